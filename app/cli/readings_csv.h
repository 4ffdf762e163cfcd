// The readings CSV of `calc evaluate`: header applied,indicated[,direction][,repeat], one
// reading per row, each remembered with its line so that messages point into the file.
#pragma once

#include "core/evaluation/evaluation.h"
#include "core/units/quantity.h"

#include <QString>

#include <vector>

namespace mw::cli {

// The readings in file order and the 1-based CSV line each came from.
struct ReadingsFile {
    QString path;
    std::vector<EvaluationReading> readings;
    std::vector<int> lines;
};

// Reads `path` (see csv_table.h for separators, quotes and skipped lines); values are parsed in
// `unit`, with a decimal comma when `decimalComma`. Throws UsageError naming line and column.
ReadingsFile readReadingsCsv(const QString& path, Unit unit, bool decimalComma);

// The engine numbers readings from 1 in file order ("evaluation: reading N …"); a person editing
// the file wants its line, so the reading number is replaced by "FILE line L (reading N)".
// Other messages come back unchanged.
QString messageWithCsvLine(const QString& message, const ReadingsFile& file);

} // namespace mw::cli
