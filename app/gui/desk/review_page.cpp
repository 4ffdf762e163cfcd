#include "app/gui/desk/review_page.h"

#include "app/gui/bench/bench_view.h"
#include "app/gui/desk/desk_dialogs.h"
#include "app/gui/desk/desk_text.h"
#include "app/gui/status_icons.h"
#include "app/gui/workspace.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/sql_support.h"
#include "storage/standard_repository.h"
#include "storage/user_repository.h"

#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QPushButton>
#include <QSplitter>
#include <QTableWidget>
#include <QThread>
#include <QVBoxLayout>

#include <map>

namespace mw::gui {

ReviewPage::ReviewPage(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("reviewPage"));
    build();
}

void ReviewPage::build() {
    auto* layout = new QVBoxLayout(this);
    auto* splitter = new QSplitter(Qt::Vertical, this);

    auto* top = new QWidget(splitter);
    auto* topLayout = new QVBoxLayout(top);
    topLayout->setContentsMargins(0, 0, 0, 0);
    queueSummary_ = new QLabel(top);
    topLayout->addWidget(queueSummary_);
    queue_ = new QTableWidget(0, ColumnCount, top);
    queue_->setObjectName(QStringLiteral("reviewQueue"));
    queue_->setHorizontalHeaderLabels({tr("Instrument"), tr("Technician"), tr("Submitted"),
                                       tr("Outcome"), tr("Reference standards")});
    queue_->setSelectionBehavior(QAbstractItemView::SelectRows);
    queue_->setSelectionMode(QAbstractItemView::SingleSelection);
    queue_->setEditTriggers(QAbstractItemView::NoEditTriggers);
    queue_->verticalHeader()->hide();
    queue_->horizontalHeader()->setStretchLastSection(true);
    queue_->setWordWrap(false);
    topLayout->addWidget(queue_, 1);

    auto* bottom = new QWidget(splitter);
    auto* bottomLayout = new QVBoxLayout(bottom);
    bottomLayout->setContentsMargins(0, 0, 0, 0);
    auto* actions = new QHBoxLayout;
    approve_ = new QPushButton(tr("Approve and sign…"), bottom);
    approve_->setObjectName(QStringLiteral("reviewApprove"));
    return_ = new QPushButton(tr("Return to technician…"), bottom);
    return_->setObjectName(QStringLiteral("reviewReturn"));
    print_ = new QPushButton(tr("Print record…"), bottom);
    blocker_ = new QLabel(bottom);
    blocker_->setObjectName(QStringLiteral("reviewBlocker"));
    blocker_->setWordWrap(true);
    actions->addWidget(approve_);
    actions->addWidget(return_);
    actions->addWidget(blocker_, 1);
    actions->addWidget(print_);
    bottomLayout->addLayout(actions);
    verdict_ = new QLabel(bottom);
    verdict_->setObjectName(QStringLiteral("reviewVerdict"));
    verdict_->setWordWrap(true);
    verdict_->setTextInteractionFlags(Qt::TextSelectableByMouse);
    verdict_->hide();
    bottomLayout->addWidget(verdict_);
    view_ = new BenchView(workspace_, bottom);
    view_->setViewOnly(tr("<b>Choose a calibration in the queue above</b> to see it as the "
                          "technician left it."));
    bottomLayout->addWidget(view_, 1);
    splitter->addWidget(top);
    splitter->addWidget(bottom);
    splitter->setStretchFactor(0, 1);
    splitter->setStretchFactor(1, 4);
    splitter->setSizes({170, 560}); // the whole queue of a small lab, and the record below
    layout->addWidget(splitter);

    connect(queue_, &QTableWidget::currentCellChanged, this, [this](int row) {
        if (row < 0) {
            return;
        }
        const qint64 id = queue_->item(row, Instrument)->data(Qt::UserRole).toLongLong();
        if (!sessionId() || *sessionId() != id) {
            verdict_->hide();
            openSession(id);
        }
    });
    connect(approve_, &QPushButton::clicked, this, &ReviewPage::askToApprove);
    connect(return_, &QPushButton::clicked, this, &ReviewPage::askToReturn);
    connect(print_, &QPushButton::clicked, this, [this] {
        if (const auto id = sessionId()) {
            emit printRequested(*id);
        }
    });
    connect(view_, &BenchView::statusMessage, this, &ReviewPage::statusMessage);
    updateActions();
}

