// `meterwright calc eseries`: the IEC 60063 value not above a computed resistance, its trim and
// the part's dissipation.
#include "app/cli/calc_eseries.h"

#include "app/cli/cli_support.h"
#include "core/circuits/eseries.h"
#include "core/units/quantity.h"

#include <QJsonObject>

namespace mw::cli {
namespace {

QString eng(double value, Unit unit, int digits = 4) {
    return QString::fromStdString(formatEngineering(value, digits, unit));
}

QCommandLineOption valueOption(const QString& name, const QString& help, const QString& value) {
    return QCommandLineOption(name, help, value);
}

} // namespace

int runEseries(const QStringList& arguments) {
    const QString command = QStringLiteral("calc eseries");
    QCommandLineParser parser;
    parser.setApplicationDescription(QStringLiteral(
        "Nearest IEC 60063 value not above a computed resistance, and the trim to reach it."));
    parser.addOption(valueOption(QStringLiteral("value"),
                                 QStringLiteral("Computed resistance (e.g. 4k7)."),
                                 QStringLiteral("OHM")));
    parser.addOption(valueOption(QStringLiteral("series"),
                                 QStringLiteral("E6, E12, E24, E48, E96 (default) or E192."),
                                 QStringLiteral("SERIES")));
    parser.addOption(valueOption(QStringLiteral("current"),
                                 QStringLiteral("Current at full scale, for the dissipation."),
                                 QStringLiteral("A")));
    parser.addOption(valueOption(QStringLiteral("rating"),
                                 QStringLiteral("Power rating of the part (default 0.25W)."),
                                 QStringLiteral("W")));
    parser.addOption(valueOption(QStringLiteral("voltage-rating"),
                                 QStringLiteral("Largest working voltage of the part (default "
                                                "250V, typical of a 0.25 W film resistor)."),
                                 QStringLiteral("V")));
    parseOptions(parser, command, arguments, ReadsValues::Yes);
    if (helpRequested(parser, command)) {
        return 0;
    }
    const double ohms = requireQuantity(parser, QStringLiteral("value"), Unit::Ohm);
    const QString seriesText = parser.isSet(QStringLiteral("series"))
                                   ? parser.value(QStringLiteral("series"))
                                   : QStringLiteral("E96");
    const auto series = eseriesFromText(seriesText.trimmed().toStdString());
    if (!series) {
        throw UsageError(QStringLiteral("option --series \"%1\": expected one of "
                                        "E6|E12|E24|E48|E96|E192")
                             .arg(excerpt(seriesText)));
    }
    const ResistorChoice choice = chooseResistor(ohms, *series);
    const double ohms_nearest = nearestStandard(ohms, *series);
    requireFinite({{"value not above", choice.ohms_standard},
                   {"nearest value", ohms_nearest},
                   {"trim", choice.ohms_trim},
                   {"trim range", choice.ohms_trim_range},
                   {"trimmer", choice.ohms_trimmer}},
                  QStringLiteral("--value"));
    const QJsonValue null(QJsonValue::Null);
    QJsonObject json{
        {QStringLiteral("wanted_ohm"), jsonNumber(ohms)},
        {QStringLiteral("series"), QString::fromUtf8(toText(*series).data())},
        {QStringLiteral("nearest_not_above_ohm"), jsonNumber(choice.ohms_standard)},
        {QStringLiteral("nearest_ohm"), jsonNumber(ohms_nearest)},
        {QStringLiteral("trim_ohm"), choice.trimPractical ? jsonNumber(choice.ohms_trim) : null},
        {QStringLiteral("trim_range_ohm"), jsonNumber(choice.ohms_trim_range)},
        {QStringLiteral("trimmer_ohm"),
         choice.trimPractical ? jsonNumber(choice.ohms_trimmer) : null},
        {QStringLiteral("trim_note"),
         choice.trimPractical ? null : QJsonValue(QString::fromStdString(choice.trimNote))},
        {QStringLiteral("tolerance_percent"), jsonNumber(100.0 * eseriesTolerance(*series))}};
    QStringList lines{
        choice.trimPractical
            ? QStringLiteral("%1 not above %2: %3, trim %4 (trimmer %5 covers the %6 tolerance)")
                  .arg(seriesText.toUpper(), eng(ohms, Unit::Ohm),
                       eng(choice.ohms_standard, Unit::Ohm), eng(choice.ohms_trim, Unit::Ohm),
                       eng(choice.ohms_trimmer, Unit::Ohm, 2),
                       eng(100.0 * eseriesTolerance(*series), Unit::Percent, 2))
            : QStringLiteral("%1 not above %2: %3; %4")
                  .arg(seriesText.toUpper(), eng(ohms, Unit::Ohm),
                       eng(choice.ohms_standard, Unit::Ohm),
                       QString::fromStdString(choice.trimNote))};
    if (const auto amps = optionalQuantity(parser, QStringLiteral("current"), Unit::Ampere)) {
        const double rating = optionalQuantity(parser, QStringLiteral("rating"), Unit::Watt)
                                  .value_or(kTypicalRating_W);
        const double volts = optionalQuantity(parser, QStringLiteral("voltage-rating"), Unit::Volt)
                                 .value_or(kTypicalVoltageRating_V);
        const Dissipation heat = dissipation(ohms, *amps, rating, kTypicalDerating, volts);
        requireFinite({{"dissipation at 120 %", heat.watts_overrange},
                       {"power rating to choose", heat.watts_overrange / kTypicalDerating},
                       {"voltage at 120 %", heat.volts_overrange}},
                      QStringLiteral("--value and --current"));
        const auto caution = ratingCaution(heat, "the part");
        json.insert(QStringLiteral("dissipation_w"), jsonNumber(heat.watts_fs));
        json.insert(QStringLiteral("dissipation_overrange_w"), jsonNumber(heat.watts_overrange));
        json.insert(QStringLiteral("voltage_overrange_v"), jsonNumber(heat.volts_overrange));
        json.insert(QStringLiteral("exceeds_rating"), heat.overRating);
        json.insert(QStringLiteral("exceeds_derated_rating"), heat.aboveDeratedRating);
        json.insert(QStringLiteral("exceeds_voltage_rating"), heat.overVoltageRating);
        json.insert(QStringLiteral("caution"),
                    caution ? QJsonValue(QString::fromStdString(*caution)) : null);
        lines << QStringLiteral("dissipation %1 at full scale, %2 at 120 %, %3 across it at 120 %")
                     .arg(eng(heat.watts_fs, Unit::Watt), eng(heat.watts_overrange, Unit::Watt),
                          eng(heat.volts_overrange, Unit::Volt));
        if (caution) {
            lines << QStringLiteral("caution: ") + QString::fromStdString(*caution);
        }
    } else if (parser.isSet(QStringLiteral("rating")) ||
               parser.isSet(QStringLiteral("voltage-rating"))) {
        throw UsageError(QStringLiteral("options --rating and --voltage-rating need --current"));
    }
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(json);
    } else {
        printLine(lines.join(QLatin1Char('\n')));
    }
    return 0;
}

} // namespace mw::cli
