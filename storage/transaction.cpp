// Write transactions: BEGIN IMMEDIATE, the audit actor for the duration, and rollback unless
// committed.
#include "storage/transaction.h"

#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"
#include "storage/workbook.h"

#include <QSqlQuery>

namespace mw::storage {
namespace {

void setAuditActor(const QSqlDatabase& db, std::optional<std::int64_t> userId) {
    QSqlQuery query = sql::prepare(db, QStringLiteral("UPDATE audit_context SET user_id = ? "
                                                      "WHERE id = 1"));
    query.addBindValue(sql::nullableId(userId));
    sql::exec(query, QStringLiteral("recording who writes"));
}

} // namespace

Transaction::Transaction(Workbook& workbook, Durability durability)
    : workbook_(workbook)
    , durability_(durability) {
    workbook_.requireWritable(QStringLiteral("write"));
    const QSqlDatabase db = workbook_.database();
    if (workbook_.transactionDepth_ == 0) {
        if (durability_ == Durability::Full) {
            dialect::setFullSync(db, true);
        }
        sql::execText(db, dialect::beginWrite(), QStringLiteral("starting a write"));
        outermost_ = true;
        workbook_.rollbackOnly_ = false;
        try {
            setAuditActor(db, workbook_.actor());
        } catch (...) {
            QSqlQuery(db).exec(QStringLiteral("ROLLBACK"));
            throw;
        }
    }
    // SQLite cannot change synchronous inside a transaction, so a Full guard nested in a
    // Normal one commits with the outer guard's durability (bulk imports, demo workbooks).
    ++workbook_.transactionDepth_;
}

Transaction::~Transaction() {
    if (done_) {
        return;
    }
    --workbook_.transactionDepth_;
    if (!outermost_) {
        workbook_.rollbackOnly_ = true;
        return;
    }
    const QSqlDatabase db = workbook_.database();
    QSqlQuery(db).exec(QStringLiteral("ROLLBACK"));
    QSqlQuery(db).exec(QStringLiteral("PRAGMA synchronous = NORMAL"));
}

void Transaction::commit() {
    if (!outermost_) {
        done_ = true;
        --workbook_.transactionDepth_;
        return;
    }
    if (workbook_.rollbackOnly_) {
        throw WorkbookError(
            WorkbookError::Kind::Sql,
            QStringLiteral("a step of this change failed, so none of it was saved"));
    }
    const QSqlDatabase db = workbook_.database();
    setAuditActor(db, std::nullopt);
    sql::execText(db, QStringLiteral("COMMIT"), QStringLiteral("saving"));
    done_ = true;
    --workbook_.transactionDepth_;
    if (durability_ == Durability::Full) {
        dialect::setFullSync(db, false);
    }
}

} // namespace mw::storage
