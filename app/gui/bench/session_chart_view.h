// The session chart of one range: error as a percentage of the fiducial value against the
// applied value, the class limits, the guard band, U as a bar on each point, as-found and
// as-left series (up-scale and down-scale told apart by marker shape) and a rectifier range's
// predicted curve. It only draws core's numbers (core/evaluation/session_chart.h); every series
// is created once and updated in place with replace().
#pragma once

#include "core/evaluation/session_chart.h"

#include <QChartView>

#include <map>

class QLineSeries;
class QScatterSeries;
class QValueAxis;

namespace mw::gui {

class UncertaintyBars;

class SessionChartView : public QChartView {
    Q_OBJECT
public:
    explicit SessionChartView(QWidget* parent = nullptr);

    void showChart(const RangeChart& chart, const QString& unitLabel);

    // Writes the chart as a picture; the format follows the suffix (.png or .svg). Returns false
    // with `error` set when the file cannot be written.
    bool exportTo(const QString& path, QString* error) const;

    // The points a series holds now, by its name (tests compare them with core's numbers).
    QList<QPointF> seriesPoints(const QString& name) const;

protected:
    void changeEvent(QEvent* event) override;

private:
    void applyPalette();
    QScatterSeries* marks(Phase phase, Direction direction) const;

    QValueAxis* x_ = nullptr;
    QValueAxis* y_ = nullptr;
    QLineSeries* limitUpper_ = nullptr;
    QLineSeries* limitLower_ = nullptr;
    QLineSeries* guardUpper_ = nullptr;
    QLineSeries* guardLower_ = nullptr;
    QLineSeries* predicted_ = nullptr;
    std::map<std::pair<int, int>, QScatterSeries*> marks_; // (phase, direction)
    UncertaintyBars* bars_ = nullptr;
};

} // namespace mw::gui
