// `meterwright calc shunt|ayrton|temperature|eseries` run as a separate process: JSON results
// against textbook examples, and bad input giving exit code 2 with one line on stderr.
#include "support/approx.h"
#include "support/cli_process.h"

#include <catch2/catch.hpp>

#include <QJsonArray>
#include <QJsonObject>
#include <QStringList>

#include <cmath>

using mwtest::args;
using mwtest::relative;
using mwtest::calc::runJson;

namespace {

// The shared check, and also that the one line on stderr ends with its newline.
void requireUsageError(const QStringList& arguments, const char* words) {
    const mwtest::CliResult result = mwtest::calc::requireUsageError(arguments, words);
    INFO("stderr: " << result.err.toStdString());
    CHECK(result.err.endsWith('\n'));
}

// The same refusal as text and as --json: a result that is no number is printed in neither.
void requireRefusedInBothFormats(const QStringList& arguments, const char* words) {
    requireUsageError(arguments, words);
    requireUsageError(arguments + QStringList{QStringLiteral("--json")}, words);
}

} // namespace

TEST_CASE("calc shunt gives the shunt of Helfrick & Cooper Example 4-1") {
    // Helfrick & Cooper Example 4-1: 1 mA, 100 Ω movement, 100 mA range -> 1.01 Ω.
    const QJsonObject json =
        runJson(args({"shunt", "--ifs", "1mA", "--rm", "100", "--range", "100 mA"}));
    CHECK(json.value(QStringLiteral("shunt_ohm")).toDouble() == relative(1.0101010101, 1e-9));
    CHECK(json.value(QStringLiteral("shunt_current_a")).toDouble() == relative(0.099, 1e-12));
    CHECK(json.value(QStringLiteral("burden_v")).toDouble() == relative(0.1, 1e-12));
    CHECK(json.value(QStringLiteral("exceeds_rating")).isBool());
}

TEST_CASE("calc ayrton gives the taps of Helfrick & Cooper Example 4-2, by topology") {
    // Helfrick & Cooper Example 4-2: 1 mA, 50 Ω, ranges 1/5/10 A -> 0.005005 Ω alone on 10 A,
    // 0.005005 Ω added for 5 A, 0.04004 Ω added for 1 A (Helfrick & Cooper, Modern Electronic
    // Instrumentation and Measurement Techniques, Example 4-2, p. 57).
    const QJsonObject json =
        runJson(args({"ayrton", "--ifs", "1mA", "--rm", "50", "--ranges", "10A,1A,5A"}));
    const QJsonArray ranges = json.value(QStringLiteral("ranges_a")).toArray();
    const QJsonArray taps = json.value(QStringLiteral("taps_ohm")).toArray();
    const QJsonArray sections = json.value(QStringLiteral("sections_ohm")).toArray();
    REQUIRE(ranges.size() == 3);
    REQUIRE(taps.size() == 3);
    REQUIRE(sections.size() == 3);
    CHECK(ranges[0].toDouble() == 1.0);
    CHECK(ranges[2].toDouble() == 10.0);
    CHECK(taps[0].toDouble() == relative(0.05005, 1e-3));  // whole string on 1 A
    CHECK(taps[1].toDouble() == relative(0.01001, 1e-3));  // two sections on 5 A
    CHECK(taps[2].toDouble() == relative(0.005005, 1e-3)); // one section on 10 A
    CHECK(sections[0].toDouble() == relative(0.005005, 1e-3));
    CHECK(sections[1].toDouble() == relative(0.005005, 1e-3));
    CHECK(sections[2].toDouble() == relative(0.04004, 1e-3));
    CHECK(json.value(QStringLiteral("topology")).toString().contains(QStringLiteral("common")));
}

TEST_CASE("calc temperature gives the IEC 60028 coil resistance and the span error") {
    // IEC 60028 copper, α20 = 0.00393 /K: 100 Ω at 20 °C is 103.93 Ω at 30 °C.
    // Helfrick & Cooper Example 4-3 10 V range (9.9 kΩ multiplier): span error ≈ -α·ΔT·R_m/R_v
    // (swamping rule, derived from the IEC 60028 law for annealed copper, α20 = 0.00393 /K).
    const QJsonObject json = runJson(
        args({"temperature", "--rm", "100", "--temp", "30C", "--ref", "20 °C", "--series", "9k9"}));
    CHECK(json.value(QStringLiteral("coil_ohm_at_temp")).toDouble() == relative(103.93, 1e-9));
    CHECK(json.value(QStringLiteral("span_error_percent")).toDouble() == relative(-0.0393, 1e-3));
    // Coil measured at 23 °C: referred to 20 °C by the same law (IEC 60028 annealed copper,
    // α20 = 0.00393 /K: R(23 °C)/R(20 °C) = 1.01179, computed).
    const QJsonObject measured =
        runJson(args({"temperature", "--rm", "101.179", "--rm-at", "296.15K", "--temp", "20C"}));
    CHECK(measured.value(QStringLiteral("coil_ohm_20c")).toDouble() == relative(100.0, 1e-5));
}

