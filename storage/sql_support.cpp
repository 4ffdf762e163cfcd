// Qt SQL plumbing shared by the repositories: errors, statements, column text forms.
#include "storage/sql_support.h"

#include <QDate>
#include <QDateTime>
#include <QTimeZone>

namespace mw::storage::sql {
namespace {

// SQLite primary result codes (sqlite3.h); Qt reports them as the native error code.
constexpr int kSqliteBusy = 5;
constexpr int kSqliteLocked = 6;
constexpr int kSqliteReadOnly = 8;
constexpr int kSqliteCorrupt = 11;
constexpr int kSqliteConstraint = 19;
constexpr int kSqliteNotADatabase = 26;

WorkbookError::Kind kindOf(int code) {
    switch (code & 0xff) { // extended codes carry the primary code in the low byte
    case kSqliteBusy:
    case kSqliteLocked:
        return WorkbookError::Kind::Locked;
    case kSqliteReadOnly:
        return WorkbookError::Kind::ReadOnly;
    case kSqliteCorrupt:
        return WorkbookError::Kind::Corrupt;
    case kSqliteNotADatabase:
        return WorkbookError::Kind::NotAWorkbook;
    case kSqliteConstraint:
        return WorkbookError::Kind::RuleViolation;
    default:
        return WorkbookError::Kind::Sql;
    }
}

} // namespace

WorkbookError errorFrom(const QSqlError& error, const QString& context) {
    bool isNumber = false;
    const int code = error.nativeErrorCode().toInt(&isNumber);
    const WorkbookError::Kind kind = isNumber ? kindOf(code) : WorkbookError::Kind::Sql;
    QString detail = error.databaseText().isEmpty() ? error.text() : error.databaseText();
    if (kind == WorkbookError::Kind::Locked) {
        detail += QStringLiteral(" (another program kept the workbook busy too long)");
    }
    return WorkbookError(kind, context + QStringLiteral(": ") + detail);
}

QSqlQuery prepare(const QSqlDatabase& db, const QString& text) {
    QSqlQuery query(db);
    query.setForwardOnly(true);
    if (!query.prepare(text)) {
        throw errorFrom(query.lastError(), QStringLiteral("preparing \"%1\"").arg(text.left(60)));
    }
    return query;
}

void exec(QSqlQuery& query, const QString& context) {
    if (!query.exec()) {
        throw errorFrom(query.lastError(), context);
    }
}

void execText(const QSqlDatabase& db, const QString& text, const QString& context) {
    QSqlQuery query(db);
    if (!query.exec(text)) {
        throw errorFrom(query.lastError(), context);
    }
}

QVariant scalar(const QSqlDatabase& db, const QString& text, const QString& context) {
    QSqlQuery query(db);
    query.setForwardOnly(true);
    if (!query.exec(text)) {
        throw errorFrom(query.lastError(), context);
    }
    return query.next() ? query.value(0) : QVariant();
}

QString toIso(Timestamp at) {
    return QDateTime::fromSecsSinceEpoch(at.time_since_epoch().count(), QTimeZone::utc())
        .toString(Qt::ISODate);
}

Timestamp timestampFrom(const QVariant& value) {
    const QDateTime parsed = QDateTime::fromString(value.toString(), Qt::ISODate);
    if (!parsed.isValid()) {
        throw WorkbookError(WorkbookError::Kind::Corrupt,
                            QStringLiteral("\"%1\" is not a timestamp").arg(value.toString()));
    }
    return Timestamp{std::chrono::seconds{parsed.toSecsSinceEpoch()}};
}

QVariant nullableTime(const std::optional<Timestamp>& at) {
    return at ? QVariant(toIso(*at)) : QVariant(QMetaType(QMetaType::QString));
}

std::optional<Timestamp> optionalTimestamp(const QVariant& value) {
    if (value.isNull()) {
        return std::nullopt;
    }
    return timestampFrom(value);
}

QString toIsoDate(std::chrono::sys_days day) {
    const std::chrono::year_month_day ymd{day};
    return QDate(int(ymd.year()), int(unsigned(ymd.month())), int(unsigned(ymd.day())))
        .toString(Qt::ISODate);
}

std::chrono::sys_days dateFrom(const QVariant& value) {
    const QDate date = QDate::fromString(value.toString(), Qt::ISODate);
    if (!date.isValid()) {
        throw WorkbookError(WorkbookError::Kind::Corrupt,
                            QStringLiteral("\"%1\" is not a date").arg(value.toString()));
    }
    return std::chrono::sys_days{std::chrono::year{date.year()} /
                                 std::chrono::month{unsigned(date.month())} /
                                 std::chrono::day{unsigned(date.day())}};
}

QString unitText(Unit unit, const QString& field) {
    switch (unit) {
    case Unit::Volt:
        return QStringLiteral("V");
    case Unit::Ampere:
        return QStringLiteral("A");
    case Unit::Ohm:
        return QStringLiteral("ohm");
    default:
        throw WorkbookError(WorkbookError::Kind::BadInput,
                            QStringLiteral("%1: unit %2 cannot be stored (volts, amperes or ohms)")
                                .arg(field, text(unitSymbol(unit))));
    }
}

Unit unitFrom(const QVariant& value) {
    const QString word = value.toString();
    if (word == QLatin1String("V")) {
        return Unit::Volt;
    }
    if (word == QLatin1String("A")) {
        return Unit::Ampere;
    }
    if (word == QLatin1String("ohm")) {
        return Unit::Ohm;
    }
    throw WorkbookError(WorkbookError::Kind::Corrupt,
                        QStringLiteral("unknown unit \"%1\"").arg(word));
}

QString text(std::string_view value) {
    return QString::fromUtf8(value.data(), qsizetype(value.size()));
}

std::string toStd(const QVariant& value) {
    return value.toString().toStdString();
}

QVariant nullableId(const std::optional<std::int64_t>& id) {
    return id ? QVariant(qint64(*id)) : QVariant(QMetaType(QMetaType::LongLong));
}

QVariant nullableReal(const std::optional<double>& value) {
    return value ? QVariant(*value) : QVariant(QMetaType(QMetaType::Double));
}

} // namespace mw::storage::sql
