// Drawing the rectifier range's scale error curve.
#include "app/gui/designer/rectifier_chart.h"

#include "app/gui/status_icons.h"
#include "core/circuits/scale_error_curve.h"

#include <QChart>
#include <QEvent>
#include <QLineSeries>
#include <QValueAxis>

#include <algorithm>
#include <cmath>

namespace mw::gui {
RectifierCurveChart::RectifierCurveChart(QWidget* parent)
    : QChartView(parent) {
    setObjectName(QStringLiteral("rectifierCurveChart"));
    setRenderHint(QPainter::Antialiasing);
    setMinimumSize(360, 260);
    auto* chart = new QChart;
    chart->setTitle(tr("Predicted indication error across the scale"));
    chart->legend()->setAlignment(Qt::AlignBottom);
    diodes_ = new QLineSeries(chart);
    diodes_->setObjectName(QStringLiteral("diodeCurve"));
    ideal_ = new QLineSeries(chart);
    ideal_->setObjectName(QStringLiteral("idealLine"));
    ideal_->setName(tr("ideal diodes"));
    chart->addSeries(diodes_);
    chart->addSeries(ideal_);
    x_ = new QValueAxis(chart);
    x_->setTitleText(tr("applied sine, % of range"));
    x_->setRange(0.0, 100.0);
    x_->setTickCount(11);
    x_->setLabelFormat(QStringLiteral("%.0f"));
    y_ = new QValueAxis(chart);
    y_->setTitleText(tr("error, % of range"));
    y_->setLabelFormat(QStringLiteral("%.2f"));
    chart->addAxis(x_, Qt::AlignBottom);
    chart->addAxis(y_, Qt::AlignLeft);
    for (QLineSeries* series : {diodes_, ideal_}) {
        series->attachAxis(x_);
        series->attachAxis(y_);
    }
    setChart(chart);
    applyPalette();
}

void RectifierCurveChart::setCurve(const ScaleErrorCurve& curve, const QString& diodes) {
    QList<QPointF> real;
    QList<QPointF> ideal;
    double low = 0.0;
    double high = 0.0;
    for (std::size_t i = 0; i < curve.fractions.size(); ++i) {
        const double x = 100.0 * curve.fractions[i];
        real.append(QPointF(x, curve.error_percent[i]));
        ideal.append(QPointF(x, curve.ideal_error_percent[i]));
        low = std::min({low, curve.error_percent[i], curve.ideal_error_percent[i]});
        high = std::max({high, curve.error_percent[i], curve.ideal_error_percent[i]});
    }
    diodes_->setName(diodes);
    diodes_->replace(real);
    ideal_->replace(ideal);
    // A little room around the curve, never less than ±0.5 % so that a flat line stays flat.
    const double span = std::max(0.5, 1.1 * std::max(std::fabs(low), std::fabs(high)));
    y_->setRange(low < 0.0 ? -span : -0.5, high > 0.0 ? span : 0.5);
    y_->applyNiceNumbers();
}

void RectifierCurveChart::clearCurve() {
    diodes_->clear();
    ideal_->clear();
}

void RectifierCurveChart::changeEvent(QEvent* event) {
    if (event->type() == QEvent::PaletteChange) {
        applyPalette();
    }
    QChartView::changeEvent(event);
}

void RectifierCurveChart::applyPalette() {
    const QPalette& colours = palette();
    chart()->setTheme(isDark(colours) ? QChart::ChartThemeDark : QChart::ChartThemeLight);
    chart()->setBackgroundBrush(colours.color(QPalette::Base));
    // Shapes of line, not colour alone: the diode curve solid and thick, the ideal line dashed.
    diodes_->setPen(QPen(colours.color(QPalette::Highlight), 2.5, Qt::SolidLine));
    ideal_->setPen(QPen(colours.color(QPalette::Text), 1.5, Qt::DashLine));
}

} // namespace mw::gui