TEST_CASE("calc temperature designs a swamping resistor for a target") {
    // Zero-tempco swamp for a 5 Ω coil within 1 % from 20 to 30 °C: closed form
    // (R(30) - R(20)) / 0.01 - R(30), derived from the swamping rule with IEC 60028 copper
    // (α20 = 0.00393 /K).
    const QJsonObject json = runJson(args({"temperature", "--rm", "5", "--ref", "20C", "--from",
                                           "20C", "--to", "30C", "--target", "1%"}));
    const double hot = 5.0 * 1.0393;
    CHECK(json.value(QStringLiteral("swamp_ohm")).toDouble() ==
          relative((hot - 5.0) / 0.01 - hot, 1e-7));
    CHECK(json.value(QStringLiteral("swamp_shunt_ohm")).isNull());
    CHECK(json.value(QStringLiteral("swamp_worst_at_c")).toDouble() == 30.0);
    // Negative temperatures are read as values, not as options.
    const QJsonObject cold =
        runJson(args({"temperature", "--rm", "50", "--from", "-10C", "--to", "40C", "--target",
                      "0.5%", "--ifs", "1mA", "--range", "1A", "--swamp-tempco", "15ppm/K"}));
    CHECK(cold.value(QStringLiteral("swamp_ohm")).toDouble() > 0.0);
    CHECK(cold.value(QStringLiteral("swamp_shunt_ohm")).toDouble() > 0.0);
    CHECK(std::abs(cold.value(QStringLiteral("swamp_worst_error_percent")).toDouble()) <=
          0.5 * (1.0 + 1e-9));
}

TEST_CASE("calc eseries picks the IEC 60063 value not above and the trim") {
    // IEC 60063:2015 Table 2 (E96): 8.87 kΩ below 8 950 Ω (Helfrick & Cooper Example 4-9).
    const QJsonObject e96 = runJson(args({"eseries", "--value", "8950", "--series", "E96"}));
    CHECK(e96.value(QStringLiteral("nearest_not_above_ohm")).toDouble() == relative(8870.0, 1e-12));
    CHECK(e96.value(QStringLiteral("trim_ohm")).toDouble() == relative(80.0, 1e-9));
    CHECK(e96.value(QStringLiteral("nearest_ohm")).toDouble() == relative(8870.0, 1e-12));
    CHECK(e96.value(QStringLiteral("tolerance_percent")).toDouble() == relative(1.0, 1e-12));
    // IEC 60063:2015 Table 1 (E24) has 4.7; Table 2 (E96) has 4.64 but not 4.7.
    const QJsonObject e24 = runJson(args({"eseries", "--value", "4k7", "--series", "e24"}));
    CHECK(e24.value(QStringLiteral("nearest_not_above_ohm")).toDouble() == relative(4700.0, 1e-12));
    CHECK(e24.value(QStringLiteral("trim_ohm")).toDouble() == 0.0);
    const QJsonObject fallback = runJson(args({"eseries", "--value", "4k7"}));
    CHECK(fallback.value(QStringLiteral("series")).toString() == QStringLiteral("E96"));
    CHECK(fallback.value(QStringLiteral("nearest_not_above_ohm")).toDouble() ==
          relative(4640.0, 1e-12));
    // Helfrick & Cooper Example 4-3: 250 kΩ at 1 mA dissipates 0.25 W (I²R).
    const QJsonObject heat =
        runJson(args({"eseries", "--value", "250k", "--current", "1mA", "--series", "E24"}));
    CHECK(heat.value(QStringLiteral("dissipation_w")).toDouble() == relative(0.25, 1e-12));
    CHECK(heat.value(QStringLiteral("dissipation_overrange_w")).toDouble() ==
          relative(0.36, 1e-12));
    CHECK(heat.value(QStringLiteral("exceeds_rating")).toBool());
}

TEST_CASE("without --json the commands print readable lines") {
    const mwtest::CliResult result =
        mwtest::calc::run(args({"shunt", "--ifs", "1mA", "--rm", "100", "--range", "1A"}));
    CHECK(result.exitCode == 0);
    CHECK(result.out.contains("shunt"));
    CHECK(result.out.contains("m\xce\xa9")); // "mΩ": engineering notation with the ohm sign
    const mwtest::CliResult ayrton =
        mwtest::calc::run(args({"ayrton", "--ifs", "1mA", "--rm", "50", "--ranges", "1A,5A,10A"}));
    CHECK(ayrton.exitCode == 0);
    CHECK(ayrton.out.contains("section 1 from the common terminal"));
}

