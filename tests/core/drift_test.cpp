// Drift per point by least squares over time, with the t-test of the slope.
#include "core/interval/drift.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>

using namespace mw;
using namespace std::chrono;

namespace {

sys_days dayOffset(int days) {
    return sys_days{year{2020} / January / 1} + std::chrono::days{days};
}

} // namespace

TEST_CASE("a steady drift is significant and projected to the limit") {
    // Invented history: error grows 0.02 per 365.25 days from 0.01 with small scatter; limit 0.15.
    const double perDay = 0.02 / 365.25;
    const std::vector<DriftObservation> history{{dayOffset(0), 0.0100 + 0.0010},
                                                {dayOffset(365), 0.01 + perDay * 365 - 0.0010},
                                                {dayOffset(730), 0.01 + perDay * 730 + 0.0005},
                                                {dayOffset(1096), 0.01 + perDay * 1096},
                                                {dayOffset(1461), 0.01 + perDay * 1461 - 0.0005}};
    const DriftResult result = analyseDrift(history, 0.15);
    CHECK(result.slopePerYear == mwtest::absolute(0.02, 0.001));
    CHECK(result.significant);
    CHECK(result.pValue < 0.01);
    REQUIRE(result.projectedLimitDate);
    // The line reaches 0.15 after about (0.15 − 0.01)/0.02 = 7 years.
    const auto years = (*result.projectedLimitDate - dayOffset(0)).count() / 365.25;
    CHECK(years == mwtest::absolute(7.0, 0.3));
    CHECK_THAT(result.summary, Catch::Contains("reaches the limit"));
}

TEST_CASE("the slope test matches a hand computation") {
    // Ordinary least squares (NIST/SEMATECH e-Handbook 4.4.5): x = 0, 1, 2, 3 years,
    // y = 0, 2, 1, 3 -> b = 0.8, s(b)² = (1.8/2)/5, t = 0.8/√0.18 = 1.8856, ν = 2,
    // p = 2(1 − F_t(1.8856; 2)) = 0.2 (t_2 two-sided: p = 1 − t/√(2 + t²)).
    std::vector<DriftObservation> history;
    const double errors[] = {0.0, 2.0, 1.0, 3.0};
    for (int i = 0; i < 4; ++i) {
        history.push_back({sys_days{year{2020 + i} / January / 1}, errors[i]});
    }
    // Calendar years are 365 or 366 days; use the observation days as they fall.
    const DriftResult result = analyseDrift(history, 10.0);
    CHECK(result.dof == 2.0);
    CHECK(result.slopePerYear == mwtest::relative(0.8, 2e-3));
    const double t = result.tStatistic;
    CHECK(t == mwtest::relative(0.8 / std::sqrt(0.18), 2e-3));
    CHECK(result.pValue == mwtest::relative(1.0 - t / std::sqrt(2.0 + t * t), 1e-9));
    CHECK_FALSE(result.significant);
    CHECK_FALSE(result.projectedLimitDate.has_value());
    CHECK_THAT(result.summary, Catch::Contains("no significant drift"));
}

TEST_CASE("drift needs three results on different dates") {
    CHECK_THROWS_WITH(analyseDrift({{dayOffset(0), 0.0}, {dayOffset(9), 0.1}}, 1.0),
                      Catch::Contains("three"));
    CHECK_THROWS_AS(
        analyseDrift({{dayOffset(0), 0.0}, {dayOffset(0), 0.1}, {dayOffset(0), 0.2}}, 1.0),
        std::invalid_argument);
    CHECK_THROWS_AS(
        analyseDrift({{dayOffset(0), 0.0}, {dayOffset(1), 0.1}, {dayOffset(2), 0.2}}, 0.0),
        std::invalid_argument);
}
