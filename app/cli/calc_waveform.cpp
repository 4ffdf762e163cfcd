// `meterwright calc waveform`: the waveform from a shape or a file of samples, its rms,
// average and form factor, and the reading of an average-responding meter.
#include "app/cli/calc_waveform.h"

#include "app/cli/cli_support.h"
#include "app/cli/csv_table.h"
#include "core/circuits/hazard.h"
#include "core/units/quantity.h"

#include <QJsonObject>

#include <optional>
#include <string>
#include <vector>

namespace mw::cli {
namespace {

QString eng(double value, Unit unit, int digits = 5) {
    return QString::fromStdString(formatEngineering(value, digits, unit));
}

void addValueOption(QCommandLineParser& parser, const QString& name, const QString& help,
                    const QString& value) {
    parser.addOption(QCommandLineOption(name, help, value));
}

double sampleVolts(const QString& where, const QString& cell, bool decimalComma) {
    const QString escaped = escapedCell(cell);
    if (escaped != cell) {
        // The parser's own message would quote the raw text, cut short at a NUL.
        throw UsageError(
            QStringLiteral("%1 \"%2\": a control character in the cell").arg(where, escaped));
    }
    try {
        ParseOptions options;
        options.decimalComma = decimalComma;
        return parseValue(cell.toStdString(), Unit::Volt, options);
    } catch (const QuantityError& error) {
        throw UsageError(QStringLiteral("%1 \"%2\": %3")
                             .arg(where, escapedCell(cell), QString::fromStdString(error.what())));
    }
}

// The column v of a samples CSV; n and t may number or time the samples but are not read, since
// the samples are taken as evenly spaced in file order. Any other column is refused.
int sampleColumn(const CsvTable& csv) {
    csv.requireKnownColumns({QStringLiteral("v"), QStringLiteral("n"), QStringLiteral("t")});
    const int column = csv.column(QStringLiteral("v"));
    if (column < 0) {
        throw UsageError(QStringLiteral("%1: the header must name the column v (optional, not "
                                        "read: n, t)")
                             .arg(csv.where(csv.header.line)));
    }
    return column;
}

// One period of samples: a CSV with a header line, or else one value per line. A sample starts
// with a digit, a sign or a point, so a first line starting with a letter or a quote is a header.
std::vector<double> readSamples(const QString& path, bool decimalComma) {
    const std::vector<CsvLine> lines = readDataLines(path, QStringLiteral("samples"));
    std::vector<double> volts;
    const QString first = lines.empty() ? QString() : lines.front().text.trimmed();
    const bool table =
        !first.isEmpty() && (first.front().isLetter() || first.front() == QLatin1Char('"'));
    if (table) {
        const CsvTable csv = tableFromLines(path, lines);
        const int column = sampleColumn(csv);
        for (const CsvRow& row : csv.rows) {
            volts.push_back(sampleVolts(csv.where(row.line) + QStringLiteral(", column v"),
                                        row.cells[column], decimalComma));
        }
    } else {
        for (const CsvLine& line : lines) {
            volts.push_back(sampleVolts(
                QStringLiteral("%1 line %2").arg(shownPath(path), QString::number(line.number)),
                line.text.trimmed(), decimalComma));
        }
    }
    if (volts.size() < 2) {
        throw UsageError(QStringLiteral("%1: one period needs at least 2 samples, found %2")
                             .arg(shownPath(path), QString::number(volts.size())));
    }
    return volts;
}

// The waveform of `calc waveform`: samples from a file, or a shape with its AC part by rms or
// peak and a DC offset for the sine.
Waveform waveformFrom(const QCommandLineParser& parser) {
    if (parser.isSet(QStringLiteral("samples"))) {
        for (const char* other : {"waveform", "rms", "peak", "offset"}) {
            if (parser.isSet(QLatin1String(other))) {
                throw UsageError(QStringLiteral("option --samples gives the whole waveform; it "
                                                "cannot go with --%1")
                                     .arg(QLatin1String(other)));
            }
        }
        return Waveform::sampled(
            readSamples(parser.value(QStringLiteral("samples")), decimalCommaSet(parser)));
    }
    const WaveShape shape = shapeFrom(parser);
    if (parser.isSet(QStringLiteral("rms")) && parser.isSet(QStringLiteral("peak"))) {
        throw UsageError(QStringLiteral("give either --rms or --peak, not both"));
    }
    const auto peak_volts = optionalQuantity(parser, QStringLiteral("peak"), Unit::Volt);
    const double rms_volts =
        optionalQuantity(parser, QStringLiteral("rms"), Unit::Volt).value_or(1.0);
    const double offset_volts =
        optionalQuantity(parser, QStringLiteral("offset"), Unit::Volt).value_or(0.0);
    if (offset_volts != 0.0 && shape != WaveShape::Sine) {
        throw UsageError(QStringLiteral("option --offset applies to --waveform sine only"));
    }
    if ((peak_volts && *peak_volts < 0.0) || rms_volts < 0.0) {
        throw UsageError(QStringLiteral("options --rms and --peak cannot be negative"));
    }
    Waveform wave = Waveform::withRms(shape, rms_volts);
    if (peak_volts) {
        wave = wave.peakVolts() > 0.0 ? wave.scaled(*peak_volts / wave.peakVolts())
                                      : Waveform::withRms(shape, 0.0);
    }
    if (offset_volts != 0.0) {
        wave = Waveform::sineWithOffset(wave.peakVolts(), offset_volts);
    }
    return wave;
}

} // namespace

WaveShape shapeFrom(const QCommandLineParser& parser) {
    const QString shape =
        chooseOne(parser, QStringLiteral("waveform"),
                  {QStringLiteral("sine"), QStringLiteral("square"), QStringLiteral("triangle")},
                  QStringLiteral("sine"));
    return shape == QStringLiteral("square")     ? WaveShape::Square
           : shape == QStringLiteral("triangle") ? WaveShape::Triangle
                                                 : WaveShape::Sine;
}

int runWaveform(const QStringList& arguments) {
    const QString command = QStringLiteral("calc waveform");
    QCommandLineParser parser;
    parser.setApplicationDescription(
        QStringLiteral("True rms, rectified average and form factor of a waveform, and what an "
                       "average-responding meter scaled in rms of a sine reads for it."));
    addValueOption(parser, QStringLiteral("waveform"),
                   QStringLiteral("sine (default), square or triangle."), QStringLiteral("SHAPE"));
    addValueOption(parser, QStringLiteral("rms"),
                   QStringLiteral("True rms of the AC part (default 1V)."), QStringLiteral("V"));
    addValueOption(parser, QStringLiteral("peak"),
                   QStringLiteral("Peak of the AC part, instead of --rms."), QStringLiteral("V"));
    addValueOption(parser, QStringLiteral("offset"),
                   QStringLiteral("DC offset added to a sine (default 0V)."), QStringLiteral("V"));
    addValueOption(
        parser, QStringLiteral("samples"),
        QStringLiteral("File with one period of evenly spaced samples in volts: one "
                       "value per line, or a CSV whose header has a column v and "
                       "optionally n or t, not read (separator ';' if the header "
                       "has one, else ','). Replaces "
                       "--waveform, --rms, --peak and --offset. A regular file of at most 4 MiB."),
        QStringLiteral("FILE"));
    addValueOption(parser, QStringLiteral("rectifier"),
                   QStringLiteral("Meter's rectifier: bridge (default) or half."),
                   QStringLiteral("KIND"));
    parseOptions(parser, command, arguments, ReadsValues::Yes);
    if (helpRequested(parser, command)) {
        return 0;
    }
    const Waveform wave = waveformFrom(parser);
    const QString kind =
        chooseOne(parser, QStringLiteral("rectifier"),
                  {QStringLiteral("bridge"), QStringLiteral("half")}, QStringLiteral("bridge"));
    const Rectification rectification =
        kind == QStringLiteral("half") ? Rectification::HalfWave : Rectification::FullWave;
    const AverageRespondingReading reading = averageRespondingReading(wave, rectification);
    // Samples of 1e200 V square to more than a double holds; 1e-200 V to nothing, and the
    // error is then taken against an rms of zero.
    const double rms_volts = wave.rms();
    requireFinite({{"true rms", rms_volts},
                   {"rectified average", wave.rectifiedAverage()},
                   {"half-wave average", wave.halfWaveAverage()},
                   {"mean", wave.mean()},
                   {"form factor", wave.formFactor()},
                   {"crest factor", rms_volts > 0.0 ? wave.crestFactor() : 0.0},
                   {"peak", rms_volts > 0.0 ? rms_volts * wave.crestFactor() : 0.0},
                   {"reading", reading.indicated_volts},
                   {"reading error", reading.error_percent}},
                  parser.isSet(QStringLiteral("samples"))
                      ? QStringLiteral("the samples in --samples \"%1\"")
                            .arg(excerpt(parser.value(QStringLiteral("samples"))))
                      : QStringLiteral("--rms, --peak and --offset"));

    QJsonObject json;
    json[QStringLiteral("waveform")] = QString::fromUtf8(shapeName(wave.shape()).data());
    if (wave.shape() == WaveShape::Sampled) {
        json[QStringLiteral("samples")] = static_cast<qint64>(wave.samplesVolts().size());
    }
    json[QStringLiteral("rms_v")] = jsonNumber(wave.rms());
    json[QStringLiteral("average_v")] = jsonNumber(wave.rectifiedAverage());
    json[QStringLiteral("half_wave_average_v")] = jsonNumber(wave.halfWaveAverage());
    json[QStringLiteral("mean_v")] = jsonNumber(wave.mean());
    json[QStringLiteral("form_factor")] = jsonNumber(wave.formFactor());
    json[QStringLiteral("crest_factor")] = jsonNumber(wave.crestFactor());
    json[QStringLiteral("reading_v")] = jsonNumber(reading.indicated_volts);
    json[QStringLiteral("error_percent")] = jsonNumber(reading.error_percent);
    // The waveform on the terminals: its rms and its peak (crest factor) against IEC 61010-1.
    const std::optional<std::string> caution =
        wave.rms() > 0.0 ? hazardCaution(wave.rms(), VoltageKind::AcRms, wave.crestFactor())
                         : std::nullopt;
    json[QStringLiteral("caution")] =
        caution ? QJsonValue(QString::fromStdString(*caution)) : QJsonValue(QJsonValue::Null);
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(json);
        return 0;
    }
    printLine(QStringLiteral("true rms          %1").arg(eng(wave.rms(), Unit::Volt)));
    printLine(QStringLiteral("rectified average %1").arg(eng(wave.rectifiedAverage(), Unit::Volt)));
    printLine(QStringLiteral("form factor       %1")
                  .arg(QString::fromStdString(formatPlain(wave.formFactor()))));
    printLine(QStringLiteral("average-responding meter reads %1 (%2)")
                  .arg(eng(reading.indicated_volts, Unit::Volt),
                       eng(reading.error_percent, Unit::Percent, 3)));
    if (json.value(QStringLiteral("caution")).isString()) {
        printLine(QStringLiteral("caution           ") +
                  json.value(QStringLiteral("caution")).toString());
    }
    return 0;
}

} // namespace mw::cli
