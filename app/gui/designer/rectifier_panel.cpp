// Rectifier voltmeter range design in the range designer.
#include "app/gui/designer/rectifier_panel.h"

#include "app/gui/designer/rectifier_chart.h"
#include "core/circuits/hazard.h"
#include "core/circuits/rectifier_design.h"
#include "core/circuits/scale_error_curve.h"

#include <QComboBox>
#include <QFormLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QVBoxLayout>

#include <limits>
#include <stdexcept>

namespace mw::gui {
namespace {

constexpr int kIdeal = -1; // the diode box's entry for ideal diodes

} // namespace

RectifierPanel::RectifierPanel(MovementBox* movement, QWidget* parent)
    : DesignerPanel(movement, parent) {
    setObjectName(QStringLiteral("rectifierPanel"));
    auto* layout = new QHBoxLayout(this);
    auto* left = new QGroupBox(tr("Multiplier for full scale at the range (rms of a sine)"), this);
    auto* column = new QVBoxLayout(left);
    auto* form = new QFormLayout;
    rectifier_ = new QComboBox(left);
    rectifier_->setObjectName(QStringLiteral("rectifier_kind"));
    rectifier_->addItem(tr("bridge (full-wave)"), int(SignalType::Bridge));
    rectifier_->addItem(tr("half-wave"), int(SignalType::HalfWave));
    form->addRow(tr("Rectifier:"), rectifier_);
    diode_ = new QComboBox(left);
    diode_->setObjectName(QStringLiteral("rectifier_diode"));
    for (DiodePreset preset :
         {DiodePreset::SmallSignalSilicon, DiodePreset::Schottky, DiodePreset::Germanium}) {
        diode_->addItem(QString::fromUtf8(presetName(preset).data()), int(preset));
    }
    diode_->addItem(tr("ideal"), kIdeal);
    form->addRow(tr("Diodes:"), diode_);
    celsius_ = addField(form, QStringLiteral("rectifier_temperature"), tr("Diode temperature:"),
                        Unit::DegreeCelsius, QStringLiteral("23 °C"));
    range_ = addField(form, QStringLiteral("rectifier_range"), tr("Range:"), Unit::Volt,
                      QStringLiteral("10 V"));
    across_ = addField(form, QStringLiteral("rectifier_shunt"), tr("Resistor across the movement:"),
                       Unit::Ohm, QString());
    across_->line()->setPlaceholderText(tr("none"));
    column->addLayout(form);
    results_ = new ResultList(left);
    results_->addRow("multiplier", tr("Multiplier R_s:"));
    results_->addRow("ideal_multiplier", tr("With ideal diodes:"));
    results_->addRow("sensitivity", tr("AC sensitivity (ideal diodes):"));
    results_->addRow("effective_sensitivity", tr("Effective sensitivity:"));
    results_->addRow("input_resistance", tr("Input resistance at full scale:"));
    addResistorRows(results_);
    column->addWidget(results_);
    column->addWidget(statusLine());
    column->addStretch();
    layout->addWidget(left, 2);
    chart_ = new RectifierCurveChart(this);
    layout->addWidget(chart_, 3);
    for (QComboBox* box : {rectifier_, diode_}) {
        connect(box, &QComboBox::currentIndexChanged, this, &RectifierPanel::recompute);
    }
}

void RectifierPanel::setCircuit(SignalType signal, std::optional<DiodePreset> diode) {
    rectifier_->setCurrentIndex(rectifier_->findData(int(signal)));
    diode_->setCurrentIndex(diode_->findData(diode ? int(*diode) : kIdeal));
}

void RectifierPanel::recompute() {
    designed_.reset();
    const bool ideal = diode_->currentData().toInt() == kIdeal;
    celsius_->setEnabled(!ideal);
    const auto movement = movement_->movement();
    const auto volts = range_->value();
    const auto celsius = ideal ? std::optional<double>(23.0) : celsius_->value();
    const auto across = across_->value(true);
    if (!movement || !volts || !celsius || (!across && !across_->isEmpty())) {
        chart_->clearCurve();
        noResult(results_);
        return;
    }
    const auto signal = SignalType(rectifier_->currentData().toInt());
    RectifierCircuit circuit;
    circuit.rectifier = signal == SignalType::HalfWave ? Rectifier::HalfWave : Rectifier::Bridge;
    circuit.movement_amps_fs = movement->amps_fs;
    circuit.movement_ohms = movement->ohms_coil;
    circuit.shunt_ohms = across.value_or(std::numeric_limits<double>::infinity());
    QuantityField* blamed = range_;
    try {
        blamed = across_;
        validate(circuit);
        blamed = celsius_;
        const RectifierMeter meter =
            ideal ? RectifierMeter(circuit, IdealDiodes{})
                  : RectifierMeter(circuit, diodePreset(DiodePreset(diode_->currentData().toInt())),
                                   *celsius);
        blamed = range_;
        const MultiplierSolution solution = solveMultiplier(meter, *volts);
        const ScaleErrorCurve curve = rectifierScaleErrorCurve(meter, *volts);
        const double ohms = solution.multiplier_ohms;
        results_->set("multiplier", ohms, Unit::Ohm);
        results_->set("ideal_multiplier", solution.ideal_multiplier_ohms, Unit::Ohm);
        results_->set("sensitivity",
                      acSensitivityOhmPerVolt(circuit, averagePerRms(circuit.rectifier)),
                      Unit::OhmPerVolt);
        results_->set("effective_sensitivity", 1.0 / solution.multiplier_rms_amps_fs,
                      Unit::OhmPerVolt);
        results_->set("input_resistance", *volts / solution.multiplier_rms_amps_fs, Unit::Ohm);
        if (ohms > 0.0) {
            showResistor(results_, ohms, solution.multiplier_rms_amps_fs, "the multiplier",
                         hazardCaution(*volts, VoltageKind::AcRms));
        }
        chart_->setCurve(curve, ideal ? tr("ideal diodes (as designed)")
                                      : tr("%1 diodes at %2")
                                            .arg(diode_->currentText(),
                                                 engineering(*celsius, Unit::DegreeCelsius, 3)));
        designed_ =
            DesignedValue{ohms,
                          false,
                          Unit::Volt,
                          *volts,
                          *movement,
                          signal,
                          tr("the multiplier of a %1 %2 range")
                              .arg(engineering(*volts, Unit::Volt, 4), rectifier_->currentText())};
        finish(QString());
    } catch (const std::exception& error) {
        chart_->clearCurve();
        noResult(results_, blamed, QString::fromUtf8(error.what()));
    }
}

} // namespace mw::gui
