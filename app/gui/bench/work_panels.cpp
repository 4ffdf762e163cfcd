// Resistor checks, adjustment notes and the session log of the bench.
#include "app/gui/bench/work_panels.h"

#include "app/gui/bench/bench_session.h"
#include "app/gui/session_edits.h"
#include "app/gui/workspace.h"
#include "core/advice/resistor_correction.h"
#include "core/circuits/range_design.h"
#include "core/units/quantity.h"
#include "storage/audit_repository.h"
#include "storage/user_repository.h"

#include <QComboBox>
#include <QDateTime>
#include <QDoubleSpinBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QJsonDocument>
#include <QJsonObject>
#include <QLabel>
#include <QLineEdit>
#include <QListWidget>
#include <QPlainTextEdit>
#include <QPushButton>
#include <QTableWidget>
#include <QVBoxLayout>

#include <chrono>
#include <map>

namespace mw::gui {
namespace {

QString text(const std::string& value) {
    return QString::fromStdString(value);
}

QString ohms(double value) {
    return text(formatEngineering(value, 5, Unit::Ohm));
}

Timestamp now() {
    return std::chrono::floor<std::chrono::seconds>(std::chrono::system_clock::now());
}

QString localTime(Timestamp at) {
    return QDateTime::fromSecsSinceEpoch(at.time_since_epoch().count())
        .toLocalTime()
        .toString(QStringLiteral("yyyy-MM-dd HH:mm"));
}

QTableWidget* makeTable(QWidget* parent, const QStringList& headers) {
    auto* t = new QTableWidget(0, int(headers.size()), parent);
    t->setHorizontalHeaderLabels(headers);
    t->verticalHeader()->hide();
    t->setEditTriggers(QAbstractItemView::NoEditTriggers);
    t->setSelectionBehavior(QAbstractItemView::SelectRows);
    t->setSelectionMode(QAbstractItemView::SingleSelection);
    t->horizontalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);
    t->horizontalHeader()->setStretchLastSection(true);
    return t;
}

} // namespace

ResistorPanel::ResistorPanel(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("resistorPanel"));
    auto* layout = new QVBoxLayout(this);
    auto* form = new QFormLayout;
    range_ = new QComboBox(this);
    designed_ = new QLabel(this);
    designed_->setObjectName(QStringLiteral("designedResistor"));
    designed_->setWordWrap(true);
    measured_ = new QLineEdit(this);
    measured_->setObjectName(QStringLiteral("measuredResistor"));
    measured_->setPlaceholderText(tr("e.g. 9k93 or 9.93 kΩ"));
    tolerance_ = new QDoubleSpinBox(this);
    tolerance_->setRange(0.01, 20.0);
    tolerance_->setDecimals(2);
    tolerance_->setValue(1.0);
    tolerance_->setSuffix(QStringLiteral(" %"));
    record_ = new QPushButton(tr("Record check"), this);
    form->addRow(tr("Range:"), range_);
    form->addRow(tr("Designed by the engine:"), designed_);
    form->addRow(tr("Measured:"), measured_);
    form->addRow(tr("Resistor tolerance:"), tolerance_);
    layout->addLayout(form);
    layout->addWidget(record_, 0, Qt::AlignRight);
    checks_ = makeTable(this, {tr("Range"), tr("Component"), tr("Designed"), tr("Measured"),
                               tr("Deviation"), tr("Verdict")});
    layout->addWidget(checks_, 1);
    remove_ = new QPushButton(tr("Remove check"), this);
    layout->addWidget(remove_, 0, Qt::AlignRight);
    connect(range_, &QComboBox::currentIndexChanged, this, &ResistorPanel::showDesign);
    connect(record_, &QPushButton::clicked, this, [this] {
        QString message;
        if (recordMeasured(measured_->text(), &message)) {
            measured_->clear();
        }
        emit statusMessage(message);
    });
    connect(measured_, &QLineEdit::returnPressed, record_, &QPushButton::click);
    connect(remove_, &QPushButton::clicked, this, [this] {
        const int row = checks_->currentRow();
        if (bench_ == nullptr || row < 0) {
            return;
        }
        try {
            workspace_.edits().removeResistorCheck(
                bench_->id(), checks_->item(row, 0)->data(Qt::UserRole).toLongLong());
        } catch (const std::exception& error) {
            emit statusMessage(QString::fromUtf8(error.what()));
        }
    });
}

