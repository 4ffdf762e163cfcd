// `meterwright calc coverage|evaluate` run as a separate process: JSON results against GUM
// Table G.2 and hand-checked evaluations of invented readings, and bad input giving exit code 2
// with one line on stderr naming the row, column or option.
#include "support/approx.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QJsonArray>
#include <QJsonDocument>
#include <QJsonObject>
#include <QProcess>
#include <QStringList>
#include <QTemporaryDir>

#include <initializer_list>

using mwtest::absolute;
using mwtest::relative;

namespace {

struct Result {
    int exitCode = -1;
    QByteArray out;
    QByteArray err;
};

Result runCalc(const QStringList& arguments) {
    QProcess process;
    process.start(QStringLiteral(MW_BINARY_DIR "/app/meterwright"),
                  QStringList{QStringLiteral("calc")} + arguments);
    REQUIRE(process.waitForFinished(30000));
    REQUIRE(process.exitStatus() == QProcess::NormalExit);
    return {process.exitCode(), process.readAllStandardOutput(), process.readAllStandardError()};
}

QJsonObject runJson(const QStringList& arguments) {
    const Result result = runCalc(arguments + QStringList{QStringLiteral("--json")});
    INFO(result.err.toStdString());
    REQUIRE(result.exitCode == 0);
    QJsonParseError error{};
    const QJsonDocument document = QJsonDocument::fromJson(result.out, &error);
    REQUIRE(error.error == QJsonParseError::NoError);
    return document.object();
}

void requireUsageError(const QStringList& arguments, const char* words) {
    const Result result = runCalc(arguments);
    INFO("arguments: " << arguments.join(QLatin1Char(' ')).toStdString());
    INFO("stderr: " << result.err.toStdString());
    CHECK(result.exitCode == 2);
    CHECK(result.err.count('\n') == 1);
    CHECK(result.err.contains(words));
    CHECK(result.out.isEmpty());
}

QStringList args(std::initializer_list<const char*> words) {
    QStringList list;
    for (const char* word : words) {
        list << QString::fromUtf8(word);
    }
    return list;
}

// Writes `text` to `name` in `dir` and returns the path.
QString fixture(const QTemporaryDir& dir, const char* name, const char* text) {
    const QString path = dir.filePath(QString::fromUtf8(name));
    QFile file(path);
    REQUIRE(file.open(QIODevice::WriteOnly | QIODevice::Text));
    file.write(text);
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

} // namespace

TEST_CASE("calc coverage reproduces GUM Table G.2") {
    // JCGM 100:2008 Table G.2: t_95.45(16) = 2.17, t_95(2) = 4.30, t_99(16) = 2.92, ∞ -> 2.000.
    CHECK(runJson(args({"coverage", "--dof", "16"})).value(QStringLiteral("k")).toDouble() ==
          absolute(2.17, 0.005));
    CHECK(runJson(args({"coverage", "--dof", "2", "--probability", "95%"}))
              .value(QStringLiteral("k"))
              .toDouble() == absolute(4.30, 0.005));
    CHECK(runJson(args({"coverage", "--dof", "16.7", "--probability", "99%"}))
              .value(QStringLiteral("k"))
              .toDouble() == absolute(2.92, 0.005)); // GUM H.1: ν_eff 16.7 -> 16
    CHECK(runJson(args({"coverage", "--dof", "inf", "--probability", "95.45%"}))
              .value(QStringLiteral("k"))
              .toDouble() == absolute(2.000, 0.0005));
    CHECK(runJson(args({"coverage", "--dof", "100", "--probability", "0.9545"}))
              .value(QStringLiteral("k"))
              .toDouble() == absolute(2.025, 0.0005));
}

TEST_CASE("calc coverage refuses bad options") {
    requireUsageError(args({"coverage"}), "--dof");
    requireUsageError(args({"coverage", "--dof", "0"}), "--dof");
    requireUsageError(args({"coverage", "--dof", "ten"}), "--dof");
    requireUsageError(args({"coverage", "--dof", "5", "--probability", "150%"}), "--probability");
}

TEST_CASE("calc evaluate gives per-point errors, budget, decisions, statement and advice") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString csv = fixture(dir, "readings.csv", kSynthetic);
    const QJsonObject json =
        runJson(evaluate(csv, {"--divisions", "50", "--readability", "0.2", "--reference",
                               "0.02%rdg+0.01%rng", "--rs", "9900", "--rm", "100"}));
    const QJsonArray points = json.value(QStringLiteral("points")).toArray();
    REQUIRE(points.size() == 6);
    const QJsonObject top = points.at(5).toObject();
    for (const char* key :
         {"applied", "indicated", "error", "error_percent_of_fiducial", "permissible_error",
          "u_combined", "dof_effective", "k", "expanded_uncertainty", "tur", "decision"}) {
        INFO(key);
        CHECK(top.contains(QLatin1String(key)));
    }
    CHECK(top.value(QStringLiteral("applied")).toDouble() == 10.0);
    CHECK(top.value(QStringLiteral("error")).toDouble() == absolute(0.16, 1e-9));
    CHECK(top.value(QStringLiteral("indicated")).toDouble() == absolute(10.16, 1e-9));
    CHECK(top.value(QStringLiteral("error_percent_of_fiducial")).toDouble() == absolute(1.6, 1e-9));
    // IEC 60051: class 1.5 of 10 V -> ±0.15 V.
    CHECK(top.value(QStringLiteral("permissible_error")).toDouble() == relative(0.15, 1e-12));
    // GUM 4.3.7 and Table G.2: U = 2·√(0.02² + 0.003²)/√3 = 0.02335 -> 0.023 V (7.2.6).
    CHECK(top.value(QStringLiteral("expanded_uncertainty")).toDouble() == relative(0.023, 1e-12));
    CHECK(top.value(QStringLiteral("k")).toDouble() == relative(2.0, 1e-9));
    CHECK(top.value(QStringLiteral("dof_effective")).isNull()); // infinite
    CHECK(top.value(QStringLiteral("tur")).toDouble() == relative(0.15 / 0.023, 1e-9));
    // ILAC G8:09/2019 4.2.1 simple acceptance: 0.16 V > 0.15 V fails; 0.14 V at 8 V passes.
    CHECK(top.value(QStringLiteral("decision")).toString() == QStringLiteral("fail"));
    CHECK(points.at(4).toObject().value(QStringLiteral("decision")).toString() ==
          QStringLiteral("pass"));
    CHECK(json.value(QStringLiteral("overall")).toString() == QStringLiteral("fail"));
    CHECK(json.value(QStringLiteral("statement"))
              .toString()
              .contains(QStringLiteral("simple acceptance")));
    const QJsonObject advice = json.value(QStringLiteral("advice")).toObject();
    CHECK(advice.value(QStringLiteral("zero_offset")).toDouble() == absolute(0.05, 1e-9));
    CHECK(advice.value(QStringLiteral("span_factor")).toDouble() == relative(1.01, 1e-9));
    CHECK(advice.value(QStringLiteral("nonlinearity")).toDouble() == absolute(0.0, 1e-9));
    CHECK(advice.value(QStringLiteral("hysteresis")).toDouble() == absolute(0.02, 1e-9));
    CHECK(advice.value(QStringLiteral("likely_cause")).toString().contains(QStringLiteral("span")));
    // R'_s = 1.01 × (9900 + 100) − 100 = 10 000 Ω (Helfrick & Cooper §4 formula).
    CHECK(advice.value(QStringLiteral("corrected_multiplier_ohm")).toDouble() ==
          relative(10000.0, 1e-9));
}

