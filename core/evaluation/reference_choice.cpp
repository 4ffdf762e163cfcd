// Choosing the reference standard's range for an instrument's range, and its budget components.
#include "core/evaluation/reference_choice.h"

#include <cmath>
#include <stdexcept>
#include <tuple>

namespace mw {
namespace {

bool hasLimits(const StandardRangeSpec& spec) {
    return spec.percent_of_reading > 0.0 || spec.percent_of_range > 0.0 || spec.floor > 0.0;
}

double limitHalfWidth(const StandardRangeSpec& spec, double reading) {
    return spec.percent_of_reading / 100.0 * std::fabs(reading) +
           spec.percent_of_range / 100.0 * spec.full_scale + spec.floor;
}

// Sort key of a candidate: smaller is better.
using Rank = std::tuple<double, double, std::int64_t, int, std::int64_t, int>;

const StandardSpecCopy& requireSpec(const std::vector<StandardSpecCopy>& specs,
                                    const SpecRef& ref) {
    const StandardSpecCopy* found = findSpec(specs, ref);
    if (found == nullptr) {
        throw std::invalid_argument("reference: the session holds no copy of range " +
                                    std::to_string(ref.sort_order + 1) + " of standard " +
                                    std::to_string(ref.standard_id));
    }
    return *found;
}

UncertaintyComponent scaled(UncertaintyComponent component, double factor) {
    component.value *= std::fabs(factor);
    return component;
}

std::optional<ReferenceChoice> directChoice(Unit unit, SignalKind kind, double largest,
                                            const std::vector<StandardSpecCopy>& specs) {
    std::optional<ReferenceChoice> best;
    Rank bestRank{};
    for (const StandardSpecCopy& copy : specs) {
        const StandardRangeSpec& spec = copy.spec;
        if (spec.unit != unit || spec.signal != kind || !statesUncertainty(spec) ||
            !(spec.full_scale >= largest)) {
            continue;
        }
        const Rank rank{standardUncertainty(standardComponent(spec, largest)),
                        spec.full_scale,
                        copy.standard_id,
                        copy.sort_order,
                        0,
                        0};
        if (!best || rank < bestRank) {
            best = ReferenceChoice{{copy.standard_id, copy.sort_order}, std::nullopt};
            bestRank = rank;
        }
    }
    return best;
}

std::optional<ReferenceChoice> shuntChoice(double largest,
                                           const std::vector<StandardSpecCopy>& specs) {
    std::optional<ReferenceChoice> best;
    Rank bestRank{};
    for (const StandardSpecCopy& shunt : specs) {
        if (shunt.spec.unit != Unit::Ohm || !statesUncertainty(shunt.spec) ||
            !(shunt.spec.full_scale > 0.0)) {
            continue;
        }
        const double volts = largest * shunt.spec.full_scale;
        for (const StandardSpecCopy& meter : specs) {
            if (meter.spec.unit != Unit::Volt || meter.spec.signal != SignalKind::Dc ||
                !statesUncertainty(meter.spec) || !(meter.spec.full_scale >= volts)) {
                continue;
            }
            const ReferenceChoice candidate{{meter.standard_id, meter.sort_order},
                                            SpecRef{shunt.standard_id, shunt.sort_order}};
            double sumSquares = 0.0;
            for (const UncertaintyComponent& c : referenceComponents(candidate, specs, largest)) {
                sumSquares += standardUncertainty(c) * standardUncertainty(c);
            }
            const Rank rank{std::sqrt(sumSquares), shunt.spec.full_scale, shunt.standard_id,
                            shunt.sort_order,      meter.standard_id,     meter.sort_order};
            if (!best || rank < bestRank) {
                best = candidate;
                bestRank = rank;
            }
        }
    }
    return best;
}

} // namespace

const StandardSpecCopy* findSpec(const std::vector<StandardSpecCopy>& specs, const SpecRef& ref) {
    for (const StandardSpecCopy& copy : specs) {
        if (copy.standard_id == ref.standard_id && copy.sort_order == ref.sort_order) {
            return &copy;
        }
    }
    return nullptr;
}

bool statesUncertainty(const StandardRangeSpec& spec) {
    return hasLimits(spec) || spec.certificate_expanded_uncertainty.value_or(0.0) > 0.0;
}

UncertaintyComponent standardComponent(const StandardRangeSpec& spec, double reading) {
    UncertaintyComponent component;
    component.name = "reference: " + spec.label;
    if (hasLimits(spec)) {
        component.value = limitHalfWidth(spec, reading);
        component.distribution = Distribution::Rectangular;
        return component;
    }
    component.value = spec.certificate_expanded_uncertainty.value_or(0.0);
    component.distribution = Distribution::Normal;
    component.coverageK = spec.coverage_factor;
    component.dof = spec.degrees_of_freedom.value_or(kInfiniteDof);
    return component;
}

std::optional<ReferenceChoice> chooseReference(Unit unit, SignalType signal,
                                               double largestMagnitude,
                                               const std::vector<StandardSpecCopy>& specs) {
    if (auto direct = directChoice(unit, kindOf(signal), largestMagnitude, specs)) {
        return direct;
    }
    if (unit == Unit::Ampere && signal == SignalType::Dc) {
        return shuntChoice(largestMagnitude, specs);
    }
    return std::nullopt;
}

std::vector<UncertaintyComponent> referenceComponents(const ReferenceChoice& choice,
                                                      const std::vector<StandardSpecCopy>& specs,
                                                      double applied) {
    const StandardRangeSpec& reference = requireSpec(specs, choice.reference).spec;
    if (!choice.shunt) {
        return {standardComponent(reference, applied)};
    }
    // I = V / R: the voltage reading's uncertainty divided by R, and the shunt's relative
    // uncertainty times the current (JCGM 100:2008 5.1.6, relative sensitivities of a quotient).
    const StandardRangeSpec& shunt = requireSpec(specs, *choice.shunt).spec;
    const double ohms = shunt.full_scale;
    UncertaintyComponent volts = scaled(standardComponent(reference, applied * ohms), 1.0 / ohms);
    volts.name = "reference: " + reference.label + " across the shunt";
    UncertaintyComponent resistance = scaled(standardComponent(shunt, ohms), applied / ohms);
    resistance.name = "reference: shunt " + shunt.label;
    return {volts, resistance};
}

std::string describeChoice(const ReferenceChoice& choice,
                           const std::vector<StandardSpecCopy>& specs) {
    const StandardRangeSpec& reference = requireSpec(specs, choice.reference).spec;
    if (!choice.shunt) {
        return reference.label;
    }
    return reference.label + " across " + requireSpec(specs, *choice.shunt).spec.label;
}

} // namespace mw
