// `meterwright calc shunt|ayrton|temperature|eseries`: DC range design from the command line
// (calc eseries lives in calc_eseries.cpp).
#include "app/cli/calc_eseries.h"
#include "app/cli/cli_support.h"
#include "app/cli/command_table.h"
#include "core/circuits/ammeter.h"
#include "core/circuits/coil_temperature.h"
#include "core/circuits/eseries.h"
#include "core/circuits/movement.h"
#include "core/units/quantity.h"

#include <QJsonArray>
#include <QJsonObject>

#include <cmath>
#include <vector>

namespace mw::cli {
namespace {

QString eng(double value, Unit unit, int digits = 4) {
    return QString::fromStdString(formatEngineering(value, digits, unit));
}

QCommandLineOption valueOption(const QString& name, const QString& help, const QString& value) {
    return QCommandLineOption(name, help, value);
}

Movement movementFrom(const QCommandLineParser& parser) {
    const Movement movement{requireQuantity(parser, QStringLiteral("ifs"), Unit::Ampere),
                            requireQuantity(parser, QStringLiteral("rm"), Unit::Ohm)};
    checkMovement(movement);
    return movement;
}

void addMovementOptions(QCommandLineParser& parser) {
    parser.addOption(valueOption(QStringLiteral("ifs"),
                                 QStringLiteral("Full-scale current of the movement (e.g. 1mA)."),
                                 QStringLiteral("A")));
    parser.addOption(valueOption(QStringLiteral("rm"),
                                 QStringLiteral("Coil resistance of the movement (e.g. 100)."),
                                 QStringLiteral("OHM")));
}

// Splits "10mA,100mA,1A" and reads each item as a current; the error names the item.
std::vector<double> currentList(const QCommandLineParser& parser, const QString& option) {
    const QString text = requireText(parser, option);
    std::vector<double> values;
    const QStringList items = text.split(QLatin1Char(','));
    for (int i = 0; i < items.size(); ++i) {
        try {
            values.push_back(parseValue(items[i].trimmed().toStdString(), Unit::Ampere));
        } catch (const QuantityError& error) {
            throw UsageError(QStringLiteral("option --%1, item %2 \"%3\": %4")
                                 .arg(option)
                                 .arg(i + 1)
                                 .arg(excerpt(items[i]), QString::fromStdString(error.what())));
        }
    }
    return values;
}

void addShuntOptions(QCommandLineParser& parser) {
    parser.addOption(valueOption(QStringLiteral("range"),
                                 QStringLiteral("Full-scale current of the range (e.g. 1A)."),
                                 QStringLiteral("A")));
    parser.addOption(valueOption(QStringLiteral("rating"),
                                 QStringLiteral("Power rating of the shunt (default 0.25W)."),
                                 QStringLiteral("W")));
    parser.addOption(valueOption(QStringLiteral("swamp"),
                                 QStringLiteral("Low-tempco swamping resistor in series with the "
                                                "coil (default 0)."),
                                 QStringLiteral("OHM")));
    parser.addOption(valueOption(QStringLiteral("class"),
                                 QStringLiteral("Accuracy class the temperature drift is checked "
                                                "against (default 1: 1 % per 10 K, IEC 60051-1)."),
                                 QStringLiteral("INDEX")));
}

// The caution lines of a shunt design: its ratings, and a copper coil left unswamped.
QStringList shuntCautions(const Dissipation& heat, const CoilCircuit& circuit, double classIndex) {
    QStringList cautions;
    if (const auto rating = ratingCaution(heat, "the shunt")) {
        cautions << QString::fromStdString(*rating);
    }
    if (const auto drift = unswampedShuntCaution(circuit, classIndex)) {
        cautions << QString::fromStdString(*drift);
    }
    return cautions;
}

int runShunt(const QStringList& arguments) {
    const QString command = QStringLiteral("calc shunt");
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Shunt for a DC ammeter range: R_sh = I_fs·(R_m + R_swamp) / (I - I_fs), its burden "
        "voltage and dissipation, and the span drift of the copper coil over 10 K (IEC 60028 "
        "copper; coil taken at 20 °C, shunt and swamp as zero-tempco manganin)."));
    addMovementOptions(parser);
    addShuntOptions(parser);
    parseOptions(parser, command, arguments, ReadsValues::Yes);
    if (helpRequested(parser, command)) {
        return 0;
    }
    const Movement bare = movementFrom(parser);
    const double ohms_swamp =
        optionalQuantity(parser, QStringLiteral("swamp"), Unit::Ohm).value_or(0.0);
    if (ohms_swamp < 0.0) {
        throw UsageError(QStringLiteral("option --swamp cannot be negative"));
    }
    const double classIndex =
        optionalQuantity(parser, QStringLiteral("class"), Unit::Dimensionless).value_or(1.0);
    const Movement movement{bare.amps_fs, bare.ohms_coil + ohms_swamp}; // the shunted branch
    const double amps_range = requireQuantity(parser, QStringLiteral("range"), Unit::Ampere);
    const double watts_rating =
        optionalQuantity(parser, QStringLiteral("rating"), Unit::Watt).value_or(kTypicalRating_W);
    const double ohms_shunt = shunt_ohm(movement, amps_range);
    const double amps_shunt = amps_range - movement.amps_fs;
    const Dissipation heat = dissipation(ohms_shunt, amps_shunt, watts_rating);
    const double ohms_meter = ohms_shunt * movement.ohms_coil / (ohms_shunt + movement.ohms_coil);
    const double burden_V = movement.fullScaleDrop_V();
    const CoilCircuit circuit{bare.ohms_coil, TempcoResistor{ohms_swamp, 0.0},
                              TempcoResistor{ohms_shunt, 0.0}};
    const double drift = spanDriftPer10K(circuit);
    requireFinite({{"shunt", ohms_shunt},
                   {"shunt current", amps_shunt},
                   {"meter resistance", ohms_meter},
                   {"burden", kOverrangeFactor * burden_V},
                   {"dissipation at 120 %", heat.watts_overrange},
                   {"power rating to choose", heat.watts_overrange / kTypicalDerating},
                   {"span drift", 100.0 * drift}},
                  QStringLiteral("--ifs, --rm, --swamp and --range"));
    const QStringList cautions = shuntCautions(heat, circuit, classIndex);
    if (parser.isSet(QStringLiteral("json"))) {
        printJson({{QStringLiteral("shunt_ohm"), jsonNumber(ohms_shunt)},
                   {QStringLiteral("range_a"), jsonNumber(amps_range)},
                   {QStringLiteral("shunt_current_a"), jsonNumber(amps_shunt)},
                   {QStringLiteral("meter_resistance_ohm"), jsonNumber(ohms_meter)},
                   {QStringLiteral("burden_v"), jsonNumber(burden_V)},
                   {QStringLiteral("burden_overrange_v"), jsonNumber(kOverrangeFactor * burden_V)},
                   {QStringLiteral("dissipation_w"), jsonNumber(heat.watts_fs)},
                   {QStringLiteral("dissipation_overrange_w"), jsonNumber(heat.watts_overrange)},
                   {QStringLiteral("exceeds_rating"), heat.overRating},
                   {QStringLiteral("exceeds_derated_rating"), heat.aboveDeratedRating},
                   {QStringLiteral("span_drift_percent_per_10k"), jsonNumber(100.0 * drift)},
                   {QStringLiteral("caution"), cautions.isEmpty()
                                                   ? QJsonValue(QJsonValue::Null)
                                                   : QJsonValue(cautions.join(QLatin1Char(' ')))}});
        return 0;
    }
    printLine(QStringLiteral("shunt            %1").arg(eng(ohms_shunt, Unit::Ohm)));
    printLine(
        QStringLiteral("shunt current    %1 at full scale").arg(eng(amps_shunt, Unit::Ampere)));
    printLine(QStringLiteral("meter resistance %1").arg(eng(ohms_meter, Unit::Ohm)));
    printLine(QStringLiteral("burden           %1 at full scale, %2 at 120 %")
                  .arg(eng(burden_V, Unit::Volt), eng(kOverrangeFactor * burden_V, Unit::Volt)));
    printLine(QStringLiteral("dissipation      %1 at full scale, %2 at 120 % (rating %3)")
                  .arg(eng(heat.watts_fs, Unit::Watt), eng(heat.watts_overrange, Unit::Watt),
                       eng(heat.watts_rating, Unit::Watt, 3)));
    printLine(
        QStringLiteral("span drift       %1 per 10 K").arg(eng(100.0 * drift, Unit::Percent, 3)));
    for (const QString& caution : cautions) {
        printLine(QStringLiteral("caution          ") + caution);
    }
    return 0;
}

