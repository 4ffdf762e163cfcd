// Dates and times as records print them (ISO 8601 days, UTC to the minute).
#include "core/history/calendar.h"

#include <catch2/catch.hpp>

using namespace mw;
using namespace std::chrono;

TEST_CASE("days are written as ISO 8601 calendar dates") {
    // ISO 8601 extended format YYYY-MM-DD (common practice on records).
    CHECK(formatDay(sys_days{year{2024} / February / 29}) == "2024-02-29");
    CHECK(formatDay(sys_days{year{1999} / December / 31}) == "1999-12-31");
}

TEST_CASE("times are written in UTC to the minute, with the zone named") {
    const Timestamp at = sys_days{year{2025} / June / 21} + hours{14} + minutes{55} + seconds{59};
    CHECK(formatTimeUtc(at) == "2025-06-21 14:55 UTC");
    CHECK(dayOf(at) == sys_days{year{2025} / June / 21});
    // Midnight belongs to the day it starts.
    CHECK(formatTimeUtc(Timestamp{sys_days{year{2026} / January / 1}}) == "2026-01-01 00:00 UTC");
}
