// meterwright record and history-report on the invented demo workbook, read back with
// pdftotext: every item ISO/IEC 17025:2017 7.8.2.1, 7.8.4 and 7.8.6 ask of a certificate, the
// numbers the session evaluator gives (as `meterwright sessions` shows them), page numbering,
// the watermark on drafts only, the superseded mark, and the digest `meterwright verify` holds.
#include "core/model/vocabulary.h"
#include "core/units/quantity.h"
#include "support/cli_process.h"
#include "support/pdf_text.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QFile>
#include <QJsonArray>
#include <QJsonObject>
#include <QRegularExpression>
#include <QTemporaryDir>

#include <cmath>
#include <vector>

using mwtest::runJson;
using mwtest::runMeterwright;

namespace {

// One demo workbook for the whole file: writing it takes a while.
const QString& demo() {
    static QTemporaryDir dir;
    static const QString path = [] {
        const QString file = dir.filePath(QStringLiteral("demo.mwb"));
        REQUIRE(runMeterwright({QStringLiteral("demo"), file, QStringLiteral("--as-of"),
                                QStringLiteral("2026-03-16")})
                    .exitCode == 0);
        return file;
    }();
    return path;
}

QJsonArray sessions(const QStringList& filter = {}) {
    return runJson(QStringList{QStringLiteral("sessions"), demo()} + filter)
        .value(QStringLiteral("sessions"))
        .toArray();
}

QJsonObject firstWith(const QString& key, const QString& value, const QString& instrument = {}) {
    for (const QJsonValue& row : sessions()) {
        const QJsonObject s = row.toObject();
        if (s.value(key).toString() == value &&
            (instrument.isEmpty() ||
             s.value(QStringLiteral("instrument")).toString() == instrument)) {
            return s;
        }
    }
    FAIL("no session with " << key.toStdString() << " = " << value.toStdString());
    return {};
}

QString idOf(const QJsonObject& session) {
    return QString::number(session.value(QStringLiteral("id")).toInteger());
}

// Writes the record of `sessionId` into `dir` and returns its path.
QString recordOf(const QTemporaryDir& dir, const QString& sessionId) {
    const QString out = dir.filePath(QStringLiteral("record-%1.pdf").arg(sessionId));
    const mwtest::CliResult result =
        runMeterwright({QStringLiteral("record"), demo(), QStringLiteral("--session"), sessionId,
                        QStringLiteral("--out"), out});
    INFO("stderr: " << result.errText().toStdString());
    REQUIRE(result.exitCode == 0);
    return out;
}

// Every page carries the record's identity and "Page x of y".
void checkEveryPage(const QStringList& pages, const QString& identifier) {
    REQUIRE(!pages.isEmpty());
    for (int i = 0; i < pages.size(); ++i) {
        INFO("page " << i + 1);
        CHECK(pages[i].contains(identifier));
        CHECK(pages[i].contains(QStringLiteral("Page %1 of %2").arg(i + 1).arg(pages.size())));
    }
}

// The latest approved session of the workbook: its digest is the head of the chain.
QJsonObject latestApproved() {
    QJsonObject latest;
    for (const QJsonValue& row :
         sessions({QStringLiteral("--state"), QStringLiteral("approved")})) {
        const QJsonObject s = row.toObject();
        if (s.value(QStringLiteral("approved_at")).toString() >
            latest.value(QStringLiteral("approved_at")).toString()) {
            latest = s;
        }
    }
    return latest;
}

// The evaluator's ranges and phases of a session, as meterwright sessions shows them.
QJsonArray evaluationOf(const QString& sessionId) {
    return runJson({QStringLiteral("sessions"), demo(), QStringLiteral("--session"), sessionId})
        .value(QStringLiteral("evaluation"))
        .toObject()
        .value(QStringLiteral("ranges"))
        .toArray();
}

// A printed value and half a unit of its last printed digit.
struct Printed {
    double value = 0.0;
    double halfDigit = 0.0;
};

Printed printedValue(const QString& cell, mw::Unit unit) {
    QString text = cell;
    text.remove(QChar('+'));
    const QString mantissa = text.section(QChar(' '), 0, 0);
    const QString symbol = text.section(QChar(' '), 1);
    const qsizetype point = mantissa.indexOf(QChar('.'));
    const int decimals = point < 0 ? 0 : static_cast<int>(mantissa.size() - point - 1);
    const double scale =
        symbol.isEmpty() ? 1.0 : mw::parseValue(("1 " + symbol).toStdString(), unit);
    return {mw::parseValue(text.toStdString(), unit), 0.5 * std::pow(10.0, -decimals) * scale};
}

// The rows of the results tables, in the order printed: point, applied, indicated, error,
// % FV, limit, U, k, decision.
struct PrintedRow {
    QStringList cells;
};

std::vector<PrintedRow> printedRows(const QString& path) {
    static const QRegularExpression row(QStringLiteral(
        "^\\s*(\\d+)\\s+(-?[\\d.]+ \\S+)\\s+(-?[\\d.]+ \\S+)\\s+([+-]?[\\d.]+ \\S+)\\s+"
        "([+-]?[\\d.]+ %)\\s+([\\d.]+ \\S+)\\s+([\\d.]+ \\S+)\\s+(\\d+\\.\\d\\d)\\s+"
        "(Pass|Fail|Conditional pass|Conditional fail)\\s*$"));
    std::vector<PrintedRow> rows;
    for (const QString& page : mwtest::pdfPages(path)) {
        for (const QString& line : page.split(QChar('\n'))) {
            const QRegularExpressionMatch match = row.match(line);
            if (match.hasMatch()) {
                rows.push_back({match.capturedTexts().mid(1)});
            }
        }
    }
    return rows;
}

} // namespace

