// Evaluation of one range from readings of a synthetic meter with known zero, span and
// hysteresis (demo data), checked against hand calculation by the cited rules.
#include "core/evaluation/evaluation.h"

#include "core/uncertainty/distributions.h"
#include "support/approx.h"

#include <catch2/catch.hpp>

#include <boost/math/distributions/students_t.hpp>

#include <algorithm>

#include <cmath>
#include <limits>
#include <stdexcept>

using namespace mw;

namespace {

// A 0-10 V class 1.5 voltmeter (limit ±0.15 V) with zero offset +0.05 V, span 1.01 and
// hysteresis 0.02 V (down reads 0.01 V above the mean, up 0.01 V below). Invented demo data.
EvaluationInput syntheticMeter() {
    EvaluationInput input;
    input.range = {0.0, 10.0, ScaleType::ZeroAtEnd, {}};
    input.classIndex = 1.5;
    input.divisions = 50;
    input.readabilityFraction = 0.2;
    input.reference = parseReferenceSpec("0.02%rdg+0.01%rng", Unit::Volt);
    for (const double applied : {0.0, 2.0, 4.0, 6.0, 8.0, 10.0}) {
        const double mean = 0.05 + 1.01 * applied;
        input.readings.push_back({applied, mean - 0.01, Direction::Up, 1, -1});
        input.readings.push_back({applied, mean + 0.01, Direction::Down, 1, -1});
    }
    return input;
}

} // namespace

TEST_CASE("errors per point in units, % of reading and % of fiducial value") {
    const EvaluationResult result = evaluateRange(syntheticMeter());
    CHECK(result.fiducialValue == 10.0);                             // IEC 60051-1: upper limit
    CHECK(result.permissibleError == mwtest::relative(0.15, 1e-12)); // 1.5 % of 10 V
    REQUIRE(result.points.size() == 6);
    const PointResult& top = result.points[5];
    CHECK(top.applied == 10.0);
    CHECK(*top.errorUp == mwtest::absolute(0.14, 1e-12));
    CHECK(*top.errorDown == mwtest::absolute(0.16, 1e-12));
    CHECK(*top.hysteresis == mwtest::absolute(0.02, 1e-12));
    CHECK(top.error == mwtest::absolute(0.16, 1e-12)); // the worse direction decides
    CHECK(top.indicated == mwtest::absolute(10.16, 1e-12));
    CHECK(*top.errorPercentOfReading == mwtest::absolute(1.6, 1e-10));
    CHECK(top.errorPercentOfFiducial == mwtest::absolute(1.6, 1e-10));
    CHECK_FALSE(result.points[0].errorPercentOfReading.has_value()); // zero applied
    CHECK(result.worstPoint == 5);
    CHECK_FALSE(top.repeatability.has_value());
}

TEST_CASE("per-point budget: reference spec and readability") {
    // Reference ±(0.02 % rdg + 0.01 % rng) at 10 V = 3 mV rectangular; readability 1/5 of a
    // 0.2 V division -> half-width 0.02 V rectangular (JCGM 100:2008 4.3.7); k = 2 for ν = ∞
    // (Table G.2); U to two digits rounded up (7.2.6): 2·√(0.02² + 0.003²)/√3 = 0.02335 ->
    // 0.024 V (to the nearest it would be 0.023 V).
    const PointResult top = evaluateRange(syntheticMeter()).points[5];
    REQUIRE(top.components.size() == 2);
    const double uc = std::sqrt(0.02 * 0.02 + 0.003 * 0.003) / std::sqrt(3.0);
    CHECK(top.budget.combined == mwtest::relative(uc, 1e-12));
    CHECK(std::isinf(top.budget.dofEffective));
    CHECK(top.budget.coverageFactor == mwtest::relative(2.0, 1e-9));
    CHECK(top.budget.expanded == mwtest::relative(2.0 * uc, 1e-9));
    CHECK(top.budget.expandedRounded == mwtest::relative(0.024, 1e-12));
    // ANSI/NCSL Z540.3 Handbook: TUR = 0.30 V / (2 × U), with the reported U = 0.024 V:
    // 6.25, shown rounded down to two significant digits.
    REQUIRE(top.tur);
    CHECK(*top.tur == mwtest::relative(0.15 / 0.024, 1e-12));
    CHECK(top.turText == "6.2:1");
    CHECK_FALSE(top.turBelowMinimum);
}

