// Comparing a workbook's schema and values with a fresh workbook of the same version.
#include "storage/schema_check.h"

#include "storage/schema.h"
#include "storage/sql_support.h"
#include "storage/workbook_error.h"

#include <QAtomicInteger>
#include <QMap>
#include <QMutex>
#include <QRegularExpression>
#include <QSqlQuery>
#include <QSqlRecord>
#include <QUrl>

#include <map>

namespace mw::storage::schema {
namespace {

struct Object {
    QString type;
    QString table;
    QString sql;
};
using Objects = QMap<QString, Object>; // by name

QString nextName() {
    static QAtomicInteger<quint64> counter;
    return QStringLiteral("meterwright-schema-%1").arg(counter.fetchAndAddRelaxed(1));
}

// A connection of its own to a scratch database, removed with the guard.
class Scratch {
public:
    explicit Scratch(const QString& options = {})
        : name_(nextName()) {
        QSqlDatabase db = QSqlDatabase::addDatabase(QStringLiteral("QSQLITE"), name_);
        // An empty name is a private temporary database SQLite deletes on closing; it spills
        // to disk, so checking a large workbook does not hold it all in memory.
        db.setDatabaseName(QString());
        db.setConnectOptions(options);
        if (!db.open()) {
            throw sql::errorFrom(db.lastError(), QStringLiteral("opening a scratch database"));
        }
    }
    ~Scratch() {
        {
            QSqlDatabase db = QSqlDatabase::database(name_, false);
            db.close();
        }
        QSqlDatabase::removeDatabase(name_);
    }
    Scratch(const Scratch&) = delete;
    Scratch& operator=(const Scratch&) = delete;
    QSqlDatabase db() const { return QSqlDatabase::database(name_, false); }

private:
    QString name_;
};

Objects objectsOf(const QSqlDatabase& db, const QString& schemaName = QStringLiteral("main")) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT type, name, tbl_name, coalesce(sql, '') "
                                                  "FROM %1.sqlite_master WHERE name NOT LIKE "
                                                  "'sqlite_%'")
                                       .arg(schemaName));
    sql::exec(q, QStringLiteral("reading the schema"));
    Objects objects;
    while (q.next()) {
        objects.insert(q.value(1).toString(),
                       {q.value(0).toString(), q.value(2).toString(), q.value(3).toString()});
    }
    return objects;
}

// A fresh workbook of each version, built once per process.
const Objects& expected(int version) {
    static QMutex mutex;
    static std::map<int, Objects> cache;
    const QMutexLocker locker(&mutex);
    auto found = cache.find(version);
    if (found == cache.end()) {
        const Scratch scratch;
        migrate(scratch.db(), version);
        found = cache.emplace(version, objectsOf(scratch.db())).first;
    }
    return found->second;
}

QString describe(const QString& name, const Object& object) {
    return QStringLiteral("%1 %2").arg(object.type, name);
}

QString uriFor(const QString& path) {
    return QStringLiteral("file:") + QString::fromLatin1(QUrl::toPercentEncoding(path, "/")) +
           QStringLiteral("?mode=ro");
}

QString quoted(const QString& identifier) {
    return QLatin1Char('"') +
           QString(identifier).replace(QLatin1Char('"'), QStringLiteral("\"\"")) + QLatin1Char('"');
}

// Copies the first `rows` rows of `table` into the scratch copy inside a savepoint that is
// rolled back; returns SQLite's complaint, empty when they fit.
QString tryCopy(const QSqlDatabase& db, const QString& table, qint64 rows) {
    QSqlQuery q(db);
    q.exec(QStringLiteral("SAVEPOINT probe"));
    QString complaint;
    if (!q.exec(QStringLiteral("INSERT INTO main.%1 SELECT * FROM wb.%1 LIMIT %2")
                    .arg(quoted(table))
                    .arg(rows))) {
        complaint = q.lastError().databaseText();
        if (complaint.isEmpty()) {
            complaint = q.lastError().text();
        }
    }
    q.exec(QStringLiteral("ROLLBACK TO probe"));
    q.exec(QStringLiteral("RELEASE probe"));
    return complaint;
}

// The row at `offset` of `table`, named by its id and its session where it has them.
QString rowName(const QSqlDatabase& db, const QString& table, qint64 offset) {
    QSqlQuery q(db);
    if (!q.exec(QStringLiteral("SELECT * FROM wb.%1 LIMIT 1 OFFSET %2")
                    .arg(quoted(table))
                    .arg(offset)) ||
        !q.next()) {
        return QStringLiteral("row %1").arg(offset + 1);
    }
    const QSqlRecord record = q.record();
    QString name = record.contains(QStringLiteral("id"))
                       ? QStringLiteral("row id %1").arg(q.value(QStringLiteral("id")).toString())
                       : QStringLiteral("row %1").arg(offset + 1);
    if (table == QLatin1String("calibration_sessions")) {
        name += QStringLiteral(" (session %1)").arg(q.value(QStringLiteral("id")).toString());
    } else if (record.contains(QStringLiteral("session_id"))) {
        name +=
            QStringLiteral(" (session %1)").arg(q.value(QStringLiteral("session_id")).toString());
    }
    return name;
}

