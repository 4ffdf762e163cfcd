// Evaluation of an uncertainty budget by the law of propagation of uncertainty (GUM 5.1.2) for
// uncorrelated inputs.
#include "core/uncertainty/budget.h"

#include <cmath>
#include <numeric>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

void validate(const UncertaintyComponent& component) {
    const std::string where = "uncertainty component \"" + component.name + "\": ";
    if (!std::isfinite(component.value) || component.value < 0.0) {
        throw std::invalid_argument(where + "value must be a finite number >= 0");
    }
    if (component.distribution == Distribution::Normal &&
        !(std::isfinite(component.coverageK) && component.coverageK > 0.0)) {
        throw std::invalid_argument(where + "coverage factor k must be > 0");
    }
    if (!std::isfinite(component.sensitivity)) {
        throw std::invalid_argument(where + "sensitivity coefficient must be finite");
    }
    if (std::isnan(component.dof) || component.dof <= 0.0) {
        throw std::invalid_argument(where + "degrees of freedom must be > 0");
    }
}

} // namespace

double divisor(const UncertaintyComponent& component) {
    switch (component.distribution) {
    case Distribution::Normal:
        return component.coverageK;
    case Distribution::Rectangular:
        return std::sqrt(3.0); // JCGM 100:2008 4.3.7
    case Distribution::Triangular:
        return std::sqrt(6.0); // JCGM 100:2008 4.3.9
    case Distribution::UShaped:
        return std::sqrt(2.0); // arcsine law, JCGM 101:2008 6.4.6
    }
    return 1.0;
}

double standardUncertainty(const UncertaintyComponent& component) {
    return component.value / divisor(component);
}

double contribution(const UncertaintyComponent& component) {
    return std::fabs(component.sensitivity) * standardUncertainty(component);
}

double welchSatterthwaite(const std::vector<double>& contributions,
                          const std::vector<double>& dofs) {
    if (contributions.size() != dofs.size()) {
        throw std::invalid_argument("Welch-Satterthwaite: one dof per contribution needed");
    }
    double sumSquares = 0.0;
    double denominator = 0.0;
    for (std::size_t i = 0; i < contributions.size(); ++i) {
        const double u2 = contributions[i] * contributions[i];
        sumSquares += u2;
        if (std::isfinite(dofs[i])) {
            denominator += u2 * u2 / dofs[i];
        }
    }
    if (denominator == 0.0) {
        return kInfiniteDof;
    }
    return sumSquares * sumSquares / denominator;
}

double roundUpToSignificant(double value, int digits) {
    if (value == 0.0 || !std::isfinite(value)) {
        return value;
    }
    if (digits < 1) {
        throw std::invalid_argument("rounding: at least one significant digit is needed");
    }
    const double magnitude = std::fabs(value);
    const int exponent = static_cast<int>(std::floor(std::log10(magnitude)));
    const double scale = std::pow(10.0, digits - 1 - exponent);
    const double scaled = magnitude * scale;
    const double nearest = std::round(scaled);
    const double up = std::fabs(scaled - nearest) <= 1e-9 * scaled ? nearest : std::ceil(scaled);
    // The double nearest the rounded decimal, so that its shortest decimal is the digits shown
    // (up / scale can land one binary step off when the scale is not exact).
    const ExactDecimal rounded =
        ExactDecimal::fromDouble(up / scale).roundedToExponent(exponent - digits + 1);
    return std::copysign(rounded.toDouble(), value);
}

BudgetResult evaluateBudget(const std::vector<UncertaintyComponent>& components,
                            double probability) {
    BudgetResult result;
    std::vector<double> dofs;
    for (const UncertaintyComponent& component : components) {
        validate(component);
        result.contributions.push_back(contribution(component));
        dofs.push_back(component.dof);
    }
    const double sumSquares =
        std::inner_product(result.contributions.begin(), result.contributions.end(),
                           result.contributions.begin(), 0.0);
    result.combined = std::sqrt(sumSquares);
    result.dofEffective =
        result.combined > 0.0 ? welchSatterthwaite(result.contributions, dofs) : kInfiniteDof;
    result.coverageFactor = coverageFactor(result.dofEffective, probability);
    result.expanded = result.coverageFactor * result.combined;
    result.expandedRounded = roundUpToSignificant(result.expanded, 2);
    return result;
}

double sampleStandardDeviation(const std::vector<double>& observations) {
    const auto n = static_cast<double>(observations.size());
    if (observations.size() < 2) {
        return 0.0;
    }
    const double mean = std::accumulate(observations.begin(), observations.end(), 0.0) / n;
    double sum = 0.0;
    for (double q : observations) {
        sum += (q - mean) * (q - mean);
    }
    return std::sqrt(sum / (n - 1.0));
}

