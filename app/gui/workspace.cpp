// The window's open workbook, signed-in person and background work.
#include "app/gui/workspace.h"

#include "app/gui/session_edits.h"
#include "storage/backup.h"
#include "storage/lab_repository.h"
#include "storage/sqlite_dialect.h"
#include "storage/user_repository.h"
#include "storage/workbook_error.h"

#include <QDateTime>
#include <QFileInfo>
#include <QtConcurrent/QtConcurrentRun>

namespace mw::gui {
namespace {

// Runs on a worker thread with a connection of its own: "ok" or SQLite's first complaint.
QString fullCheck(const QString& path) {
    try {
        storage::OpenOptions options;
        options.readOnly = true;
        options.quickCheck = false;
        const storage::Workbook workbook(path, options);
        return storage::dialect::quickCheck(workbook.database());
    } catch (const std::exception& error) {
        return QString::fromUtf8(error.what());
    }
}

QString automaticBackup(const QString& path) {
    try {
        storage::OpenOptions options;
        options.readOnly = true;
        options.quickCheck = false;
        const storage::Workbook workbook(path, options);
        const auto written =
            storage::backupIfDue(workbook, storage::BackupPolicy{}, QDateTime::currentDateTime());
        return written ? QObject::tr("automatic backup written (%1)")
                             .arg(QFileInfo(*written).fileName())
                       : QString();
    } catch (const std::exception& error) {
        return QObject::tr("automatic backup failed: %1").arg(QString::fromUtf8(error.what()));
    }
}

} // namespace

Workspace::Workspace(QObject* parent)
    : QObject(parent)
    , edits_(std::make_unique<SessionEdits>(*this)) {
    connect(&check_, &QFutureWatcher<QString>::finished, this, [this] {
        const QString verdict = check_.result();
        if (workbook_ && verdict != QLatin1String("ok")) {
            workbook_->refuseWrites(tr("the full check found damage: %1").arg(verdict));
            emit backgroundMessage(tr("The workbook is damaged (%1); it is open read-only. Restore "
                                      "a backup.")
                                       .arg(verdict));
            emit workbookChanged();
        }
        emit busyChanged(isBusy());
    });
    connect(&backup_, &QFutureWatcher<QString>::finished, this, [this] {
        if (!backup_.result().isEmpty()) {
            emit backgroundMessage(backup_.result());
        }
        emit busyChanged(isBusy());
    });
}

Lab Workspace::lab() const {
    if (!workbook_) {
        return {};
    }
    return storage::LabRepository(*workbook_).load().value_or(Lab{});
}

Workspace::~Workspace() {
    waitForBackgroundWork();
}

void Workspace::open(const QString& path) {
    waitForBackgroundWork();
    storage::OpenOptions options;
    options.quickCheck = false; // the full check runs after the window is up
    auto opened = std::make_unique<storage::Workbook>(path, options);
    user_.reset();
    undo_.clear();
    workbook_ = std::move(opened);
    emit userChanged();
    emit workbookChanged();
    startFullCheck();
}

void Workspace::close() {
    waitForBackgroundWork();
    undo_.clear();
    user_.reset();
    workbook_.reset();
    emit userChanged();
    emit workbookChanged();
}

bool Workspace::signIn(const QString& login, const QString& password) {
    if (!workbook_) {
        return false;
    }
    const auto found = storage::UserRepository(*workbook_).authenticate(login, password);
    if (!found) {
        return false;
    }
    user_ = found;
    undo_.clear(); // one person's edits are never undone by another
    workbook_->setActor(user_->id);
    emit userChanged();
    return true;
}

void Workspace::signOut() {
    user_.reset();
    undo_.clear();
    if (workbook_) {
        workbook_->setActor(std::nullopt);
    }
    emit userChanged();
}

bool Workspace::can(Capability capability) const {
    if (!user_ || !user_->active || !workbook_) {
        return false;
    }
    switch (capability) {
    case Capability::Calibrate:
        return user_->role == Role::Technician || user_->role == Role::Administrator;
    case Capability::Review:
        return user_->role == Role::Reviewer || user_->role == Role::Administrator;
    case Capability::Administer:
        return user_->role == Role::Administrator;
    }
    return false;
}

void Workspace::startFullCheck() {
    check_.setFuture(QtConcurrent::run(fullCheck, workbook_->path()));
    emit busyChanged(true);
}

void Workspace::startAutomaticBackup() {
    if (!workbook_ || workbook_->isReadOnly() || backup_.isRunning()) {
        return;
    }
    backup_.setFuture(QtConcurrent::run(automaticBackup, workbook_->path()));
    emit busyChanged(true);
}

bool Workspace::isBusy() const {
    return check_.isRunning() || backup_.isRunning();
}

void Workspace::waitForBackgroundWork() {
    check_.waitForFinished();
    backup_.waitForFinished();
}

} // namespace mw::gui
