// Drawing the session chart.
#include "app/gui/bench/session_chart_view.h"

#include "app/gui/status_icons.h"

#include <QApplication>
#include <QChart>
#include <QEvent>
#include <QGraphicsItem>
#include <QGraphicsLayout>
#include <QLegendMarker>
#include <QLineSeries>
#include <QPainter>
#include <QScatterSeries>
#include <QSvgGenerator>
#include <QValueAxis>

#include <cmath>
#include <vector>

namespace mw::gui {

// U drawn as a vertical bar through each point: Qt Charts has no error bars, so an item on the
// chart maps the values to the plot area itself and follows every resize.
class UncertaintyBars : public QGraphicsItem {
public:
    struct Bar {
        double x = 0.0;
        double y = 0.0;
        double u = 0.0;
        bool asLeft = false;
    };

    UncertaintyBars(QChart* chart, QAbstractSeries* reference)
        : QGraphicsItem(chart)
        , chart_(chart)
        , reference_(reference) {
        setZValue(4);
    }

    void setBars(std::vector<Bar> bars, QColor found, QColor left) {
        bars_ = std::move(bars);
        found_ = found;
        left_ = left;
        update();
    }
    const std::vector<Bar>& bars() const { return bars_; }

    QRectF boundingRect() const override { return chart_->plotArea(); }

    void paint(QPainter* painter, const QStyleOptionGraphicsItem*, QWidget*) override {
        painter->setClipRect(chart_->plotArea());
        for (const Bar& bar : bars_) {
            const QPointF top = chart_->mapToPosition(QPointF(bar.x, bar.y + bar.u), reference_);
            const QPointF bottom = chart_->mapToPosition(QPointF(bar.x, bar.y - bar.u), reference_);
            painter->setPen(QPen(bar.asLeft ? left_ : found_, 1.5));
            painter->drawLine(top, bottom);
            painter->drawLine(top - QPointF(4, 0), top + QPointF(4, 0));
            painter->drawLine(bottom - QPointF(4, 0), bottom + QPointF(4, 0));
        }
    }