// The first row of `table` that does not fit its definition, found by halving: copying the
// first n rows fails exactly when one of them does not fit.
QString firstBadRow(const QSqlDatabase& db, const QString& table, qint64 count) {
    qint64 good = 0;    // the first `good` rows fit
    qint64 bad = count; // the first `bad` rows do not
    while (bad - good > 1) {
        const qint64 middle = good + (bad - good) / 2;
        (tryCopy(db, table, middle).isEmpty() ? good : bad) = middle;
    }
    return rowName(db, table, bad - 1);
}

// Rules added to an earlier version after it shipped (the key triggers of version 2) are
// accepted when all they can do is refuse a write: one SELECT RAISE(ABORT, ...) and nothing
// else, so they cannot change what is stored.
bool onlyRefuses(const QString& triggerSql) {
    static const QRegularExpression pattern(
        QStringLiteral("^CREATE TRIGGER \\w+ BEFORE (INSERT|UPDATE)[^;]* BEGIN SELECT "
                       "RAISE\\(ABORT, '([^']|'')*'\\); END$"));
    return pattern.match(triggerSql).hasMatch();
}

} // namespace

QStringList differences(const QSqlDatabase& db, int version) {
    const Objects& want = expected(version);
    const Objects have = objectsOf(db);
    QStringList found;
    for (auto it = want.begin(); it != want.end(); ++it) {
        const auto present = have.find(it.key());
        if (present == have.end()) {
            found << describe(it.key(), it.value()) + QStringLiteral(" is missing");
        } else if (present->type != it->type || present->sql != it->sql) {
            found << describe(it.key(), it.value()) +
                         QStringLiteral(" differs from its definition");
        }
    }
    const Objects& current = expected(kCurrentVersion);
    for (auto it = have.begin(); it != have.end(); ++it) {
        if (want.contains(it.key())) {
            continue;
        }
        const auto known = current.find(it.key());
        const bool laterRule =
            version < kCurrentVersion && it->type == QLatin1String("trigger") &&
            ((known != current.end() && known->sql == it->sql) || onlyRefuses(it->sql));
        if (!laterRule) {
            found << describe(it.key(), it.value()) +
                         QStringLiteral(" is not part of workbook version %1").arg(version);
        }
    }
    return found;
}

QStringList missingRules(const QSqlDatabase& db, int version) {
    const Objects& want = expected(version);
    const Objects have = objectsOf(db);
    QStringList missing;
    for (auto it = want.begin(); it != want.end(); ++it) {
        if (it->type == QLatin1String("trigger") &&
            (!have.contains(it.key()) || have.value(it.key()).sql != it->sql)) {
            missing << it.key();
        }
    }
    return missing;
}

QStringList valueProblems(const QString& path, int version) {
    const Scratch scratch(QStringLiteral("QSQLITE_OPEN_URI"));
    const QSqlDatabase db = scratch.db();
    const QString context = QStringLiteral("checking the values of %1").arg(path);
    migrate(db, version);
    const Objects objects = objectsOf(db);
    for (auto it = objects.begin(); it != objects.end(); ++it) {
        if (it->type == QLatin1String("trigger")) {
            sql::execText(db, QStringLiteral("DROP TRIGGER %1").arg(quoted(it.key())), context);
        }
    }
    sql::execText(db, QStringLiteral("PRAGMA foreign_keys = OFF"), context);
    // A scratch copy that is thrown away: no journal, no waiting for the disk.
    sql::execText(db, QStringLiteral("PRAGMA journal_mode = OFF"), context);
    sql::execText(db, QStringLiteral("PRAGMA synchronous = OFF"), context);
    QSqlQuery attach = sql::prepare(db, QStringLiteral("ATTACH DATABASE ? AS wb"));
    attach.addBindValue(uriFor(path));
    sql::exec(attach, context);
    QStringList problems;
    for (auto it = objects.begin(); it != objects.end(); ++it) {
        if (it->type != QLatin1String("table")) {
            continue;
        }
        const QString table = it.key();
        sql::execText(db, QStringLiteral("DELETE FROM main.%1").arg(quoted(table)), context);
        const qint64 count =
            sql::scalar(db, QStringLiteral("SELECT count(*) FROM wb.%1").arg(quoted(table)),
                        context)
                .toLongLong();
        const QString complaint = tryCopy(db, table, count);
        if (!complaint.isEmpty()) {
            problems << QStringLiteral("table %1, %2: %3")
                            .arg(table, firstBadRow(db, table, count), complaint);
        }
    }
    sql::execText(db, QStringLiteral("DETACH DATABASE wb"), context);
    return problems;
}

} // namespace mw::storage::schema
