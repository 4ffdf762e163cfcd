// The range designer page: the movement and "use for this range" above, one panel per design
// calculation below.
#include "app/gui/designer/range_designer_view.h"

#include "app/gui/designer/component_panels.h"
#include "app/gui/designer/dc_panels.h"
#include "app/gui/designer/range_use_box.h"
#include "app/gui/designer/rectifier_panel.h"
#include "app/gui/workspace.h"
#include "core/model/instrument.h"

#include <QHBoxLayout>
#include <QLineEdit>
#include <QTabWidget>
#include <QVBoxLayout>

namespace mw::gui {

RangeDesignerView::RangeDesignerView(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("rangeDesigner"));
    auto* layout = new QVBoxLayout(this);
    auto* top = new QHBoxLayout;
    movement_ = new MovementBox(this);
    use_ = new RangeUseBox(workspace_, this);
    top->addWidget(movement_, 2);
    top->addWidget(use_, 3);
    layout->addLayout(top);
    tabs_ = new QTabWidget(this);
    tabs_->setObjectName(QStringLiteral("designerPanels"));
    dc_ = new DcVoltmeterPanel(movement_, tabs_);
    ammeter_ = new AmmeterPanel(movement_, tabs_);
    rectifier_ = new RectifierPanel(movement_, tabs_);
    waveform_ = new WaveformPanel(tabs_);
    temperature_ = new CoilTemperaturePanel(tabs_);
    eseries_ = new ESeriesPanel(tabs_);
    // In the order of Panel.
    tabs_->addTab(dc_, tr("&DC voltmeter"));
    tabs_->addTab(ammeter_, tr("&Ammeter shunt"));
    tabs_->addTab(rectifier_, tr("&Rectifier voltmeter"));
    tabs_->addTab(waveform_, tr("&Waveform"));
    tabs_->addTab(temperature_, tr("&Coil temperature"));
    tabs_->addTab(eseries_, tr("Resistor &value"));
    layout->addWidget(tabs_, 1);

    for (DesignerPanel* panel :
         {static_cast<DesignerPanel*>(dc_), static_cast<DesignerPanel*>(ammeter_),
          static_cast<DesignerPanel*>(rectifier_)}) {
        connect(panel, &DesignerPanel::recomputed, this, [this, panel] {
            if (panel == currentPanel()) {
                offerCurrent();
            }
        });
    }
    connect(tabs_, &QTabWidget::currentChanged, this, &RangeDesignerView::offerCurrent);
    connect(use_, &RangeUseBox::rangeTaken, this, &RangeDesignerView::takeRange);
    connect(use_, &RangeUseBox::saved, this, [this](qint64 instrumentId, qint64 rangeId) {
        emit resistorSaved(instrumentId, rangeId);
        emit workspace_.notifier()->registerChanged();
    });
    connect(&workspace_, &Workspace::workbookChanged, this, &RangeDesignerView::reload);
    connect(&workspace_, &Workspace::userChanged, this, &RangeDesignerView::reload);
    connect(workspace_.notifier(), &ChangeNotifier::registerChanged, this,
            [this] { use_->reload(); });
    reload();
}

void RangeDesignerView::showPanel(Panel panel) {
    tabs_->setCurrentIndex(int(panel));
}

DesignerPanel* RangeDesignerView::currentPanel() const {
    return static_cast<DesignerPanel*>(tabs_->currentWidget());
}

void RangeDesignerView::reload() {
    const bool decimalComma = workspace_.isOpen() && workspace_.lab().decimal_comma;
    movement_->setDecimalComma(decimalComma);
    for (DesignerPanel* panel : findChildren<DesignerPanel*>()) {
        panel->setDecimalComma(decimalComma);
    }
    use_->reload();
    recomputeAll();
}

void RangeDesignerView::recomputeAll() {
    for (DesignerPanel* panel : findChildren<DesignerPanel*>()) {
        panel->recompute();
    }
    offerCurrent();
}

void RangeDesignerView::offerCurrent() {
    use_->setDesigned(currentPanel()->designed());
}

void RangeDesignerView::takeRange(const Instrument& instrument, const RangeSpec& range) {
    movement_->setMovement(instrument.movement);
    if (range.unit == Unit::Ampere) {
        ammeter_->rangeField()->setValue(range.full_scale);
        showPanel(Panel::Ammeter);
    } else if (range.signal && *range.signal != SignalType::Dc) {
        rectifier_->setCircuit(*range.signal, range.diode);
        rectifier_->rangeField()->setValue(range.full_scale);
        showPanel(Panel::Rectifier);
    } else {
        dc_->rangeField()->setValue(range.full_scale);
        showPanel(Panel::DcVoltmeter);
    }
}

} // namespace mw::gui
