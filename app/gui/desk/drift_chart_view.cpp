#include "app/gui/desk/drift_chart_view.h"

#include "core/units/quantity.h"

#include <QApplication>
#include <QChart>
#include <QDateTime>
#include <QDateTimeAxis>
#include <QLegendMarker>
#include <QLineSeries>
#include <QScatterSeries>
#include <QValueAxis>

#include <algorithm>
#include <cmath>

namespace mw::gui {
namespace {

using std::chrono::sys_days;

constexpr qint64 kMillisecondsPerDay = 86'400'000;

double dayNumber(sys_days day) {
    return static_cast<double>(day.time_since_epoch().count());
}

QColor seriesColour(int index) {
    // Distinct hues for overlaid points; the single-point view uses the palette's highlight.
    static const QColor hues[] = {QColor(0x1f, 0x5f, 0xa8), QColor(0xb0, 0x50, 0x00),
                                  QColor(0x2e, 0x7d, 0x32), QColor(0x7b, 0x1f, 0xa2),
                                  QColor(0x00, 0x83, 0x8f), QColor(0x8d, 0x6e, 0x63)};
    return hues[index % 6];
}

// Series hold day numbers for the tests; the date axis needs milliseconds.
void appendDay(QXYSeries* series, double day, double value) {
    series->append(day * kMillisecondsPerDay, value);
}

// The SI prefix that writes `magnitude` with one to three digits before the point, so that an
// axis of a 100 mA range's errors reads in µA rather than in 0.0005 A.
std::pair<double, QString> prefixFor(double magnitude) {
    static const std::pair<int, const char*> prefixes[] = {
        {-12, "p"}, {-9, "n"}, {-6, "µ"}, {-3, "m"}, {0, ""}, {3, "k"}, {6, "M"}};
    int power = 0;
    if (magnitude > 0.0 && std::isfinite(magnitude)) {
        power = int(std::floor(std::log10(magnitude) / 3.0)) * 3;
        power = std::clamp(power, -12, 6);
    }
    for (const auto& [p, symbol] : prefixes) {
        if (p == power) {
            return {std::pow(10.0, -power), QString::fromUtf8(symbol)};
        }
    }
    return {1.0, QString()};
}

} // namespace

sys_days driftChartEnd(const PointHistory& point) {
    sys_days end = point.asFound.empty() ? sys_days{} : point.asFound.back().date;
    if (!point.asLeft.empty()) {
        end = std::max(end, point.asLeft.back().date);
    }
    if (point.line && point.line->reachesLimit && point.drift && point.drift->significant) {
        end = std::max(
            end, std::min(*point.line->reachesLimit, point.line->to + std::chrono::days{3 * 365}));
    }
    return end;
}

DriftChartView::DriftChartView(QWidget* parent)
    : QChartView(parent) {
    setObjectName(QStringLiteral("driftChart"));
    auto* chart = new QChart;
    chart->legend()->setAlignment(Qt::AlignBottom);
    chart->setMargins(QMargins(4, 4, 4, 4));
    const QPalette palette = QApplication::palette();
    chart->setTheme(palette.color(QPalette::Window).lightness() < 128 ? QChart::ChartThemeDark
                                                                      : QChart::ChartThemeLight);
    setChart(chart);
    setRenderHint(QPainter::Antialiasing);
    x_ = new QDateTimeAxis(chart);
    x_->setFormat(QStringLiteral("yyyy"));
    x_->setTitleText(tr("calibration date"));
    y_ = new QValueAxis(chart);
    chart->addAxis(x_, Qt::AlignBottom);
    chart->addAxis(y_, Qt::AlignLeft);
    setMinimumHeight(240);
}

void DriftChartView::clear() {
    chart()->removeAllSeries();
}

void DriftChartView::showPoint(const PointHistory& point) {
    clear();
    const auto [scale, prefix] = prefixFor(point.permissibleError);
    scale_ = scale;
    addPoint(point, scale, QString(), 0);
    if (!point.asFound.empty()) {
        addLimits(point.permissibleError * scale, point.asFound.front().date, driftChartEnd(point));
    }
    fitAxes(
        tr("as-found error (%1%2)").arg(prefix, QString::fromUtf8(unitSymbol(point.unit).data())));
}

void DriftChartView::showAll(const std::vector<PointHistory>& points) {
    clear();
    scale_ = 1.0;
    std::optional<sys_days> first;
    std::optional<sys_days> last;
    int index = 0;
    for (const PointHistory& point : points) {
        ++index;
        if (point.asFound.empty() || !(point.permissibleError > 0.0)) {
            continue;
        }
        addPoint(point, 100.0 / point.permissibleError, QStringLiteral(" %1").arg(index), index);
        first = std::min(first.value_or(point.asFound.front().date), point.asFound.front().date);
        last = std::max(last.value_or(driftChartEnd(point)), driftChartEnd(point));
    }
    if (first) {
        addLimits(100.0, *first, *last);
    }
    fitAxes(tr("as-found error (% of the limit)"));
}

void DriftChartView::addPoint(const PointHistory& point, double scale, const QString& suffix,
                              int index) {
    const QColor colour =
        index == 0 ? QApplication::palette().color(QPalette::Highlight) : seriesColour(index - 1);
    auto* found = new QScatterSeries;
    found->setName(tr("as found") + suffix);
    found->setMarkerShape(QScatterSeries::MarkerShapeCircle);
    found->setMarkerSize(9);
    found->setColor(colour);
    for (const PointSample& sample : point.asFound) {
        appendDay(found, dayNumber(sample.date), sample.error * scale);
    }
    chart()->addSeries(found);
    if (point.line && point.drift && point.drift->significant) {
        const DriftLine& line = *point.line;
        auto* fitted = new QLineSeries;
        fitted->setName(tr("fitted") + suffix);
        fitted->setPen(QPen(colour, 2.0));
        appendDay(fitted, dayNumber(line.from), line.errorAtFrom * scale);
        appendDay(fitted, dayNumber(line.to), line.errorAtTo * scale);
        chart()->addSeries(fitted);
        const sys_days end = driftChartEnd(point);
        if (end > line.to) {
            auto* projected = new QLineSeries;
            projected->setName(tr("projected") + suffix);
            projected->setPen(QPen(colour, 1.5, Qt::DashLine));
            appendDay(projected, dayNumber(line.to), line.errorAtTo * scale);
            appendDay(projected, dayNumber(end), fittedErrorOn(line, end) * scale);
            chart()->addSeries(projected);
        }
    }
}

void DriftChartView::addLimits(double limit, sys_days from, sys_days to) {
    const QColor ink = QApplication::palette().color(QPalette::WindowText);
    const std::pair<QString, double> sides[] = {{tr("+limit"), limit}, {tr("−limit"), -limit}};
    for (const auto& [name, value] : sides) {
        auto* series = new QLineSeries;
        series->setName(name);
        series->setPen(QPen(ink, 1.2, Qt::DashDotLine));
        appendDay(series, dayNumber(from) - 30, value);
        appendDay(series, dayNumber(to) + 30, value);
        chart()->addSeries(series);
    }
    // One legend entry says what both lines are.
    const QList<QAbstractSeries*> all = chart()->series();
    for (QLegendMarker* marker : chart()->legend()->markers(all.at(all.size() - 2))) {
        marker->setLabel(tr("± limit"));
    }
    for (QLegendMarker* marker : chart()->legend()->markers(all.back())) {
        marker->setVisible(false);
    }
}

void DriftChartView::fitAxes(const QString& yTitle) {
    double low = 0.0;
    double high = 0.0;
    double first = 0.0;
    double last = 0.0;
    bool any = false;
    for (QAbstractSeries* abstract : chart()->series()) {
        auto* series = static_cast<QXYSeries*>(abstract);
        series->attachAxis(x_);
        series->attachAxis(y_);
        for (const QPointF& p : series->points()) {
            low = any ? std::min(low, p.y()) : p.y();
            high = any ? std::max(high, p.y()) : p.y();
            first = any ? std::min(first, p.x()) : p.x();
            last = any ? std::max(last, p.x()) : p.x();
            any = true;
        }
    }
    y_->setTitleText(yTitle);
    if (!any) {
        return;
    }
    const double margin = std::max((high - low) * 0.08, 1e-12);
    y_->setRange(low - margin, high + margin);
    y_->applyNiceNumbers();
    x_->setRange(QDateTime::fromMSecsSinceEpoch(qint64(first), Qt::UTC),
                 QDateTime::fromMSecsSinceEpoch(qint64(last), Qt::UTC));
}

QList<QPointF> DriftChartView::seriesPoints(const QString& name) const {
    for (QAbstractSeries* abstract : chart()->series()) {
        if (abstract->name() == name) {
            QList<QPointF> points = static_cast<QXYSeries*>(abstract)->points();
            for (QPointF& p : points) {
                p.setX(p.x() / kMillisecondsPerDay);
            }
            return points;
        }
    }
    return {};
}

} // namespace mw::gui
