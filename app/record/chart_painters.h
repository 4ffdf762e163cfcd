// Charts of printed documents, drawn as vector graphics with QPainter so that a PDF keeps them
// sharp at any zoom: the session chart of one range, and the drift of one test point over time.
// Both only map core's numbers to the page.
#pragma once

#include "app/record/page_style.h"
#include "core/evaluation/session_chart.h"
#include "core/history/instrument_history.h"

#include <QPointF>
#include <QRectF>
#include <QString>

#include <functional>
#include <vector>

class QPainter;

namespace mw::record {

// The errors of one range in % of the fiducial value against the applied value: class limits,
// guard band, U as bars, a rectifier range's predicted curve, and a legend underneath.
void paintRangeChart(QPainter& painter, const PageStyle& style, const RangeChart& chart, Unit unit,
                     const QRectF& area);

// The error of one test point against the date: limits, as-found and as-left results, the
// fitted drift line and its projection to the limit, and a legend underneath.
void paintDriftPlot(QPainter& painter, const PageStyle& style, const PointHistory& point,
                    const QRectF& area);

namespace chart {

// An axis with round tick values covering low..high.
struct Axis {
    double low = 0.0;
    double high = 1.0;
    std::vector<double> ticks;
};

// Ticks at 1, 2, 2.5 or 5 times a power of ten, about `target` of them, within low..high.
Axis niceAxis(double low, double high, int target = 6);

// Values of `unit` written in the prefix of `largest`: factor 1e-3 and "mV" for 0.15 V.
struct UnitScale {
    double factor = 1.0;
    QString symbol;
};
UnitScale unitScale(double largest, Unit unit);

// A tick value in at most four significant digits, without trailing zeros.
QString tickText(double value);

enum class Marker { Circle, Square };
void drawMarker(QPainter& painter, QPointF at, double size, Marker shape, bool filled);

// One entry of a legend: how it is drawn beside its words.
struct LegendItem {
    QString words;
    std::function<void(QPainter&, const QRectF& swatch)> draw;
};

// The plot area inside `outer` once tick labels, axis titles and the legend have their room, and
// the mapping of values into it.
class Frame {
public:
    Frame(QPainter& painter, const PageStyle& style, const QRectF& outer, Axis x, Axis y,
          const std::vector<QString>& xLabels, const std::vector<QString>& yLabels,
          const QString& xTitle, const QString& yTitle, const std::vector<LegendItem>& legend);

    QPointF map(double x, double y) const;
    const QRectF& plot() const { return plot_; }
    const Axis& x() const { return x_; }
    const Axis& y() const { return y_; }

    // Grid, box, tick labels, titles and legend.
    void drawAxes() const;

private:
    double legendHeight(double width) const;

    QPainter& painter_;
    const PageStyle& style_;
    QRectF outer_;
    QRectF plot_;
    Axis x_;
    Axis y_;
    std::vector<QString> xLabels_;
    std::vector<QString> yLabels_;
    QString xTitle_;
    QString yTitle_;
    std::vector<LegendItem> legend_;
};

} // namespace chart
} // namespace mw::record
