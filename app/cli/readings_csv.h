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
// `unit` with `options` (decimal comma; the power of ten of a bare number, the range's prefix).
// A repeat cell gives the reading's repeat number; empty or absent, it is 0 (not numbered).
// Throws UsageError naming line and column.
ReadingsFile readReadingsCsv(const QString& path, Unit unit, const ParseOptions& options);

// The engine numbers readings from 1 in file order; a person editing the file wants its
// line, so an error about one reading becomes "FILE line L (reading N) …", naming the line of
// a conflicting earlier reading too. Other errors come back as their message.
QString messageWithCsvLine(const EvaluationError& error, const ReadingsFile& file);

} // namespace mw::cli
