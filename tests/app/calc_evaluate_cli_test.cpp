// `meterwright calc evaluate` run as a separate process: hand-checked evaluations of invented
// readings (JSON and text), exit codes, cautions, the budget's parts and options, and bad input
// giving exit code 2 with one line on stderr naming the CSV line, column or option. The CSV
// format itself is tested in readings_csv_cli_test.cpp.
#include "support/approx.h"
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QJsonArray>
#include <QJsonObject>
#include <QStringList>
#include <QTemporaryDir>

#include <algorithm>
#include <initializer_list>

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

TEST_CASE("calc evaluate gives per-point errors, budget, decisions, statement and advice") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString csv = fixture(dir, "readings.csv", kSynthetic);
    const QJsonObject json =
        runEvaluation(evaluate(csv, {"--divisions", "50", "--readability", "0.2", "--reference",
                                     "0.02%rdg+0.01%rng", "--rs", "9900", "--rm", "100"}),
                      kFailed);
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
    // GUM 4.3.7 and Table G.2: U = 2·√(0.02² + 0.003²)/√3 = 0.02335 V, reported to two
    // significant digits (JCGM 100:2008 7.2.6). The engine rounds UP, as 7.2.6 allows, so that
    // rounding never narrows the guard band or flatters the TUR: 0.024 V, not 0.023 V.
    CHECK(top.value(QStringLiteral("expanded_uncertainty")).toDouble() == relative(0.024, 1e-12));
    CHECK(top.value(QStringLiteral("k")).toDouble() == relative(2.0, 1e-9));
    CHECK(top.value(QStringLiteral("dof_effective")).isNull()); // infinite
    // ANSI/NCSL Z540.3 TUR = limit / U with the reported (rounded-up) U: 0.15 / 0.024 = 6.25,
    // shown rounded down to two significant digits.
    CHECK(top.value(QStringLiteral("tur")).toDouble() == relative(6.25, 1e-9));
    CHECK(top.value(QStringLiteral("tur_text")).toString() == QStringLiteral("6.2:1"));
    CHECK(top.value(QStringLiteral("tur_below_4")) == QJsonValue(false));
    // JCGM 106:2012: a rejected point reports its conformance probability, no specific risk.
    CHECK(top.value(QStringLiteral("specific_risk")).isNull());
    CHECK(top.value(QStringLiteral("conformance_probability")).toDouble() < 0.5);
    CHECK(points.at(0).toObject().value(QStringLiteral("specific_risk")).toDouble() < 1e-6);
    CHECK_FALSE(top.contains(QStringLiteral("probability_of_false_accept")));
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
    // ILAC G8:09/2019 4.2.3, w = U = 0.024 V (rounded up, JCGM 100:2008 7.2.6): 0.14 V at 8 V
    // conditional pass, 0.16 V at 10 V conditional fail.
    QTemporaryDir dir;
    const QString csv = fixture(dir, "readings.csv", kSynthetic);
    const QJsonObject json =
        runEvaluation(evaluate(csv, {"--divisions", "50", "--reference", "0.02%rdg+0.01%rng",
                                     "--rule", "guarded", "--guard-factor", "1"}),
                      kFailed);
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
    requireUsageError(evaluate(badNumber, {}), "line 3, column indicated");
    const QString badUnit = fixture(dir, "bad_unit.csv", "applied,indicated\n1mA,1.0\n");
    requireUsageError(evaluate(badUnit, {}), "line 2, column applied");
    const QString badDirection =
        fixture(dir, "bad_direction.csv", "applied,indicated,direction\n1,1,sideways\n");
    requireUsageError(evaluate(badDirection, {}), "column direction");
    const QString badRepeat = fixture(dir, "bad_repeat.csv", "applied,indicated,repeat\n1,1,0\n");
    requireUsageError(evaluate(badRepeat, {}), "column repeat");
    const QString noHeader = fixture(dir, "no_header.csv", "x,y\n1,1\n");
    requireUsageError(evaluate(noHeader, {}), "line 1");
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

TEST_CASE("calc evaluate names the CSV line of a reading off the range's scale") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // 20 V on a 10 V range is the 3rd reading but stands on line 5 (a blank line before it).
    const QString off = fixture(dir, "off.csv", "applied,indicated\n5,5.1\n10,10.1\n\n20,20\n");
    const auto result = requireUsageError(evaluate(off, {}), "off.csv line 5 (reading 3)");
    CHECK(result.err.contains("outside the range's scale"));
}

