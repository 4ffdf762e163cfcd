// Reading the audit log.
#include "storage/audit_repository.h"

#include "storage/sql_support.h"
#include "storage/workbook.h"

namespace mw::storage {

std::vector<AuditEntry> AuditRepository::entries(const QString& table,
                                                 std::optional<std::int64_t> rowId) const {
    QString text = QStringLiteral("SELECT id, at, user_id, table_name, row_id, action, "
                                  "old_values, new_values FROM audit_log");
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

std::int64_t AuditRepository::count() const {
    return sql::scalar(workbook_.database(), QStringLiteral("SELECT COUNT(*) FROM audit_log"),
                       QStringLiteral("counting audit entries"))
        .toLongLong();
}

} // namespace mw::storage
