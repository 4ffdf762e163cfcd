// `meterwright calc multiplier|indication|waveform` run as a separate process: JSON keys and
// values against textbook examples and form factors, and bad input giving exit code 2.
#include "support/approx.h"
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QJsonObject>
#include <QStringList>
#include <QTemporaryDir>

#include <cmath>
#include <numbers>

using mwtest::absolute;
using mwtest::args;
using mwtest::relative;
using mwtest::calc::requireUsageError;
using mwtest::calc::runJson;

namespace {

double number(const QJsonObject& json, const char* key) {
    INFO("key " << key);
    REQUIRE(json.value(QString::fromUtf8(key)).isDouble());
    return json.value(QString::fromUtf8(key)).toDouble();
}

// Writes `text` to `name` in `dir` and returns the path.
QString fixture(const QTemporaryDir& dir, const char* name, const QByteArray& text) {
    const QString path = dir.filePath(QString::fromUtf8(name));
    QFile file(path);
    REQUIRE(file.open(QIODevice::WriteOnly | QIODevice::Text));
    file.write(text);
    return path;
}

// The same refusal as text and as --json: a result that is no number is printed in neither.
void requireRefusedInBothFormats(const QStringList& arguments, const char* words) {
    requireUsageError(arguments, words);
    requireUsageError(arguments + QStringList{QStringLiteral("--json")}, words);
}

} // namespace

TEST_CASE("calc multiplier: bridge with ideal diodes, Helfrick & Cooper Example 4-9") {
    // Helfrick & Cooper, Modern Electronic Instrumentation and Measurement Techniques,
    // Example 4-9 (p. 79): 1 mA, 50 Ω, 10 V rms; the book's 0.9 gives 8 950 Ω, the exact
    // 2√2/π gives 8 953.2 Ω (computed from the exact formula). E96 below it: 8.87 kΩ
    // (IEC 60063 E96: 887 and 909 bracket 895). 10 V is below 30 V rms: no caution
    // (IEC 61010-1 6.3.1).
    const QJsonObject json = runJson(args({"multiplier", "--ifs", "1mA", "--rm", "50", "--range",
                                           "10V", "--rectifier", "bridge", "--diode", "ideal"}));
    CHECK(number(json, "multiplier_ohm") == absolute(8953.2, 0.05));
    CHECK(number(json, "multiplier_ideal_ohm") == absolute(8953.2, 0.05));
    // AC sensitivity 2√2/π = 0.9003 × 1 000 Ω/V for a bridge (exact form, computed).
    CHECK(number(json, "sensitivity_ohm_per_volt") == relative(900.316, 1e-6));
    CHECK(number(json, "nearest_standard_ohm") == relative(8870.0, 1e-12));
    CHECK(number(json, "trim_ohm") == absolute(83.2, 0.05));
    // Bridge: the multiplier carries the full sine, I_rms = 10 V / 9 003.2 Ω.
    CHECK(number(json, "dissipation_w") ==
          relative(10.0 / 9003.163 * 10.0 / 9003.163 * 8953.163, 1e-5));
    CHECK(json.value(QStringLiteral("caution")).isNull());
}

TEST_CASE("calc multiplier: DC range of 100 V and its caution") {
    // R_s = V/I_fs − R_m: 100 V range, 1 mA, 100 Ω → 99.9 kΩ (classic textbook case, from
    // memory; no printed source checked); 100 V DC exceeds the 60 V DC limit of
    // IEC 61010-1 6.3.1.
    const QJsonObject json =
        runJson(args({"multiplier", "--ifs", "1mA", "--rm", "100", "--range", "100V"}));
    CHECK(number(json, "multiplier_ohm") == relative(99900.0, 1e-12));
    CHECK(number(json, "sensitivity_ohm_per_volt") == relative(1000.0, 1e-12));
    CHECK(number(json, "dissipation_w") == relative(1e-3 * 1e-3 * 99900.0, 1e-12));
    REQUIRE(json.value(QStringLiteral("caution")).isString());
    CHECK(json.value(QStringLiteral("caution")).toString().contains(QStringLiteral("61010")));
}