std::optional<UncertaintyComponent> typeAFromRepeats(const std::string& name,
                                                     const std::vector<double>& observations) {
    if (observations.size() < 2) {
        return std::nullopt;
    }
    const auto n = static_cast<double>(observations.size());
    UncertaintyComponent component;
    component.name = name;
    component.value = sampleStandardDeviation(observations) / std::sqrt(n);
    component.distribution = Distribution::Normal;
    component.coverageK = 1.0;
    component.dof = n - 1.0;
    component.typeA = true;
    return component;
}

UncertaintyComponent readabilityComponent(double divisionValue, double fractionOfDivision) {
    if (!(divisionValue > 0.0) || !(fractionOfDivision > 0.0 && fractionOfDivision <= 1.0)) {
        throw std::invalid_argument("readability: the division value must be > 0 and the "
                                    "fraction of a division in (0, 1]");
    }
    UncertaintyComponent component;
    component.name = "readability of the scale";
    component.value = 0.5 * fractionOfDivision * divisionValue;
    component.distribution = Distribution::Rectangular;
    return component;
}

UncertaintyComponent resolutionComponent(const std::string& name, double resolution) {
    if (!(resolution >= 0.0) || !std::isfinite(resolution)) {
        throw std::invalid_argument(name + ": resolution must be a finite number >= 0");
    }
    UncertaintyComponent component;
    component.name = name;
    component.value = 0.5 * resolution;
    component.distribution = Distribution::Rectangular;
    return component;
}

UncertaintyComponent temperatureComponent(double reading, double relativeShift) {
    if (!std::isfinite(reading) || !std::isfinite(relativeShift)) {
        throw std::invalid_argument("temperature effect: reading and shift must be finite");
    }
    UncertaintyComponent component;
    component.name = "temperature effect";
    component.value = std::fabs(reading * relativeShift);
    component.distribution = Distribution::Rectangular;
    return component;
}

double testUncertaintyRatio(double toleranceLower, double toleranceUpper, double expanded) {
    if (!(toleranceUpper > toleranceLower)) {
        throw std::invalid_argument("TUR: the upper tolerance limit must exceed the lower");
    }
    if (!(expanded > 0.0)) {
        return kInfiniteDof;
    }
    return (toleranceUpper - toleranceLower) / (2.0 * expanded);
}

bool turBelowMinimum(const ExactDecimal& toleranceSpan, const ExactDecimal& expanded) {
    return toleranceSpan < ExactDecimal::fromInteger(2 * static_cast<int>(kMinimumTur)) * expanded;
}

double turRoundedDown(const ExactDecimal& toleranceSpan, const ExactDecimal& expanded, int digits) {
    if (!(toleranceSpan > ExactDecimal()) || expanded.isNegative()) {
        throw std::invalid_argument("TUR: the tolerance span must be > 0 and U >= 0");
    }
    if (expanded.isZero()) {
        return kInfiniteDof;
    }
    const ExactDecimal twiceU = ExactDecimal::fromInteger(2) * expanded;
    // A first guess from binary arithmetic, then exact steps of one unit in the last digit
    // until guess · 2U ≤ span < (guess + step) · 2U.
    ExactDecimal guess = ExactDecimal::fromDouble(toleranceSpan.toDouble() / twiceU.toDouble())
                             .roundedDownToSignificant(digits);
    const auto step = [digits](const ExactDecimal& value) {
        return ExactDecimal::fromInteger(1).timesPowerOfTen(value.leadingExponent() - digits + 1);
    };
    while (guess * twiceU > toleranceSpan) {
        guess = guess - step(guess);
    }
    while ((guess + step(guess)) * twiceU <= toleranceSpan) {
        guess = guess + step(guess);
    }
    return guess.toDouble();
}

std::string formatTur(double tur) {
    if (!std::isfinite(tur)) {
        return "inf:1";
    }
    const ExactDecimal value = ExactDecimal::fromDouble(tur);
    if (value.isZero()) {
        return "0:1";
    }
    // Two significant digits, trailing zero kept: 4 -> "4.0".
    const int last = value.leadingExponent() - 1;
    std::string text = value.roundedToExponent(last).toPlain();
    if (last < 0) {
        const std::size_t point = text.find('.');
        const std::size_t have = point == std::string::npos ? 0 : text.size() - point - 1;
        if (point == std::string::npos) {
            text += '.';
        }
        text += std::string(static_cast<std::size_t>(-last) - have, '0');
    }
    return text + ":1";
}

} // namespace mw
