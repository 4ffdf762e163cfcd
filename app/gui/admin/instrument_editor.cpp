// The instrument editor.
#include "app/gui/admin/instrument_editor.h"

#include "app/gui/admin/range_table.h"
#include "app/gui/workspace.h"
#include "core/accuracy/accuracy_class.h"
#include "core/model/instrument_check.h"
#include "core/units/quantity.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"

#include <QComboBox>
#include <QDialogButtonBox>
#include <QFormLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QPushButton>
#include <QSpinBox>
#include <QVBoxLayout>

namespace mw::gui {
namespace {

QString text(std::string_view value) {
    return QString::fromUtf8(value.data(), static_cast<qsizetype>(value.size()));
}

const char* const kFrozenReason = QT_TRANSLATE_NOOP(
    "mw::gui::InstrumentEditor",
    "An approved calibration record rests on this value, so it cannot change here. A meter whose "
    "specification changed is registered as a new instrument; a record that was wrong is "
    "amended.");

} // namespace

InstrumentEditor::InstrumentEditor(Workspace& workspace, std::optional<Instrument> instrument,
                                   QWidget* parent)
    : QDialog(parent)
    , workspace_(workspace)
    , original_(std::move(instrument)) {
    setObjectName(QStringLiteral("instrumentEditor"));
    setWindowTitle(original_ ? tr("Instrument %1").arg(text(original_->asset_tag))
                             : tr("New instrument"));
    build();
    if (original_) {
        fill(*original_);
        frozen_ =
            storage::SessionRepository(*workspace_.workbook()).hasApprovedRecords(original_->id);
        freeze();
    } else {
        ranges_->addRange(Unit::Volt);
    }
    check();
}

QLineEdit* InstrumentEditor::addLine() {
    auto* line = new QLineEdit(this);
    connect(line, &QLineEdit::textChanged, this, &InstrumentEditor::check);
    return line;
}

void InstrumentEditor::build() {
    resize(980, 720);
    auto* layout = new QVBoxLayout(this);
    frozenNote_ = new QLabel(this);
    frozenNote_->setObjectName(QStringLiteral("frozenNote"));
    frozenNote_->setWordWrap(true);
    frozenNote_->hide();
    layout->addWidget(frozenNote_);
    auto* columns = new QHBoxLayout;
    auto* identity = new QFormLayout;
    auto* meter = new QFormLayout;
    // A field with its reason line beneath it.
    auto row = [this](QFormLayout* form, const char* name, const QString& label, QWidget* field) {
        auto* box = new QWidget(this);
        auto* stack = new QVBoxLayout(box);
        stack->setContentsMargins(0, 0, 0, 0);
        stack->setSpacing(1);
        stack->addWidget(field);
        auto* reason = new QLabel(box);
        reason->setObjectName(QStringLiteral("reason_") + QLatin1String(name));
        reason->setWordWrap(true);
        reason->hide();
        stack->addWidget(reason);
        reasons_[name] = reason;
        fields_[name] = field;
        field->setObjectName(QLatin1String(name));
        form->addRow(label, box);
    };
    row(identity, "asset_tag", tr("Asset tag:"), addLine());
    row(identity, "description", tr("Description:"), addLine());
    row(identity, "manufacturer", tr("Maker:"), addLine());
    row(identity, "model", tr("Model:"), addLine());
    row(identity, "serial", tr("Serial number:"), addLine());
    row(identity, "location", tr("Location:"), addLine());
    row(identity, "owner", tr("Owner:"), addLine());
    status_ = new QComboBox(this);
    for (InstrumentStatus s :
         {InstrumentStatus::InService, InstrumentStatus::OutOfService, InstrumentStatus::Retired}) {
        status_->addItem(text(displayName(s)), int(s));
    }
    row(identity, "status", tr("Status:"), status_);

    kind_ = new QComboBox(this);
    for (InstrumentKind k : {InstrumentKind::DcVoltmeter, InstrumentKind::DcAmmeter,
                             InstrumentKind::HalfWaveAcVoltmeter, InstrumentKind::BridgeAcVoltmeter,
                             InstrumentKind::MultiRange}) {
        kind_->addItem(text(displayName(k)), int(k));
    }
    row(meter, "kind", tr("Kind:"), kind_);
    row(meter, "movement_amps_fs", tr("Movement I_fs:"), addLine());
    row(meter, "movement_ohms", tr("Movement R_m:"), addLine());
    scale_ = new QComboBox(this);
    for (ScaleType t :
         {ScaleType::ZeroAtEnd, ScaleType::ZeroInside, ScaleType::NoZero, ScaleType::NonLinear}) {
        scale_->addItem(text(displayName(t)), int(t));
    }
    row(meter, "scale_type", tr("Scale:"), scale_);
    divisions_ = new QSpinBox(this);
    divisions_->setRange(0, 10000);
    divisions_->setSpecialValueText(tr("not recorded"));
    row(meter, "scale_divisions", tr("Scale divisions:"), divisions_);
    class_ = new QComboBox(this);
    class_->setEditable(true); // typed as on the dial; anything outside the series is refused
    for (const double index : classIndexSeries()) {
        class_->addItem(QString::number(index));
    }
    row(meter, "accuracy_class", tr("Accuracy class:"), class_);
    interval_ = new QSpinBox(this);
    interval_->setRange(0, 3650);
    interval_->setValue(365);
    interval_->setSuffix(tr(" days"));
    row(meter, "interval_days", tr("Calibration interval:"), interval_);
    auto* left = new QGroupBox(tr("Identity"), this);
    left->setLayout(identity);
    auto* right = new QGroupBox(tr("Movement, scale and class"), this);
    right->setLayout(meter);
    columns->addWidget(left);
    columns->addWidget(right);
    layout->addLayout(columns);

    auto* rangesBox = new QGroupBox(tr("Ranges (values as on the bench: 15, 500 mV, 9k9)"), this);
    auto* rangesLayout = new QVBoxLayout(rangesBox);
    ranges_ = new RangeTable(this);
    ranges_->setDecimalComma(workspace_.lab().decimal_comma);
    rangesLayout->addWidget(ranges_);
    auto* rangeButtons = new QHBoxLayout;
    auto* addVolts = new QPushButton(tr("Add a voltage range"), this);
    auto* addAmps = new QPushButton(tr("Add a current range"), this);
    auto* remove = new QPushButton(tr("Remove the range"), this);
    rangeButtons->addWidget(addVolts);
    rangeButtons->addWidget(addAmps);
    rangeButtons->addWidget(remove);
    rangeButtons->addStretch();
    rangesLayout->addLayout(rangeButtons);
    reasons_["ranges"] = new QLabel(rangesBox);
    reasons_["ranges"]->setObjectName(QStringLiteral("reason_ranges"));
    reasons_["ranges"]->setWordWrap(true);
    rangesLayout->addWidget(reasons_["ranges"]);
    layout->addWidget(rangesBox, 1);

    message_ = new QLabel(this);
    message_->setObjectName(QStringLiteral("editorMessage"));
    message_->setWordWrap(true);
    layout->addWidget(message_);
    auto* buttons = new QDialogButtonBox(QDialogButtonBox::Cancel, this);
    save_ = buttons->addButton(tr("&Save"), QDialogButtonBox::AcceptRole);
    layout->addWidget(buttons);
    connect(buttons, &QDialogButtonBox::accepted, this, [this] {
        if (save()) {
            accept();
        }
    });
    connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
    connect(addVolts, &QPushButton::clicked, this, [this] { ranges_->addRange(Unit::Volt); });
    connect(addAmps, &QPushButton::clicked, this, [this] { ranges_->addRange(Unit::Ampere); });
    connect(remove, &QPushButton::clicked, ranges_, &RangeTable::removeCurrentRange);
    connect(ranges_, &RangeTable::edited, this, &InstrumentEditor::check);
    for (QComboBox* combo : {kind_, status_, scale_}) {
        connect(combo, &QComboBox::currentIndexChanged, this, &InstrumentEditor::check);
    }
    connect(class_, &QComboBox::currentTextChanged, this, &InstrumentEditor::check);
    for (QSpinBox* spin : {divisions_, interval_}) {
        connect(spin, &QSpinBox::valueChanged, this, &InstrumentEditor::check);
    }
}

void InstrumentEditor::fill(const Instrument& instrument) {
    const auto set = [this](const char* name, const std::string& value) {
        static_cast<QLineEdit*>(fields_.at(name))->setText(QString::fromStdString(value));
    };
    set("asset_tag", instrument.asset_tag);
    set("description", instrument.description);
    set("manufacturer", instrument.manufacturer);
    set("model", instrument.model);
    set("serial", instrument.serial);
    set("location", instrument.location);
    set("owner", instrument.owner);
    set("movement_amps_fs", formatEngineering(instrument.movement.amps_fs, 6, Unit::Ampere));
    set("movement_ohms", formatEngineering(instrument.movement.ohms_coil, 6, Unit::Ohm));
    status_->setCurrentIndex(status_->findData(int(instrument.status)));
    kind_->setCurrentIndex(kind_->findData(int(instrument.kind)));
    scale_->setCurrentIndex(scale_->findData(int(instrument.scale_type)));
    divisions_->setValue(instrument.scale_divisions);
    class_->setCurrentText(QString::number(instrument.accuracy_class));
    interval_->setValue(instrument.interval_days);
    ranges_->setRanges(instrument.ranges);
}

Instrument
InstrumentEditor::typed(std::vector<std::pair<std::string, QString>>* parseProblems) const {
    Instrument instrument = original_.value_or(Instrument{});
    const auto get = [this](const char* name) {
        return static_cast<QLineEdit*>(fields_.at(name))->text().trimmed();
    };
    instrument.asset_tag = get("asset_tag").toStdString();
    instrument.description = get("description").toStdString();
    instrument.manufacturer = get("manufacturer").toStdString();
    instrument.model = get("model").toStdString();
    instrument.serial = get("serial").toStdString();
    instrument.location = get("location").toStdString();
    instrument.owner = get("owner").toStdString();
    instrument.status = InstrumentStatus(status_->currentData().toInt());
    instrument.kind = InstrumentKind(kind_->currentData().toInt());
    instrument.scale_type = ScaleType(scale_->currentData().toInt());
    instrument.scale_divisions = divisions_->value();
    instrument.interval_days = interval_->value();
    ParseOptions options;
    options.decimalComma = workspace_.lab().decimal_comma;
    const auto quantity = [&](const char* name, Unit unit) {
        try {
            return parseValue(get(name).toStdString(), unit, options);
        } catch (const QuantityError& error) {
            parseProblems->push_back({name, QString::fromUtf8(error.what())});
            return 0.0;
        }
    };
    instrument.movement.amps_fs = quantity("movement_amps_fs", Unit::Ampere);
    instrument.movement.ohms_coil = quantity("movement_ohms", Unit::Ohm);
    bool classOk = false;
    QString classText = class_->currentText().trimmed();
    if (options.decimalComma) {
        classText.replace(QLatin1Char(','), QLatin1Char('.'));
    }
    instrument.accuracy_class = classText.toDouble(&classOk);
    if (!classOk) {
        parseProblems->push_back(
            {"accuracy_class",
             tr("\"%1\" is not a class index (a number such as 1.5)").arg(class_->currentText())});
    }
    return instrument;
}

void InstrumentEditor::check() {
    std::vector<std::pair<std::string, QString>> parseProblems;
    Instrument instrument = typed(&parseProblems);
    std::vector<std::pair<QPoint, QString>> cellProblems;
    instrument.ranges = ranges_->ranges(&cellProblems);
    std::map<std::string, QStringList> byField;
    for (const auto& [field, reason] : parseProblems) {
        byField[field] << reason;
    }
    const bool parsed = parseProblems.empty() && cellProblems.empty();
    QStringList rangeLines;
    for (const auto& [cell, reason] : cellProblems) {
        rangeLines << tr("Range %1: %2").arg(cell.y() + 1).arg(reason);
    }
    for (const InstrumentProblem& problem : checkInstrument(instrument)) {
        const QString reason = QString::fromStdString(problem.message);
        if (problem.rangeIndex >= 0) {
            const int column = problem.field == "label"            ? RangeTable::Label
                               : problem.field == "nominal_ohms"   ? RangeTable::Resistor
                               : problem.field == "fiducial_value" ? RangeTable::Fiducial
                               : problem.field == "signal"         ? RangeTable::Label
                               : problem.field == "unit"           ? RangeTable::Label
                                                                   : RangeTable::FullScale;
            cellProblems.push_back({QPoint(column, problem.rangeIndex), reason});
            rangeLines << tr("Range %1: %2").arg(problem.rangeIndex + 1).arg(reason);
        } else if (byField.count(problem.field) == 0) { // a parse error already explains it
            byField[problem.field] << reason;
        }
    }
    for (auto& [field, label] : reasons_) {
        if (field == "ranges") {
            QStringList lines = rangeLines + byField["ranges"];
            label->setText(lines.isEmpty() ? QString() : tr("✖ ") + lines.join(tr("\n✖ ")));
            continue;
        }
        const QStringList& reasons = byField[field];
        label->setText(reasons.isEmpty() ? QString()
                                         : tr("✖ %1").arg(reasons.join(QStringLiteral("; "))));
        label->setVisible(!reasons.isEmpty());
    }
    ranges_->showCheck(instrument, cellProblems);
    const bool good = parsed && problems().isEmpty();
    save_->setEnabled(good);
    message_->setText(good ? tr("✔ The instrument holds together.") : QString());
}

QStringList InstrumentEditor::problems() const {
    QStringList all;
    for (const auto& [field, label] : reasons_) {
        if (!label->text().isEmpty()) {
            all << QString::fromStdString(field) + QStringLiteral(": ") + label->text();
        }
    }
    return all;
}

QString InstrumentEditor::message() const {
    return message_->text();
}

void InstrumentEditor::freeze() {
    const QString reason = tr(kFrozenReason);
    for (const char* name : {"asset_tag", "serial", "movement_amps_fs", "movement_ohms", "kind",
                             "scale_type", "scale_divisions", "accuracy_class"}) {
        QWidget* field = fields_.at(name);
        field->setEnabled(!frozen_);
        field->setToolTip(frozen_ ? reason : QString());
    }
    ranges_->freezeSavedRows(frozen_, reason);
    frozenNote_->setVisible(frozen_);
    frozenNote_->setText(tr("🔒 Approved calibration records refer to this meter: its tag, serial, "
                            "kind, movement, scale, class and its ranges' limits are shown "
                            "read-only. %1")
                             .arg(reason));
}

bool InstrumentEditor::save() {
    check();
    std::vector<std::pair<std::string, QString>> parseProblems;
    Instrument instrument = typed(&parseProblems);
    std::vector<std::pair<QPoint, QString>> cellProblems;
    instrument.ranges = ranges_->ranges(&cellProblems);
    if (!parseProblems.empty() || !cellProblems.empty() || !problems().isEmpty()) {
        message_->setText(tr("✖ Not saved: correct the values marked ✖ first."));
        return false;
    }
    if (!workspace_.can(Capability::Administer)) {
        message_->setText(tr("✖ Not saved: only an administrator edits the register."));
        return false;
    }
    try {
        storage::InstrumentRepository repository(*workspace_.workbook());
        if (original_) {
            repository.update(instrument);
        } else {
            repository.add(instrument);
        }
        savedId_ = instrument.id;
        original_ = instrument;
        message_->setText(tr("✔ Saved."));
        return true;
    } catch (const std::exception& error) {
        message_->setText(tr("✖ Not saved: %1").arg(QString::fromUtf8(error.what())));
        return false;
    }
}

} // namespace mw::gui
