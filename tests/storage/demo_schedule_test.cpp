// The parts the demo's meters play on the supervisor's desk, seen through the engine's history
// (buildHistory) as the history screen and `meterwright history` show them: a meter drifting
// toward its limit, one holding still, one whose interval the staircase shortens; and the
// records waiting for review.
#include "storage/demo/demo_schedule.h"

#include "core/history/calendar.h"
#include "core/history/instrument_history.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "storage/user_repository.h"
#include "support/demo_workbook.h"

#include <catch2/catch.hpp>

#include <algorithm>
#include <set>

namespace {

struct Meter {
    mw::Instrument instrument;
    mw::InstrumentHistory history;
};

Meter historyOf(const char* tag) {
    mw::storage::Workbook& workbook = mwtest::readOnlyDemo();
    const auto instrument =
        mw::storage::InstrumentRepository(workbook).findByTag(QString::fromLatin1(tag));
    REQUIRE(instrument);
    return {*instrument,
            mw::buildHistory(*instrument,
                             mw::storage::SessionRepository(workbook).historyOf(instrument->id),
                             mw::storage::StandardRepository(workbook).all(),
                             mw::storage::UserRepository(workbook).all())};
}

// The day the latest approved calibration started.
std::chrono::sys_days lastCalibrated(const mw::InstrumentHistory& history) {
    std::optional<std::chrono::sys_days> last;
    for (const mw::HistoryRow& row : history.rows) {
        if (row.counted) {
            last = mw::dayOf(row.startedAt);
        }
    }
    REQUIRE(last);
    return *last;
}

} // namespace

TEST_CASE("CFM-205 drifts toward its limit and will reach it before it is due") {
    const Meter meter = historyOf("CFM-205");
    const std::chrono::sys_days nextDue =
        lastCalibrated(meter.history) + std::chrono::days(meter.instrument.interval_days);
    int crossing = 0;
    for (const mw::PointHistory& point : meter.history.points) {
        INFO(point.rangeLabel << " at " << point.nominal << ": " << point.summary);
        REQUIRE(point.drift);
        CHECK(point.fittedCount >= 4);
        if (point.drift->significant && point.drift->projectedLimitDate &&
            *point.drift->projectedLimitDate > point.line->to &&
            *point.drift->projectedLimitDate <= nextDue) {
            ++crossing;
        }
    }
    CHECK(crossing >= 1);
    // Found in tolerance every time: the staircase alone would not call it in early.
    for (const mw::HistoryRow& row : meter.history.rows) {
        CHECK(row.asFound == mw::Outcome::Pass);
    }
}

TEST_CASE("CFM-104 shows no significant drift at any point") {
    const Meter meter = historyOf("CFM-104");
    REQUIRE_FALSE(meter.history.points.empty());
    for (const mw::PointHistory& point : meter.history.points) {
        INFO(point.nominal << ": " << point.summary);
        REQUIRE(point.drift); // analysed, with enough results
        CHECK_FALSE(point.drift->significant);
        CHECK_FALSE(point.drift->projectedLimitDate);
    }
}

TEST_CASE("the staircase shortens the interval of CFM-102") {
    const Meter meter = historyOf("CFM-102");
    const auto& recommendation = meter.history.interval.recommendation;
    REQUIRE(recommendation);
    CHECK(recommendation->recommendedDays < meter.instrument.interval_days);
    CHECK(std::any_of(
        recommendation->steps.begin(), recommendation->steps.end(),
        [](const mw::IntervalStep& step) { return step.kind == mw::IntervalStepKind::Shorten; }));
}

TEST_CASE("three records wait for review, one was returned") {
    mw::storage::Workbook& workbook = mwtest::readOnlyDemo();
    mw::storage::SessionRepository sessions(workbook);
    std::set<std::string> tags;
    for (const mw::CalibrationSession& s : sessions.withState(mw::SessionState::Submitted)) {
        tags.insert(mw::storage::InstrumentRepository(workbook).find(s.instrument_id)->asset_tag);
    }
    CHECK(tags == std::set<std::string>{"CFM-103", "CFM-204", "CFM-502"});
    const auto returned = sessions.withState(mw::SessionState::Returned);
    REQUIRE(returned.size() == 1);
    CHECK_FALSE(returned.front().return_comment.empty());
}