TEST_CASE("calc evaluate takes only class indices of IEC 60051-2") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString csv = fixture(dir, "readings.csv", kSynthetic);
    // IEC 60051-2 class series 0.05 … 5 (from memory, see the reference notes): 1.7 is none.
    const QStringList base = QStringList{QStringLiteral("evaluate"), QStringLiteral("--readings"),
                                         csv, QStringLiteral("--range"), QStringLiteral("10V")};
    const auto refused = requireUsageError(base + args({"--class", "1.7"}), "--class \"1.7\"");
    CHECK(refused.err.contains("0.05, 0.1, 0.2, 0.3, 0.5, 1, 1.5, 2, 2.5, 3, 5"));
    requireUsageError(base + args({"--class", "0"}), "--class");
    requireUsageError(base + args({"--class", "one"}), "--class");
    // 2.5 is in the series: ±0.25 V on 10 V (IEC 60051-1: class index % of the fiducial value).
    const QJsonObject json = runJson(base + args({"--class", "2.5"}));
    CHECK(json.value(QStringLiteral("permissible_error")).toDouble() == relative(0.25, 1e-12));
    CHECK(json.value(QStringLiteral("statement"))
              .toString()
              .contains(QStringLiteral("class 2.5 (IEC 60051-1:2016 and IEC 60051-2")));
}

TEST_CASE("calc evaluate --fiducial sets the fiducial value and is required for non-linear") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString csv =
        fixture(dir, "suppressed.csv", "applied,indicated\n180,180.5\n220,220.9\n260,261.0\n");
    const QStringList base = QStringList{
        QStringLiteral("evaluate"), QStringLiteral("--readings"), csv,
        QStringLiteral("--range"),  QStringLiteral("180V..260V"), QStringLiteral("--class"),
        QStringLiteral("1.5")};
    // IEC 60051-1 fiducial value of a suppressed-zero 180 … 260 V scale, class 1.5 (from
    // memory, low confidence, see the reference notes): the upper limit by the general rule,
    // ±3.9 V; the span where the relevant part fixes it, ±1.2 V.
    const QJsonObject byRule = runJson(base + args({"--scale", "no-zero"}));
    CHECK(byRule.value(QStringLiteral("fiducial_value")).toDouble() == relative(260.0, 1e-12));
    CHECK(byRule.value(QStringLiteral("permissible_error")).toDouble() == relative(3.9, 1e-12));
    const QJsonObject bySpan = runJson(base + args({"--scale", "no-zero", "--fiducial", "80V"}));
    CHECK(bySpan.value(QStringLiteral("fiducial_value")).toDouble() == relative(80.0, 1e-12));
    CHECK(bySpan.value(QStringLiteral("permissible_error")).toDouble() == relative(1.2, 1e-12));
    const QJsonArray points = bySpan.value(QStringLiteral("points")).toArray();
    REQUIRE(points.size() == 3);
    // 0.9 V at 220 V is 1.125 % of 80 V and within ±1.2 V; 1.0 V at 260 V also.
    CHECK(points.at(1).toObject().value(QStringLiteral("error_percent_of_fiducial")).toDouble() ==
          relative(1.125, 1e-9));
    // A non-linear scale has no limit that defines its fiducial value: it must be given.
    requireUsageError(base + args({"--scale", "non-linear"}), "--fiducial is required");
    const QJsonObject nonLinear =
        runJson(base + args({"--scale", "non-linear", "--fiducial", "100"}));
    CHECK(nonLinear.value(QStringLiteral("permissible_error")).toDouble() == relative(1.5, 1e-12));
    requireUsageError(base + args({"--scale", "non-linear", "--fiducial", "2A"}), "--fiducial");
    requireUsageError(base + args({"--scale", "non-linear", "--fiducial", "-5V"}), "--fiducial");
}