TEST_CASE("simple acceptance: the top point fails and so does the range") {
    // ILAC G8:09/2019 4.2.1: 0.16 V > 0.15 V fails; 0.14 V at 8 V passes.
    const EvaluationResult result = evaluateRange(syntheticMeter());
    CHECK(result.points[4].decision == Outcome::Pass);
    CHECK(result.points[5].decision == Outcome::Fail);
    CHECK(result.overall == Outcome::Fail);
    // JCGM 106:2012: the top point's error lies 0.01 V beyond the limit, so it conforms with
    // less than 50 % probability; a rejected point shows p_c, not a risk of false accept.
    CHECK(result.points[5].conformanceProbability < 0.5);
    CHECK_FALSE(result.points[5].specificRisk.has_value());
    REQUIRE(result.points[0].specificRisk.has_value());
    CHECK(*result.points[0].specificRisk < 1e-6);
}

TEST_CASE("guarded acceptance with w = U gives conditional outcomes near the limit") {
    // ILAC G8:09/2019 4.2.3 with w = U = 0.024 V: 0.14 V at 8 V lies within U below the limit
    // (conditional pass); 0.16 V lies within U above it (conditional fail).
    EvaluationInput input = syntheticMeter();
    input.decision = {DecisionRule::GuardedAcceptance, 1.0};
    const EvaluationResult result = evaluateRange(input);
    CHECK(result.points[0].decision == Outcome::Pass);
    CHECK(result.points[4].decision == Outcome::ConditionalPass);
    CHECK(result.points[5].decision == Outcome::ConditionalFail);
    CHECK(result.overall == Outcome::ConditionalFail);
    CHECK_THAT(result.statement,
               Catch::Contains("ILAC G8:09/2019 4.2.3") && Catch::Contains("conditional fail"));
}

TEST_CASE("advice finds the known zero, span and hysteresis and the multiplier to fit") {
    EvaluationInput input = syntheticMeter();
    // 1 mA movement of 100 Ω with a 9.9 kΩ multiplier on 10 V (Helfrick & Cooper formula
    // R_s = V/I_fs − R_m); span 1.01 needs R_total × 1.01 = 10.1 kΩ -> R_s = 10.0 kΩ.
    input.resistor = RangeResistor{9900.0, 100.0, false, 9900.0, 1.0, ESeries::E96};
    const EvaluationResult result = evaluateRange(input);
    REQUIRE(result.advice);
    CHECK(result.advice->fit.zeroOffset == mwtest::absolute(0.05, 1e-12));
    CHECK(result.advice->fit.spanFactor == mwtest::relative(1.01, 1e-12));
    CHECK(result.advice->fit.nonlinearity == mwtest::absolute(0.0, 1e-12));
    CHECK(result.advice->hysteresis == mwtest::absolute(0.02, 1e-12));
    CHECK(result.advice->cause == LikelyCause::Span);
    REQUIRE(result.correctedResistorOhms);
    CHECK(*result.correctedResistorOhms == mwtest::relative(10000.0, 1e-9));
    REQUIRE(result.correctedChoice);
    CHECK(result.correctedChoice->ohms_standard == mwtest::relative(10000.0, 1e-12)); // E96 100
    REQUIRE(result.resistorDeviation);
    CHECK(result.resistorDeviation->deviationPercent == mwtest::absolute(0.0, 1e-12));
}