TEST_CASE("calc multiplier and indication agree: full scale at the range with real diodes") {
    for (const char* rectifier : {"half", "bridge"}) {
        for (const char* diode : {"silicon", "schottky", "germanium"}) {
            INFO(rectifier << ", " << diode);
            const QJsonObject design =
                runJson(args({"multiplier", "--ifs", "1mA", "--rm", "1k", "--range", "10V",
                              "--rectifier", rectifier, "--diode", diode, "--temp", "23C"}));
            const double multiplier_ohms = number(design, "multiplier_ohm");
            // Property: the diode drop costs multiplier resistance.
            CHECK(multiplier_ohms < number(design, "multiplier_ideal_ohm"));
            const QString rs = QString::number(multiplier_ohms, 'g', 17);
            const QJsonObject at_range =
                runJson(QStringList{QStringLiteral("indication"), QStringLiteral("--rs"), rs} +
                        args({"--rectifier", rectifier, "--ifs", "1mA", "--rm", "1k", "--range",
                              "10V", "--input", "10V", "--diode", diode, "--temp", "23C"}));
            CHECK(number(at_range, "indicated") == relative(10.0, 1e-6));
            CHECK(number(at_range, "movement_current_avg_a") == relative(1e-3, 1e-6));
            CHECK(number(at_range, "error_percent_of_range") == absolute(0.0, 1e-4));
            // Low on the scale the knee shows: the meter reads low (common practice).
            const QJsonObject low =
                runJson(QStringList{QStringLiteral("indication"), QStringLiteral("--rs"), rs} +
                        args({"--rectifier", rectifier, "--ifs", "1mA", "--rm", "1k", "--range",
                              "10V", "--input", "2.5V", "--diode", diode, "--frequency", "50Hz"}));
            CHECK(number(low, "error_percent_of_range") < 0.0);
        }
    }
}

TEST_CASE("calc indication: ideal half-wave with shunt, Helfrick & Cooper Example 4-10") {
    // Helfrick & Cooper Example 4-10: 1 mA, 100 Ω shunted by 100 Ω, 400 Ω diodes, 1 800 Ω;
    // with the exact √2/π the movement passes 1.000351 mA at 10 V rms (computed from the exact
    // formula).
    const QJsonObject json = runJson(args(
        {"indication", "--rectifier", "half", "--ifs", "1mA", "--rm", "100", "--rsh", "100", "--rs",
         "1800", "--range", "10V", "--input", "10V", "--diode", "ideal", "--diode-rf", "400"}));
    CHECK(number(json, "movement_current_avg_a") == relative(1.000351e-3, 1e-6));
    CHECK(number(json, "indicated") == relative(10.00351, 1e-6));
    CHECK(number(json, "error_percent_of_range") == absolute(0.0351, 0.0001));
    // A square wave of the same rms through the same ideal meter reads 11.07 % high
    // (exact form factor π/(2√2), computed; instrument manuals' waveform tables give +11 %).
    const QJsonObject square =
        runJson(args({"indication", "--rectifier", "bridge", "--ifs", "1mA", "--rm", "50", "--rs",
                      "8953.1631615710606", "--range", "10V", "--input", "5V", "--waveform",
                      "square", "--diode", "ideal"}));
    CHECK(number(square, "indicated") == relative(5.0 * 1.110721, 1e-6));
}

TEST_CASE("calc waveform: form factors and average-responding readings") {
    // Exact forms, computed: triangle form factor 2/√3, reading 0.961912 (−3.81 %); square
    // +11.07 % (instrument manuals' waveform tables print 0.96 and +11 %).
    const QJsonObject triangle = runJson(args({"waveform", "--waveform", "triangle"}));
    CHECK(number(triangle, "rms_v") == relative(1.0, 1e-12));
    CHECK(number(triangle, "form_factor") == relative(1.154701, 1e-6));
    CHECK(number(triangle, "reading_v") == relative(0.961912, 1e-6));
    CHECK(number(triangle, "error_percent") == absolute(-3.81, 0.005));
    const QJsonObject square = runJson(args({"waveform", "--waveform", "square", "--rms", "2V"}));
    CHECK(number(square, "average_v") == relative(2.0, 1e-12));
    CHECK(number(square, "error_percent") == absolute(11.07, 0.005));
    // Sine with offset: rms² = c² + A²/2 (exact algebra).
    const QJsonObject offset = runJson(args({"waveform", "--peak", "1V", "--offset", "0.5V"}));
    CHECK(number(offset, "rms_v") == relative(std::sqrt(0.25 + 0.5), 1e-12));
    CHECK(number(offset, "mean_v") == relative(0.5, 1e-12));
}

