// Zero + span fit and the likely cause, on synthetic errors with known zero, span,
// non-linearity and hysteresis (invented demo data; the fit is ordinary least squares).
#include "core/advice/advice.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>

using namespace mw;

namespace {

// Errors of a 0-10 range: zero z, span s, hysteresis h (down − up), plus an extra error.
std::vector<PointErrors> synthetic(double z, double s, double h, double (*extra)(double)) {
    std::vector<PointErrors> points;
    for (const double a : {1.0, 2.0, 4.0, 6.0, 8.0, 10.0}) {
        const double e = z + (s - 1.0) * a + extra(a);
        points.push_back({a, e - h / 2.0, e + h / 2.0});
    }
    return points;
}

double none(double) {
    return 0.0;
}

AdviceInput adviceFor(InstrumentKind kind, std::vector<PointErrors> points) {
    AdviceInput input;
    input.kind = kind;
    input.upperLimit = 10.0;
    input.permissibleError = 0.15; // class 1.5 on 10 V
    input.points = std::move(points);
    return input;
}

} // namespace

TEST_CASE("the fit recovers a known zero and span exactly") {
    const ZeroSpanFit fit = fitZeroSpan(synthetic(-0.03, 0.995, 0.0, none));
    CHECK(fit.zeroOffset == mwtest::absolute(-0.03, 1e-12));
    CHECK(fit.spanFactor == mwtest::relative(0.995, 1e-12));
    CHECK(fit.nonlinearity == mwtest::absolute(0.0, 1e-12));
    CHECK(maxHysteresis(synthetic(0.0, 1.0, 0.04, none)) == mwtest::absolute(0.04, 1e-12));
}

TEST_CASE("each dominant effect is named") {
    const Advice zero =
        adviseAdjustment(adviceFor(InstrumentKind::DcVoltmeter, synthetic(0.08, 1.0, 0.0, none)));
    CHECK(zero.cause == LikelyCause::Zero);
    CHECK_THAT(zero.explanation, Catch::Contains("mechanical zero"));

    const Advice span =
        adviseAdjustment(adviceFor(InstrumentKind::DcAmmeter, synthetic(0.0, 0.99, 0.0, none)));
    CHECK(span.cause == LikelyCause::Span);
    CHECK(span.spanEffect == mwtest::absolute(0.1, 1e-12));
    CHECK_THAT(span.explanation, Catch::Contains("shunt"));

    // Hysteresis counts with half its width, the part the worse direction adds to the error:
    // 0.12 V between up and down is 0.06 V of error, 40 % of the limit.
    const Advice friction =
        adviseAdjustment(adviceFor(InstrumentKind::DcVoltmeter, synthetic(0.0, 1.0, 0.12, none)));
    CHECK(friction.cause == LikelyCause::Friction);
    CHECK_THAT(friction.explanation, Catch::Contains("pivots"));

    const Advice fine = adviseAdjustment(
        adviceFor(InstrumentKind::DcVoltmeter, synthetic(0.01, 1.001, 0.01, none)));
    CHECK(fine.cause == LikelyCause::None);
    CHECK(fine.alsoSignificant.empty());
}

TEST_CASE("non-linearity at the low end of a rectifier scale points at the diode") {
    // Shape only: a rectifier reads low at small signals (forward drop), common practice.
    auto diode = [](double a) {
        return -0.2 / a;
    };
    const Advice rect = adviseAdjustment(
        adviceFor(InstrumentKind::BridgeAcVoltmeter, synthetic(0.0, 1.0, 0.0, diode)));
    CHECK(rect.cause == LikelyCause::RectifierNonlinearity);
    CHECK_THAT(rect.explanation, Catch::Contains("rectifier"));
    // The same shape on a DC meter is the scale or the movement.
    const Advice dc =
        adviseAdjustment(adviceFor(InstrumentKind::DcVoltmeter, synthetic(0.0, 1.0, 0.0, diode)));
    CHECK(dc.cause == LikelyCause::ScaleNonlinearity);
}

TEST_CASE("a predicted rectifier curve is compared with the residuals") {
    auto bump = [](double a) {
        return 0.15 * std::sin(a / 10.0 * 3.14159);
    };
    AdviceInput input =
        adviceFor(InstrumentKind::HalfWaveAcVoltmeter, synthetic(0.0, 1.0, 0.0, bump));
    std::vector<double> predicted;
    for (const PointErrors& p : input.points) {
        predicted.push_back(bump(p.applied) * 0.8); // same shape, other size
    }
    input.predictedErrors = predicted;
    CHECK(adviseAdjustment(input).cause == LikelyCause::RectifierNonlinearity);
    for (double& value : *input.predictedErrors) {
        value = -value; // opposite shape
    }
    CHECK(adviseAdjustment(input).cause == LikelyCause::ScaleNonlinearity);
}

