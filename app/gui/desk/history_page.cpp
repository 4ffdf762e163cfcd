#include "app/gui/desk/history_page.h"

#include "app/gui/calendar_days.h"
#include "app/gui/desk/desk_dialogs.h"
#include "app/gui/desk/desk_tables.h"
#include "app/gui/desk/desk_text.h"
#include "app/gui/desk/drift_chart_view.h"
#include "app/gui/status_icons.h"
#include "app/gui/workspace.h"
#include "app/record/record_loader.h"
#include "core/units/quantity.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"

#include <QComboBox>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QMessageBox>
#include <QPushButton>
#include <QSplitter>
#include <QTableWidget>
#include <QVBoxLayout>

#include <algorithm>
#include <cmath>

namespace mw::gui {
namespace {

QString text(const std::string& value) {
    return QString::fromStdString(value);
}

QTableWidgetItem* item(const QString& value) {
    return new QTableWidgetItem(value);
}

} // namespace

HistoryPage::HistoryPage(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("historyPage"));
    build();
}

void HistoryPage::build() {
    auto* layout = new QVBoxLayout(this);
    auto* top = new QHBoxLayout;
    instruments_ = new QComboBox(this);
    instruments_->setObjectName(QStringLiteral("historyInstrument"));
    instruments_->setMinimumContentsLength(40);
    auto* printHistory = new QPushButton(tr("Print history…"), this);
    auto* exportHistory = new QPushButton(tr("Export history as PDF…"), this);
    top->addWidget(new QLabel(tr("Instrument:"), this));
    top->addWidget(instruments_);
    top->addStretch();
    top->addWidget(printHistory);
    top->addWidget(exportHistory);
    layout->addLayout(top);

    auto* splitter = new QSplitter(Qt::Vertical, this);
    auto* records = new QWidget(splitter);
    auto* recordsLayout = new QVBoxLayout(records);
    recordsLayout->setContentsMargins(0, 0, 0, 0);
    table_ =
        readOnlyTable({tr("Started"), tr("Approved"), tr("Rev."), tr("State"), tr("As found"),
                       tr("As left"), tr("Worst as-found point"), tr("Technician"), tr("Reviewer")},
                      records);
    table_->setObjectName(QStringLiteral("historyCalibrations"));
    recordsLayout->addWidget(table_, 1);
    auto* recordRow = new QHBoxLayout;
    recordLine_ = new QLabel(records);
    recordLine_->setObjectName(QStringLiteral("historyRecordLine"));
    recordLine_->setWordWrap(true);
    open_ = new QPushButton(tr("Open read-only"), records);
    successor_ = new QPushButton(tr("Go to the revision that replaces it"), records);
    amend_ = new QPushButton(tr("Amend this record…"), records);
    printRecord_ = new QPushButton(tr("Print record…"), records);
    recordRow->addWidget(recordLine_, 1);
    recordRow->addWidget(open_);
    recordRow->addWidget(successor_);
    recordRow->addWidget(amend_);
    recordRow->addWidget(printRecord_);
    recordsLayout->addLayout(recordRow);

    auto* analysis = new QSplitter(Qt::Horizontal, splitter);
    analysis->addWidget(buildDrift(analysis));
    analysis->addWidget(buildInterval(analysis));
    analysis->setStretchFactor(0, 3);
    analysis->setStretchFactor(1, 2);
    splitter->addWidget(records);
    splitter->addWidget(analysis);
    splitter->setStretchFactor(0, 2);
    splitter->setStretchFactor(1, 3);
    splitter->setSizes({260, 420});
    layout->addWidget(splitter, 1);

    connect(instruments_, &QComboBox::activated, this,
            [this](int index) { showInstrument(instruments_->itemData(index).toLongLong()); });
    connect(table_, &QTableWidget::currentCellChanged, this, [this] { updateRecordActions(); });
    connect(table_, &QTableWidget::cellDoubleClicked, this, [this] {
        if (const auto id = selectedSession()) {
            emit openRequested(*id);
        }
    });
    connect(open_, &QPushButton::clicked, this, [this] {
        if (const auto id = selectedSession()) {
            emit openRequested(*id);
        }
    });
    connect(successor_, &QPushButton::clicked, this, [this] {
        const HistoryRow* shown = selectedSession() ? row(*selectedSession()) : nullptr;
        if (shown != nullptr && shown->supersededBy) {
            selectSession(*shown->supersededBy);
        }
    });
    connect(amend_, &QPushButton::clicked, this, &HistoryPage::askToAmend);
    connect(printRecord_, &QPushButton::clicked, this, [this] {
        if (const auto id = selectedSession()) {
            emit printRequested(*id);
        }
    });
    connect(printHistory, &QPushButton::clicked, this, [this] {
        if (instrument_) {
            emit historyPrintRequested(instrument_->id, false);
        }
    });
    connect(exportHistory, &QPushButton::clicked, this, [this] {
        if (instrument_) {
            emit historyPrintRequested(instrument_->id, true);
        }
    });
    updateRecordActions();
}

