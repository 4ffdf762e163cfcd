// The register's due column: never calibrated, overdue and due dates in words, not colour alone.
#include "app/gui/register_rows.h"

#include <catch2/catch.hpp>

using namespace std::chrono;
using mw::Instrument;
using mw::InstrumentStatus;
using mw::storage::DueItem;

namespace {

Instrument instrument(std::int64_t id, const char* tag, InstrumentStatus status) {
    Instrument item;
    item.id = id;
    item.asset_tag = tag;
    item.status = status;
    return item;
}

} // namespace

TEST_CASE("due column says never calibrated, overdue, or the due date") {
    const sys_days today = sys_days{2026y / December / 1};
    const std::vector<Instrument> instruments{
        instrument(1, "A", InstrumentStatus::InService),
        instrument(2, "B", InstrumentStatus::InService),
        instrument(3, "C", InstrumentStatus::OutOfService),
        instrument(4, "D", InstrumentStatus::Retired),
    };
    DueItem overdue;
    overdue.instrument_id = 2;
    overdue.due_date = sys_days{2026y / October / 15};
    DueItem later;
    later.instrument_id = 3;
    later.due_date = sys_days{2027y / March / 1};
    const auto rows = mw::gui::buildRegisterRows(instruments, {overdue, later}, {}, today);

    REQUIRE(rows.size() == 4);
    CHECK(rows[0].due == QStringLiteral("Never calibrated"));
    CHECK(rows[0].attention);
    CHECK(rows[1].due == QStringLiteral("Overdue since 2026-10-15"));
    CHECK(rows[1].attention);
    CHECK(rows[2].due == QStringLiteral("2027-03-01"));
    CHECK_FALSE(rows[2].attention);
    CHECK(rows[2].status == QStringLiteral("Out of service"));
    CHECK(rows[3].due == QStringLiteral("—"));
    CHECK_FALSE(rows[3].attention);
}

TEST_CASE("an instrument due today is not overdue") {
    const sys_days today = sys_days{2026y / December / 1};
    DueItem dueToday;
    dueToday.instrument_id = 1;
    dueToday.due_date = today;
    const auto rows = mw::gui::buildRegisterRows({instrument(1, "A", InstrumentStatus::InService)},
                                                 {dueToday}, {}, today);
    REQUIRE(rows.size() == 1);
    CHECK(rows[0].due == QStringLiteral("2026-12-01 (due soon)"));
    CHECK(rows[0].dueState == mw::gui::DueState::DueSoon);
    CHECK_FALSE(rows[0].attention);
}

TEST_CASE("due soon follows the lab's window; the last approved outcome is shown") {
    const sys_days today = sys_days{2026y / December / 1};
    DueItem inFortyDays;
    inFortyDays.instrument_id = 1;
    inFortyDays.due_date = today + std::chrono::days(40);
    const std::map<std::int64_t, mw::Outcome> outcomes{{1, mw::Outcome::ConditionalPass}};
    auto rows = mw::gui::buildRegisterRows({instrument(1, "A", InstrumentStatus::InService),
                                            instrument(2, "B", InstrumentStatus::InService)},
                                           {inFortyDays}, {}, today, outcomes, 30);
    CHECK(rows[0].dueState == mw::gui::DueState::InDate);
    CHECK(rows[0].lastOutcome == QStringLiteral("Conditional pass"));
    CHECK(rows[0].lastOutcomeValue == mw::Outcome::ConditionalPass);
    CHECK(rows[1].lastOutcome == QStringLiteral("—"));
    CHECK_FALSE(rows[1].lastOutcomeValue);
    rows = mw::gui::buildRegisterRows({instrument(1, "A", InstrumentStatus::InService)},
                                      {inFortyDays}, {}, today, outcomes, 45);
    CHECK(rows[0].dueState == mw::gui::DueState::DueSoon);
}

TEST_CASE("an open calibration says what it is waiting for beside the due state") {
    const sys_days today = sys_days{2026y / December / 1};
    DueItem overdue;
    overdue.instrument_id = 1;
    overdue.due_date = sys_days{2026y / November / 20};
    DueItem later;
    later.instrument_id = 2;
    later.due_date = sys_days{2027y / May / 2};
    const mw::gui::OpenCalibrations open{{1, mw::SessionState::Submitted},
                                         {2, mw::SessionState::Draft},
                                         {3, mw::SessionState::Returned}};
    const auto rows = mw::gui::buildRegisterRows({instrument(1, "A", InstrumentStatus::InService),
                                                  instrument(2, "B", InstrumentStatus::InService),
                                                  instrument(3, "C", InstrumentStatus::InService)},
                                                 {overdue, later}, open, today);
    REQUIRE(rows.size() == 3);
    CHECK(rows[0].due == QStringLiteral("Overdue since 2026-11-20 · record awaiting review"));
    CHECK(rows[1].due == QStringLiteral("2027-05-02 · calibration in progress"));
    CHECK(rows[2].due == QStringLiteral("Never calibrated · record returned to technician"));
}
