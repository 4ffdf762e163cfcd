// The budget and advice panels of the bench.
#include "app/gui/bench/results_panels.h"

#include <QHeaderView>
#include <QLabel>
#include <QScrollArea>
#include <QTableWidget>
#include <QVBoxLayout>

#include <cmath>

namespace mw::gui {
namespace {

QString qs(const std::string& value) {
    return QString::fromStdString(value);
}

QString distributionWords(Distribution distribution) {
    switch (distribution) {
    case Distribution::Normal:
        return QObject::tr("normal");
    case Distribution::Rectangular:
        return QObject::tr("rectangular");
    case Distribution::Triangular:
        return QObject::tr("triangular");
    case Distribution::UShaped:
        return QObject::tr("U-shaped");
    }
    return {};
}

QString dofText(double dof) {
    return std::isinf(dof) ? QStringLiteral("∞") : QString::number(dof, 'g', 4);
}

} // namespace

BudgetPanel::BudgetPanel(QWidget* parent)
    : QWidget(parent) {
    setObjectName(QStringLiteral("budgetPanel"));
    auto* layout = new QVBoxLayout(this);
    title_ = new QLabel(this);
    title_->setWordWrap(true);
    layout->addWidget(title_);
    table_ = new QTableWidget(0, 7, this);
    table_->setHorizontalHeaderLabels({tr("Component"), tr("Value"), tr("Distribution"),
                                       tr("Divisor"), tr("cᵢ"), tr("u(xᵢ)"), tr("νᵢ")});
    table_->verticalHeader()->hide();
    table_->setEditTriggers(QAbstractItemView::NoEditTriggers);
    table_->horizontalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);
    table_->horizontalHeader()->setStretchLastSection(true);
    layout->addWidget(table_, 1);
    summary_ = new QLabel(this);
    summary_->setObjectName(QStringLiteral("budgetSummary"));
    summary_->setWordWrap(true);
    summary_->setTextInteractionFlags(Qt::TextSelectableByMouse);
    layout->addWidget(summary_);
    showPoint(std::nullopt, Unit::Volt, QString());
}

void BudgetPanel::showPoint(const std::optional<PointResult>& point, Unit unit,
                            const QString& title) {
    table_->setRowCount(0);
    if (!point) {
        title_->setText(tr("Choose a point in the grid to see its uncertainty budget."));
        summary_->clear();
        return;
    }
    title_->setText(tr("<b>Uncertainty budget</b> at %1 (JCGM 100:2008)").arg(title));
    table_->setRowCount(int(point->components.size()));
    for (std::size_t i = 0; i < point->components.size(); ++i) {
        const UncertaintyComponent& c = point->components[i];
        const int row = int(i);
        const QStringList cells = {
            qs(c.name),
            qs(formatEngineering(c.value, 3, unit)),
            distributionWords(c.distribution),
            QString::number(divisor(c), 'g', 4),
            QString::number(c.sensitivity, 'g', 4),
            qs(formatEngineering(standardUncertainty(c), 3, unit)),
            dofText(c.dof),
        };
        for (int column = 0; column < cells.size(); ++column) {
            auto* item = new QTableWidgetItem(cells[column]);
            if (column > 0) {
                item->setTextAlignment(Qt::AlignRight | Qt::AlignVCenter);
            }
            table_->setItem(row, column, item);
        }
    }
    const BudgetResult& b = point->budget;
    summary_->setText(tr("u<sub>c</sub> = %1, ν<sub>eff</sub> = %2, k = %3, U = %4 (rounded up "
                         "to two significant digits, JCGM 100:2008 7.2.6)")
                          .arg(qs(formatEngineering(b.combined, 3, unit)), dofText(b.dofEffective))
                          .arg(b.coverageFactor, 0, 'f', 3)
                          .arg(qs(formatEngineering(b.expandedRounded, 2, unit))));
}

QString BudgetPanel::summary() const {
    return summary_->text();
}

AdvicePanel::AdvicePanel(QWidget* parent)
    : QWidget(parent) {
    setObjectName(QStringLiteral("advicePanel"));
    auto* layout = new QVBoxLayout(this);
    text_ = new QLabel(this);
    text_->setWordWrap(true);
    text_->setAlignment(Qt::AlignTop | Qt::AlignLeft);
    text_->setTextInteractionFlags(Qt::TextSelectableByMouse);
    auto* scroll = new QScrollArea(this);
    scroll->setWidgetResizable(true);
    scroll->setWidget(text_);
    layout->addWidget(scroll);
    showResult(std::nullopt, Unit::Volt, false);
}

void AdvicePanel::showResult(const std::optional<EvaluationResult>& result, Unit unit,
                             bool isShunt) {
    if (!result || !result->advice) {
        text_->setText(tr("Advice needs readings at two or more points of the range."));
        return;
    }
    const Advice& advice = *result->advice;
    QString html = tr("<p><b>%1</b></p>").arg(qs(advice.explanation).toHtmlEscaped());
    html += tr("<p>Fitted: zero offset %1, span factor %2, largest residual non-linearity %3, "
               "hysteresis %4.</p>")
                .arg(qs(formatEngineering(advice.fit.zeroOffset, 3, unit)))
                .arg(advice.fit.spanFactor, 0, 'f', 5)
                .arg(qs(formatEngineering(advice.fit.nonlinearity, 3, unit)),
                     qs(formatEngineering(advice.hysteresis, 3, unit)));
    html += QStringLiteral("<table cellspacing='6'><tr><th align='left'>%1</th><th>%2</th>"
                           "<th>%3</th></tr>")
                .arg(tr("Effect"), tr("Size"), tr("Of the limit"));
    for (const AdviceEffect& effect : advice.effects) {
        html += QStringLiteral("<tr><td>%1%2</td><td align='right'>%3</td><td "
                               "align='right'>%4 %</td></tr>")
                    .arg(qs(std::string(effectName(effect.cause))).toHtmlEscaped(),
                         effect.significant ? tr(" (significant)") : QString(),
                         qs(formatEngineering(effect.size, 3, unit)))
                    .arg(effect.fractionOfLimit * 100.0, 0, 'f', 0);
    }
    html += QStringLiteral("</table>");
    if (result->correctedResistorOhms && result->correctedChoice) {
        const ResistorChoice& choice = *result->correctedChoice;
        html += tr("<p>The %1 that nulls the span error: <b>%2</b>; nearest E96 value not above "
                   "it %3")
                    .arg(isShunt ? tr("shunt") : tr("multiplier"),
                         qs(formatEngineering(*result->correctedResistorOhms, 5, Unit::Ohm)),
                         qs(formatEngineering(choice.ohms_standard, 3, Unit::Ohm)));
        html += choice.trimPractical
                    ? tr(" plus a trim of %1.</p>")
                          .arg(qs(formatEngineering(choice.ohms_trim, 3, Unit::Ohm)))
                    : tr(". %1</p>").arg(qs(choice.trimNote).toHtmlEscaped());
    }
    text_->setText(html);
}

QString AdvicePanel::text() const {
    return text_->text();
}

} // namespace mw::gui
