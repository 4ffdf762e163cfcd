// Headless `calc coverage` and `calc evaluate`: coverage factors and the evaluation of one range
// from a CSV of readings, with the same core function the bench screen uses.
#include "app/cli/cli_support.h"
#include "app/cli/command_table.h"
#include "core/evaluation/evaluation.h"
#include "core/model/vocabulary.h"
#include "core/uncertainty/distributions.h"

#include <QFile>
#include <QJsonArray>
#include <QJsonObject>
#include <QTextStream>

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

// --- readings CSV ---------------------------------------------------------------------------

struct CsvColumns {
    int applied = -1;
    int indicated = -1;
    int direction = -1;
    int repeat = -1;
};

QStringList splitCsvLine(const QString& line) {
    QStringList cells = line.split(QLatin1Char(','));
    for (QString& cell : cells) {
        cell = cell.trimmed();
        if (cell.size() >= 2 && cell.startsWith(QLatin1Char('"')) &&
            cell.endsWith(QLatin1Char('"'))) {
            cell = cell.mid(1, cell.size() - 2).trimmed();
        }
    }
    return cells;
}

CsvColumns readHeader(const QString& file, const QString& line) {
    CsvColumns columns;
    const QStringList names = splitCsvLine(line);
    for (int i = 0; i < names.size(); ++i) {
        const QString name = names[i].toLower();
        int* slot = name == QStringLiteral("applied")     ? &columns.applied
                    : name == QStringLiteral("indicated") ? &columns.indicated
                    : name == QStringLiteral("direction") ? &columns.direction
                    : name == QStringLiteral("repeat")    ? &columns.repeat
                                                          : nullptr;
        if (slot != nullptr) {
            if (*slot >= 0) {
                throw UsageError(
                    QStringLiteral("%1 row 1: column \"%2\" appears twice").arg(file, names[i]));
            }
            *slot = i;
        }
    }
    if (columns.applied < 0 || columns.indicated < 0) {
        throw UsageError(QStringLiteral("%1 row 1: the header must name the columns applied and "
                                        "indicated (optional: direction, repeat)")
                             .arg(file));
    }
    return columns;
}

double cellValue(const QString& where, const QString& cell, Unit unit) {
    if (cell.isEmpty()) {
        throw UsageError(where + QStringLiteral(": empty"));
    }
    try {
        return parseValue(cell.toStdString(), unit);
    } catch (const QuantityError& error) {
        throw UsageError(
            QStringLiteral("%1 \"%2\": %3").arg(where, cell, QString::fromStdString(error.what())));
    }
}

EvaluationReading readRow(const QString& file, int row, const QStringList& cells,
                          const CsvColumns& columns, Unit unit) {
    auto cellAt = [&cells](int column) {
        return column >= 0 && column < cells.size() ? cells[column] : QString();
    };
    auto where = [&](const char* column) {
        return QStringLiteral("%1 row %2, column %3").arg(file).arg(row).arg(QLatin1String(column));
    };
    EvaluationReading reading;
    reading.applied = cellValue(where("applied"), cellAt(columns.applied), unit);
    reading.indicated = cellValue(where("indicated"), cellAt(columns.indicated), unit);
    const QString direction = cellAt(columns.direction).toLower();
    if (direction == QStringLiteral("down")) {
        reading.direction = Direction::Down;
    } else if (!direction.isEmpty() && direction != QStringLiteral("up")) {
        throw UsageError(where("direction") +
                         QStringLiteral(" \"%1\": expected up or down").arg(direction));
    }
    const QString repeat = cellAt(columns.repeat);
    if (!repeat.isEmpty()) {
        bool ok = false;
        reading.repeat = repeat.toInt(&ok);
        if (!ok || reading.repeat < 1) {
            throw UsageError(where("repeat") +
                             QStringLiteral(" \"%1\": expected a whole number >= 1").arg(repeat));
        }
    }
    return reading;
}

std::vector<EvaluationReading> readReadingsCsv(const QString& path, Unit unit) {
    QFile file(path);
    if (!file.open(QIODevice::ReadOnly | QIODevice::Text)) {
        throw UsageError(
            QStringLiteral("option --readings \"%1\": %2").arg(path, file.errorString()));
    }
    QTextStream in(&file);
    std::optional<CsvColumns> columns;
    std::vector<EvaluationReading> readings;
    for (int row = 1; !in.atEnd(); ++row) {
        const QString line = in.readLine();
        if (line.trimmed().isEmpty() || line.trimmed().startsWith(QLatin1Char('#'))) {
            continue;
        }
        if (!columns) {
            columns = readHeader(path, line);
            continue;
        }
        readings.push_back(readRow(path, row, splitCsvLine(line), *columns, unit));
    }
    if (readings.empty()) {
        throw UsageError(QStringLiteral("%1: no readings after the header").arg(path));
    }
    return readings;
}