QWidget* HistoryPage::buildDrift(QWidget* parent) {
    auto* box = new QWidget(parent);
    auto* layout = new QVBoxLayout(box);
    layout->setContentsMargins(0, 0, 0, 0);
    auto* chooser = new QHBoxLayout;
    point_ = new QComboBox(box);
    point_->setObjectName(QStringLiteral("historyPoint"));
    chooser->addWidget(new QLabel(tr("Drift of:"), box));
    chooser->addWidget(point_, 1);
    layout->addLayout(chooser);
    chart_ = new DriftChartView(box);
    layout->addWidget(chart_, 1);
    driftSummary_ = new QLabel(box);
    driftSummary_->setObjectName(QStringLiteral("historyDriftSummary"));
    driftSummary_->setWordWrap(true);
    driftSummary_->setTextInteractionFlags(Qt::TextSelectableByMouse);
    layout->addWidget(driftSummary_);
    connect(point_, &QComboBox::currentIndexChanged, this, [this](int index) {
        if (index >= 0) {
            const int data = point_->itemData(index).toInt();
            showDriftOf(data < 0 ? std::nullopt : std::optional<int>(data));
        }
    });
    return box;
}

QWidget* HistoryPage::buildInterval(QWidget* parent) {
    auto* box = new QWidget(parent);
    auto* layout = new QVBoxLayout(box);
    layout->setContentsMargins(0, 0, 0, 0);
    interval_ = new QLabel(box);
    interval_->setObjectName(QStringLiteral("historyInterval"));
    interval_->setWordWrap(true);
    interval_->setTextFormat(Qt::RichText);
    layout->addWidget(interval_);
    steps_ = readOnlyTable({tr("Calibrated"), tr("Found"), tr("Step"), tr("Interval after")}, box);
    steps_->setObjectName(QStringLiteral("historyIntervalSteps"));
    layout->addWidget(steps_, 1);
    method_ = new QLabel(box);
    method_->setWordWrap(true);
    method_->setTextInteractionFlags(Qt::TextSelectableByMouse);
    layout->addWidget(method_);
    adopt_ = new QPushButton(tr("Adopt the recommended interval…"), box);
    adopt_->setObjectName(QStringLiteral("historyAdopt"));
    layout->addWidget(adopt_);
    connect(adopt_, &QPushButton::clicked, this, &HistoryPage::askToAdopt);
    return box;
}

void HistoryPage::reload() {
    const std::optional<std::int64_t> shown = instrumentId();
    instruments_->clear();
    if (!workspace_.isOpen()) {
        instrument_.reset();
        history_.reset();
        fillTable();
        fillPoints();
        fillInterval();
        return;
    }
    for (const Instrument& instrument :
         storage::InstrumentRepository(*workspace_.workbook()).all()) {
        instruments_->addItem(
            QStringLiteral("%1 — %2").arg(text(instrument.asset_tag), text(instrument.description)),
            qint64(instrument.id));
    }
    if (shown) {
        showInstrument(*shown);
    } else if (instruments_->count() > 0) {
        showInstrument(instruments_->itemData(0).toLongLong());
    }
}

bool HistoryPage::showInstrument(std::int64_t id) {
    const std::optional<std::int64_t> keep = selectedSession();
    std::optional<record::HistoryReportSource> source;
    try {
        source = record::RecordLoader(*workspace_.workbook()).history(id, currentTime());
    } catch (const std::exception& error) {
        emit statusMessage(tr("The history could not be read: %1").arg(error.what()));
        return false;
    }
    if (!source) {
        emit statusMessage(tr("No instrument %1 in this workbook.").arg(id));
        return false;
    }
    instrument_ = source->instrument;
    history_ = std::move(source->history);
    const int index = instruments_->findData(qint64(id));
    if (index >= 0) {
        instruments_->setCurrentIndex(index);
    }
    fillTable();
    fillPoints();
    fillInterval();
    if (!keep || !selectSession(*keep)) {
        table_->setCurrentCell(table_->rowCount() > 0 ? 0 : -1, 0);
    }
    updateRecordActions();
    return true;
}

std::optional<std::int64_t> HistoryPage::instrumentId() const {
    return instrument_ ? std::optional<std::int64_t>(instrument_->id) : std::nullopt;
}

const InstrumentHistory* HistoryPage::history() const {
    return history_ ? &*history_ : nullptr;
}

