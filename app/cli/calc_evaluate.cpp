// Headless `calc coverage` and `calc evaluate`: coverage factors and the evaluation of one range
// from a CSV of readings, with the same core function the bench screen uses.
#include "app/cli/cli_support.h"
#include "app/cli/command_table.h"
#include "app/cli/readings_csv.h"
#include "core/accuracy/accuracy_class.h"
#include "core/evaluation/evaluation.h"
#include "core/model/vocabulary.h"
#include "core/uncertainty/distributions.h"

#include <QJsonArray>
#include <QJsonObject>

#include <cmath>
#include <limits>

namespace mw::cli {
namespace {

QString text(std::string_view view) {
    return QString::fromUtf8(view.data(), static_cast<qsizetype>(view.size()));
}

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
        throw UsageError(QStringLiteral("option --probability \"%1\": not a number").arg(raw));
    }
    if (percent || number > 1.0) {
        number /= 100.0;
    }
    if (!(number > 0.0 && number < 1.0)) {
        throw UsageError(
            QStringLiteral("option --probability \"%1\": must lie between 0 and 100 %").arg(raw));
    }
    return std::fabs(number - 0.9545) < 5e-9 ? kProbabilityTwoSigma : number;
}

double parseDof(const QString& raw) {
    const QString value = raw.trimmed().toLower();
    if (value == QStringLiteral("inf") || value == QStringLiteral("infinity") ||
        value == QStringLiteral("\u221e")) {
        return std::numeric_limits<double>::infinity();
    }
    bool ok = false;
    const double dof = value.toDouble(&ok);
    if (!ok || !(dof > 0.0)) {
        throw UsageError(
            QStringLiteral("option --dof \"%1\": expected a number > 0 or inf").arg(raw));
    }
    return dof;
}

