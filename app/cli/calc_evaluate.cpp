// Headless `calc coverage` and `calc evaluate`: coverage factors and the evaluation of one range
// from a CSV of readings, with the same core function the bench screen uses.
#include "app/cli/calc_evaluate_options.h"
#include "app/cli/calc_evaluate_output.h"
#include "app/cli/cli_support.h"
#include "app/cli/command_table.h"
#include "core/evaluation/evaluation.h"
#include "core/uncertainty/budget.h"
#include "core/uncertainty/distributions.h"
#include "core/units/quantity.h"

#include <QJsonObject>

#include <cmath>
#include <limits>

namespace mw::cli {
namespace {

constexpr int kCheckFailed = 1;

// "95.45%", "95.45" and "0.9545" all mean the GUM's ±2σ level; 95.45 % is taken as erf(√2)
// because that is what Table G.2's column means (so that k(∞) = 2 exactly).
double parseProbability(const QString& raw) {
    QString value = raw.trimmed();
    const bool percent = value.endsWith(QLatin1Char('%'));
    if (percent) {
        value.chop(1);
    }
    bool ok = false;
    double number = value.trimmed().toDouble(&ok);
    if (!ok || !std::isfinite(number)) {
        throw UsageError(
            QStringLiteral("option --probability \"%1\": not a number").arg(excerpt(raw)));
    }
    if (percent || number > 1.0) {
        number /= 100.0;
    }
    if (!(number > 0.0 && number < 1.0)) {
        throw UsageError(QStringLiteral("option --probability \"%1\": must lie between 0 and 100 %")
                             .arg(excerpt(raw)));
    }
    return std::fabs(number - 0.9545) < 5e-9 ? kProbabilityTwoSigma : number;
}

// Table G.2 starts at ν = 1, and truncation takes a fraction to the next lower integer, so a ν
// below 1 has no row to enter: refused rather than silently read as 1.
double parseDof(const QString& raw) {
    const QString value = raw.trimmed().toLower();
    if (value == QStringLiteral("inf") || value == QStringLiteral("infinity") ||
        value == QStringLiteral("\u221e")) {
        return std::numeric_limits<double>::infinity();
    }
    bool ok = false;
    const double dof = value.toDouble(&ok);
    if (!ok || !(dof > 0.0) || !std::isfinite(dof)) {
        throw UsageError(
            QStringLiteral("option --dof \"%1\": expected a number >= 1 or inf").arg(excerpt(raw)));
    }
    if (dof < 1.0) {
        throw UsageError(QStringLiteral("option --dof \"%1\": truncated to the next lower integer "
                                        "it is 0, and JCGM 100:2008 Table G.2 starts at 1 degree "
                                        "of freedom")
                             .arg(excerpt(raw)));
    }
    return dof;
}

int runCoverage(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Coverage factor k = t_p(dof) from Student's t (JCGM 100:2008 Table G.2). A fractional "
        "dof is truncated to the next lower integer (GUM G.4.1), so it must be at least 1."));
    parser.addOption({QStringLiteral("dof"), QStringLiteral("Degrees of freedom, >= 1 (or inf)."),
                      QStringLiteral("N")});
    parser.addOption({QStringLiteral("probability"),
                      QStringLiteral("Coverage probability (default 95.45%)."),
                      QStringLiteral("P")});
    parseOptions(parser, QStringLiteral("calc coverage"), arguments);
    if (helpRequested(parser, QStringLiteral("calc coverage"))) {
        return 0;
    }
    const double dof = parseDof(requireText(parser, QStringLiteral("dof")));
    const double probability = parser.isSet(QStringLiteral("probability"))
                                   ? parseProbability(parser.value(QStringLiteral("probability")))
                                   : kProbabilityTwoSigma;
    const double used = tableDof(dof);
    const double k = coverageFactor(dof, probability);
    requireFinite({{"coverage factor k", k}}, QStringLiteral("--dof and --probability"));
    if (parser.isSet(QStringLiteral("json"))) {
        QJsonObject out;
        out[QStringLiteral("k")] = jsonNumber(k);
        out[QStringLiteral("dof")] = jsonNumber(dof);
        out[QStringLiteral("dof_used")] = jsonNumber(used);
        out[QStringLiteral("probability")] = probability;
        printJson(out);
        return 0;
    }
    const QString usedText = std::isinf(used) ? QStringLiteral("inf") : QString::number(used);
    printLine(QStringLiteral("k = %1 for %2 degrees of freedom%3 at %4 % coverage probability")
                  .arg(QString::number(k, 'f', 3), usedText,
                       used != dof ? QStringLiteral(" (%1 truncated)")
                                         .arg(QString::fromStdString(formatPlain(dof)))
                                   : QString(),
                       QString::number(100.0 * probability, 'g', 6)));
    return 0;
}

// The options every number of an evaluation may come from.
const QString kEvaluationInputs = QStringLiteral(
    "--range, --fiducial, --reference, --reference-range, --reference-resolution, --divisions, "
    "--readability, --ambient, --reference-temperature, --tempco, --rs, --rm, --guard-factor "
    "and the readings");

// Degrees of freedom may be infinite (the normal law) but never NaN.
double dofForCheck(double dof) {
    return std::isinf(dof) && dof > 0.0 ? 0.0 : dof;
}

