// DC voltmeter and ammeter design in the range designer.
#include "app/gui/designer/dc_panels.h"

#include "core/circuits/ammeter.h"
#include "core/circuits/coil_temperature.h"
#include "core/circuits/dc_voltmeter.h"
#include "core/circuits/eseries.h"
#include "core/circuits/hazard.h"

#include <QFormLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QTableWidget>
#include <QVBoxLayout>

#include <stdexcept>

namespace mw::gui {
namespace {

QTableWidget* table(QWidget* parent, const QString& name, const QStringList& headers) {
    auto* view = new QTableWidget(0, int(headers.size()), parent);
    view->setObjectName(name);
    view->setHorizontalHeaderLabels(headers);
    view->setEditTriggers(QAbstractItemView::NoEditTriggers);
    view->verticalHeader()->hide();
    view->horizontalHeader()->setSectionResizeMode(QHeaderView::Stretch);
    return view;
}

void fill(QTableWidget* view, const std::vector<std::vector<std::pair<double, Unit>>>& rows) {
    view->setRowCount(int(rows.size()));
    for (int row = 0; row < int(rows.size()); ++row) {
        for (int column = 0; column < int(rows[std::size_t(row)].size()); ++column) {
            const auto& [value, unit] = rows[std::size_t(row)][std::size_t(column)];
            auto* cell = new QTableWidgetItem(engineering(value, unit));
            cell->setData(Qt::UserRole, value);
            view->setItem(row, column, cell);
        }
    }
}

// A titled group with a column layout.
QVBoxLayout* group(const QString& title, QWidget* parent, QGroupBox** box) {
    *box = new QGroupBox(title, parent);
    return new QVBoxLayout(*box);
}

} // namespace

DcVoltmeterPanel::DcVoltmeterPanel(MovementBox* movement, QWidget* parent)
    : DesignerPanel(movement, parent) {
    setObjectName(QStringLiteral("dcVoltmeterPanel"));
    auto* layout = new QHBoxLayout(this);
    QGroupBox* single = nullptr;
    QVBoxLayout* singleColumn = group(tr("One range: R_s = V / I_fs − R_m"), this, &single);
    auto* form = new QFormLayout;
    range_ = addField(form, QStringLiteral("dc_range"), tr("Range:"), Unit::Volt,
                      QStringLiteral("10 V"));
    singleColumn->addLayout(form);
    results_ = new ResultList(single);
    results_->addRow("multiplier", tr("Multiplier R_s:"));
    results_->addRow("input_resistance", tr("Input resistance:"));
    results_->addRow("sensitivity", tr("Sensitivity:"));
    addResistorRows(results_);
    singleColumn->addWidget(results_);
    singleColumn->addWidget(statusLine());
    singleColumn->addStretch();
    layout->addWidget(single, 1);

    QGroupBox* several = nullptr;
    QVBoxLayout* severalColumn = group(tr("Several ranges: series chain"), this, &several);
    auto* chainForm = new QFormLayout;
    ranges_ = addField(chainForm, QStringLiteral("dc_ranges"), tr("Ranges (separated by ;):"),
                       Unit::Volt, QStringLiteral("1; 10; 100; 300 V"));
    severalColumn->addLayout(chainForm);
    chain_ =
        table(several, QStringLiteral("dcChain"),
              {tr("Range"), tr("Own multiplier"), tr("Chain section"), tr("Input resistance")});
    severalColumn->addWidget(chain_);
    chainStatus_ = new QLabel(several);
    chainStatus_->setWordWrap(true);
    severalColumn->addWidget(chainStatus_);
    layout->addWidget(several, 1);
}

void DcVoltmeterPanel::recompute() {
    designed_.reset();
    const auto movement = movement_->movement();
    showChain(movement.value_or(Movement{}));
    const auto volts = range_->value();
    if (!movement || !volts) {
        noResult(results_);
        return;
    }
    try {
        const double ohms = multiplier_ohm(*movement, *volts);
        results_->set("multiplier", ohms, Unit::Ohm);
        results_->set("input_resistance", voltmeterResistance_ohm(*movement, *volts), Unit::Ohm);
        results_->set("sensitivity", movement->sensitivity_ohm_per_V(), Unit::OhmPerVolt);
        if (ohms > 0.0) {
            showResistor(results_, ohms, movement->amps_fs, "the multiplier",
                         hazardCaution(*volts, VoltageKind::Dc));
        }
        designed_ = DesignedValue{
            ohms,
            false,
            Unit::Volt,
            *volts,
            *movement,
            SignalType::Dc,
            tr("the multiplier of a %1 DC range").arg(engineering(*volts, Unit::Volt, 4))};
        finish(QString());
    } catch (const std::domain_error& error) {
        noResult(results_, range_, QString::fromUtf8(error.what()));
    }
}

void DcVoltmeterPanel::showChain(const Movement& movement) {
    chain_->setRowCount(0);
    const auto ranges = ranges_->values();
    if (!ranges || !(movement.amps_fs > 0.0)) {
        chainStatus_->setText(markedEntriesProblem());
        return;
    }
    try {
        const std::vector<double> own = multipliers_ohm(movement, *ranges);
        const std::vector<double> sections = seriesChain_ohm(movement, *ranges);
        std::vector<std::vector<std::pair<double, Unit>>> rows;
        for (std::size_t i = 0; i < ranges->size(); ++i) {
            rows.push_back({{(*ranges)[i], Unit::Volt},
                            {own[i], Unit::Ohm},
                            {sections[i], Unit::Ohm},
                            {voltmeterResistance_ohm(movement, (*ranges)[i]), Unit::Ohm}});
        }
        fill(chain_, rows);
        chainStatus_->setText(tr("Section 1 sits next to the movement; each higher range adds "
                                 "the next: (V_i − V_i−1) / I_fs."));
    } catch (const std::domain_error& error) {
        ranges_->refuse(QString::fromUtf8(error.what()));
        chainStatus_->setText(tr("✖ No chain: %1").arg(QString::fromUtf8(error.what())));
    }
}

AmmeterPanel::AmmeterPanel(MovementBox* movement, QWidget* parent)
    : DesignerPanel(movement, parent) {
    setObjectName(QStringLiteral("ammeterPanel"));
    auto* layout = new QHBoxLayout(this);
    QGroupBox* single = nullptr;
    QVBoxLayout* singleColumn =
        group(tr("Shunt: R_sh = I_fs·(R_m + R_swamp) / (I − I_fs)"), this, &single);
    auto* form = new QFormLayout;
    range_ = addField(form, QStringLiteral("shunt_range"), tr("Range:"), Unit::Ampere,
                      QStringLiteral("1 A"));
    swamp_ = addField(form, QStringLiteral("shunt_swamp"), tr("Swamping resistor:"), Unit::Ohm,
                      QStringLiteral("0"));
    rating_ = addField(form, QStringLiteral("shunt_rating"), tr("Shunt rating:"), Unit::Watt,
                       QStringLiteral("0.25 W"));
    classIndex_ = addField(form, QStringLiteral("shunt_class"), tr("Accuracy class:"),
                           Unit::Dimensionless, QStringLiteral("1"));
    singleColumn->addLayout(form);
    results_ = new ResultList(single);
    results_->addRow("shunt", tr("Shunt R_sh:"));
    results_->addRow("shunt_current", tr("Shunt current at full scale:"));
    results_->addRow("meter_resistance", tr("Meter resistance:"));
    results_->addRow("burden", tr("Burden:"));
    results_->addRow("dissipation", tr("Dissipation:"));
    results_->addRow("drift", tr("Span drift per 10 K:"));
    results_->addRow("caution", tr("Caution:"));
    singleColumn->addWidget(results_);
    singleColumn->addWidget(statusLine());
    singleColumn->addStretch();
    layout->addWidget(single, 1);

    QGroupBox* ayrton = nullptr;
    QVBoxLayout* ayrtonColumn = group(tr("Several ranges: Ayrton shunt"), this, &ayrton);
    auto* tapsForm = new QFormLayout;
    ranges_ = addField(tapsForm, QStringLiteral("ayrton_ranges"), tr("Ranges (separated by ;):"),
                       Unit::Ampere, QStringLiteral("10 mA; 100 mA; 1 A"));
    ayrtonColumn->addLayout(tapsForm);
    taps_ = table(ayrton, QStringLiteral("ayrtonTaps"),
                  {tr("Range"), tr("Tap from common"), tr("Section"), tr("Burden")});
    ayrtonColumn->addWidget(taps_);
    tapsStatus_ = new QLabel(ayrton);
    tapsStatus_->setWordWrap(true);
    ayrtonColumn->addWidget(tapsStatus_);
    layout->addWidget(ayrton, 1);
}

void AmmeterPanel::recompute() {
    designed_.reset();
    const auto bare = movement_->movement();
    showTaps(bare.value_or(Movement{}));
    const auto amps = range_->value();
    const auto swamp = swamp_->value();
    const auto rating = rating_->value();
    const auto classIndex = classIndex_->value();
    if (swamp && *swamp < 0.0) {
        swamp_->refuse(tr("a swamping resistor cannot be negative"));
    }
    if (!bare || !amps || !swamp || *swamp < 0.0 || !rating || !classIndex) {
        noResult(results_);
        return;
    }
    try {
        const Movement branch{bare->amps_fs, bare->ohms_coil + *swamp}; // the shunted branch
        const double ohms = shunt_ohm(branch, *amps);
        const double amps_shunt = *amps - branch.amps_fs;
        const Dissipation heat = dissipation(ohms, amps_shunt, *rating);
        const CoilCircuit circuit{bare->ohms_coil, TempcoResistor{*swamp, 0.0},
                                  TempcoResistor{ohms, 0.0}};
        results_->set("shunt", ohms, Unit::Ohm);
        results_->set("shunt_current", amps_shunt, Unit::Ampere);
        results_->set("meter_resistance", ohms * branch.ohms_coil / (ohms + branch.ohms_coil),
                      Unit::Ohm);
        results_->set(
            "burden", branch.fullScaleDrop_V(),
            tr("%1 at full scale, %2 at 120 %")
                .arg(engineering(branch.fullScaleDrop_V(), Unit::Volt),
                     engineering(kOverrangeFactor * branch.fullScaleDrop_V(), Unit::Volt)));
        const QString flag = QStringLiteral("  ") + ratingFlag(heat);
        results_->set("dissipation", heat.watts_fs,
                      tr("%1 at full scale, %2 at 120 % (rating %3)")
                              .arg(engineering(heat.watts_fs, Unit::Watt),
                                   engineering(heat.watts_overrange, Unit::Watt),
                                   engineering(heat.watts_rating, Unit::Watt, 3)) +
                          flag);
        results_->set("drift", 100.0 * spanDriftPer10K(circuit), Unit::Percent, 3);
        QStringList cautions;
        if (const auto caution = ratingCaution(heat, "the shunt")) {
            cautions << QString::fromStdString(*caution);
        }
        if (const auto caution = unswampedShuntCaution(circuit, *classIndex)) {
            cautions << QString::fromStdString(*caution);
        }
        results_->setText("caution",
                          cautions.isEmpty() ? tr("none") : tr("⚠ ") + cautions.join(u' '));
        designed_ =
            DesignedValue{ohms,
                          true,
                          Unit::Ampere,
                          *amps,
                          *bare,
                          SignalType::Dc,
                          tr("the shunt of a %1 range").arg(engineering(*amps, Unit::Ampere, 4))};
        finish(QString());
    } catch (const std::domain_error& error) {
        noResult(results_, range_, QString::fromUtf8(error.what()));
    }
}

void AmmeterPanel::showTaps(const Movement& movement) {
    taps_->setRowCount(0);
    const auto ranges = ranges_->values();
    if (!ranges || !(movement.amps_fs > 0.0)) {
        tapsStatus_->setText(markedEntriesProblem());
        return;
    }
    try {
        const AyrtonShunt shunt = ayrtonShunt(movement, *ranges);
        std::vector<std::vector<std::pair<double, Unit>>> rows;
        for (std::size_t k = 0; k < shunt.amps_ranges.size(); ++k) {
            rows.push_back({{shunt.amps_ranges[k], Unit::Ampere},
                            {shunt.taps_ohm[k], Unit::Ohm},
                            {shunt.sections_ohm[k], Unit::Ohm},
                            {shunt.burden_V[k], Unit::Volt}});
        }
        fill(taps_, rows);
        tapsStatus_->setText(tr("Whole string %1; section 1 is next to the common terminal and "
                                "used alone on the highest range.")
                                 .arg(engineering(shunt.total_ohm, Unit::Ohm)));
    } catch (const std::domain_error& error) {
        ranges_->refuse(QString::fromUtf8(error.what()));
        tapsStatus_->setText(tr("✖ No taps: %1").arg(QString::fromUtf8(error.what())));
    }
}

} // namespace mw::gui
