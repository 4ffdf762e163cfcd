// Reading small CSV files for headless commands, with line numbers in every message.
#include "app/cli/csv_table.h"

#include "app/cli/cli_support.h"

#include <QFile>

#include <algorithm>
#include <cerrno>
#include <cstring>
#include <fcntl.h>
#include <optional>
#include <sys/stat.h>
#include <unistd.h>

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
    return QStringLiteral("%1 line %2").arg(shownPath(path), QString::number(line));
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

QString shownPath(const QString& path) {
    constexpr qsizetype kLongestPath = 200;
    return excerpt(path, kLongestPath);
}

namespace {

QString tooLarge(const QString& option, const QString& shown) {
    return QStringLiteral("option --%1 \"%2\": the file is larger than %3 MiB, the limit for a "
                          "file of readings or samples")
        .arg(option, shown, QString::number(kMaxDataFileBytes / (1024 * 1024)));
}

// Opens `path` for reading if it is a regular file of at most kMaxDataFileBytes. A FIFO would
// block the command and a device (/dev/zero) never ends: the descriptor is opened without
// blocking and its own type asked, so that nothing swapped in between a check of the name and
// the opening is read. A file too large is refused before any of it is read.
void openRegularFile(QFile& file, const QString& path, const QString& option,
                     const QString& shown) {
    const int fd = ::open(QFile::encodeName(path).constData(), O_RDONLY | O_NONBLOCK | O_CLOEXEC);
    if (fd < 0) {
        throw UsageError(QStringLiteral("option --%1 \"%2\": %3")
                             .arg(option, shown, QString::fromLocal8Bit(std::strerror(errno))));
    }
    struct stat status {};
    if (::fstat(fd, &status) != 0 || !S_ISREG(status.st_mode)) {
        ::close(fd);
        throw UsageError(QStringLiteral("option --%1 \"%2\": not a regular file (a pipe, device "
                                        "or folder); give a file")
                             .arg(option, shown));
    }
    if (status.st_size > kMaxDataFileBytes) {
        ::close(fd);
        throw UsageError(tooLarge(option, shown));
    }
    ::fcntl(fd, F_SETFL, ::fcntl(fd, F_GETFL) & ~O_NONBLOCK);
    // Binary: text mode would drop a CR inside a cell ("1\r5" read as 15) without a word.
    if (!file.open(fd, QIODevice::ReadOnly, QFileDevice::AutoCloseHandle)) {
        ::close(fd);
        throw UsageError(
            QStringLiteral("option --%1 \"%2\": %3").arg(option, shown, file.errorString()));
    }
}

// One line as read (its LF included, if it has one) turned into a data line, or nothing for a
// blank line or a comment; UsageError for a CR that ends no line.
std::optional<CsvLine> dataLine(const QByteArray& raw, int number, const QString& shown) {
    QString text = QString::fromUtf8(raw);
    if (text.endsWith(QLatin1Char('\n'))) {
        text.chop(1);
    } else if (number == 1 && text.contains(QLatin1Char('\r'))) {
        // A whole file without LF: its CRs are line ends of their own.
        throw UsageError(QStringLiteral("%1: lines end with CR only (old Mac line ends); save the "
                                        "file with LF or CRLF line ends")
                             .arg(shown));
    }
    if (text.endsWith(QLatin1Char('\r'))) {
        text.chop(1); // CRLF line end
    }
    const qsizetype cr = text.indexOf(QLatin1Char('\r'));
    if (cr >= 0) {
        throw UsageError(QStringLiteral("%1 line %2: a carriage return (CR) at character %3 "
                                        "inside the line; lines end with LF or CRLF")
                             .arg(shown, QString::number(number), QString::number(cr + 1)));
    }
    if (number == 1 && text.startsWith(QChar(0xFEFF))) {
        text.remove(0, 1); // the byte-order mark spreadsheets write before UTF-8
    }
    const QString trimmed = text.trimmed();
    if (trimmed.isEmpty() || trimmed.startsWith(QLatin1Char('#'))) {
        return std::nullopt;
    }
    return CsvLine{number, text};
}

} // namespace

std::vector<CsvLine> readDataLines(const QString& path, const QString& option) {
    const QString shown = shownPath(path);
    QFile file;
    openRegularFile(file, path, option, shown);
    // In blocks, each line taken as soon as its LF arrives, never more than the limit and one
    // block past it in all: memory stays bounded even if the file grows while it is read.
    constexpr qint64 kBlockBytes = 64 * 1024;
    std::vector<CsvLine> lines;
    QByteArray pending; // the start of a line whose LF has not come yet
    qint64 bytesRead = 0;
    int number = 0;
    const auto take = [&](const QByteArray& raw) {
        if (std::optional<CsvLine> line = dataLine(raw, ++number, shown)) {
            lines.push_back(std::move(*line));
        }
    };
    for (;;) {
        const QByteArray block = file.read(kBlockBytes);
        if (block.isEmpty()) {
            break;
        }
        bytesRead += block.size();
        if (bytesRead > kMaxDataFileBytes) {
            throw UsageError(tooLarge(option, shown)); // it grew while it was read
        }
        pending += block;
        qsizetype start = 0;
        for (qsizetype end = pending.indexOf('\n'); end >= 0; end = pending.indexOf('\n', start)) {
            take(pending.mid(start, end + 1 - start));
            start = end + 1;
        }
        pending.remove(0, start);
    }
    if (!pending.isEmpty()) {
        take(pending); // the last line, without LF; a LF after the last line starts no other
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
        throw UsageError(QStringLiteral("%1: the file holds no header line").arg(shownPath(path)));
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
