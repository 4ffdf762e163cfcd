// The chart of a rectifier range's indication error across its scale: the chosen diodes'
// curve beside the ideal-diode line. It draws the series core computed and nothing else.
#pragma once

#include <QChartView>

class QLineSeries;
class QValueAxis;

namespace mw {
struct ScaleErrorCurve;
}

namespace mw::gui {

class RectifierCurveChart : public QChartView {
    Q_OBJECT
public:
    explicit RectifierCurveChart(QWidget* parent = nullptr);

    // x: share of the range in %, y: error in % of the range. `diodes` names the real curve.
    void setCurve(const ScaleErrorCurve& curve, const QString& diodes);
    void clearCurve();
    QLineSeries* diodeSeries() const { return diodes_; }
    QLineSeries* idealSeries() const { return ideal_; }

protected:
    void changeEvent(QEvent* event) override;

private:
    void applyPalette();

    QLineSeries* diodes_;
    QLineSeries* ideal_;
    QValueAxis* x_;
    QValueAxis* y_;
};

} // namespace mw::gui
