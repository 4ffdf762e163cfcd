// SQLite-only statements: connection pragmas, write locking, checks and backups.
#include "storage/sqlite_dialect.h"

#include "storage/sql_support.h"

#include <QSqlQuery>
#include <QStringList>

namespace mw::storage::dialect {
namespace {

int intPragma(const QSqlDatabase& db, const QString& pragma) {
    return sql::scalar(db, QStringLiteral("PRAGMA ") + pragma, QStringLiteral("reading ") + pragma)
        .toInt();
}

// SQLite answers a check with one row per problem, and a row may itself hold several lines
// (b-tree problems come as one text under a "*** in database main ***" heading). Callers show
// the verdict on one line, so it is summarised as the first problem and a count of the rest.
QString checkPragma(const QSqlDatabase& db, const QString& pragma) {
    QSqlQuery query(db);
    query.setForwardOnly(true);
    if (!query.exec(QStringLiteral("PRAGMA ") + pragma)) {
        throw sql::errorFrom(query.lastError(), QStringLiteral("running ") + pragma);
    }
    QStringList problems;
    while (query.next()) {
        for (const QString& line : query.value(0).toString().split(QLatin1Char('\n'))) {
            const QString trimmed = line.trimmed();
            if (!trimmed.isEmpty() && !trimmed.startsWith(QLatin1String("***"))) {
                problems << trimmed;
            }
        }
    }
    if (problems.isEmpty()) {
        return QStringLiteral("no answer");
    }
    if (problems.size() == 1) {
        return problems.first();
    }
    return QStringLiteral("%1 (and %2 more)").arg(problems.first()).arg(problems.size() - 1);
}

} // namespace

QString nowUtcExpression() {
    return QStringLiteral("strftime('%Y-%m-%dT%H:%M:%fZ', 'now')");
}

void configureConnection(const QSqlDatabase& db, bool readOnly,
                         std::chrono::milliseconds busyTimeout) {
    const QString context = QStringLiteral("configuring the connection");
    sql::execText(db, QStringLiteral("PRAGMA busy_timeout = %1").arg(busyTimeout.count()), context);
    sql::execText(db, QStringLiteral("PRAGMA foreign_keys = ON"), context);
    if (!readOnly) {
        sql::execText(db, QStringLiteral("PRAGMA journal_mode = WAL"), context);
        sql::execText(db, QStringLiteral("PRAGMA synchronous = NORMAL"), context);
    }
}

void setFullSync(const QSqlDatabase& db, bool full) {
    sql::execText(db,
                  full ? QStringLiteral("PRAGMA synchronous = FULL")
                       : QStringLiteral("PRAGMA synchronous = NORMAL"),
                  QStringLiteral("setting the durability of commits"));
}

QString beginWrite() {
    return QStringLiteral("BEGIN IMMEDIATE");
}

int applicationId(const QSqlDatabase& db) {
    return intPragma(db, QStringLiteral("application_id"));
}

void setApplicationId(const QSqlDatabase& db) {
    sql::execText(db, QStringLiteral("PRAGMA application_id = %1").arg(kApplicationId),
                  QStringLiteral("marking the file as a workbook"));
}

int userVersion(const QSqlDatabase& db) {
    return intPragma(db, QStringLiteral("user_version"));
}

void setUserVersion(const QSqlDatabase& db, int version) {
    sql::execText(db, QStringLiteral("PRAGMA user_version = %1").arg(version),
                  QStringLiteral("recording the schema version"));
}

int tableCount(const QSqlDatabase& db) {
    return sql::scalar(db,
                       QStringLiteral("SELECT COUNT(*) FROM sqlite_master WHERE type = 'table'"),
                       QStringLiteral("listing tables"))
        .toInt();
}

QString quickCheck(const QSqlDatabase& db) {
    return checkPragma(db, QStringLiteral("quick_check"));
}

QString integrityCheck(const QSqlDatabase& db) {
    return checkPragma(db, QStringLiteral("integrity_check"));
}

void vacuumInto(const QSqlDatabase& db, const QString& targetPath) {
    QString quoted = targetPath;
    quoted.replace(QLatin1Char('\''), QStringLiteral("''"));
    sql::execText(db, QStringLiteral("VACUUM INTO '%1'").arg(quoted),
                  QStringLiteral("writing a backup to %1").arg(targetPath));
}

void setForeignKeys(const QSqlDatabase& db, bool on) {
    sql::execText(db,
                  on ? QStringLiteral("PRAGMA foreign_keys = ON")
                     : QStringLiteral("PRAGMA foreign_keys = OFF"),
                  QStringLiteral("switching foreign key enforcement"));
}

std::optional<QString> foreignKeyProblem(const QSqlDatabase& db) {
    QSqlQuery query(db);
    query.setForwardOnly(true);
    if (!query.exec(QStringLiteral("PRAGMA foreign_key_check"))) {
        throw sql::errorFrom(query.lastError(), QStringLiteral("checking foreign keys"));
    }
    if (!query.next()) {
        return std::nullopt;
    }
    return QStringLiteral("row %1 of table %2 refers to a missing row of table %3")
        .arg(query.value(1).toLongLong())
        .arg(query.value(0).toString(), query.value(2).toString());
}

} // namespace mw::storage::dialect
