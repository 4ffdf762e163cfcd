// Reinstalling the triggers of a workbook, recorded in its audit log.
#include "storage/rules_repair.h"

#include "storage/schema.h"
#include "storage/schema_check.h"
#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"
#include "storage/sqlite_triggers.h"
#include "storage/transaction.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"

#include <QJsonArray>
#include <QJsonDocument>

namespace mw::storage {

QStringList repairRules(Workbook& workbook, std::int64_t administratorId) {
    const auto administrator = UserRepository(workbook).find(administratorId);
    if (!administrator || !administrator->active || administrator->role != Role::Administrator) {
        throw WorkbookError(WorkbookError::Kind::RuleViolation,
                            QStringLiteral("only an active administrator may reinstall the "
                                           "workbook's rules"));
    }
    const QSqlDatabase db = workbook.database();
    const QStringList missing = schema::missingRules(db, workbook.schemaVersion());
    if (missing.isEmpty()) {
        return missing;
    }
    const QString context = QStringLiteral("reinstalling the workbook's rules");
    workbook.setActor(administratorId);
    Transaction transaction(workbook);
    QSqlQuery triggers =
        sql::prepare(db, QStringLiteral("SELECT name FROM sqlite_master WHERE type = 'trigger'"));
    sql::exec(triggers, context);
    QStringList present;
    while (triggers.next()) {
        present << triggers.value(0).toString();
    }
    for (const QString& name : present) {
        sql::execText(db, QStringLiteral("DROP TRIGGER \"%1\"").arg(name), context);
    }
    dialect::createTriggers(db);
    // The log's own triggers are back, so this row is written as any other: by the rules.
    QSqlQuery log = sql::prepare(
        db, QStringLiteral("INSERT INTO audit_log (at, user_id, table_name, row_id, action, "
                           "old_values, new_values) VALUES (%1, ?, 'sqlite_master', 0, "
                           "'update', ?, ?)")
                .arg(dialect::nowUtcExpression()));
    log.addBindValue(qint64(administratorId));
    log.addBindValue(QString::fromUtf8(
        QJsonDocument(QJsonArray::fromStringList(missing)).toJson(QJsonDocument::Compact)));
    log.addBindValue(QStringLiteral("[\"rules reinstalled\"]"));
    sql::exec(log, context);
    transaction.commit();
    return missing;
}

} // namespace mw::storage