const HistoryRow* HistoryPage::row(std::int64_t sessionId) const {
    if (!history_) {
        return nullptr;
    }
    const auto found = std::find_if(history_->rows.begin(), history_->rows.end(),
                                    [&](const HistoryRow& r) { return r.sessionId == sessionId; });
    return found == history_->rows.end() ? nullptr : &*found;
}

void HistoryPage::fillTable() {
    const QSignalBlocker blocker(table_);
    table_->setRowCount(0);
    if (!history_) {
        return;
    }
    // Newest first, as a supervisor reads a meter's file.
    for (auto it = history_->rows.rbegin(); it != history_->rows.rend(); ++it) {
        const HistoryRow& r = *it;
        const int at = table_->rowCount();
        table_->insertRow(at);
        auto* started = item(minuteText(r.startedAt));
        started->setData(Qt::UserRole, qint64(r.sessionId));
        table_->setItem(at, Started, started);
        table_->setItem(at, Approved, item(r.approvedAt ? minuteText(*r.approvedAt) : QString()));
        table_->setItem(at, Revision, item(QString::number(r.revision)));
        QString state = QString::fromUtf8(displayName(r.state).data());
        if (r.supersededBy) {
            state = tr("⊘ superseded by rev. %1")
                        .arg(row(*r.supersededBy) ? row(*r.supersededBy)->revision : 0);
        } else if (r.supersedesId) {
            state += tr(" (amends rev. %1)")
                         .arg(row(*r.supersedesId) ? row(*r.supersedesId)->revision : 0);
        }
        table_->setItem(at, State, item(state));
        const std::pair<Column, std::optional<Outcome>> outcomes[] = {{AsFound, r.asFound},
                                                                      {AsLeft, r.asLeft}};
        for (const auto& [column, outcome] : outcomes) {
            auto* cell = item(outcome ? outcomeWords(*outcome)
                                      : (r.adjusted || column == AsFound ? QString() : tr("—")));
            if (outcome) {
                cell->setIcon(outcomeIcon(*outcome, palette()));
            }
            table_->setItem(at, column, cell);
        }
        table_->setItem(at, Worst,
                        item(r.worstAsFoundFraction
                                 ? tr("%1 % of limit (%2 @ %3)")
                                       .arg(std::lround(*r.worstAsFoundFraction * 100.0))
                                       .arg(text(r.worstAsFoundRange),
                                            text(formatEngineering(r.worstAsFoundApplied, 4,
                                                                   r.worstAsFoundUnit)))
                                 : QString()));
        table_->setItem(at, Technician, item(text(r.technician)));
        table_->setItem(at, Reviewer, item(text(r.reviewer)));
    }
    table_->resizeColumnsToContents();
}

void HistoryPage::fillPoints() {
    const QSignalBlocker blocker(point_);
    point_->clear();
    if (!history_ || history_->points.empty()) {
        chart_->clear();
        driftSummary_->setText(history_ ? tr("No approved calibration of this meter has results "
                                             "at its test points yet.")
                                        : QString());
        return;
    }
    point_->addItem(tr("All test points (error as % of limit)"), -1);
    int firstSignificant = -1;
    for (std::size_t i = 0; i < history_->points.size(); ++i) {
        const PointHistory& p = history_->points[i];
        const bool significant = p.drift && p.drift->significant;
        point_->addItem(tr("%1 at %2%3")
                            .arg(text(p.rangeLabel), text(formatEngineering(p.nominal, 4, p.unit)),
                                 significant ? tr(" — significant drift") : QString()),
                        int(i));
        // The point to open on: the one whose trend reaches its limit first, else the first
        // with a significant drift.
        const auto reaches = [](const PointHistory& q) {
            return q.drift && q.drift->significant && q.line && q.line->reachesLimit;
        };
        if (significant &&
            (firstSignificant < 0 ||
             (reaches(p) &&
              (!reaches(history_->points[std::size_t(firstSignificant)]) ||
               *p.line->reachesLimit <
                   *history_->points[std::size_t(firstSignificant)].line->reachesLimit)))) {
            firstSignificant = int(i);
        }
    }
    // Open on the point that needs attention most, else on the overview.
    const int choose = firstSignificant >= 0 ? firstSignificant + 1 : 0;
    point_->setCurrentIndex(choose);
    showDriftOf(firstSignificant >= 0 ? std::optional<int>(firstSignificant) : std::nullopt);
}