const QString kAyrtonTopology = QStringLiteral(
    "one resistor string from the common terminal to the movement's free terminal; "
    "taps_ohm[k] is the resistance from the common terminal to the tap of ranges_a[k] "
    "(ranges ascending, taps_ohm[0] is the whole string); sections_ohm[j] is the j-th "
    "resistor counted from the common terminal (sections_ohm[0] is used alone on the highest "
    "range, the last is added only on the lowest)");

int runAyrton(const QStringList& arguments) {
    const QString command = QStringLiteral("calc ayrton");
    QCommandLineParser parser;
    parser.setApplicationDescription(
        QStringLiteral("Ayrton (universal) shunt taps for several ammeter ranges."));
    addMovementOptions(parser);
    parser.addOption(valueOption(QStringLiteral("ranges"),
                                 QStringLiteral("Comma-separated ranges (e.g. 10mA,100mA,1A)."),
                                 QStringLiteral("LIST")));
    parseOptions(parser, command, arguments, ReadsValues::Yes);
    if (helpRequested(parser, command)) {
        return 0;
    }
    const Movement movement = movementFrom(parser);
    const AyrtonShunt shunt = ayrtonShunt(movement, currentList(parser, QStringLiteral("ranges")));
    const QString inputs = QStringLiteral("--ifs, --rm and --ranges");
    requireFinite({{"whole string", shunt.total_ohm}}, inputs);
    for (std::size_t k = 0; k < shunt.amps_ranges.size(); ++k) {
        requireFinite({{"tap resistance", shunt.taps_ohm[k]},
                       {"section resistance", shunt.sections_ohm[k]},
                       {"burden", shunt.burden_V[k]}},
                      inputs);
    }
    if (parser.isSet(QStringLiteral("json"))) {
        QJsonArray ranges;
        QJsonArray taps;
        QJsonArray sections;
        QJsonArray burdens;
        for (std::size_t k = 0; k < shunt.amps_ranges.size(); ++k) {
            ranges.append(jsonNumber(shunt.amps_ranges[k]));
            taps.append(jsonNumber(shunt.taps_ohm[k]));
            sections.append(jsonNumber(shunt.sections_ohm[k]));
            burdens.append(jsonNumber(shunt.burden_V[k]));
        }
        printJson({{QStringLiteral("ranges_a"), ranges},
                   {QStringLiteral("taps_ohm"), taps},
                   {QStringLiteral("sections_ohm"), sections},
                   {QStringLiteral("burden_v"), burdens},
                   {QStringLiteral("total_ohm"), jsonNumber(shunt.total_ohm)},
                   {QStringLiteral("topology"), kAyrtonTopology}});
        return 0;
    }
    printLine(QStringLiteral("whole string     %1").arg(eng(shunt.total_ohm, Unit::Ohm)));
    for (std::size_t k = 0; k < shunt.amps_ranges.size(); ++k) {
        printLine(QStringLiteral("range %1  tap at %2 from the common terminal, burden %3")
                      .arg(eng(shunt.amps_ranges[k], Unit::Ampere).leftJustified(10),
                           eng(shunt.taps_ohm[k], Unit::Ohm), eng(shunt.burden_V[k], Unit::Volt)));
    }
    for (std::size_t j = 0; j < shunt.sections_ohm.size(); ++j) {
        printLine(QStringLiteral("section %1 from the common terminal: %2")
                      .arg(j + 1)
                      .arg(eng(shunt.sections_ohm[j], Unit::Ohm)));
    }
    return 0;
}

