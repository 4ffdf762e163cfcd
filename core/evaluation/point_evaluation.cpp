// Grouping readings into points and evaluating one point: exact errors, budget, decision, TUR
// and the JCGM 106 figures.
#include "core/evaluation/point_evaluation.h"

#include "core/plan/test_plan.h"
#include "core/uncertainty/distributions.h"

#include <algorithm>
#include <cmath>
#include <map>
#include <numeric>
#include <string>
#include <tuple>

namespace mw::evaluation {
namespace {

bool sameValue(double a, double b) {
    return std::fabs(a - b) <= 1e-9 * std::max({1.0, std::fabs(a), std::fabs(b)});
}

double mean(const std::vector<double>& values) {
    return std::accumulate(values.begin(), values.end(), 0.0) / static_cast<double>(values.size());
}

void addTo(ExactMean& mean, const ExactDecimal& value) {
    mean.sum = mean.sum + value;
    ++mean.count;
}

// Type A from repeats, pooling the scatter of both directions (JCGM 100:2008 H.3.6 pooled
// variance): u = s_p / √n of the chosen direction's mean, ν = Σ (n_i − 1).
void addTypeA(const PointGroup& group, std::size_t chosenCount, PointResult& point) {
    double sumSquares = 0.0;
    double dof = 0.0;
    for (const auto* errors : {&group.errorsUp, &group.errorsDown}) {
        if (errors->size() < 2) {
            continue;
        }
        const double s = sampleStandardDeviation(*errors);
        sumSquares += s * s * static_cast<double>(errors->size() - 1);
        dof += static_cast<double>(errors->size() - 1);
    }
    if (dof == 0.0) {
        return;
    }
    const double pooled = std::sqrt(sumSquares / dof);
    point.repeatability = pooled;
    UncertaintyComponent typeA;
    typeA.name = "repeatability (Type A)";
    typeA.value = pooled / std::sqrt(static_cast<double>(chosenCount));
    typeA.distribution = Distribution::Normal;
    typeA.coverageK = 1.0;
    typeA.dof = dof;
    typeA.typeA = true;
    point.components.push_back(typeA);
}

// TUR and the JCGM 106 figures of an evaluated point.
void addRatioAndRisk(const EvaluationInput& input, const ExactDecimal& limit,
                     const ExactDecimal& expanded, PointResult& point) {
    if (input.reference || input.referenceComponents) {
        const ExactDecimal span = ExactDecimal::fromInteger(2) * limit;
        point.tur = testUncertaintyRatio(-point.permissibleError, point.permissibleError,
                                         point.budget.expandedRounded);
        point.turBelowMinimum = turBelowMinimum(span, expanded);
        point.turText = formatTur(turRoundedDown(span, expanded));
    }
    const ToleranceInterval tolerance{-point.permissibleError, point.permissibleError};
    point.riskDof = tableDof(point.budget.dofEffective);
    const double risk = specificRisk(point.error, point.budget.combined, tolerance, point.riskDof);
    point.conformanceProbability = 1.0 - risk;
    if (isAccepted(point.decision)) {
        point.specificRisk = risk;
    }
}

} // namespace

std::vector<PointGroup> groupReadings(const std::vector<EvaluationReading>& readings, Unit unit) {
    std::vector<PointGroup> groups;
    std::vector<std::pair<int, double>> keys;
    // (point, direction, repeat) -> reading number, for numbered repeats.
    std::map<std::tuple<std::size_t, Direction, int>, std::size_t> numbered;
    for (std::size_t i = 0; i < readings.size(); ++i) {
        const EvaluationReading& reading = readings[i];
        auto found = std::find_if(keys.begin(), keys.end(), [&reading](const auto& key) {
            return reading.point >= 0 ? key.first == reading.point
                                      : key.first < 0 && sameValue(key.second, reading.applied);
        });
        if (found == keys.end()) {
            keys.emplace_back(reading.point, reading.applied);
            groups.emplace_back();
            groups.back().point = reading.point;
            found = keys.end() - 1;
        }
        const auto index = static_cast<std::size_t>(found - keys.begin());
        if (reading.repeat > 0) {
            const auto [earlier, fresh] =
                numbered.try_emplace({index, reading.direction, reading.repeat}, i + 1);
            if (!fresh) {
                throw EvaluationError("repeat", i + 1,
                                      "repeats number " + std::to_string(reading.repeat) +
                                          " of reading " + std::to_string(earlier->second) +
                                          " at the same point (" +
                                          formatEngineering(reading.applied, 4, unit) + ", " +
                                          std::string(toText(reading.direction)) + ")",
                                      earlier->second);
            }
        }
        PointGroup& group = groups[index];
        const ExactDecimal applied = ExactDecimal::fromDouble(reading.applied);
        const ExactDecimal error = ExactDecimal::fromDouble(reading.indicated) - applied;
        group.applied.push_back(reading.applied);
        group.appliedSum = group.appliedSum + applied;
        const bool up = reading.direction == Direction::Up;
        (up ? group.errorsUp : group.errorsDown).push_back(error.toDouble());
        addTo(up ? group.up : group.down, error);
    }
    std::sort(groups.begin(), groups.end(), [](const PointGroup& a, const PointGroup& b) {
        return mean(a.applied) < mean(b.applied);
    });
    return groups;
}

std::vector<UncertaintyComponent> typeBComponents(const EvaluationInput& input, double applied,
                                                  double referenceRangeValue) {
    std::vector<UncertaintyComponent> components;
    if (input.referenceComponents) {
        components = input.referenceComponents(applied);
    } else if (input.reference) {
        components.push_back(referenceComponent(*input.reference, applied, referenceRangeValue));
    }
    if (input.referenceResolution > 0.0) {
        components.push_back(
            resolutionComponent("resolution of the reference", input.referenceResolution));
    }
    if (input.divisions > 0) {
        components.push_back(readabilityComponent(divisionValue(input.range, input.divisions),
                                                  input.readabilityFraction));
    }
    if (input.temperature) {
        const TemperatureInfluence& t = *input.temperature;
        const double shift = t.coil ? spanError(*t.coil, t.roomCelsius, t.referenceCelsius)
                                    : t.coefficientPerKelvin * (t.roomCelsius - t.referenceCelsius);
        components.push_back(temperatureComponent(applied, shift));
    }
    components.insert(components.end(), input.extraComponents.begin(), input.extraComponents.end());
    return components;
}

EvaluatedPoint evaluatePoint(const EvaluationInput& input, const PointGroup& group, double fiducial,
                             const ExactDecimal& limit, double referenceRangeValue) {
    PointResult point;
    point.pointIndex = group.point;
    const auto count = static_cast<std::int64_t>(group.applied.size());
    point.applied = ExactMean{group.appliedSum, count}.toDouble();
    point.readingCount = static_cast<int>(count);
    const bool hasUp = group.up.count > 0;
    const bool hasDown = group.down.count > 0;
    if (hasUp) {
        point.errorUp = group.up.toDouble();
    }
    if (hasDown) {
        point.errorDown = group.down.toDouble();
    }
    if (hasUp && hasDown) {
        point.hysteresis = ExactMean{group.down.sum * ExactDecimal::fromInteger(group.up.count) -
                                         group.up.sum * ExactDecimal::fromInteger(group.down.count),
                                     group.up.count * group.down.count}
                               .toDouble();
    }
    // The class applies to every reading, up-scale and down-scale (common practice), so the
    // point is judged by the direction with the larger error, compared exactly.
    const bool downWorse = hasDown && (!hasUp || group.down.compareMagnitude(group.up) > 0);
    const ExactMean chosen = downWorse ? group.down : group.up;
    point.decidingDirection = downWorse ? Direction::Down : Direction::Up;
    point.error = chosen.toDouble();
    point.indicated = point.applied + point.error;
    if (point.applied != 0.0) {
        point.errorPercentOfReading = point.error / point.applied * 100.0;
    }
    point.errorPercentOfFiducial = point.error / fiducial * 100.0;
    point.permissibleError = limit.toDouble();

    point.components = typeBComponents(input, point.applied, referenceRangeValue);
    addTypeA(group, static_cast<std::size_t>(chosen.count), point);
    point.budget = evaluateBudget(point.components, input.probability);

    // The rounded-up U rather than the unrounded one: it is the larger (never narrows the guard
    // band) and it is the number printed beside the decision (see PointResult).
    const ExactDecimal expanded = ExactDecimal::fromDouble(point.budget.expandedRounded);
    point.decision = decide(chosen, expanded, ExactTolerance{-limit, limit}, input.decision);
    addRatioAndRisk(input, limit, expanded, point);
    return {point, chosen};
}

} // namespace mw::evaluation