void requireFinitePoint(const PointResult& p, const Unit unit) {
    const QString inputs =
        QStringLiteral("%1, at the point %2")
            .arg(kEvaluationInputs, QString::fromStdString(formatEngineering(p.applied, 5, unit)));
    requireFinite({{"indication", p.indicated},
                   {"error", p.error},
                   {"error in % of reading", p.errorPercentOfReading.value_or(0.0)},
                   {"error in % of the fiducial value", p.errorPercentOfFiducial},
                   {"error going up", p.errorUp.value_or(0.0)},
                   {"error going down", p.errorDown.value_or(0.0)},
                   {"hysteresis", p.hysteresis.value_or(0.0)},
                   {"repeatability", p.repeatability.value_or(0.0)},
                   {"limit of error", p.permissibleError},
                   {"combined standard uncertainty", p.budget.combined},
                   {"effective degrees of freedom", dofForCheck(p.budget.dofEffective)},
                   {"coverage factor", p.budget.coverageFactor},
                   {"expanded uncertainty", p.budget.expanded},
                   {"rounded expanded uncertainty", p.budget.expandedRounded},
                   {"TUR", p.tur.value_or(0.0)},
                   {"conformance probability", p.conformanceProbability},
                   {"specific risk", p.specificRisk.value_or(0.0)},
                   {"degrees of freedom of the risk", dofForCheck(p.riskDof)}},
                  inputs);
    for (std::size_t i = 0; i < p.components.size(); ++i) {
        const UncertaintyComponent& c = p.components[i];
        requireFinite({{"value of a budget component", c.value},
                       {"divisor of a budget component", divisor(c)},
                       {"sensitivity coefficient of a budget component", c.sensitivity},
                       {"standard uncertainty of a budget component", standardUncertainty(c)},
                       {"contribution of a budget component", p.budget.contributions.at(i)},
                       {"degrees of freedom of a budget component", dofForCheck(c.dof)}},
                      inputs);
    }
}

// Every number the text or the JSON of an evaluation shows, and those its sentences quote.
void requireFiniteEvaluation(const EvaluationResult& result, const EvaluationInput& input) {
    requireFinite({{"fiducial value", result.fiducialValue},
                   {"limit of error", result.permissibleError},
                   {"range of the reference", result.referenceRangeValue.value_or(0.0)}},
                  kEvaluationInputs);
    for (const PointResult& point : result.points) {
        requireFinitePoint(point, input.unit);
    }
    if (result.advice) {
        const Advice& advice = *result.advice;
        requireFinite(
            {{"zero offset", advice.fit.zeroOffset},
             {"span factor", advice.fit.spanFactor},
             {"non-linearity", advice.fit.nonlinearity},
             {"hysteresis", advice.hysteresis},
             {"zero effect", advice.zeroEffect},
             {"span effect", advice.spanEffect},
             {"worst error as a fraction of the limit", advice.worstErrorFractionOfLimit}},
            kEvaluationInputs);
        for (const AdviceEffect& effect : advice.effects) {
            requireFinite({{"size of an effect", effect.size},
                           {"effect as a fraction of the limit", effect.fractionOfLimit}},
                          kEvaluationInputs);
        }
    }
    if (result.correctedResistorOhms && result.correctedChoice) {
        requireFinite({{"corrected resistor", *result.correctedResistorOhms},
                       {"nearest standard resistor", result.correctedChoice->ohms_standard},
                       {"series trim", result.correctedChoice->ohms_trim}},
                      kEvaluationInputs);
    }
    if (result.resistorDeviation) {
        requireFinite({{"deviation of the resistor", result.resistorDeviation->deviationPercent}},
                      kEvaluationInputs);
    }
}

int runEvaluate(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Evaluate the readings of one range: errors, uncertainty budget (GUM), decision "
        "(ILAC G8:09/2019), statement of conformity, cautions and adjustment advice.\n"
        "Exit code: 0 when the overall outcome is pass or conditional pass, 1 when it is fail "
        "or conditional fail, 2 for a usage or input error.\n"
        "Every comparison with a limit, an acceptance limit or the 4:1 TUR is made exactly on "
        "the decimals as typed. Without --reference the budget leaves out the reference "
        "standard (and there is no TUR); without --divisions it leaves out the readability of "
        "the scale; the result says so.\n"
        "In --json output, a point's dof_effective is null when the effective degrees of "
        "freedom are infinite (k is then 2 for 95.45 %), and expanded_uncertainty is U rounded "
        "UP to two significant digits (JCGM 100:2008 7.2.6); tur and the decision use that "
        "rounded U. specific_risk (JCGM 106:2012) is the probability that an accepted point's "
        "true error lies outside the limits, from the t-distribution at the point's "
        "effective degrees of freedom (risk_dof, null for the normal law); a rejected point "
        "has none, and its conformance_probability says how likely it conforms after all."));
    addEvaluateOptions(parser);
    parseOptions(parser, QStringLiteral("calc evaluate"), arguments, ReadsValues::Yes);
    if (helpRequested(parser, QStringLiteral("calc evaluate"))) {
        return 0;
    }
    const EvaluateRequest request = evaluateRequestFrom(parser);
    EvaluationResult result;
    try {
        result = evaluateRange(request.input);
    } catch (const EvaluationError& error) {
        throw UsageError(messageWithCsvLine(error, request.readings));
    }
    requireFiniteEvaluation(result, request.input);
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(evaluationJson(result, request));
    } else {
        printEvaluation(result, request);
    }
    return isAccepted(result.overall) ? 0 : kCheckFailed;
}

} // namespace

std::vector<Command> evaluationCalcCommands() {
    return {
        {QStringLiteral("coverage"),
         QStringLiteral("coverage factor k from Student's t (GUM Table G.2)"), runCoverage},
        {QStringLiteral("evaluate"),
         QStringLiteral("errors, uncertainty, decision and advice for one range from a CSV"),
         runEvaluate},
    };
}

} // namespace mw::cli