TEST_CASE("calc evaluate --help states how dof_effective and U are reported") {
    const mwtest::CliResult help = mwtest::calc::run(args({"evaluate", "--help"}));
    CHECK(help.exitCode == 0);
    const QString text = help.outText().simplified(); // option help is wrapped in columns
    CHECK(text.contains(QStringLiteral("dof_effective is null when the effective degrees of "
                                       "freedom are infinite")));
    CHECK(text.contains(QStringLiteral("rounded UP to two significant digits")));
    CHECK(text.contains(QStringLiteral("--fiducial")));
    CHECK(text.contains(QStringLiteral("only with --decimal-comma")));
}

TEST_CASE("calc evaluate prints its table in engineering notation") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString csv = fixture(dir, "readings.csv", kSynthetic);
    const mwtest::CliResult table =
        mwtest::calc::run(evaluate(csv, {"--divisions", "50", "--reference", "0.02%rdg+0.01%rng"}));
    INFO(table.outText().toStdString());
    REQUIRE(table.exitCode == kFailed);
    // The 10 V point of the first test case (values sourced there): error 0.16 V, limit
    // 0.15 V, U 0.024 V, TUR 6.25 shown as 6.2:1, written with SI prefixes like every number
    // the app shows; the error to U's last digit (JCGM 100:2008 7.2.6).
    const QStringList lines = table.outText().split(QLatin1Char('\n'));
    const auto top = std::find_if(lines.begin(), lines.end(), [](const QString& line) {
        return line.trimmed().startsWith(QStringLiteral("10.000 V"));
    });
    REQUIRE(top != lines.end());
    CHECK(top->contains(QStringLiteral("+160 mV")));
    CHECK(top->contains(QStringLiteral("150 mV")));
    CHECK(top->contains(QStringLiteral("24 mV")));
    CHECK(top->contains(QStringLiteral("6.2:1")));
    CHECK(top->contains(QStringLiteral("Fail")));
    CHECK_FALSE(top->contains(QStringLiteral("0.16")));
    // The budget of the worst point, with every column (JCGM 100:2008 4.3.7, G.4.1).
    const QString out = table.outText();
    CHECK(out.contains(QStringLiteral("budget at 10.000 V")));
    CHECK(out.contains(QStringLiteral("reference standard")));
    CHECK(out.contains(QStringLiteral("readability of the scale")));
    CHECK(out.contains(QStringLiteral("rectangular")));
    CHECK(out.contains(QStringLiteral("u_c = 11.7 mV")));
    CHECK(out.contains(QStringLiteral("k = 2.00, U = 24 mV")));
    CHECK(out.contains(QStringLiteral("statement: As-found results")));
}

TEST_CASE("calc evaluate says which budget parts it left out and gives no TUR then") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString csv = fixture(dir, "readings.csv", "applied,indicated\n5,5.05\n10,10.08\n");
    // A TUR needs the uncertainty of the calibration process (ANSI/NCSL Z540.3 Handbook);
    // without the reference standard it is not stated.
    const QJsonObject json = runEvaluation(evaluate(csv, {}), kPassed);
    const QJsonArray omitted = json.value(QStringLiteral("omitted_components")).toArray();
    REQUIRE(omitted.size() == 2);
    CHECK(omitted.at(0).toObject().value(QStringLiteral("name")).toString() ==
          QStringLiteral("reference standard"));
    CHECK(omitted.at(1).toObject().value(QStringLiteral("name")).toString() ==
          QStringLiteral("readability of the scale"));
    const QJsonObject point = json.value(QStringLiteral("points")).toArray().at(0).toObject();
    CHECK(point.value(QStringLiteral("tur")).isNull());
    CHECK(point.value(QStringLiteral("tur_below_4")).isNull());
    CHECK(json.value(QStringLiteral("statement"))
              .toString()
              .contains(QStringLiteral("budget is incomplete")));
    const mwtest::CliResult text = mwtest::calc::run(evaluate(csv, {}));
    CHECK(text.exitCode == kPassed);
    CHECK(text.outText().contains(QStringLiteral("left out: reference standard")));
    CHECK(text.outText().contains(
        QStringLiteral("caution: Left out of the uncertainty budget: reference standard")));
}