// Reads a temperature option in °C ("23C", "296.15K", "23"), or `fallback` when absent.
double celsiusOption(const QCommandLineParser& parser, const QString& option, double fallback) {
    return optionalQuantity(parser, option, Unit::DegreeCelsius).value_or(fallback);
}

void addTemperatureOptions(QCommandLineParser& parser) {
    const QList<QCommandLineOption> options{
        valueOption(QStringLiteral("rm"), QStringLiteral("Coil resistance (copper)."),
                    QStringLiteral("OHM")),
        valueOption(QStringLiteral("rm-at"),
                    QStringLiteral("Temperature at which --rm was measured (default 20C)."),
                    QStringLiteral("TEMP")),
        valueOption(QStringLiteral("ref"),
                    QStringLiteral("Temperature at which the meter is adjusted (default 23C)."),
                    QStringLiteral("TEMP")),
        valueOption(QStringLiteral("temp"),
                    QStringLiteral("Working temperature for the span error."),
                    QStringLiteral("TEMP")),
        valueOption(QStringLiteral("series"),
                    QStringLiteral("Low-tempco resistance in series with the coil (multiplier "
                                   "or swamping resistor, default 0)."),
                    QStringLiteral("OHM")),
        valueOption(QStringLiteral("series-tempco"),
                    QStringLiteral("Tempco of --series (e.g. 15ppm/K, default 0)."),
                    QStringLiteral("TC")),
        valueOption(QStringLiteral("shunt"),
                    QStringLiteral("Shunt across coil + series: the meter is an ammeter."),
                    QStringLiteral("OHM")),
        valueOption(QStringLiteral("shunt-tempco"),
                    QStringLiteral("Tempco of the shunt (default 0)."), QStringLiteral("TC")),
        valueOption(QStringLiteral("target"),
                    QStringLiteral("Design a swamping resistor keeping |span error| within "
                                   "this (e.g. 0.5%)."),
                    QStringLiteral("PERCENT")),
        valueOption(QStringLiteral("from"),
                    QStringLiteral("Lowest working temperature for --target."),
                    QStringLiteral("TEMP")),
        valueOption(QStringLiteral("to"),
                    QStringLiteral("Highest working temperature for --target."),
                    QStringLiteral("TEMP")),
        valueOption(QStringLiteral("swamp-tempco"),
                    QStringLiteral("Tempco of the swamping resistor (default 0)."),
                    QStringLiteral("TC")),
        valueOption(QStringLiteral("ifs"),
                    QStringLiteral("With --range: design for an ammeter, shunt resized."),
                    QStringLiteral("A")),
        valueOption(QStringLiteral("range"),
                    QStringLiteral("Ammeter range for --target (with --ifs)."),
                    QStringLiteral("A")),
        valueOption(QStringLiteral("class"),
                    QStringLiteral("With --shunt: accuracy class the drift over 10 K is checked "
                                   "against (default 1: 1 % per 10 K, IEC 60051-1)."),
                    QStringLiteral("INDEX")),
    };
    parser.addOptions(options);
}