    void followPlotArea() {
        prepareGeometryChange();
        update();
    }

private:
    QChart* chart_;
    QAbstractSeries* reference_;
    std::vector<Bar> bars_;
    QColor found_;
    QColor left_;
};

namespace {

QLineSeries* line(QChart* chart, const QString& name, Qt::PenStyle style) {
    auto* series = new QLineSeries(chart);
    series->setName(name);
    QPen pen = series->pen();
    pen.setStyle(style);
    pen.setWidthF(1.5);
    series->setPen(pen);
    chart->addSeries(series);
    return series;
}

void hideFromLegend(QChart* chart, QAbstractSeries* series) {
    for (QLegendMarker* marker : chart->legend()->markers(series)) {
        marker->setVisible(false);
    }
}

QList<QPointF> points(const ChartLine& line) {
    QList<QPointF> out;
    for (const auto& [x, y] : line.points) {
        out.append(QPointF(x, y));
    }
    return out;
}

// A step of 1, 2 or 5 × 10^n giving about five intervals over `span`, so tick labels are
// round numbers a reader can interpolate between.
double niceStep(double span) {
    const double rough = span / 5.0;
    const double decade = std::pow(10.0, std::floor(std::log10(rough)));
    for (const double factor : {1.0, 2.0, 5.0}) {
        if (factor * decade >= rough) {
            return factor * decade;
        }
    }
    return 10.0 * decade;
}

void setRoundTicks(QValueAxis* axis, double step) {
    axis->setTickType(QValueAxis::TicksDynamic);
    axis->setTickAnchor(0.0);
    axis->setTickInterval(step);
    axis->setLabelFormat(step >= 1.0 ? QStringLiteral("%.0f")
                                     : QStringLiteral("%.") +
                                           QString::number(int(std::ceil(-std::log10(step)))) +
                                           QStringLiteral("f"));
}

} // namespace

SessionChartView::SessionChartView(QWidget* parent)
    : QChartView(parent) {
    setObjectName(QStringLiteral("sessionChart"));
    setRenderHint(QPainter::Antialiasing);
    auto* chart = new QChart;
    chart->setTitle(tr("Error against applied value"));
    limitUpper_ = line(chart, tr("Class limit"), Qt::SolidLine);
    limitLower_ = line(chart, tr("Class limit (lower)"), Qt::SolidLine);
    guardUpper_ = line(chart, tr("Guard band"), Qt::DashLine);
    guardLower_ = line(chart, tr("Acceptance limit (lower)"), Qt::DashLine);
    predicted_ = line(chart, tr("Diode model"), Qt::DotLine);
    const std::pair<Phase, Direction> order[] = {{Phase::AsFound, Direction::Up},
                                                 {Phase::AsFound, Direction::Down},
                                                 {Phase::AsLeft, Direction::Up},
                                                 {Phase::AsLeft, Direction::Down}};
    for (const auto& [phase, direction] : order) {
        auto* series = new QScatterSeries(chart);
        series->setName(tr("%1 %2").arg(phase == Phase::AsFound ? tr("As-found") : tr("As-left"),
                                        direction == Direction::Up ? tr("▲") : tr("▼")));
        series->setMarkerSize(13);
        chart->addSeries(series);
        marks_[{int(phase), int(direction)}] = series;
    }
    x_ = new QValueAxis(chart);
    y_ = new QValueAxis(chart);
    y_->setTitleText(tr("Error, % of fiducial value"));
    chart->addAxis(x_, Qt::AlignBottom);
    chart->addAxis(y_, Qt::AlignLeft);
    for (QAbstractSeries* series : chart->series()) {
        series->attachAxis(x_);
        series->attachAxis(y_);
    }
    hideFromLegend(chart, limitLower_);
    hideFromLegend(chart, guardLower_);
    chart->legend()->setAlignment(Qt::AlignBottom);
    setChart(chart);
    bars_ = new UncertaintyBars(chart, limitUpper_);
    connect(chart, &QChart::plotAreaChanged, this, [this] { bars_->followPlotArea(); });
    applyPalette();
}

QScatterSeries* SessionChartView::marks(Phase phase, Direction direction) const {
    return marks_.at({int(phase), int(direction)});
}

void SessionChartView::applyPalette() {
    const QPalette palette = QApplication::palette();
    chart()->setTheme(isDark(palette) ? QChart::ChartThemeDark : QChart::ChartThemeLight);
    const QColor ink = palette.color(QPalette::WindowText);
    const QColor found = palette.color(QPalette::Highlight);
    const QColor left = isDark(palette) ? QColor(0xff, 0xb0, 0x40) : QColor(0xb0, 0x50, 0x00);
    for (QLineSeries* limit : {limitUpper_, limitLower_}) {
        QPen pen(ink, 2.0);
        limit->setPen(pen);
    }
    for (QLineSeries* guard : {guardUpper_, guardLower_}) {
        QPen pen(ink, 1.2, Qt::DashLine);
        guard->setPen(pen);
    }
    predicted_->setPen(QPen(palette.color(QPalette::Link), 1.5, Qt::DotLine));
    for (const auto& [key, series] : marks_) {
        const auto phase = Phase(key.first);
        const auto direction = Direction(key.second);
        const QColor colour = phase == Phase::AsFound ? found : left;
        series->setLightMarker(markerImage(direction, phase, colour, 26));
        series->setColor(colour);
        series->setBorderColor(colour);
    }
    bars_->setBars(bars_->bars(), found, left);
}

void SessionChartView::changeEvent(QEvent* event) {
    if (event->type() == QEvent::PaletteChange ||
        event->type() == QEvent::ApplicationPaletteChange) {
        applyPalette();
    }
    QChartView::changeEvent(event);
}

void SessionChartView::showChart(const RangeChart& data, const QString& unitLabel) {
    const double margin = (data.upper - data.lower) * 0.03;
    const double left = data.lower - margin;
    const double right = data.upper + margin;
    limitUpper_->replace({QPointF(left, data.limitPercent), QPointF(right, data.limitPercent)});
    limitLower_->replace({QPointF(left, -data.limitPercent), QPointF(right, -data.limitPercent)});
    guardUpper_->replace(data.guardUpper ? points(*data.guardUpper) : QList<QPointF>());
    guardLower_->replace(data.guardLower ? points(*data.guardLower) : QList<QPointF>());
    for (QLegendMarker* marker : chart()->legend()->markers(guardUpper_)) {
        marker->setVisible(data.guardUpper.has_value());
    }
    predicted_->replace(data.predicted ? points(*data.predicted) : QList<QPointF>());
    for (QLegendMarker* marker : chart()->legend()->markers(predicted_)) {
        marker->setVisible(data.predicted.has_value());
    }
    std::map<std::pair<int, int>, QList<QPointF>> marks;
    std::vector<UncertaintyBars::Bar> bars;
    for (const ChartSeries& series : data.series) {
        QList<QPointF>& list = marks[{int(series.phase), int(series.direction)}];
        for (const ChartMark& mark : series.marks) {
            list.append(QPointF(mark.applied, mark.errorPercent));
            bars.push_back({mark.applied, mark.errorPercent, mark.uncertaintyPercent,
                            series.phase == Phase::AsLeft});
        }
    }
    for (const auto& [key, series] : marks_) {
        series->replace(marks.count(key) ? marks[key] : QList<QPointF>());
        for (QLegendMarker* marker : chart()->legend()->markers(series)) {
            marker->setVisible(marks.count(key) > 0);
        }
    }
    const QPalette palette = QApplication::palette();
    bars_->setBars(std::move(bars), palette.color(QPalette::Highlight),
                   isDark(palette) ? QColor(0xff, 0xb0, 0x40) : QColor(0xb0, 0x50, 0x00));
    // A new range with the old tick step (a 10 V range after a 1 mA one) would lay out tens of
    // thousands of ticks for a moment: the step is made coarse first, then set.
    x_->setTickInterval(std::max(std::abs(right - left), x_->max() - x_->min()));
    x_->setRange(left, right);
    setRoundTicks(x_, niceStep(data.upper - data.lower));
    x_->setTitleText(tr("Applied (%1)").arg(unitLabel));
    const double extent = data.yExtent > 0.0 ? data.yExtent : 1.0;
    const double yStep = niceStep(extent);
    const double yEdge = std::ceil(extent / yStep - 1e-9) * yStep;
    y_->setTickInterval(std::max(2.0 * yEdge, y_->max() - y_->min()));
    y_->setRange(-yEdge, yEdge);
    setRoundTicks(y_, yStep);
    // Markers shown or hidden above: the legend lays itself out again only when told to.
    chart()->legend()->layout()->invalidate();
}

QList<QPointF> SessionChartView::seriesPoints(const QString& name) const {
    for (QAbstractSeries* series : chart()->series()) {
        if (series->name() == name) {
            return static_cast<QXYSeries*>(series)->points();
        }
    }
    return {};
}

bool SessionChartView::exportTo(const QString& path, QString* error) const {
    const QSize size = this->size().isEmpty() ? QSize(900, 600) : this->size();
    if (path.endsWith(QLatin1String(".svg"), Qt::CaseInsensitive)) {
        QSvgGenerator generator;
        generator.setFileName(path);
        generator.setSize(size);
        generator.setViewBox(QRect(QPoint(0, 0), size));
        generator.setTitle(chart()->title());
        QPainter painter;
        if (!painter.begin(&generator)) {
            *error = tr("%1 cannot be written").arg(path);
            return false;
        }
        const_cast<SessionChartView*>(this)->render(&painter);
        painter.end();
        return true;
    }
    if (!const_cast<SessionChartView*>(this)->grab().save(path, "PNG")) {
        *error = tr("%1 cannot be written").arg(path);
        return false;
    }
    return true;
}

} // namespace mw::gui
