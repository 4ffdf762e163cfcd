// The standards page.
#include "app/gui/admin/standards_page.h"
#include "app/gui/calendar_days.h"

#include "app/gui/admin/standard_editor.h"
#include "app/gui/status_icons.h"
#include "app/gui/workspace.h"
#include "core/accuracy/standard_spec_text.h"
#include "core/units/quantity.h"
#include "storage/standard_repository.h"

#include <QApplication>
#include <QDate>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QPushButton>
#include <QSplitter>
#include <QTableWidget>
#include <QVBoxLayout>

#include <chrono>

namespace mw::gui {
namespace {

QTableWidget* makeTable(QWidget* parent, const QStringList& headers, const char* name) {
    auto* table = new QTableWidget(0, int(headers.size()), parent);
    table->setObjectName(QLatin1String(name));
    table->setHorizontalHeaderLabels(headers);
    table->setEditTriggers(QAbstractItemView::NoEditTriggers);
    table->setSelectionBehavior(QAbstractItemView::SelectRows);
    table->setSelectionMode(QAbstractItemView::SingleSelection);
    table->verticalHeader()->hide();
    table->horizontalHeader()->setStretchLastSection(true);
    return table;
}

} // namespace

StandardsPage::StandardsPage(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("standardsPage"));
    auto* layout = new QVBoxLayout(this);
    layout->setContentsMargins(0, 0, 0, 0);
    auto* splitter = new QSplitter(Qt::Vertical, this);
    list_ = makeTable(splitter,
                      {tr("Asset tag"), tr("Description"), tr("Certificate"), tr("Calibrated on"),
                       tr("Due"), tr("May it be used today?")},
                      "standardsList");
    auto* lower = new QWidget(splitter);
    auto* lowerLayout = new QVBoxLayout(lower);
    lowerLayout->setContentsMargins(0, 0, 0, 0);
    ranges_ = makeTable(lower, {tr("Range"), tr("Signal"), tr("Full scale"), tr("Specification")},
                        "standardRangesShown");
    lowerLayout->addWidget(ranges_, 1);
    note_ = new QLabel(lower);
    note_->setWordWrap(true);
    lowerLayout->addWidget(note_);
    auto* buttons = new QHBoxLayout;
    add_ = new QPushButton(tr("New standard…"), lower);
    edit_ = new QPushButton(tr("Edit…"), lower);
    recalibrate_ = new QPushButton(tr("Record a recalibration…"), lower);
    buttons->addWidget(add_);
    buttons->addWidget(edit_);
    buttons->addWidget(recalibrate_);
    buttons->addStretch();
    lowerLayout->addLayout(buttons);
    splitter->addWidget(list_);
    splitter->addWidget(lower);
    splitter->setSizes({320, 360});
    layout->addWidget(splitter);
    connect(list_, &QTableWidget::itemSelectionChanged, this, &StandardsPage::showSelected);
    connect(add_, &QPushButton::clicked, this,
            [this] { openEditor(int(StandardEditor::Mode::New)); });
    connect(edit_, &QPushButton::clicked, this,
            [this] { openEditor(int(StandardEditor::Mode::Edit)); });
    connect(recalibrate_, &QPushButton::clicked, this,
            [this] { openEditor(int(StandardEditor::Mode::Recalibrate)); });
    connect(&workspace_, &Workspace::userChanged, this, &StandardsPage::updateActions);
    updateActions();
}

