// The set-up of a calibration.
#include "app/gui/bench/session_setup_dialog.h"

#include "core/uncertainty/distributions.h"
#include "storage/sql_support.h"

#include <QComboBox>
#include <QDialogButtonBox>
#include <QDoubleSpinBox>
#include <QFormLayout>
#include <QGroupBox>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QListWidget>
#include <QPlainTextEdit>
#include <QPushButton>
#include <QSpinBox>
#include <QVBoxLayout>

#include <algorithm>

namespace mw::gui {
namespace {

QString text(std::string_view value) {
    return QString::fromUtf8(value.data(), qsizetype(value.size()));
}

constexpr int kOverdueRole = Qt::UserRole + 1;

} // namespace

SessionSetupDialog::SessionSetupDialog(const Instrument& instrument,
                                       const std::vector<ReferenceStandard>& standards,
                                       const std::optional<CalibrationSession>& current,
                                       std::chrono::sys_days today, QWidget* parent)
    : QDialog(parent)
    , instrument_(instrument) {
    setObjectName(QStringLiteral("sessionSetup"));
    setWindowTitle(current ? tr("Set-up of the calibration of %1").arg(text(instrument.asset_tag))
                           : tr("Start a calibration of %1").arg(text(instrument.asset_tag)));
    auto* layout = new QVBoxLayout(this);
    auto* columns = new QHBoxLayout;
    layout->addLayout(columns);

    auto* what = new QGroupBox(tr("What is calibrated"), this);
    auto* whatForm = new QFormLayout(what);
    ranges_ = new QListWidget(what);
    ranges_->setObjectName(QStringLiteral("setupRanges"));
    std::vector<std::int64_t> planned;
    if (current) {
        for (const TestPoint& point : current->plan) {
            planned.push_back(point.range_id);
        }
        for (const Reading& reading : current->readings) {
            lockedRanges_.push_back(reading.range_id);
            planned.push_back(reading.range_id);
        }
    }
    for (const RangeSpec& range : instrument.ranges) {
        auto* item = new QListWidgetItem(
            tr("%1 (%2)").arg(text(range.label), range.signal ? text(displayName(*range.signal))
                                                              : tr("signal type not recorded")),
            ranges_);
        item->setData(Qt::UserRole, qint64(range.id));
        const bool chosen =
            current ? std::count(planned.begin(), planned.end(), range.id) > 0 : true;
        item->setCheckState(chosen ? Qt::Checked : Qt::Unchecked);
        if (std::count(lockedRanges_.begin(), lockedRanges_.end(), range.id) > 0) {
            item->setFlags(item->flags() & ~Qt::ItemIsUserCheckable);
            item->setToolTip(tr("This range has readings: remove them first to drop it."));
        }
    }
    whatForm->addRow(tr("Ranges:"), ranges_);
    phases_ = new QComboBox(what);
    for (PhasePlan plan : {PhasePlan::AsFound, PhasePlan::AsFoundAndAsLeft, PhasePlan::AsLeft}) {
        phases_->addItem(text(displayName(plan)), int(plan));
    }
    phases_->setCurrentIndex(
        phases_->findData(int(current ? current->phases : PhasePlan::AsFound)));
    whatForm->addRow(tr("Phases:"), phases_);
    repeats_ = new QSpinBox(what);
    repeats_->setRange(1, 5);
    repeats_->setToolTip(tr("How many times each point is taken in each direction (for ranges "
                            "added now)."));
    whatForm->addRow(tr("Repeats per point:"), repeats_);
    columns->addWidget(what);

    auto* right = new QVBoxLayout;
    right->addWidget(buildStandards(standards, current, today));
    right->addWidget(buildJudgement(current));
    columns->addLayout(right);

    method_ = new QPlainTextEdit(this);
    method_->setObjectName(QStringLiteral("setupMethod"));
    method_->setPlaceholderText(tr("How the values are applied and read, e.g. \"Calibrator "
                                   "CFS-01 in series, pointer set on each numbered mark.\""));
    method_->setMaximumHeight(70);
    if (current) {
        method_->setPlainText(QString::fromStdString(current->method));
    }
    layout->addWidget(new QLabel(tr("Method:"), this));
    layout->addWidget(method_);
    problem_ = new QLabel(this);
    problem_->setObjectName(QStringLiteral("setupProblem"));
    problem_->setWordWrap(true);
    layout->addWidget(problem_);
    auto* buttons = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel, this);
    buttons->button(QDialogButtonBox::Ok)->setText(current ? tr("Save set-up") : tr("Start"));
    layout->addWidget(buttons);
    connect(buttons, &QDialogButtonBox::accepted, this, &SessionSetupDialog::accept);
    connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
    connect(standards_, &QListWidget::itemChanged, this, &SessionSetupDialog::updateState);
    connect(ranges_, &QListWidget::itemChanged, this, &SessionSetupDialog::updateState);
    connect(rule_, &QComboBox::currentIndexChanged, this, &SessionSetupDialog::updateState);
    updateState();
}

