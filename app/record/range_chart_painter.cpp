// The session chart of one range on paper: errors in % of the fiducial value with U as bars.
#include "app/record/chart_painters.h"

#include <QPainter>
#include <QPainterPath>

#include <algorithm>
#include <cmath>

namespace mw::record {
namespace {

using chart::LegendItem;
using chart::Marker;

QPolygonF polyline(const chart::Frame& frame, const ChartLine& line) {
    QPolygonF points;
    for (const auto& [x, y] : line.points) {
        points << frame.map(x, y);
    }
    return points;
}

QString seriesWords(const ChartSeries& series) {
    return QStringLiteral("%1, %2").arg(
        series.phase == Phase::AsFound ? QStringLiteral("as found") : QStringLiteral("as left"),
        series.direction == Direction::Up ? QStringLiteral("up-scale")
                                          : QStringLiteral("down-scale"));
}

// As found in circles, as left in squares; up-scale filled, down-scale open.
Marker markerOf(const ChartSeries& series) {
    return series.phase == Phase::AsFound ? Marker::Circle : Marker::Square;
}

std::vector<LegendItem> legendOf(const PageStyle& style, const RangeChart& chart,
                                 bool anyNotPassed) {
    const double size = style.mm(1.8);
    std::vector<LegendItem> legend;
    for (const ChartSeries& series : chart.series) {
        const Marker shape = markerOf(series);
        const bool filled = series.direction == Direction::Up;
        legend.push_back(
            {seriesWords(series), [size, shape, filled, &style](QPainter& p, const QRectF& r) {
                 p.setPen(QPen(style.ink, style.pt(0.8)));
                 chart::drawMarker(p, r.center(), size, shape, filled);
             }});
    }
    legend.push_back({QStringLiteral("U"), [&style](QPainter& p, const QRectF& r) {
                          p.setPen(QPen(style.ink, style.pt(0.6)));
                          const double c = r.center().x();
                          p.drawLine(QPointF(c, r.top()), QPointF(c, r.bottom()));
                          p.drawLine(QPointF(c - r.width() / 6, r.top()),
                                     QPointF(c + r.width() / 6, r.top()));
                          p.drawLine(QPointF(c - r.width() / 6, r.bottom()),
                                     QPointF(c + r.width() / 6, r.bottom()));
                      }});
    legend.push_back({QStringLiteral("class limits"), [&style](QPainter& p, const QRectF& r) {
                          p.setPen(QPen(style.ink, style.pt(1.2)));
                          p.drawLine(QPointF(r.left(), r.center().y()),
                                     QPointF(r.right(), r.center().y()));
                      }});
    if (chart.guardUpper) {
        legend.push_back({QStringLiteral("acceptance limits (guard band)"),
                          [&style](QPainter& p, const QRectF& r) {
                              p.setPen(QPen(style.ink, style.pt(0.8), Qt::DashLine));
                              p.drawLine(QPointF(r.left(), r.center().y()),
                                         QPointF(r.right(), r.center().y()));
                          }});
    }
    if (chart.predicted) {
        legend.push_back({QStringLiteral("predicted by the rectifier model"),
                          [&style](QPainter& p, const QRectF& r) {
                              p.setPen(QPen(style.muted, style.pt(1.0), Qt::DotLine));
                              p.drawLine(QPointF(r.left(), r.center().y()),
                                         QPointF(r.right(), r.center().y()));
                          }});
    }
    if (anyNotPassed) {
        legend.push_back(
            {QStringLiteral("did not pass (ringed)"), [size, &style](QPainter& p, const QRectF& r) {
                 p.setPen(QPen(style.ink, style.pt(0.8)));
                 p.drawEllipse(r.center(), size * 1.2, size * 1.2);
             }});
    }
    return legend;
}

} // namespace

void paintRangeChart(QPainter& painter, const PageStyle& style, const RangeChart& chart, Unit unit,
                     const QRectF& area) {
    const chart::UnitScale scale =
        chart::unitScale(std::max(std::fabs(chart.lower), std::fabs(chart.upper)), unit);
    // The scale with a little room at both ends: applied values may lie just beyond it, and a
    // marker on the frame would be cut in half.
    double lowest = chart.lower;
    double highest = chart.upper;
    for (const ChartSeries& series : chart.series) {
        for (const ChartMark& mark : series.marks) {
            lowest = std::min(lowest, mark.applied);
            highest = std::max(highest, mark.applied);
        }
    }
    const double room = (highest - lowest) * 0.04;
    chart::Axis x =
        chart::niceAxis((lowest - room) / scale.factor, (highest + room) / scale.factor, 10);
    const double extent = chart.yExtent > 0.0 ? chart.yExtent : 1.0;
    chart::Axis y = chart::niceAxis(-extent, extent, 8);
    std::vector<QString> xLabels;
    std::vector<QString> yLabels;
    for (double t : x.ticks) {
        xLabels.push_back(chart::tickText(t));
    }
    for (double t : y.ticks) {
        yLabels.push_back(chart::tickText(t));
    }
    // The x axis runs in the scaled unit; map() takes scaled values.
    bool anyNotPassed = false;
    for (const ChartSeries& series : chart.series) {
        for (const ChartMark& mark : series.marks) {
            anyNotPassed = anyNotPassed || mark.decision != Outcome::Pass;
        }
    }
    const chart::Frame frame(painter, style, area, x, y, xLabels, yLabels,
                             QStringLiteral("applied value (%1)").arg(scale.symbol),
                             QStringLiteral("error (% of fiducial value)"),
                             legendOf(style, chart, anyNotPassed));
    frame.drawAxes();
    painter.save();
    painter.setClipRect(frame.plot());
    painter.setRenderHint(QPainter::Antialiasing);
    const double x0 = frame.x().low * scale.factor;
    const double x1 = frame.x().high * scale.factor;
    const auto at = [&](double applied, double percent) {
        return frame.map(applied / scale.factor, percent);
    };
    painter.setPen(QPen(style.rule, style.pt(0.6)));
    painter.drawLine(at(x0, 0.0), at(x1, 0.0));
    painter.setPen(QPen(style.ink, style.pt(1.2)));
    for (double sign : {1.0, -1.0}) {
        painter.drawLine(at(x0, sign * chart.limitPercent), at(x1, sign * chart.limitPercent));
    }
    if (chart.guardUpper && chart.guardLower) {
        painter.setPen(QPen(style.ink, style.pt(0.8), Qt::DashLine));
        for (const ChartLine* line : {&*chart.guardUpper, &*chart.guardLower}) {
            ChartLine scaled = *line;
            for (auto& point : scaled.points) {
                point.first /= scale.factor;
            }
            painter.drawPolyline(polyline(frame, scaled));
        }
    }
    if (chart.predicted) {
        ChartLine scaled = *chart.predicted;
        for (auto& point : scaled.points) {
            point.first /= scale.factor;
        }
        painter.setPen(QPen(style.muted, style.pt(1.0), Qt::DotLine));
        painter.drawPolyline(polyline(frame, scaled));
    }
    // Side by side at each applied value, so that bars of the same point do not cover each
    // other: each series is shifted by a small share of the plot's width.
    const double size = style.mm(1.8);
    const double step = frame.plot().width() * 0.012;
    const double middle = (static_cast<double>(chart.series.size()) - 1.0) / 2.0;
    for (std::size_t i = 0; i < chart.series.size(); ++i) {
        const ChartSeries& series = chart.series[i];
        const double dx = (static_cast<double>(i) - middle) * step;
        for (const ChartMark& mark : series.marks) {
            const QPointF centre = at(mark.applied, mark.errorPercent) + QPointF(dx, 0.0);
            const QPointF top = at(mark.applied, mark.errorPercent + mark.uncertaintyPercent);
            const QPointF bottom = at(mark.applied, mark.errorPercent - mark.uncertaintyPercent);
            painter.setPen(QPen(style.ink, style.pt(0.6)));
            painter.drawLine(QPointF(centre.x(), top.y()), QPointF(centre.x(), bottom.y()));
            painter.drawLine(QPointF(centre.x() - size / 3, top.y()),
                             QPointF(centre.x() + size / 3, top.y()));
            painter.drawLine(QPointF(centre.x() - size / 3, bottom.y()),
                             QPointF(centre.x() + size / 3, bottom.y()));
            painter.setPen(QPen(style.ink, style.pt(0.8)));
            chart::drawMarker(painter, centre, size, markerOf(series),
                              series.direction == Direction::Up);
            if (mark.decision != Outcome::Pass) {
                painter.drawEllipse(centre, size * 1.2, size * 1.2);
            }
        }
    }
    painter.restore();
}

} // namespace mw::record
