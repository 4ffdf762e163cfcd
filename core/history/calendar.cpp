// Date and time text for records and reports.
#include "core/history/calendar.h"

#include <cstdio>

namespace mw {

std::chrono::sys_days dayOf(Timestamp at) {
    return std::chrono::floor<std::chrono::days>(at);
}

std::string formatDay(std::chrono::sys_days day) {
    const std::chrono::year_month_day ymd{day};
    char text[16];
    std::snprintf(text, sizeof text, "%04d-%02u-%02u", static_cast<int>(ymd.year()),
                  static_cast<unsigned>(ymd.month()), static_cast<unsigned>(ymd.day()));
    return text;
}

std::string formatTimeUtc(Timestamp at) {
    const std::chrono::sys_days day = dayOf(at);
    const std::chrono::hh_mm_ss time{at - day};
    char text[16];
    std::snprintf(text, sizeof text, " %02d:%02d UTC", static_cast<int>(time.hours().count()),
                  static_cast<int>(time.minutes().count()));
    return formatDay(day) + text;
}

} // namespace mw
