// Normal and Student-t distributions by bracketed solves over the incomplete beta function, so
// that coverage factors need nothing beyond the standard library.
#include "core/uncertainty/distributions.h"

#include "core/units/quantity.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

constexpr double kTiny = 1e-300;
constexpr double kEpsilon = 1e-15;
constexpr int kMaxFractionTerms = 100000;
// Beyond this many degrees of freedom t and z differ by less than 1e-11 relative.
constexpr double kDofTreatedAsInfinite = 1e12;
// From here on lgamma differences in the beta front factor lose digits; the quantile comes
// from the asymptotic expansion of t in powers of 1/ν instead.
constexpr double kDofForExpansion = 1e5;

// Continued fraction of I_x(a, b) (modified Lentz); converges fast for x < (a+1)/(a+b+2).
double betaFraction(double a, double b, double x) {
    double c = 1.0;
    double d = 1.0 - (a + b) * x / (a + 1.0);
    d = 1.0 / (std::fabs(d) < kTiny ? kTiny : d);
    double h = d;
    for (int m = 1; m <= kMaxFractionTerms; ++m) {
        const double m2 = 2.0 * m;
        for (int half = 0; half < 2; ++half) {
            const double numerator = half == 0
                                         ? m * (b - m) * x / ((a + m2 - 1.0) * (a + m2))
                                         : -(a + m) * (a + b + m) * x / ((a + m2) * (a + m2 + 1.0));
            d = 1.0 + numerator * d;
            d = 1.0 / (std::fabs(d) < kTiny ? kTiny : d);
            c = 1.0 + numerator / c;
            c = std::fabs(c) < kTiny ? kTiny : c;
            const double step = c * d;
            h *= step;
            if (half == 1 && std::fabs(step - 1.0) < kEpsilon) {
                return h;
            }
        }
    }
    throw std::runtime_error("incomplete beta function did not converge for a = " + formatPlain(a) +
                             ", b = " + formatPlain(b));
}

// I_x(a, b) given both x and y = 1 − x, so that x close to 1 keeps its precision.
double incompleteBeta(double a, double b, double x, double y) {
    if (x <= 0.0) {
        return 0.0;
    }
    if (y <= 0.0) {
        return 1.0;
    }
    const double logFront =
        std::lgamma(a + b) - std::lgamma(a) - std::lgamma(b) + a * std::log(x) + b * std::log1p(-x);
    const double logFrontY =
        std::lgamma(a + b) - std::lgamma(a) - std::lgamma(b) + a * std::log1p(-y) + b * std::log(y);
    if (x < (a + 1.0) / (a + b + 2.0)) {
        return std::exp(logFront) * betaFraction(a, b, x) / a;
    }
    return 1.0 - std::exp(logFrontY) * betaFraction(b, a, y) / b;
}

// Upper tail P(T > t) for t ≥ 0.
double studentUpperTail(double t, double dof) {
    const double t2 = t * t;
    const double x = dof / (dof + t2);
    const double y = t2 / (dof + t2);
    return 0.5 * incompleteBeta(0.5 * dof, 0.5, x, y);
}

void requireProbability(double probability, const char* what) {
    if (!(probability > 0.0 && probability < 1.0)) {
        throw std::domain_error(std::string(what) + ": probability must lie strictly between 0 " +
                                "and 1 (0 % and 100 %), got " +
                                formatEngineering(100.0 * probability, 4, Unit::Percent));
    }
}

// Bisection of a decreasing function f on [lo, hi] with f(lo) > 0 > f(hi).
template <typename Function>
double solveDecreasing(Function f, double lo, double hi) {
    for (int i = 0; i < 400 && hi - lo > 4.0 * std::numeric_limits<double>::epsilon() * hi; ++i) {
        const double mid = 0.5 * (lo + hi);
        (f(mid) > 0.0 ? lo : hi) = mid;
    }
    return 0.5 * (lo + hi);
}

// Cornish–Fisher type expansion of the t quantile about the normal one (Abramowitz & Stegun
// 26.7.5); with ν ≥ 1e5 the terms beyond 1/ν³ are below 1e-20.
double studentQuantileExpansion(double z, double dof) {
    const double z2 = z * z;
    const double g1 = (z2 + 1.0) * z / 4.0;
    const double g2 = ((5.0 * z2 + 16.0) * z2 + 3.0) * z / 96.0;
    const double g3 = (((3.0 * z2 + 19.0) * z2 + 17.0) * z2 - 15.0) * z / 384.0;
    return z + (g1 + (g2 + g3 / dof) / dof) / dof;
}

} // namespace

double normalCdf(double z) {
    return 0.5 * std::erfc(-z / std::sqrt(2.0));
}

double normalQuantile(double p) {
    requireProbability(p, "normal quantile");
    // Solve in the smaller tail, where erfc keeps full relative precision.
    if (p == 0.5) {
        return 0.0;
    }
    const double tail = p < 0.5 ? p : 1.0 - p;
    auto excess = [tail](double z) {
        return 0.5 * std::erfc(z / std::sqrt(2.0)) - tail;
    };
    double hi = 1.0;
    while (excess(hi) > 0.0) {
        hi *= 2.0;
    }
    const double z = solveDecreasing(excess, 0.0, hi);
    return p < 0.5 ? -z : z;
}

double regularizedIncompleteBeta(double a, double b, double x) {
    if (!(a > 0.0 && b > 0.0) || !(x >= 0.0 && x <= 1.0)) {
        throw std::domain_error("incomplete beta: need a, b > 0 and 0 <= x <= 1");
    }
    return incompleteBeta(a, b, x, 1.0 - x);
}

double studentTCdf(double t, double dof) {
    if (!(dof > 0.0)) {
        throw std::domain_error("Student t: degrees of freedom must be positive, got " +
                                formatPlain(dof));
    }
    if (dof >= kDofTreatedAsInfinite) {
        return normalCdf(t);
    }
    const double upper = studentUpperTail(std::fabs(t), dof);
    return t >= 0.0 ? 1.0 - upper : upper;
}

double studentTCoverage(double probability, double dof) {
    requireProbability(probability, "Student t coverage");
    if (!(dof > 0.0)) {
        throw std::domain_error("Student t: degrees of freedom must be positive, got " +
                                formatPlain(dof));
    }
    const double tail = 0.5 * (1.0 - probability);
    if (dof >= kDofTreatedAsInfinite) {
        return normalQuantile(1.0 - tail);
    }
    if (dof >= kDofForExpansion) {
        return studentQuantileExpansion(normalQuantile(1.0 - tail), dof);
    }
    auto excess = [tail, dof](double t) {
        return studentUpperTail(t, dof) - tail;
    };
    double hi = 2.0;
    while (excess(hi) > 0.0) {
        hi *= 2.0;
    }
    return solveDecreasing(excess, 0.0, hi);
}

double tableDof(double dof) {
    if (std::isnan(dof) || dof <= 0.0) {
        throw std::domain_error("coverage factor: degrees of freedom must be positive");
    }
    return std::isinf(dof) ? dof : std::max(1.0, std::floor(dof));
}

double coverageFactor(double dof, double probability) {
    return studentTCoverage(probability, tableDof(dof));
}

} // namespace mw
