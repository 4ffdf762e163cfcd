// The range table of the instrument editor.
#include "app/gui/admin/range_table.h"

#include "app/gui/status_icons.h"
#include "core/circuits/diode.h"
#include "core/circuits/range_design.h"
#include "core/units/quantity.h"

#include <QApplication>
#include <QComboBox>
#include <QHeaderView>

#include <cmath>

namespace mw::gui {
namespace {

QString text(std::string_view value) {
    return QString::fromUtf8(value.data(), static_cast<qsizetype>(value.size()));
}

QString number(double value) {
    return QString::number(value, 'g', 10);
}

QComboBox* comboAt(const QTableWidget* table, int row, int column) {
    return qobject_cast<QComboBox*>(table->cellWidget(row, column));
}

} // namespace

RangeTable::RangeTable(QWidget* parent)
    : QTableWidget(0, 9, parent) {
    setObjectName(QStringLiteral("rangeTable"));
    setHorizontalHeaderLabels({tr("Label"), tr("Unit"), tr("Lower end"), tr("Full scale"),
                               tr("Signal"), tr("Diodes"), tr("Multiplier / shunt (Ω)"),
                               tr("Fiducial value"), tr("Designed by the engine")});
    horizontalHeader()->setStretchLastSection(true);
    verticalHeader()->hide();
    setSelectionBehavior(QAbstractItemView::SelectItems);
    connect(this, &QTableWidget::itemChanged, this, [this] { emit edited(); });
}

void RangeTable::setRanges(const std::vector<RangeSpec>& ranges) {
    QSignalBlocker quiet(this);
    setRowCount(0);
    ids_.clear();
    for (const RangeSpec& range : ranges) {
        addRow(range);
    }
    resizeColumnsToContents();
}

void RangeTable::addRange(Unit unit) {
    RangeSpec range;
    range.unit = unit;
    range.signal = SignalType::Dc;
    {
        QSignalBlocker quiet(this);
        addRow(range);
    }
    setCurrentCell(rowCount() - 1, Label);
    emit edited();
}

void RangeTable::removeCurrentRange() {
    if (currentRow() >= 0) {
        ids_.erase(ids_.begin() + currentRow());
        removeRow(currentRow());
        emit edited();
    }
}

void RangeTable::addRow(const RangeSpec& range) {
    const int row = rowCount();
    insertRow(row);
    ids_.push_back(range.id);
    setItem(row, Label, new QTableWidgetItem(QString::fromStdString(range.label)));
    auto* unit = new QComboBox(this);
    unit->addItem(tr("V"), int(Unit::Volt));
    unit->addItem(tr("A"), int(Unit::Ampere));
    unit->setCurrentIndex(range.unit == Unit::Ampere ? 1 : 0);
    setCellWidget(row, UnitColumn, unit);
    setItem(row, Lower, new QTableWidgetItem(number(range.lower_limit)));
    setItem(row, FullScale,
            new QTableWidgetItem(range.full_scale != 0.0 ? number(range.full_scale) : QString()));
    auto* signal = new QComboBox(this);
    signal->addItem(tr("— not recorded"), -1);
    for (SignalType type : {SignalType::Dc, SignalType::HalfWave, SignalType::Bridge}) {
        signal->addItem(text(displayName(type)), int(type));
    }
    signal->setCurrentIndex(range.signal ? signal->findData(int(*range.signal)) : 0);
    setCellWidget(row, Signal, signal);
    auto* diode = new QComboBox(this);
    diode->addItem(tr("— not recorded"), -1);
    for (DiodePreset preset :
         {DiodePreset::SmallSignalSilicon, DiodePreset::Schottky, DiodePreset::Germanium}) {
        diode->addItem(text(presetName(preset)), int(preset));
    }
    diode->setCurrentIndex(range.diode ? diode->findData(int(*range.diode)) : 0);
    setCellWidget(row, Diode, diode);
    setItem(row, Resistor,
            new QTableWidgetItem(range.nominal_ohms ? number(*range.nominal_ohms) : QString()));
    setItem(row, Fiducial,
            new QTableWidgetItem(range.fiducial_value ? number(*range.fiducial_value) : QString()));
    auto* designed = new QTableWidgetItem;
    designed->setFlags(Qt::ItemIsEnabled);
    setItem(row, Designed, designed);
    for (QComboBox* combo : {unit, signal, diode}) {
        connect(combo, &QComboBox::currentIndexChanged, this, [this] { emit edited(); });
    }
}

double RangeTable::cellValue(int row, int column, Unit unit, bool* ok, QString* reason) const {
    const QString typed = item(row, column) ? item(row, column)->text().trimmed() : QString();
    *ok = true;
    if (typed.isEmpty()) {
        return 0.0;
    }
    try {
        ParseOptions options;
        options.decimalComma = decimalComma_;
        return parseValue(typed.toStdString(), unit, options);
    } catch (const QuantityError& error) {
        *ok = false;
        *reason = QString::fromUtf8(error.what());
        return 0.0;
    }
}

std::vector<RangeSpec> RangeTable::ranges(std::vector<std::pair<QPoint, QString>>* problems) const {
    std::vector<RangeSpec> out;
    for (int row = 0; row < rowCount(); ++row) {
        RangeSpec range;
        range.id = ids_[std::size_t(row)];
        range.label = item(row, Label) ? item(row, Label)->text().trimmed().toStdString() : "";
        range.unit = Unit(comboAt(this, row, UnitColumn)->currentData().toInt());
        const int signal = comboAt(this, row, Signal)->currentData().toInt();
        range.signal = signal < 0 ? std::nullopt : std::optional(SignalType(signal));
        const int diode = comboAt(this, row, Diode)->currentData().toInt();
        range.diode = diode < 0 ? std::nullopt : std::optional(DiodePreset(diode));
        auto read = [&](int column, Unit unit) -> std::optional<double> {
            bool ok = true;
            QString reason;
            const double value = cellValue(row, column, unit, &ok, &reason);
            if (!ok) {
                problems->push_back({QPoint(column, row), reason});
                return std::nullopt;
            }
            const bool empty = !item(row, column) || item(row, column)->text().trimmed().isEmpty();
            return empty ? std::nullopt : std::optional(value);
        };
        range.lower_limit = read(Lower, range.unit).value_or(0.0);
        range.full_scale = read(FullScale, range.unit).value_or(0.0);
        range.nominal_ohms = read(Resistor, Unit::Ohm);
        range.fiducial_value = read(Fiducial, range.unit);
        out.push_back(range);
    }
    return out;
}

void RangeTable::showCheck(const Instrument& instrument,
                           const std::vector<std::pair<QPoint, QString>>& problems) {
    QSignalBlocker quiet(this);
    for (int row = 0; row < rowCount(); ++row) {
        for (int column : {Label, Lower, FullScale, Resistor, Fiducial}) {
            if (QTableWidgetItem* cell = item(row, column)) {
                cell->setIcon(QIcon());
                cell->setToolTip(QString());
            }
        }
        QString designed;
        QString basis;
        if (row < int(instrument.ranges.size())) {
            try {
                const auto design =
                    designedResistor(instrument, instrument.ranges[std::size_t(row)]);
                designed = design ? text(formatEngineering(design->ohms, 5, Unit::Ohm)) +
                                        (design->isShunt ? tr(" shunt") : tr(" multiplier"))
                                  : tr("bare movement");
                basis = design ? text(design->basis) : QString();
            } catch (const std::exception&) {
                designed = tr("—");
            }
        }
        item(row, Designed)->setText(designed);
        item(row, Designed)->setToolTip(basis);
    }
    for (const auto& [cell, reason] : problems) {
        QTableWidgetItem* marked = item(cell.y(), cell.x());
        if (marked == nullptr) {
            continue;
        }
        marked->setIcon(warningIcon(QApplication::palette()));
        marked->setToolTip(
            marked->toolTip().isEmpty() ? reason : marked->toolTip() + QLatin1Char('\n') + reason);
    }
}

void RangeTable::freezeSavedRows(bool frozen, const QString& reason) {
    QSignalBlocker quiet(this);
    for (int row = 0; row < rowCount(); ++row) {
        const bool saved = ids_[std::size_t(row)] != 0;
        for (int column : {Label, Lower, FullScale, Fiducial}) {
            QTableWidgetItem* cell = item(row, column);
            const bool locked = frozen && saved;
            cell->setFlags(locked
                               ? (Qt::ItemIsEnabled | Qt::ItemIsSelectable)
                               : (Qt::ItemIsEnabled | Qt::ItemIsSelectable | Qt::ItemIsEditable));
            if (locked) {
                cell->setToolTip(reason);
            }
        }
        comboAt(this, row, UnitColumn)->setEnabled(!(frozen && saved));
    }
}

} // namespace mw::gui