int runCoverage(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Coverage factor k = t_p(dof) from Student's t (JCGM 100:2008 Table G.2). A fractional "
        "dof is truncated to the next lower integer (GUM G.4.1)."));
    parser.addOption({QStringLiteral("dof"), QStringLiteral("Degrees of freedom (or inf)."),
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
    QJsonObject out;
    out[QStringLiteral("k")] = coverageFactor(dof, probability);
    out[QStringLiteral("dof")] = jsonNumber(dof);
    out[QStringLiteral("dof_used")] =
        jsonNumber(std::isinf(dof) ? dof : std::max(1.0, std::floor(dof)));
    out[QStringLiteral("probability")] = probability;
    printJson(out);
    return 0;
}

// --- evaluate -------------------------------------------------------------------------------

// "10V" -> 0 … 10 V; "-50uA..50uA" -> both limits.
ScaleRange parseRange(const QString& raw, Unit& unit, const ParseOptions& options) {
    const QStringList parts = raw.split(QStringLiteral(".."));
    if (parts.size() > 2) {
        throw UsageError(QStringLiteral("option --range \"%1\": expected 10V or -5V..5V").arg(raw));
    }
    ScaleRange range;
    try {
        const Quantity upper = parseQuantity(parts.back().trimmed().toStdString(), options);
        unit = upper.unit;
        if (unit != Unit::Volt && unit != Unit::Ampere) {
            throw UsageError(
                QStringLiteral("option --range \"%1\": give a voltage or a current with its unit, "
                               "e.g. 10V or 50uA")
                    .arg(raw));
        }
        range.upper = upper.value;
        range.lower = parts.size() == 2
                          ? parseValue(parts.front().trimmed().toStdString(), unit, options)
                          : 0.0;
    } catch (const QuantityError& error) {
        throw UsageError(QStringLiteral("option --range \"%1\": %2")
                             .arg(raw, QString::fromStdString(error.what())));
    }
    if (!(range.upper > range.lower)) {
        throw UsageError(
            QStringLiteral("option --range \"%1\": the upper limit must exceed the lower")
                .arg(raw));
    }
    return range;
}

double positiveNumber(const QCommandLineParser& parser, const QString& option) {
    bool ok = false;
    const QString raw = parser.value(option);
    const double value = raw.trimmed().toDouble(&ok);
    if (!ok || !(value > 0.0) || !std::isfinite(value)) {
        throw UsageError(
            QStringLiteral("option --%1 \"%2\": expected a number > 0").arg(option, raw));
    }
    return value;
}

QString classSeriesText() {
    QStringList indices;
    for (double index : classIndexSeries()) {
        indices << QString::fromStdString(formatPlain(index));
    }
    return indices.join(QStringLiteral(", "));
}

void addEvaluateOptions(QCommandLineParser& parser) {
    const QString valueName = QStringLiteral("VALUE");
    parser.addOption(
        {QStringLiteral("readings"),
         QStringLiteral("CSV whose header names applied, indicated and optionally direction "
                        "(up|down) and repeat. Cells are separated by ';' when the header line "
                        "holds one, else by ','. A comma inside a value is a decimal comma only "
                        "with --decimal-comma (then separate cells by ';' or quote them). Every "
                        "row must have as many cells as the header; blank lines and lines "
                        "starting with # are skipped. Messages give the file's line number "
                        "(the header is line 1)."),
         QStringLiteral("FILE")});
    parser.addOption(
        {QStringLiteral("range"), QStringLiteral("Range, e.g. 10V or -50uA..50uA."), valueName});
    parser.addOption(
        {QStringLiteral("class"),
         QStringLiteral("Accuracy class index of IEC 60051-2: %1.").arg(classSeriesText()),
         valueName});
    parser.addOption({QStringLiteral("scale"),
                      QStringLiteral("zero-at-end (default) | zero-inside | no-zero | "
                                     "non-linear; sets the fiducial value (IEC 60051-1)."),
                      valueName});
    parser.addOption(
        {QStringLiteral("fiducial"),
         QStringLiteral("Fiducial value in the range's unit, e.g. 80V, instead of the one the "
                        "scale type gives (as the relevant part of IEC 60051 may fix it for a "
                        "suppressed-zero scale); required for --scale non-linear."),
         valueName});
    parser.addOption({QStringLiteral("divisions"), QStringLiteral("Scale divisions."), valueName});
    parser.addOption({QStringLiteral("readability"),
                      QStringLiteral("Fraction of a division read (default 0.2)."), valueName});
    parser.addOption({QStringLiteral("reference"),
                      QStringLiteral("Reference spec, e.g. 0.02%rdg+0.01%rng or U=1mV,k=2."),
                      valueName});
    parser.addOption({QStringLiteral("rule"), QStringLiteral("simple | guarded."), valueName});
    parser.addOption({QStringLiteral("guard-factor"),
                      QStringLiteral("r in the guard band w = r*U (default 1)."), valueName});
    parser.addOption({QStringLiteral("rs"),
                      QStringLiteral("Multiplier (or shunt) resistance now fitted."),
                      QStringLiteral("OHM")});
    parser.addOption(
        {QStringLiteral("rm"), QStringLiteral("Movement resistance."), QStringLiteral("OHM")});
}

void addDecisionAndResistor(const QCommandLineParser& parser, EvaluationInput& input) {
    const QString rule =
        chooseOne(parser, QStringLiteral("rule"),
                  {QStringLiteral("simple"), QStringLiteral("guarded")}, QStringLiteral("simple"));
    input.decision.rule = *fromText<DecisionRule>(rule.toStdString());
    input.decision.guardFactor = parser.isSet(QStringLiteral("guard-factor"))
                                     ? positiveNumber(parser, QStringLiteral("guard-factor"))
                                     : 1.0;
    const auto rs = optionalQuantity(parser, QStringLiteral("rs"), Unit::Ohm);
    const auto rm = optionalQuantity(parser, QStringLiteral("rm"), Unit::Ohm);
    if (rs.has_value() != rm.has_value()) {
        throw UsageError(QStringLiteral("options --rs and --rm go together"));
    }
    if (rs) {
        RangeResistor resistor;
        resistor.presentOhms = *rs;
        resistor.movementOhms = *rm;
        resistor.isShunt = input.unit == Unit::Ampere;
        input.resistor = resistor;
    }
}

// Class index from the IEC 60051-2 series, scale type, and the fiducial value when given.
void addClassAndScale(const QCommandLineParser& parser, EvaluationInput& input) {
    // The series has no thousands, so "1,5" and "1.5" can only mean the same index.
    QString index = requireText(parser, QStringLiteral("class")).trimmed();
    bool ok = false;
    input.classIndex = index.replace(QLatin1Char(','), QLatin1Char('.')).toDouble(&ok);
    if (!ok || !isStandardClassIndex(input.classIndex)) {
        // The statement of conformity names the class "of IEC 60051": only the series is valid.
        throw UsageError(QStringLiteral("option --class \"%1\": not an IEC 60051-2 class index; "
                                        "use one of %2")
                             .arg(parser.value(QStringLiteral("class")), classSeriesText()));
    }
    const QString scale = chooseOne(parser, QStringLiteral("scale"),
                                    {QStringLiteral("zero-at-end"), QStringLiteral("zero-inside"),
                                     QStringLiteral("no-zero"), QStringLiteral("non-linear")},
                                    QStringLiteral("zero-at-end"));
    input.range.type = *fromText<ScaleType>(scale.toStdString());
    input.range.fiducialOverride = optionalQuantity(parser, QStringLiteral("fiducial"), input.unit);
    if (input.range.fiducialOverride && !(*input.range.fiducialOverride > 0.0)) {
        throw UsageError(QStringLiteral("option --fiducial \"%1\": must be above zero")
                             .arg(parser.value(QStringLiteral("fiducial"))));
    }
    if (input.range.type == ScaleType::NonLinear && !input.range.fiducialOverride) {
        throw UsageError(QStringLiteral("option --fiducial is required with --scale non-linear: "
                                        "no range limit defines the fiducial value of such a "
                                        "scale (IEC 60051-1)"));
    }
}

// Scale divisions and readability (the analog reading component), the reference standard.
void addReadingAids(const QCommandLineParser& parser, EvaluationInput& input) {
    if (parser.isSet(QStringLiteral("divisions"))) {
        bool ok = false;
        input.divisions = parser.value(QStringLiteral("divisions")).toInt(&ok);
        if (!ok || input.divisions < 1) {
            throw UsageError(QStringLiteral("option --divisions \"%1\": expected a whole number "
                                            ">= 1")
                                 .arg(parser.value(QStringLiteral("divisions"))));
        }
    }
    if (parser.isSet(QStringLiteral("readability"))) {
        if (input.divisions == 0) {
            throw UsageError(QStringLiteral("option --readability needs --divisions"));
        }
        input.readabilityFraction = positiveNumber(parser, QStringLiteral("readability"));
        if (input.readabilityFraction > 1.0) {
            throw UsageError(QStringLiteral("option --readability: a fraction of one division "
                                            "(0 < r <= 1)"));
        }
    }
    if (parser.isSet(QStringLiteral("reference"))) {
        try {
            input.reference = parseReferenceSpec(
                parser.value(QStringLiteral("reference")).toStdString(), input.unit);
        } catch (const std::invalid_argument& error) {
            throw UsageError(
                QStringLiteral("option --reference: %1").arg(QString::fromStdString(error.what())));
        }
    }
}

EvaluationInput inputFromOptions(const QCommandLineParser& parser, ReadingsFile& readings) {
    const bool decimalComma = decimalCommaSet(parser);
    ParseOptions options;
    options.decimalComma = decimalComma;
    EvaluationInput input;
    input.range = parseRange(requireText(parser, QStringLiteral("range")), input.unit, options);
    input.kind =
        input.unit == Unit::Ampere ? InstrumentKind::DcAmmeter : InstrumentKind::DcVoltmeter;
    addClassAndScale(parser, input);
    addReadingAids(parser, input);
    addDecisionAndResistor(parser, input);
    readings =
        readReadingsCsv(requireText(parser, QStringLiteral("readings")), input.unit, decimalComma);
    input.readings = readings.readings;
    return input;
}

QJsonObject pointJson(const PointResult& point) {
    QJsonObject out;
    auto optional = [](const std::optional<double>& value) {
        return value ? jsonNumber(*value) : QJsonValue(QJsonValue::Null);
    };
    out[QStringLiteral("applied")] = jsonNumber(point.applied);
    out[QStringLiteral("indicated")] = jsonNumber(point.indicated);
    out[QStringLiteral("error")] = jsonNumber(point.error);
    out[QStringLiteral("error_percent_of_reading")] = optional(point.errorPercentOfReading);
    out[QStringLiteral("error_percent_of_fiducial")] = jsonNumber(point.errorPercentOfFiducial);
    out[QStringLiteral("error_up")] = optional(point.errorUp);
    out[QStringLiteral("error_down")] = optional(point.errorDown);
    out[QStringLiteral("hysteresis")] = optional(point.hysteresis);
    out[QStringLiteral("repeatability")] = optional(point.repeatability);
    out[QStringLiteral("readings")] = point.readingCount;
    out[QStringLiteral("permissible_error")] = jsonNumber(point.permissibleError);
    out[QStringLiteral("u_combined")] = jsonNumber(point.budget.combined);
    out[QStringLiteral("dof_effective")] = jsonNumber(point.budget.dofEffective); // null for ∞
    out[QStringLiteral("k")] = jsonNumber(point.budget.coverageFactor);
    out[QStringLiteral("expanded_uncertainty")] = jsonNumber(point.budget.expandedRounded);
    out[QStringLiteral("tur")] = jsonNumber(point.tur);
    out[QStringLiteral("tur_below_4")] = point.turBelowMinimum;
    out[QStringLiteral("decision")] = text(toText(point.decision));
    out[QStringLiteral("probability_of_false_accept")] = jsonNumber(point.probabilityOfFalseAccept);
    QJsonArray budget;
    for (std::size_t i = 0; i < point.components.size(); ++i) {
        const UncertaintyComponent& c = point.components[i];
        QJsonObject row;
        row[QStringLiteral("name")] = QString::fromStdString(c.name);
        row[QStringLiteral("value")] = jsonNumber(c.value);
        row[QStringLiteral("divisor")] = jsonNumber(divisor(c));
        row[QStringLiteral("sensitivity")] = jsonNumber(c.sensitivity);
        row[QStringLiteral("standard_uncertainty")] = jsonNumber(standardUncertainty(c));
        row[QStringLiteral("dof")] = jsonNumber(c.dof);
        budget.append(row);
    }
    out[QStringLiteral("budget")] = budget;
    return out;
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
    out[QStringLiteral("likely_cause")] = QString::fromStdString(advice.explanation);
    out[QStringLiteral("likely_cause_code")] = text(toText(advice.cause));
    if (result.correctedResistorOhms) {
        // For a current range the resistor is the shunt; the key stays the same for scripts.
        out[QStringLiteral("corrected_multiplier_ohm")] = jsonNumber(*result.correctedResistorOhms);
        out[QStringLiteral("resistor_role")] =
            input.resistor->isShunt ? QStringLiteral("shunt") : QStringLiteral("multiplier");
        out[QStringLiteral("nearest_standard_ohm")] =
            jsonNumber(result.correctedChoice->ohms_standard);
        out[QStringLiteral("series_trim_ohm")] = jsonNumber(result.correctedChoice->ohms_trim);
    }
    return out;
}

QJsonObject resultJson(const EvaluationResult& result, const EvaluationInput& input) {
    QJsonObject out;
    QJsonObject range;
    range[QStringLiteral("lower")] = jsonNumber(input.range.lower);
    range[QStringLiteral("upper")] = jsonNumber(input.range.upper);
    range[QStringLiteral("unit")] = text(unitSymbol(input.unit));
    out[QStringLiteral("range")] = range;
    out[QStringLiteral("class")] = jsonNumber(input.classIndex);
    out[QStringLiteral("fiducial_value")] = jsonNumber(result.fiducialValue);
    out[QStringLiteral("permissible_error")] = jsonNumber(result.permissibleError);
    out[QStringLiteral("rule")] = text(toText(input.decision.rule));
    QJsonArray points;
    for (const PointResult& point : result.points) {
        points.append(pointJson(point));
    }
    out[QStringLiteral("points")] = points;
    out[QStringLiteral("worst_point")] = static_cast<int>(result.worstPoint);
    out[QStringLiteral("overall")] = text(toText(result.overall));
    out[QStringLiteral("statement")] = QString::fromStdString(result.statement);
    out[QStringLiteral("advice")] = adviceJson(result, input);
    return out;
}

void printTable(const EvaluationResult& result, const EvaluationInput& input) {
    const auto eng = [&input](double value, int digits) {
        return QString::fromStdString(formatEngineering(value, digits, input.unit));
    };
    printLine(QStringLiteral("%1 %2 %3 %4 %5 %6")
                  .arg(QStringLiteral("applied"), 12)
                  .arg(QStringLiteral("error"), 12)
                  .arg(QStringLiteral("limit"), 12)
                  .arg(QStringLiteral("U"), 12)
                  .arg(QStringLiteral("TUR"), 8)
                  .arg(QStringLiteral("decision")));
    for (const PointResult& p : result.points) {
        // U is already rounded up to two significant digits; printing two keeps it exact.
        printLine(QStringLiteral("%1 %2 %3 %4 %5 %6")
                      .arg(eng(p.applied, 5), 12)
                      .arg(eng(p.error, 3), 12)
                      .arg(eng(p.permissibleError, 3), 12)
                      .arg(eng(p.budget.expandedRounded, 2), 12)
                      .arg(QString::fromStdString(formatPlain(p.tur)), 8)
                      .arg(text(displayName(p.decision))));
    }
    printLine(QStringLiteral("overall: %1").arg(text(displayName(result.overall))));
    printLine(QString::fromStdString(result.statement));
    if (result.advice) {
        printLine(QStringLiteral("advice: ") + QString::fromStdString(result.advice->explanation));
    }
}

int runEvaluate(const QStringList& arguments) {
    QCommandLineParser parser;
    parser.setApplicationDescription(
        QStringLiteral("Evaluate the readings of one range: errors, uncertainty (GUM), decision "
                       "(ILAC G8:09/2019), statement of conformity and adjustment advice.\n"
                       "In --json output, a point's dof_effective is null when the effective "
                       "degrees of freedom are infinite (k is then 2 for 95.45 %), and "
                       "expanded_uncertainty is U rounded UP to two significant digits (JCGM "
                       "100:2008 7.2.6); tur and the decision use that rounded U."));
    addEvaluateOptions(parser);
    parseOptions(parser, QStringLiteral("calc evaluate"), arguments, ReadsValues::Yes);
    if (helpRequested(parser, QStringLiteral("calc evaluate"))) {
        return 0;
    }
    ReadingsFile readings;
    const EvaluationInput input = inputFromOptions(parser, readings);
    EvaluationResult result;
    try {
        result = evaluateRange(input);
    } catch (const std::invalid_argument& error) {
        throw UsageError(messageWithCsvLine(QString::fromStdString(error.what()), readings));
    }
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(resultJson(result, input));
    } else {
        printTable(result, input);
    }
    return 0;
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
