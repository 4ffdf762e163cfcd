// The due list: date arithmetic and ordering over what storage read.
#include "core/interval/due.h"

#include <algorithm>
#include <stdexcept>
#include <tuple>

namespace mw {
namespace {

using std::chrono::days;
using std::chrono::sys_days;

const ReferenceStandard* findStandard(const std::vector<ReferenceStandard>& standards,
                                      std::int64_t id) {
    const auto it = std::find_if(standards.begin(), standards.end(),
                                 [id](const ReferenceStandard& s) { return s.id == id; });
    return it == standards.end() ? nullptr : &*it;
}

int daysBetween(sys_days from, sys_days to) {
    return static_cast<int>((to - from).count());
}

DueEntry instrumentEntry(const InstrumentDueSource& source,
                         const std::vector<ReferenceStandard>& standards, sys_days asOf) {
    DueEntry entry;
    entry.subject = DueSubject::Instrument;
    entry.id = source.instrumentId;
    entry.assetTag = source.assetTag;
    entry.description = source.description;
    entry.location = source.location;
    entry.status = source.status;
    entry.lastCalibrated = source.lastCalibrated;
    entry.lastSessionId = source.lastSessionId;
    entry.openSessionId = source.openSessionId;
    entry.openState = source.openState;
    if (source.lastCalibrated) {
        entry.dueDate = *source.lastCalibrated + days(source.intervalDays);
        entry.daysOverdue = daysBetween(*entry.dueDate, asOf);
    }
    for (std::int64_t id : source.standardsUsed) {
        DueStandardUse use;
        use.standardId = id;
        if (const ReferenceStandard* standard = findStandard(standards, id)) {
            use.assetTag = standard->asset_tag;
            use.dueDate = standard->due_date;
            // A certificate holds through its due date (the workbook refuses its use only
            // after it, storage/sqlite_triggers.cpp).
            use.inDate = standard->due_date >= asOf;
        } else {
            use.assetTag = "standard " + std::to_string(id);
        }
        entry.standards.push_back(std::move(use));
    }
    return entry;
}

DueEntry standardEntry(const ReferenceStandard& standard, sys_days asOf) {
    DueEntry entry;
    entry.subject = DueSubject::Standard;
    entry.id = standard.id;
    entry.assetTag = standard.asset_tag;
    entry.description = standard.description;
    entry.lastCalibrated = standard.calibrated_on;
    entry.dueDate = standard.due_date;
    entry.daysOverdue = daysBetween(standard.due_date, asOf);
    return entry;
}

} // namespace

std::vector<DueEntry> selectDue(const std::vector<InstrumentDueSource>& instruments,
                                const std::vector<ReferenceStandard>& standards, sys_days asOf,
                                int withinDays) {
    if (withinDays < 0) {
        throw std::invalid_argument("due list: the window of " + std::to_string(withinDays) +
                                    " days is negative; give 0 or more days");
    }
    const sys_days horizon = asOf + days(withinDays);
    std::vector<DueEntry> due;
    for (const InstrumentDueSource& source : instruments) {
        if (source.status == InstrumentStatus::Retired) {
            continue;
        }
        DueEntry entry = instrumentEntry(source, standards, asOf);
        if (!entry.dueDate || *entry.dueDate <= horizon) {
            due.push_back(std::move(entry));
        }
    }
    for (const ReferenceStandard& standard : standards) {
        if (standard.due_date <= horizon) {
            due.push_back(standardEntry(standard, asOf));
        }
    }
    std::stable_sort(due.begin(), due.end(), [](const DueEntry& a, const DueEntry& b) {
        // Never calibrated (no due date) first; std::optional orders nullopt lowest.
        return std::tie(a.dueDate, a.subject, a.assetTag) <
               std::tie(b.dueDate, b.subject, b.assetTag);
    });
    return due;
}

} // namespace mw