void ReviewPage::reload() {
    const std::optional<std::int64_t> shown = sessionId();
    const QSignalBlocker blocker(queue_);
    queue_->setRowCount(0);
    if (!workspace_.isOpen()) {
        queueSummary_->setText(tr("No workbook open."));
        view_->closeSession();
        updateActions();
        return;
    }
    storage::Workbook& workbook = *workspace_.workbook();
    const auto sessions = storage::SessionRepository(workbook).withState(SessionState::Submitted);
    std::map<std::int64_t, QString> people;
    for (const User& user : storage::UserRepository(workbook).all()) {
        people[user.id] = QString::fromStdString(user.full_name);
    }
    std::map<std::int64_t, ReferenceStandard> standards;
    for (ReferenceStandard& standard : storage::StandardRepository(workbook).all()) {
        standards[standard.id] = std::move(standard);
    }
    storage::InstrumentRepository instruments(workbook);
    int rowToSelect = -1;
    for (const CalibrationSession& session : sessions) {
        const int row = queue_->rowCount();
        queue_->insertRow(row);
        const auto instrument = instruments.find(session.instrument_id);
        auto* name = new QTableWidgetItem(
            instrument
                ? QStringLiteral("%1 — %2").arg(QString::fromStdString(instrument->asset_tag),
                                                QString::fromStdString(instrument->description))
                : tr("instrument %1").arg(session.instrument_id));
        name->setData(Qt::UserRole, qint64(session.id));
        queue_->setItem(row, Instrument, name);
        queue_->setItem(row, Technician,
                        new QTableWidgetItem(people.count(session.technician_id) != 0
                                                 ? people[session.technician_id]
                                                 : tr("user %1").arg(session.technician_id)));
        queue_->setItem(row, Submitted,
                        new QTableWidgetItem(
                            session.submitted_at ? minuteText(*session.submitted_at) : QString()));
        auto* outcome = new QTableWidgetItem;
        if (session.outcome) {
            outcome->setText(outcomeWords(*session.outcome));
            outcome->setIcon(outcomeIcon(*session.outcome, palette()));
        }
        queue_->setItem(row, Outcome, outcome);
        queue_->setItem(row, Standards,
                        new QTableWidgetItem(standardsUsedText(session.standards, standards)));
        if (shown && *shown == session.id) {
            rowToSelect = row;
        }
    }
    queue_->resizeColumnsToContents();
    queueSummary_->setText(
        sessions.empty()
            ? tr("Nothing is waiting for review.")
            : tr("%n calibration(s) waiting for review, oldest first.", "", int(sessions.size())));
    if (rowToSelect >= 0) {
        queue_->selectRow(rowToSelect);
    }
    updateActions();
}

bool ReviewPage::openSession(std::int64_t id) {
    try {
        view_->openSession(id);
    } catch (const std::exception& error) {
        emit statusMessage(tr("The calibration could not be read: %1").arg(error.what()));
        view_->closeSession();
        updateActions();
        return false;
    }
    for (int row = 0; row < queue_->rowCount(); ++row) {
        if (queue_->item(row, Instrument)->data(Qt::UserRole).toLongLong() == id) {
            const QSignalBlocker blocker(queue_);
            queue_->selectRow(row);
        }
    }
    updateActions();
    return true;
}

std::optional<std::int64_t> ReviewPage::sessionId() const {
    return view_->sessionId();
}

QString ReviewPage::actionBlocker() const {
    const BenchSession* shown = view_->bench();
    if (shown == nullptr) {
        return tr("Choose a calibration in the queue.");
    }
    if (shown->session().state != SessionState::Submitted) {
        return tr("This calibration is %1, not waiting for review.")
            .arg(QString::fromUtf8(displayName(shown->session().state).data()));
    }
    if (!workspace_.can(Capability::Review)) {
        return tr("Only a reviewer or an administrator approves or returns calibrations.");
    }
    if (workspace_.workbook()->isReadOnly()) {
        return tr("The workbook is read-only (%1).").arg(workspace_.workbook()->readOnlyReason());
    }
    if (workspace_.user()->id == shown->session().technician_id) {
        return tr("You calibrated this meter: another reviewer must approve or return it (the "
                  "workbook refuses a technician's approval of their own work).");
    }
    return {};
}

void ReviewPage::updateActions() {
    const QString blocker = actionBlocker();
    approve_->setEnabled(blocker.isEmpty());
    return_->setEnabled(blocker.isEmpty());
    print_->setEnabled(view_->sessionId().has_value());
    blocker_->setText(blocker.isEmpty() || !view_->sessionId() ? QString()
                                                               : QStringLiteral("ⓘ ") + blocker);
}

