// The text form of `calc evaluate`: one row per point, the budget of the worst point, the
// cautions, the statement and the advice.
#include "app/cli/calc_evaluate_output.h"

#include "app/cli/cli_support.h"
#include "core/evaluation/statement.h"
#include "core/model/vocabulary.h"
#include "core/units/decimal.h"

#include <QRegularExpression>

#include <cmath>

namespace mw::cli {
namespace {

QString text(std::string_view view) {
    return QString::fromUtf8(view.data(), static_cast<qsizetype>(view.size()));
}

QString eng(double value, int digits, Unit unit) {
    return QString::fromStdString(formatEngineering(value, digits, unit));
}

QString plain(double value) {
    return std::isinf(value) ? QStringLiteral("inf") : QString::fromStdString(formatPlain(value));
}

QString percent(double fraction) {
    // Below one in a million the digits say nothing a reader can use.
    return fraction < 1e-6 ? QStringLiteral("< 0.0001 %") : eng(100.0 * fraction, 2, Unit::Percent);
}

// Applied values in the range's prefix, to five significant digits of its upper limit, so that
// a zero reads "0.000 µA" beside "50.000 µA".
QString appliedText(double applied, const EvaluateRequest& request) {
    const double largest =
        std::max(std::fabs(request.input.range.lower), std::fabs(request.input.range.upper));
    const int last = ExactDecimal::fromDouble(largest).leadingExponent() - 4;
    return QString::fromStdString(
        formatAtExponent(applied, last, request.input.unit, request.rangePrefixPower));
}

QString riskText(const PointResult& point) {
    return point.specificRisk ? QStringLiteral("risk ") + percent(*point.specificRisk)
                              : QStringLiteral("p_c ") + percent(point.conformanceProbability);
}

void printHeader(const EvaluationResult& result, const EvaluationInput& input) {
    printLine(QStringLiteral("%1 results, %2 to %3, class %4 (limit \u00B1%5); %6")
                  .arg(text(displayName(input.phase)), eng(input.range.lower, 4, input.unit),
                       eng(input.range.upper, 4, input.unit), plain(input.classIndex),
                       eng(result.permissibleError, 3, input.unit),
                       text(displayName(input.decision.rule))));
}

void printPoints(const EvaluationResult& result, const EvaluateRequest& request) {
    const EvaluationInput& input = request.input;
    printLine(QStringLiteral("%1 %2 %3 %4 %5  %6 %7")
                  .arg(QStringLiteral("applied"), 13)
                  .arg(QStringLiteral("error"), 12)
                  .arg(QStringLiteral("limit"), 10)
                  .arg(QStringLiteral("U"), 10)
                  .arg(QStringLiteral("TUR"), 7)
                  .arg(QStringLiteral("decision"), -17)
                  .arg(QStringLiteral("risk (accepted) / p_c (rejected)")));
    for (const PointResult& p : result.points) {
        const double w = guardBand(input.decision, p.budget.expandedRounded);
        // U is already rounded up to two significant digits; printing two keeps it exact. The
        // error goes to U's last digit (JCGM 100:2008 7.2.6).
        printLine(
            QStringLiteral("%1 %2 %3 %4 %5  %6 %7")
                .arg(appliedText(p.applied, request), 13)
                .arg(QString::fromStdString(formatErrorLikeU(p.error, p.budget.expandedRounded,
                                                             p.permissibleError, w, input.unit)),
                     12)
                .arg(eng(p.permissibleError, 3, input.unit), 10)
                .arg(eng(p.budget.expandedRounded, 2, input.unit), 10)
                .arg(p.tur ? QString::fromStdString(p.turText) : QStringLiteral("-"), 7)
                .arg(text(displayName(p.decision)), -17)
                .arg(riskText(p)));
    }
    printLine(QStringLiteral("overall: %1").arg(text(displayName(result.overall))));
}

void printBudget(const EvaluationResult& result, const EvaluateRequest& request) {
    const EvaluationInput& input = request.input;
    const PointResult& worst = result.points.at(result.worstPoint);
    printLine(QStringLiteral("budget at %1, the point with the largest error (JCGM 100:2008):")
                  .arg(appliedText(worst.applied, request)));
    printLine(QStringLiteral("  %1 %2 %3 %4 %5 %6 %7")
                  .arg(QStringLiteral("component"), -28)
                  .arg(QStringLiteral("value"), 10)
                  .arg(QStringLiteral("distribution"), 12)
                  .arg(QStringLiteral("divisor"), 8)
                  .arg(QStringLiteral("c_i"), 6)
                  .arg(QStringLiteral("u_i(y)"), 10)
                  .arg(QStringLiteral("\u03BD_i"), 6));
    for (std::size_t i = 0; i < worst.components.size(); ++i) {
        const UncertaintyComponent& c = worst.components[i];
        const char* shape = c.distribution == Distribution::Normal        ? "normal"
                            : c.distribution == Distribution::Rectangular ? "rectangular"
                            : c.distribution == Distribution::Triangular  ? "triangular"
                                                                          : "u-shaped";
        printLine(QStringLiteral("  %1 %2 %3 %4 %5 %6 %7")
                      .arg(QString::fromStdString(c.name), -28)
                      .arg(eng(c.value, 3, input.unit), 10)
                      .arg(QLatin1String(shape), 12)
                      .arg(plain(divisor(c)).left(8), 8)
                      .arg(plain(c.sensitivity), 6)
                      .arg(eng(worst.budget.contributions.at(i), 3, input.unit), 10)
                      .arg(plain(c.dof), 6));
    }
    const BudgetResult& b = worst.budget;
    printLine(QStringLiteral("  u_c = %1, \u03BD_eff = %2, k = %3, U = %4 (k \u00D7 u_c = %5, "
                             "rounded up to two significant digits)")
                  .arg(eng(b.combined, 3, input.unit), plain(std::floor(b.dofEffective * 10) / 10),
                       QString::number(b.coverageFactor, 'f', 2),
                       eng(b.expandedRounded, 2, input.unit), eng(b.expanded, 3, input.unit)));
    for (const OmittedComponent& omitted : result.omittedComponents) {
        printLine(QStringLiteral("  left out: %1").arg(QString::fromStdString(omitted.name)));
    }
}

void printAdvice(const EvaluationResult& result) {
    if (!result.advice) {
        return;
    }
    printLine(QStringLiteral("advice: ") + QString::fromStdString(result.advice->explanation));
    if (result.correctedResistorOhms && result.correctedChoice) {
        const ResistorChoice& choice = *result.correctedChoice;
        QString line = QStringLiteral("corrected resistor %1: standard value %2")
                           .arg(eng(*result.correctedResistorOhms, 5, Unit::Ohm),
                                eng(choice.ohms_standard, 3, Unit::Ohm));
        line += choice.trimPractical
                    ? QStringLiteral(" + trim %1").arg(eng(choice.ohms_trim, 3, Unit::Ohm))
                    : QStringLiteral("; ") + QString::fromStdString(choice.trimNote);
        printLine(line);
    }
}

} // namespace

void printEvaluation(const EvaluationResult& result, const EvaluateRequest& request) {
    printHeader(result, request.input);
    printPoints(result, request);
    printBudget(result, request);
    for (const std::string& caution : result.cautions) {
        QString line = QString::fromStdString(caution);
        line.remove(QRegularExpression(QStringLiteral("^Caution: ")));
        printLine(QStringLiteral("caution: ") + line);
    }
    printLine(QStringLiteral("statement: ") + QString::fromStdString(result.statement));
    printAdvice(result);
}

} // namespace mw::cli
