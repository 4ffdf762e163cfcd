// An instrument's history: rows from the session evaluator, the error series of each test point,
// drift fitted since the last adjustment, and the staircase interval. Meter, people and readings
// are invented demo data; limits follow IEC 60051, steps the cited interval methods.
#include "core/history/instrument_history.h"

#include "support/approx.h"
#include "support/calibration_fixture.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>

using namespace mw;
using namespace std::chrono;

namespace {

using mwtest::fixtureDay;
using mwtest::fixturePeople;
using mwtest::fixtureStandards;

Instrument meter() {
    return mwtest::fixtureMeter();
}

CalibrationSession calibration(std::int64_t id, int day, double asFoundAtTop,
                               std::optional<double> asLeftAtTop = std::nullopt,
                               SessionState state = SessionState::Approved) {
    return mwtest::fixtureCalibration(id, day, asFoundAtTop, asLeftAtTop, state);
}

InstrumentHistory historyOf(const std::vector<CalibrationSession>& sessions) {
    return buildHistory(meter(), sessions, fixtureStandards(), fixturePeople());
}

const PointHistory& pointAt(const InstrumentHistory& history, double nominal) {
    for (const PointHistory& point : history.points) {
        if (point.nominal == nominal) {
            return point;
        }
    }
    FAIL("no test point at " << nominal);
    throw std::logic_error("unreachable");
}

} // namespace

TEST_CASE("each calibration is a row with the evaluator's outcomes and who signed it") {
    // Out of tolerance as found (0.2 V > 0.15 V), adjusted to 0.01 V; then an open draft.
    const std::vector<CalibrationSession> sessions{
        calibration(2, 400, 0.20, 0.01),
        calibration(1, 0, 0.03),
        calibration(3, 800, 0.05, std::nullopt, SessionState::Draft),
    };
    const InstrumentHistory history = historyOf(sessions);
    REQUIRE(history.rows.size() == 3);
    CHECK(history.rows[0].sessionId == 1); // oldest first
    const HistoryRow& adjusted = history.rows[1];
    CHECK(adjusted.asFound == Outcome::Fail);
    CHECK(adjusted.asLeft == Outcome::Pass);
    CHECK(adjusted.overall == Outcome::Pass);
    CHECK(adjusted.adjusted);
    CHECK(adjusted.counted);
    // Worst as-found point: 0.20 V of the ±0.15 V limit at 10 V.
    REQUIRE(adjusted.worstAsFoundFraction);
    CHECK(*adjusted.worstAsFoundFraction == mwtest::relative(0.20 / 0.15, 1e-12));
    CHECK(adjusted.worstAsFoundRange == "10 V");
    CHECK(adjusted.worstAsFoundApplied == 10.0);
    CHECK(adjusted.technician == "Tess Demo");
    CHECK(adjusted.reviewer == "Rowan Demo");
    const HistoryRow& draft = history.rows[2];
    CHECK(draft.state == SessionState::Draft);
    CHECK_FALSE(draft.asFound);
    CHECK_FALSE(draft.counted);
    CHECK(draft.reviewer.empty());
}

TEST_CASE("a steady drift is fitted per test point and projected to the limit") {
    // Collinear as-found errors at 10 V: 0.02, 0.05, 0.08, 0.11 V on days 0, 365, 730, 1095.
    // A least-squares line through collinear points is that line, so the slope is 0.03 V per
    // 365 days, i.e. 0.03 × 365.25/365 V per year of 365.25 days (the drift analysis' year).
    std::vector<CalibrationSession> sessions;
    const double errors[] = {0.02, 0.05, 0.08, 0.11};
    for (int i = 0; i < 4; ++i) {
        sessions.push_back(calibration(i + 1, 365 * i, errors[i]));
    }
    const InstrumentHistory history = historyOf(sessions);
    REQUIRE(history.points.size() == 3); // 0, 5 and 10 V
    const PointHistory& top = pointAt(history, 10.0);
    CHECK(top.rangeLabel == "10 V");
    CHECK(top.permissibleError == mwtest::relative(0.15, 1e-12));
    REQUIRE(top.asFound.size() == 4);
    CHECK(top.asFound[3].error == mwtest::relative(0.11, 1e-12));
    CHECK(top.asLeft.empty());
    CHECK_FALSE(top.fittedSince);
    REQUIRE(top.drift);
    CHECK(top.drift->slopePerYear == mwtest::relative(0.03 * 365.25 / 365.0, 1e-9));
    CHECK(top.drift->significant);
    // The line reaches 0.15 V after (0.15 − 0.02)/0.03 × 365 = 1581.7 days: day 1581.
    REQUIRE(top.drift->projectedLimitDate);
    CHECK(*top.drift->projectedLimitDate == fixtureDay(1581));
    REQUIRE(top.line);
    CHECK(top.line->from == fixtureDay(0));
    CHECK(top.line->to == fixtureDay(1095));
    CHECK(top.line->errorAtFrom == mwtest::absolute(0.02, 1e-12));
    CHECK(top.line->errorAtTo == mwtest::absolute(0.11, 1e-12));
    CHECK(fittedErrorOn(*top.line, fixtureDay(1581)) == mwtest::absolute(0.15, 0.0001));
    CHECK_THAT(top.summary, Catch::Contains("reaches the limit of +150 mV around 2024-04-30"));

    // Zero shows no error at all: a flat line, no significant drift.
    const PointHistory& zero = pointAt(history, 0.0);
    REQUIRE(zero.drift);
    CHECK_FALSE(zero.drift->significant);
    CHECK_THAT(zero.summary, Catch::StartsWith("no significant drift"));
}