TEST_CASE("repeats give a Type A component and finite effective dof") {
    // JCGM 100:2008 4.2: three repeats 5.02, 5.04, 5.03 V -> s = 0.01 V, u = 0.01/√3, ν = 2.
    EvaluationInput input;
    input.range = {0.0, 10.0, ScaleType::ZeroAtEnd, {}};
    input.classIndex = 1.0;
    int repeat = 0;
    for (const double indicated : {5.02, 5.04, 5.03}) {
        input.readings.push_back({5.0, indicated, Direction::Up, ++repeat, -1});
    }
    const EvaluationResult result = evaluateRange(input);
    REQUIRE(result.points.size() == 1);
    const PointResult& point = result.points[0];
    CHECK(point.readingCount == 3);
    CHECK(*point.repeatability == mwtest::relative(0.01, 1e-9));
    CHECK(point.error == mwtest::absolute(0.03, 1e-12));
    CHECK(point.budget.dofEffective == mwtest::relative(2.0, 1e-9));
    // Table G.2: t_95.45(2) = 4.53.
    CHECK(point.budget.coverageFactor == mwtest::absolute(4.53, 0.005));
    CHECK_FALSE(result.advice.has_value()); // one point: no fit
}

TEST_CASE("readings are grouped by point index when one is given") {
    EvaluationInput input;
    input.range = {0.0, 10.0, ScaleType::ZeroAtEnd, {}};
    input.classIndex = 1.5;
    input.readings = {{4.98, 5.0, Direction::Up, 1, 2}, {5.02, 5.0, Direction::Down, 1, 2}};
    const EvaluationResult result = evaluateRange(input);
    REQUIRE(result.points.size() == 1);
    CHECK(result.points[0].applied == mwtest::relative(5.0, 1e-12));
    CHECK(std::fabs(result.points[0].error) == mwtest::absolute(0.02, 1e-12));
}

TEST_CASE("bad input names what is wrong") {
    EvaluationInput input = syntheticMeter();
    input.readings.clear();
    CHECK_THROWS_WITH(evaluateRange(input), Catch::Contains("no readings"));
    input = syntheticMeter();
    input.readings[1].indicated = std::numeric_limits<double>::quiet_NaN();
    CHECK_THROWS_WITH(evaluateRange(input), Catch::Contains("reading 2"));
    input = syntheticMeter();
    input.classIndex = -1.0;
    CHECK_THROWS_WITH(evaluateRange(input), Catch::Contains("class index"));
    input.classIndex = -1e-9; // shown as given, not as -0.000000
    CHECK_THROWS_WITH(evaluateRange(input), Catch::Contains("got -1e-09"));
}

TEST_CASE("a warm room adds the coil model's temperature effect") {
    // Swamped movement: 5 Ω copper coil (IEC 60028, α20 = 0.00393 /K) with
    // 15 Ω manganin (α ≈ 0); room 28 °C against the 23 °C reference (IEC 60051-1). Current
    // falls by R(23)/R(28): (15 + 5(1 + 0.00393·3)) / (15 + 5(1 + 0.00393·8)) − 1.
    EvaluationInput input = syntheticMeter();
    TemperatureInfluence warm;
    warm.roomCelsius = 28.0;
    warm.coil = CoilCircuit{5.0, TempcoResistor{15.0, 0.0}, std::nullopt};
    input.temperature = warm;
    const PointResult top = evaluateRange(input).points[5];
    REQUIRE(top.components.size() == 3);
    const double shift = (15.0 + 5.0 * (1 + 0.00393 * 3)) / (15.0 + 5.0 * (1 + 0.00393 * 8)) - 1;
    CHECK(top.components[2].name == "temperature effect");
    CHECK(top.components[2].value == mwtest::relative(10.0 * std::fabs(shift), 1e-9));
    // About ¼ of copper's 0.393 %/K over 5 K (computed: α_eff = 0.000983 /K).
    CHECK(top.components[2].value == mwtest::relative(10.0 * 0.000983 * 5.0, 0.01));
}

