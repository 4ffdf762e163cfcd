// The reference-standard editor.
#include "app/gui/admin/standard_editor.h"
#include "app/gui/calendar_days.h"

#include "app/gui/status_icons.h"
#include "app/gui/workspace.h"
#include "core/accuracy/standard_spec_text.h"
#include "core/units/quantity.h"
#include "storage/standard_repository.h"

#include <QApplication>
#include <QCheckBox>
#include <QComboBox>
#include <QDate>
#include <QDateEdit>
#include <QDialogButtonBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLineEdit>
#include <QPushButton>
#include <QTableWidget>
#include <QVBoxLayout>

namespace mw::gui {
namespace {

enum Column { Label, UnitColumn, SignalColumn, FullScale, Specification, ColumnCount };

QComboBox* comboAt(const QTableWidget* table, int row, int column) {
    return qobject_cast<QComboBox*>(table->cellWidget(row, column));
}

QString cellText(const QTableWidget* table, int row, int column) {
    return table->item(row, column) ? table->item(row, column)->text().trimmed() : QString();
}

} // namespace

StandardEditor::StandardEditor(Workspace& workspace, std::optional<ReferenceStandard> standard,
                               Mode mode, QWidget* parent)
    : QDialog(parent)
    , workspace_(workspace)
    , original_(std::move(standard))
    , mode_(mode) {
    setObjectName(QStringLiteral("standardEditor"));
    build();
    if (original_) {
        fill(*original_);
    } else {
        addRange(Unit::Volt);
    }
    if (mode_ == Mode::Recalibrate) {
        setWindowTitle(tr("Recalibration of %1").arg(QString::fromStdString(original_->asset_tag)));
        certificate_->clear();
        calibrated_->setDate(QDate::currentDate());
        due_->setDate(QDate::currentDate().addYears(1));
        tag_->setEnabled(false);
    } else {
        setWindowTitle(
            original_
                ? tr("Reference standard %1").arg(QString::fromStdString(original_->asset_tag))
                : tr("New reference standard"));
    }
    check();
}

void StandardEditor::build() {
    resize(900, 600);
    auto* layout = new QVBoxLayout(this);
    if (mode_ == Mode::Recalibrate) {
        auto* note = new QLabel(tr("Enter the new certificate. The records made with the old one "
                                   "keep its number, due date and specification; only work from "
                                   "now on uses the new values."),
                                this);
        note->setWordWrap(true);
        layout->addWidget(note);
    }
    auto* form = new QFormLayout;
    tag_ = new QLineEdit(this);
    tag_->setObjectName(QStringLiteral("standardTag"));
    description_ = new QLineEdit(this);
    description_->setObjectName(QStringLiteral("standardDescription"));
    certificate_ = new QLineEdit(this);
    certificate_->setObjectName(QStringLiteral("certificateNumber"));
    calibratedKnown_ = new QCheckBox(tr("recorded"), this);
    calibratedKnown_->setChecked(true);
    calibrated_ = new QDateEdit(QDate::currentDate(), this);
    calibrated_->setObjectName(QStringLiteral("calibratedOn"));
    calibrated_->setCalendarPopup(true);
    calibrated_->setDisplayFormat(QStringLiteral("yyyy-MM-dd"));
    due_ = new QDateEdit(QDate::currentDate().addYears(1), this);
    due_->setObjectName(QStringLiteral("dueDate"));
    due_->setCalendarPopup(true);
    due_->setDisplayFormat(QStringLiteral("yyyy-MM-dd"));
    auto* calibratedRow = new QHBoxLayout;
    calibratedRow->addWidget(calibrated_);
    calibratedRow->addWidget(calibratedKnown_);
    calibratedRow->addStretch();
    form->addRow(tr("Asset tag:"), tag_);
    form->addRow(tr("Description:"), description_);
    form->addRow(tr("Certificate number:"), certificate_);
    form->addRow(tr("Calibrated on:"), calibratedRow);
    form->addRow(tr("Due for calibration:"), due_);
    layout->addLayout(form);

    auto* rangesLabel = new QLabel(
        tr("<b>Ranges and their specification</b> — as limits (0.004%rdg+0.0008%rng, "
           "20ppm+5ppm, 0.5mV, or limits with a floor: 0.004%rdg+0.0008%rng+5uV) or as the "
           "certificate states it (U=1mV,k=2, with dof=8 when it gives degrees of freedom)."),
        this);
    rangesLabel->setWordWrap(true);
    layout->addWidget(rangesLabel);
    ranges_ = new QTableWidget(0, ColumnCount, this);
    ranges_->setObjectName(QStringLiteral("standardRanges"));
    ranges_->setHorizontalHeaderLabels(
        {tr("Range"), tr("Unit"), tr("Signal"), tr("Full scale"), tr("Specification")});
    ranges_->horizontalHeader()->setStretchLastSection(true);
    ranges_->verticalHeader()->hide();
    layout->addWidget(ranges_, 1);
    auto* buttons = new QHBoxLayout;
    auto* addVolts = new QPushButton(tr("Add a voltage range"), this);
    auto* addAmps = new QPushButton(tr("Add a current range"), this);
    auto* addOhms = new QPushButton(tr("Add a resistance range"), this);
    auto* remove = new QPushButton(tr("Remove the range"), this);
    for (QPushButton* button : {addVolts, addAmps, addOhms, remove}) {
        buttons->addWidget(button);
    }
    buttons->addStretch();
    layout->addLayout(buttons);
    problems_ = new QLabel(this);
    problems_->setObjectName(QStringLiteral("standardProblems"));
    problems_->setWordWrap(true);
    layout->addWidget(problems_);
    message_ = new QLabel(this);
    message_->setWordWrap(true);
    layout->addWidget(message_);
    auto* box = new QDialogButtonBox(QDialogButtonBox::Cancel, this);
    save_ = box->addButton(tr("&Save"), QDialogButtonBox::AcceptRole);
    layout->addWidget(box);
    connect(box, &QDialogButtonBox::accepted, this, [this] {
        if (save()) {
            accept();
        }
    });
    connect(box, &QDialogButtonBox::rejected, this, &QDialog::reject);
    connect(addVolts, &QPushButton::clicked, this, [this] { addRange(Unit::Volt); });
    connect(addAmps, &QPushButton::clicked, this, [this] { addRange(Unit::Ampere); });
    connect(addOhms, &QPushButton::clicked, this, [this] { addRange(Unit::Ohm); });
    connect(remove, &QPushButton::clicked, this, [this] {
        if (ranges_->currentRow() >= 0) {
            ranges_->removeRow(ranges_->currentRow());
            check();
        }
    });
    connect(ranges_, &QTableWidget::itemChanged, this, &StandardEditor::check);
    for (QLineEdit* line : {tag_, description_, certificate_}) {
        connect(line, &QLineEdit::textChanged, this, &StandardEditor::check);
    }
    for (QDateEdit* date : {calibrated_, due_}) {
        connect(date, &QDateEdit::dateChanged, this, &StandardEditor::check);
    }
    connect(calibratedKnown_, &QCheckBox::toggled, calibrated_, &QWidget::setEnabled);
    connect(calibratedKnown_, &QCheckBox::toggled, this, &StandardEditor::check);
}

void StandardEditor::addRange(Unit unit) {
    QSignalBlocker quiet(ranges_);
    const int row = ranges_->rowCount();
    ranges_->insertRow(row);
    ranges_->setItem(row, Label, new QTableWidgetItem);
    auto* unitBox = new QComboBox(ranges_);
    unitBox->addItem(tr("V"), int(Unit::Volt));
    unitBox->addItem(tr("A"), int(Unit::Ampere));
    unitBox->addItem(tr("Ω"), int(Unit::Ohm));
    unitBox->setCurrentIndex(unitBox->findData(int(unit)));
    ranges_->setCellWidget(row, UnitColumn, unitBox);
    auto* signal = new QComboBox(ranges_);
    signal->addItem(tr("DC"), int(SignalKind::Dc));
    signal->addItem(tr("AC"), int(SignalKind::Ac));
    ranges_->setCellWidget(row, SignalColumn, signal);
    ranges_->setItem(row, FullScale, new QTableWidgetItem);
    ranges_->setItem(row, Specification, new QTableWidgetItem);
    for (QComboBox* combo : {unitBox, signal}) {
        connect(combo, &QComboBox::currentIndexChanged, this, &StandardEditor::check);
    }
    ranges_->setCurrentCell(row, Label);
}

void StandardEditor::fill(const ReferenceStandard& standard) {
    tag_->setText(QString::fromStdString(standard.asset_tag));
    description_->setText(QString::fromStdString(standard.description));
    certificate_->setText(QString::fromStdString(standard.certificate_number));
    calibratedKnown_->setChecked(standard.calibrated_on.has_value());
    if (standard.calibrated_on) {
        calibrated_->setDate(toQDate(*standard.calibrated_on));
    }
    due_->setDate(toQDate(standard.due_date));
    for (const StandardRangeSpec& spec : standard.specs) {
        addRange(spec.unit);
        const int row = ranges_->rowCount() - 1;
        QSignalBlocker quiet(ranges_);
        ranges_->item(row, Label)->setText(QString::fromStdString(spec.label));
        comboAt(ranges_, row, SignalColumn)
            ->setCurrentIndex(comboAt(ranges_, row, SignalColumn)->findData(int(spec.signal)));
        ranges_->item(row, FullScale)
            ->setText(QString::fromStdString(formatEngineering(spec.full_scale, 6, spec.unit)));
        ranges_->item(row, Specification)->setText(QString::fromStdString(specText(spec)));
    }
    ranges_->resizeColumnsToContents();
}

std::optional<ReferenceStandard> StandardEditor::typed(QStringList* problems) const {
    ReferenceStandard standard = original_.value_or(ReferenceStandard{});
    standard.asset_tag = tag_->text().trimmed().toStdString();
    standard.description = description_->text().trimmed().toStdString();
    standard.certificate_number = certificate_->text().trimmed().toStdString();
    standard.calibrated_on = calibratedKnown_->isChecked()
                                 ? std::optional(fromQDate(calibrated_->date()))
                                 : std::nullopt;
    standard.due_date = fromQDate(due_->date());
    if (standard.asset_tag.empty()) {
        *problems << tr("a reference standard needs an asset tag");
    }
    if (standard.certificate_number.empty()) {
        *problems << tr("give the number of the certificate that states its accuracy");
    }
    if (standard.calibrated_on && *standard.calibrated_on > standard.due_date) {
        *problems << tr("the calibration day is after the due date");
    }
    if (mode_ == Mode::Recalibrate && original_ &&
        standard.certificate_number == original_->certificate_number) {
        *problems << tr("a recalibration has a new certificate number");
    }
    ParseOptions options;
    options.decimalComma = workspace_.lab().decimal_comma;
    standard.specs.clear();
    for (int row = 0; row < ranges_->rowCount(); ++row) {
        StandardRangeSpec spec;
        spec.label = cellText(ranges_, row, Label).toStdString();
        spec.unit = Unit(comboAt(ranges_, row, UnitColumn)->currentData().toInt());
        spec.signal = SignalKind(comboAt(ranges_, row, SignalColumn)->currentData().toInt());
        QStringList reasons;
        if (spec.label.empty()) {
            reasons << tr("no range label");
        }
        try {
            spec.full_scale =
                parseValue(cellText(ranges_, row, FullScale).toStdString(), spec.unit, options);
            if (!(spec.full_scale > 0.0)) {
                reasons << tr("the full scale must be above zero");
            }
        } catch (const std::exception& error) {
            reasons << tr("full scale: %1").arg(QString::fromUtf8(error.what()));
        }
        try {
            setSpecFromText(spec, cellText(ranges_, row, Specification).toStdString(), options);
        } catch (const std::exception& error) {
            reasons << tr("specification: %1").arg(QString::fromUtf8(error.what()));
        }
        if (spec.signal == SignalKind::Ac && spec.unit != Unit::Volt) {
            reasons << tr("only voltage ranges are AC here");
        }
        for (const QString& reason : reasons) {
            *problems << tr("range %1: %2").arg(row + 1).arg(reason);
        }
        QTableWidgetItem* mark = ranges_->item(row, Label);
        const QSignalBlocker quiet(ranges_);
        mark->setIcon(reasons.isEmpty() ? QIcon() : warningIcon(QApplication::palette()));
        mark->setToolTip(reasons.join(QLatin1Char('\n')));
        standard.specs.push_back(spec);
    }
    if (standard.specs.empty()) {
        *problems << tr("a reference standard covers at least one range");
    }
    if (!problems->isEmpty()) {
        return std::nullopt;
    }
    return standard;
}

void StandardEditor::check() {
    QStringList problems;
    typed(&problems);
    problems_->setText(problems.isEmpty() ? QString()
                                          : tr("✖ ") + problems.join(QStringLiteral("\n✖ ")));
    save_->setEnabled(problems.isEmpty());
}

QStringList StandardEditor::problems() const {
    QStringList problems;
    typed(&problems);
    return problems;
}

QString StandardEditor::message() const {
    return message_->text();
}

bool StandardEditor::save() {
    QStringList problems;
    const auto standard = typed(&problems);
    if (!standard) {
        check();
        message_->setText(tr("✖ Not saved: correct what is marked first."));
        return false;
    }
    if (!workspace_.can(Capability::Administer)) {
        message_->setText(tr("✖ Not saved: only an administrator edits reference standards."));
        return false;
    }
    try {
        storage::StandardRepository repository(*workspace_.workbook());
        ReferenceStandard saved = *standard;
        if (original_) {
            repository.update(saved);
        } else {
            repository.add(saved);
        }
        savedId_ = saved.id;
        original_ = saved;
        message_->setText(tr("✔ Saved."));
        return true;
    } catch (const std::exception& error) {
        message_->setText(tr("✖ Not saved: %1").arg(QString::fromUtf8(error.what())));
        return false;
    }
}

} // namespace mw::gui