void ResistorPanel::showSession(const BenchSession& bench) {
    bench_ = &bench;
    const QVariant current = range_->currentData();
    QSignalBlocker block(range_);
    range_->clear();
    for (const RangeSpec* range : bench.plannedRanges()) {
        range_->addItem(text(range->label), qint64(range->id));
    }
    const int index = range_->findData(current);
    range_->setCurrentIndex(index >= 0 ? index : 0);
    showDesign();
    checks_->setRowCount(0);
    for (const ResistorCheck& check : bench.session().resistor_checks) {
        const RangeSpec* range = bench.range(check.range_id);
        const ResistorDeviation deviation =
            compareResistor(check.computed_ohms, check.measured_ohms, check.tolerance_percent);
        const int row = checks_->rowCount();
        checks_->insertRow(row);
        const QStringList cells = {
            range ? text(range->label) : QString(),
            text(check.component),
            ohms(check.computed_ohms),
            ohms(check.measured_ohms),
            QStringLiteral("%1 %").arg(deviation.deviationPercent, 0, 'f', 3),
            deviation.withinTolerance ? tr("✔ within ±%1 %").arg(check.tolerance_percent)
                                      : tr("✖ outside ±%1 %").arg(check.tolerance_percent),
        };
        for (int column = 0; column < cells.size(); ++column) {
            auto* item = new QTableWidgetItem(cells[column]);
            item->setData(Qt::UserRole, qint64(check.id));
            checks_->setItem(row, column, item);
        }
    }
    const bool editable = bench.editable();
    for (QWidget* w : std::initializer_list<QWidget*>{measured_, tolerance_, record_, remove_}) {
        w->setEnabled(editable);
    }
}

void ResistorPanel::showDesign() {
    if (bench_ == nullptr || range_->currentIndex() < 0) {
        designed_->setText(tr("No range"));
        return;
    }
    const RangeSpec* range = bench_->range(range_->currentData().toLongLong());
    try {
        const auto design = designedResistor(bench_->instrument(), *range);
        designed_->setText(design ? tr("%1 (%2)").arg(ohms(design->ohms), text(design->basis))
                                  : tr("none: the range uses the bare movement"));
        record_->setEnabled(design.has_value() && bench_->editable());
    } catch (const std::exception& error) {
        designed_->setText(tr("cannot be designed: %1").arg(QString::fromUtf8(error.what())));
        record_->setEnabled(false);
    }
}

bool ResistorPanel::recordMeasured(const QString& typed, QString* message) {
    if (bench_ == nullptr || range_->currentIndex() < 0) {
        *message = tr("No range to check.");
        return false;
    }
    const RangeSpec* range = bench_->range(range_->currentData().toLongLong());
    try {
        const auto design = designedResistor(bench_->instrument(), *range);
        if (!design) {
            *message = tr("The %1 range uses the bare movement: there is no resistor to check.")
                           .arg(text(range->label));
            return false;
        }
        const double measured = parseValue(typed.trimmed().toStdString(), Unit::Ohm);
        if (!(measured > 0.0)) {
            *message = tr("A measured resistance is above zero.");
            return false;
        }
        ResistorCheck check;
        check.range_id = range->id;
        check.component = range->label + (design->isShunt ? " shunt" : " multiplier");
        check.computed_ohms = design->ohms;
        check.measured_ohms = measured;
        check.tolerance_percent = tolerance_->value();
        workspace_.edits().addResistorCheck(bench_->id(), check);
        const ResistorDeviation deviation =
            compareResistor(check.computed_ohms, measured, check.tolerance_percent);
        *message =
            tr("%1: %2 against %3 designed, %4 %: %5")
                .arg(text(check.component), ohms(measured), ohms(design->ohms))
                .arg(deviation.deviationPercent, 0, 'f', 3)
                .arg(deviation.withinTolerance ? tr("within tolerance") : tr("outside tolerance"));
        return true;
    } catch (const std::exception& error) {
        *message = tr("Not recorded: %1").arg(QString::fromUtf8(error.what()));
        return false;
    }
}

