// `meterwright calc multiplier|indication`: voltmeter range design and rectifier meter
// predictions from the command line (calc waveform lives in calc_waveform.cpp).
#include "app/cli/calc_waveform.h"
#include "app/cli/cli_support.h"
#include "app/cli/command_table.h"
#include "core/circuits/eseries.h"
#include "core/circuits/hazard.h"
#include "core/circuits/rectifier_design.h"
#include "core/circuits/rectifier_meter.h"
#include "core/circuits/waveform.h"
#include "core/units/quantity.h"

#include <QJsonObject>

#include <cmath>
#include <limits>
#include <optional>
#include <stdexcept>
#include <vector>

namespace mw::cli {
namespace {

// Reference temperature of IEC 60051-1 when none is marked (the diode data hold at 27 °C).
constexpr double kDefaultCelsius = 23.0;

QString eng(double value, Unit unit, int digits = 5) {
    return QString::fromStdString(formatEngineering(value, digits, unit));
}

void addValueOption(QCommandLineParser& parser, const QString& name, const QString& help,
                    const QString& value) {
    parser.addOption(QCommandLineOption(name, help, value));
}

void addMovementOptions(QCommandLineParser& parser) {
    addValueOption(parser, QStringLiteral("ifs"),
                   QStringLiteral("Full-scale current of the movement (e.g. 1mA)."),
                   QStringLiteral("A"));
    addValueOption(parser, QStringLiteral("rm"),
                   QStringLiteral("Coil resistance of the movement (e.g. 1k)."),
                   QStringLiteral("OHM"));
    addValueOption(parser, QStringLiteral("rsh"),
                   QStringLiteral("Resistor across the movement (default: none)."),
                   QStringLiteral("OHM"));
    addValueOption(parser, QStringLiteral("rectifier"),
                   QStringLiteral("none (DC), half (half-wave) or bridge (full-wave)."),
                   QStringLiteral("KIND"));
}

void addDiodeOptions(QCommandLineParser& parser) {
    addValueOption(parser, QStringLiteral("diode"),
                   QStringLiteral("ideal, silicon (default), schottky or germanium."),
                   QStringLiteral("KIND"));
    addValueOption(parser, QStringLiteral("diode-is"),
                   QStringLiteral("Saturation current IS at 27 °C (replaces the preset's)."),
                   QStringLiteral("A"));
    addValueOption(parser, QStringLiteral("diode-n"),
                   QStringLiteral("Emission coefficient N (replaces the preset's)."),
                   QStringLiteral("N"));
    addValueOption(parser, QStringLiteral("diode-rs"),
                   QStringLiteral("Series resistance RS (replaces the preset's)."),
                   QStringLiteral("OHM"));
    addValueOption(parser, QStringLiteral("diode-rf"),
                   QStringLiteral("Forward resistance of ideal diodes (default 0)."),
                   QStringLiteral("OHM"));
    addValueOption(parser, QStringLiteral("temp"),
                   QStringLiteral("Temperature of the diodes (default 23C)."),
                   QStringLiteral("TEMP"));
}

Rectifier rectifierFrom(const QCommandLineParser& parser, const QString& fallback) {
    const QString kind = chooseOne(
        parser, QStringLiteral("rectifier"),
        {QStringLiteral("none"), QStringLiteral("half"), QStringLiteral("bridge")}, fallback);
    if (kind.isEmpty()) {
        throw UsageError(QStringLiteral("option --rectifier is required (none|half|bridge)"));
    }
    return kind == QStringLiteral("half")     ? Rectifier::HalfWave
           : kind == QStringLiteral("bridge") ? Rectifier::Bridge
                                              : Rectifier::None;
}

RectifierCircuit circuitFrom(const QCommandLineParser& parser, Rectifier rectifier,
                             double multiplier_ohms) {
    RectifierCircuit circuit;
    circuit.rectifier = rectifier;
    circuit.movement_amps_fs = requireQuantity(parser, QStringLiteral("ifs"), Unit::Ampere);
    circuit.movement_ohms = requireQuantity(parser, QStringLiteral("rm"), Unit::Ohm);
    circuit.multiplier_ohms = multiplier_ohms;
    circuit.shunt_ohms = optionalQuantity(parser, QStringLiteral("rsh"), Unit::Ohm)
                             .value_or(std::numeric_limits<double>::infinity());
    validate(circuit);
    return circuit;
}

// The meter with the diodes the options ask for: ideal (closed form) or a Shockley preset,
// optionally with the user's own IS, N and RS.
RectifierMeter meterFrom(const QCommandLineParser& parser, const RectifierCircuit& circuit) {
    const QString kind = chooseOne(parser, QStringLiteral("diode"),
                                   {QStringLiteral("ideal"), QStringLiteral("silicon"),
                                    QStringLiteral("schottky"), QStringLiteral("germanium")},
                                   QStringLiteral("silicon"));
    const bool custom = parser.isSet(QStringLiteral("diode-is")) ||
                        parser.isSet(QStringLiteral("diode-n")) ||
                        parser.isSet(QStringLiteral("diode-rs"));
    if (kind == QStringLiteral("ideal")) {
        if (custom) {
            throw UsageError(QStringLiteral("options --diode-is/--diode-n/--diode-rs describe a "
                                            "real diode; they cannot go with --diode ideal"));
        }
        const double forward_ohms =
            optionalQuantity(parser, QStringLiteral("diode-rf"), Unit::Ohm).value_or(0.0);
        return RectifierMeter(circuit, IdealDiodes{forward_ohms});
    }
    if (parser.isSet(QStringLiteral("diode-rf"))) {
        throw UsageError(QStringLiteral("option --diode-rf applies to --diode ideal only; a real "
                                        "diode takes --diode-rs"));
    }
    DiodeParameters diode =
        diodePreset(kind == QStringLiteral("schottky")    ? DiodePreset::Schottky
                    : kind == QStringLiteral("germanium") ? DiodePreset::Germanium
                                                          : DiodePreset::SmallSignalSilicon);
    diode.saturation_current_a = optionalQuantity(parser, QStringLiteral("diode-is"), Unit::Ampere)
                                     .value_or(diode.saturation_current_a);
    diode.emission_coefficient =
        optionalQuantity(parser, QStringLiteral("diode-n"), Unit::Dimensionless)
            .value_or(diode.emission_coefficient);
    diode.series_ohms =
        optionalQuantity(parser, QStringLiteral("diode-rs"), Unit::Ohm).value_or(diode.series_ohms);
    try {
        validate(diode);
    } catch (const std::invalid_argument& error) {
        throw UsageError(QString::fromStdString(error.what()));
    }
    const double celsius = optionalQuantity(parser, QStringLiteral("temp"), Unit::DegreeCelsius)
                               .value_or(kDefaultCelsius);
    return RectifierMeter(circuit, diode, celsius);
}

// Runs a solve of the rectifier circuit. Its iterations are sized for meters (microamperes to
// amperes, ohms to megohms, real diodes); far outside that they may not settle, which is the
// values' doing, not a fault to report: refused like a result beyond a double.
template <typename Solve>
auto solvedOrRefused(const char* result, const QString& inputs, Solve solve) {
    try {
        return solve();
    } catch (const std::runtime_error& error) {
        throw UsageError(
            QStringLiteral("the %1 cannot be computed from the values of %2: %3; "
                           "check those values")
                .arg(QString::fromUtf8(result), inputs, QString::fromStdString(error.what())));
    }
}

// A hazardous-live caution and a rating caution, joined; null when there is neither.
QJsonValue cautionFor(std::optional<std::string> hazard, const std::optional<std::string>& other) {
    if (other) {
        hazard = hazard ? *hazard + " " + *other : *other;
    }
    return hazard ? QJsonValue(QString::fromStdString(*hazard)) : QJsonValue(QJsonValue::Null);
}

VoltageKind voltageKind(Rectifier rectifier) {
    return rectifier == Rectifier::None ? VoltageKind::Dc : VoltageKind::AcRms;
}

// The human-readable form of `calc multiplier`, from the same numbers as the JSON. A DC
// voltmeter has no diodes, so nothing is said about them.
void printMultiplier(const QJsonObject& json, Rectifier rectifier) {
    const auto value = [&json](const char* key, Unit unit, int digits = 5) {
        return eng(json.value(QLatin1String(key)).toDouble(), unit, digits);
    };
    const bool dc = rectifier == Rectifier::None;
    printLine(dc ? QStringLiteral("multiplier        %1").arg(value("multiplier_ohm", Unit::Ohm))
                 : QStringLiteral("multiplier        %1 (ideal diodes %2)")
                       .arg(value("multiplier_ohm", Unit::Ohm),
                            value("multiplier_ideal_ohm", Unit::Ohm)));
    printLine(dc ? QStringLiteral("sensitivity       %1")
                       .arg(value("sensitivity_ohm_per_volt", Unit::OhmPerVolt))
                 : QStringLiteral("sensitivity       %1 (ideal diodes), %2 effective")
                       .arg(value("sensitivity_ohm_per_volt", Unit::OhmPerVolt),
                            value("effective_sensitivity_ohm_per_volt", Unit::OhmPerVolt)));
    if (json.value(QStringLiteral("trim_ohm")).isNull()) {
        printLine(QStringLiteral("E96 not above     %1; %2")
                      .arg(value("nearest_standard_ohm", Unit::Ohm, 3),
                           json.value(QStringLiteral("trim_note")).toString()));
    } else {
        printLine(
            QStringLiteral("E96 not above     %1 + trim %2")
                .arg(value("nearest_standard_ohm", Unit::Ohm, 3), value("trim_ohm", Unit::Ohm)));
    }
    printLine(QStringLiteral("dissipation       %1 at full scale, %2 across it at 120 %")
                  .arg(value("dissipation_w", Unit::Watt, 3),
                       value("voltage_overrange_v", Unit::Volt, 3)));
    if (json.value(QStringLiteral("caution")).isString()) {
        printLine(QStringLiteral("caution           ") +
                  json.value(QStringLiteral("caution")).toString());
    }
}

int runMultiplier(const QStringList& arguments) {
    const QString command = QStringLiteral("calc multiplier");
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Multiplier that puts full scale exactly at the range (DC, or rms of a sine through a "
        "half-wave or bridge rectifier), with the nearest E96 value and its trim.\n"
        "sensitivity_ohm_per_volt is the textbook AC sensitivity with ideal diodes (0.9 x the DC "
        "ohms per volt for a bridge, 0.45 x for half-wave), whatever --diode says. "
        "effective_sensitivity_ohm_per_volt is what the source sees at full scale with the "
        "chosen diodes: 1 / (true rms input current at full scale), i.e. input_resistance_ohm "
        "(range / that current) per volt of range."));
    addMovementOptions(parser);
    addDiodeOptions(parser);
    addValueOption(parser, QStringLiteral("range"),
                   QStringLiteral("Full-scale voltage of the range (e.g. 10V)."),
                   QStringLiteral("V"));
    addValueOption(parser, QStringLiteral("rating"),
                   QStringLiteral("Power rating of the multiplier resistor (default 0.25W)."),
                   QStringLiteral("W"));
    addValueOption(parser, QStringLiteral("voltage-rating"),
                   QStringLiteral("Largest working voltage of one multiplier resistor (default "
                                  "250V, typical of a 0.25 W film resistor; common practice)."),
                   QStringLiteral("V"));
    parseOptions(parser, command, arguments, ReadsValues::Yes);
    if (helpRequested(parser, command)) {
        return 0;
    }
    const Rectifier rectifier = rectifierFrom(parser, QStringLiteral("none"));
    const RectifierCircuit circuit = circuitFrom(parser, rectifier, 0.0);
    const double range_volts = requireQuantity(parser, QStringLiteral("range"), Unit::Volt);
    const double watts_rating =
        optionalQuantity(parser, QStringLiteral("rating"), Unit::Watt).value_or(kTypicalRating_W);
    const double volts_rating =
        optionalQuantity(parser, QStringLiteral("voltage-rating"), Unit::Volt)
            .value_or(kTypicalVoltageRating_V);
    const RectifierMeter meter = meterFrom(parser, circuit);
    const QString inputs = QStringLiteral("--ifs, --rm, --rsh, --range and the diode options");
    const MultiplierSolution solution =
        solvedOrRefused("multiplier", inputs,
                        [&meter, range_volts] { return solveMultiplier(meter, range_volts); });