TEST_CASE("a result near the limit is judged with the rounded-up U") {
    // ILAC G8:09/2019 4.2.3, w = U. Same budget as above at 10 V: k·u_c = 0.02335 V, reported
    // 0.024 V (JCGM 100:2008 7.2.6, rounded up). An error of 0.1263 V lies 0.0237 V inside the
    // 0.15 V limit: clear of a 0.023 V band (nearest rounding) or a 0.02335 V band (unrounded),
    // within the 0.024 V band. The conservative value must decide.
    EvaluationInput input = syntheticMeter();
    input.decision = {DecisionRule::GuardedAcceptance, 1.0};
    input.readings = {{10.0, 10.1263, Direction::Up, 1, -1}};
    const PointResult point = evaluateRange(input).points.at(0);
    REQUIRE(point.budget.expandedRounded == mwtest::relative(0.024, 1e-12));
    const ToleranceInterval tolerance{-0.15, 0.15};
    REQUIRE(decide(point.error, 0.023, tolerance, input.decision) == Outcome::Pass);
    REQUIRE(decide(point.error, point.budget.expanded, tolerance, input.decision) == Outcome::Pass);
    CHECK(point.decision == Outcome::ConditionalPass);
    // ANSI/NCSL Z540.3 Handbook TUR from the same U: 0.30 / 0.048 = 6.25, not 0.30 / 0.046.
    CHECK(point.tur.value_or(0.0) == mwtest::relative(6.25, 1e-12));
}

TEST_CASE("an applied value off the range's scale is refused naming the reading") {
    // A 20 V reading on a 0-10 V range cannot be a test point of that range.
    EvaluationInput input = syntheticMeter();
    input.readings.push_back({20.0, 20.1, Direction::Up, 1, -1});
    CHECK_THROWS_AS(evaluateRange(input), std::invalid_argument);
    CHECK_THROWS_WITH(evaluateRange(input), Catch::Contains("reading 13") &&
                                                Catch::Contains("20.00 V") &&
                                                Catch::Contains("0.000 V … 10.00 V"));
    input = syntheticMeter();
    input.readings[0].applied = -2.5;
    CHECK_THROWS_WITH(evaluateRange(input), Catch::Contains("reading 1"));
    // Within a fifth of the span beyond either end: the pointer set on the end mark of a meter
    // that reads low (or high) needs more (or less) than the range from the standard.
    input = syntheticMeter();
    input.readings.push_back({10.4, 10.0, Direction::Up, 1, -1});
    input.readings.push_back({-2.0, -1.9, Direction::Up, 1, -1});
    CHECK_NOTHROW(evaluateRange(input));
    input.readings.back().applied = -2.01;
    CHECK_THROWS_WITH(evaluateRange(input), Catch::Contains("reading 14"));
}

TEST_CASE("a centre-zero range accepts both signs up to its limits") {
    // Zero inside the scale, -5 … +5 mA (IEC 60051-1 scale type); a fifth of the 10 mA span.
    EvaluationInput input;
    input.unit = Unit::Ampere;
    input.range = {-5e-3, 5e-3, ScaleType::ZeroInside, {}};
    input.classIndex = 2.5;
    input.readings = {{-5e-3, -5.01e-3, Direction::Up, 1, -1}, {7e-3, 7e-3, Direction::Up, 1, -1}};
    CHECK(evaluateRange(input).points.size() == 2);
    input.readings.push_back({7.1e-3, 7.1e-3, Direction::Up, 1, -1});
    CHECK_THROWS_WITH(evaluateRange(input),
                      Catch::Contains("reading 3") && Catch::Contains("7.100 mA"));
}

TEST_CASE("errors are named by a structured error with field and reading number") {
    EvaluationInput input = syntheticMeter();
    input.readings[3].applied = 20.0;
    try {
        evaluateRange(input);
        FAIL("an applied value off the scale must be refused");
    } catch (const EvaluationError& error) {
        CHECK(error.field() == "applied");
        CHECK(error.readingNumber() == std::optional<std::size_t>(4));
        CHECK_THAT(error.detail(), Catch::StartsWith("has an applied value of 20.00 V"));
    }
    input = syntheticMeter();
    input.classIndex = 0.0;
    try {
        evaluateRange(input);
        FAIL("a class index of 0 must be refused");
    } catch (const EvaluationError& error) {
        CHECK(error.field() == "class index");
        CHECK_FALSE(error.readingNumber().has_value());
    }
    input = syntheticMeter();
    input.decision = {DecisionRule::GuardedBinary, -0.5};
    CHECK_THROWS_AS(evaluateRange(input), EvaluationError);
    input = syntheticMeter();
    input.probability = 1.2;
    CHECK_THROWS_AS(evaluateRange(input), EvaluationError);
}