// --- evaluate -------------------------------------------------------------------------------

// "10V" -> 0 … 10 V; "-50uA..50uA" -> both limits.
ScaleRange parseRange(const QString& raw, Unit& unit) {
    const QStringList parts = raw.split(QStringLiteral(".."));
    if (parts.size() > 2) {
        throw UsageError(QStringLiteral("option --range \"%1\": expected 10V or -5V..5V").arg(raw));
    }
    ScaleRange range;
    try {
        const Quantity upper = parseQuantity(parts.back().trimmed().toStdString());
        unit = upper.unit;
        if (unit != Unit::Volt && unit != Unit::Ampere) {
            throw UsageError(
                QStringLiteral("option --range \"%1\": give a voltage or a current with its unit, "
                               "e.g. 10V or 50uA")
                    .arg(raw));
        }
        range.upper = upper.value;
        range.lower =
            parts.size() == 2 ? parseValue(parts.front().trimmed().toStdString(), unit) : 0.0;
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

void addEvaluateOptions(QCommandLineParser& parser) {
    const QString valueName = QStringLiteral("VALUE");
    parser.addOption({QStringLiteral("readings"),
                      QStringLiteral("CSV with columns applied,indicated[,direction][,repeat]."),
                      QStringLiteral("FILE")});
    parser.addOption(
        {QStringLiteral("range"), QStringLiteral("Range, e.g. 10V or -50uA..50uA."), valueName});
    parser.addOption(
        {QStringLiteral("class"), QStringLiteral("Accuracy class index (IEC 60051)."), valueName});
    parser.addOption({QStringLiteral("scale"),
                      QStringLiteral("zero-at-end | zero-inside | no-zero | non-linear."),
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

EvaluationInput inputFromOptions(const QCommandLineParser& parser) {
    EvaluationInput input;
    input.range = parseRange(requireText(parser, QStringLiteral("range")), input.unit);
    input.kind =
        input.unit == Unit::Ampere ? InstrumentKind::DcAmmeter : InstrumentKind::DcVoltmeter;
    requireText(parser, QStringLiteral("class"));
    input.classIndex = positiveNumber(parser, QStringLiteral("class"));
    const QString scale = chooseOne(parser, QStringLiteral("scale"),
                                    {QStringLiteral("zero-at-end"), QStringLiteral("zero-inside"),
                                     QStringLiteral("no-zero"), QStringLiteral("non-linear")},
                                    QStringLiteral("zero-at-end"));
    input.range.type = *fromText<ScaleType>(scale.toStdString());
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
    addDecisionAndResistor(parser, input);
    input.readings = readReadingsCsv(requireText(parser, QStringLiteral("readings")), input.unit);
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
    const QString unit = text(unitSymbol(input.unit));
    printLine(QStringLiteral("%1 %2 %3 %4 %5 %6")
                  .arg(QStringLiteral("applied"), 12)
                  .arg(QStringLiteral("error"), 12)
                  .arg(QStringLiteral("limit"), 10)
                  .arg(QStringLiteral("U"), 10)
                  .arg(QStringLiteral("TUR"), 6)
                  .arg(QStringLiteral("decision")));
    for (const PointResult& p : result.points) {
        printLine(QStringLiteral("%1 %2 %3 %4 %5 %6")
                      .arg(QString::number(p.applied, 'g', 6) + QLatin1Char(' ') + unit, 12)
                      .arg(QString::number(p.error, 'g', 4), 12)
                      .arg(QString::number(p.permissibleError, 'g', 4), 10)
                      .arg(QString::number(p.budget.expandedRounded, 'g', 2), 10)
                      .arg(QString::number(p.tur, 'f', 1), 6)
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
                       "(ILAC G8:09/2019), statement of conformity and adjustment advice."));
    addEvaluateOptions(parser);
    parseOptions(parser, QStringLiteral("calc evaluate"), arguments);
    if (helpRequested(parser, QStringLiteral("calc evaluate"))) {
        return 0;
    }
    const EvaluationInput input = inputFromOptions(parser);
    const EvaluationResult result = evaluateRange(input);
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
