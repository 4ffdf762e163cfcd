// Decision rules against ILAC G8:09/2019 and conformance probabilities and specific risks
// against JCGM 106:2012, with Boost.Math as the independent reference for the t-distribution.
#include "core/decision/decision.h"

#include "core/uncertainty/distributions.h"
#include "support/approx.h"

#include <catch2/catch.hpp>

#include <boost/math/distributions/students_t.hpp>

#include <stdexcept>

using namespace mw;

namespace {

const ToleranceInterval kTolerance{-1.0, 1.0};
const DecisionSettings kSimple{DecisionRule::SimpleAcceptance, 0.0};
const DecisionSettings kGuarded{DecisionRule::GuardedAcceptance, 1.0};
const DecisionSettings kGuardedBinary{DecisionRule::GuardedBinary, 1.0};

} // namespace

TEST_CASE("simple acceptance passes on the limit and fails just beyond it") {
    // ILAC G8:09/2019 4.2.1: pass if the result is at or below the tolerance limit (w = 0).
    CHECK(decide(1.0, 0.5, kTolerance, kSimple) == Outcome::Pass);
    CHECK(decide(-1.0, 0.5, kTolerance, kSimple) == Outcome::Pass);
    CHECK(decide(1.0001, 0.5, kTolerance, kSimple) == Outcome::Fail);
    CHECK(decide(0.9, 5.0, kTolerance, kSimple) == Outcome::Pass); // U does not matter
    CHECK(guardBand(kSimple, 0.5) == 0.0);
}

TEST_CASE("an error equal to the limit in decimals is on the limit, not beyond it") {
    // IEC 60051-1: errors shall not exceed the limits; ILAC G8:09/2019 4.2.1: pass at the
    // limit. 10.15 − 10 is 0.15 in decimals but 0.15000000000000036 in binary arithmetic.
    const ToleranceInterval limit{-0.15, 0.15};
    REQUIRE(10.15 - 10.0 > 0.15); // the binary trap this guards against
    const ExactDecimal error = ExactDecimal::parse("10.15") - ExactDecimal::parse("10");
    const ExactTolerance exact = ExactTolerance::of(limit);
    CHECK(decide(ExactMean{error, 1}, ExactDecimal::parse("0.024"), exact, kSimple) ==
          Outcome::Pass);
    // The mean of 10.16 and 10.14 minus 10 is 0.15 exactly: sum 0.30 over 2 readings.
    const ExactMean mean{ExactDecimal::parse("0.16") + ExactDecimal::parse("0.14"), 2};
    CHECK(decide(mean, ExactDecimal::parse("0.024"), exact, kSimple) == Outcome::Pass);
    const ExactMean beyond{ExactDecimal::parse("0.301"), 2};
    CHECK(decide(beyond, ExactDecimal::parse("0.024"), exact, kSimple) == Outcome::Fail);
}

TEST_CASE("guarded acceptance with w = U gives the four ILAC G8 outcomes") {
    // ILAC G8:09/2019 4.2.3 zones with w = U: pass below T - w, conditional pass from T - w up
    // to T, conditional fail up to T + w, fail beyond. T = ±1, U = 0.5 (values of our own).
    const double u = 0.5;
    CHECK(decide(0.0, u, kTolerance, kGuarded) == Outcome::Pass);            // far inside
    CHECK(decide(0.49, u, kTolerance, kGuarded) == Outcome::Pass);           // just clear
    CHECK(decide(0.5, u, kTolerance, kGuarded) == Outcome::ConditionalPass); // at T - w
    CHECK(decide(0.8, u, kTolerance, kGuarded) == Outcome::ConditionalPass); // within U
    CHECK(decide(1.0, u, kTolerance, kGuarded) == Outcome::ConditionalPass); // on the limit
    CHECK(decide(1.2, u, kTolerance, kGuarded) == Outcome::ConditionalFail); // just outside
    CHECK(decide(1.5, u, kTolerance, kGuarded) == Outcome::ConditionalFail); // at T + w
    CHECK(decide(1.51, u, kTolerance, kGuarded) == Outcome::Fail);
    CHECK(decide(3.0, u, kTolerance, kGuarded) == Outcome::Fail); // far outside
    // The lower limit mirrors the upper one.
    CHECK(decide(-0.8, u, kTolerance, kGuarded) == Outcome::ConditionalPass);
    CHECK(decide(-1.3, u, kTolerance, kGuarded) == Outcome::ConditionalFail);
    CHECK(decide(-2.0, u, kTolerance, kGuarded) == Outcome::Fail);
}

