// Decision rules of ILAC G8:09/2019 in exact decimal arithmetic, and the conformance
// probability and specific risk of JCGM 106:2012.
#include "core/decision/decision.h"

#include "core/uncertainty/distributions.h"
#include "core/units/quantity.h"

#include <cmath>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

void validate(double measured, double uncertainty, const ToleranceInterval& tolerance) {
    if (!(tolerance.upper > tolerance.lower)) {
        throw std::invalid_argument("decision: the upper tolerance limit must exceed the lower");
    }
    if (!std::isfinite(measured)) {
        throw std::invalid_argument("decision: the measured value must be finite");
    }
    if (!(uncertainty >= 0.0) || !std::isfinite(uncertainty)) {
        throw std::invalid_argument("decision: the uncertainty must be finite and >= 0");
    }
}

void validate(const ExactMean& measured, const ExactDecimal& expandedU,
              const ExactTolerance& tolerance) {
    if (!(tolerance.upper > tolerance.lower)) {
        throw std::invalid_argument("decision: the upper tolerance limit must exceed the lower");
    }
    if (measured.count < 1) {
        throw std::invalid_argument("decision: a mean needs at least one value");
    }
    if (expandedU.isNegative()) {
        throw std::invalid_argument("decision: the expanded uncertainty must be >= 0");
    }
}

int severity(Outcome outcome) {
    return static_cast<int>(outcome); // the enumerators are declared in order of severity
}

void validateFactor(double guardFactor) {
    if (!(guardFactor >= 0.0) || !std::isfinite(guardFactor)) {
        throw std::invalid_argument("decision: the guard-band factor r must be >= 0, got " +
                                    formatPlain(guardFactor));
    }
}

} // namespace

ExactTolerance ExactTolerance::of(const ToleranceInterval& tolerance) {
    return {ExactDecimal::fromDouble(tolerance.lower), ExactDecimal::fromDouble(tolerance.upper)};
}

bool hasGuardBand(DecisionRule rule) {
    return rule != DecisionRule::SimpleAcceptance;
}

ExactDecimal exactGuardBand(const DecisionSettings& settings, const ExactDecimal& expandedU) {
    if (!hasGuardBand(settings.rule)) {
        return {};
    }
    validateFactor(settings.guardFactor);
    return ExactDecimal::fromDouble(settings.guardFactor) * expandedU;
}

double guardBand(const DecisionSettings& settings, double expandedU) {
    if (!std::isfinite(expandedU)) {
        throw std::invalid_argument("decision: the expanded uncertainty must be finite");
    }
    return exactGuardBand(settings, ExactDecimal::fromDouble(expandedU)).toDouble();
}

Outcome decide(const ExactMean& measured, const ExactDecimal& expandedU,
               const ExactTolerance& tolerance, const DecisionSettings& settings) {
    validate(measured, expandedU, tolerance);
    const ExactDecimal w = exactGuardBand(settings, expandedU);
    // mean ≥ bound ⟺ sum ≥ count·bound: never a division, so never a rounding.
    const auto atLeast = [&measured](const ExactDecimal& bound) {
        return measured.compare(bound) >= 0;
    };
    const auto atMost = [&measured](const ExactDecimal& bound) {
        return measured.compare(bound) <= 0;
    };
    const bool inside = atLeast(tolerance.lower) && atMost(tolerance.upper);
    switch (settings.rule) {
    case DecisionRule::SimpleAcceptance:
        return inside ? Outcome::Pass : Outcome::Fail;
    case DecisionRule::GuardedBinary:
        return atLeast(tolerance.lower + w) && atMost(tolerance.upper - w) ? Outcome::Pass
                                                                           : Outcome::Fail;
    case DecisionRule::GuardedAcceptance:
        break;
    }
    if (inside) {
        const bool clearOfLimits =
            measured.compare(tolerance.upper - w) < 0 && measured.compare(tolerance.lower + w) > 0;
        return clearOfLimits ? Outcome::Pass : Outcome::ConditionalPass;
    }
    const bool withinBand = atMost(tolerance.upper + w) && atLeast(tolerance.lower - w);
    return withinBand ? Outcome::ConditionalFail : Outcome::Fail;
}

Outcome decide(double measured, double expandedU, const ToleranceInterval& tolerance,
               const DecisionSettings& settings) {
    validate(measured, expandedU, tolerance);
    return decide(ExactMean::of(measured), ExactDecimal::fromDouble(expandedU),
                  ExactTolerance::of(tolerance), settings);
}

Outcome worseOf(Outcome a, Outcome b) {
    return severity(a) >= severity(b) ? a : b;
}

bool isAccepted(Outcome outcome) {
    return outcome == Outcome::Pass || outcome == Outcome::ConditionalPass;
}

double specificRisk(double measured, double standardU, const ToleranceInterval& tolerance,
                    double dof) {
    validate(measured, standardU, tolerance);
    if (std::isnan(dof) || !(dof > 0.0)) {
        throw std::invalid_argument("decision: the degrees of freedom must be > 0");
    }
    if (standardU == 0.0) {
        return measured >= tolerance.lower && measured <= tolerance.upper ? 0.0 : 1.0;
    }
    // The t-distribution is symmetric: P(true > T_U) = F((y − T_U)/u).
    const double above = studentTCdf((measured - tolerance.upper) / standardU, dof);
    const double below = studentTCdf((tolerance.lower - measured) / standardU, dof);
    return above + below;
}

double conformanceProbability(double measured, double standardU, const ToleranceInterval& tolerance,
                              double dof) {
    return 1.0 - specificRisk(measured, standardU, tolerance, dof);
}

double measurementCapabilityIndex(double standardU, const ToleranceInterval& tolerance) {
    validate(0.0, standardU, tolerance);
    if (standardU == 0.0) {
        return std::numeric_limits<double>::infinity();
    }
    return (tolerance.upper - tolerance.lower) / (4.0 * standardU);
}

} // namespace mw