TEST_CASE("bad input gives exit code 2 and one line saying what is wrong") {
    requireUsageError(args({"shunt", "--ifs", "1mA", "--rm", "100", "--range", "0.5mA"}),
                      "not above the movement's full-scale current");
    requireUsageError(args({"shunt", "--ifs", "1mA", "--rm", "5A", "--range", "1A"}),
                      "a resistance");
    requireUsageError(args({"shunt", "--ifs", "1mA", "--rm", "100"}), "--range is required");
    requireUsageError(args({"shunt", "--ifs", "1..2mA", "--rm", "100", "--range", "1A"}),
                      "character 3");
    requireUsageError(args({"ayrton", "--ifs", "1mA", "--rm", "50", "--ranges", "1A,xx"}),
                      "item 2");
    requireUsageError(args({"ayrton", "--ifs", "1mA", "--rm", "50", "--ranges", "1A,1A"}),
                      "given twice");
    requireUsageError(args({"eseries", "--value", "4k7", "--series", "E7"}), "E6|E12");
    requireUsageError(args({"eseries", "--value", "-5"}), "above 0");
    requireUsageError(args({"temperature", "--rm", "100"}), "--temp");
    requireUsageError(args({"temperature", "--rm", "100", "--target", "1%"}), "--from and --to");
    requireUsageError(args({"temperature", "--rm", "100", "--temp", "30 V"}), "temperature");
    requireUsageError(args({"shunt", "--bogus", "1"}), "bogus");
}

TEST_CASE("calc shunt: over the power rating is OVER, burden and an unswamped coil") {
    // 1 mA, 100 Ω movement on 10 A: R_sh = 0.1 V / 9.999 A = 10.001 mΩ (Helfrick & Cooper
    // §4 formula), I²R ≈ 1.0 W at full scale on a 0.25 W rating; burden I_fs·R_m = 100 mV,
    // 120 mV at 120 % (Ohm's law). The unswamped copper coil drifts about -3.9 % per 10 K
    // (IEC 60028 copper), more than class 1 allows (IEC 60051-1, from memory).
    const QStringList design = args({"shunt", "--ifs", "1mA", "--rm", "100", "--range", "10A"});
    const QJsonObject json = runJson(design);
    CHECK(json.value(QStringLiteral("dissipation_w")).toDouble() == relative(0.9999, 1e-3));
    CHECK(json.value(QStringLiteral("exceeds_rating")).toBool());
    CHECK(json.value(QStringLiteral("burden_v")).toDouble() == relative(0.1, 1e-12));
    CHECK(json.value(QStringLiteral("burden_overrange_v")).toDouble() == relative(0.12, 1e-12));
    CHECK(json.value(QStringLiteral("span_drift_percent_per_10k")).toDouble() ==
          relative(-3.8, 0.05));
    const QString caution = json.value(QStringLiteral("caution")).toString();
    CHECK(caution.contains(QStringLiteral("OVER the power rating")));
    CHECK(caution.contains(QStringLiteral("not swamped")));
    const mwtest::CliResult text = mwtest::calc::run(design);
    CHECK(text.outText().contains(QStringLiteral("OVER the power rating")));
    CHECK_FALSE(text.outText().contains(QStringLiteral("above half")));
    // A 100 mA range swamped 1:19 with manganin: the drift falls to about a twentieth, within
    // class 1 (swamping rule, check-values.md 8); the burden grows to 1 mA × 2 kΩ = 2 V; a
    // 1 W part carries the 0.29 W at 120 % within half its rating.
    const QJsonObject swamped = runJson(args({"shunt", "--ifs", "1mA", "--rm", "100", "--range",
                                              "100mA", "--swamp", "1900", "--rating", "1W"}));
    CHECK(swamped.value(QStringLiteral("caution")).isNull());
    CHECK(swamped.value(QStringLiteral("burden_v")).toDouble() == relative(2.0, 1e-12));
    CHECK(std::fabs(swamped.value(QStringLiteral("span_drift_percent_per_10k")).toDouble()) < 1.0);
}

TEST_CASE("calc ayrton gives the burden of each range") {
    // Helfrick & Cooper Example 4-2 string: on 1 A the movement's own 50 mV (1 mA × 50 Ω).
    const QJsonObject json =
        runJson(args({"ayrton", "--ifs", "1mA", "--rm", "50", "--ranges", "1A,5A,10A"}));
    const QJsonArray burdens = json.value(QStringLiteral("burden_v")).toArray();
    REQUIRE(burdens.size() == 3);
    CHECK(burdens.at(0).toDouble() == relative(0.05, 1e-9));
}