// One row of the temperature table: the label in a column wide enough for every label.
QString tableRow(const QString& label, const QString& value) {
    return label.leftJustified(22) + value;
}

SwampRequest swampRequestFrom(const QCommandLineParser& parser, double ohms_coil_20C,
                              double celsius_ref) {
    SwampRequest request;
    request.ohms_coil_20C = ohms_coil_20C;
    request.celsius_ref = celsius_ref;
    request.celsius_min = celsiusOption(parser, QStringLiteral("from"), celsius_ref);
    request.celsius_max = celsiusOption(parser, QStringLiteral("to"), celsius_ref);
    if (!parser.isSet(QStringLiteral("from")) || !parser.isSet(QStringLiteral("to"))) {
        throw UsageError(QStringLiteral("option --target needs --from and --to"));
    }
    request.error_limit_fraction =
        requireQuantity(parser, QStringLiteral("target"), Unit::Percent) / 100.0;
    request.swamp_tempco_per_K =
        optionalQuantity(parser, QStringLiteral("swamp-tempco"), Unit::PerKelvin).value_or(0.0);
    request.amps_fs = optionalQuantity(parser, QStringLiteral("ifs"), Unit::Ampere);
    request.amps_range = optionalQuantity(parser, QStringLiteral("range"), Unit::Ampere);
    request.shunt_tempco_per_K =
        optionalQuantity(parser, QStringLiteral("shunt-tempco"), Unit::PerKelvin).value_or(0.0);
    return request;
}

