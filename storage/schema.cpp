// Schema versions and the migrations between them. A new workbook is created at the current
// version directly; an older one is brought up one step at a time, each step in its own
// transaction, with the earlier versions' SQL frozen as it shipped (storage/sql/).
#include "storage/schema.h"

#include "storage/frozen_schema.h"
#include "storage/schema_upgrade.h"
#include "storage/schema_v4.h"
#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"
#include "storage/sqlite_triggers.h"

#include <QSqlQuery>

namespace mw::storage::schema {
namespace {

const QString kContext = QStringLiteral("upgrading the workbook");

Timestamp now() {
    return std::chrono::floor<std::chrono::seconds>(std::chrono::system_clock::now());
}

void createVersion1(const QSqlDatabase& db) {
    dialect::setApplicationId(db);
    frozen::run(db, frozen::kSchemaVersion1Sql, 1);
}

void toVersion2(const QSqlDatabase& db) {
    frozen::run(db, frozen::kSchemaVersion2Sql, 2);
}

// Step `from` brings the schema from version `from` to `from + 1`.
void step(const QSqlDatabase& db, int from) {
    switch (from) {
    case 0:
        createVersion1(db);
        return;
    case 1:
        toVersion2(db);
        return;
    case 2:
        upgradeToVersion3(db);
        return;
    case 3:
        upgradeToVersion4(db, now());
        return;
    default:
        throw WorkbookError(WorkbookError::Kind::Internal,
                            QStringLiteral("no upgrade step from workbook version %1").arg(from));
    }
}

void rollback(const QSqlDatabase& db) {
    QSqlQuery(db).exec(QStringLiteral("ROLLBACK"));
}

// Runs `work` in one write transaction that also re-reads the version under the write lock, so
// two processes opening a new file at once do not both create it. Returns the version found.
template <typename Work>
int inTransaction(const QSqlDatabase& db, int targetVersion, Work work) {
    sql::execText(db, dialect::beginWrite(), kContext);
    const int version = dialect::userVersion(db);
    if (version >= targetVersion) {
        sql::execText(db, QStringLiteral("COMMIT"), kContext);
        return version;
    }
    try {
        const int reached = work(version);
        if (const auto problem = dialect::foreignKeyProblem(db)) {
            throw WorkbookError(WorkbookError::Kind::Corrupt,
                                kContext + QStringLiteral(": ") + *problem);
        }
        dialect::setUserVersion(db, reached);
        sql::execText(db, QStringLiteral("COMMIT"), kContext);
    } catch (...) {
        rollback(db);
        throw;
    }
    return version;
}

} // namespace

void createCurrentVersion(const QSqlDatabase& db) {
    dialect::setApplicationId(db);
    for (const schema4::TableDefinition& table : schema4::tables()) {
        sql::execText(db, schema4::expand(table.createSql),
                      QStringLiteral("creating table %1").arg(QLatin1String(table.name)));
    }
    for (const QString& index : schema4::indexes()) {
        sql::execText(db, index, QStringLiteral("creating an index"));
    }
    sql::execText(db, QStringLiteral("INSERT INTO audit_context (id, user_id) VALUES (1, NULL)"),
                  QStringLiteral("creating the audit context"));
    recordVersionReached(db, kCurrentVersion, now());
    dialect::createTriggers(db);
}

int migrate(const QSqlDatabase& db, int targetVersion) {
    if (targetVersion < 1 || targetVersion > kCurrentVersion) {
        throw WorkbookError(WorkbookError::Kind::Internal,
                            QStringLiteral("no workbook version %1").arg(targetVersion));
    }
    // Tables are rebuilt with foreign keys off (they cannot be switched inside a transaction);
    // each step checks them before it commits.
    dialect::setForeignKeys(db, false);
    try {
        for (;;) {
            int reached = 0;
            const int found = inTransaction(db, targetVersion, [&](int version) {
                if (version == 0 && targetVersion == kCurrentVersion) {
                    createCurrentVersion(db);
                    reached = kCurrentVersion;
                } else {
                    step(db, version);
                    reached = version + 1;
                }
                return reached;
            });
            if (found >= targetVersion || reached >= targetVersion) {
                break;
            }
        }
    } catch (...) {
        dialect::setForeignKeys(db, true);
        throw;
    }
    dialect::setForeignKeys(db, true);
    return dialect::userVersion(db);
}

} // namespace mw::storage::schema
