// Uncertainty budgets against the worked examples of JCGM 100:2008 and the GUM's divisors.
#include "core/uncertainty/budget.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>

using namespace mw;

namespace {

UncertaintyComponent standard(const char* name, double u, double sensitivity, double dof) {
    UncertaintyComponent c;
    c.name = name;
    c.value = u;
    c.distribution = Distribution::Normal;
    c.coverageK = 1.0;
    c.sensitivity = sensitivity;
    c.dof = dof;
    return c;
}

} // namespace

TEST_CASE("divisors of the Type B distributions") {
    // JCGM 100:2008 4.3.7 (rectangular a/√3), 4.3.9 (triangular a/√6); JCGM 101:2008 6.4.6
    // (arcsine a/√2); JCGM 100:2008 4.3.3 (normal U/k).
    UncertaintyComponent c;
    c.value = 1.5;
    c.distribution = Distribution::Rectangular;
    CHECK(standardUncertainty(c) == mwtest::absolute(0.87, 0.005)); // QUAM App. E.1: a = 1.5
    CHECK(divisor(c) == mwtest::relative(1.732051, 1e-6));
    c.distribution = Distribution::Triangular;
    CHECK(divisor(c) == mwtest::relative(2.449490, 1e-6));
    c.distribution = Distribution::UShaped;
    CHECK(divisor(c) == mwtest::relative(1.414214, 1e-6));
    c.distribution = Distribution::Normal;
    c.coverageK = 2.0;
    CHECK(standardUncertainty(c) == mwtest::relative(0.75, 1e-12));
    c.sensitivity = -3.0;
    CHECK(contribution(c) == mwtest::relative(2.25, 1e-12));
}

TEST_CASE("GUM H.1 end-gauge budget is reproduced to its printed digits") {
    // JCGM 100:2008 Annex H.1 (end-gauge calibration), all lengths in nm. Sensitivity
    // coefficients of δα and δθ: -l_S·θ = 50e6 nm × 0.1 °C and -l_S·α_S = -575 nm/°C.
    const std::vector<UncertaintyComponent> budget{
        standard("l_S, length of the standard", 25.0, 1.0, 18.0),
        standard("d, measured difference", 9.7, 1.0, 25.6),
        standard("alpha_S, expansion coefficient", 1.2e-6, 0.0, kInfiniteDof),
        standard("theta, deviation from 20 degC", 0.41, 0.0, kInfiniteDof),
        standard("delta alpha", 0.58e-6, 50e6 * 0.1, 50.0),
        standard("delta theta", 0.029, -50e6 * 11.5e-6, 2.0),
    };
    const BudgetResult result = evaluateBudget(budget, 0.99);
    CHECK(result.contributions[4] == mwtest::absolute(2.9, 0.05)); // H.1: 2.9 nm
    CHECK(result.contributions[5] == mwtest::absolute(16.6, 0.1)); // H.1: 16.6 nm
    CHECK(result.combined == mwtest::absolute(32.0, 0.5));         // H.1: u_c = 32 nm
    CHECK(result.dofEffective == mwtest::absolute(16.7, 0.05));    // H.1: ν_eff = 16.7
    CHECK(result.coverageFactor == mwtest::absolute(2.92, 0.005)); // H.1: t_99(16) = 2.92
    // H.1: U_99 = 93 nm. Unrounded k·u_c is 92.6 nm (computed), so rounding up (7.2.6)
    // reproduces the printed 93 nm as rounding to the nearest does.
    CHECK(result.expanded == mwtest::absolute(92.62, 0.005));
    CHECK(result.expandedRounded == mwtest::absolute(93.0, 1e-9));
}

TEST_CASE("GUM G.4.1 relative budget with Welch-Satterthwaite") {
    // JCGM 100:2008 G.4.1 example: relative uncertainties 0.25 % (ν 9), 0.57 % (ν 4),
    // 0.82 % (ν 14); u_c = 1.03 %, ν_eff = 19.0, t_95(19) = 2.09, U_95 = 2.2 %.
    const std::vector<UncertaintyComponent> budget{standard("X1", 0.25, 1.0, 9.0),
                                                   standard("X2", 0.57, 1.0, 4.0),
                                                   standard("X3", 0.82, 1.0, 14.0)};
    const BudgetResult result = evaluateBudget(budget, 0.95);
    CHECK(result.combined == mwtest::absolute(1.03, 0.005));
    // The example rounds u_c to 1.03 % before eq. G.2b (19.04); the unrounded value is 18.999.
    CHECK(result.dofEffective == mwtest::absolute(19.0, 0.05));
    CHECK(welchSatterthwaite({0.25, 0.57, 0.82}, {9, 4, 14}) == mwtest::absolute(19.0, 0.05));
    CHECK(coverageFactor(19.04, 0.95) == mwtest::absolute(2.09, 0.005));
    CHECK(result.expandedRounded == mwtest::absolute(2.2, 1e-9));
}