TEST_CASE("binary statement with guard band passes only within the acceptance limits") {
    // ILAC G8:09/2019 4.2.2: pass if the result is at or below AL = TL − w, fail otherwise;
    // only two outcomes. T = ±1, U = 0.5, w = U (values of our own).
    const double u = 0.5;
    CHECK(decide(0.0, u, kTolerance, kGuardedBinary) == Outcome::Pass);
    CHECK(decide(0.5, u, kTolerance, kGuardedBinary) == Outcome::Pass); // on AL
    CHECK(decide(-0.5, u, kTolerance, kGuardedBinary) == Outcome::Pass);
    CHECK(decide(0.51, u, kTolerance, kGuardedBinary) == Outcome::Fail); // inside T, beyond AL
    CHECK(decide(1.0, u, kTolerance, kGuardedBinary) == Outcome::Fail);
    CHECK(decide(-1.2, u, kTolerance, kGuardedBinary) == Outcome::Fail);
    CHECK(guardBand(kGuardedBinary, 0.5) == 0.5);
    CHECK(hasGuardBand(DecisionRule::GuardedBinary));
    CHECK_FALSE(hasGuardBand(DecisionRule::SimpleAcceptance));
    // The acceptance limit T − w is decided exactly: 0.15 − 1 × 0.024 = 0.126.
    const ToleranceInterval limit{-0.15, 0.15};
    CHECK(decide(0.126, 0.024, limit, kGuardedBinary) == Outcome::Pass);
    CHECK(decide(0.1261, 0.024, limit, kGuardedBinary) == Outcome::Fail);
}

TEST_CASE("the guard band scales with r") {
    // ILAC G8:09/2019 4.2.3 with w = r·U; r = 0.5 and U = 0.5 give w = 0.25.
    const DecisionSettings half{DecisionRule::GuardedAcceptance, 0.5};
    CHECK(guardBand(half, 0.5) == mwtest::relative(0.25, 1e-12));
    CHECK(decide(0.7, 0.5, kTolerance, half) == Outcome::Pass);
    CHECK(decide(0.8, 0.5, kTolerance, half) == Outcome::ConditionalPass);
    CHECK(decide(1.3, 0.5, kTolerance, half) == Outcome::Fail);
    // w = 0.83 U (ISO 14253-1:2017 default, quoted with ILAC G8:09/2019, check-values.md 4.1):
    // 0.83 × 0.024 = 0.01992, so T − w = 0.13008 exactly; 4.2.3 passes only below it.
    const DecisionSettings iso{DecisionRule::GuardedAcceptance, 0.83};
    const ToleranceInterval limit{-0.15, 0.15};
    CHECK(decide(0.13007, 0.024, limit, iso) == Outcome::Pass);
    CHECK(decide(0.13008, 0.024, limit, iso) == Outcome::ConditionalPass);
    const DecisionSettings negative{DecisionRule::GuardedAcceptance, -1.0};
    CHECK_THROWS_AS(decide(0.0, 0.5, kTolerance, negative), std::invalid_argument);
    // The message shows the factor as given, even a tiny one (not "-0.000000").
    const DecisionSettings tiny{DecisionRule::GuardedAcceptance, -2e-9};
    CHECK_THROWS_WITH(decide(0.0, 0.5, kTolerance, tiny),
                      Catch::Contains("guard-band factor") && Catch::Contains("-2e-09"));
}

TEST_CASE("worse outcome orders pass, conditional pass, conditional fail, fail") {
    CHECK(worseOf(Outcome::Pass, Outcome::ConditionalPass) == Outcome::ConditionalPass);
    CHECK(worseOf(Outcome::ConditionalFail, Outcome::ConditionalPass) == Outcome::ConditionalFail);
    CHECK(worseOf(Outcome::Fail, Outcome::Pass) == Outcome::Fail);
    CHECK(isAccepted(Outcome::ConditionalPass));
    CHECK_FALSE(isAccepted(Outcome::ConditionalFail));
}