TEST_CASE("calc evaluate with guarded acceptance gives conditional outcomes") {
    // ILAC G8:09/2019 4.2.3, w = U = 0.023 V: 0.14 V at 8 V conditional pass, 0.16 V at
    // 10 V conditional fail.
    QTemporaryDir dir;
    const QString csv = fixture(dir, "readings.csv", kSynthetic);
    const QJsonObject json =
        runJson(evaluate(csv, {"--divisions", "50", "--reference", "0.02%rdg+0.01%rng", "--rule",
                               "guarded", "--guard-factor", "1"}));
    const QJsonArray points = json.value(QStringLiteral("points")).toArray();
    REQUIRE(points.size() == 6);
    CHECK(points.at(0).toObject().value(QStringLiteral("decision")).toString() ==
          QStringLiteral("pass"));
    CHECK(points.at(4).toObject().value(QStringLiteral("decision")).toString() ==
          QStringLiteral("conditional-pass"));
    CHECK(points.at(5).toObject().value(QStringLiteral("decision")).toString() ==
          QStringLiteral("conditional-fail"));
    CHECK(json.value(QStringLiteral("overall")).toString() == QStringLiteral("conditional-fail"));
    CHECK(json.value(QStringLiteral("advice"))
              .toObject()
              .value(QStringLiteral("corrected_multiplier_ohm")) ==
          QJsonValue(QJsonValue::Undefined));
}

