// The readings CSV of `calc evaluate`, read through the command: separators, quotes, line
// ends, control characters and unknown columns named by line; bare numbers in the range's
// prefix; repeat numbers given twice.
#include "support/approx.h"
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QStringList>
#include <QTemporaryDir>

#include <initializer_list>

#include <sys/stat.h>

using mwtest::absolute;
using mwtest::args;
using mwtest::relative;
using mwtest::calc::requireUsageError;
using mwtest::calc::runJson;

namespace {

// Writes `text` to `name` in `dir` and returns the path.
QString fixture(const QTemporaryDir& dir, const char* name, const char* text) {
    const QString path = dir.filePath(QString::fromUtf8(name));
    QFile file(path);
    REQUIRE(file.open(QIODevice::WriteOnly | QIODevice::Text));
    file.write(text);
    return path;
}

// Writes `bytes` unchanged (CR and NUL included) to `name` in `dir` and returns the path.
QString rawFixture(const QTemporaryDir& dir, const char* name, const QByteArray& bytes) {
    const QString path = dir.filePath(QString::fromUtf8(name));
    QFile file(path);
    REQUIRE(file.open(QIODevice::WriteOnly));
    REQUIRE(file.write(bytes) == bytes.size());
    return path;
}

// Invented readings of a 0-10 V class 1.5 meter with zero +0.05 V, span 1.01 and hysteresis
// 0.02 V (down 0.01 V above the mean, up 0.01 V below).
const char* const kSynthetic = "applied,indicated,direction\n"
                               "0 V,0.04,up\n2,2.06,up\n4,4.08,up\n6,6.10,up\n8,8.12,up\n"
                               "10,10.14 V,up\n10,10.16,down\n8,8.14,down\n6,6.12,down\n"
                               "4,4.10,down\n2,2.08,down\n0,0.06,down\n";

QStringList evaluate(const QString& csv, std::initializer_list<const char*> more) {
    return QStringList{QStringLiteral("evaluate"), QStringLiteral("--readings"), csv} +
           args({"--range", "10V", "--class", "1.5", "--scale", "zero-at-end"}) + args(more);
}

constexpr int kPassed = 0; // overall pass or conditional pass
constexpr int kFailed = 1; // overall fail or conditional fail

// `calc ARGUMENTS --json` with the exit code the overall outcome must give, as a JSON object.
QJsonObject runEvaluation(const QStringList& arguments, int expectedExit) {
    const mwtest::CliResult result =
        mwtest::calc::run(arguments + QStringList{QStringLiteral("--json")});
    INFO("stderr: " << result.err.toStdString());
    REQUIRE(result.exitCode == expectedExit);
    QJsonParseError error{};
    const QJsonDocument document = QJsonDocument::fromJson(result.out, &error);
    REQUIRE(error.error == QJsonParseError::NoError);
    return document.object();
}

} // namespace

TEST_CASE("calc evaluate refuses a row whose cell count differs from the header") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // RFC 4180 2.4 (from memory): every record has as many fields as the header. A third cell
    // under a two-column header must not be dropped silently.
    const QString extra = fixture(dir, "extra.csv", "applied,indicated\n0,0\n0,0,7\n");
    requireUsageError(evaluate(extra, {}), "line 3 has 3 cells, but the header (line 1) has 2");
    const QString fewer = fixture(dir, "fewer.csv", "applied,indicated,direction\n5,5.1,up\n5\n");
    requireUsageError(evaluate(fewer, {}), "line 3 has 1 cell, but the header (line 1) has 3");
    // Blank and comment lines still count: the message points at the line a text editor shows.
    const QString gaps =
        fixture(dir, "gaps.csv", "# bench log\napplied,indicated\n\n5,5.1\n\n6,6.1,\n");
    requireUsageError(evaluate(gaps, {}), "gaps.csv line 6 has 3 cells, but the header (line 2)");
    const QString quote = fixture(dir, "quote.csv", "applied,indicated\n5,\"5.1\n");
    requireUsageError(evaluate(quote, {}), "line 2: a quoted cell is not closed");
    const QString twice = fixture(dir, "twice.csv", "applied,Applied,indicated\n1,1,1\n");
    requireUsageError(evaluate(twice, {}), "twice.csv line 1: column \"applied\" appears twice");
}

