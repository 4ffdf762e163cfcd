// meterwright record and history-report on the invented demo workbook, read back with
// pdftotext: every item ISO/IEC 17025:2017 7.8.2.1, 7.8.4 and 7.8.6 ask of a certificate, the
// numbers the session evaluator gives (as `meterwright sessions` shows them), page numbering,
// the watermark on drafts only, the superseded mark, and the digest `meterwright verify` holds.
#include "core/decision/decision.h"
#include "core/evaluation/statement.h"
#include "core/model/vocabulary.h"
#include "core/record/record_format.h"
#include "support/cli_process.h"
#include "support/pdf_text.h"

#include <catch2/catch.hpp>

#include <QDir>
#include <QFile>
#include <QJsonArray>
#include <QJsonObject>
#include <QRegularExpression>
#include <QTemporaryDir>

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

TEST_CASE("every point printed is the session evaluator's") {
    QTemporaryDir dir;
    const QJsonObject session = firstWith(QStringLiteral("instrument"), QStringLiteral("CFM-501"));
    const QString id = idOf(session);
    const QString layout = mwtest::pdfPages(recordOf(dir, id)).join(QChar('\n'));
    const QJsonObject shown =
        runJson({QStringLiteral("sessions"), demo(), QStringLiteral("--session"), id});
    const QJsonArray ranges = shown.value(QStringLiteral("evaluation"))
                                  .toObject()
                                  .value(QStringLiteral("ranges"))
                                  .toArray();
    REQUIRE(ranges.size() == 5);
    int rows = 0;
    for (const QJsonValue& r : ranges) {
        const QJsonObject range = r.toObject();
        const QJsonObject scale = range.value(QStringLiteral("range")).toObject();
        mw::RangeSpec spec;
        spec.unit = mw::Unit::Volt;
        spec.lower_limit = scale.value(QStringLiteral("lower")).toDouble();
        spec.full_scale = scale.value(QStringLiteral("upper")).toDouble();
        for (const QJsonValue& p : range.value(QStringLiteral("points")).toArray()) {
            const QJsonObject point = p.toObject();
            const double u = point.value(QStringLiteral("expanded_uncertainty")).toDouble();
            const double limit = point.value(QStringLiteral("permissible_error")).toDouble();
            // The demo decides by simple acceptance: no guard band (ILAC G8:09/2019 4.2.1).
            const QStringList cells{
                QString::fromStdString(mw::record::scaleValue(
                    point.value(QStringLiteral("applied")).toDouble(), spec)),
                QString::fromStdString(
                    mw::formatErrorLikeU(point.value(QStringLiteral("error")).toDouble(), u, limit,
                                         0.0, mw::Unit::Volt)),
                QString::fromStdString(mw::formatEngineering(limit, 3, mw::Unit::Volt)),
                QString::fromStdString(mw::formatEngineering(u, 2, mw::Unit::Volt)),
            };
            const auto decision = mw::fromText<mw::Outcome>(
                point.value(QStringLiteral("decision")).toString().toStdString());
            REQUIRE(decision);
            // One printed row holds the cells in this order, then the decision.
            QString pattern;
            for (const QString& cell : cells) {
                pattern += QRegularExpression::escape(cell) + QStringLiteral(".*");
            }
            pattern +=
                QRegularExpression::escape(QString::fromUtf8(mw::displayName(*decision).data()));
            INFO("row: " << pattern.toStdString());
            CHECK(layout.contains(QRegularExpression(pattern)));
            ++rows;
        }
    }
    CHECK(rows >= 25);
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