TEST_CASE("calc multiplier/indication/waveform: bad input gives exit code 2 and one line") {
    requireUsageError(args({"indication", "--rectifier", "bridge", "--ifs", "1mA", "--rm", "1k",
                            "--rs", "6k", "--range", "10V", "--input", "2.5A"}),
                      "--input");
    requireUsageError(
        args({"multiplier", "--ifs", "1mA", "--rm", "1k", "--range", "10V", "--rectifier", "full"}),
        "none|half|bridge");
    requireUsageError(args({"indication", "--rectifier", "bridge", "--ifs", "1mA", "--rm", "1k",
                            "--range", "10V", "--input", "2V"}),
                      "--rs is required");
    requireUsageError(args({"multiplier", "--ifs", "1mA", "--rm", "1k", "--range", "10V",
                            "--rectifier", "half", "--diode", "ideal", "--diode-is", "1n"}),
                      "--diode ideal");
    requireUsageError(args({"multiplier", "--ifs", "1mA", "--rm", "1k", "--range", "1.2V",
                            "--rectifier", "bridge"}),
                      "too low for the diodes");
    requireUsageError(args({"multiplier", "--ifs", "1mA", "--rm", "1k", "--range", "10V",
                            "--rectifier", "bridge", "--diode-n", "0"}),
                      "emission coefficient");
    requireUsageError(args({"waveform", "--waveform", "square", "--offset", "1V"}), "--offset");
    requireUsageError(args({"indication", "--ifs", "1mA", "--rm", "1k", "--rs", "6k", "--range",
                            "10V", "--input", "2V"}),
                      "--rectifier is required");
}

TEST_CASE("calc multiplier: effective sensitivity from the rms input current at full scale") {
    // Helfrick & Cooper Example 4-4: a 1 mA movement has S = 1/I_fs = 1 000 Ω/V on DC, and a
    // 10 V range presents 10 kΩ.
    const QJsonObject dc =
        runJson(args({"multiplier", "--ifs", "1mA", "--rm", "100", "--range", "10V"}));
    CHECK(number(dc, "effective_sensitivity_ohm_per_volt") == relative(1000.0, 1e-12));
    CHECK(number(dc, "input_resistance_ohm") == relative(10000.0, 1e-12));
    // Helfrick & Cooper Example 4-9: with ideal diodes a bridge carries the whole sine through
    // R_T = 0.9 × 10 V / 1 mA ≈ 9 kΩ (exact 2√2/π: 9 003.16 Ω), so the source sees 900 Ω/V,
    // the same as the textbook AC sensitivity.
    const QJsonObject ideal = runJson(args({"multiplier", "--ifs", "1mA", "--rm", "50", "--range",
                                            "10V", "--rectifier", "bridge", "--diode", "ideal"}));
    CHECK(number(ideal, "effective_sensitivity_ohm_per_volt") == relative(900.316, 1e-6));
    CHECK(number(ideal, "input_resistance_ohm") == relative(9003.16, 1e-6));
    // Real diodes conduct only near the crests: the current is peakier than a sine, its rms per
    // average is above π/(2√2), so the source sees less than the ideal 0.9 × 1 000 Ω/V, while
    // sensitivity_ohm_per_volt keeps the textbook value (common practice for the datasheet
    // figure). The key is 1 / I_rms by its definition in --help.
    const QJsonObject real = runJson(args({"multiplier", "--ifs", "1mA", "--rm", "1k", "--range",
                                           "10V", "--rectifier", "bridge", "--diode", "silicon"}));
    CHECK(number(real, "sensitivity_ohm_per_volt") == relative(900.316, 1e-6));
    CHECK(number(real, "effective_sensitivity_ohm_per_volt") < 900.316 * (1.0 - 1e-3));
    CHECK(number(real, "effective_sensitivity_ohm_per_volt") ==
          relative(1.0 / number(real, "multiplier_rms_current_a"), 1e-12));
    CHECK(number(real, "input_resistance_ohm") ==
          relative(10.0 * number(real, "effective_sensitivity_ohm_per_volt"), 1e-12));
}

