// Decision rules against ILAC G8:09/2019 and conformance probabilities against JCGM 106:2012.
#include "core/decision/decision.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <stdexcept>

using namespace mw;

namespace {

const ToleranceInterval kTolerance{-1.0, 1.0};
const DecisionSettings kSimple{DecisionRule::SimpleAcceptance, 0.0};
const DecisionSettings kGuarded{DecisionRule::GuardedAcceptance, 1.0};

} // namespace

TEST_CASE("simple acceptance passes on the limit and fails just beyond it") {
    // ILAC G8:09/2019 4.2.1: pass if the result is at or below the tolerance limit (w = 0).
    CHECK(decide(1.0, 0.5, kTolerance, kSimple) == Outcome::Pass);
    CHECK(decide(-1.0, 0.5, kTolerance, kSimple) == Outcome::Pass);
    CHECK(decide(1.0001, 0.5, kTolerance, kSimple) == Outcome::Fail);
    CHECK(decide(0.9, 5.0, kTolerance, kSimple) == Outcome::Pass); // U does not matter
    CHECK(guardBand(kSimple, 0.5) == 0.0);
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

TEST_CASE("the guard band scales with r") {
    // ILAC G8:09/2019 4.2.3 with w = r·U; r = 0.5 and U = 0.5 give w = 0.25.
    const DecisionSettings half{DecisionRule::GuardedAcceptance, 0.5};
    CHECK(guardBand(half, 0.5) == mwtest::relative(0.25, 1e-12));
    CHECK(decide(0.7, 0.5, kTolerance, half) == Outcome::Pass);
    CHECK(decide(0.8, 0.5, kTolerance, half) == Outcome::ConditionalPass);
    CHECK(decide(1.3, 0.5, kTolerance, half) == Outcome::Fail);
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
}

TEST_CASE("conformance probability for a normal model") {
    // JCGM 106:2012 clause 7 formula; vectors computed from it: T = ±1, u = 0.25.
    CHECK(conformanceProbability(0.5, 0.25, kTolerance) == mwtest::absolute(0.97725, 5e-6));
    CHECK(conformanceProbability(1.0, 0.25, kTolerance) == mwtest::absolute(0.5, 1e-9));
    CHECK(conformanceProbability(0.0, 0.25, kTolerance) == mwtest::absolute(0.999937, 5e-7));
    CHECK(probabilityOfFalseAccept(0.5, 0.25, kTolerance) == mwtest::absolute(0.02275, 5e-6));
    CHECK(measurementCapabilityIndex(0.25, kTolerance) == mwtest::relative(2.0, 1e-12));
    CHECK(conformanceProbability(0.5, 0.0, kTolerance) == 1.0);
    CHECK(probabilityOfFalseAccept(1.5, 0.0, kTolerance) == 1.0);
}

TEST_CASE("specific risk at the acceptance limit for common guard bands") {
    // ILAC G8:09/2019 guard-band examples, computed here for U = 2u:
    // w = U -> 2.28 %, w = 0.83 U -> 4.85 %, w = 1.5 U -> 0.135 %, w = 0 -> 50 %.
    const double u = 0.05;
    const double bigU = 2.0 * u;
    CHECK(probabilityOfFalseAccept(1.0 - bigU, u, kTolerance) == mwtest::absolute(0.02275, 5e-5));
    CHECK(probabilityOfFalseAccept(1.0 - 0.83 * bigU, u, kTolerance) ==
          mwtest::absolute(0.0485, 5e-4));
    CHECK(probabilityOfFalseAccept(1.0 - 1.5 * bigU, u, kTolerance) ==
          mwtest::absolute(0.00135, 5e-5));
    CHECK(probabilityOfFalseAccept(1.0, u, kTolerance) == mwtest::absolute(0.5, 1e-9));
}

TEST_CASE("decisions reject an empty tolerance and a negative uncertainty") {
    CHECK_THROWS_AS(decide(0.0, 0.1, ToleranceInterval{1.0, 1.0}, kSimple), std::invalid_argument);
    CHECK_THROWS_AS(decide(0.0, -0.1, kTolerance, kSimple), std::invalid_argument);
}