TEST_CASE("Welch-Satterthwaite ignores components with infinite dof") {
    // JCGM 100:2008 G.4.1: ν_i = ∞ terms contribute nothing to the denominator of eq. G.2b.
    CHECK(welchSatterthwaite({3.0, 4.0}, {kInfiniteDof, 4.0}) ==
          mwtest::relative(625.0 / 256.0 * 4.0, 1e-12));
    CHECK(std::isinf(welchSatterthwaite({3.0, 4.0}, {kInfiniteDof, kInfiniteDof})));
}

TEST_CASE("expanded uncertainty is rounded UP to two significant digits") {
    // JCGM 100:2008 7.2.6: at most two significant digits, and rounding up rather than to the
    // nearest digit is allowed (its example, from memory: u_c = 10.47 mΩ reported as 11 mΩ).
    // Never rounding an uncertainty down is common practice on calibration certificates.
    CHECK(roundUpToSignificant(10.47, 2) == mwtest::relative(11.0, 1e-12));
    CHECK(roundUpToSignificant(0.0234, 2) == mwtest::relative(0.024, 1e-12)); // nearest: 0.023
    CHECK(roundUpToSignificant(92.61, 2) == mwtest::relative(93.0, 1e-12));
    CHECK(roundUpToSignificant(0.0012345, 2) == mwtest::relative(0.0013, 1e-12));
    CHECK(roundUpToSignificant(9.91, 2) == mwtest::relative(10.0, 1e-12));  // into the next decade
    CHECK(roundUpToSignificant(-4.51, 2) == mwtest::relative(-4.6, 1e-12)); // magnitude up
    CHECK(roundUpToSignificant(0.0, 2) == 0.0);
    // Values already at two digits stay, binary noise included (0.1 + 0.2 = 0.30000000000000004).
    CHECK(roundUpToSignificant(0.023, 2) == mwtest::relative(0.023, 1e-12));
    CHECK(roundUpToSignificant(0.1 + 0.2, 2) == mwtest::relative(0.30, 1e-12));
    CHECK(roundUpToSignificant(2.0 * 0.0115, 2) == mwtest::relative(0.023, 1e-12));
    CHECK_THROWS_AS(roundUpToSignificant(1.0, 0), std::invalid_argument);
}

TEST_CASE("a coverage probability out of range is refused in percent") {
    UncertaintyComponent component;
    component.name = "half-width";
    component.value = 1.0;
    CHECK_THROWS_WITH(evaluateBudget({component}, 1.5),
                      Catch::Contains("probability") && Catch::Contains("150.0 %"));
    CHECK_THROWS_WITH(evaluateBudget({component}, -1e-12), Catch::Contains("-1.000e-10 %"));
}

TEST_CASE("the reported U of a budget is never below k times u_c") {
    // JCGM 100:2008 4.3.7: a rectangular half-width a gives u = a/√3; k = 2 for ν = ∞
    // (Table G.2, 95.45 %). Half-widths of our own choosing.
    for (const double halfWidth : {0.0101, 0.02022, 0.3333, 1.0, 7.77, 123.4}) {
        UncertaintyComponent component;
        component.name = "half-width";
        component.value = halfWidth;
        const BudgetResult result = evaluateBudget({component});
        CHECK(result.expanded == mwtest::relative(2.0 * halfWidth / std::sqrt(3.0), 1e-9));
        CHECK(result.expandedRounded >= result.expanded);
        CHECK(result.expandedRounded ==
              mwtest::relative(roundUpToSignificant(result.expanded, 2), 1e-15));
        // Two digits: the step is at most one unit of the second digit.
        CHECK(result.expandedRounded - result.expanded < 0.1 * result.expandedRounded);
    }
}

