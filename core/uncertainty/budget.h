// An uncertainty budget of named components and its evaluation by JCGM 100:2008 (GUM): combined
// standard uncertainty, Welch–Satterthwaite effective degrees of freedom, coverage factor from
// Student's t and the expanded uncertainty rounded up to two significant digits.
#pragma once

#include "core/uncertainty/distributions.h"
#include "core/units/decimal.h"

#include <limits>
#include <optional>
#include <string>
#include <vector>

namespace mw {

inline constexpr double kInfiniteDof = std::numeric_limits<double>::infinity();

// How the value of a component turns into a standard uncertainty (JCGM 100:2008 4.3).
enum class Distribution {
    Normal,      // value is an expanded uncertainty with coverage factor k; u = value / k
    Rectangular, // value is a half-width a; u = a / √3
    Triangular,  // value is a half-width a; u = a / √6
    UShaped,     // value is a half-width a (arcsine); u = a / √2
};

struct UncertaintyComponent {
    std::string name;
    double value = 0.0; // half-width or expanded uncertainty, in the unit of the input quantity
    Distribution distribution = Distribution::Rectangular;
    double coverageK = 1.0;    // only for Distribution::Normal
    double sensitivity = 1.0;  // c_i = ∂y/∂x_i
    double dof = kInfiniteDof; // ν_i; infinity for a Type B estimate taken as exact
    bool typeA = false;        // evaluated statistically from repeated observations
};

double divisor(const UncertaintyComponent& component);
double standardUncertainty(const UncertaintyComponent& component); // u(x_i) = value / divisor
double contribution(const UncertaintyComponent& component);        // |c_i| · u(x_i)

struct BudgetResult {
    std::vector<double> contributions;  // |c_i| u(x_i), same order as the components
    double combined = 0.0;              // u_c(y)
    double dofEffective = kInfiniteDof; // ν_eff before truncation
    double coverageFactor = 2.0;        // k = t_p(⌊ν_eff⌋)
    double expanded = 0.0;              // U = k u_c, unrounded
    // U as reported: two significant digits, rounded UP (JCGM 100:2008 7.2.6 permits rounding
    // up; calibration certificates never round an uncertainty down, common practice). Never
    // smaller than `expanded`; the value guard bands, decisions and TUR use.
    double expandedRounded = 0.0;
};

// Evaluates the budget; throws std::invalid_argument naming the first bad component.
BudgetResult evaluateBudget(const std::vector<UncertaintyComponent>& components,
                            double probability = kProbabilityTwoSigma);

// Welch–Satterthwaite (JCGM 100:2008 G.4.1, eq. G.2b) from contributions u_i(y) and ν_i.
double welchSatterthwaite(const std::vector<double>& contributions,
                          const std::vector<double>& dofs);

// Rounds the magnitude UP (away from zero) to `digits` significant digits: 0.0231 -> 0.024,
// 0.023 stays 0.023. A value within 1e-9 (relative) of a representable digit string is taken
// as that string, so binary noise (0.023 stored as 0.0230000000000001) does not bump it.
// JCGM 100:2008 7.2.6 allows at most two digits and rounding up rather than to the nearest.
double roundUpToSignificant(double value, int digits);

// Type A evaluation (JCGM 100:2008 4.2): experimental standard deviation of the mean of the
// observations, with n − 1 degrees of freedom. nullopt with fewer than two observations.
std::optional<UncertaintyComponent> typeAFromRepeats(const std::string& name,
                                                     const std::vector<double>& observations);

// Experimental standard deviation s(q_k) of single observations (JCGM 100:2008 4.2.2).
double sampleStandardDeviation(const std::vector<double>& observations);

// Reading an analog scale to a fraction of a division: the reading is quantised to
// fraction × division, so the half-width is half of that, rectangular (common practice,
// EA-4/02 treatment of resolution).
UncertaintyComponent readabilityComponent(double divisionValue, double fractionOfDivision);

// Finite resolution of a digital reference display: half-width resolution/2, rectangular.
UncertaintyComponent resolutionComponent(const std::string& name, double resolution);

// Effect of the room being off the reference temperature: the indication at `reading` is
// shifted by the fraction `relativeShift` (from the coil model, or coefficient × ΔT) and left
// uncorrected, so the whole shift is taken as the half-width of a rectangular distribution.
UncertaintyComponent temperatureComponent(double reading, double relativeShift);

// Test uncertainty ratio by the ANSI/NCSL Z540.3 Handbook definition: span of the tolerance
// divided by twice the expanded uncertainty of the calibration process.
double testUncertaintyRatio(double toleranceLower, double toleranceUpper, double expanded);
inline constexpr double kMinimumTur = 4.0; // Z540.3 5.3 fallback of 4:1

// TUR < 4:1 decided exactly on the decimals: (T_U − T_L) < 2 · 4 · U, with U as reported.
bool turBelowMinimum(const ExactDecimal& toleranceSpan, const ExactDecimal& expanded);

// The TUR (T_U − T_L) / (2U) rounded DOWN to `digits` significant digits, exactly: a ratio of
// 3.98 shows as 3.9, never as 4.0, so the printed ratio agrees with turBelowMinimum() and
// rounding never flatters it. Infinity when U is 0. Throws std::invalid_argument for a span
// that is not positive or a negative U.
double turRoundedDown(const ExactDecimal& toleranceSpan, const ExactDecimal& expanded,
                      int digits = 2);

// A TUR as "6.2:1", "12:1", "4.0:1" (two significant digits as given), "inf:1" without U.
std::string formatTur(double tur);

} // namespace mw
