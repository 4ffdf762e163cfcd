// The drift of a meter's test points over the years: each approved calibration's as-found
// error against its date, the ± limit lines, and where the engine finds a significant drift,
// the fitted line and its projection to the limit with the projected date. One point is drawn
// in the range's unit; all points together are drawn as a percentage of their limits, so that
// ranges of different units share one scale. The numbers are core's (core/history); the view
// only draws them.
#pragma once

#include "core/history/instrument_history.h"

#include <QChartView>

#include <vector>

class QDateTimeAxis;
class QValueAxis;

namespace mw::gui {

class DriftChartView : public QChartView {
    Q_OBJECT
public:
    explicit DriftChartView(QWidget* parent = nullptr);

    // One test point, in its range's unit.
    void showPoint(const PointHistory& point);
    // Every point, each error as a percentage of its limit.
    void showAll(const std::vector<PointHistory>& points);
    void clear();

    // The points a series holds now, by its name: "as found", "fitted", "projected",
    // "+limit", "−limit" (with " n" appended for the n-th point, from 1, when all are shown);
    // x is the day number since 1970-01-01.
    QList<QPointF> seriesPoints(const QString& name) const;
    // What the range's values are multiplied by on the y axis of one point (its SI prefix,
    // e.g. 1e6 for µA); 1 for the overview in % of the limit.
    double yScale() const { return scale_; }

private:
    void addPoint(const PointHistory& point, double scale, const QString& suffix, int index);
    void addLimits(double limit, std::chrono::sys_days from, std::chrono::sys_days to);
    void fitAxes(const QString& yTitle);

    QDateTimeAxis* x_ = nullptr;
    QValueAxis* y_ = nullptr;
    double scale_ = 1.0;
};

// The last day the chart shows: the last result, or the projected date when a significant
// drift reaches the limit within three years of it (further out a projection says little).
std::chrono::sys_days driftChartEnd(const PointHistory& point);

} // namespace mw::gui