TEST_CASE("an approved record shows every required item, on numbered pages") {
    QTemporaryDir dir;
    // A five-range voltmeter up to 300 V: many points, several pages, hazardous live.
    const QJsonObject session = firstWith(QStringLiteral("instrument"), QStringLiteral("CFM-501"));
    const QString id = idOf(session);
    const QString path = recordOf(dir, id);
    const QString identifier = QStringLiteral("CFM-501-%1").arg(id.toInt(), 5, 10, QChar('0'));
    const QStringList pages = mwtest::pdfPages(path);
    REQUIRE(pages.size() >= 3);
    checkEveryPage(pages, identifier);
    const QString text = mwtest::pdfText(path);
    for (const char* item : {
             "Calibration record",                                  // 7.8.2.1 a
             "Copperfen Instrument Works",                          // b
             "Place of calibration",                                // c
             "Customer (owner)",                                    // e
             "Method Comparison with the multifunction calibrator", // f
             "Serial number",                                       // g
             "Asset tag CFM-501",                                   //
             "Accuracy class class 1 (IEC 60051-2)",                //
             "Date of calibration",                                 // i
             "Date of issue",                                       // j
             "relate only to the item calibrated",                  // l
             "Approved by Rowan Ettrick (Reviewer)",                // o
             "Calibrated by Tess Marlowe-Quine (Technician)",       //
             "Environment ambient",                                 // 7.8.4.1 b
             "Reference standards and traceability",                // c
             "EXT-CAL-0412",                                        // certificate number
             "coverage probability of about 95.45 %",               // a: U with k
             "Statement of conformity",                             // 7.8.6
             "binary statement for simple acceptance (ILAC G8:09/2019 4.2.1): each measured error "
             "is compared with the limit as it stands",
             "hazardous-live limits of IEC 61010-1", // the session reached 300 V DC
             "local electrical codes",
             "meterwright verify WORKBOOK",
             "End of record",
         }) {
        INFO(item);
        CHECK(text.contains(QString::fromUtf8(item)));
    }
    CHECK_FALSE(text.contains(QStringLiteral("NOT A CALIBRATION RECORD")));
    CHECK_FALSE(text.contains(QStringLiteral("SUPERSEDED")));
}

TEST_CASE("every point printed is the session evaluator's, to the digits printed") {
    QTemporaryDir dir;
    // A five-range voltmeter, and an ammeter found near its limit and adjusted (both phases).
    std::vector<QString> ids{
        idOf(firstWith(QStringLiteral("instrument"), QStringLiteral("CFM-501")))};
    for (const QJsonValue& row :
         sessions({QStringLiteral("--instrument"), QStringLiteral("CFM-201"),
                   QStringLiteral("--state"), QStringLiteral("approved")})) {
        if (evaluationOf(idOf(row.toObject())).size() == 2) {
            ids.push_back(idOf(row.toObject()));
            break;
        }
    }
    REQUIRE(ids.size() == 2);
    for (const QString& id : ids) {
        const std::vector<PrintedRow> printed = printedRows(recordOf(dir, id));
        std::size_t next = 0;
        for (const QJsonValue& r : evaluationOf(id)) {
            const QJsonObject range = r.toObject();
            const mw::Unit unit = range.value(QStringLiteral("range"))
                                              .toObject()
                                              .value(QStringLiteral("unit"))
                                              .toString() == QStringLiteral("A")
                                      ? mw::Unit::Ampere
                                      : mw::Unit::Volt;
            for (const QJsonValue& p : range.value(QStringLiteral("points")).toArray()) {
                const QJsonObject point = p.toObject();
                INFO("session " << id.toStdString() << ", printed row " << next + 1);
                REQUIRE(next < printed.size());
                const PrintedRow& row = printed[next++];
                const auto near = [&](const QString& cell, mw::Unit u, const char* key) {
                    const Printed value = printedValue(cell, u);
                    INFO(key << ": printed " << cell.toStdString() << ", engine "
                             << point.value(QString::fromUtf8(key)).toDouble());
                    CHECK(std::fabs(value.value - point.value(QString::fromUtf8(key)).toDouble()) <=
                          value.halfDigit * (1.0 + 1e-9));
                };
                near(row.cells[1], unit, "applied");
                near(row.cells[2], unit, "indicated");
                near(row.cells[3], unit, "error");
                near(row.cells[4], mw::Unit::Percent, "error_percent_of_fiducial");
                near(row.cells[5], unit, "permissible_error");
                near(row.cells[6], unit, "expanded_uncertainty");
                near(row.cells[7], mw::Unit::Dimensionless, "k");
                const auto decision = mw::fromText<mw::Outcome>(
                    point.value(QStringLiteral("decision")).toString().toStdString());
                REQUIRE(decision);
                CHECK(row.cells[8] == QString::fromUtf8(mw::displayName(*decision).data()));
            }
        }
        CHECK(next == printed.size()); // no row printed that the evaluator did not give
        CHECK(next >= 12);
    }
}