TEST_CASE("calc evaluate takes ';' from the header and a decimal comma with --decimal-comma") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // Common practice: spreadsheets set to a decimal comma write ';' between cells.
    const QString semicolon =
        fixture(dir, "comma.csv", "applied;indicated\n5,0;5,2\n10;10,1\n0;0,05\n");
    const QJsonObject json = runEvaluation(evaluate(semicolon, {"--decimal-comma"}), kFailed);
    const QJsonArray points = json.value(QStringLiteral("points")).toArray();
    REQUIRE(points.size() == 3);
    CHECK(points.at(1).toObject().value(QStringLiteral("applied")).toDouble() == 5.0);
    CHECK(points.at(1).toObject().value(QStringLiteral("error")).toDouble() ==
          absolute(0.2, 1e-12));
    CHECK(points.at(2).toObject().value(QStringLiteral("error")).toDouble() ==
          absolute(0.1, 1e-12));
    // Without --decimal-comma "5,0" is refused, naming the line and the column.
    const auto refused = requireUsageError(evaluate(semicolon, {}), "line 2, column applied");
    CHECK(refused.err.contains("decimal comma is off"));
    // A ',' file can still carry a decimal comma inside quotes (RFC 4180 2.6, from memory).
    const QString quoted = fixture(dir, "quoted.csv", "applied,indicated\n\"5,0\",\"5,2\"\n");
    const QJsonObject fromQuotes = runEvaluation(evaluate(quoted, {"--decimal-comma"}), kFailed);
    CHECK(fromQuotes.value(QStringLiteral("points"))
              .toArray()
              .at(0)
              .toObject()
              .value(QStringLiteral("error"))
              .toDouble() == absolute(0.2, 1e-12));
    // Unquoted, "5,0,5,2" is four cells under a two-column header: refused with a hint.
    const QString unquoted = fixture(dir, "unquoted.csv", "applied,indicated\n5,0,5,2\n");
    const auto split =
        requireUsageError(evaluate(unquoted, {"--decimal-comma"}), "line 2 has 4 cells");
    CHECK(split.err.contains("decimal comma needs ';'"));
}

TEST_CASE("calc evaluate skips a UTF-8 byte-order mark, blank lines and comments") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // Common practice: spreadsheet programs start a UTF-8 CSV with the byte-order mark U+FEFF.
    const QString bom = fixture(dir, "bom.csv",
                                "\xEF\xBB\xBF"
                                "applied,indicated\n\n# first run\n5,5.1\n\n10,10.1\n\n");
    const QJsonObject json = runJson(evaluate(bom, {}));
    CHECK(json.value(QStringLiteral("points")).toArray().size() == 2);
}

TEST_CASE("calc evaluate refuses a header column it does not know") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // A misspelt "direction" must not turn up and down readings into repeats of one point.
    const QString misspelt =
        fixture(dir, "misspelt.csv", "applied,indicated,directon\n5,5.1,up\n5,5.2,down\n");
    const auto refused = requireUsageError(evaluate(misspelt, {}),
                                           "misspelt.csv line 1: unknown column \"directon\"");
    CHECK(refused.err.contains("applied, indicated, direction, repeat"));
    // A trailing separator in the header leaves a column without a name.
    const QString unnamed = fixture(dir, "unnamed.csv", "applied,indicated,\n5,5.1,\n");
    requireUsageError(evaluate(unnamed, {}), "unnamed.csv line 1: column 3 has no name");
}

TEST_CASE("calc evaluate takes CRLF line ends and refuses any other carriage return") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // RFC 4180 2.1 (from memory): CSV lines end with CRLF; common practice: Windows programs
    // write them. The same readings with LF and with CRLF give the same evaluation.
    const QByteArray lf = kSynthetic;
    QByteArray crlf = lf;
    crlf.replace("\n", "\r\n");
    const QJsonObject fromLf = runEvaluation(evaluate(rawFixture(dir, "lf.csv", lf), {}), kFailed);
    const QJsonObject fromCrlf =
        runEvaluation(evaluate(rawFixture(dir, "crlf.csv", crlf), {}), kFailed);
    CHECK(fromCrlf.value(QStringLiteral("points")).toArray().size() == 6);
    CHECK(fromCrlf == fromLf);
    // A CR inside a cell would otherwise vanish and "1\r5" be read as 15.
    const QString stray = rawFixture(dir, "stray.csv", "applied,indicated\r\n5,1\r5\r\n");
    requireUsageError(evaluate(stray, {}),
                      "stray.csv line 2: a carriage return (CR) at character 4");
    // Common practice (from memory): classic Mac OS ended lines with CR alone.
    const QString mac = rawFixture(dir, "mac.csv", "applied,indicated\r5,5.1\r10,10.1\r");
    const auto crOnly = requireUsageError(evaluate(mac, {}), "mac.csv: lines end with CR only");
    CHECK_FALSE(crOnly.err.contains("header"));
}

TEST_CASE("calc evaluate echoes control characters of a bad cell escaped") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // A NUL would end the message early on a C-string path; it comes back as \x00 with the rest.
    static const char kWithNul[] = "applied,indicated\n5,5\0001\n";
    const QByteArray withNul(kWithNul, sizeof kWithNul - 1);
    const QString nul = rawFixture(dir, "nul.csv", withNul);
    const auto refused = requireUsageError(
        evaluate(nul, {}), "nul.csv line 2, column indicated \"5\\x001\": a control character");
    CHECK_FALSE(refused.err.contains('\0'));
    const QString tab = fixture(dir, "tab.csv", "applied,indicated,direction\n5,5.1,u\tp\n");
    requireUsageError(evaluate(tab, {}), "column direction \"u\\x09p\"");
}