TEST_CASE("calc eseries suppresses a trim no practical trimmer can make") {
    // Helfrick & Cooper Example 4-1 shunt 1.0101 Ω as E96 (IEC 60063 Table 2): 1.00 Ω and a
    // trim of 10 mΩ, far below the smallest practical trimmer (about 10 Ω, common practice,
    // from memory): no trim is suggested, and the reason is given.
    const QJsonObject json = runJson(args({"eseries", "--value", "1.0101"}));
    CHECK(json.value(QStringLiteral("nearest_not_above_ohm")).toDouble() == relative(1.0, 1e-12));
    CHECK(json.value(QStringLiteral("trim_ohm")).isNull());
    CHECK(json.value(QStringLiteral("trim_note"))
              .toString()
              .contains(QStringLiteral("smallest practical")));
    const mwtest::CliResult text = mwtest::calc::run(args({"eseries", "--value", "1.0101"}));
    CHECK(text.outText().contains(QStringLiteral("no trim suggested")));
    CHECK_FALSE(text.outText().contains(QStringLiteral("trim 10")));
}

TEST_CASE("calc temperature prints its table aligned") {
    const mwtest::CliResult text =
        mwtest::calc::run(args({"temperature", "--rm", "100", "--temp", "30C", "--ref", "20C",
                                "--target", "0.5%", "--from", "10C", "--to", "30C"}));
    REQUIRE(text.exitCode == 0);
    const QStringList lines = text.outText().trimmed().split(QLatin1Char('\n'));
    REQUIRE(lines.size() == 4);
    for (const QString& line : lines) {
        INFO(line.toStdString());
        CHECK(line.at(21) == QLatin1Char(' '));
        CHECK(line.at(22) != QLatin1Char(' ')); // every value starts in the same column
    }
    // A copper coil on a manganin shunt without swamping: cautioned (IEC 60028 copper drift).
    const QJsonObject shunted =
        runJson(args({"temperature", "--rm", "100", "--temp", "30C", "--shunt", "1.0101"}));
    CHECK(shunted.value(QStringLiteral("caution"))
              .toString()
              .contains(QStringLiteral("not swamped")));
}

TEST_CASE("the decimal comma is offered where values are read") {
    // 4,7k with a decimal comma (common practice in much of Europe).
    const QJsonObject json = runJson(args({"eseries", "--value", "4,7k", "--decimal-comma"}));
    CHECK(json.value(QStringLiteral("wanted_ohm")).toDouble() == relative(4700.0, 1e-12));
}

TEST_CASE("calc shunt refuses a result beyond the numbers it can hold") {
    // Invented inputs far outside any meter: the shunt's dissipation overflows a double.
    mwtest::calc::requireUsageError(
        mwtest::args({"shunt", "--ifs", "1mA", "--rm", "100", "--range", "1e308"}),
        "beyond the numbers");
}

TEST_CASE("calc temperature refuses a span error or resistance beyond a double") {
    // Invented inputs far outside any meter, each of which used to print nan or inf with exit 0.
    requireRefusedInBothFormats(args({"temperature", "--rm", "100", "--temp", "50C", "--series",
                                      "1k", "--series-tempco", "1e308"}),
                                "the span error cannot be computed from the values of --rm");
    requireRefusedInBothFormats(args({"temperature", "--rm", "1e308", "--temp", "1e308"}),
                                "the coil resistance at --temp cannot be computed");
    requireRefusedInBothFormats(args({"temperature", "--rm", "1e308", "--target", "0.5%", "--from",
                                      "0C", "--to", "50C", "--ifs", "1mA", "--range", "1A"}),
                                "the resized shunt cannot be computed");
    // A shunt of 0 Ω would make the span error 0 / 0.
    requireUsageError(args({"temperature", "--rm", "100", "--temp", "50C", "--shunt", "0"}),
                      "option --shunt must be above 0");
}

TEST_CASE("calc eseries refuses a dissipation beyond a double") {
    // Invented: 1e308 Ω carrying 1e154 A dissipates more than a double holds (it printed inf W).
    requireRefusedInBothFormats(args({"eseries", "--value", "1e308", "--current", "1e154"}),
                                "the dissipation at 120 % cannot be computed from the values of "
                                "--value and --current");
}

TEST_CASE("an exponent counts by its value, not by its digits") {
    const QJsonObject json = runJson(args({"eseries", "--value", "1e0000003"}));
    CHECK(json.value(QStringLiteral("wanted_ohm")).toDouble() == 1000.0);
}
