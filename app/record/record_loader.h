// Reads from a workbook what records and history reports are printed from. The laboratory,
// the standards, the users and the instruments are read once, so a batch of records reads
// each session and little else.
#pragma once

#include "core/record/calibration_record.h"
#include "core/record/history_report.h"

#include <QString>

#include <cstdint>
#include <optional>
#include <vector>

namespace mw::storage {
class Workbook;
}

namespace mw::record {

class RecordLoader {
public:
    explicit RecordLoader(storage::Workbook& workbook);

    // What the record of the session is printed from; nullopt when there is no such session.
    std::optional<RecordSource> record(std::int64_t sessionId, Timestamp printedAt) const;
    // What the history report of the instrument is printed from; nullopt when there is none.
    std::optional<HistoryReportSource> history(std::int64_t instrumentId,
                                               Timestamp printedAt) const;

    std::optional<Instrument> instrumentByTag(const QString& assetTag) const;
    // The instrument's current record: approved (not superseded), approved last.
    std::optional<std::int64_t> latestApproved(std::int64_t instrumentId) const;

private:
    const Instrument* instrument(std::int64_t instrumentId) const;

    storage::Workbook& workbook_;
    std::optional<Lab> lab_;
    std::vector<ReferenceStandard> standards_;
    std::vector<User> users_;
    std::vector<Instrument> instruments_;
};

// Now, to the second, as records time their printing.
Timestamp printTime();

} // namespace mw::record