TEST_CASE("a budget without reference or divisions says what it leaves out and gives no TUR") {
    // A TUR is the ratio of the tolerance to the uncertainty of the calibration process
    // (ANSI/NCSL Z540.3 Handbook); without the reference standard's part there is none to
    // state. ISO/IEC 17025:2017 7.8.4.1 a) asks for the uncertainty with the result.
    EvaluationInput input = syntheticMeter();
    input.reference.reset();
    input.divisions = 0;
    const EvaluationResult result = evaluateRange(input);
    REQUIRE(result.omittedComponents.size() == 2);
    CHECK(result.omittedComponents[0].name == "reference standard");
    CHECK(result.omittedComponents[1].name == "readability of the scale");
    for (const PointResult& point : result.points) {
        CHECK_FALSE(point.tur.has_value());
        CHECK(point.turText.empty());
        CHECK_FALSE(point.turBelowMinimum);
    }
    CHECK_THAT(result.statement,
               Catch::Contains("budget is incomplete") &&
                   Catch::Contains("reference standard and readability of the scale") &&
                   Catch::Contains("No reference standard is recorded"));
    CHECK(std::any_of(result.cautions.begin(), result.cautions.end(), [](const std::string& c) {
        return c.find("Left out of the uncertainty budget: reference standard") == 0;
    }));
    // The complete budget says nothing of the kind.
    const EvaluationResult complete = evaluateRange(syntheticMeter());
    CHECK(complete.omittedComponents.empty());
    CHECK_THAT(complete.statement, !Catch::Contains("incomplete"));
}

TEST_CASE("the statement follows the phase and names standard, failing points and reference") {
    // ISO/IEC 17025:2017 7.8.4.1 d) as-found and as-left results; 7.8.6.2 b) the
    // specification, here IEC 60051-1:2016 with the class series of IEC 60051-2.
    EvaluationInput input = syntheticMeter();
    input.phase = Phase::AsLeft;
    input.referenceIdentity = "calibrator CAL-7, certificate 2024-118";
    const EvaluationResult result = evaluateRange(input);
    CHECK_THAT(result.statement, Catch::StartsWith("As-left results at 6 test points"));
    CHECK_THAT(result.statement, Catch::Contains("IEC 60051-1:2016 and IEC 60051-2"));
    // The 10 V point fails by 0.16 V, shown to U's last digit (24 mV: JCGM 100:2008 7.2.6).
    CHECK_THAT(result.statement, Catch::Contains("Points that did not pass: 10.00 V (error "
                                                 "+160 mV, fail)"));
    CHECK_THAT(result.statement,
               Catch::Contains("Reference standard: calibrator CAL-7, certificate 2024-118, "
                               "taken as \u00B1(0.02 % of reading + 0.01 % of range)"));
    input.phase = Phase::AsFound;
    CHECK_THAT(evaluateRange(input).statement, Catch::StartsWith("As-found results"));
}

TEST_CASE("the reference's range term is taken on the standard's range when given") {
    // ±(0.02 % rdg + 0.01 % rng): on a 100 V range of the standard the range term at 10 V is
    // 10 mV, not 1 mV; half-width 2 mV + 10 mV = 12 mV, rectangular (JCGM 100:2008 4.3.7).
    EvaluationInput input = syntheticMeter();
    input.referenceRangeValue = 100.0;
    const EvaluationResult given = evaluateRange(input);
    CHECK(given.points[5].components[0].value == mwtest::relative(0.012, 1e-12));
    CHECK_FALSE(given.referenceRangeAssumed);
    const EvaluationResult assumed = evaluateRange(syntheticMeter());
    CHECK(assumed.points[5].components[0].value == mwtest::relative(0.003, 1e-12));
    CHECK(assumed.referenceRangeAssumed);
    CHECK(assumed.referenceRangeValue == 10.0);
    CHECK(std::any_of(assumed.cautions.begin(), assumed.cautions.end(), [](const auto& c) {
        return c.find("taken on 10.00 V, the meter range's limit") != std::string::npos;
    }));
}

