// Reads what the due list is computed from (core/interval/due.h) and computes it: the one entry
// point for the due view and `meterwright due`.
#pragma once

#include "core/interval/due.h"

#include <chrono>
#include <optional>
#include <vector>

namespace mw::storage {

class Workbook;

struct DueReport {
    std::chrono::sys_days asOf{};
    int withinDays = kDefaultDueWindowDays; // the window the entries were selected with
    std::vector<DueEntry> entries;          // selectDue()'s order: overdue first
};

// Every instrument not retired, by asset tag, with its latest approved calibration, the
// standards that calibration used and any calibration under way. Three queries, whatever the
// workbook's size.
std::vector<InstrumentDueSource> dueSources(Workbook& workbook);

// What is due on `asOf` within `withinDays` (nullopt: the lab's due window setting, 30 days
// while the lab is not yet described). Throws std::invalid_argument for a negative window.
DueReport dueReport(Workbook& workbook, std::chrono::sys_days asOf,
                    std::optional<int> withinDays = std::nullopt);

} // namespace mw::storage