TEST_CASE("Type A from repeated observations") {
    // JCGM 100:2008 4.2.2-4.2.3: s(q_k) with n - 1, s(q̄) = s/√n; observations of our own.
    const std::vector<double> observations{10.0, 10.2, 9.9, 10.1, 9.8};
    CHECK(sampleStandardDeviation(observations) == mwtest::relative(std::sqrt(0.025), 1e-12));
    const auto typeA = typeAFromRepeats("repeats", observations);
    REQUIRE(typeA);
    CHECK(typeA->value == mwtest::relative(std::sqrt(0.025 / 5.0), 1e-12));
    CHECK(typeA->dof == 4.0);
    CHECK(typeA->typeA);
    CHECK_FALSE(typeAFromRepeats("one", {1.0}).has_value());
}

TEST_CASE("readability, resolution and temperature components") {
    // Common practice (EA-4/02): a reading quantised to d has u = (d/2)/√3.
    const UncertaintyComponent read = readabilityComponent(0.2, 0.2); // 50 div on 10 V, 1/5 div
    CHECK(standardUncertainty(read) == mwtest::relative(0.02 / std::sqrt(3.0), 1e-12));
    const UncertaintyComponent res = resolutionComponent("display", 0.001);
    CHECK(standardUncertainty(res) == mwtest::relative(0.0005 / std::sqrt(3.0), 1e-12));
    // Swamped coil: 5 Ω copper (IEC 60028, 0.00393 /K) + 15 Ω manganin -> 0.000983 /K
    // (computed); 5 K above 23 °C, reading 10 V.
    const UncertaintyComponent temp = temperatureComponent(10.0, 0.000983 * 5.0);
    CHECK(temp.value == mwtest::relative(0.04915, 1e-9));
    CHECK(temp.distribution == Distribution::Rectangular);
    CHECK_THROWS_AS(readabilityComponent(0.2, 0.0), std::invalid_argument);
}

TEST_CASE("test uncertainty ratio by the Z540.3 Handbook definition") {
    // ANSI/NCSL Z540.3 Handbook: TUR = (T_U - T_L) / (2 U95); vectors computed from it.
    CHECK(testUncertaintyRatio(-1.0, 1.0, 0.25) == mwtest::relative(4.0, 1e-12));
    CHECK(testUncertaintyRatio(-0.5, 0.5, 0.2) == mwtest::relative(2.5, 1e-12));
    CHECK(testUncertaintyRatio(-0.6, 0.2, 0.1) == mwtest::relative(4.0, 1e-12));
    CHECK_THROWS_AS(testUncertaintyRatio(1.0, -1.0, 0.1), std::invalid_argument);
}

TEST_CASE("TUR below 4:1 is decided exactly and shown rounded down to two digits") {
    // ANSI/NCSL Z540.3 Handbook TUR = span / (2U), 5.3 fallback 4:1 (check-values.md 4.2).
    // ±0.15 V with U = 0.0375 V is exactly 4:1, though 0.3 / 0.075 is 3.9999999999999996 in
    // binary arithmetic.
    const ExactDecimal span = ExactDecimal::parse("0.3");
    CHECK_FALSE(turBelowMinimum(span, ExactDecimal::parse("0.0375")));
    CHECK(turBelowMinimum(span, ExactDecimal::parse("0.03751")));
    CHECK(turRoundedDown(span, ExactDecimal::parse("0.0375")) == 4.0);
    CHECK(formatTur(turRoundedDown(span, ExactDecimal::parse("0.0375"))) == "4.0:1");
    // 3.98... is shown as 3.9, never flattered to 4.0; 6.25 as 6.2; 15.6 as 15.
    CHECK(formatTur(turRoundedDown(span, ExactDecimal::parse("0.03768"))) == "3.9:1");
    CHECK(formatTur(turRoundedDown(span, ExactDecimal::parse("0.024"))) == "6.2:1");
    CHECK(formatTur(turRoundedDown(span, ExactDecimal::parse("0.0096"))) == "15:1");
    CHECK(formatTur(turRoundedDown(ExactDecimal::parse("2"), ExactDecimal::parse("0.001"))) ==
          "1000:1");
    CHECK(std::isinf(turRoundedDown(span, ExactDecimal())));
}

TEST_CASE("a bad component is named in the error") {
    UncertaintyComponent bad;
    bad.name = "reference standard";
    bad.value = -1.0;
    CHECK_THROWS_WITH(evaluateBudget({bad}), Catch::Contains("reference standard"));
}
