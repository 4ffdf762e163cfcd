// One instrument over time, as data for the history screen and the history report: a row per
// calibration (dates, outcomes, worst point, who did and who approved it, state), the as-found
// error of each test point over the years with its limit and drift analysis, and the interval
// the staircase recommends with every step that led to it. Every outcome and error comes from
// the session evaluator; drift and interval from core/interval.
#pragma once

#include "core/interval/drift.h"
#include "core/interval/interval.h"
#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"
#include "core/model/user.h"

#include <chrono>
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace mw {

// One calibration (one revision of a record) of the instrument.
struct HistoryRow {
    std::int64_t sessionId = 0;
    int revision = 1;
    SessionState state = SessionState::Draft;
    std::optional<std::int64_t> supersedesId; // the record this revision amends
    std::string amendmentReason;
    std::optional<std::int64_t> supersededBy; // the approved revision that replaced it
    Timestamp startedAt{};
    std::optional<Timestamp> approvedAt;
    // The evaluator's outcomes; nullopt for work not yet submitted (draft, returned), and for a
    // phase the session has no results in.
    std::optional<Outcome> asFound;
    std::optional<Outcome> asLeft;
    std::optional<Outcome> overall;
    // Largest |error| / permissible error over the as-found points of every range (1.0 is on
    // the limit), with the range and applied value where it was found; nullopt without
    // as-found results.
    std::optional<double> worstAsFoundFraction;
    std::string worstAsFoundRange; // range label
    double worstAsFoundApplied = 0.0;
    Unit worstAsFoundUnit = Unit::Volt;
    std::string technician; // full name from the register ("user 7" if no longer there)
    std::string reviewer;   // who returned or approved it; "" when nobody has yet
    bool adjusted = false;  // as-left results were recorded (an adjustment or repair)
    // Used for drift and interval: approved records only. A superseded revision is replaced by
    // its amendment, and open or submitted work is not yet a record.
    bool counted = false;
    std::vector<std::string> problems; // ranges the evaluator could not evaluate, in words
};

// The error at one test point on one calibration.
struct PointSample {
    std::chrono::sys_days date{}; // the day the calibration started (UTC)
    std::int64_t sessionId = 0;
    Phase phase = Phase::AsFound;
    double applied = 0.0;
    double error = 0.0; // indicated − applied, in the range's unit (the deciding direction)
};

// The straight line the drift analysis fitted, ready to draw: from the first result it used
// to the last, and on to the projected date where the line reaches the limit (significant
// drift only).
struct DriftLine {
    std::chrono::sys_days from{};
    double errorAtFrom = 0.0;
    std::chrono::sys_days to{};
    double errorAtTo = 0.0;
    double slopePerYear = 0.0;
    std::optional<std::chrono::sys_days> reachesLimit;
};

// One test point of one range over the instrument's approved records.
struct PointHistory {
    std::int64_t rangeId = 0;
    std::string rangeLabel;
    Unit unit = Unit::Volt;
    double nominal = 0.0; // the planned test point (its applied value when no plan was kept)
    double permissibleError = 0.0;    // ± limit, as the latest record evaluated it
    std::vector<PointSample> asFound; // date order
    std::vector<PointSample> asLeft;  // after adjustments, date order
    // An adjustment resets the error, so the line is fitted to the results since the last one:
    // its as-left result, then the as-found results of later calibrations. nullopt: no
    // adjustment, every as-found result is used.
    std::optional<std::chrono::sys_days> fittedSince;
    std::size_t fittedCount = 0;      // results the analysis used
    std::optional<DriftResult> drift; // nullopt when there were too few results
    std::optional<DriftLine> line;    // the fitted line, with the analysis
    std::string summary;              // the analysis in words, or why none was made
};

// The recalibration interval the approved as-found results lead to.
struct IntervalFinding {
    int registeredDays = 0; // the instrument's interval on the register, where the walk starts
    std::vector<AsFoundRecord> history;        // one per approved record with as-found results
    std::vector<std::int64_t> historySessions; // the session of each entry of `history`
    std::optional<IntervalRecommendation> recommendation; // nullopt without any such record
    std::string summary; // how the recommendation was reached, or why there is none
};

struct HistorySettings {
    StaircaseSettings staircase;
    double significanceLevel = 0.05; // of the t-test of a drift slope
};

struct InstrumentHistory {
    std::vector<HistoryRow> rows;     // every calibration, oldest first
    std::vector<PointHistory> points; // in the instrument's range order, then by nominal value
    IntervalFinding interval;
};

// Builds the history of `instrument` from its sessions (any order, any state), evaluating each
// submitted record with the inputs it was sealed with (core/history/evaluation_basis.h).
// `registerStandards` serves the records sealed before copies were kept; `users` gives the
// names of technicians and reviewers. Throws std::invalid_argument naming a session that
// belongs to another instrument.
InstrumentHistory buildHistory(const Instrument& instrument,
                               const std::vector<CalibrationSession>& sessions,
                               const std::vector<ReferenceStandard>& registerStandards,
                               const std::vector<User>& users,
                               const HistorySettings& settings = {});

// The fitted error of `line` on `day` (in the range's unit), for drawing beyond its ends.
double fittedErrorOn(const DriftLine& line, std::chrono::sys_days day);

} // namespace mw
