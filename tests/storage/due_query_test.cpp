// The due list's reads on the invented demo: each meter's latest approved calibration and the
// standards it used, the register's due list agreeing with it, and the lab's window setting.
#include "storage/due_query.h"

#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "support/demo_workbook.h"

#include <catch2/catch.hpp>

#include <algorithm>

using namespace std::chrono;

namespace {

const sys_days kAsOf = sys_days{year{2026} / March / 16};

} // namespace

TEST_CASE("the latest approved calibration of each meter and its standards") {
    mw::storage::Workbook& workbook = mwtest::readOnlyDemo();
    const std::vector<mw::InstrumentDueSource> sources = mw::storage::dueSources(workbook);
    const auto register_ = mw::storage::InstrumentRepository(workbook).dueList();
    REQUIRE(sources.size() == register_.size()); // every meter but the retired one
    mw::storage::SessionRepository sessions(workbook);
    for (const mw::InstrumentDueSource& source : sources) {
        INFO(source.assetTag);
        CHECK(source.status != mw::InstrumentStatus::Retired);
        const auto listed = std::find_if(register_.begin(), register_.end(), [&](const auto& d) {
            return d.instrument_id == source.instrumentId;
        });
        REQUIRE(listed != register_.end());
        CHECK(listed->last_calibrated == source.lastCalibrated);
        // The latest approved session by start, with the standards it names in its order.
        std::optional<mw::CalibrationSession> latest;
        for (mw::CalibrationSession& s : sessions.historyOf(source.instrumentId)) {
            if (s.state == mw::SessionState::Approved &&
                (!latest || s.started_at >= latest->started_at)) {
                latest = std::move(s);
            }
        }
        REQUIRE(latest);
        CHECK(source.lastSessionId == latest->id);
        std::vector<std::int64_t> used;
        for (const mw::StandardUse& use : latest->standards) {
            used.push_back(use.standard_id);
        }
        CHECK(source.standardsUsed == used);
        const auto open = sessions.openSessions(source.instrumentId);
        CHECK(source.openSessionId ==
              (open.empty() ? std::nullopt : std::optional(open.back().id)));
    }
}

TEST_CASE("without a window the lab's due window setting is used") {
    mw::storage::Workbook& workbook = mwtest::readOnlyDemo();
    const mw::storage::DueReport report = mw::storage::dueReport(workbook, kAsOf);
    CHECK(report.withinDays == 30); // the demo lab keeps the default setting
    CHECK(report.asOf == kAsOf);
    const mw::storage::DueReport wide = mw::storage::dueReport(workbook, kAsOf, 2000);
    CHECK(wide.withinDays == 2000);
    CHECK(wide.entries.size() == 24 + 4); // every meter in service or withdrawn, every standard
    CHECK(report.entries.size() < wide.entries.size());
}
