// The due list's date arithmetic and order: due date = last approved calibration + interval,
// days overdue counted from the due date, the window's edge, overdue first, retired meters
// left out, and a standard's certificate in date through its due date.
#include "core/interval/due.h"

#include <catch2/catch.hpp>

#include <stdexcept>

using namespace std::chrono;

namespace {

const sys_days kAsOf = sys_days{year{2026} / March / 16};

mw::InstrumentDueSource meter(const char* tag, std::optional<sys_days> last, int interval,
                              mw::InstrumentStatus status = mw::InstrumentStatus::InService) {
    mw::InstrumentDueSource source;
    source.instrumentId = tag[4] - '0';
    source.assetTag = tag;
    source.location = "Bench 1";
    source.status = status;
    source.intervalDays = interval;
    source.lastCalibrated = last;
    if (last) {
        source.lastSessionId = 100 + source.instrumentId;
    }
    return source;
}

mw::ReferenceStandard standard(std::int64_t id, const char* tag, sys_days due) {
    mw::ReferenceStandard s;
    s.id = id;
    s.asset_tag = tag;
    s.due_date = due;
    return s;
}

std::vector<std::string> tagsOf(const std::vector<mw::DueEntry>& entries) {
    std::vector<std::string> tags;
    for (const mw::DueEntry& e : entries) {
        tags.push_back(e.assetTag);
    }
    return tags;
}

} // namespace

TEST_CASE("the due date is the last calibration plus the interval") {
    // 2025-03-01 + 365 days = 2026-03-01 (2025 is not a leap year): 15 days overdue on 03-16.
    const auto due =
        mw::selectDue({meter("MTR-1", sys_days{year{2025} / March / 1}, 365)}, {}, kAsOf, 30);
    REQUIRE(due.size() == 1);
    CHECK(due[0].dueDate == sys_days{year{2026} / March / 1});
    CHECK(due[0].daysOverdue == 15);
    CHECK(due[0].location == "Bench 1");
    CHECK(due[0].lastSessionId == 101);
}

TEST_CASE("the window's last day is included, the day after is not") {
    const sys_days edge = kAsOf + days(30) - days(365);
    const auto due = mw::selectDue({meter("MTR-1", edge, 365), meter("MTR-2", edge + days(1), 365)},
                                   {}, kAsOf, 30);
    REQUIRE(tagsOf(due) == std::vector<std::string>{"MTR-1"});
    CHECK(due[0].daysOverdue == -30); // not yet due: negative
}

TEST_CASE("never calibrated first, then by due date, meters before standards") {
    const sys_days day = kAsOf - days(400);
    const auto due = mw::selectDue(
        {meter("MTR-3", day + days(10), 365), meter("MTR-2", std::nullopt, 365),
         meter("MTR-1", day, 365), meter("MTR-4", day, 365, mw::InstrumentStatus::Retired)},
        {standard(7, "STD-1", day + days(365)), standard(8, "STD-2", kAsOf + days(90))}, kAsOf, 30);
    CHECK(tagsOf(due) == std::vector<std::string>{"MTR-2", "MTR-1", "STD-1", "MTR-3"});
    CHECK_FALSE(due[0].dueDate);
    CHECK_FALSE(due[0].daysOverdue);
    CHECK(due[2].subject == mw::DueSubject::Standard);
    CHECK(due[2].daysOverdue == 35);
}

TEST_CASE("the standards a meter last used, in date through their due date") {
    mw::InstrumentDueSource source = meter("MTR-1", kAsOf - days(360), 365);
    source.standardsUsed = {7, 8, 9};
    const auto due = mw::selectDue(
        {source}, {standard(7, "STD-1", kAsOf), standard(8, "STD-2", kAsOf - days(1))}, kAsOf, 30);
    // STD-2 overdue since yesterday, STD-1 due today, the meter in five days.
    REQUIRE(tagsOf(due) == std::vector<std::string>{"STD-2", "STD-1", "MTR-1"});
    const auto& uses = due[2].standards;
    REQUIRE(uses.size() == 3);
    CHECK(uses[0].assetTag == "STD-1");
    CHECK(uses[0].inDate); // due today: still usable today
    CHECK_FALSE(uses[1].inDate);
    CHECK(uses[2].assetTag == "standard 9"); // no longer on the register
    CHECK_FALSE(uses[2].dueDate);
    CHECK_FALSE(uses[2].inDate);
}

TEST_CASE("a negative window is refused") {
    CHECK_THROWS_AS(mw::selectDue({}, {}, kAsOf, -1), std::invalid_argument);
}
