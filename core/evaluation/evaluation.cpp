// Evaluation of the readings of one range: validation, the points, the overall outcome, what
// the budget leaves out, cautions, the statement and the advice.
#include "core/evaluation/evaluation.h"

#include "core/circuits/hazard.h"
#include "core/evaluation/point_evaluation.h"
#include "core/evaluation/statement.h"
#include "core/plan/test_plan.h"

#include <algorithm>
#include <cmath>
#include <string>
#include <utility>

namespace mw {
namespace {

std::string readingPrefix(std::optional<std::size_t> readingNumber) {
    return readingNumber ? "reading " + std::to_string(*readingNumber) + " " : std::string();
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
    throw EvaluationError(
        "applied", index + 1,
        "has an applied value of " + show(applied) + ", outside the range's scale " + show(lower) +
            " … " + show(upper) + " (by more than " +
            formatEngineering(100.0 * kScaleEndAllowance, 2, Unit::Percent) + " of the span)");
}

// Runs `step`, turning the std::invalid_argument of a lower layer into an EvaluationError
// naming `field`.
template <typename Step>
auto naming(const std::string& field, Step step) {
    try {
        return step();
    } catch (const EvaluationError&) {
        throw;
    } catch (const std::invalid_argument& error) {
        throw EvaluationError(field, std::nullopt, error.what());
    }
}

void validateInput(const EvaluationInput& input) {
    if (input.readings.empty()) {
        throw EvaluationError("readings", std::nullopt, "there are no readings");
    }
    naming("range", [&input] { return fiducialValue(input.range); });
    for (std::size_t i = 0; i < input.readings.size(); ++i) {
        const EvaluationReading& reading = input.readings[i];
        if (!std::isfinite(reading.applied)) {
            throw EvaluationError("applied", i + 1,
                                  "has an applied value that is not a finite "
                                  "number");
        }
        if (!std::isfinite(reading.indicated)) {
            throw EvaluationError("indicated", i + 1,
                                  "has an indicated value that is not a "
                                  "finite number");
        }
        if (reading.repeat < 0) {
            throw EvaluationError("repeat", i + 1, "has a negative repeat number");
        }
        requireOnScale(input, i, reading.applied);
    }
    if (!(input.readabilityFraction > 0.0 && input.readabilityFraction <= 1.0)) {
        throw EvaluationError("readability", std::nullopt,
                              "readability must be a fraction of a division in (0, 1]");
    }
    if (input.divisions < 0) {
        throw EvaluationError("divisions", std::nullopt, "scale divisions must not be negative");
    }
    if (!(input.probability > 0.0 && input.probability < 1.0)) {
        throw EvaluationError("probability", std::nullopt,
                              "the coverage probability must lie between 0 and 1");
    }
    if (hasGuardBand(input.decision.rule) &&
        !(input.decision.guardFactor >= 0.0 && std::isfinite(input.decision.guardFactor))) {
        throw EvaluationError("decision", std::nullopt,
                              "the guard-band factor r must be a number >= 0, got " +
                                  formatPlain(input.decision.guardFactor));
    }
    if (input.referenceRangeValue &&
        !(*input.referenceRangeValue > 0.0 && std::isfinite(*input.referenceRangeValue))) {
        throw EvaluationError("reference", std::nullopt,
                              "the reference standard's range must be a value above zero");
    }
}

double referenceRange(const EvaluationInput& input) {
    return input.referenceRangeValue.value_or(
        std::max(std::fabs(input.range.lower), std::fabs(input.range.upper)));
}

std::vector<OmittedComponent> omittedComponents(const EvaluationInput& input) {
    std::vector<OmittedComponent> omitted;
    if (!input.reference && !input.referenceComponents) {
        omitted.push_back({"reference standard",
                           "no uncertainty of the reference standard was given, so U understates "
                           "the uncertainty of the calibration and no TUR is stated"});
    }
    if (input.divisions == 0) {
        omitted.push_back({"readability of the scale",
                           "no number of scale divisions was given, so reading the analog scale "
                           "adds nothing to U"});
    }
    return omitted;
}

VoltageKind voltageKindOf(InstrumentKind kind) {
    // A multi-range meter may be on an AC range: the stricter AC limits are checked.
    return kind == InstrumentKind::DcVoltmeter || kind == InstrumentKind::DcAmmeter
               ? VoltageKind::Dc
               : VoltageKind::AcRms;
}

// The largest voltage the range and its readings put on the terminals, against IEC 61010-1.
std::optional<std::string> hazardOf(const EvaluationInput& input) {
    if (input.unit != Unit::Volt) {
        return std::nullopt;
    }
    double largest = std::max(std::fabs(input.range.lower), std::fabs(input.range.upper));
    for (const EvaluationReading& reading : input.readings) {
        largest = std::max({largest, std::fabs(reading.applied), std::fabs(reading.indicated)});
    }
    return hazardCaution(largest, voltageKindOf(input.kind));
}

void addCautions(const EvaluationInput& input, EvaluationResult& result) {
    if (result.hazardCaution) {
        result.cautions.push_back(*result.hazardCaution);
    }
    for (const OmittedComponent& omitted : result.omittedComponents) {
        result.cautions.push_back("Left out of the uncertainty budget: " + omitted.name + " (" +
                                  omitted.reason + ").");
    }
    const auto below = std::count_if(result.points.begin(), result.points.end(),
                                     [](const PointResult& p) { return p.turBelowMinimum; });
    if (input.decision.rule == DecisionRule::SimpleAcceptance && below > 0) {
        result.cautions.push_back(
            "Simple acceptance with a TUR below 4:1 at " + std::to_string(below) +
            (below == 1 ? " point" : " points") +
            ": the uncertainty is large against the limit, so an error near the limit may be "
            "accepted wrongly with up to 50 % probability (ILAC G8:09/2019 4.2.1); consider a "
            "guard band (ILAC G8:09/2019 4.2.2 or 4.2.3) or a better reference.");
    }
    if (result.referenceRangeAssumed) {
        result.cautions.push_back(
            "The reference's \"% of range\" term was taken on " +
            formatEngineering(*result.referenceRangeValue, 4, input.unit) +
            ", the meter range's limit; the standard's own range may differ.");
    }
}

StatementFacts statementFacts(const EvaluationInput& input, const EvaluationResult& result) {
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
    facts.probability = input.probability;
    for (const PointResult& point : result.points) {
        if (point.decision != Outcome::Pass) {
            facts.findings.push_back(
                {point.applied, point.error, point.budget.expandedRounded, point.decision});
        }
    }
    if (input.reference) {
        facts.referenceSpec = describeReferenceSpec(*input.reference, input.unit);
    }
    facts.referenceIdentity = input.referenceIdentity;
    for (const OmittedComponent& omitted : result.omittedComponents) {
        facts.omittedComponents.push_back(omitted.name);
    }
    return facts;
}

void addAdvice(const EvaluationInput& input, EvaluationResult& result) {
    std::vector<PointErrors> errors;
    double largestU = 0.0;
    for (const PointResult& point : result.points) {
        errors.push_back({point.applied, point.errorUp, point.errorDown});
        largestU = std::max(largestU, point.budget.expandedRounded);
    }
    if (errors.size() < 2) {
        return;
    }
    AdviceInput adviceInput;
    adviceInput.kind = input.kind;
    adviceInput.unit = input.unit;
    adviceInput.upperLimit = std::max(std::fabs(input.range.lower), std::fabs(input.range.upper));
    adviceInput.permissibleError = result.permissibleError;
    adviceInput.expandedUncertainty = largestU;
    adviceInput.points = errors;
    if (input.predictedError) {
        std::vector<double> predicted;
        for (const PointResult& point : result.points) {
            predicted.push_back(input.predictedError(point.applied));
        }
        adviceInput.predictedErrors = predicted;
    }
    result.advice = adviseAdjustment(adviceInput);
    const Advice& advice = *result.advice;
    const bool spanMatters = advice.cause == LikelyCause::Span ||
                             std::find(advice.alsoSignificant.begin(), advice.alsoSignificant.end(),
                                       LikelyCause::Span) != advice.alsoSignificant.end();
    if (input.resistor && spanMatters) {
        const RangeResistor& r = input.resistor.value();
        const double span = advice.fit.spanFactor;
        result.correctedResistorOhms =
            r.isShunt ? correctedShuntOhms(r.presentOhms, r.movementOhms, span)
                      : correctedMultiplierOhms(r.presentOhms, r.movementOhms, span);
        result.correctedChoice = chooseResistor(*result.correctedResistorOhms, r.series);
    }
    if (input.resistor && input.resistor->computedOhms) {
        const RangeResistor& r = input.resistor.value();
        result.resistorDeviation =
            compareResistor(*r.computedOhms, r.presentOhms, r.tolerancePercent);
    }
}

} // namespace

EvaluationError::EvaluationError(std::string field, std::optional<std::size_t> readingNumber,
                                 const std::string& detail,
                                 std::optional<std::size_t> conflictingReadingNumber)
    : std::invalid_argument("evaluation: " + readingPrefix(readingNumber) + detail)
    , field_(std::move(field))
    , readingNumber_(readingNumber)
    , conflictingReadingNumber_(conflictingReadingNumber)
    , detail_(detail) {}

EvaluationResult evaluateRange(const EvaluationInput& input) {
    validateInput(input);
    EvaluationResult result;
    result.fiducialValue = fiducialValue(input.range);
    const ExactDecimal limit = naming(
        "class index", [&input] { return exactPermissibleError(input.classIndex, input.range); });
    result.permissibleError = limit.toDouble();
    if (input.reference) {
        result.referenceRangeValue = referenceRange(input);
        result.referenceRangeAssumed =
            !input.referenceRangeValue && input.reference->fractionOfRange > 0.0;
    }
    const double rangeForReference = referenceRange(input);

    std::optional<ExactMean> worst;
    for (const evaluation::PointGroup& group :
         evaluation::groupReadings(input.readings, input.unit)) {
        const evaluation::EvaluatedPoint point = naming("component", [&] {
            return evaluation::evaluatePoint(input, group, result.fiducialValue, limit,
                                             rangeForReference);
        });
        result.points.push_back(point.result);
        result.overall = worseOf(result.overall, point.result.decision);
        if (!worst || point.error.compareMagnitude(*worst) > 0) {
            worst = point.error;
            result.worstPoint = result.points.size() - 1;
        }
    }
    result.omittedComponents = omittedComponents(input);
    result.hazardCaution = hazardOf(input);
    addCautions(input, result);
    naming("readings", [&] {
        addAdvice(input, result);
        return 0;
    });
    result.statement = conformityStatement(statementFacts(input, result));
    return result;
}

} // namespace mw
