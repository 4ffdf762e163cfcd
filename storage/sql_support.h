// Small helpers every repository uses: prepared statements that throw WorkbookError, and the
// text forms of timestamps, dates, units and enumerations in the workbook's columns.
#pragma once

#include "core/model/calibration.h"
#include "core/model/vocabulary.h"
#include "core/units/quantity.h"
#include "storage/workbook_error.h"

#include <QSqlDatabase>
#include <QSqlError>
#include <QSqlQuery>
#include <QString>
#include <QVariant>

#include <chrono>
#include <optional>
#include <string>
#include <string_view>

namespace mw::storage::sql {

// Turns a Qt SQL error into a WorkbookError whose kind follows SQLite's result code and whose
// message starts with `context` (what the workbook was doing).
WorkbookError errorFrom(const QSqlError& error, const QString& context);

QSqlQuery prepare(const QSqlDatabase& db, const QString& text);
void exec(QSqlQuery& query, const QString& context);
void execText(const QSqlDatabase& db, const QString& text, const QString& context);
// Runs a one-value query ("SELECT COUNT(*) ...") and returns that value.
QVariant scalar(const QSqlDatabase& db, const QString& text, const QString& context);

// Timestamps as ISO 8601 UTC text "2024-03-05T10:00:00+00:00" (the form Qt writes for a UTC
// time, kept since the first workbook): they sort as they compare.
QString toIso(Timestamp at);
Timestamp timestampFrom(const QVariant& value);
QVariant nullableTime(const std::optional<Timestamp>& at);
std::optional<Timestamp> optionalTimestamp(const QVariant& value);
QString toIsoDate(std::chrono::sys_days day);
std::chrono::sys_days dateFrom(const QVariant& value);

// Units stored in the workbook: "V", "A", "ohm"; any other unit is BadInput naming `field`.
QString unitText(Unit unit, const QString& field);
Unit unitFrom(const QVariant& value);

QString text(std::string_view value);
std::string toStd(const QVariant& value);
QVariant nullableId(const std::optional<std::int64_t>& id);
QVariant nullableReal(const std::optional<double>& value);

// Reads an enumeration stored as its stable text; Corrupt naming the column if unknown.
template <typename Enum>
Enum enumFrom(const QVariant& value, const char* column) {
    const std::string word = toStd(value);
    if (auto parsed = fromText<Enum>(word)) {
        return *parsed;
    }
    throw WorkbookError(WorkbookError::Kind::Corrupt,
                        QStringLiteral("unknown value \"%1\" in column %2")
                            .arg(QString::fromStdString(word), QLatin1String(column)));
}

template <typename Enum>
QString enumText(Enum value) {
    return text(toText(value));
}

} // namespace mw::storage::sql