void HistoryPage::showDriftOf(std::optional<int> pointIndex) {
    if (!history_ || history_->points.empty()) {
        return;
    }
    if (!pointIndex) {
        chart_->showAll(history_->points);
        const auto significant =
            std::count_if(history_->points.begin(), history_->points.end(),
                          [](const PointHistory& p) { return p.drift && p.drift->significant; });
        driftSummary_->setText(
            significant == 0
                ? tr("No significant drift at any of the %n test point(s).", "",
                     int(history_->points.size()))
                : tr("Significant drift at %1 of %2 test points; choose one to see its trend "
                     "and projection.")
                      .arg(significant)
                      .arg(history_->points.size()));
        return;
    }
    const PointHistory& p = history_->points.at(std::size_t(*pointIndex));
    chart_->showPoint(p);
    QString summary = text(p.summary);
    if (p.drift && !p.drift->significant) {
        summary = tr("No significant drift: %1").arg(summary);
    }
    driftSummary_->setText(summary);
    const int comboIndex = point_->findData(*pointIndex);
    if (comboIndex >= 0 && point_->currentIndex() != comboIndex) {
        const QSignalBlocker blocker(point_);
        point_->setCurrentIndex(comboIndex);
    }
}

bool HistoryPage::selectSession(std::int64_t sessionId) {
    for (int r = 0; r < table_->rowCount(); ++r) {
        if (table_->item(r, Started)->data(Qt::UserRole).toLongLong() == sessionId) {
            table_->setCurrentCell(r, 0);
            updateRecordActions();
            return true;
        }
    }
    return false;
}

std::optional<std::int64_t> HistoryPage::selectedSession() const {
    const int r = table_->currentRow();
    if (r < 0 || table_->item(r, Started) == nullptr) {
        return std::nullopt;
    }
    return table_->item(r, Started)->data(Qt::UserRole).toLongLong();
}

void HistoryPage::updateRecordActions() {
    const HistoryRow* shown = selectedSession() ? row(*selectedSession()) : nullptr;
    open_->setEnabled(shown != nullptr);
    printRecord_->setEnabled(shown != nullptr);
    successor_->setVisible(shown != nullptr && shown->supersededBy.has_value());
    const bool approved = shown != nullptr && shown->state == SessionState::Approved;
    amend_->setEnabled(approved && workspace_.can(Capability::Calibrate));
    amend_->setToolTip(workspace_.can(Capability::Calibrate)
                           ? tr("A new revision of this approved record, with a reason")
                           : tr("An amendment is new calibration work: a technician or an "
                                "administrator starts it."));
    if (shown == nullptr) {
        recordLine_->clear();
        return;
    }
    QString line;
    if (shown->supersededBy) {
        const HistoryRow* next = row(*shown->supersededBy);
        line = tr("⊘ Superseded: revision %1 replaces this record (%2). It stays readable as it "
                  "was approved.")
                   .arg(next ? next->revision : 0)
                   .arg(next ? text(next->amendmentReason) : QString());
    } else if (shown->supersedesId) {
        line = tr("Revision %1, amending an earlier record: %2")
                   .arg(shown->revision)
                   .arg(text(shown->amendmentReason));
    } else if (!shown->problems.empty()) {
        line = tr("⚠ %1").arg(text(shown->problems.front()));
    }
    recordLine_->setText(line);
}

std::optional<std::int64_t> HistoryPage::amendSelected(const QString& reason, QString* message) {
    const HistoryRow* shown = selectedSession() ? row(*selectedSession()) : nullptr;
    if (shown == nullptr || shown->state != SessionState::Approved) {
        *message = tr("Not amended: choose an approved record (not one already superseded).");
        return std::nullopt;
    }
    if (!workspace_.can(Capability::Calibrate)) {
        *message = tr("Not amended: an amendment is new calibration work; a technician or an "
                      "administrator starts it.");
        return std::nullopt;
    }
    if (reason.trimmed().isEmpty()) {
        *message = tr("Not amended: say why the record is amended; the reason is required.");
        return std::nullopt;
    }
    std::int64_t id = 0;
    try {
        id = storage::SessionRepository(*workspace_.workbook())
                 .amend(shown->sessionId, workspace_.user()->id, reason.trimmed(), currentTime());
    } catch (const std::exception& error) {
        *message = tr("Not amended: %1").arg(QString::fromUtf8(error.what()));
        return std::nullopt;
    }
    emit workspace_.notifier()->sessionStateChanged(id);
    showInstrument(instrument_->id);
    selectSession(id);
    *message = tr("Revision started; the approved record stays as it is until the new revision "
                  "is approved.");
    return id;
}

void HistoryPage::askToAmend() {
    CommentDialog dialog(tr("Amend the record"),
                         tr("Why is this approved record amended? The reason is printed on the "
                            "new revision; the original stays readable and is marked as "
                            "superseded once the new revision is approved."),
                         this);
    while (dialog.exec() == QDialog::Accepted) {
        QString message;
        if (const auto id = amendSelected(dialog.text(), &message)) {
            emit statusMessage(message);
            emit amendStarted(*id);
            return;
        }
        dialog.showRefusal(message);
    }
}

} // namespace mw::gui
