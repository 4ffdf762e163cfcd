// Small CSV files handed to headless commands (readings, sampled waveforms): the separator taken
// from the header line, quoted cells, and 1-based line numbers for every message.
#pragma once

#include <QChar>
#include <QString>
#include <QStringList>

#include <vector>

namespace mw::cli {

// One line of the file that holds data: its 1-based number in the file and its text.
struct CsvLine {
    int number = 0;
    QString text;
};

struct CsvRow {
    int line = 0; // 1-based line number in the file
    QStringList cells;
};

struct CsvTable {
    QString path;
    QChar separator = QLatin1Char(',');
    CsvRow header;
    std::vector<CsvRow> rows;

    // Index of the header cell named `name` (case-insensitive), -1 when absent. UsageError when
    // the header names it twice.
    int column(const QString& name) const;
    // "FILE line N", the prefix of every message about that line.
    QString where(int line) const;
    // UsageError naming the first header cell that is not one of `allowed` (case-insensitive)
    // and listing `allowed`: a misspelt optional column must not be skipped silently.
    void requireKnownColumns(const QStringList& allowed) const;
};

// `text` with every control character written as \xNN, so that a NUL or a CR echoed from a cell
// can neither cut nor garble a one-line message; past 40 characters it is cut with a count.
QString escapedCell(const QString& text);

// `path` as messages quote it: control characters escaped like a cell's, but cut only past 200
// characters, since the file's name is what a person looks for.
QString shownPath(const QString& path);

// The largest file of readings or samples a command reads (4 MiB: some 100,000 lines, far
// beyond a calibration's readings or one period of samples).
inline constexpr qint64 kMaxDataFileBytes = qint64(4) * 1024 * 1024;

// The lines of `path` that hold data: a UTF-8 byte-order mark, blank lines and lines starting
// with '#' are skipped. Lines end with LF or CRLF; any other CR (inside a line, or a file with
// CR-only line ends) is a UsageError naming the line. A file that cannot be read is a UsageError
// naming `option`.
std::vector<CsvLine> readDataLines(const QString& path, const QString& option);

// ';' when the header line holds one (the separator of spreadsheets set to a decimal comma),
// otherwise ','.
QChar separatorOf(const QString& headerLine);

// Splits one line at `separator` outside double quotes ("" inside quotes is one quote) and trims
// each cell. An unclosed quote is a UsageError starting with `where`.
QStringList splitCsvLine(const QString& line, QChar separator, const QString& where);

// The first line is the header; every other line must have exactly as many cells as the header,
// otherwise a UsageError names the line, both counts and the separator in use.
CsvTable tableFromLines(const QString& path, const std::vector<CsvLine>& lines);

} // namespace mw::cli