TEST_CASE("a session not approved prints as a draft, watermarked on every page") {
    QTemporaryDir dir;
    for (const char* state : {"draft", "submitted", "returned"}) {
        const QJsonObject session = firstWith(QStringLiteral("state"), QString::fromUtf8(state));
        const QStringList pages = mwtest::pdfPages(recordOf(dir, idOf(session)));
        for (int i = 0; i < pages.size(); ++i) {
            INFO(state << ", page " << i + 1);
            CHECK(pages[i].contains(QStringLiteral("NOT A CALIBRATION RECORD")));
        }
        CHECK(pages.join(QString()).contains(QStringLiteral("This is not a calibration record")));
    }
}

TEST_CASE("a superseded record is marked on every page and points to its amendment") {
    QTemporaryDir dir;
    const QJsonObject old = firstWith(QStringLiteral("state"), QStringLiteral("superseded"));
    QJsonObject amendment;
    for (const QJsonValue& row : sessions()) {
        if (row.toObject().value(QStringLiteral("supersedes")).toInteger() ==
            old.value(QStringLiteral("id")).toInteger()) {
            amendment = row.toObject();
        }
    }
    REQUIRE_FALSE(amendment.isEmpty());
    const QString successor =
        QStringLiteral("CFM-201-%1")
            .arg(amendment.value(QStringLiteral("id")).toInt(), 5, 10, QChar('0'));
    const QStringList pages = mwtest::pdfPages(recordOf(dir, idOf(old)), false);
    for (int i = 0; i < pages.size(); ++i) {
        INFO("page " << i + 1);
        const QString page = pages[i].simplified();
        CHECK(page.contains(QStringLiteral("SUPERSEDED. Replaced by record ") + successor));
    }
    // The amendment says what it supersedes and why.
    const QString text = mwtest::pdfText(recordOf(dir, idOf(amendment)));
    CHECK(text.contains(QStringLiteral("supersedes record CFM-201-%1")
                            .arg(old.value(QStringLiteral("id")).toInt(), 5, 10, QChar('0'))));
    CHECK(text.contains(QStringLiteral("Reason: As-found applied value")));
    CHECK_FALSE(text.contains(QStringLiteral("SUPERSEDED")));
}

TEST_CASE("the digest on the page is the one verify recomputes") {
    QTemporaryDir dir;
    const QJsonObject head =
        runJson({QStringLiteral("verify"), demo()}).value(QStringLiteral("chain_head")).toObject();
    const QString digest = head.value(QStringLiteral("digest")).toString();
    REQUIRE(digest.size() == 64);
    const QString text = mwtest::pdfText(recordOf(dir, idOf(latestApproved())));
    CHECK(text.contains(QStringLiteral("Digest (SHA-256) ") + digest));
    // The chain as it stood at printing: the same head, shortened as verify prints it.
    CHECK(text.contains(QStringLiteral("Record chain at printing %1 approved records, head %2")
                            .arg(head.value(QStringLiteral("records")).toInt())
                            .arg(digest.left(16))));
}