TEST_CASE("calc indication checks --waveform even for a DC voltmeter") {
    const QStringList dc = args({"indication", "--rectifier", "none", "--ifs", "1mA", "--rm", "1k",
                                 "--rs", "9k", "--range", "10V", "--input", "5V"});
    requireUsageError(dc + args({"--waveform", "sawtooth"}), "--waveform \"sawtooth\"");
    // R_s = V/I_fs − R_m (Helfrick & Cooper §4): 9 kΩ + 1 kΩ at 1 mA is a 10 V range, so 5 V
    // reads 5 V; a valid shape is accepted and, on DC, has nothing to change.
    const QJsonObject json = runJson(dc + args({"--waveform", "square"}));
    CHECK(number(json, "indicated") == relative(5.0, 1e-12));
}

TEST_CASE("calc waveform --samples: one period from a file") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    // A square wave as samples, one value per line: form factor 1, and an average-responding
    // meter reads +11.07 % (exact π/(2√2); instrument manuals' waveform tables print +11 %).
    const QString square = fixture(dir, "square.txt", "2V\n2\n2\n-2\n-2 V\n-2\n");
    const QJsonObject fromLines = runJson(args({"waveform", "--samples"}) + QStringList{square});
    CHECK(fromLines.value(QStringLiteral("waveform")).toString() == QStringLiteral("sampled"));
    CHECK(fromLines.value(QStringLiteral("samples")).toInt() == 6);
    CHECK(number(fromLines, "rms_v") == relative(2.0, 1e-12));
    CHECK(number(fromLines, "form_factor") == relative(1.0, 1e-12));
    CHECK(number(fromLines, "error_percent") == absolute(11.07, 0.005));
    // A sine of 1 V rms in 720 samples, as a ';' CSV with a decimal comma and a column v: the
    // samples average sin² to exactly 1/2, and |sin| to 2/π within 1e-5 (exact forms; the form
    // factor π/(2√2) = 1.110721).
    QByteArray csv = "t;v\n";
    for (int i = 0; i < 720; ++i) {
        const double volts = std::numbers::sqrt2 * std::sin(2.0 * std::numbers::pi * i / 720.0);
        csv += QByteArray::number(i) + ';' + QByteArray::number(volts, 'g', 17).replace('.', ',') +
               '\n';
    }
    const QString sine = fixture(dir, "sine.csv", csv);
    const QJsonObject fromCsv =
        runJson(args({"waveform", "--decimal-comma", "--samples"}) + QStringList{sine});
    CHECK(number(fromCsv, "rms_v") == relative(1.0, 1e-12));
    CHECK(number(fromCsv, "form_factor") == relative(1.110721, 1e-5));
    CHECK(number(fromCsv, "reading_v") == relative(1.0, 1e-5));
    CHECK(number(fromCsv, "mean_v") == absolute(0.0, 1e-12));
}

TEST_CASE("calc waveform --samples names the line of a bad sample") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QString word = fixture(dir, "word.txt", "1\n\n0\nminus one\n");
    requireUsageError(args({"waveform", "--samples"}) + QStringList{word}, "word.txt line 4");
    const QString amps = fixture(dir, "amps.csv", "n,v\n1,1\n2,-1mA\n");
    requireUsageError(args({"waveform", "--samples"}) + QStringList{amps},
                      "amps.csv line 3, column v");
    const QString ragged = fixture(dir, "ragged.csv", "n,v\n1,1\n2,-1,3\n");
    requireUsageError(args({"waveform", "--samples"}) + QStringList{ragged},
                      "ragged.csv line 3 has 3 cells");
    const QString one = fixture(dir, "one.txt", "1\n");
    requireUsageError(args({"waveform", "--samples"}) + QStringList{one}, "at least 2 samples");
    requireUsageError(args({"waveform", "--samples"}) +
                          QStringList{dir.filePath(QStringLiteral("missing.txt"))},
                      "--samples");
    requireUsageError(args({"waveform", "--rms", "1V", "--samples"}) + QStringList{one}, "--rms");
}

