// The instrument register: instruments with their ranges, and the due list.
#pragma once

#include "core/model/instrument.h"

#include <QString>

#include <chrono>
#include <optional>
#include <vector>

namespace mw::storage {

class Workbook;

// One line of the due list. Due and overdue are computed from the last approved calibration,
// never stored (an instrument never calibrated has no due date and comes first).
struct DueItem {
    std::int64_t instrument_id = 0;
    std::string asset_tag;
    std::string description;
    InstrumentStatus status = InstrumentStatus::InService;
    int interval_days = 0;
    std::optional<std::chrono::sys_days> last_calibrated;
    std::optional<std::chrono::sys_days> due_date;
};

class InstrumentRepository {
public:
    explicit InstrumentRepository(Workbook& workbook)
        : workbook_(workbook) {}

    // Inserts the instrument and its ranges; sets instrument.id and every range's id.
    void add(Instrument& instrument);
    // Saves the instrument's fields; ranges with id 0 are added (ids set), ranges no longer
    // listed are removed (refused while readings refer to them), others are updated.
    void update(Instrument& instrument);

    std::optional<Instrument> find(std::int64_t instrumentId) const;
    std::optional<Instrument> findByTag(const QString& assetTag) const;
    std::vector<Instrument> all() const; // ordered by asset tag
    std::int64_t count() const;

    // Instruments not retired, never-calibrated first, then by due date (earliest first).
    std::vector<DueItem> dueList() const;

private:
    Workbook& workbook_;
};

} // namespace mw::storage