TEST_CASE("a certificate's degrees of freedom enter Welch-Satterthwaite") {
    // U = 20 mV, k = 2, ν = 8 alone in the budget: u = 10 mV with ν_eff = 8 (JCGM 100:2008
    // G.4.1), k = t_95.45(8) = 2.37 (Table G.2), U = 23.7 mV -> 24 mV rounded up (7.2.6).
    EvaluationInput input = syntheticMeter();
    input.divisions = 0;
    input.reference = parseReferenceSpec("U=20mV,k=2,dof=8", Unit::Volt);
    const PointResult top = evaluateRange(input).points[5];
    CHECK(top.budget.dofEffective == mwtest::relative(8.0, 1e-12));
    CHECK(top.budget.coverageFactor == mwtest::absolute(2.37, 0.005));
    CHECK(top.budget.expandedRounded == mwtest::relative(0.024, 1e-12));
}

TEST_CASE("specific risk uses the t-distribution at the point's effective dof") {
    // JCGM 106:2012 specific risk, t-distribution scaled by u_c at ν_eff (truncated as for k,
    // JCGM 100:2008 G.4.1); Boost.Math as the reference. Three repeats at 9 V of a 10 V class
    // 1.5 meter: errors 0.12, 0.14, 0.13 V, s = 0.01 V, u = s/√3, ν = 2.
    EvaluationInput input;
    input.range = {0.0, 10.0, ScaleType::ZeroAtEnd, {}};
    input.classIndex = 1.5;
    input.readings = {{9.0, 9.12, Direction::Up, 1, -1},
                      {9.0, 9.14, Direction::Up, 2, -1},
                      {9.0, 9.13, Direction::Up, 3, -1}};
    const PointResult point = evaluateRange(input).points.at(0);
    REQUIRE(point.budget.dofEffective == mwtest::relative(2.0, 1e-9));
    const double u = 0.01 / std::sqrt(3.0);
    const boost::math::students_t_distribution<double> t(2.0);
    const double expected =
        boost::math::cdf(t, (0.13 - 0.15) / u) + boost::math::cdf(t, (-0.15 - 0.13) / u);
    CHECK(point.decision == Outcome::Pass);
    REQUIRE(point.specificRisk);
    CHECK(*point.specificRisk == mwtest::relative(expected, 1e-6));
    CHECK(point.riskDof == 2.0);
    // The normal law at the same u would claim a risk several times smaller.
    CHECK(*point.specificRisk > 3.0 * specificRisk(0.13, u, {-0.15, 0.15}));
}

TEST_CASE("binary statement with guard band in an evaluation") {
    // ILAC G8:09/2019 4.2.2, w = U = 24 mV: 0.14 V at 8 V lies beyond the acceptance limit
    // 0.126 V and fails; 0.12 V at 6 V passes; no conditional outcome exists.
    EvaluationInput input = syntheticMeter();
    input.decision = {DecisionRule::GuardedBinary, 1.0};
    const EvaluationResult result = evaluateRange(input);
    CHECK(result.points[3].decision == Outcome::Pass);
    CHECK(result.points[4].decision == Outcome::Fail);
    CHECK(result.overall == Outcome::Fail);
    CHECK_THAT(result.statement, Catch::Contains("binary statement with guard band w = 1 \u00D7 U "
                                                 "(ILAC G8:09/2019 4.2.2)"));
}

