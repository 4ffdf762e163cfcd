// Options of `calc evaluate` turned into an EvaluationInput, with every user mistake named.
#include "app/cli/calc_evaluate_options.h"

#include "app/cli/cli_support.h"
#include "core/accuracy/accuracy_class.h"
#include "core/circuits/coil_temperature.h"
#include "core/model/vocabulary.h"

#include <cmath>

namespace mw::cli {
namespace {

const QString kValue = QStringLiteral("VALUE");

// "10V" -> 0 … 10 V; "-50uA..50uA" -> both limits. A bare lower limit ("-50..50uA") is in
// the upper limit's prefix, like every bare number of the command.
ScaleRange parseRange(const QString& raw, Unit& unit, int& prefixPower,
                      const ParseOptions& options) {
    const QStringList parts = raw.split(QStringLiteral(".."));
    if (parts.size() > 2) {
        throw UsageError(
            QStringLiteral("option --range \"%1\": expected 10V or -5V..5V").arg(excerpt(raw)));
    }
    ScaleRange range;
    try {
        const Quantity upper = parseQuantity(parts.back().trimmed().toStdString(), options);
        unit = upper.unit;
        if (unit != Unit::Volt && unit != Unit::Ampere) {
            throw UsageError(
                QStringLiteral("option --range \"%1\": give a voltage or a current with its unit, "
                               "e.g. 10V or 50uA")
                    .arg(excerpt(raw)));
        }
        prefixPower = upper.prefixPower;
        ParseOptions lowerOptions = options;
        lowerOptions.bareNumberPowerOfTen = prefixPower;
        range.upper = upper.value;
        range.lower = parts.size() == 2
                          ? parseValue(parts.front().trimmed().toStdString(), unit, lowerOptions)
                          : 0.0;
    } catch (const QuantityError& error) {
        throw UsageError(QStringLiteral("option --range \"%1\": %2")
                             .arg(excerpt(raw), QString::fromStdString(error.what())));
    }
    if (!(range.upper > range.lower)) {
        throw UsageError(
            QStringLiteral("option --range \"%1\": the upper limit must exceed the lower")
                .arg(excerpt(raw)));
    }
    return range;
}

double positiveNumber(const QCommandLineParser& parser, const QString& option) {
    bool ok = false;
    const QString raw = parser.value(option);
    const double value = raw.trimmed().toDouble(&ok);
    if (!ok || !(value > 0.0) || !std::isfinite(value)) {
        throw UsageError(
            QStringLiteral("option --%1 \"%2\": expected a number > 0").arg(option, excerpt(raw)));
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

void addReadingsAndScaleOptions(QCommandLineParser& parser) {
    parser.addOption(
        {QStringLiteral("readings"),
         QStringLiteral(
             "CSV whose header names applied, indicated and optionally direction (up|down) and "
             "repeat. A number without a unit is in the range's unit as the meter's scale shows "
             "it, with the prefix typed in --range (on --range 50uA, -50 is -50 µA); a number "
             "with a unit (0.05mA, 2 V) is converted. A repeat number may appear only once at a "
             "point and direction; without one, readings at the same applied value are repeats "
             "in file order. Cells are separated by ';' when the header line holds one, else by "
             "','. A comma inside a value is a decimal comma only with --decimal-comma (then "
             "separate cells by ';' or quote them). Every row must have as many cells as the "
             "header; blank lines and lines starting with # are skipped. Messages give the "
             "file's line number (the header is line 1). A regular file of at most 4 MiB."),
         QStringLiteral("FILE")});
    parser.addOption({QStringLiteral("range"),
                      QStringLiteral("Range, e.g. 10V or -50uA..50uA; its prefix is the unit of "
                                     "bare numbers."),
                      kValue});
    parser.addOption(
        {QStringLiteral("class"),
         QStringLiteral("Accuracy class index of IEC 60051-2: %1.").arg(classSeriesText()),
         kValue});
    parser.addOption({QStringLiteral("scale"),
                      QStringLiteral("zero-at-end (default) | zero-inside | no-zero | "
                                     "non-linear; sets the fiducial value (IEC 60051-1)."),
                      kValue});
    parser.addOption(
        {QStringLiteral("fiducial"),
         QStringLiteral("Fiducial value in the range's unit, e.g. 80V, instead of the one the "
                        "scale type gives (as the relevant part of IEC 60051 may fix it for a "
                        "suppressed-zero scale); required for --scale non-linear."),
         kValue});
    parser.addOption({QStringLiteral("kind"),
                      QStringLiteral("dc (default) | half-wave | bridge: a DC meter or a "
                                     "rectifier AC voltmeter; sets the hazardous-live limits "
                                     "checked (IEC 61010-1) and what the advice looks for."),
                      kValue});
    parser.addOption({QStringLiteral("phase"),
                      QStringLiteral("as-found (default) | as-left: the results the statement "
                                     "covers."),
                      kValue});
}

void addBudgetOptions(QCommandLineParser& parser) {
    parser.addOption({QStringLiteral("divisions"),
                      QStringLiteral("Scale divisions; without it the budget leaves out the "
                                     "readability of the scale, and says so."),
                      kValue});
    parser.addOption({QStringLiteral("readability"),
                      QStringLiteral("Fraction of a division read (default 0.2)."), kValue});
    parser.addOption(
        {QStringLiteral("reference"),
         QStringLiteral("Reference standard's spec, e.g. 0.02%rdg+0.01%rng, 0.5mV or "
                        "U=1mV,k=2; add ,dof=N for the degrees of freedom its certificate "
                        "states (used in Welch-Satterthwaite; default infinite). Without it the "
                        "budget leaves out the reference standard, says so, and gives no TUR."),
         QStringLiteral("SPEC")});
    parser.addOption(
        {QStringLiteral("reference-range"),
         QStringLiteral("Full scale of the standard's range, on which a spec's %rng term is "
                        "taken (default: the larger limit of the meter's range, stated as an "
                        "assumption in the result)."),
         kValue});
    parser.addOption({QStringLiteral("reference-resolution"),
                      QStringLiteral("Resolution of the standard's setting or display, e.g. "
                                     "1mV (a rectangular half-width of half of it)."),
                      kValue});
    parser.addOption({QStringLiteral("reference-id"),
                      QStringLiteral("The standard used (asset, certificate), for the "
                                     "statement."),
                      QStringLiteral("TEXT")});
    parser.addOption({QStringLiteral("ambient"),
                      QStringLiteral("Room temperature during the readings; with "
                                     "--reference-temperature and --tempco (or --rs and --rm for "
                                     "the copper-coil model) it adds a temperature component."),
                      QStringLiteral("TEMP")});
    parser.addOption({QStringLiteral("reference-temperature"),
                      QStringLiteral("Reference temperature of the meter (default 23C, "
                                     "IEC 60051-1)."),
                      QStringLiteral("TEMP")});
    parser.addOption({QStringLiteral("tempco"),
                      QStringLiteral("Relative change of the indication per kelvin, e.g. "
                                     "100ppm/K or 0.01%/K."),
                      QStringLiteral("TC")});
}

void addDecisionOptions(QCommandLineParser& parser) {
    parser.addOption(
        {QStringLiteral("rule"),
         QStringLiteral("simple (ILAC G8:09/2019 4.2.1 binary statement for simple acceptance, "
                        "default) | guarded-binary (4.2.2 binary statement with guard band: "
                        "pass only within the acceptance limits T - w) | guarded (4.2.3 "
                        "non-binary statement with guard band: pass, conditional pass, "
                        "conditional fail, fail)."),
         kValue});
    parser.addOption({QStringLiteral("guard-factor"),
                      QStringLiteral("r in the guard band w = r*U (default 1)."), kValue});
    parser.addOption({QStringLiteral("rs"),
                      QStringLiteral("Multiplier (or shunt) resistance now fitted."),
                      QStringLiteral("OHM")});
    parser.addOption(
        {QStringLiteral("rm"), QStringLiteral("Movement resistance."), QStringLiteral("OHM")});
}

ParseOptions valueOptions(const QCommandLineParser& parser, int prefixPower) {
    ParseOptions options;
    options.decimalComma = decimalCommaSet(parser);
    options.bareNumberPowerOfTen = prefixPower;
    return options;
}

// A value of the range's unit: a bare number takes the range's prefix.
std::optional<double> rangeQuantity(const QCommandLineParser& parser, const QString& option,
                                    const EvaluateRequest& request) {
    if (!parser.isSet(option)) {
        return std::nullopt;
    }
    const QString text = parser.value(option);
    try {
        return parseValue(text.toStdString(), request.input.unit,
                          valueOptions(parser, request.rangePrefixPower));
    } catch (const QuantityError& error) {
        throw UsageError(QStringLiteral("option --%1 \"%2\": %3")
                             .arg(option, excerpt(text), QString::fromStdString(error.what())));
    }
}

void addClassAndScale(const QCommandLineParser& parser, EvaluateRequest& request) {
    EvaluationInput& input = request.input;
    // The series has no thousands, so "1,5" and "1.5" can only mean the same index.
    QString index = requireText(parser, QStringLiteral("class")).trimmed();
    bool ok = false;
    input.classIndex = index.replace(QLatin1Char(','), QLatin1Char('.')).toDouble(&ok);
    if (!ok || !isStandardClassIndex(input.classIndex)) {
        // The statement of conformity names the class of IEC 60051-2: only the series is valid.
        throw UsageError(
            QStringLiteral("option --class \"%1\": not an IEC 60051-2 class index; "
                           "use one of %2")
                .arg(excerpt(parser.value(QStringLiteral("class"))), classSeriesText()));
    }
    const QString scale = chooseOne(parser, QStringLiteral("scale"),
                                    {QStringLiteral("zero-at-end"), QStringLiteral("zero-inside"),
                                     QStringLiteral("no-zero"), QStringLiteral("non-linear")},
                                    QStringLiteral("zero-at-end"));
    input.range.type = *fromText<ScaleType>(scale.toStdString());
    input.range.fiducialOverride = rangeQuantity(parser, QStringLiteral("fiducial"), request);
    if (input.range.fiducialOverride && !(*input.range.fiducialOverride > 0.0)) {
        throw UsageError(QStringLiteral("option --fiducial \"%1\": must be above zero")
                             .arg(excerpt(parser.value(QStringLiteral("fiducial")))));
    }
    if (input.range.type == ScaleType::NonLinear && !input.range.fiducialOverride) {
        throw UsageError(QStringLiteral("option --fiducial is required with --scale non-linear: "
                                        "no range limit defines the fiducial value of such a "
                                        "scale (IEC 60051-1)"));
    }
}

void addKindAndPhase(const QCommandLineParser& parser, EvaluationInput& input) {
    const QString kind =
        chooseOne(parser, QStringLiteral("kind"),
                  {QStringLiteral("dc"), QStringLiteral("half-wave"), QStringLiteral("bridge")},
                  QStringLiteral("dc"));
    if (kind != QStringLiteral("dc") && input.unit != Unit::Volt) {
        throw UsageError(QStringLiteral("option --kind %1: a rectifier instrument here is an AC "
                                        "voltmeter; give a voltage range")
                             .arg(kind));
    }
    input.kind = kind == QStringLiteral("half-wave") ? InstrumentKind::HalfWaveAcVoltmeter
                 : kind == QStringLiteral("bridge")  ? InstrumentKind::BridgeAcVoltmeter
                 : input.unit == Unit::Ampere        ? InstrumentKind::DcAmmeter
                                                     : InstrumentKind::DcVoltmeter;
    const QString phase = chooseOne(parser, QStringLiteral("phase"),
                                    {QStringLiteral("as-found"), QStringLiteral("as-left")},
                                    QStringLiteral("as-found"));
    input.phase = *fromText<Phase>(phase.toStdString());
}

// Scale divisions and readability (the analog reading component).
void addReadingAids(const QCommandLineParser& parser, EvaluationInput& input) {
    if (parser.isSet(QStringLiteral("divisions"))) {
        bool ok = false;
        input.divisions = parser.value(QStringLiteral("divisions")).toInt(&ok);
        if (!ok || input.divisions < 1) {
            throw UsageError(QStringLiteral("option --divisions \"%1\": expected a whole number "
                                            ">= 1")
                                 .arg(excerpt(parser.value(QStringLiteral("divisions")))));
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
}

void addReference(const QCommandLineParser& parser, EvaluateRequest& request) {
    EvaluationInput& input = request.input;
    if (parser.isSet(QStringLiteral("reference"))) {
        try {
            input.reference =
                parseReferenceSpec(parser.value(QStringLiteral("reference")).toStdString(),
                                   input.unit, valueOptions(parser, request.rangePrefixPower));
        } catch (const std::invalid_argument& error) {
            throw UsageError(
                QStringLiteral("option --reference: %1").arg(QString::fromStdString(error.what())));
        }
    }
    input.referenceRangeValue = rangeQuantity(parser, QStringLiteral("reference-range"), request);
    if (input.referenceRangeValue && !(*input.referenceRangeValue > 0.0)) {
        throw UsageError(QStringLiteral("option --reference-range must be above zero"));
    }
    input.referenceResolution =
        rangeQuantity(parser, QStringLiteral("reference-resolution"), request).value_or(0.0);
    if (input.referenceResolution < 0.0) {
        throw UsageError(QStringLiteral("option --reference-resolution cannot be negative"));
    }
    for (const char* needsSpec : {"reference-range", "reference-id"}) {
        if (parser.isSet(QLatin1String(needsSpec)) && !input.reference) {
            throw UsageError(QStringLiteral("option --%1 needs --reference (the standard's spec)")
                                 .arg(QLatin1String(needsSpec)));
        }
    }
    input.referenceIdentity = parser.value(QStringLiteral("reference-id")).toStdString();
}

void addResistor(const QCommandLineParser& parser, EvaluationInput& input) {
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

// The room off the reference temperature: a plain coefficient, or the copper coil with its
// multiplier (or shunt) of negligible tempco (manganin, common practice).
void addTemperature(const QCommandLineParser& parser, EvaluationInput& input) {
    const bool ambient = parser.isSet(QStringLiteral("ambient"));
    for (const char* other : {"reference-temperature", "tempco"}) {
        if (parser.isSet(QLatin1String(other)) && !ambient) {
            throw UsageError(
                QStringLiteral("option --%1 needs --ambient").arg(QLatin1String(other)));
        }
    }
    if (!ambient) {
        return;
    }
    TemperatureInfluence t;
    t.roomCelsius = *optionalQuantity(parser, QStringLiteral("ambient"), Unit::DegreeCelsius);
    t.referenceCelsius =
        optionalQuantity(parser, QStringLiteral("reference-temperature"), Unit::DegreeCelsius)
            .value_or(23.0);
    if (const auto tempco = optionalQuantity(parser, QStringLiteral("tempco"), Unit::PerKelvin)) {
        t.coefficientPerKelvin = *tempco;
    } else if (input.resistor) {
        CoilCircuit coil;
        coil.ohms_coil_20C =
            copperResistanceAt20_ohm(input.resistor->movementOhms, t.referenceCelsius);
        if (input.resistor->isShunt) {
            coil.shunt = TempcoResistor{input.resistor->presentOhms, 0.0};
        } else {
            coil.series = TempcoResistor{input.resistor->presentOhms, 0.0};
        }
        t.coil = coil;
    } else {
        throw UsageError(QStringLiteral("option --ambient needs --tempco, or --rs and --rm for "
                                        "the copper-coil model"));
    }
    input.temperature = t;
}

void addDecision(const QCommandLineParser& parser, EvaluationInput& input) {
    const QString rule = chooseOne(
        parser, QStringLiteral("rule"),
        {QStringLiteral("simple"), QStringLiteral("guarded-binary"), QStringLiteral("guarded")},
        QStringLiteral("simple"));
    input.decision.rule = *fromText<DecisionRule>(rule.toStdString());
    if (parser.isSet(QStringLiteral("guard-factor")) && !hasGuardBand(input.decision.rule)) {
        throw UsageError(QStringLiteral("option --guard-factor needs --rule guarded-binary or "
                                        "guarded: simple acceptance has no guard band"));
    }
    input.decision.guardFactor = parser.isSet(QStringLiteral("guard-factor"))
                                     ? positiveNumber(parser, QStringLiteral("guard-factor"))
                                     : 1.0;
}

} // namespace

void addEvaluateOptions(QCommandLineParser& parser) {
    addReadingsAndScaleOptions(parser);
    addBudgetOptions(parser);
    addDecisionOptions(parser);
}

EvaluateRequest evaluateRequestFrom(const QCommandLineParser& parser) {
    EvaluateRequest request;
    EvaluationInput& input = request.input;
    ParseOptions options;
    options.decimalComma = decimalCommaSet(parser);
    input.range = parseRange(requireText(parser, QStringLiteral("range")), input.unit,
                             request.rangePrefixPower, options);
    addKindAndPhase(parser, input);
    addClassAndScale(parser, request);
    addReadingAids(parser, input);
    addReference(parser, request);
    addResistor(parser, input);
    addTemperature(parser, input);
    addDecision(parser, input);
    options.bareNumberPowerOfTen = request.rangePrefixPower;
    request.readings =
        readReadingsCsv(requireText(parser, QStringLiteral("readings")), input.unit, options);
    input.readings = request.readings.readings;
    return request;
}

} // namespace mw::cli