TEST_CASE("calc evaluate takes repeats and reports Type A with finite dof") {
    // JCGM 100:2008 4.2: 5.02, 5.04, 5.03 V -> s = 0.01 V, ν = 2; no other component, so
    // ν_eff = 2 and k = t_95.45(2) = 4.53 (Table G.2).
    QTemporaryDir dir;
    const QString csv = fixture(dir, "repeats.csv",
                                "Applied, Indicated, Repeat\n5V,5.02V,1\n5V,5.04V,2\n5V,5.03V,3\n");
    const QJsonObject json = runJson(evaluate(csv, {}));
    const QJsonArray points = json.value(QStringLiteral("points")).toArray();
    REQUIRE(points.size() == 1);
    const QJsonObject point = points.at(0).toObject();
    CHECK(point.value(QStringLiteral("dof_effective")).toDouble() == relative(2.0, 1e-9));
    CHECK(point.value(QStringLiteral("k")).toDouble() == absolute(4.53, 0.005));
    CHECK(point.value(QStringLiteral("error")).toDouble() == absolute(0.03, 1e-9));
    CHECK(json.value(QStringLiteral("advice"))
              .toObject()
              .value(QStringLiteral("span_factor"))
              .isNull());
}

TEST_CASE("calc evaluate names the bad row, column or option") {
    QTemporaryDir dir;
    const QString good = fixture(dir, "good.csv", kSynthetic);
    const QString badNumber = fixture(dir, "bad_number.csv", "applied,indicated\n1,1.01\n2,two\n");
    requireUsageError(evaluate(badNumber, {}), "row 3, column indicated");
    const QString badUnit = fixture(dir, "bad_unit.csv", "applied,indicated\n1mA,1.0\n");
    requireUsageError(evaluate(badUnit, {}), "row 2, column applied");
    const QString badDirection =
        fixture(dir, "bad_direction.csv", "applied,indicated,direction\n1,1,sideways\n");
    requireUsageError(evaluate(badDirection, {}), "column direction");
    const QString badRepeat = fixture(dir, "bad_repeat.csv", "applied,indicated,repeat\n1,1,0\n");
    requireUsageError(evaluate(badRepeat, {}), "column repeat");
    const QString noHeader = fixture(dir, "no_header.csv", "x,y\n1,1\n");
    requireUsageError(evaluate(noHeader, {}), "row 1");
    const QString empty = fixture(dir, "empty.csv", "applied,indicated\n");
    requireUsageError(evaluate(empty, {}), "no readings");
    requireUsageError(evaluate(dir.filePath(QStringLiteral("missing.csv")), {}), "--readings");
    requireUsageError(evaluate(good, {"--reference", "0.02%rdg+0.01%rgn"}), "--reference");
    requireUsageError(evaluate(good, {"--rule", "lenient"}), "--rule");
    requireUsageError(evaluate(good, {"--rs", "9900"}), "--rm");
    requireUsageError(evaluate(good, {"--readability", "0.2"}), "--divisions");
    requireUsageError(evaluate(good, {"--divisions", "-3"}), "--divisions");
    requireUsageError(evaluate(good, {"--scale", "sideways"}), "--scale");
    requireUsageError(QStringList{QStringLiteral("evaluate"), QStringLiteral("--readings"), good} +
                          args({"--range", "10V"}),
                      "--class");
    requireUsageError(QStringList{QStringLiteral("evaluate"), QStringLiteral("--readings"), good} +
                          args({"--range", "10 ohm", "--class", "1"}),
                      "--range");
}
