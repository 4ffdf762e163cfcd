// The drift of one test point on paper: its error on every approved record against the date,
// the limits, the fitted line and its projection.
#include "app/record/chart_painters.h"

#include "core/history/calendar.h"

#include <QPainter>

#include <algorithm>
#include <chrono>
#include <cmath>

namespace mw::record {
namespace {

using chart::LegendItem;
using chart::Marker;
using std::chrono::sys_days;

double dayNumber(sys_days day) {
    return static_cast<double>(day.time_since_epoch().count());
}

// Where the date axis ends: past the last result, and on to the projected date when a
// significant drift reaches the limit within a few years (further out it says little).
sys_days axisEnd(const PointHistory& point, sys_days first, sys_days last) {
    sys_days end = last;
    if (point.line && point.line->reachesLimit && point.drift && point.drift->significant) {
        const sys_days horizon = last + std::chrono::days{3 * 365};
        end = std::max(end, std::min(*point.line->reachesLimit, horizon));
    }
    const auto span = std::max<long>((end - first).count(), 365);
    return end + std::chrono::days{span / 12};
}

// Ticks on the first day of each year, or of each quarter when the span is short.
void dateTicks(sys_days low, sys_days high, chart::Axis& axis, std::vector<QString>& labels) {
    using namespace std::chrono;
    const year_month_day from{low};
    const year_month_day to{high};
    const bool quarters = (to.year() - from.year()).count() < 2;
    for (year y = from.year(); y <= to.year(); ++y) {
        for (unsigned m = 1; m <= 12; m += quarters ? 3 : 12) {
            const sys_days day{y / month{m} / 1};
            if (day >= low && day <= high) {
                axis.ticks.push_back(dayNumber(day));
                labels.push_back(quarters ? QString::fromStdString(formatDay(day).substr(0, 7))
                                          : QString::number(static_cast<int>(y)));
            }
        }
    }
}

std::vector<LegendItem> legendOf(const PageStyle& style, const PointHistory& point) {
    const double size = style.mm(1.6);
    std::vector<LegendItem> legend{
        {QStringLiteral("as found"), [size, &style](QPainter& p, const QRectF& r) {
             p.setPen(QPen(style.ink, style.pt(0.8)));
             chart::drawMarker(p, r.center(), size, Marker::Circle, true);
         }}};
    if (!point.asLeft.empty()) {
        legend.push_back({QStringLiteral("as left"), [size, &style](QPainter& p, const QRectF& r) {
                              p.setPen(QPen(style.ink, style.pt(0.8)));
                              chart::drawMarker(p, r.center(), size, Marker::Square, false);
                          }});
    }
    legend.push_back({QStringLiteral("limits"), [&style](QPainter& p, const QRectF& r) {
                          p.setPen(QPen(style.ink, style.pt(1.2)));
                          p.drawLine(QPointF(r.left(), r.center().y()),
                                     QPointF(r.right(), r.center().y()));
                      }});
    if (point.line) {
        legend.push_back(
            {QStringLiteral("fit, projection"), [&style](QPainter& p, const QRectF& r) {
                 const double mid = r.center().x();
                 p.setPen(QPen(style.ink, style.pt(0.9)));
                 p.drawLine(QPointF(r.left(), r.center().y()), QPointF(mid, r.center().y()));
                 p.setPen(QPen(style.ink, style.pt(0.9), Qt::DashLine));
                 p.drawLine(QPointF(mid, r.center().y()), QPointF(r.right(), r.center().y()));
             }});
    }
    return legend;
}

} // namespace

void paintDriftPlot(QPainter& painter, const PageStyle& style, const PointHistory& point,
                    const QRectF& area) {
    std::vector<PointSample> all = point.asFound;
    all.insert(all.end(), point.asLeft.begin(), point.asLeft.end());
    if (all.empty()) {
        return;
    }
    sys_days first = all.front().date;
    sys_days last = all.front().date;
    double largest = point.permissibleError;
    for (const PointSample& s : all) {
        first = std::min(first, s.date);
        last = std::max(last, s.date);
        largest = std::max(largest, std::fabs(s.error));
    }
    const sys_days low = first - std::chrono::days{std::max<long>((last - first).count() / 12, 60)};
    const sys_days high = axisEnd(point, first, last);
    chart::Axis x{dayNumber(low), dayNumber(high), {}};
    std::vector<QString> xLabels;
    dateTicks(low, high, x, xLabels);
    const chart::UnitScale scale = chart::unitScale(largest, point.unit);
    chart::Axis y =
        chart::niceAxis(-largest * 1.15 / scale.factor, largest * 1.15 / scale.factor, 6);
    std::vector<QString> yLabels;
    for (double t : y.ticks) {
        yLabels.push_back(chart::tickText(t));
    }
    const chart::Frame frame(painter, style, area, x, y, xLabels, yLabels, QStringLiteral("date"),
                             QStringLiteral("error (%1)").arg(scale.symbol),
                             legendOf(style, point));
    frame.drawAxes();
    const auto at = [&](sys_days day, double error) {
        return frame.map(dayNumber(day), error / scale.factor);
    };
    painter.save();
    painter.setClipRect(frame.plot());
    painter.setRenderHint(QPainter::Antialiasing);
    painter.setPen(QPen(style.rule, style.pt(0.6)));
    painter.drawLine(at(low, 0.0), at(high, 0.0));
    painter.setPen(QPen(style.ink, style.pt(1.2)));
    for (double sign : {1.0, -1.0}) {
        painter.drawLine(at(low, sign * point.permissibleError),
                         at(high, sign * point.permissibleError));
    }
    if (point.line) {
        const DriftLine& line = *point.line;
        painter.setPen(QPen(style.ink, style.pt(0.9)));
        painter.drawLine(at(line.from, line.errorAtFrom), at(line.to, line.errorAtTo));
        if (point.drift && point.drift->significant) {
            painter.setPen(QPen(style.ink, style.pt(0.9), Qt::DashLine));
            painter.drawLine(at(line.to, line.errorAtTo), at(high, fittedErrorOn(line, high)));
            if (line.reachesLimit && *line.reachesLimit <= high) {
                const double limit =
                    line.slopePerYear > 0.0 ? point.permissibleError : -point.permissibleError;
                const QPointF hit = at(*line.reachesLimit, limit);
                painter.setPen(QPen(style.ink, style.pt(0.8)));
                painter.drawLine(hit + QPointF(0.0, -style.mm(2.0)),
                                 hit + QPointF(0.0, style.mm(2.0)));
            }
        }
    }
    const double size = style.mm(1.6);
    painter.setPen(QPen(style.ink, style.pt(0.8)));
    for (const PointSample& s : point.asLeft) {
        chart::drawMarker(painter, at(s.date, s.error), size, Marker::Square, false);
    }
    for (const PointSample& s : point.asFound) {
        chart::drawMarker(painter, at(s.date, s.error), size, Marker::Circle, true);
    }
    painter.restore();
}

} // namespace mw::record