TEST_CASE("a fit needs two distinct applied values") {
    CHECK_THROWS_AS(fitZeroSpan({{5.0, 0.1, 0.2}}), std::invalid_argument);
    CHECK_THROWS_AS(fitZeroSpan({{5.0, 0.1, {}}, {5.0, 0.2, {}}}), std::invalid_argument);
    CHECK_THROWS_WITH(fitZeroSpan({{5.0, {}, {}}, {6.0, 0.2, {}}}), Catch::Contains("no reading"));
}

TEST_CASE("a point without readings is named with its applied value in its unit") {
    // Small values must not print as 0.000000 (std::to_string): 12 µA on an ammeter range.
    const std::vector<PointErrors> points{{0.0, 0.1e-6, {}}, {12e-6, {}, {}}};
    CHECK_THROWS_WITH(fitZeroSpan(points, Unit::Ampere), Catch::Contains("point 2") &&
                                                             Catch::Contains("12.00 µA") &&
                                                             Catch::Contains("no reading"));
    AdviceInput input = adviceFor(InstrumentKind::DcVoltmeter, {{0.0, 0.0, {}}, {2.5e-3, {}, {}}});
    CHECK_THROWS_WITH(adviseAdjustment(input), Catch::Contains("2.500 mV"));
}

TEST_CASE("causes are ranked by how much of the error each explains") {
    // Invented errors: zero +0.03 V, span 1.012 (0.12 V at 10 V) and hysteresis 0.02 V on a
    // class 1.5, 10 V meter (limit 0.15 V): the span explains most of the worst error, the zero
    // a fifth of the limit (not significant at a quarter), the hysteresis almost nothing.
    const Advice advice = adviseAdjustment(
        adviceFor(InstrumentKind::DcVoltmeter, synthetic(0.03, 1.012, 0.02, none)));
    REQUIRE(advice.effects.size() == 4);
    CHECK(advice.effects[0].cause == LikelyCause::Span);
    CHECK(advice.effects[0].size == mwtest::absolute(0.12, 1e-12));
    CHECK(advice.effects[0].fractionOfLimit == mwtest::relative(0.8, 1e-9));
    CHECK(advice.effects[1].cause == LikelyCause::Zero);
    CHECK_FALSE(advice.effects[1].significant);
    CHECK(advice.effects.back().size <= advice.effects[1].size);
    CHECK(advice.adjustmentNeeded); // worst error 0.16 V, 107 % of the limit
    CHECK(advice.cause == LikelyCause::Span);
    CHECK(advice.alsoSignificant.empty());
    CHECK_THAT(advice.explanation, Catch::StartsWith("adjustment advised"));
    CHECK_THAT(advice.explanation, !Catch::Contains("zero offset") && !Catch::Contains("pivots"));
}

TEST_CASE("an effect within the measurement uncertainty is not called significant") {
    // A zero of 0.05 V is a third of the limit, but with U = 0.06 V the readings cannot show it.
    AdviceInput input = adviceFor(InstrumentKind::DcVoltmeter, synthetic(0.05, 1.0, 0.0, none));
    CHECK(adviseAdjustment(input).cause == LikelyCause::Zero);
    input.expandedUncertainty = 0.06;
    const Advice advice = adviseAdjustment(input);
    CHECK(advice.cause == LikelyCause::None);
    CHECK_FALSE(advice.adjustmentNeeded); // 0.05 V is a third of the limit
    CHECK_THAT(advice.explanation, Catch::StartsWith("no adjustment needed"));
}

TEST_CASE("a failing meter with no clear cause is told to measure again, not to repair") {
    // Errors up to 0.13 V (87 % of the limit) that no single effect explains beyond U.
    AdviceInput input = adviceFor(InstrumentKind::DcVoltmeter, synthetic(0.0, 1.0, 0.0, none));
    input.points[2].errorUp = 0.13;
    input.points[2].errorDown = 0.13;
    input.expandedUncertainty = 0.14;
    const Advice advice = adviseAdjustment(input);
    CHECK(advice.adjustmentNeeded);
    CHECK(advice.cause == LikelyCause::None);
    CHECK_THAT(advice.explanation,
               Catch::Contains("repeat the readings") && !Catch::Contains("repair"));
}