TEST_CASE("calc evaluate reads a bare number in the range's unit as its scale shows it") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // A centre-zero 50 µA meter (IEC 60051-1: fiducial value the span, 100 µA): "-50" on its
    // scale is -50 µA, not -50 A; "0.02mA" carries its unit and is converted.
    const QString csv =
        fixture(dir, "micro.csv", "applied,indicated\n-50,-49.6\n0,0.2\n0.02mA,20.4\n50,50.5\n");
    const QJsonObject json = runEvaluation(
        QStringList{QStringLiteral("evaluate"), QStringLiteral("--readings"), csv} +
            args({"--range", "-50uA..50uA", "--scale", "zero-inside", "--class", "0.5"}),
        kPassed);
    const QJsonArray points = json.value(QStringLiteral("points")).toArray();
    REQUIRE(points.size() == 4);
    CHECK(points.at(0).toObject().value(QStringLiteral("applied")).toDouble() ==
          relative(-50e-6, 1e-12));
    CHECK(points.at(2).toObject().value(QStringLiteral("applied")).toDouble() ==
          relative(20e-6, 1e-12));
    CHECK(points.at(3).toObject().value(QStringLiteral("error")).toDouble() ==
          relative(0.5e-6, 1e-9));
    // Class 0.5 of 100 µA: ±0.5 µA; +0.5 µA at 50 µA is on the limit and passes
    // (IEC 60051-1: an error equal to the limit does not exceed it).
    CHECK(json.value(QStringLiteral("permissible_error")).toDouble() == relative(0.5e-6, 1e-12));
    CHECK(points.at(3).toObject().value(QStringLiteral("decision")).toString() ==
          QStringLiteral("pass"));
    // A bare lower limit of --range takes the upper limit's prefix too.
    const QJsonObject bareLower = runEvaluation(
        QStringList{QStringLiteral("evaluate"), QStringLiteral("--readings"), csv} +
            args({"--range", "-50..50uA", "--scale", "zero-inside", "--class", "0.5"}),
        kPassed);
    CHECK(bareLower.value(QStringLiteral("range")).toObject().value(QStringLiteral("lower")) ==
          QJsonValue(-50e-6));
    // The text table shows the applied zero in the same prefix as the other rows.
    const mwtest::CliResult text = mwtest::calc::run(
        QStringList{QStringLiteral("evaluate"), QStringLiteral("--readings"), csv} +
        args({"--range", "-50uA..50uA", "--scale", "zero-inside", "--class", "0.5"}));
    CHECK(text.outText().contains(QStringLiteral("0.000 \u00B5A")));
    CHECK(text.outText().contains(QStringLiteral("-50.000 \u00B5A")));
    const mwtest::CliResult help = mwtest::calc::run(args({"evaluate", "--help"}));
    CHECK(help.outText().simplified().contains(
        QStringLiteral("A number without a unit is in the range's unit")));
}

TEST_CASE("calc evaluate refuses a repeat number given twice, naming both lines") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString csv =
        fixture(dir, "twice.csv", "applied,indicated,repeat\n5,5.02,1\n5,5.03,2\n\n5,5.01,1\n");
    requireUsageError(evaluate(csv, {}),
                      "twice.csv line 5 (reading 3) repeats number 1 of reading 1 at the same "
                      "point (5.000 V, up); reading 1 is on line 2");
}

TEST_CASE("calc evaluate reads regular files of bounded size only") {
    QTemporaryDir dir;
    // A device never ends and a pipe blocks: both are refused before reading.
    requireUsageError(evaluate(QStringLiteral("/dev/zero"), {}), "not a regular file");
    const QString fifo = dir.filePath(QStringLiteral("readings.fifo"));
    REQUIRE(::mkfifo(QFile::encodeName(fifo).constData(), 0600) == 0);
    requireUsageError(evaluate(fifo, {}), "not a regular file");
    // Past the documented limit (4 MiB), refused without reading it all.
    const QString big = rawFixture(dir, "big.csv", QByteArray(4 * 1024 * 1024 + 1, '1'));
    requireUsageError(evaluate(big, {}), "larger than 4 MiB");
}

TEST_CASE("calc evaluate quotes a short escaped excerpt of a long or odd cell") {
    QTemporaryDir dir;
    const QByteArray cell = QByteArray("1x") + QByteArray(100'000, 'y');
    const QString csv = rawFixture(dir, "long.csv", "applied,indicated\n1," + cell + "\n");
    const mwtest::CliResult result = mwtest::calc::run(evaluate(csv, {}));
    CHECK(result.exitCode == 2);
    CHECK(result.err.count('\n') == 1);
    CHECK(result.err.size() < 600);
    const mwtest::CliResult newline = requireUsageError(
        args({"shunt", "--ifs", "1\nmA", "--rm", "100", "--range", "1A"}), "\\x0a");
    CHECK(newline.err.count('\n') == 1);
}