TEST_CASE("calc evaluate --phase, --reference-range, dof, resolution and temperature") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString csv = fixture(dir, "readings.csv", "applied,indicated\n5,5.05\n10,10.08\n");
    // ISO/IEC 17025:2017 7.8.4.1 d): the statement says which results it covers.
    const QJsonObject asLeft =
        runEvaluation(evaluate(csv, {"--phase", "as-left", "--reference", "U=2mV,k=2",
                                     "--reference-id", "calibrator CAL-7"}),
                      kPassed);
    CHECK(asLeft.value(QStringLiteral("phase")).toString() == QStringLiteral("as-left"));
    CHECK(asLeft.value(QStringLiteral("statement"))
              .toString()
              .startsWith(QStringLiteral("As-left results")));
    CHECK(asLeft.value(QStringLiteral("statement"))
              .toString()
              .contains(QStringLiteral("Reference standard: calibrator CAL-7")));
    // ±(0.01 % rng) on the standard's 100 V range: 10 mV half-width, not 1 mV on the meter's
    // 10 V (rectangular, JCGM 100:2008 4.3.7).
    const QJsonObject onStandard = runEvaluation(
        evaluate(csv, {"--reference", "0%rdg+0.01%rng", "--reference-range", "100"}), kPassed);
    const QJsonObject budgetRow = onStandard.value(QStringLiteral("points"))
                                      .toArray()
                                      .at(1)
                                      .toObject()
                                      .value(QStringLiteral("budget"))
                                      .toArray()
                                      .at(0)
                                      .toObject();
    CHECK(budgetRow.value(QStringLiteral("value")).toDouble() == relative(0.01, 1e-12));
    CHECK(onStandard.value(QStringLiteral("reference_range")).toObject() ==
          QJsonObject{{QStringLiteral("value"), 100.0}, {QStringLiteral("assumed"), false}});
    // The certificate's ν = 8 reaches Welch-Satterthwaite: ν_eff = 8, k = 2.37 (Table G.2).
    const QJsonObject dof =
        runEvaluation(evaluate(csv, {"--reference", "U=20mV,k=2,dof=8"}), kPassed);
    const QJsonObject top = dof.value(QStringLiteral("points")).toArray().at(1).toObject();
    CHECK(top.value(QStringLiteral("dof_effective")).toDouble() == relative(8.0, 1e-9));
    CHECK(top.value(QStringLiteral("k")).toDouble() == absolute(2.37, 0.005));
    // Resolution (half of 10 mV, rectangular) and a temperature effect of 100 ppm/K over 5 K
    // at 10 V: 5 mV half-width (rectangular), as components of their own.
    const QJsonObject more =
        runEvaluation(evaluate(csv, {"--reference", "U=2mV,k=2", "--reference-resolution", "10mV",
                                     "--ambient", "28C", "--tempco", "100ppm/K"}),
                      kPassed);
    const QJsonArray rows = more.value(QStringLiteral("points"))
                                .toArray()
                                .at(1)
                                .toObject()
                                .value(QStringLiteral("budget"))
                                .toArray();
    REQUIRE(rows.size() == 3);
    CHECK(rows.at(1).toObject().value(QStringLiteral("name")).toString() ==
          QStringLiteral("resolution of the reference"));
    CHECK(rows.at(1).toObject().value(QStringLiteral("value")).toDouble() ==
          relative(0.005, 1e-12));
    CHECK(rows.at(2).toObject().value(QStringLiteral("name")).toString() ==
          QStringLiteral("temperature effect"));
    CHECK(rows.at(2).toObject().value(QStringLiteral("value")).toDouble() == relative(0.005, 1e-9));
    requireUsageError(evaluate(csv, {"--tempco", "100ppm/K"}), "--ambient");
    requireUsageError(evaluate(csv, {"--ambient", "28C"}), "--tempco");
    requireUsageError(evaluate(csv, {"--reference-range", "100"}), "--reference");
    requireUsageError(evaluate(csv, {"--phase", "later"}), "--phase");
}

