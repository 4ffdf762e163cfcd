// Reading the audit log that the database's triggers write for every change.
#pragma once

#include <QString>

#include <cstdint>
#include <optional>
#include <vector>

namespace mw::storage {

class Workbook;

struct AuditEntry {
    std::int64_t id = 0;
    QString at;                          // ISO 8601 UTC with milliseconds
    std::optional<std::int64_t> user_id; // nullopt: written outside the app or before sign-in
    QString table;                       // e.g. "readings"
    std::int64_t row_id = 0;
    QString action;    // "insert", "update" or "delete"
    QString oldValues; // JSON object of the row before an update or delete
    // JSON object of the row after an update. Empty for a delete; for an insert the row's key
    // when it has no id of its own (a reading: range, point, direction, phase, repeat), else
    // empty: the row holds what was inserted, and a later change logs those values.
    QString newValues;
};

class AuditRepository {
public:
    explicit AuditRepository(const Workbook& workbook)
        : workbook_(workbook) {}

    // Entries oldest first; restricted to one table (and one row) when given.
    std::vector<AuditEntry> entries(const QString& table = {},
                                    std::optional<std::int64_t> rowId = {}) const;
    // Everything logged about one calibration session and its parts, oldest first: what was
    // saved when, and by whom (the session log a technician or reviewer reads).
    std::vector<AuditEntry> entriesOfSession(std::int64_t sessionId) const;
    std::int64_t count() const;

private:
    const Workbook& workbook_;
};

} // namespace mw::storage