QWidget* SessionSetupDialog::buildStandards(const std::vector<ReferenceStandard>& standards,
                                            const std::optional<CalibrationSession>& current,
                                            std::chrono::sys_days today) {
    auto* box = new QGroupBox(tr("Reference standards"), this);
    auto* layout = new QVBoxLayout(box);
    standards_ = new QListWidget(box);
    standards_->setObjectName(QStringLiteral("setupStandards"));
    QString justification;
    for (const ReferenceStandard& standard : standards) {
        const bool overdue = standard.due_date < today;
        const QString due = storage::sql::toIsoDate(standard.due_date);
        auto* item = new QListWidgetItem(
            overdue ? tr("⚠ %1 — %2 — OVERDUE since %3: needs a justification")
                          .arg(text(standard.asset_tag), text(standard.description), due)
                    : tr("%1 — %2 — due %3")
                          .arg(text(standard.asset_tag), text(standard.description), due),
            standards_);
        item->setData(Qt::UserRole, qint64(standard.id));
        item->setData(kOverdueRole, overdue);
        bool used = false;
        if (current) {
            for (const StandardUse& use : current->standards) {
                if (use.standard_id == standard.id) {
                    used = true;
                    if (!use.overdue_justification.empty()) {
                        justification = QString::fromStdString(use.overdue_justification);
                    }
                }
            }
        }
        item->setCheckState(used ? Qt::Checked : Qt::Unchecked);
    }
    layout->addWidget(standards_);
    justification_ = new QLineEdit(justification, box);
    justification_->setObjectName(QStringLiteral("setupJustification"));
    justification_->setPlaceholderText(
        tr("Why an overdue standard may still be used (e.g. intermediate check passed on …)"));
    layout->addWidget(justification_);
    return box;
}

QWidget* SessionSetupDialog::buildJudgement(const std::optional<CalibrationSession>& current) {
    auto* box = new QGroupBox(tr("Conditions and judgement"), this);
    auto* form = new QFormLayout(box);
    const Environment environment = current ? current->environment : Environment{};
    ambient_ = new QDoubleSpinBox(box);
    ambient_->setRange(-40.0, 85.0);
    ambient_->setDecimals(1);
    ambient_->setSuffix(QStringLiteral(" °C"));
    ambient_->setValue(environment.ambient_celsius);
    humidity_ = new QDoubleSpinBox(box);
    humidity_->setRange(0.0, 100.0);
    humidity_->setDecimals(0);
    humidity_->setSuffix(QStringLiteral(" % RH"));
    humidity_->setValue(environment.relative_humidity_percent);
    form->addRow(tr("Room temperature:"), ambient_);
    form->addRow(tr("Humidity:"), humidity_);
    rule_ = new QComboBox(box);
    rule_->setObjectName(QStringLiteral("setupRule"));
    for (DecisionRule rule : {DecisionRule::SimpleAcceptance, DecisionRule::GuardedBinary,
                              DecisionRule::GuardedAcceptance}) {
        rule_->addItem(text(displayName(rule)), int(rule));
    }
    rule_->setCurrentIndex(
        rule_->findData(int(current ? current->decision_rule : DecisionRule::SimpleAcceptance)));
    form->addRow(tr("Decision rule:"), rule_);
    guard_ = new QDoubleSpinBox(box);
    guard_->setRange(0.0, 3.0);
    guard_->setSingleStep(0.1);
    guard_->setDecimals(2);
    guard_->setPrefix(QStringLiteral("r = "));
    guard_->setValue(current && current->guard_factor > 0.0 ? current->guard_factor : 1.0);
    guard_->setToolTip(tr("Guard band w = r × U (ILAC G8:09/2019)."));
    form->addRow(tr("Guard band:"), guard_);
    const EvaluationSettings settings =
        current ? current->settings.value_or(EvaluationSettings{}) : EvaluationSettings{};
    readability_ = new QDoubleSpinBox(box);
    readability_->setRange(0.05, 1.0);
    readability_->setSingleStep(0.05);
    readability_->setDecimals(2);
    readability_->setValue(settings.readability_fraction);
    readability_->setSuffix(tr(" of a division"));
    form->addRow(tr("Scale read to:"), readability_);
    probability_ = new QComboBox(box);
    probability_->addItem(tr("95.45 % (k = 2 for large ν)"), kProbabilityTwoSigma);
    probability_->addItem(tr("95 %"), 0.95);
    probability_->addItem(tr("99 %"), 0.99);
    const int found = probability_->findData(settings.coverage_probability);
    probability_->setCurrentIndex(found >= 0 ? found : 0);
    form->addRow(tr("Coverage probability:"), probability_);
    return box;
}

