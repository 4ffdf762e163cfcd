// The range designer's panel base and the movement entries shared by its panels.
#include "app/gui/designer/designer_panel.h"

#include "core/circuits/eseries.h"

#include <QFormLayout>
#include <QLabel>
#include <QLineEdit>

#include <stdexcept>

namespace mw::gui {

QString markedEntriesProblem() {
    return QObject::tr("✖ No result: correct the entries marked ✖.");
}

QString ratingFlag(const Dissipation& heat) {
    return heat.overRating || heat.overVoltageRating ? QObject::tr("✖ over its rating")
           : heat.aboveDeratedRating ? QObject::tr("⚠ above the derated rating (50 %)")
                                     : QObject::tr("✔ within its rating");
}

void addResistorRows(ResultList* results) {
    results->addRow("standard", QObject::tr("E96 not above:"));
    results->addRow("dissipation", QObject::tr("Dissipation:"));
    results->addRow("caution", QObject::tr("Caution:"));
}

void showResistor(ResultList* results, double ohms, double amps, const char* part,
                  const std::optional<std::string>& hazard) {
    const ResistorChoice choice = chooseResistor(ohms, ESeries::E96);
    results->set("standard", choice.ohms_standard,
                 choice.trimPractical
                     ? QObject::tr("%1 + trim %2 (trimmer %3)")
                           .arg(engineering(choice.ohms_standard, Unit::Ohm, 3),
                                engineering(choice.ohms_trim, Unit::Ohm),
                                engineering(choice.ohms_trimmer, Unit::Ohm, 2))
                     : QObject::tr("%1; %2").arg(engineering(choice.ohms_standard, Unit::Ohm, 3),
                                                 QString::fromStdString(choice.trimNote)));
    const Dissipation heat = dissipation(ohms, amps);
    const QString flag = QStringLiteral("  ") + ratingFlag(heat);
    results->set("dissipation", heat.watts_fs,
                 QObject::tr("%1 at full scale, %2 and %3 across it at 120 %")
                         .arg(engineering(heat.watts_fs, Unit::Watt, 3),
                              engineering(heat.watts_overrange, Unit::Watt, 3),
                              engineering(heat.volts_overrange, Unit::Volt, 3)) +
                     flag);
    QStringList cautions;
    if (hazard) {
        cautions << QString::fromStdString(*hazard);
    }
    if (const auto rating = ratingCaution(heat, part)) {
        cautions << QString::fromStdString(*rating);
    }
    results->setText("caution", cautions.isEmpty() ? QObject::tr("none")
                                                   : QObject::tr("⚠ ") + cautions.join(u' '));
}

MovementBox::MovementBox(QWidget* parent)
    : QGroupBox(tr("Movement"), parent) {
    auto* form = new QFormLayout(this);
    amps_ = new QuantityField(QStringLiteral("movement_amps_fs"), Unit::Ampere,
                              QStringLiteral("50 µA"), this);
    ohms_ =
        new QuantityField(QStringLiteral("movement_ohms"), Unit::Ohm, QStringLiteral("2k"), this);
    form->addRow(tr("Full-scale current I_fs:"), amps_);
    form->addRow(tr("Coil resistance R_m:"), ohms_);
    connect(amps_, &QuantityField::edited, this, &MovementBox::edited);
    connect(ohms_, &QuantityField::edited, this, &MovementBox::edited);
}

std::optional<Movement> MovementBox::movement() {
    const auto amps = amps_->value();
    const auto ohms = ohms_->value();
    if (!amps || !ohms) {
        return std::nullopt;
    }
    const Movement movement{*amps, *ohms};
    try {
        checkMovement(movement);
    } catch (const std::invalid_argument& error) {
        // The engine names the field it refuses.
        const bool current = !(*amps > 0.0);
        (current ? amps_ : ohms_)->refuse(QString::fromUtf8(error.what()));
        return std::nullopt;
    }
    return movement;
}

void MovementBox::setMovement(const Movement& movement) {
    amps_->setValue(movement.amps_fs);
    ohms_->setValue(movement.ohms_coil);
}

void MovementBox::setDecimalComma(bool decimalComma) {
    amps_->setDecimalComma(decimalComma);
    ohms_->setDecimalComma(decimalComma);
}

DesignerPanel::DesignerPanel(MovementBox* movement, QWidget* parent)
    : QWidget(parent)
    , movement_(movement)
    , status_(new QLabel(this)) {
    status_->setObjectName(QStringLiteral("designerStatus"));
    status_->setWordWrap(true);
    if (movement_ != nullptr) {
        connect(movement_, &MovementBox::edited, this, &DesignerPanel::recompute);
    }
}

void DesignerPanel::setDecimalComma(bool decimalComma) {
    for (QuantityField* field : findChildren<QuantityField*>()) {
        field->setDecimalComma(decimalComma);
    }
}

QString DesignerPanel::problem() const {
    return status_->text().startsWith(QStringLiteral("✖")) ? status_->text() : QString();
}

QuantityField* DesignerPanel::addField(QFormLayout* form, const QString& name, const QString& label,
                                       Unit unit, const QString& text) {
    auto* field = new QuantityField(name, unit, text, this);
    form->addRow(label, field);
    connect(field, &QuantityField::edited, this, &DesignerPanel::recompute);
    return field;
}

void DesignerPanel::noResult(ResultList* results, QuantityField* blamed, const QString& reason) {
    results->clear();
    if (blamed == nullptr) {
        finish(markedEntriesProblem());
        return;
    }
    blamed->refuse(reason);
    finish(tr("✖ No result: %1").arg(reason));
}

void DesignerPanel::finish(const QString& problem) {
    status_->setText(problem);
    emit recomputed();
}

} // namespace mw::gui