TEST_CASE("calc waveform --samples reads only the columns v, n and t") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QStringList samples = args({"waveform", "--samples"});
    const QString misspelt = fixture(dir, "volt.csv", "n,volt\n1,1\n2,-1\n");
    const auto unknown = requireUsageError(samples + QStringList{misspelt},
                                           "volt.csv line 1: unknown column \"volt\"");
    CHECK(unknown.err.contains("the columns are v, n, t"));
    const QString extra = fixture(dir, "extra.csv", "t,v,i\n0,1,1\n1,-1,1\n");
    requireUsageError(samples + QStringList{extra}, "unknown column \"i\"");
    const QString noV = fixture(dir, "no_v.csv", "n,t\n1,0\n2,1\n");
    requireUsageError(samples + QStringList{noV},
                      "no_v.csv line 1: the header must name the column v");
}

TEST_CASE("calc waveform --samples takes CRLF, refuses a stray CR and escapes a NUL") {
    QTemporaryDir dir;
    REQUIRE(dir.isValid());
    const QStringList samples = args({"waveform", "--samples"});
    // RFC 4180 2.1 (from memory): CRLF line ends. A square wave of 2 V: rms 2 V, form factor 1.
    const QString crlf = fixture(dir, "crlf.csv", "n,v\r\n1,2\r\n2,-2\r\n");
    const QJsonObject json = runJson(samples + QStringList{crlf});
    CHECK(json.value(QStringLiteral("samples")).toInt() == 2);
    CHECK(number(json, "rms_v") == relative(2.0, 1e-12));
    CHECK(number(json, "form_factor") == relative(1.0, 1e-12));
    const QString stray = fixture(dir, "stray.txt", "2\n-2\r5\n");
    requireUsageError(samples + QStringList{stray}, "stray.txt line 2: a carriage return (CR)");
    static const char kWithNul[] = "2\n-\0002\n";
    const QString nul = fixture(dir, "nul.txt", QByteArray(kWithNul, sizeof kWithNul - 1));
    const auto refused =
        requireUsageError(samples + QStringList{nul}, "nul.txt line 2 \"-\\x002\"");
    CHECK_FALSE(refused.err.contains('\0'));
    CHECK(refused.err.contains("a control character in the cell"));
}

TEST_CASE("calc indication and waveform print numbers in engineering notation") {
    // Square of 1 V rms: +11.07 % (exact π/(2√2), as above), shown with the percent sign of the
    // app's one number format instead of a fixed count of decimals.
    const mwtest::CliResult wave = mwtest::calc::run(args({"waveform", "--waveform", "square"}));
    INFO(wave.outText().toStdString());
    REQUIRE(wave.exitCode == 0);
    CHECK(wave.outText().contains(QStringLiteral("form factor       1\n")));
    CHECK(wave.outText().contains(QStringLiteral("1.1107 V (11.1 %)")));
    // Helfrick & Cooper Example 4-10 as above: +0.0351 % of range.
    const mwtest::CliResult indication = mwtest::calc::run(args(
        {"indication", "--rectifier", "half", "--ifs", "1mA", "--rm", "100", "--rsh", "100", "--rs",
         "1800", "--range", "10V", "--input", "10V", "--diode", "ideal", "--diode-rf", "400"}));
    INFO(indication.outText().toStdString());
    REQUIRE(indication.exitCode == 0);
    CHECK(indication.outText().contains(QStringLiteral("0.0351 % of range")));
}

