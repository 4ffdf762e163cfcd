// The range designer's DC panels: a voltmeter's multiplier with its multi-range series chain,
// and an ammeter's shunt with its Ayrton taps.
#pragma once

#include "app/gui/designer/designer_panel.h"

class QTableWidget;

namespace mw::gui {

class DcVoltmeterPanel : public DesignerPanel {
    Q_OBJECT
public:
    DcVoltmeterPanel(MovementBox* movement, QWidget* parent = nullptr);
    void recompute() override;
    std::optional<DesignedValue> designed() const override { return designed_; }
    QuantityField* rangeField() const { return range_; }
    ResultList* results() const { return results_; }
    QTableWidget* chain() const { return chain_; }

private:
    void showChain(const Movement& movement);

    QuantityField* range_;
    QuantityField* ranges_;
    ResultList* results_;
    QTableWidget* chain_;
    QLabel* chainStatus_;
    std::optional<DesignedValue> designed_;
};

class AmmeterPanel : public DesignerPanel {
    Q_OBJECT
public:
    AmmeterPanel(MovementBox* movement, QWidget* parent = nullptr);
    void recompute() override;
    std::optional<DesignedValue> designed() const override { return designed_; }
    QuantityField* rangeField() const { return range_; }
    ResultList* results() const { return results_; }
    QTableWidget* taps() const { return taps_; }

private:
    void showTaps(const Movement& movement);

    QuantityField* range_;
    QuantityField* swamp_;
    QuantityField* rating_;
    QuantityField* classIndex_;
    QuantityField* ranges_;
    ResultList* results_;
    QTableWidget* taps_;
    QLabel* tapsStatus_;
    std::optional<DesignedValue> designed_;
};

} // namespace mw::gui
