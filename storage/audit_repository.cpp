// Reading the audit log.
#include "storage/audit_repository.h"

#include "storage/sql_support.h"
#include "storage/workbook.h"

namespace mw::storage {

namespace {

const QString kColumns = QStringLiteral("SELECT id, at, user_id, table_name, row_id, action, "
                                        "old_values, new_values FROM audit_log");

std::vector<AuditEntry> read(QSqlQuery& q) {
    sql::exec(q, QStringLiteral("reading the audit log"));
    std::vector<AuditEntry> found;
    while (q.next()) {
        AuditEntry e;
        e.id = q.value(0).toLongLong();
        e.at = q.value(1).toString();
        if (!q.value(2).isNull()) {
            e.user_id = q.value(2).toLongLong();
        }
        e.table = q.value(3).toString();
        e.row_id = q.value(4).toLongLong();
        e.action = q.value(5).toString();
        e.oldValues = q.value(6).toString();
        e.newValues = q.value(7).toString();
        found.push_back(std::move(e));
    }
    return found;
}

} // namespace

std::vector<AuditEntry> AuditRepository::entries(const QString& table,
                                                 std::optional<std::int64_t> rowId) const {
    QString text = kColumns;
    if (!table.isEmpty()) {
        text += rowId ? QStringLiteral(" WHERE table_name = ? AND row_id = ?")
                      : QStringLiteral(" WHERE table_name = ?");
    }
    QSqlQuery q = sql::prepare(workbook_.database(), text + QStringLiteral(" ORDER BY id"));
    if (!table.isEmpty()) {
        q.addBindValue(table);
        if (rowId) {
            q.addBindValue(qint64(*rowId));
        }
    }
    return read(q);
}

std::vector<AuditEntry> AuditRepository::entriesOfSession(std::int64_t sessionId) const {
    // Rows logged under the session's id (the session and its parts without ids of their own),
    // and rows of parts with ids of their own that belong, or belonged, to the session.
    QSqlQuery q = sql::prepare(
        workbook_.database(),
        kColumns + QStringLiteral(
                       " WHERE (table_name IN ('calibration_sessions', 'readings', "
                       "'session_points', 'session_ranges', 'session_standard_specs') AND row_id "
                       "= ?) OR (table_name IN ('resistor_checks', 'adjustment_notes', "
                       "'session_standards', 'record_chain') AND (json_extract(old_values, "
                       "'$.session_id') = ? OR json_extract(new_values, '$.session_id') = ? OR "
                       "(table_name = 'resistor_checks' AND row_id IN (SELECT id FROM "
                       "resistor_checks WHERE session_id = ?)) OR (table_name = "
                       "'adjustment_notes' AND row_id IN (SELECT id FROM adjustment_notes WHERE "
                       "session_id = ?)) OR (table_name = 'session_standards' AND row_id IN "
                       "(SELECT id FROM session_standards WHERE session_id = ?)) OR (table_name "
                       "= 'record_chain' AND row_id IN (SELECT id FROM record_chain WHERE "
                       "session_id = ?)))) ORDER BY id"));
    for (int i = 0; i < 7; ++i) {
        q.addBindValue(qint64(sessionId));
    }
    return read(q);
}

std::int64_t AuditRepository::count() const {
    return sql::scalar(workbook_.database(), QStringLiteral("SELECT COUNT(*) FROM audit_log"),
                       QStringLiteral("counting audit entries"))
        .toLongLong();
}

} // namespace mw::storage
