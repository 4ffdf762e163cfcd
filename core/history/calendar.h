// Dates and times as records and reports print them: ISO 8601 days, and UTC times to the minute.
#pragma once

#include "core/model/calibration.h"

#include <chrono>
#include <string>

namespace mw {

// The calendar day (UTC) a moment falls on.
std::chrono::sys_days dayOf(Timestamp at);

// "2025-06-21".
std::string formatDay(std::chrono::sys_days day);

// "2025-06-21 14:55 UTC": records are read in other time zones, so the zone is always written.
std::string formatTimeUtc(Timestamp at);

} // namespace mw
