// The range designer's panels about parts rather than one range: the waveform an
// average-responding meter misreads, the copper coil's temperature with its swamping
// resistor, and the preferred-number resistor with its trim and dissipation.
#pragma once

#include "app/gui/designer/designer_panel.h"

class QComboBox;

namespace mw::gui {

class WaveformPanel : public DesignerPanel {
    Q_OBJECT
public:
    explicit WaveformPanel(QWidget* parent = nullptr);
    void recompute() override;
    ResultList* results() const { return results_; }

private:
    QComboBox* shape_;
    QComboBox* rectification_;
    QuantityField* rms_;
    QuantityField* samples_;
    ResultList* results_;
};

class CoilTemperaturePanel : public DesignerPanel {
    Q_OBJECT
public:
    explicit CoilTemperaturePanel(QWidget* parent = nullptr);
    void recompute() override;
    ResultList* results() const { return results_; }

private:
    QuantityField* coil_;
    QuantityField* coilAt_;
    QuantityField* reference_;
    QuantityField* working_;
    QuantityField* series_;
    QuantityField* target_;
    QuantityField* from_;
    QuantityField* to_;
    QuantityField* swampTempco_;
    ResultList* results_;
};

class ESeriesPanel : public DesignerPanel {
    Q_OBJECT
public:
    explicit ESeriesPanel(QWidget* parent = nullptr);
    void recompute() override;
    ResultList* results() const { return results_; }

private:
    QComboBox* series_;
    QuantityField* ohms_;
    QuantityField* amps_;
    QuantityField* rating_;
    QuantityField* voltageRating_;
    ResultList* results_;
};

} // namespace mw::gui
