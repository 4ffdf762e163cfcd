// The range designer: one page for the engine's design calculations — a DC voltmeter's
// multiplier and series chain, an ammeter's shunt and Ayrton taps, a rectifier voltmeter's
// multiplier with its diodes and the chart of its error across the scale, the waveform error of
// an average-responding meter, the coil's temperature with its swamping resistor, and the
// preferred resistor value with its trim and dissipation. Values are typed as on the bench
// (the lab's decimal comma), every result follows each keystroke, and an entry the engine
// cannot read is marked with the reason while what was typed stays. A designed multiplier or
// shunt can be copied into an instrument's range ("use for this range").
#pragma once

#include <QWidget>

class QTabWidget;

namespace mw {
struct Instrument;
struct RangeSpec;
} // namespace mw

namespace mw::gui {

class AmmeterPanel;
class CoilTemperaturePanel;
class DcVoltmeterPanel;
class DesignerPanel;
class ESeriesPanel;
class MovementBox;
class RangeUseBox;
class RectifierPanel;
class WaveformPanel;
class Workspace;

class RangeDesignerView : public QWidget {
    Q_OBJECT
public:
    enum class Panel { DcVoltmeter, Ammeter, Rectifier, Waveform, CoilTemperature, ESeries };

    explicit RangeDesignerView(Workspace& workspace, QWidget* parent = nullptr);

    void showPanel(Panel panel);
    DesignerPanel* currentPanel() const;

    MovementBox* movementBox() const { return movement_; }
    DcVoltmeterPanel* dcPanel() const { return dc_; }
    AmmeterPanel* ammeterPanel() const { return ammeter_; }
    RectifierPanel* rectifierPanel() const { return rectifier_; }
    WaveformPanel* waveformPanel() const { return waveform_; }
    CoilTemperaturePanel* temperaturePanel() const { return temperature_; }
    ESeriesPanel* eseriesPanel() const { return eseries_; }
    RangeUseBox* useBox() const { return use_; }

public slots:
    // Reads the register and the lab's decimal-comma setting again and recomputes every panel.
    // Called by the view itself when the workbook, the person signed in or the register changes.
    void reload();

signals:
    // A designed value was saved into a range (the register's change notification follows).
    void resistorSaved(qint64 instrumentId, qint64 rangeId);

private:
    void recomputeAll();
    void offerCurrent();
    void takeRange(const Instrument& instrument, const RangeSpec& range);

    Workspace& workspace_;
    MovementBox* movement_;
    QTabWidget* tabs_;
    DcVoltmeterPanel* dc_;
    AmmeterPanel* ammeter_;
    RectifierPanel* rectifier_;
    WaveformPanel* waveform_;
    CoilTemperaturePanel* temperature_;
    ESeriesPanel* eseries_;
    RangeUseBox* use_;
};

} // namespace mw::gui