NotesPanel::NotesPanel(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("notesPanel"));
    auto* layout = new QVBoxLayout(this);
    layout->addWidget(
        new QLabel(tr("What was adjusted between as-found and as-left, and why:"), this));
    notes_ = new QListWidget(this);
    notes_->setWordWrap(true);
    layout->addWidget(notes_, 1);
    text_ = new QPlainTextEdit(this);
    text_->setObjectName(QStringLiteral("noteText"));
    text_->setPlaceholderText(tr("e.g. Span reset with the magnetic shunt; zero reset."));
    text_->setMaximumHeight(90);
    layout->addWidget(text_);
    auto* buttons = new QHBoxLayout;
    remove_ = new QPushButton(tr("Remove note"), this);
    add_ = new QPushButton(tr("Add note"), this);
    buttons->addWidget(remove_);
    buttons->addStretch();
    buttons->addWidget(add_);
    layout->addLayout(buttons);
    connect(add_, &QPushButton::clicked, this, [this] {
        QString message;
        if (addNote(text_->toPlainText(), &message)) {
            text_->clear();
        }
        emit statusMessage(message);
    });
    connect(remove_, &QPushButton::clicked, this, [this] {
        QListWidgetItem* item = notes_->currentItem();
        if (item == nullptr) {
            return;
        }
        try {
            workspace_.edits().removeNote(sessionId_, item->data(Qt::UserRole).toLongLong());
        } catch (const std::exception& error) {
            emit statusMessage(QString::fromUtf8(error.what()));
        }
    });
}

void NotesPanel::showSession(const BenchSession& bench) {
    sessionId_ = bench.id();
    notes_->clear();
    for (const AdjustmentNote& note : bench.session().adjustments) {
        auto* item = new QListWidgetItem(
            QStringLiteral("%1 — %2").arg(localTime(note.at), text(note.text)), notes_);
        item->setData(Qt::UserRole, qint64(note.id));
    }
    const bool editable = bench.editable();
    text_->setEnabled(editable);
    add_->setEnabled(editable);
    remove_->setEnabled(editable);
}

bool NotesPanel::addNote(const QString& typed, QString* message) {
    try {
        workspace_.edits().addNote(sessionId_,
                                   AdjustmentNote{0, now(), typed.trimmed().toStdString()});
        *message = tr("Note added.");
        return true;
    } catch (const std::exception& error) {
        *message = tr("Note not added: %1").arg(QString::fromUtf8(error.what()));
        return false;
    }
}

SessionLogPanel::SessionLogPanel(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("sessionLog"));
    auto* layout = new QVBoxLayout(this);
    table_ = makeTable(this, {tr("When (UTC)"), tr("Who"), tr("What")});
    layout->addWidget(table_);
}

void SessionLogPanel::showSession(std::int64_t sessionId) {
    table_->setRowCount(0);
    if (!workspace_.isOpen()) {
        return;
    }
    std::map<std::int64_t, QString> people;
    for (const User& user : storage::UserRepository(*workspace_.workbook()).all()) {
        people[user.id] = text(user.login);
    }
    const auto entries =
        storage::AuditRepository(*workspace_.workbook()).entriesOfSession(sessionId);
    for (auto it = entries.rbegin(); it != entries.rend(); ++it) {
        const storage::AuditEntry& entry = *it;
        const QJsonObject values =
            QJsonDocument::fromJson(
                (entry.newValues.isEmpty() ? entry.oldValues : entry.newValues).toUtf8())
                .object();
        QString what = tr("%1 %2").arg(entry.action, entry.table);
        if (entry.table == QLatin1String("readings")) {
            what = tr("reading %1: point %2 %3 %4")
                       .arg(entry.action == QLatin1String("insert")   ? tr("added")
                            : entry.action == QLatin1String("update") ? tr("changed")
                                                                      : tr("removed"))
                       .arg(values.value(QStringLiteral("point_index")).toInt() + 1)
                       .arg(values.value(QStringLiteral("direction")).toString(),
                            values.value(QStringLiteral("phase")).toString());
        } else if (entry.table == QLatin1String("calibration_sessions") &&
                   entry.action == QLatin1String("update")) {
            const QString before = QJsonDocument::fromJson(entry.oldValues.toUtf8())
                                       .object()
                                       .value(QStringLiteral("state"))
                                       .toString();
            const QString after = values.value(QStringLiteral("state")).toString();
            what = before != after ? tr("state %1 → %2").arg(before, after) : tr("set-up changed");
        }
        const int row = table_->rowCount();
        table_->insertRow(row);
        table_->setItem(
            row, 0,
            new QTableWidgetItem(entry.at.left(19).replace(QLatin1Char('T'), QLatin1Char(' '))));
        table_->setItem(row, 1,
                        new QTableWidgetItem(entry.user_id ? people[*entry.user_id]
                                                           : tr("(outside the program)")));
        table_->setItem(row, 2, new QTableWidgetItem(what));
    }
}

} // namespace mw::gui
