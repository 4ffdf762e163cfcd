// Staircase interval adjustment on a known sequence of in/out-of-tolerance results.
#include "core/interval/interval.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>

using namespace mw;
using namespace std::chrono;

namespace {

AsFoundRecord record(int y, unsigned m, bool in, double worst) {
    return {sys_days{year{y} / month{m} / day{1}}, in, worst};
}

} // namespace

TEST_CASE("shortening step at equilibrium with the reliability target") {
    // Our own derivation, not a published RP-1 value: the b that keeps the NCSL RP-1 A1
    // multiplicative staircase stationary at reliability R, b = 1 − (1 + a)^(−R/(1−R)), computed
    // by hand: R = 0.90, a = 0.10 -> 1 − 1.1^−9 = 0.576; R = 0.85, a = 0.10 -> 0.417.
    CHECK(shortenFraction(0.10, 0.90) == mwtest::absolute(0.576, 0.0005));
    CHECK(shortenFraction(0.10, 0.85) == mwtest::absolute(0.417, 0.0005));
    CHECK_THROWS_AS(shortenFraction(0.1, 1.0), std::invalid_argument);
}

TEST_CASE("the staircase lengthens, keeps and shortens on a known sequence") {
    // ILAC-G24:2007 / OIML D 10 method 1: lengthen when in tolerance, shorten when out; NCSL
    // RP-1 A1: by I(1 + a) and I(1 − b); our own keep zone: in tolerance above 80 % of the limit
    // (the 80 % from memory) keeps the interval. Arithmetic by hand, a = 0.10, R = 0.90.
    const std::vector<AsFoundRecord> history{
        record(2019, 1, true, 0.30),  // 365 × 1.1 = 401.5
        record(2020, 2, true, 0.50),  // × 1.1 = 441.65
        record(2021, 5, true, 0.90),  // kept
        record(2022, 7, false, 1.20), // × (1 − b) = 441.65 × 1.1^−9 = 187.30
        record(2022, 12, true, 0.40), // × 1.1 = 206.03
    };
    const IntervalRecommendation result = recommendInterval(365, history);
    REQUIRE(result.steps.size() == 5);
    CHECK(result.steps[0].kind == IntervalStepKind::Lengthen);
    CHECK(result.steps[1].intervalDays == mwtest::relative(441.65, 1e-12));
    CHECK(result.steps[2].kind == IntervalStepKind::Keep);
    CHECK(result.steps[3].kind == IntervalStepKind::Shorten);
    CHECK(result.steps[3].intervalDays == mwtest::relative(441.65 * std::pow(1.1, -9.0), 1e-12));
    CHECK(result.recommendedDays == 206);
    CHECK(result.inToleranceCount == 4);
    CHECK(result.observedReliability == mwtest::relative(0.8, 1e-12));
    CHECK_THAT(result.method, Catch::Contains("ILAC-G24") && Catch::Contains("RP-1") &&
                                  Catch::Contains("our own keep zone") &&
                                  Catch::Contains("our own step"));
}

TEST_CASE("with the keep zone off the staircase is the plain method 1 rule") {
    // ILAC-G24:2007 / OIML D 10 method 1: every in-tolerance result lengthens, every
    // out-of-tolerance result shortens; steps of NCSL RP-1 A1 with a = 0.10, b = 1 − 1.1^−9.
    StaircaseSettings plain;
    plain.marginFraction = 1.0;
    const std::vector<AsFoundRecord> history{
        record(2019, 1, true, 0.95), record(2020, 1, true, 1.0), record(2021, 1, false, 1.05)};
    const IntervalRecommendation result = recommendInterval(365, history, plain);
    REQUIRE(result.steps.size() == 3);
    CHECK(result.steps[0].kind == IntervalStepKind::Lengthen);
    CHECK(result.steps[1].kind == IntervalStepKind::Lengthen);
    CHECK(result.steps[2].kind == IntervalStepKind::Shorten);
    CHECK(result.steps[2].intervalDays ==
          mwtest::relative(365.0 * 1.1 * 1.1 * std::pow(1.1, -9.0), 1e-12));
    // At equilibrium (9 in, 1 out, in any order) the interval returns to where it started.
    std::vector<AsFoundRecord> ten(9, record(2020, 1, true, 0.5));
    ten.push_back(record(2020, 1, false, 1.5));
    CHECK(recommendInterval(365, ten, plain).steps.back().intervalDays ==
          mwtest::relative(365.0, 1e-12));
}

TEST_CASE("staircase settings out of range are refused naming the setting") {
    StaircaseSettings settings;
    settings.marginFraction = 1.2;
    CHECK_THROWS_WITH(recommendInterval(365, {}, settings), Catch::Contains("keep-zone"));
    settings = {};
    settings.lengthenFraction = 0.0;
    CHECK_THROWS_WITH(recommendInterval(365, {}, settings), Catch::Contains("lengthening"));
    settings = {};
    settings.maximumDays = 10;
    CHECK_THROWS_WITH(recommendInterval(365, {}, settings), Catch::Contains("minimum days"));
}

TEST_CASE("the interval stays within its bounds") {
    StaircaseSettings settings;
    settings.maximumDays = 400;
    std::vector<AsFoundRecord> good(5, record(2020, 1, true, 0.1));
    CHECK(recommendInterval(365, good, settings).recommendedDays == 400);
    std::vector<AsFoundRecord> bad(6, record(2020, 1, false, 2.0));
    CHECK(recommendInterval(365, bad, settings).recommendedDays == settings.minimumDays);
}

TEST_CASE("history out of date order is refused naming the record") {
    const std::vector<AsFoundRecord> history{record(2021, 1, true, 0.2),
                                             record(2020, 1, true, 0.2)};
    CHECK_THROWS_WITH(recommendInterval(365, history), Catch::Contains("record 2"));
    CHECK_THROWS_AS(recommendInterval(0, {}), std::invalid_argument);
}