TEST_CASE("conformance probability for a normal model") {
    // JCGM 106:2012 clause 7 formula; vectors from check-values.md 4.1: T = ±1, u = 0.25.
    CHECK(conformanceProbability(0.5, 0.25, kTolerance) == mwtest::absolute(0.97725, 5e-6));
    CHECK(conformanceProbability(1.0, 0.25, kTolerance) == mwtest::absolute(0.5, 1e-9));
    CHECK(conformanceProbability(0.0, 0.25, kTolerance) == mwtest::absolute(0.999937, 5e-7));
    CHECK(specificRisk(0.5, 0.25, kTolerance) == mwtest::absolute(0.02275, 5e-6));
    CHECK(measurementCapabilityIndex(0.25, kTolerance) == mwtest::relative(2.0, 1e-12));
    CHECK(conformanceProbability(0.5, 0.0, kTolerance) == 1.0);
    CHECK(specificRisk(1.5, 0.0, kTolerance) == 1.0);
}

TEST_CASE("specific risk at the acceptance limit for common guard bands") {
    // ILAC G8:09/2019 guard-band examples, computed for U = 2u (check-values.md 4.1):
    // w = U -> 2.28 %, w = 0.83 U -> 4.85 %, w = 1.5 U -> 0.135 %, w = 0 -> 50 %.
    const double u = 0.05;
    const double bigU = 2.0 * u;
    CHECK(specificRisk(1.0 - bigU, u, kTolerance) == mwtest::absolute(0.02275, 5e-5));
    CHECK(specificRisk(1.0 - 0.83 * bigU, u, kTolerance) == mwtest::absolute(0.0485, 5e-4));
    CHECK(specificRisk(1.0 - 1.5 * bigU, u, kTolerance) == mwtest::absolute(0.00135, 5e-5));
    CHECK(specificRisk(1.0, u, kTolerance) == mwtest::absolute(0.5, 1e-9));
}

TEST_CASE("with finite degrees of freedom the scaled and shifted t-distribution is used") {
    // JCGM 106:2012 specific risk with the t PDF of the measurand (JCGM 101:2008 6.4.9, from
    // memory); Boost.Math's Student's t as the independent reference. T = ±1, u = 0.25.
    for (const double dof : {1.0, 2.0, 4.0, 9.0, 30.0}) {
        const boost::math::students_t_distribution<double> t(dof);
        for (const double y : {0.0, 0.5, 0.9, 1.0, 1.3}) {
            INFO("dof " << dof << ", y " << y);
            const double expected =
                boost::math::cdf(t, (y - 1.0) / 0.25) + boost::math::cdf(t, (-1.0 - y) / 0.25);
            CHECK(specificRisk(y, 0.25, kTolerance, dof) == mwtest::relative(expected, 1e-9));
            CHECK(conformanceProbability(y, 0.25, kTolerance, dof) ==
                  mwtest::absolute(1.0 - expected, 1e-12));
        }
    }
    // At y = T_U − k·u with k = t_p(ν) (JCGM 100:2008 G.3) the risk beyond T_U is the one tail
    // (1 − p)/2 whatever ν: 2.275 % for p = 95.45 %. T_L is put far away so that only that
    // tail counts; the normal law at the same y understates the risk.
    const ToleranceInterval upperOnly{-1000.0, 1.0};
    for (const double dof : {2.0, 5.0, 16.0}) {
        INFO("dof " << dof);
        const double k = coverageFactor(dof);
        const double risk = specificRisk(1.0 - k * 0.05, 0.05, upperOnly, dof);
        CHECK(risk == mwtest::relative((1.0 - kProbabilityTwoSigma) / 2.0, 1e-4));
        CHECK(specificRisk(1.0 - k * 0.05, 0.05, upperOnly) < 0.7 * risk);
    }
    CHECK_THROWS_AS(specificRisk(0.0, 0.25, kTolerance, 0.0), std::invalid_argument);
}

TEST_CASE("decisions reject an empty tolerance and a negative uncertainty") {
    CHECK_THROWS_AS(decide(0.0, 0.1, ToleranceInterval{1.0, 1.0}, kSimple), std::invalid_argument);
    CHECK_THROWS_AS(decide(0.0, -0.1, kTolerance, kSimple), std::invalid_argument);
}