    const double ohms = solution.multiplier_ohms;
    const double sensitivity = acSensitivityOhmPerVolt(circuit, averagePerRms(rectifier));
    requireFinite({{"multiplier", ohms},
                   {"multiplier with ideal diodes", solution.ideal_multiplier_ohms},
                   {"rms current at full scale", solution.multiplier_rms_amps_fs},
                   {"sensitivity", sensitivity},
                   // The source sees range / I_rms; per volt of range that is 1 / I_rms.
                   {"input resistance", range_volts / solution.multiplier_rms_amps_fs},
                   {"effective sensitivity", 1.0 / solution.multiplier_rms_amps_fs}},
                  inputs);
    const bool positive = ohms > 0.0;
    const ResistorChoice choice = positive ? chooseResistor(ohms, ESeries::E96) : ResistorChoice{};
    // rms current and voltage: the working voltage of a resistor is given as DC or AC rms.
    const Dissipation heat = positive ? dissipation(ohms, solution.multiplier_rms_amps_fs,
                                                    watts_rating, kTypicalDerating, volts_rating)
                                      : Dissipation{};
    requireFinite({{"nearest E96 value", choice.ohms_standard},
                   {"trim", choice.ohms_trim},
                   {"trimmer", choice.ohms_trimmer},
                   {"dissipation at 120 %", heat.watts_overrange},
                   {"power rating to choose", heat.watts_overrange / kTypicalDerating},
                   {"voltage at 120 %", heat.volts_overrange}},
                  inputs);
    QJsonObject json;
    json[QStringLiteral("multiplier_ohm")] = jsonNumber(ohms);
    json[QStringLiteral("multiplier_ideal_ohm")] = jsonNumber(solution.ideal_multiplier_ohms);
    json[QStringLiteral("sensitivity_ohm_per_volt")] = jsonNumber(sensitivity);
    json[QStringLiteral("input_resistance_ohm")] =
        jsonNumber(range_volts / solution.multiplier_rms_amps_fs);
    json[QStringLiteral("effective_sensitivity_ohm_per_volt")] =
        jsonNumber(1.0 / solution.multiplier_rms_amps_fs);
    json[QStringLiteral("nearest_standard_ohm")] = jsonNumber(choice.ohms_standard);
    json[QStringLiteral("trim_ohm")] =
        choice.trimPractical ? jsonNumber(choice.ohms_trim) : QJsonValue(QJsonValue::Null);
    json[QStringLiteral("trim_note")] = choice.trimPractical
                                            ? QJsonValue(QJsonValue::Null)
                                            : QJsonValue(QString::fromStdString(choice.trimNote));
    json[QStringLiteral("dissipation_w")] = jsonNumber(heat.watts_fs);
    json[QStringLiteral("voltage_overrange_v")] = jsonNumber(heat.volts_overrange);
    json[QStringLiteral("exceeds_rating")] = heat.overRating;
    json[QStringLiteral("exceeds_derated_rating")] = heat.aboveDeratedRating;
    json[QStringLiteral("exceeds_voltage_rating")] = heat.overVoltageRating;
    json[QStringLiteral("multiplier_rms_current_a")] = jsonNumber(solution.multiplier_rms_amps_fs);
    json[QStringLiteral("caution")] =
        cautionFor(hazardCaution(range_volts, voltageKind(rectifier)),
                   positive ? ratingCaution(heat, "the multiplier") : std::nullopt);
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(json);
        return 0;
    }
    printMultiplier(json, rectifier);
    return 0;
}

