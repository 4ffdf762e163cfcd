// The range designer's rectifier panel: a half-wave or bridge voltmeter range's multiplier
// with the diodes' model and temperature, and the chart of its error across the scale.
#pragma once

#include "app/gui/designer/designer_panel.h"
#include "core/circuits/diode.h"

class QComboBox;

namespace mw::gui {

class RectifierCurveChart;

class RectifierPanel : public DesignerPanel {
    Q_OBJECT
public:
    RectifierPanel(MovementBox* movement, QWidget* parent = nullptr);
    void recompute() override;
    std::optional<DesignedValue> designed() const override { return designed_; }
    QuantityField* rangeField() const { return range_; }
    ResultList* results() const { return results_; }
    RectifierCurveChart* chart() const { return chart_; }
    // Rectifier (half-wave or bridge) and diodes: nullopt for ideal ones.
    void setCircuit(SignalType signal, std::optional<DiodePreset> diode);

private:
    QComboBox* rectifier_;
    QComboBox* diode_;
    QuantityField* celsius_;
    QuantityField* range_;
    QuantityField* across_;
    ResultList* results_;
    RectifierCurveChart* chart_;
    std::optional<DesignedValue> designed_;
};

} // namespace mw::gui
