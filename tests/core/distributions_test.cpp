// Student-t coverage factors and the normal law of the engine against GUM Table G.2 and, as an
// independent implementation, Boost.Math.
#include "core/uncertainty/distributions.h"

#include "support/approx.h"

#include <boost/math/distributions/normal.hpp>
#include <boost/math/distributions/students_t.hpp>

#include <catch2/catch.hpp>

#include <cmath>
#include <limits>
#include <stdexcept>
#include <utility>

using namespace mw;

namespace {

double boostCoverage(double probability, double dof) {
    const boost::math::students_t_distribution<double> t(dof);
    return boost::math::quantile(boost::math::complement(t, 0.5 * (1.0 - probability)));
}

} // namespace

TEST_CASE("the 95.45 % level is the coverage of ±2σ of a normal law") {
    // JCGM 100:2008 Table G.2 note: the 95.45 column is the fraction within ±2σ, erf(√2).
    CHECK(kProbabilityTwoSigma == mwtest::relative(std::erf(std::sqrt(2.0)), 1e-15));
    CHECK(coverageFactor(std::numeric_limits<double>::infinity()) == mwtest::relative(2.0, 1e-10));
}

TEST_CASE("coverage factors reproduce GUM Table G.2 at 95.45 %") {
    // JCGM 100:2008 Annex G, Table G.2, column p = 95.45 % (printed to two decimals).
    const std::pair<int, double> table[] = {
        {1, 13.97}, {2, 4.53},  {3, 3.31},  {4, 2.87},  {5, 2.65},  {6, 2.52},  {7, 2.43},
        {8, 2.37},  {9, 2.32},  {10, 2.28}, {11, 2.25}, {12, 2.23}, {13, 2.21}, {14, 2.20},
        {15, 2.18}, {16, 2.17}, {17, 2.16}, {18, 2.15}, {19, 2.14}, {20, 2.13}, {25, 2.11},
        {30, 2.09}, {35, 2.07}, {40, 2.06}, {45, 2.06}, {50, 2.05}};
    for (const auto& [dof, printed] : table) {
        INFO("dof = " << dof);
        CHECK(coverageFactor(dof) == mwtest::absolute(printed, 0.005));
    }
    CHECK(coverageFactor(100) == mwtest::absolute(2.025, 0.0005)); // Table G.2, ν = 100
}

TEST_CASE("coverage factors reproduce GUM Table G.2 at 95 % and 99 %") {
    // JCGM 100:2008 Table G.2, columns p = 95 % and p = 99 %.
    const std::pair<int, double> at95[] = {{1, 12.71}, {2, 4.30},  {5, 2.57},
                                           {10, 2.23}, {20, 2.09}, {50, 2.01}};
    for (const auto& [dof, printed] : at95) {
        CHECK(coverageFactor(dof, 0.95) == mwtest::absolute(printed, 0.005));
    }
    const std::pair<int, double> at99[] = {{1, 63.66}, {3, 5.84}, {16, 2.92}, {30, 2.75}};
    for (const auto& [dof, printed] : at99) {
        CHECK(coverageFactor(dof, 0.99) == mwtest::absolute(printed, 0.005));
    }
    CHECK(coverageFactor(100, 0.95) == mwtest::absolute(1.984, 0.0005));
    CHECK(coverageFactor(std::numeric_limits<double>::infinity(), 0.95) ==
          mwtest::absolute(1.960, 0.0005)); // Table G.2, ν = ∞
}

TEST_CASE("Student-t quantiles agree with Boost.Math for every integer dof 1 to 1000") {
    // Boost.Math students_t_distribution as an independent reference.
    for (const double p : {kProbabilityTwoSigma, 0.95, 0.99, 0.6827}) {
        for (int dof = 1; dof <= 1000; ++dof) {
            INFO("p = " << p << ", dof = " << dof);
            CHECK(studentTCoverage(p, dof) == mwtest::relative(boostCoverage(p, dof), 1e-9));
        }
    }
}

TEST_CASE("Student-t quantiles agree with Boost.Math for non-integer and very large dof") {
    // Boost.Math as the reference; non-integer ν arises from Welch–Satterthwaite.
    for (const double dof : {0.5, 1.5, 2.5, 16.66, 25.6, 1e4, 99999.0, 1e5, 1e6, 1e9}) {
        INFO("dof = " << dof);
        CHECK(studentTCoverage(kProbabilityTwoSigma, dof) ==
              mwtest::relative(boostCoverage(kProbabilityTwoSigma, dof), 1e-8));
    }
}

TEST_CASE("the Student-t CDF agrees with Boost.Math") {
    // Boost.Math students_t_distribution cdf as the reference.
    for (const double dof : {1.0, 2.0, 3.5, 10.0, 100.0, 1000.0}) {
        const boost::math::students_t_distribution<double> reference(dof);
        for (const double t : {-8.0, -2.0, -0.3, 0.0, 0.7, 2.0, 4.5, 30.0}) {
            INFO("dof = " << dof << ", t = " << t);
            CHECK(studentTCdf(t, dof) == mwtest::absolute(boost::math::cdf(reference, t), 1e-13));
        }
    }
}

TEST_CASE("the normal CDF and its inverse agree with Boost.Math") {
    // Boost.Math normal distribution as the reference.
    const boost::math::normal_distribution<double> normal;
    for (const double z : {-6.0, -2.0, -1.0, 0.0, 0.5, 1.96, 2.0, 3.0}) {
        CHECK(normalCdf(z) == mwtest::absolute(boost::math::cdf(normal, z), 1e-15));
    }
    for (const double p : {1e-9, 0.001, 0.02275, 0.8, 0.975, 0.999999}) {
        INFO("p = " << p);
        CHECK(normalQuantile(p) == mwtest::relative(boost::math::quantile(normal, p), 1e-10));
    }
    CHECK(normalQuantile(0.5) == mwtest::absolute(0.0, 1e-15));
}

TEST_CASE("the incomplete beta function meets closed forms") {
    // I_x(1, 1) = x and I_x(a, 1) = x^a (definition of the regularized incomplete beta).
    CHECK(regularizedIncompleteBeta(1.0, 1.0, 0.3) == mwtest::relative(0.3, 1e-13));
    CHECK(regularizedIncompleteBeta(3.0, 1.0, 0.4) == mwtest::relative(0.064, 1e-13));
    CHECK(regularizedIncompleteBeta(2.0, 5.0, 0.0) == 0.0);
    CHECK(regularizedIncompleteBeta(2.0, 5.0, 1.0) == 1.0);
}

TEST_CASE("coverage factors truncate the effective dof as GUM G.4.1 says") {
    // JCGM 100:2008 G.4.1: ν_eff is truncated to the next lower integer before Table G.2.
    CHECK(coverageFactor(16.66, 0.99) == coverageFactor(16.0, 0.99));
    CHECK(coverageFactor(0.4) == coverageFactor(1.0));
}

TEST_CASE("distribution functions reject impossible arguments") {
    CHECK_THROWS_AS(studentTCoverage(1.0, 5), std::domain_error);
    CHECK_THROWS_AS(studentTCoverage(0.95, 0.0), std::domain_error);
    CHECK_THROWS_AS(normalQuantile(0.0), std::domain_error);
    CHECK_THROWS_AS(coverageFactor(-3.0), std::domain_error);
    CHECK_THROWS_AS(regularizedIncompleteBeta(-1.0, 1.0, 0.5), std::domain_error);
}
