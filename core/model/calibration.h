// One calibration of one instrument: the session record with its readings, resistor checks,
// adjustment notes, the reference standards it used, its review state and revision chain.
#pragma once

#include "core/model/vocabulary.h"
#include "core/units/quantity.h"

#include <chrono>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace mw {

using Timestamp = std::chrono::sys_seconds; // UTC, whole seconds

// One observation at one test point. `applied` is what the standard delivered, `indicated` what
// the instrument under test showed; both in `unit`, which must be the unit of the range.
struct Reading {
    std::int64_t range_id = 0; // RangeSpec::id of the instrument
    int point_index = 0;       // 0-based position of the test point in the plan
    Direction direction = Direction::Up;
    Phase phase = Phase::AsFound;
    int repeat = 1; // 1-based repeat number at the same point, direction and phase
    Unit unit = Unit::Volt;
    double applied = 0.0;
    double indicated = 0.0;

    bool operator==(const Reading&) const = default;
};

// A multiplier or shunt resistor measured against its designed (computed) value.
struct ResistorCheck {
    std::int64_t range_id = 0;
    std::string component; // e.g. "R3 multiplier"
    double computed_ohms = 0.0;
    double measured_ohms = 0.0;
    double tolerance_percent = 0.0;

    bool operator==(const ResistorCheck&) const = default;
};

struct AdjustmentNote {
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
    double guard_factor = 0.0; // r in w = r * U (ILAC G8:09/2019 4.2.3); 0 for simple acceptance
    std::optional<Outcome> outcome; // overall result once evaluated

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

    std::vector<Reading> readings;
    std::vector<ResistorCheck> resistor_checks;
    std::vector<AdjustmentNote> adjustments;

    // Hex SHA-256 of the approved record chained with its predecessor; empty until approved.
    // Filled by the workbook, never compared by operator== callers for new sessions.
    std::string digest;

    bool operator==(const CalibrationSession&) const = default;
};

} // namespace mw
