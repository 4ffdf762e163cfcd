// Read-only detail of the instrument selected in the register.
#include "app/gui/instrument_detail_panel.h"

#include "core/units/quantity.h"

#include <QFormLayout>
#include <QHeaderView>
#include <QLabel>
#include <QTableWidget>
#include <QVBoxLayout>

namespace mw::gui {
namespace {

QString text(std::string_view value) {
    return QString::fromUtf8(value.data(), static_cast<qsizetype>(value.size()));
}

QString engineering(double value, Unit unit) {
    return QString::fromStdString(formatEngineering(value, 4, unit));
}

} // namespace

InstrumentDetailPanel::InstrumentDetailPanel(QWidget* parent)
    : QWidget(parent) {
    setObjectName(QStringLiteral("instrumentDetail"));
    auto* layout = new QVBoxLayout(this);
    heading_ = new QLabel(tr("Select an instrument in the register."), this);
    heading_->setObjectName(QStringLiteral("detailHeading"));
    heading_->setWordWrap(true);
    layout->addWidget(heading_);

    body_ = new QWidget(this);
    auto* form = new QFormLayout(body_);
    addField(form, QStringLiteral("kind"), tr("Kind"));
    addField(form, QStringLiteral("maker"), tr("Manufacturer / model"));
    addField(form, QStringLiteral("serial"), tr("Serial number"));
    addField(form, QStringLiteral("movement"), tr("Movement"));
    addField(form, QStringLiteral("sensitivity"), tr("DC sensitivity"));
    addField(form, QStringLiteral("scale"), tr("Scale"));
    addField(form, QStringLiteral("class"), tr("Accuracy class"));
    addField(form, QStringLiteral("interval"), tr("Calibration interval"));
    addField(form, QStringLiteral("location"), tr("Location / owner"));
    addField(form, QStringLiteral("status"), tr("Status"));
    layout->addWidget(body_);

    ranges_ = new QTableWidget(0, 4, this);
    ranges_->setObjectName(QStringLiteral("detailRanges"));
    ranges_->setHorizontalHeaderLabels(
        {tr("Range"), tr("Scale from"), tr("Full scale"), tr("Multiplier / shunt")});
    ranges_->horizontalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);
    ranges_->horizontalHeader()->setStretchLastSection(true);
    ranges_->verticalHeader()->hide();
    ranges_->setEditTriggers(QAbstractItemView::NoEditTriggers);
    layout->addWidget(ranges_, 1);
    showInstrument(std::nullopt);
}

QLabel* InstrumentDetailPanel::addField(QFormLayout* form, const QString& name,
                                        const QString& label) {
    auto* value = new QLabel(body_);
    value->setObjectName(name);
    value->setTextInteractionFlags(Qt::TextSelectableByMouse);
    value->setWordWrap(true);
    form->addRow(label, value);
    return value;
}

QString InstrumentDetailPanel::fieldText(const QString& name) const {
    const auto* label = body_->findChild<QLabel*>(name);
    return label != nullptr ? label->text() : QString();
}

void InstrumentDetailPanel::showInstrument(const std::optional<Instrument>& instrument) {
    body_->setVisible(instrument.has_value());
    ranges_->setVisible(instrument.has_value());
    if (!instrument) {
        heading_->setText(tr("Select an instrument in the register."));
        return;
    }
    const Instrument& item = *instrument;
    heading_->setText(QStringLiteral("<h3>%1</h3>%2")
                          .arg(QString::fromStdString(item.asset_tag).toHtmlEscaped(),
                               QString::fromStdString(item.description).toHtmlEscaped()));
    auto set = [this](const char* name, const QString& value) {
        body_->findChild<QLabel*>(QLatin1String(name))->setText(value);
    };
    set("kind", text(displayName(item.kind)));
    set("maker", QStringLiteral("%1 %2").arg(QString::fromStdString(item.manufacturer),
                                             QString::fromStdString(item.model)));
    set("serial", QString::fromStdString(item.serial));
    set("movement", tr("I_fs %1, R_m %2")
                        .arg(engineering(item.movement.amps_fs, Unit::Ampere),
                             engineering(item.movement.ohms_coil, Unit::Ohm)));
    set("sensitivity", item.movement.amps_fs > 0
                           ? engineering(item.movement.sensitivity_ohm_per_V(), Unit::OhmPerVolt)
                           : QStringLiteral("—"));
    set("scale",
        tr("%1, %2 divisions").arg(text(displayName(item.scale_type))).arg(item.scale_divisions));
    set("class", tr("%1 (IEC 60051)").arg(item.accuracy_class));
    set("interval", tr("%1 days").arg(item.interval_days));
    set("location", QStringLiteral("%1 / %2").arg(QString::fromStdString(item.location),
                                                  QString::fromStdString(item.owner)));
    set("status", text(displayName(item.status)));

    ranges_->setRowCount(static_cast<int>(item.ranges.size()));
    for (int row = 0; row < ranges_->rowCount(); ++row) {
        const RangeSpec& range = item.ranges[static_cast<std::size_t>(row)];
        const QStringList cells{
            QString::fromStdString(range.label), engineering(range.lower_limit, range.unit),
            engineering(range.full_scale, range.unit),
            range.nominal_ohms ? engineering(*range.nominal_ohms, Unit::Ohm) : tr("none")};
        for (int column = 0; column < cells.size(); ++column) {
            ranges_->setItem(row, column, new QTableWidgetItem(cells[column]));
        }
    }
}

} // namespace mw::gui