TEST_CASE("calc evaluate exits 1 for fail and conditional fail, 0 otherwise") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // ILAC G8:09/2019 4.2.3 with w = U = 24 mV (as in the guarded test case above):
    // 0.14 V on 0.15 V is a conditional pass (exit 0); 0.16 V a conditional fail (exit 1).
    const QString condPass = fixture(dir, "cp.csv", "applied,indicated\n8,8.14\n10,10.1\n");
    const QString condFail = fixture(dir, "cf.csv", "applied,indicated\n8,8.1\n10,10.16\n");
    const auto guarded = {"--divisions",       "50",     "--reference",
                          "0.02%rdg+0.01%rng", "--rule", "guarded"};
    CHECK(runEvaluation(evaluate(condPass, guarded), kPassed)
              .value(QStringLiteral("overall"))
              .toString() == QStringLiteral("conditional-pass"));
    CHECK(runEvaluation(evaluate(condFail, guarded), kFailed)
              .value(QStringLiteral("overall"))
              .toString() == QStringLiteral("conditional-fail"));
    // 4.2.2: the binary guarded rule fails what 4.2.3 calls a conditional pass.
    CHECK(runEvaluation(evaluate(condPass, {"--divisions", "50", "--reference", "0.02%rdg+0.01%rng",
                                            "--rule", "guarded-binary"}),
                        kFailed)
              .value(QStringLiteral("overall"))
              .toString() == QStringLiteral("fail"));
    const mwtest::CliResult help = mwtest::calc::run(args({"evaluate", "--help"}));
    const QString helpText = help.outText().simplified();
    CHECK(helpText.contains(QStringLiteral("1 when it is fail or conditional fail")));
    CHECK(helpText.contains(QStringLiteral("guarded-binary (4.2.2 binary statement with guard "
                                           "band")));
    requireUsageError(evaluate(condPass, {"--guard-factor", "2"}), "--rule guarded");
}

TEST_CASE("calc evaluate cautions: TUR below 4:1 with simple acceptance, hazardous voltage") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString csv = fixture(dir, "readings.csv", "applied,indicated\n5,5.05\n10,10.08\n");
    // ANSI/NCSL Z540.3 5.3: a TUR of at least 4:1 as fallback; ±50 mV rectangular gives
    // U = 58 mV and 0.15 / 0.058 = 2.6 (shown rounded down, 2.5:1).
    const mwtest::CliResult lowTur = mwtest::calc::run(evaluate(csv, {"--reference", "50mV"}));
    CHECK(lowTur.exitCode == kPassed);
    CHECK(lowTur.outText().contains(QStringLiteral("caution: Simple acceptance with a TUR "
                                                   "below 4:1")));
    CHECK(lowTur.outText().contains(QStringLiteral("2.5:1")));
    // IEC 61010-1 6.3.1: 300 V DC is above the 60 V DC hazardous-live limit.
    const QString high = fixture(dir, "high.csv", "applied,indicated\n100,100.5\n300,301\n");
    const QStringList onHigh =
        QStringList{QStringLiteral("evaluate"), QStringLiteral("--readings"), high} +
        args({"--range", "300V", "--class", "1.5"});
    const QJsonObject json = runEvaluation(onHigh, kPassed);
    CHECK(
        json.value(QStringLiteral("hazard_caution")).toString().contains(QStringLiteral("61010")));
    const mwtest::CliResult text = mwtest::calc::run(onHigh);
    // The largest voltage on the terminals, here the 301 V indicated.
    CHECK(text.outText().contains(QStringLiteral("caution: 301 V DC exceeds the hazardous-live "
                                                 "limits of IEC 61010-1")));
    // 50 V is within the DC limit, but an AC voltmeter at 50 V rms is above 30 V rms.
    const QString fifty = fixture(dir, "fifty.csv", "applied,indicated\n25,25.1\n50,50.2\n");
    const QStringList onFifty =
        QStringList{QStringLiteral("evaluate"), QStringLiteral("--readings"), fifty} +
        args({"--range", "50V", "--class", "1.5"});
    CHECK(runEvaluation(onFifty, kPassed).value(QStringLiteral("hazard_caution")).isNull());
    CHECK(runEvaluation(onFifty + args({"--kind", "bridge"}), kPassed)
              .value(QStringLiteral("hazard_caution"))
              .isString());
}

TEST_CASE("calc evaluate refuses an error in % of a fiducial value too small for a double") {
    // Invented: a fiducial value of 1e-308 V makes the error in % of it overflow (printed inf).
    QTemporaryDir dir;
    const QString csv = fixture(dir, "readings.csv", kSynthetic);
    const QStringList arguments = evaluate(csv, {"--fiducial", "1e-308"});
    const char* const words = "the error in % of the fiducial value cannot be computed";
    requireUsageError(arguments, words);
    requireUsageError(arguments + QStringList{QStringLiteral("--json")}, words);
}
