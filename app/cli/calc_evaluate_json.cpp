// The JSON document of `calc evaluate --json`.
#include "app/cli/calc_evaluate_output.h"

#include "app/cli/cli_support.h"
#include "core/model/vocabulary.h"

#include <QJsonArray>

namespace mw::cli {
namespace {

QString text(std::string_view view) {
    return QString::fromUtf8(view.data(), static_cast<qsizetype>(view.size()));
}

QJsonValue optionalNumber(const std::optional<double>& value) {
    return value ? jsonNumber(*value) : QJsonValue(QJsonValue::Null);
}

std::string_view distributionName(Distribution distribution) {
    switch (distribution) {
    case Distribution::Normal:
        return "normal";
    case Distribution::Rectangular:
        return "rectangular";
    case Distribution::Triangular:
        return "triangular";
    case Distribution::UShaped:
        return "u-shaped";
    }
    return "?";
}

QJsonArray budgetJson(const PointResult& point) {
    QJsonArray budget;
    for (std::size_t i = 0; i < point.components.size(); ++i) {
        const UncertaintyComponent& c = point.components[i];
        QJsonObject row;
        row[QStringLiteral("name")] = QString::fromStdString(c.name);
        row[QStringLiteral("value")] = jsonNumber(c.value);
        row[QStringLiteral("distribution")] = text(distributionName(c.distribution));
        row[QStringLiteral("divisor")] = jsonNumber(divisor(c));
        row[QStringLiteral("sensitivity")] = jsonNumber(c.sensitivity);
        row[QStringLiteral("standard_uncertainty")] = jsonNumber(standardUncertainty(c));
        row[QStringLiteral("contribution")] = jsonNumber(point.budget.contributions.at(i));
        row[QStringLiteral("dof")] = jsonNumber(c.dof); // null for infinite
        budget.append(row);
    }
    return budget;
}

QJsonObject pointJson(const PointResult& point) {
    QJsonObject out;
    out[QStringLiteral("applied")] = jsonNumber(point.applied);
    out[QStringLiteral("indicated")] = jsonNumber(point.indicated);
    out[QStringLiteral("error")] = jsonNumber(point.error);
    out[QStringLiteral("error_percent_of_reading")] = optionalNumber(point.errorPercentOfReading);
    out[QStringLiteral("error_percent_of_fiducial")] = jsonNumber(point.errorPercentOfFiducial);
    out[QStringLiteral("error_up")] = optionalNumber(point.errorUp);
    out[QStringLiteral("error_down")] = optionalNumber(point.errorDown);
    out[QStringLiteral("hysteresis")] = optionalNumber(point.hysteresis);
    out[QStringLiteral("repeatability")] = optionalNumber(point.repeatability);
    out[QStringLiteral("readings")] = point.readingCount;
    out[QStringLiteral("permissible_error")] = jsonNumber(point.permissibleError);
    out[QStringLiteral("u_combined")] = jsonNumber(point.budget.combined);
    out[QStringLiteral("dof_effective")] = jsonNumber(point.budget.dofEffective); // null for ∞
    out[QStringLiteral("k")] = jsonNumber(point.budget.coverageFactor);
    out[QStringLiteral("expanded_uncertainty")] = jsonNumber(point.budget.expandedRounded);
    out[QStringLiteral("tur")] = optionalNumber(point.tur);
    out[QStringLiteral("tur_text")] =
        point.tur ? QJsonValue(QString::fromStdString(point.turText)) : QJsonValue();
    out[QStringLiteral("tur_below_4")] =
        point.tur ? QJsonValue(point.turBelowMinimum) : QJsonValue(QJsonValue::Null);
    out[QStringLiteral("decision")] = text(toText(point.decision));
    out[QStringLiteral("conformance_probability")] = jsonNumber(point.conformanceProbability);
    out[QStringLiteral("specific_risk")] = optionalNumber(point.specificRisk);
    out[QStringLiteral("risk_dof")] = jsonNumber(point.riskDof); // null for the normal law
    out[QStringLiteral("budget")] = budgetJson(point);
    return out;
}

QJsonArray effectsJson(const Advice& advice) {
    QJsonArray effects;
    for (const AdviceEffect& effect : advice.effects) {
        effects.append(QJsonObject{
            {QStringLiteral("cause"), text(toText(effect.cause))},
            {QStringLiteral("size"), jsonNumber(effect.size)},
            {QStringLiteral("fraction_of_limit"), jsonNumber(effect.fractionOfLimit)},
            {QStringLiteral("significant"), effect.significant},
        });
    }
    return effects;
}

QJsonObject adviceJson(const EvaluationResult& result, const EvaluationInput& input) {
    QJsonObject out;
    const QJsonValue null(QJsonValue::Null);
    if (!result.advice) {
        for (const char* key : {"zero_offset", "span_factor", "nonlinearity", "hysteresis"}) {
            out[QLatin1String(key)] = null;
        }
        out[QStringLiteral("likely_cause")] =
            QStringLiteral("not enough points: a zero and span fit needs two applied values");
        return out;
    }
    const Advice& advice = *result.advice;
    out[QStringLiteral("zero_offset")] = jsonNumber(advice.fit.zeroOffset);
    out[QStringLiteral("span_factor")] = jsonNumber(advice.fit.spanFactor);
    out[QStringLiteral("nonlinearity")] = jsonNumber(advice.fit.nonlinearity);
    out[QStringLiteral("hysteresis")] = jsonNumber(advice.hysteresis);
    out[QStringLiteral("adjustment_needed")] = advice.adjustmentNeeded;
    out[QStringLiteral("worst_error_fraction_of_limit")] =
        jsonNumber(advice.worstErrorFractionOfLimit);
    out[QStringLiteral("effects")] = effectsJson(advice);
    out[QStringLiteral("likely_cause")] = QString::fromStdString(advice.explanation);
    out[QStringLiteral("likely_cause_code")] = text(toText(advice.cause));
    if (result.correctedResistorOhms) {
        // For a current range the resistor is the shunt; the key stays the same for scripts.
        const ResistorChoice& choice = *result.correctedChoice;
        out[QStringLiteral("corrected_multiplier_ohm")] = jsonNumber(*result.correctedResistorOhms);
        out[QStringLiteral("resistor_role")] =
            input.resistor->isShunt ? QStringLiteral("shunt") : QStringLiteral("multiplier");
        out[QStringLiteral("nearest_standard_ohm")] = jsonNumber(choice.ohms_standard);
        out[QStringLiteral("series_trim_ohm")] =
            choice.trimPractical ? jsonNumber(choice.ohms_trim) : null;
        out[QStringLiteral("trim_note")] =
            choice.trimPractical ? null : QJsonValue(QString::fromStdString(choice.trimNote));
    }
    return out;
}

QJsonArray omittedJson(const EvaluationResult& result) {
    QJsonArray omitted;
    for (const OmittedComponent& component : result.omittedComponents) {
        omitted.append(
            QJsonObject{{QStringLiteral("name"), QString::fromStdString(component.name)},
                        {QStringLiteral("reason"), QString::fromStdString(component.reason)}});
    }
    return omitted;
}

} // namespace

QJsonObject evaluationJson(const EvaluationResult& result, const EvaluateRequest& request) {
    return evaluationJson(result, request.input);
}

QJsonObject evaluationJson(const EvaluationResult& result, const EvaluationInput& input) {
    QJsonObject out;
    QJsonObject range;
    range[QStringLiteral("lower")] = jsonNumber(input.range.lower);
    range[QStringLiteral("upper")] = jsonNumber(input.range.upper);
    range[QStringLiteral("unit")] = text(unitSymbol(input.unit));
    out[QStringLiteral("range")] = range;
    out[QStringLiteral("class")] = jsonNumber(input.classIndex);
    out[QStringLiteral("fiducial_value")] = jsonNumber(result.fiducialValue);
    out[QStringLiteral("permissible_error")] = jsonNumber(result.permissibleError);
    out[QStringLiteral("phase")] = text(toText(input.phase));
    out[QStringLiteral("rule")] = text(toText(input.decision.rule));
    out[QStringLiteral("guard_factor")] = hasGuardBand(input.decision.rule)
                                              ? jsonNumber(input.decision.guardFactor)
                                              : QJsonValue(QJsonValue::Null);
    out[QStringLiteral("reference_range")] = QJsonObject{
        {QStringLiteral("value"), optionalNumber(result.referenceRangeValue)},
        {QStringLiteral("assumed"), result.referenceRangeAssumed},
    };
    out[QStringLiteral("omitted_components")] = omittedJson(result);
    QJsonArray points;
    for (const PointResult& point : result.points) {
        points.append(pointJson(point));
    }
    out[QStringLiteral("points")] = points;
    out[QStringLiteral("worst_point")] = static_cast<int>(result.worstPoint);
    out[QStringLiteral("overall")] = text(toText(result.overall));
    out[QStringLiteral("hazard_caution")] =
        result.hazardCaution ? QJsonValue(QString::fromStdString(*result.hazardCaution))
                             : QJsonValue(QJsonValue::Null);
    QJsonArray cautions;
    for (const std::string& caution : result.cautions) {
        cautions.append(QString::fromStdString(caution));
    }
    out[QStringLiteral("cautions")] = cautions;
    out[QStringLiteral("statement")] = QString::fromStdString(result.statement);
    out[QStringLiteral("advice")] = adviceJson(result, input);
    return out;
}

} // namespace mw::cli
