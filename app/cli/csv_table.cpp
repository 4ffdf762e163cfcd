// Reading small CSV files for headless commands, with line numbers in every message.
#include "app/cli/csv_table.h"

#include "app/cli/cli_support.h"

#include <QFile>
#include <QFileInfo>

#include <algorithm>

namespace mw::cli {
namespace {

QString separatorName(QChar separator) {
    return separator == QLatin1Char(';') ? QStringLiteral("';'") : QStringLiteral("','");
}

QString cellCount(qsizetype count) {
    return count == 1 ? QStringLiteral("1 cell") : QStringLiteral("%1 cells").arg(count);
}

} // namespace

int CsvTable::column(const QString& name) const {
    int found = -1;
    for (int i = 0; i < header.cells.size(); ++i) {
        if (header.cells[i].compare(name, Qt::CaseInsensitive) != 0) {
            continue;
        }
        if (found >= 0) {
            throw UsageError(
                QStringLiteral("%1: column \"%2\" appears twice").arg(where(header.line), name));
        }
        found = i;
    }
    return found;
}

QString CsvTable::where(int line) const {
    return QStringLiteral("%1 line %2").arg(path).arg(line);
}

void CsvTable::requireKnownColumns(const QStringList& allowed) const {
    for (qsizetype i = 0; i < header.cells.size(); ++i) {
        const QString& name = header.cells[i];
        if (allowed.contains(name, Qt::CaseInsensitive)) {
            continue;
        }
        const QString what = name.isEmpty()
                                 ? QStringLiteral("column %1 has no name").arg(i + 1)
                                 : QStringLiteral("unknown column \"%1\"").arg(escapedCell(name));
        throw UsageError(QStringLiteral("%1: %2; the columns are %3")
                             .arg(where(header.line), what, allowed.join(QStringLiteral(", "))));
    }
}

QString escapedCell(const QString& text) {
    return excerpt(text);
}

std::vector<CsvLine> readDataLines(const QString& path, const QString& option) {
    const QString shown = escapedCell(path);
    // A FIFO would block the command and a device (/dev/zero) never ends: regular files only,
    // asked before opening, since opening a FIFO already blocks.
    const QFileInfo info(path);
    if (info.exists() && !info.isFile()) {
        throw UsageError(QStringLiteral("option --%1 \"%2\": not a regular file (a pipe, device "
                                        "or folder); give a file")
                             .arg(option, shown));
    }
    QFile file(path);
    // Binary: text mode would drop a CR inside a cell ("1\r5" read as 15) without a word.
    if (!file.open(QIODevice::ReadOnly)) {
        throw UsageError(
            QStringLiteral("option --%1 \"%2\": %3").arg(option, shown, file.errorString()));
    }
    // Read at most one byte past the limit, so memory stays bounded even if the file grows.
    const QByteArray bytes = file.read(kMaxDataFileBytes + 1);
    if (bytes.size() > kMaxDataFileBytes) {
        throw UsageError(QStringLiteral("option --%1 \"%2\": the file is larger than %3 MiB, the "
                                        "limit for a file of readings or samples")
                             .arg(option, shown)
                             .arg(kMaxDataFileBytes / (1024 * 1024)));
    }
    const QString content = QString::fromUtf8(bytes);
    if (content.contains(QLatin1Char('\r')) && !content.contains(QLatin1Char('\n'))) {
        throw UsageError(QStringLiteral("%1: lines end with CR only (old Mac line ends); save the "
                                        "file with LF or CRLF line ends")
                             .arg(path));
    }
    QStringList texts = content.split(QLatin1Char('\n'));
    if (!texts.isEmpty() && texts.back().isEmpty()) {
        texts.pop_back(); // the newline after the last line does not start another one
    }
    std::vector<CsvLine> lines;
    for (int number = 1; number <= texts.size(); ++number) {
        QString text = texts[number - 1];
        if (text.endsWith(QLatin1Char('\r'))) {
            text.chop(1); // CRLF line end
        }
        const qsizetype cr = text.indexOf(QLatin1Char('\r'));
        if (cr >= 0) {
            throw UsageError(QStringLiteral("%1 line %2: a carriage return (CR) at character %3 "
                                            "inside the line; lines end with LF or CRLF")
                                 .arg(path)
                                 .arg(number)
                                 .arg(cr + 1));
        }
        if (number == 1 && text.startsWith(QChar(0xFEFF))) {
            text.remove(0, 1); // the byte-order mark spreadsheets write before UTF-8
        }
        const QString trimmed = text.trimmed();
        if (trimmed.isEmpty() || trimmed.startsWith(QLatin1Char('#'))) {
            continue;
        }
        lines.push_back({number, text});
    }
    return lines;
}

QChar separatorOf(const QString& headerLine) {
    return headerLine.contains(QLatin1Char(';')) ? QLatin1Char(';') : QLatin1Char(',');
}

QStringList splitCsvLine(const QString& line, QChar separator, const QString& where) {
    QStringList cells;
    QString cell;
    bool quoted = false;
    for (qsizetype i = 0; i < line.size(); ++i) {
        const QChar c = line[i];
        if (c == QLatin1Char('"')) {
            if (quoted && i + 1 < line.size() && line[i + 1] == QLatin1Char('"')) {
                cell += c; // "" inside quotes stands for one quote
                ++i;
            } else {
                quoted = !quoted;
            }
        } else if (c == separator && !quoted) {
            cells << cell.trimmed();
            cell.clear();
        } else {
            cell += c;
        }
    }
    if (quoted) {
        throw UsageError(where + QStringLiteral(": a quoted cell is not closed"));
    }
    cells << cell.trimmed();
    return cells;
}

CsvTable tableFromLines(const QString& path, const std::vector<CsvLine>& lines) {
    CsvTable table;
    table.path = path;
    if (lines.empty()) {
        throw UsageError(QStringLiteral("%1: the file holds no header line").arg(path));
    }
    table.separator = separatorOf(lines.front().text);
    table.header = {lines.front().number, splitCsvLine(lines.front().text, table.separator,
                                                       table.where(lines.front().number))};
    const qsizetype expected = table.header.cells.size();
    for (std::size_t i = 1; i < lines.size(); ++i) {
        const CsvLine& line = lines[i];
        CsvRow row{line.number, splitCsvLine(line.text, table.separator, table.where(line.number))};
        if (row.cells.size() != expected) {
            // With ',' between cells, "5,1" is two cells: say how a decimal comma fits in.
            const QString hint = table.separator == QLatin1Char(',')
                                     ? QStringLiteral("; a decimal comma needs ';' or quotes")
                                     : QString();
            throw UsageError(QStringLiteral("%1 has %2, but the header (line %3) has %4 "
                                            "(separator %5, taken from the header%6)")
                                 .arg(table.where(line.number), cellCount(row.cells.size()))
                                 .arg(table.header.line)
                                 .arg(expected)
                                 .arg(separatorName(table.separator), hint));
        }
        table.rows.push_back(std::move(row));
    }
    return table;
}

} // namespace mw::cli