TEST_CASE("an adjustment restarts the drift fit from its as-left result") {
    // Found out of tolerance on day 365 and adjusted to 0.01 V; two later as-found results.
    const std::vector<CalibrationSession> sessions{
        calibration(1, 0, 0.10),
        calibration(2, 365, 0.18, 0.01),
        calibration(3, 730, 0.04),
        calibration(4, 1095, 0.07),
    };
    const InstrumentHistory history = historyOf(sessions);
    const PointHistory& top = pointAt(history, 10.0);
    CHECK(top.asFound.size() == 4);
    REQUIRE(top.asLeft.size() == 1);
    REQUIRE(top.fittedSince);
    CHECK(*top.fittedSince == fixtureDay(365));
    CHECK(top.fittedCount == 3); // the as-left on day 365, the as-found on days 730 and 1095
    REQUIRE(top.line);
    CHECK(top.line->from == fixtureDay(365));
    CHECK(top.line->errorAtFrom == mwtest::absolute(0.01, 1e-12)); // collinear: 0.01, 0.04, 0.07
    CHECK_THAT(top.summary, Catch::Contains("since the adjustment of 2020-12-31"));
}

TEST_CASE("too few results give no drift analysis, and say why") {
    const std::vector<CalibrationSession> sessions{calibration(1, 0, 0.02),
                                                   calibration(2, 365, 0.03)};
    const InstrumentHistory history = historyOf(sessions);
    const PointHistory& top = pointAt(history, 10.0);
    CHECK_FALSE(top.drift);
    CHECK_FALSE(top.line);
    CHECK_THAT(top.summary, Catch::Contains("2 results") && Catch::Contains("at least three"));
}

TEST_CASE("superseded revisions and unapproved work stay out of the analysis") {
    std::vector<CalibrationSession> sessions{
        calibration(1, 0, 0.02),
        calibration(2, 365, 0.14, std::nullopt, SessionState::Superseded),
        calibration(3, 366, 0.04),
        calibration(4, 730, 0.06, std::nullopt, SessionState::Submitted),
    };
    sessions[2].supersedes_id = 2;
    sessions[2].revision = 2;
    const InstrumentHistory history = historyOf(sessions);
    CHECK(history.rows.size() == 4);
    CHECK_FALSE(history.rows[1].counted);
    CHECK(history.rows[1].asFound == Outcome::Pass); // still evaluated for its row
    CHECK(history.rows[2].revision == 2);
    CHECK(history.rows[1].supersededBy == std::optional<std::int64_t>(3)); // links both ways
    CHECK(history.rows[2].supersedesId == std::optional<std::int64_t>(2));
    CHECK_FALSE(history.rows[0].supersededBy);
    CHECK_FALSE(history.rows[3].counted);
    const PointHistory& top = pointAt(history, 10.0);
    REQUIRE(top.asFound.size() == 2);
    CHECK(top.asFound[0].sessionId == 1);
    CHECK(top.asFound[1].sessionId == 3);
    CHECK(history.interval.historySessions == std::vector<std::int64_t>{1, 3});
}

TEST_CASE("the interval is walked from the registered one through the approved results") {
    // ILAC-G24:2007 / OIML D 10 method 1 with NCSL RP-1 A1 steps, a = 10 %, R = 90 %, keep zone
    // above 80 % of the limit (core/interval/interval.h). Arithmetic by hand:
    // 0.03/0.15 = 20 % -> 365 × 1.1 = 401.5; 0.13/0.15 = 87 % -> kept;
    // 0.20/0.15 out of tolerance -> × 1.1^−9 = 170.27; 0.06/0.15 = 40 % -> × 1.1 = 187.3 -> 187.
    const std::vector<CalibrationSession> sessions{
        calibration(1, 0, 0.03),
        calibration(2, 400, 0.13),
        calibration(3, 800, 0.20, 0.01),
        calibration(4, 1000, 0.06),
    };
    const InstrumentHistory history = historyOf(sessions);
    const IntervalFinding& finding = history.interval;
    CHECK(finding.registeredDays == 365);
    REQUIRE(finding.recommendation);
    const IntervalRecommendation& r = *finding.recommendation;
    REQUIRE(r.steps.size() == 4);
    CHECK(r.steps[0].kind == IntervalStepKind::Lengthen);
    CHECK(r.steps[1].kind == IntervalStepKind::Keep);
    CHECK(r.steps[2].kind == IntervalStepKind::Shorten);
    CHECK(r.steps[3].kind == IntervalStepKind::Lengthen);
    CHECK(r.recommendedDays == 187);
    CHECK(r.inToleranceCount == 3);
    CHECK_THAT(finding.summary, Catch::Contains("registered interval of 365 days") &&
                                    Catch::Contains("lead to 187 days"));
}

TEST_CASE("no approved results: the registered interval stands, and sessions must match") {
    const std::vector<CalibrationSession> open{
        calibration(1, 0, 0.03, std::nullopt, SessionState::Draft)};
    const InstrumentHistory history = historyOf(open);
    CHECK_FALSE(history.interval.recommendation);
    CHECK_THAT(history.interval.summary, Catch::Contains("365 days stands"));
    CHECK(history.points.empty());

    CalibrationSession other = calibration(9, 0, 0.03);
    other.instrument_id = 2;
    CHECK_THROWS_WITH(historyOf({other}),
                      Catch::Contains("session 9") && Catch::Contains("DEMO-1"));
}
