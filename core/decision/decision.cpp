// Decision rules of ILAC G8:09/2019 and conformance probability of JCGM 106:2012.
#include "core/decision/decision.h"
#include "core/units/quantity.h"

#include "core/uncertainty/distributions.h"

#include <cmath>
#include <cstdio>
#include <limits>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

void validate(double measured, double expandedU, const ToleranceInterval& tolerance) {
    if (!(tolerance.upper > tolerance.lower)) {
        throw std::invalid_argument("decision: the upper tolerance limit must exceed the lower");
    }
    if (!std::isfinite(measured)) {
        throw std::invalid_argument("decision: the measured value must be finite");
    }
    if (!(expandedU >= 0.0) || !std::isfinite(expandedU)) {
        throw std::invalid_argument("decision: the expanded uncertainty must be finite and >= 0");
    }
}

int severity(Outcome outcome) {
    return static_cast<int>(outcome); // the enumerators are declared in order of severity
}

} // namespace

double guardBand(const DecisionSettings& settings, double expandedU) {
    if (settings.rule == DecisionRule::SimpleAcceptance) {
        return 0.0;
    }
    if (!(settings.guardFactor >= 0.0) || !std::isfinite(settings.guardFactor)) {
        throw std::invalid_argument("decision: the guard-band factor r must be >= 0, got " +
                                    formatPlain(settings.guardFactor));
    }
    return settings.guardFactor * expandedU;
}

Outcome decide(double measured, double expandedU, const ToleranceInterval& tolerance,
               const DecisionSettings& settings) {
    validate(measured, expandedU, tolerance);
    const double w = guardBand(settings, expandedU);
    const bool inside = measured >= tolerance.lower && measured <= tolerance.upper;
    if (settings.rule == DecisionRule::SimpleAcceptance) {
        return inside ? Outcome::Pass : Outcome::Fail;
    }
    if (inside) {
        const bool clearOfLimits = measured < tolerance.upper - w && measured > tolerance.lower + w;
        return clearOfLimits ? Outcome::Pass : Outcome::ConditionalPass;
    }
    const bool withinBand = measured <= tolerance.upper + w && measured >= tolerance.lower - w;
    return withinBand ? Outcome::ConditionalFail : Outcome::Fail;
}

Outcome worseOf(Outcome a, Outcome b) {
    return severity(a) >= severity(b) ? a : b;
}

double conformanceProbability(double measured, double standardU,
                              const ToleranceInterval& tolerance) {
    validate(measured, standardU, tolerance);
    if (standardU == 0.0) {
        return measured >= tolerance.lower && measured <= tolerance.upper ? 1.0 : 0.0;
    }
    // Sum of the two tails keeps precision when p_c is close to 1.
    const double above = normalCdf((measured - tolerance.upper) / standardU);
    const double below = normalCdf((tolerance.lower - measured) / standardU);
    return 1.0 - above - below;
}

double probabilityOfFalseAccept(double measured, double standardU,
                                const ToleranceInterval& tolerance) {
    validate(measured, standardU, tolerance);
    if (standardU == 0.0) {
        return measured >= tolerance.lower && measured <= tolerance.upper ? 0.0 : 1.0;
    }
    return normalCdf((measured - tolerance.upper) / standardU) +
           normalCdf((tolerance.lower - measured) / standardU);
}

double measurementCapabilityIndex(double standardU, const ToleranceInterval& tolerance) {
    validate(0.0, standardU, tolerance);
    if (standardU == 0.0) {
        return std::numeric_limits<double>::infinity();
    }
    return (tolerance.upper - tolerance.lower) / (4.0 * standardU);
}

} // namespace mw
