// Reading the CSV of `calc evaluate`: one reading per row, each remembered with its line.
#include "app/cli/readings_csv.h"

#include "app/cli/cli_support.h"
#include "app/cli/csv_table.h"
#include "core/units/quantity.h"

namespace mw::cli {
namespace {

struct CsvColumns {
    int applied = -1;
    int indicated = -1;
    int direction = -1;
    int repeat = -1;
};

CsvColumns columnsOf(const CsvTable& table) {
    // A misspelt "direction" would otherwise turn up and down readings into repeats.
    table.requireKnownColumns({QStringLiteral("applied"), QStringLiteral("indicated"),
                               QStringLiteral("direction"), QStringLiteral("repeat")});
    CsvColumns columns{
        table.column(QStringLiteral("applied")), table.column(QStringLiteral("indicated")),
        table.column(QStringLiteral("direction")), table.column(QStringLiteral("repeat"))};
    if (columns.applied < 0 || columns.indicated < 0) {
        throw UsageError(QStringLiteral("%1: the header must name the columns applied and "
                                        "indicated (optional: direction, repeat)")
                             .arg(table.where(table.header.line)));
    }
    return columns;
}

double cellValue(const QString& where, const QString& cell, Unit unit,
                 const ParseOptions& options) {
    if (cell.isEmpty()) {
        throw UsageError(where + QStringLiteral(": empty"));
    }
    const QString escaped = escapedCell(cell);
    if (escaped != cell) {
        // The parser's own message would quote the raw text, cut short at a NUL.
        throw UsageError(
            QStringLiteral("%1 \"%2\": a control character in the cell").arg(where, escaped));
    }
    try {
        return parseValue(cell.toStdString(), unit, options);
    } catch (const QuantityError& error) {
        throw UsageError(QStringLiteral("%1 \"%2\": %3")
                             .arg(where, escapedCell(cell), QString::fromStdString(error.what())));
    }
}

EvaluationReading readRow(const CsvTable& table, const CsvRow& row, const CsvColumns& columns,
                          Unit unit, const ParseOptions& options) {
    auto cellAt = [&row](int column) {
        return column >= 0 ? row.cells[column] : QString();
    };
    auto where = [&](const char* column) {
        return QStringLiteral("%1, column %2").arg(table.where(row.line), QLatin1String(column));
    };
    EvaluationReading reading;
    reading.applied = cellValue(where("applied"), cellAt(columns.applied), unit, options);
    reading.indicated = cellValue(where("indicated"), cellAt(columns.indicated), unit, options);
    const QString direction = cellAt(columns.direction).toLower();
    if (direction == QStringLiteral("down")) {
        reading.direction = Direction::Down;
    } else if (!direction.isEmpty() && direction != QStringLiteral("up")) {
        throw UsageError(
            where("direction") +
            QStringLiteral(" \"%1\": expected up or down").arg(escapedCell(direction)));
    }
    const QString repeat = cellAt(columns.repeat);
    if (!repeat.isEmpty()) {
        bool ok = false;
        reading.repeat = repeat.toInt(&ok);
        if (!ok || reading.repeat < 1) {
            throw UsageError(
                where("repeat") +
                QStringLiteral(" \"%1\": expected a whole number >= 1").arg(escapedCell(repeat)));
        }
    }
    return reading;
}

} // namespace

ReadingsFile readReadingsCsv(const QString& path, Unit unit, const ParseOptions& options) {
    const CsvTable table = tableFromLines(path, readDataLines(path, QStringLiteral("readings")));
    const CsvColumns columns = columnsOf(table);
    ReadingsFile file{path, {}, {}};
    for (const CsvRow& row : table.rows) {
        file.readings.push_back(readRow(table, row, columns, unit, options));
        file.lines.push_back(row.line);
    }
    if (file.readings.empty()) {
        throw UsageError(QStringLiteral("%1: no readings after the header").arg(shownPath(path)));
    }
    return file;
}

QString messageWithCsvLine(const EvaluationError& error, const ReadingsFile& file) {
    const auto lineOf = [&file](std::optional<std::size_t> number) -> std::optional<int> {
        if (!number || *number < 1 || *number > file.lines.size()) {
            return std::nullopt;
        }
        return file.lines[*number - 1];
    };
    const std::optional<int> line = lineOf(error.readingNumber());
    if (!line) {
        return QString::fromStdString(error.what());
    }
    QString message =
        QStringLiteral("%1 line %2 (reading %3) %4")
            .arg(shownPath(file.path), QString::number(*line),
                 QString::number(*error.readingNumber()), QString::fromStdString(error.detail()));
    if (const std::optional<int> earlier = lineOf(error.conflictingReadingNumber())) {
        message += QStringLiteral("; reading %1 is on line %2")
                       .arg(*error.conflictingReadingNumber())
                       .arg(*earlier);
    }
    return message;
}

} // namespace mw::cli