TEST_CASE("record by instrument, several at once, and refusals that write nothing") {
    QTemporaryDir dir;
    const QString out = dir.filePath(QStringLiteral("latest.pdf"));
    mwtest::CliResult result = mwtest::runMeterwrightIn(
        mwtest::environmentWithoutDisplay(),
        {QStringLiteral("record"), demo(), QStringLiteral("--instrument"),
         QStringLiteral("CFM-201"), QStringLiteral("--latest"), QStringLiteral("--out"), out});
    INFO("stderr: " << result.errText().toStdString());
    REQUIRE(result.exitCode == 0);
    CHECK(result.err.isEmpty());
    const QString latest = idOf(sessions({QStringLiteral("--instrument"), QStringLiteral("CFM-201"),
                                          QStringLiteral("--state"), QStringLiteral("approved")})
                                    .last()
                                    .toObject());
    CHECK(mwtest::pdfText(out).contains(
        QStringLiteral("CFM-201-%1").arg(latest.toInt(), 5, 10, QChar('0'))));

    // Not again without --force; the file stays as it was.
    const QByteArray before = [&] {
        QFile file(out);
        REQUIRE(file.open(QIODevice::ReadOnly));
        return file.readAll();
    }();
    mwtest::requireUsageError({QStringLiteral("record"), demo(), QStringLiteral("--session"),
                               latest, QStringLiteral("--out"), out},
                              "already exists");
    QFile again(out);
    REQUIRE(again.open(QIODevice::ReadOnly));
    CHECK(again.readAll() == before);
    CHECK(runMeterwright({QStringLiteral("record"), demo(), QStringLiteral("--session"), latest,
                          QStringLiteral("--out"), out, QStringLiteral("--force")})
              .exitCode == 0);

    // Several sessions: one file each, named by the record, with a progress line each.
    const QString folder = dir.filePath(QStringLiteral("batch"));
    result = runMeterwright({QStringLiteral("record"), demo(), QStringLiteral("--session"),
                             QStringLiteral("1"), QStringLiteral("--session"), QStringLiteral("2"),
                             QStringLiteral("--session"), QStringLiteral("3"),
                             QStringLiteral("--out"), folder});
    REQUIRE(result.exitCode == 0);
    CHECK(result.outText().count(QRegularExpression(QStringLiteral("^record \\d of 3: session"),
                                                    QRegularExpression::MultilineOption)) == 3);
    CHECK(QDir(folder).entryList(QDir::Files).size() == 3);

    // Unknown ids and tags: exit 2 naming them, and no file at all.
    const QString nothing = dir.filePath(QStringLiteral("nothing"));
    mwtest::requireUsageError({QStringLiteral("record"), demo(), QStringLiteral("--session"),
                               QStringLiteral("1"), QStringLiteral("--session"),
                               QStringLiteral("9999"), QStringLiteral("--session"),
                               QStringLiteral("x7"), QStringLiteral("--out"), nothing},
                              "no calibration session with id 9999, x7");
    CHECK_FALSE(QFileInfo::exists(nothing));
    mwtest::requireUsageError({QStringLiteral("record"), demo(), QStringLiteral("--instrument"),
                               QStringLiteral("CFM-999"), QStringLiteral("--latest"),
                               QStringLiteral("--out"), nothing},
                              "no instrument with asset tag \"CFM-999\"");
    mwtest::requireUsageError({QStringLiteral("history-report"), demo(),
                               QStringLiteral("--instrument"), QStringLiteral("CFM-999"),
                               QStringLiteral("--out"), nothing},
                              "no instrument with asset tag \"CFM-999\"");
    mwtest::requireUsageError({QStringLiteral("record"), demo(), QStringLiteral("--instrument"),
                               QStringLiteral("CFM-201"), QStringLiteral("--out"), nothing},
                              "--instrument needs --latest");
    CHECK_FALSE(QFileInfo::exists(nothing));
}

TEST_CASE("the history report lists the calibrations, the interval and the drift") {
    QTemporaryDir dir;
    const QString out = dir.filePath(QStringLiteral("history.pdf"));
    const mwtest::CliResult result = mwtest::runMeterwrightIn(
        mwtest::environmentWithoutDisplay(),
        {QStringLiteral("history-report"), demo(), QStringLiteral("--instrument"),
         QStringLiteral("CFM-201"), QStringLiteral("--out"), out});
    INFO("stderr: " << result.errText().toStdString());
    REQUIRE(result.exitCode == 0);
    const QStringList pages = mwtest::pdfPages(out);
    checkEveryPage(pages, QStringLiteral("History of CFM-201"));
    const QString text = mwtest::pdfText(out);
    const int calibrations = static_cast<int>(
        sessions({QStringLiteral("--instrument"), QStringLiteral("CFM-201")}).size());
    CHECK(text.count(QRegularExpression(QStringLiteral("CFM-201-\\d{5}"))) >= calibrations);
    for (const char* item :
         {"Calibrations", "Worst as found", "Recalibration interval",
          "Registered interval 365 days", "Recommended interval",
          "G24:2007 / OIML D 10:2007 method 1", "Drift per test point", "1 A range at"}) {
        INFO(item);
        CHECK(text.contains(QString::fromUtf8(item)));
    }
}