void addIndicationOptions(QCommandLineParser& parser) {
    addValueOption(parser, QStringLiteral("rs"), QStringLiteral("Multiplier resistance."),
                   QStringLiteral("OHM"));
    addValueOption(parser, QStringLiteral("range"),
                   QStringLiteral("Full-scale value of the range (e.g. 10V)."),
                   QStringLiteral("V"));
    addValueOption(parser, QStringLiteral("input"),
                   QStringLiteral("Applied value: true rms (AC) or DC volts (e.g. 2.5V)."),
                   QStringLiteral("V"));
    addValueOption(parser, QStringLiteral("waveform"),
                   QStringLiteral("sine (default), square or triangle; checked but not used with "
                                  "--rectifier none, where --input is a DC value."),
                   QStringLiteral("SHAPE"));
    addValueOption(parser, QStringLiteral("frequency"),
                   QStringLiteral("Frequency; the resistive model does not depend on it."),
                   QStringLiteral("HZ"));
}

int runIndication(const QStringList& arguments) {
    const QString command = QStringLiteral("calc indication");
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Indication of a voltmeter at a test point: average movement current over a period, "
        "on a scale marked in rms of a sine (DC for --rectifier none)."));
    addMovementOptions(parser);
    addDiodeOptions(parser);
    addIndicationOptions(parser);
    parseOptions(parser, command, arguments, ReadsValues::Yes);
    if (helpRequested(parser, command)) {
        return 0;
    }
    const Rectifier rectifier = rectifierFrom(parser, QString());
    const RectifierCircuit circuit =
        circuitFrom(parser, rectifier, requireQuantity(parser, QStringLiteral("rs"), Unit::Ohm));
    const double range_volts = requireQuantity(parser, QStringLiteral("range"), Unit::Volt);
    const double input_volts = requireQuantity(parser, QStringLiteral("input"), Unit::Volt);
    const auto frequency_hz = optionalQuantity(parser, QStringLiteral("frequency"), Unit::Hertz);
    if (frequency_hz && !(*frequency_hz > 0.0)) {
        throw UsageError(QStringLiteral("option --frequency must be above 0 Hz"));
    }
    if (rectifier != Rectifier::None && input_volts < 0.0) {
        throw UsageError(QStringLiteral("option --input: an rms value cannot be negative"));
    }
    const WaveShape shape = shapeFrom(parser); // checked even where a DC meter ignores it
    const RectifierMeter meter = meterFrom(parser, circuit);
    const Waveform input = rectifier == Rectifier::None ? Waveform::sineWithOffset(0.0, input_volts)
                                                        : Waveform::withRms(shape, input_volts);
    const QString inputs = QStringLiteral(
        "--ifs, --rm, --rs, --rsh, --range, --input, --waveform and the diode options");
    const Indication indication =
        solvedOrRefused("indication", inputs, [&meter, range_volts, &input] {
            return predictIndication(meter, range_volts, input);
        });
    // The caution quotes the input's peak (rms x crest factor).
    requireFinite(
        {{"movement current", indication.movement_amps},
         {"indication", indication.indicated},
         {"error", indication.error_percent_of_range},
         {"applied value", indication.input_rms_volts},
         {"peak of the input", input_volts != 0.0 ? input_volts * input.crestFactor() : 0.0}},
        inputs);

    QJsonObject json;
    json[QStringLiteral("movement_current_avg_a")] = jsonNumber(indication.movement_amps);
    json[QStringLiteral("indicated")] = jsonNumber(indication.indicated);
    json[QStringLiteral("error_percent_of_range")] = jsonNumber(indication.error_percent_of_range);
    json[QStringLiteral("input_v")] = jsonNumber(indication.input_rms_volts);
    // The test value on the terminals, against the IEC 61010-1 hazardous-live limits.
    json[QStringLiteral("caution")] = cautionFor(
        rectifier == Rectifier::None ? hazardCaution(input_volts, VoltageKind::Dc)
        : input_volts > 0.0 ? hazardCaution(input_volts, VoltageKind::AcRms, input.crestFactor())
                            : std::nullopt,
        std::nullopt);
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(json);
        return 0;
    }
    printLine(QStringLiteral("movement current  %1 average")
                  .arg(eng(indication.movement_amps, Unit::Ampere)));
    printLine(QStringLiteral("indicated         %1 (applied %2)")
                  .arg(eng(indication.indicated, Unit::Volt), eng(input_volts, Unit::Volt)));
    printLine(QStringLiteral("error             %1 of range")
                  .arg(eng(indication.error_percent_of_range, Unit::Percent, 3)));
    if (json.value(QStringLiteral("caution")).isString()) {
        printLine(QStringLiteral("caution           ") +
                  json.value(QStringLiteral("caution")).toString());
    }
    return 0;
}

} // namespace

std::vector<Command> rectifierCalcCommands() {
    return {
        {QStringLiteral("multiplier"),
         QStringLiteral("voltmeter multiplier for a range (DC, half-wave, bridge)"), runMultiplier},
        {QStringLiteral("indication"), QStringLiteral("what a voltmeter indicates at a test point"),
         runIndication},
        {QStringLiteral("waveform"),
         QStringLiteral("rms, average, form factor and average-responding reading"), runWaveform},
    };
}

} // namespace mw::cli