TEST_CASE("simple acceptance with a TUR below 4:1 carries a caution") {
    // ANSI/NCSL Z540.3 5.3 fallback TUR >= 4:1; the limit here is 0.15 V and a reference of
    // ±50 mV (rectangular, u = 28.9 mV, U = 58 mV) gives 0.30 / 0.116 = 2.5, shown as 2.5:1.
    EvaluationInput input = syntheticMeter();
    input.divisions = 0;
    input.reference = parseReferenceSpec("50mV", Unit::Volt);
    const EvaluationResult result = evaluateRange(input);
    CHECK(result.points[5].turBelowMinimum);
    CHECK(result.points[5].turText == "2.5:1");
    CHECK(std::any_of(result.cautions.begin(), result.cautions.end(), [](const auto& c) {
        return c.find("TUR below 4:1 at 6 points") != std::string::npos;
    }));
    input.decision = {DecisionRule::GuardedAcceptance, 1.0};
    const EvaluationResult guarded = evaluateRange(input);
    CHECK(std::none_of(guarded.cautions.begin(), guarded.cautions.end(),
                       [](const auto& c) { return c.find("TUR below 4:1") != std::string::npos; }));
}

TEST_CASE("a voltage at the hazardous-live limits gives the IEC 61010-1 caution") {
    // IEC 61010-1 6.3.1 a): 60 V DC, 30 V rms / 42.4 V peak.
    EvaluationInput input;
    input.range = {0.0, 300.0, ScaleType::ZeroAtEnd, {}};
    input.classIndex = 1.5;
    input.readings = {{100.0, 100.5, Direction::Up, 0, -1}, {300.0, 301.0, Direction::Up, 0, -1}};
    const EvaluationResult high = evaluateRange(input);
    REQUIRE(high.hazardCaution);
    CHECK_THAT(*high.hazardCaution, Catch::Contains("IEC 61010-1"));
    CHECK(high.cautions.front() == *high.hazardCaution);
    // 50 V is below the DC limit but above the AC one.
    input.range.upper = 50.0;
    input.readings = {{10.0, 10.1, Direction::Up, 0, -1}, {50.0, 50.2, Direction::Up, 0, -1}};
    CHECK_FALSE(evaluateRange(input).hazardCaution.has_value());
    input.kind = InstrumentKind::BridgeAcVoltmeter;
    CHECK(evaluateRange(input).hazardCaution.has_value());
    // Currents are not voltages.
    input.kind = InstrumentKind::DcAmmeter;
    input.unit = Unit::Ampere;
    CHECK_FALSE(evaluateRange(input).hazardCaution.has_value());
}

TEST_CASE("a meter passing at two thirds of its limit needs no adjustment") {
    // Invented readings of a 10 V class 1.5 meter (limit 0.15 V) read to 0.02 V: errors up to
    // 0.10 V (67 % of the limit), a zero offset of 0.06 V and reading scatter (residuals up to
    // 0.036 V, under a quarter of the limit). Advice must not send a good meter for repair
    // (our policy: advise adjustment above 80 % of the limit, name only effects of a quarter
    // of the limit that stand out from U).
    EvaluationInput input = syntheticMeter();
    input.readings.clear();
    const double errors[] = {0.04, 0.10, 0.06, 0.08, 0.04, 0.10};
    const double applied[] = {0.0, 2.0, 4.0, 6.0, 8.0, 10.0};
    for (int i = 0; i < 6; ++i) {
        input.readings.push_back({applied[i], applied[i] + errors[i], Direction::Up, 0, -1});
    }
    input.resistor = RangeResistor{9900.0, 100.0, false, std::nullopt, 1.0, ESeries::E96};
    const EvaluationResult result = evaluateRange(input);
    CHECK(result.overall == Outcome::Pass);
    REQUIRE(result.advice);
    CHECK_FALSE(result.advice->adjustmentNeeded);
    CHECK(result.advice->worstErrorFractionOfLimit == mwtest::relative(0.10 / 0.15, 1e-9));
    CHECK(result.advice->cause == LikelyCause::Zero); // named only as a way to gain margin
    CHECK(result.advice->alsoSignificant.empty());
    CHECK_THAT(result.advice->explanation, Catch::StartsWith("no adjustment needed"));
    CHECK_THAT(result.advice->explanation, !Catch::Contains("repair"));
    CHECK_FALSE(result.correctedResistorOhms.has_value()); // no span effect worth trimming
}