bool ReviewPage::approve(const QString& password, QString* message) {
    const QString blocker = actionBlocker();
    if (!blocker.isEmpty()) {
        *message = tr("Not approved: %1").arg(blocker);
        return false;
    }
    const auto wait = throttle_.waitBefore(SignInThrottle::Clock::now());
    if (wait.count() > 0) {
        // Repeated wrong signatures slow down as sign-ins do.
        QThread::msleep(static_cast<unsigned long>(wait.count()));
    }
    storage::Workbook& workbook = *workspace_.workbook();
    const User& reviewer = *workspace_.user();
    const auto signer = storage::UserRepository(workbook).authenticate(
        QString::fromStdString(reviewer.login), password);
    if (!signer || signer->id != reviewer.id) {
        throttle_.recordFailure(SignInThrottle::Clock::now());
        *message = tr("Not approved: that is not your password. Your password is your signature "
                      "on the record; nothing was changed.");
        return false;
    }
    throttle_.recordSuccess();
    const std::int64_t id = *sessionId();
    QString fingerprint;
    try {
        const auto at = currentTime();
        // The password also opens the reviewer's approval key (issued at their first approval).
        const storage::ApprovalSigner key =
            storage::unlockApprovalKey(workbook, reviewer.id, password, at);
        fingerprint = storage::keyFingerprint(key.publicKey);
        *message = storage::SessionRepository(workbook).approve(id, key, at);
    } catch (const std::exception& error) {
        *message = tr("Not approved: %1").arg(QString::fromUtf8(error.what()));
        return false;
    }
    emit workspace_.notifier()->sessionStateChanged(id);
    reload();
    openSession(id);
    showVerdict(tr("✔ <b>Approved, sealed and signed</b> by %1 (key %3). Record digest "
                   "(SHA-256, chained with the record approved before it): <tt>%2</tt>. "
                   "<tt>meterwright verify</tt> recomputes it and checks the signature.")
                    .arg(QString::fromStdString(reviewer.full_name).toHtmlEscaped(), *message,
                         fingerprint));
    return true;
}

bool ReviewPage::returnToTechnician(const QString& comment, QString* message) {
    const QString blocker = actionBlocker();
    if (!blocker.isEmpty()) {
        *message = tr("Not returned: %1").arg(blocker);
        return false;
    }
    if (comment.trimmed().isEmpty()) {
        *message = tr("Not returned: write what the technician should change; the comment "
                      "is required.");
        return false;
    }
    const std::int64_t id = *sessionId();
    try {
        storage::SessionRepository(*workspace_.workbook())
            .returnToTechnician(id, workspace_.user()->id, comment.trimmed(), currentTime());
    } catch (const std::exception& error) {
        *message = tr("Not returned: %1").arg(QString::fromUtf8(error.what()));
        return false;
    }
    emit workspace_.notifier()->sessionStateChanged(id);
    reload();
    openSession(id);
    *message = tr("Returned to the technician with your comment.");
    showVerdict(
        tr("↩ <b>Returned</b> to the technician: %1").arg(comment.trimmed().toHtmlEscaped()));
    return true;
}

void ReviewPage::showVerdict(const QString& html) {
    verdict_->setText(html);
    verdict_->show();
}

void ReviewPage::askToApprove() {
    const BenchSession* shown = view_->bench();
    if (shown == nullptr) {
        return;
    }
    const CalibrationSession& s = shown->session();
    const QString what = tr("Approve the calibration of %1 (revision %2), outcome %3, as %4.")
                             .arg(QString::fromStdString(shown->instrument().asset_tag))
                             .arg(s.revision)
                             .arg(s.outcome ? outcomeWords(*s.outcome) : tr("not evaluated"),
                                  QString::fromStdString(workspace_.user()->full_name));
    SignatureDialog dialog(what, this);
    while (dialog.exec() == QDialog::Accepted) {
        QString message;
        if (approve(dialog.password(), &message)) {
            emit statusMessage(tr("Approved; record digest %1").arg(message));
            return;
        }
        dialog.showRefusal(message);
    }
}

void ReviewPage::askToReturn() {
    if (view_->bench() == nullptr) {
        return;
    }
    CommentDialog dialog(tr("Return to the technician"),
                         tr("What should the technician check or change? They see this comment "
                            "on the register and on the bench."),
                         this);
    while (dialog.exec() == QDialog::Accepted) {
        QString message;
        if (returnToTechnician(dialog.text(), &message)) {
            emit statusMessage(message);
            return;
        }
        dialog.showRefusal(message);
    }
}

} // namespace mw::gui