TEST_CASE("calc multiplier: one resistor over its working voltage is named") {
    // R_s = V/I_fs − R_m: 250 V, 50 µA, 2 kΩ → 4.998 MΩ (Helfrick & Cooper §4 formula); 300 V
    // across it at 120 % of range (Ohm's law) against the 250 V working voltage of a 0.25 W
    // film resistor (common practice, from memory). The DC line says nothing of diodes.
    const QStringList design =
        args({"multiplier", "--ifs", "50uA", "--rm", "2k", "--range", "250V"});
    const QJsonObject json = runJson(design);
    CHECK(number(json, "multiplier_ohm") == relative(4.998e6, 1e-12));
    CHECK(number(json, "voltage_overrange_v") == relative(1.2 * 50e-6 * 4.998e6, 1e-12));
    CHECK(json.value(QStringLiteral("exceeds_voltage_rating")).toBool());
    CHECK_FALSE(json.value(QStringLiteral("exceeds_rating")).toBool());
    CHECK(json.value(QStringLiteral("caution"))
              .toString()
              .contains(QStringLiteral("OVER the voltage rating")));
    // A 500 V part takes it; the hazard caution of IEC 61010-1 stays (250 V DC > 60 V DC).
    const QJsonObject rated = runJson(design + args({"--voltage-rating", "500V"}));
    CHECK_FALSE(rated.value(QStringLiteral("exceeds_voltage_rating")).toBool());
    CHECK(rated.value(QStringLiteral("caution")).toString().contains(QStringLiteral("61010")));
    const mwtest::CliResult text = mwtest::calc::run(design);
    CHECK(text.exitCode == 0);
    CHECK_FALSE(text.outText().contains(QStringLiteral("ideal diodes")));
    CHECK(text.outText().contains(QStringLiteral("OVER the voltage rating")));
}

TEST_CASE("calc indication and waveform caution at hazardous voltages") {
    // IEC 61010-1 6.3.1 a): 60 V DC, 30 V rms, 42.4 V peak.
    const QJsonObject dc =
        runJson(args({"indication", "--ifs", "1mA", "--rm", "1k", "--rs", "299k", "--range", "300V",
                      "--input", "300V", "--rectifier", "none"}));
    CHECK(dc.value(QStringLiteral("caution")).toString().contains(QStringLiteral("61010")));
    const QJsonObject low =
        runJson(args({"indication", "--ifs", "1mA", "--rm", "1k", "--rs", "299k", "--range", "300V",
                      "--input", "50V", "--rectifier", "none"}));
    CHECK(low.value(QStringLiteral("caution")).isNull());
    const mwtest::CliResult text =
        mwtest::calc::run(args({"indication", "--ifs", "1mA", "--rm", "1k", "--rs", "299k",
                                "--range", "300V", "--input", "300V", "--rectifier", "none"}));
    CHECK(text.outText().contains(QStringLiteral("caution")));
    // 25 V rms of a triangle has a 43.3 V peak (crest factor √3): above 42.4 V peak.
    CHECK(runJson(args({"waveform", "--waveform", "triangle", "--rms", "25V"}))
              .value(QStringLiteral("caution"))
              .isString());
    CHECK(runJson(args({"waveform", "--waveform", "square", "--rms", "25V"}))
              .value(QStringLiteral("caution"))
              .isNull());
}

TEST_CASE("calc multiplier, indication and waveform refuse results beyond a double") {
    // Invented inputs far outside any meter. A 1e-308 Ω shunt across the movement draws more
    // current than a double holds (the multiplier's dissipation printed inf).
    requireRefusedInBothFormats(
        args({"multiplier", "--ifs", "1mA", "--rm", "100", "--range", "10V", "--rsh", "1e-308"}),
        "the dissipation at 120 % cannot be computed from the values of --ifs, --rm, --rsh, "
        "--range");
    // A 1e308 Ω shunt: the current divider takes inf / inf (the indication printed nan).
    requireRefusedInBothFormats(
        args({"indication", "--rectifier", "none", "--ifs", "1mA", "--rm", "100", "--rs", "9.9k",
              "--range", "10V", "--input", "5V", "--rsh", "1e308"}),
        "the movement current cannot be computed from the values of --ifs");
    // A movement of 1e-160 A: the real diodes' circuit solve cannot settle (it was an internal
    // error, exit code 3).
    requireRefusedInBothFormats(args({"multiplier", "--rectifier", "bridge", "--ifs", "1e-160",
                                      "--rm", "100", "--range", "10V"}),
                                "the multiplier cannot be computed from the values of --ifs");
    // Samples whose squares overflow: the true rms is beyond a double.
    QTemporaryDir dir;
    const QString samples = fixture(dir, "huge.csv", "1e200\n-1e200\n");
    requireRefusedInBothFormats(args({"waveform"}) << QStringLiteral("--samples") << samples,
                                "the true rms cannot be computed from the values of the samples");
}
