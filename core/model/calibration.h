// One calibration of one instrument: the session record with its readings, resistor checks,
// adjustment notes, the reference standards it used, its review state and revision chain.
#pragma once

#include "core/circuits/diode.h"
#include "core/model/reference_standard.h"
#include "core/model/vocabulary.h"
#include "core/uncertainty/distributions.h"
#include "core/units/quantity.h"

#include <chrono>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace mw {

using Timestamp = std::chrono::sys_seconds; // UTC, whole seconds

// One observation at one test point. `applied` is what the standard delivered, `indicated` what
// the instrument under test showed; both in `unit`, which must be the unit of the range. A
// reading whose indication has not been typed yet (the applied value was) is pending: it is
// saved so that nothing typed is lost, is no observation, and stops a submission.
struct Reading {
    std::int64_t range_id = 0; // RangeSpec::id of the instrument
    int point_index = 0;       // 0-based position of the test point in the plan
    Direction direction = Direction::Up;
    Phase phase = Phase::AsFound;
    int repeat = 1; // 1-based repeat number at the same point, direction and phase
    Unit unit = Unit::Volt;
    double applied = 0.0;
    std::optional<double> indicated;

    bool operator==(const Reading&) const = default;
};

// One planned test point of a range: taken up-scale and down-scale, `repeats` times each, in
// every phase the session plans. `point_index` identifies it (readings refer to it); the nominal
// value is where it is taken, in the range's unit.
struct TestPoint {
    std::int64_t range_id = 0;
    int point_index = 0;
    double nominal = 0.0;
    int repeats = 1;

    bool operator==(const TestPoint&) const = default;
};

// A multiplier or shunt resistor measured against its designed (computed) value.
struct ResistorCheck {
    std::int64_t id = 0; // assigned by the workbook; 0 until saved
    std::int64_t range_id = 0;
    std::string component; // e.g. "R3 multiplier"
    double computed_ohms = 0.0;
    double measured_ohms = 0.0;
    double tolerance_percent = 0.0;

    bool operator==(const ResistorCheck&) const = default;
};

struct AdjustmentNote {
    std::int64_t id = 0; // assigned by the workbook; 0 until saved
    Timestamp at{};
    std::string text;

    bool operator==(const AdjustmentNote&) const = default;
};

// A reference standard as used by this session. Certificate number and due date are copied at
// the time of use so that the record stays true after the standard is recalibrated.
struct StandardUse {
    std::int64_t standard_id = 0;
    std::string certificate_number;
    std::chrono::sys_days due_date{};
    // Required when the standard is past due at submission: why its use is still acceptable.
    std::string overdue_justification;

    bool operator==(const StandardUse&) const = default;
};

struct Environment {
    double ambient_celsius = 23.0;
    double relative_humidity_percent = 50.0;

    bool operator==(const Environment&) const = default;
};

// How a session's results are worked out, chosen with the session and sealed with it.
struct EvaluationSettings {
    double readability_fraction = 0.2; // of a scale division, to which the pointer is read
    double coverage_probability = kProbabilityTwoSigma; // of the expanded uncertainty U
    // IEC 60051-1 reference temperature (23 °C unless the dial is marked otherwise).
    double reference_celsius = 23.0;

    bool operator==(const EvaluationSettings&) const = default;
};

// One range of a reference standard as a session used it: a copy of the standard's
// specification of that range taken at submission, so the record stays as it was decided when
// the standard is recalibrated or its specification edited.
struct StandardSpecCopy {
    std::int64_t standard_id = 0;
    int sort_order = 0; // the range's position among the standard's ranges
    StandardRangeSpec spec;

    bool operator==(const StandardSpecCopy&) const = default;
};

// A standard's range by its position, within the copies of a session.
struct SpecRef {
    std::int64_t standard_id = 0;
    int sort_order = 0;

    bool operator==(const SpecRef&) const = default;
};

// A range of the instrument as a session used it, copied at submission: what the register said
// then, and which standard's range the reference uncertainty was taken from.
struct RangeAsUsed {
    std::int64_t range_id = 0;
    SignalType signal = SignalType::Dc;
    std::optional<DiodeParameters> diode; // rectifier ranges whose diode model is recorded
    std::optional<double> resistor_ohms;  // multiplier or shunt fitted (nullopt: none)
    int divisions = 0;                    // scale divisions (0: not stated)
    // The standard's range that delivered or measured the applied value; for a current read
    // as the voltage across a shunt, the voltage range here and the shunt in reference_shunt.
    // nullopt: no standard covers the range, and the budget says so.
    std::optional<SpecRef> reference;
    std::optional<SpecRef> reference_shunt;

    bool operator==(const RangeAsUsed&) const = default;
};

// Everything besides its own rows that a session's verdict rests on.
struct SealedInputs {
    std::vector<RangeAsUsed> ranges;
    std::vector<StandardSpecCopy> specs;

    bool operator==(const SealedInputs&) const = default;
};

// Format of a stored record. 1: sealed before the workbook copied the evaluation inputs into
// each session (those are "not recorded" for it); 2: sealed with its inputs.
inline constexpr int kRecordFormatWithoutInputs = 1;
inline constexpr int kRecordFormat = 2;

struct CalibrationSession {
    std::int64_t id = 0; // assigned by the workbook; 0 until saved
    std::int64_t instrument_id = 0;
    std::int64_t technician_id = 0;
    Timestamp started_at{};
    std::optional<Timestamp> finished_at;
    Environment environment;
    std::string method;
    std::vector<StandardUse> standards;
    DecisionRule decision_rule = DecisionRule::SimpleAcceptance;
    double guard_factor = 0.0; // r in w = r * U (ILAC G8:09/2019 4.2.2/4.2.3); 0 for simple
    // Computed by the session evaluator at submission (the condition the meter leaves in);
    // never typed. nullopt while a draft.
    std::optional<Outcome> outcome;
    int record_format = kRecordFormat;
    // nullopt only for records of format 1, whose settings were not recorded.
    std::optional<EvaluationSettings> settings = EvaluationSettings{};
    // Copied at submission (an amendment starts with the copies of the record it amends);
    // nullopt while a draft evaluates against the register as it stands.
    std::optional<SealedInputs> sealed;

    SessionState state = SessionState::Draft;
    std::optional<Timestamp> submitted_at;
    std::string return_comment; // the reviewer's reason when the session was returned
    std::optional<Timestamp> returned_at;
    std::optional<std::int64_t> reviewer_id;
    std::optional<Timestamp> approved_at;

    int revision = 1;
    std::optional<std::int64_t> supersedes_id; // the approved session this revision amends
    std::string amendment_reason;
    std::optional<Timestamp> amended_at; // when this amending revision was started

    // The test points of each range (empty for a record made before plans were kept: its
    // readings are then its plan) and the phases planned.
    std::vector<TestPoint> plan;
    PhasePlan phases = PhasePlan::AsFound;

    std::vector<Reading> readings;
    std::vector<ResistorCheck> resistor_checks;
    std::vector<AdjustmentNote> adjustments;

    // Hex SHA-256 of the approved record chained with its predecessor; empty until approved.
    // Filled by the workbook, never compared by operator== callers for new sessions.
    std::string digest;

    bool operator==(const CalibrationSession&) const = default;
};

} // namespace mw