void SessionSetupDialog::updateState() {
    const auto rule = DecisionRule(rule_->currentData().toInt());
    guard_->setEnabled(rule != DecisionRule::SimpleAcceptance);
    bool overdueChosen = false;
    for (int row = 0; row < standards_->count(); ++row) {
        const QListWidgetItem* item = standards_->item(row);
        overdueChosen = overdueChosen ||
                        (item->checkState() == Qt::Checked && item->data(kOverdueRole).toBool());
    }
    justification_->setEnabled(overdueChosen);
    problem_->setText(problem().isEmpty() ? QString() : QStringLiteral("⚠ ") + problem());
}

QString SessionSetupDialog::problem() const {
    bool anyRange = false;
    for (int row = 0; row < ranges_->count(); ++row) {
        const QListWidgetItem* item = ranges_->item(row);
        if (item->checkState() != Qt::Checked) {
            continue;
        }
        anyRange = true;
        for (const RangeSpec& range : instrument_.ranges) {
            if (range.id == item->data(Qt::UserRole).toLongLong() && !range.signal) {
                return tr("The signal type of range %1 is not recorded: set it in the register "
                          "first (DC, half-wave or bridge rectifier).")
                    .arg(text(range.label));
            }
        }
    }
    if (!anyRange) {
        return tr("Choose at least one range.");
    }
    for (int row = 0; row < standards_->count(); ++row) {
        const QListWidgetItem* item = standards_->item(row);
        if (item->checkState() == Qt::Checked && item->data(kOverdueRole).toBool() &&
            justification_->text().trimmed().isEmpty()) {
            return tr("An overdue standard is chosen: write why it may still be used, or choose "
                      "another.");
        }
    }
    return {};
}

void SessionSetupDialog::accept() {
    updateState();
    if (problem().isEmpty()) {
        QDialog::accept();
    }
}

SessionSetup SessionSetupDialog::setup() const {
    SessionSetup setup;
    for (int row = 0; row < ranges_->count(); ++row) {
        if (ranges_->item(row)->checkState() == Qt::Checked) {
            setup.ranges.push_back(ranges_->item(row)->data(Qt::UserRole).toLongLong());
        }
    }
    setup.phases = PhasePlan(phases_->currentData().toInt());
    setup.repeats = repeats_->value();
    for (int row = 0; row < standards_->count(); ++row) {
        const QListWidgetItem* item = standards_->item(row);
        if (item->checkState() != Qt::Checked) {
            continue;
        }
        StandardUse use;
        use.standard_id = item->data(Qt::UserRole).toLongLong();
        if (item->data(kOverdueRole).toBool()) {
            use.overdue_justification = justification_->text().trimmed().toStdString();
        }
        setup.standards.push_back(use);
    }
    setup.environment = {ambient_->value(), humidity_->value()};
    setup.rule = DecisionRule(rule_->currentData().toInt());
    setup.guardFactor = setup.rule == DecisionRule::SimpleAcceptance ? 0.0 : guard_->value();
    setup.settings.readability_fraction = readability_->value();
    setup.settings.coverage_probability = probability_->currentData().toDouble();
    setup.method = method_->toPlainText().trimmed().toStdString();
    return setup;
}

} // namespace mw::gui
