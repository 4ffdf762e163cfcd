// The shared words of the trade as enumerations, with the stable text each one is stored and
// exchanged as (workbook columns, JSON, CSV). Text forms never change once released.
#pragma once

#include <optional>
#include <string_view>
#include <vector>

namespace mw {

enum class InstrumentKind {
    DcVoltmeter,
    DcAmmeter,
    HalfWaveAcVoltmeter,
    BridgeAcVoltmeter,
    MultiRange,
};

// How the fiducial value of a range follows from its scale (IEC 60051-1).
enum class ScaleType {
    ZeroAtEnd,  // zero at one end of the scale, or electrical zero outside it
    ZeroInside, // zero inside the scale (e.g. centre zero): fiducial value = span
    NoZero,     // suppressed zero: fiducial value = upper limit unless set explicitly
    NonLinear,  // strongly non-uniform scale: fiducial value = scale length
};

// What one range of an instrument measures and how: a DC quantity, or an AC voltage through a
// half-wave or a full-wave bridge rectifier (the scale marked in rms of a sine).
enum class SignalType { Dc, HalfWave, Bridge };

// What one range of a reference standard delivers or measures.
enum class SignalKind { Dc, Ac };

enum class Direction { Up, Down };

enum class Phase { AsFound, AsLeft };

// Which phases a calibration plans: as-found alone (no adjustment expected), as-left alone (a
// meter calibrated after repair), or both.
enum class PhasePlan { AsFound, AsLeft, AsFoundAndAsLeft };

enum class SessionState { Draft, Submitted, Returned, Approved, Superseded };

enum class Role { Technician, Reviewer, Administrator };

enum class InstrumentStatus { InService, OutOfService, Retired };

// The rules of ILAC G8:09/2019 4.2. Enumerator values are stable; new rules go at the end.
enum class DecisionRule {
    SimpleAcceptance,  // 4.2.1 binary statement, simple acceptance (w = 0): "simple"
    GuardedAcceptance, // 4.2.3 non-binary statement with guard band w = r * U: "guarded"
    GuardedBinary,     // 4.2.2 binary statement with guard band w = r * U: "guarded-binary"
};

// ILAC G8:09/2019 4.2.3 outcomes; simple acceptance only ever yields Pass or Fail.
enum class Outcome { Pass, ConditionalPass, ConditionalFail, Fail };

std::string_view toText(InstrumentKind value);
std::string_view toText(ScaleType value);
std::string_view toText(SignalType value);
std::string_view toText(SignalKind value);
std::string_view toText(Direction value);
std::string_view toText(Phase value);
std::string_view toText(PhasePlan value);
std::string_view toText(SessionState value);
std::string_view toText(Role value);
std::string_view toText(InstrumentStatus value);
std::string_view toText(DecisionRule value);
std::string_view toText(Outcome value);

// Parsing from the stable text; nullopt when the text is not one of the words.
template <typename Enum>
std::optional<Enum> fromText(std::string_view text);

// Words a person reads (labels, records); the stable text above is for machines.
std::string_view displayName(InstrumentKind value);
std::string_view displayName(ScaleType value);
std::string_view displayName(SignalType value);
std::string_view displayName(SignalKind value);
std::string_view displayName(Phase value);
std::string_view displayName(PhasePlan value);
// The phases of a plan in the order they are taken.
std::vector<Phase> phasesOf(PhasePlan plan);
std::string_view displayName(SessionState value);
std::string_view displayName(Outcome value);
std::string_view displayName(DecisionRule value);
std::string_view displayName(InstrumentStatus value);
std::string_view displayName(Role value);

// The kind of standard signal a range needs: AC for the rectifier ranges, DC otherwise.
SignalKind kindOf(SignalType signal);

} // namespace mw
