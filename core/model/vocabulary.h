// The shared words of the trade as enumerations, with the stable text each one is stored and
// exchanged as (workbook columns, JSON, CSV). Text forms never change once released.
#pragma once

#include <optional>
#include <string_view>

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

enum class Direction { Up, Down };

enum class Phase { AsFound, AsLeft };

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
std::string_view toText(Direction value);
std::string_view toText(Phase value);
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
std::string_view displayName(Phase value);
std::string_view displayName(SessionState value);
std::string_view displayName(Outcome value);
std::string_view displayName(DecisionRule value);
std::string_view displayName(InstrumentStatus value);
std::string_view displayName(Role value);

} // namespace mw
