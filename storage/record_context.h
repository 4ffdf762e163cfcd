// What an approved record's conformity rests on besides its own rows: the instrument as it was
// specified (class, scale, ranges) and who signed it. Loaded for the record's digest.
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/user.h"

#include <QSqlDatabase>

#include <cstdint>
#include <map>
#include <optional>

namespace mw::storage {

// Missing members (a row deleted behind the app's back) are written as such into the
// canonical text, so the digest no longer matches instead of verification failing to run.
struct RecordContext {
    std::optional<Instrument> instrument; // with all its ranges; only those used are digested
    std::optional<User> technician;
    std::optional<User> reviewer;
};

// Instruments, ranges and users read once, then handed out per session.
class RecordContexts {
public:
    // All instruments of the workbook, or only `instrumentId`'s when given.
    explicit RecordContexts(const QSqlDatabase& db,
                            std::optional<std::int64_t> instrumentId = std::nullopt);

    RecordContext of(const CalibrationSession& session) const;

private:
    std::map<std::int64_t, Instrument> instruments_;
    std::map<std::int64_t, User> users_;
};

} // namespace mw::storage
