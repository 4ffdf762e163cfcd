#pragma once

// Conversions between the engine's calendar days and Qt's dates, for the window's date fields
// and the ISO dates its tables show.

#include <QDate>
#include <QString>

#include <chrono>

namespace mw::gui {

inline QDate toQDate(std::chrono::sys_days day) {
    const std::chrono::year_month_day ymd{day};
    return QDate(int(ymd.year()), int(unsigned(ymd.month())), int(unsigned(ymd.day())));
}

inline std::chrono::sys_days fromQDate(const QDate& date) {
    return std::chrono::sys_days{std::chrono::year{date.year()} / unsigned(date.month()) /
                                 unsigned(date.day())};
}

inline QString isoDate(std::chrono::sys_days day) {
    return toQDate(day).toString(Qt::ISODate);
}

} // namespace mw::gui
