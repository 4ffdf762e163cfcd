// Evaluation of the readings of one range: grouping into points, errors, budgets, decisions,
// the statement and the advice.
#include "core/evaluation/evaluation.h"

#include "core/evaluation/statement.h"
#include "core/plan/test_plan.h"

#include <algorithm>
#include <cmath>
#include <numeric>
#include <stdexcept>
#include <string>

namespace mw {
namespace {

struct PointGroup {
    std::vector<double> applied;
    std::vector<double> errorsUp;
    std::vector<double> errorsDown;
};

bool sameValue(double a, double b) {
    return std::fabs(a - b) <= 1e-9 * std::max({1.0, std::fabs(a), std::fabs(b)});
}

double mean(const std::vector<double>& values) {
    return std::accumulate(values.begin(), values.end(), 0.0) / static_cast<double>(values.size());
}

void requireOnScale(const EvaluationInput& input, std::size_t index, double applied) {
    const double lower = input.range.lower;
    const double upper = input.range.upper;
    // A hair of slack so that a point exactly at the allowance is not refused by rounding.
    const double allowance = (kScaleEndAllowance + 1e-9) * (upper - lower);
    if (applied >= lower - allowance && applied <= upper + allowance) {
        return;
    }
    const auto show = [&input](double value) {
        return formatEngineering(value, 4, input.unit);
    };
    throw std::invalid_argument(
        "evaluation: reading " + std::to_string(index + 1) + " has an applied value of " +
        show(applied) + ", outside the range's scale " + show(lower) + " … " + show(upper) +
        " (by more than " + formatEngineering(100.0 * kScaleEndAllowance, 2, Unit::Percent) +
        " of the span)");
}

void validateReadings(const EvaluationInput& input) {
    if (input.readings.empty()) {
        throw std::invalid_argument("evaluation: there are no readings");
    }
    fiducialValue(input.range); // refuses limits that are not finite or not in order
    for (std::size_t i = 0; i < input.readings.size(); ++i) {
        const EvaluationReading& reading = input.readings[i];
        if (!std::isfinite(reading.applied) || !std::isfinite(reading.indicated)) {
            throw std::invalid_argument("evaluation: reading " + std::to_string(i + 1) +
                                        " has a value that is not a finite number");
        }
        requireOnScale(input, i, reading.applied);
    }
    if (!(input.readabilityFraction > 0.0 && input.readabilityFraction <= 1.0)) {
        throw std::invalid_argument("evaluation: readability must be a fraction of a division "
                                    "in (0, 1]");
    }
    if (input.divisions < 0) {
        throw std::invalid_argument("evaluation: scale divisions must not be negative");
    }
}

// Readings with the same point index (or, without one, the same applied value) form a point.
std::vector<PointGroup> groupReadings(const std::vector<EvaluationReading>& readings) {
    std::vector<PointGroup> groups;
    std::vector<std::pair<int, double>> keys;
    for (const EvaluationReading& reading : readings) {
        auto found = std::find_if(keys.begin(), keys.end(), [&reading](const auto& key) {
            return reading.point >= 0 ? key.first == reading.point
                                      : key.first < 0 && sameValue(key.second, reading.applied);
        });
        if (found == keys.end()) {
            keys.emplace_back(reading.point, reading.applied);
            groups.emplace_back();
            found = keys.end() - 1;
        }
        PointGroup& group = groups[static_cast<std::size_t>(found - keys.begin())];
        group.applied.push_back(reading.applied);
        const double error = reading.indicated - reading.applied;
        (reading.direction == Direction::Up ? group.errorsUp : group.errorsDown).push_back(error);
    }
    std::sort(groups.begin(), groups.end(), [](const PointGroup& a, const PointGroup& b) {
        return mean(a.applied) < mean(b.applied);
    });
    return groups;
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

std::vector<UncertaintyComponent> typeBComponents(const EvaluationInput& input, double applied) {
    std::vector<UncertaintyComponent> components;
    if (input.referenceComponents) {
        components = input.referenceComponents(applied);
    } else if (input.reference) {
        const double rangeValue = input.referenceRangeValue.value_or(
            std::max(std::fabs(input.range.lower), std::fabs(input.range.upper)));
        components.push_back(referenceComponent(*input.reference, applied, rangeValue));
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

PointResult evaluatePoint(const EvaluationInput& input, const PointGroup& group, double fiducial,
                          double limit) {
    PointResult point;
    point.applied = mean(group.applied);
    point.readingCount = static_cast<int>(group.applied.size());
    if (!group.errorsUp.empty()) {
        point.errorUp = mean(group.errorsUp);
    }
    if (!group.errorsDown.empty()) {
        point.errorDown = mean(group.errorsDown);
    }
    if (point.errorUp && point.errorDown) {
        point.hysteresis = *point.errorDown - *point.errorUp;
    }
    // The class applies to every reading, up-scale and down-scale (common practice), so the
    // point is judged by the direction with the larger error.
    const bool downWorse = point.errorDown && (!point.errorUp || std::fabs(*point.errorDown) >
                                                                     std::fabs(*point.errorUp));
    point.error = downWorse ? *point.errorDown : *point.errorUp;
    point.indicated = point.applied + point.error;
    if (point.applied != 0.0) {
        point.errorPercentOfReading = point.error / point.applied * 100.0;
    }
    point.errorPercentOfFiducial = point.error / fiducial * 100.0;
    point.permissibleError = limit;

    point.components = typeBComponents(input, point.applied);
    addTypeA(group, downWorse ? group.errorsDown.size() : group.errorsUp.size(), point);
    point.budget = evaluateBudget(point.components, input.probability);

    const ToleranceInterval tolerance{-limit, limit};
    // The rounded-up U rather than the unrounded one: it is the larger (never narrows the guard
    // band) and it is the number printed beside the decision (see PointResult).
    const double expanded = point.budget.expandedRounded;
    point.tur = testUncertaintyRatio(tolerance.lower, tolerance.upper, expanded);
    point.turBelowMinimum = point.tur < kMinimumTur;
    point.decision = decide(point.error, expanded, tolerance, input.decision);
    point.probabilityOfFalseAccept =
        probabilityOfFalseAccept(point.error, point.budget.combined, tolerance);
    return point;
}

void addAdvice(const EvaluationInput& input, EvaluationResult& result) {
    std::vector<PointErrors> errors;
    for (const PointResult& point : result.points) {
        errors.push_back({point.applied, point.errorUp, point.errorDown});
    }
    if (errors.size() < 2) {
        return;
    }
    AdviceInput adviceInput;
    adviceInput.kind = input.kind;
    adviceInput.unit = input.unit;
    adviceInput.upperLimit = std::max(std::fabs(input.range.lower), std::fabs(input.range.upper));
    adviceInput.permissibleError = result.permissibleError;
    adviceInput.points = errors;
    if (input.predictedError) {
        std::vector<double> predicted;
        for (const PointResult& point : result.points) {
            predicted.push_back(input.predictedError(point.applied));
        }
        adviceInput.predictedErrors = predicted;
    }
    result.advice = adviseAdjustment(adviceInput);
    if (input.resistor) {
        const RangeResistor& r = input.resistor.value();
        const double span = result.advice->fit.spanFactor;
        result.correctedResistorOhms =
            r.isShunt ? correctedShuntOhms(r.presentOhms, r.movementOhms, span)
                      : correctedMultiplierOhms(r.presentOhms, r.movementOhms, span);
        result.correctedChoice = chooseResistor(*result.correctedResistorOhms, r.series);
        if (r.computedOhms) {
            result.resistorDeviation =
                compareResistor(*r.computedOhms, r.presentOhms, r.tolerancePercent);
        }
    }
}

} // namespace

EvaluationResult evaluateRange(const EvaluationInput& input) {
    validateReadings(input);
    EvaluationResult result;
    result.fiducialValue = fiducialValue(input.range);
    result.permissibleError = permissibleError(input.classIndex, result.fiducialValue);

    double worstRatio = -1.0;
    for (const PointGroup& group : groupReadings(input.readings)) {
        result.points.push_back(
            evaluatePoint(input, group, result.fiducialValue, result.permissibleError));
        const PointResult& point = result.points.back();
        result.overall = worseOf(result.overall, point.decision);
        const double ratio = std::fabs(point.error) / point.permissibleError;
        if (ratio > worstRatio) {
            worstRatio = ratio;
            result.worstPoint = result.points.size() - 1;
        }
    }
    StatementFacts facts;
    facts.phase = input.phase;
    facts.pointCount = result.points.size();
    facts.lower = input.range.lower;
    facts.upper = input.range.upper;
    facts.unit = input.unit;
    facts.classIndex = input.classIndex;
    facts.fiducialValue = result.fiducialValue;
    facts.permissibleError = result.permissibleError;
    facts.decision = input.decision;
    facts.overall = result.overall;
    result.statement = conformityStatement(facts);
    addAdvice(input, result);
    return result;
}

} // namespace mw
