// The text of a PDF page by page, read back with poppler's pdftotext (installed by
// scripts/setup.sh), for tests that check what a printed record says.
#pragma once

#include <catch2/catch.hpp>

#include <QProcess>
#include <QString>
#include <QStringList>

namespace mwtest {

// One string per page (pdftotext ends each page with a form feed): with `layout`, lines as they
// stand across the page (table rows read as rows); without, in reading order (a sentence that
// wraps in a column stays whole).
inline QStringList pdfPages(const QString& path, bool layout = true) {
    QStringList arguments{QStringLiteral("-enc"), QStringLiteral("UTF-8"), path,
                          QStringLiteral("-")};
    if (layout) {
        arguments.prepend(QStringLiteral("-layout"));
    }
    QProcess process;
    process.start(QStringLiteral("pdftotext"), arguments);
    REQUIRE(process.waitForFinished(60'000));
    INFO("pdftotext: " << process.readAllStandardError().toStdString());
    REQUIRE(process.exitCode() == 0);
    QStringList pages = QString::fromUtf8(process.readAllStandardOutput()).split(QChar('\f'));
    if (!pages.isEmpty() && pages.last().trimmed().isEmpty()) {
        pages.removeLast();
    }
    return pages;
}

// The whole text, lines as they stand across the page, with runs of white space folded to one
// space: a label and its value read as one phrase, and so does a paragraph broken over lines.
inline QString pdfText(const QString& path) {
    return pdfPages(path).join(QChar(' ')).simplified();
}

} // namespace mwtest