int runTemperature(const QStringList& arguments) {
    const QString command = QStringLiteral("calc temperature");
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Copper coil resistance at a temperature (IEC 60028, 0.00393 /K at 20 °C), the span "
        "error it causes, and a swamping resistor that keeps the error within a target."));
    addTemperatureOptions(parser);
    parseOptions(parser, command, arguments, ReadsValues::Yes);
    if (helpRequested(parser, command)) {
        return 0;
    }
    const double ohms_measured = requireQuantity(parser, QStringLiteral("rm"), Unit::Ohm);
    const double ohms_20C = copperResistanceAt20_ohm(
        ohms_measured, celsiusOption(parser, QStringLiteral("rm-at"), kCopperReference_C));
    const double celsius_ref = celsiusOption(parser, QStringLiteral("ref"), 23.0);
    const double ohms_at_ref = copperResistance_ohm(ohms_20C, celsius_ref);
    requireFinite({{"coil resistance at 20 °C", ohms_20C},
                   {"coil resistance at the reference temperature", ohms_at_ref}},
                  QStringLiteral("--rm, --rm-at and --ref"));
    const auto celsius = optionalQuantity(parser, QStringLiteral("temp"), Unit::DegreeCelsius);
    if (!celsius && !parser.isSet(QStringLiteral("target"))) {
        throw UsageError(QStringLiteral("give --temp (span error) or --target (swamping design)"));
    }
    QJsonObject json{{QStringLiteral("coil_ohm_20c"), jsonNumber(ohms_20C)},
                     {QStringLiteral("coil_ohm_at_ref"), jsonNumber(ohms_at_ref)}};
    QStringList lines{tableRow(QStringLiteral("coil at 20 °C"), eng(ohms_20C, Unit::Ohm))};
    if (celsius) {
        CoilCircuit circuit;
        circuit.ohms_coil_20C = ohms_20C;
        circuit.series = {
            optionalQuantity(parser, QStringLiteral("series"), Unit::Ohm).value_or(0.0),
            optionalQuantity(parser, QStringLiteral("series-tempco"), Unit::PerKelvin)
                .value_or(0.0)};
        if (const auto shunt = optionalQuantity(parser, QStringLiteral("shunt"), Unit::Ohm)) {
            if (!(*shunt > 0.0)) {
                // A shunt of 0 Ω takes all the current: the span error would be 0 / 0.
                throw UsageError(QStringLiteral("option --shunt must be above 0 \u03A9"));
            }
            circuit.shunt = TempcoResistor{
                *shunt, optionalQuantity(parser, QStringLiteral("shunt-tempco"), Unit::PerKelvin)
                            .value_or(0.0)};
        }
        const double ohms_hot = copperResistance_ohm(ohms_20C, *celsius);
        const double error = spanError(circuit, *celsius, celsius_ref);
        // The caution quotes the drift over 10 K: checked like the numbers printed beside it.
        const double drift = circuit.shunt ? spanDriftPer10K(circuit, celsius_ref) : 0.0;
        requireFinite({{"coil resistance at --temp", ohms_hot},
                       {"span error", 100.0 * error},
                       {"span drift over 10 K", 100.0 * drift}},
                      QStringLiteral("--rm, --rm-at, --temp, --ref, --series, --series-tempco, "
                                     "--shunt and --shunt-tempco"));
        json.insert(QStringLiteral("coil_ohm_at_temp"), jsonNumber(ohms_hot));
        json.insert(QStringLiteral("span_error_percent"), jsonNumber(100.0 * error));
        lines << tableRow(QStringLiteral("coil at ") + eng(*celsius, Unit::DegreeCelsius, 3),
                          eng(ohms_hot, Unit::Ohm));
        lines << tableRow(QStringLiteral("span error"),
                          QStringLiteral("%1 against %2")
                              .arg(eng(100.0 * error, Unit::Percent, 3),
                                   eng(celsius_ref, Unit::DegreeCelsius, 3)));
        const double classIndex =
            optionalQuantity(parser, QStringLiteral("class"), Unit::Dimensionless).value_or(1.0);
        const auto caution = unswampedShuntCaution(circuit, classIndex, celsius_ref);
        json.insert(QStringLiteral("caution"), caution
                                                   ? QJsonValue(QString::fromStdString(*caution))
                                                   : QJsonValue(QJsonValue::Null));
        if (caution) {
            lines << tableRow(QStringLiteral("caution"), QString::fromStdString(*caution));
        }
    }
    if (parser.isSet(QStringLiteral("target"))) {
        const SwampDesign design = designSwamp(swampRequestFrom(parser, ohms_20C, celsius_ref));
        requireFinite({{"swamping resistor", design.ohms_swamp_20C},
                       {"resized shunt", design.ohms_shunt_20C.value_or(0.0)},
                       {"worst span error", 100.0 * design.worst_error_fraction}},
                      QStringLiteral("--rm, --rm-at, --ref, --target, --from, --to, "
                                     "--swamp-tempco, --ifs, --range and --shunt-tempco"));
        json.insert(QStringLiteral("swamp_ohm"), jsonNumber(design.ohms_swamp_20C));
        json.insert(QStringLiteral("swamp_shunt_ohm"), design.ohms_shunt_20C
                                                           ? jsonNumber(*design.ohms_shunt_20C)
                                                           : QJsonValue(QJsonValue::Null));
        json.insert(QStringLiteral("swamp_worst_error_percent"),
                    jsonNumber(100.0 * design.worst_error_fraction));
        json.insert(QStringLiteral("swamp_worst_at_c"), jsonNumber(design.celsius_worst));
        lines << tableRow(QStringLiteral("swamping resistor"),
                          QStringLiteral("%1 (worst %2 at %3)")
                              .arg(eng(design.ohms_swamp_20C, Unit::Ohm),
                                   eng(100.0 * design.worst_error_fraction, Unit::Percent, 3),
                                   eng(design.celsius_worst, Unit::DegreeCelsius, 3)));
        if (design.ohms_shunt_20C) {
            lines << tableRow(QStringLiteral("resized shunt"),
                              eng(*design.ohms_shunt_20C, Unit::Ohm));
        }
    }
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(json);
    } else {
        printLine(lines.join(QLatin1Char('\n')));
    }
    return 0;
}

} // namespace

std::vector<Command> dcCalcCommands() {
    return {
        {QStringLiteral("shunt"), QStringLiteral("shunt resistor for a DC ammeter range"),
         runShunt},
        {QStringLiteral("ayrton"), QStringLiteral("Ayrton shunt taps for several ammeter ranges"),
         runAyrton},
        {QStringLiteral("temperature"),
         QStringLiteral("coil resistance, span error and swamping resistor vs temperature"),
         runTemperature},
        {QStringLiteral("eseries"),
         QStringLiteral("nearest IEC 60063 value not above, trim and dissipation"), runEseries},
    };
}

} // namespace mw::cli