void StandardsPage::reload() {
    const auto previous = selectedStandard();
    QSignalBlocker quiet(list_);
    list_->setRowCount(0);
    if (!workspace_.isOpen()) {
        showSelected();
        return;
    }
    const auto today = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
    const int soon = workspace_.lab().due_window_days;
    int selectRow = 0;
    for (const ReferenceStandard& standard :
         storage::StandardRepository(*workspace_.workbook()).all()) {
        const int row = list_->rowCount();
        list_->insertRow(row);
        auto* tag = new QTableWidgetItem(QString::fromStdString(standard.asset_tag));
        tag->setData(Qt::UserRole, qlonglong(standard.id));
        list_->setItem(row, 0, tag);
        list_->setItem(row, 1, new QTableWidgetItem(QString::fromStdString(standard.description)));
        list_->setItem(row, 2,
                       new QTableWidgetItem(QString::fromStdString(standard.certificate_number)));
        list_->setItem(row, 3,
                       new QTableWidgetItem(standard.calibrated_on
                                                ? isoDate(*standard.calibrated_on)
                                                : tr("not recorded")));
        list_->setItem(row, 4, new QTableWidgetItem(isoDate(standard.due_date)));
        QString usable;
        auto* state = new QTableWidgetItem;
        if (standard.due_date < today) {
            usable = tr("⊘ Not usable: overdue since %1 (only with a written justification)")
                         .arg(isoDate(standard.due_date));
            state->setIcon(warningIcon(QApplication::palette()));
        } else if (standard.due_date <= today + std::chrono::days(soon)) {
            usable = tr("Yes — due within %1 days").arg((standard.due_date - today).count());
        } else {
            usable = tr("Yes");
        }
        state->setText(usable);
        list_->setItem(row, 5, state);
        if (previous && *previous == standard.id) {
            selectRow = row;
        }
    }
    list_->resizeColumnsToContents();
    if (list_->rowCount() > 0) {
        list_->selectRow(selectRow);
    }
    quiet.unblock();
    showSelected();
}

std::optional<std::int64_t> StandardsPage::selectedStandard() const {
    const auto rows = list_->selectionModel()->selectedRows();
    if (rows.isEmpty()) {
        return std::nullopt;
    }
    return list_->item(rows.front().row(), 0)->data(Qt::UserRole).toLongLong();
}

bool StandardsPage::selectByTag(const QString& tag) {
    for (int row = 0; row < list_->rowCount(); ++row) {
        if (list_->item(row, 0)->text() == tag) {
            list_->selectRow(row);
            return true;
        }
    }
    return false;
}

void StandardsPage::showSelected() {
    ranges_->setRowCount(0);
    const auto id = selectedStandard();
    if (id && workspace_.isOpen()) {
        if (const auto standard = storage::StandardRepository(*workspace_.workbook()).find(*id)) {
            for (const StandardRangeSpec& spec : standard->specs) {
                const int row = ranges_->rowCount();
                ranges_->insertRow(row);
                ranges_->setItem(row, 0, new QTableWidgetItem(QString::fromStdString(spec.label)));
                ranges_->setItem(
                    row, 1,
                    new QTableWidgetItem(spec.signal == SignalKind::Ac ? tr("AC") : tr("DC")));
                ranges_->setItem(row, 2,
                                 new QTableWidgetItem(QString::fromStdString(
                                     formatEngineering(spec.full_scale, 4, spec.unit))));
                ranges_->setItem(row, 3,
                                 new QTableWidgetItem(QString::fromStdString(specText(spec))));
            }
            ranges_->resizeColumnsToContents();
        }
    }
    updateActions();
}

void StandardsPage::updateActions() {
    const bool administer = workspace_.can(Capability::Administer) && workspace_.isOpen() &&
                            !workspace_.workbook()->isReadOnly();
    add_->setEnabled(administer);
    edit_->setEnabled(administer && selectedStandard().has_value());
    recalibrate_->setEnabled(administer && selectedStandard().has_value());
    note_->setText(administer ? tr("A recalibration records the new certificate; records made "
                                   "with the old one keep their own copy of it.")
                              : tr("Only an administrator adds or changes reference standards."));
}

void StandardsPage::openEditor(int mode) {
    try {
        std::optional<ReferenceStandard> standard;
        if (mode != int(StandardEditor::Mode::New)) {
            const auto id = selectedStandard();
            if (!id) {
                return;
            }
            standard = storage::StandardRepository(*workspace_.workbook()).find(*id);
        }
        StandardEditor editor(workspace_, standard, StandardEditor::Mode(mode), this);
        if (editor.exec() == QDialog::Accepted) {
            reload();
            for (int row = 0; row < list_->rowCount(); ++row) {
                if (list_->item(row, 0)->data(Qt::UserRole).toLongLong() == editor.savedId()) {
                    list_->selectRow(row);
                }
            }
            emit statusMessage(tr("Reference standard saved."));
        }
    } catch (const std::exception& error) {
        emit statusMessage(tr("Not opened: %1").arg(QString::fromUtf8(error.what())));
    }
}

} // namespace mw::gui
