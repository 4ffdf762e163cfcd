// Normal and Student-t distributions for coverage factors: CDFs and quantiles computed in the
// engine with the standard library only (no third-party numerics in core).
#pragma once

namespace mw {

// The coverage probability of ±2σ of a normal law, erf(√2) = 0.954 499 736…; the "95.45 %"
// column of JCGM 100:2008 Table G.2 means exactly this, so that k(∞) = 2.
inline constexpr double kProbabilityTwoSigma = 0.95449973610364158;

// Standard normal cumulative distribution Φ(z).
double normalCdf(double z);

// Inverse of Φ for 0 < p < 1; throws std::domain_error outside that interval.
double normalQuantile(double p);

// Regularized incomplete beta function I_x(a, b) for a, b > 0 and 0 ≤ x ≤ 1.
double regularizedIncompleteBeta(double a, double b, double x);

// Cumulative distribution of Student's t with `dof` degrees of freedom (dof > 0, may be
// non-integer; infinity gives the normal law).
double studentTCdf(double t, double dof);

// Two-sided quantile: the t for which a fraction `probability` of the t distribution with `dof`
// degrees of freedom lies within ±t (JCGM 100:2008 G.3). Throws std::domain_error for
// probability outside (0, 1) or dof ≤ 0.
double studentTCoverage(double probability, double dof);

// The degrees of freedom with which JCGM 100:2008 G.4.1 enters Table G.2: a finite ν truncated
// to the next lower integer, ν < 1 taken as 1 (the table's first row), infinity kept. Throws
// std::domain_error for ν ≤ 0 or NaN.
double tableDof(double dof);

// Coverage factor k = t_p(ν) as JCGM 100:2008 G.4.1 prescribes: a finite ν is truncated to the
// next lower integer (ν < 1 is taken as 1) before the table is entered; infinity gives the
// normal value.
double coverageFactor(double dof, double probability = kProbabilityTwoSigma);

} // namespace mw
