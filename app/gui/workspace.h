// The one owner of what the window works on: the open workbook, the person signed in, the
// undo stack of their edits, the change notifier and the edits facade. Widgets get it passed
// in; none of them opens a workbook or keeps a repository of its own.
#pragma once

#include "app/gui/change_notifier.h"
#include "core/model/lab.h"
#include "core/model/user.h"
#include "storage/workbook.h"

#include <QFutureWatcher>
#include <QObject>
#include <QUndoStack>

#include <memory>
#include <optional>

namespace mw::gui {

class SessionEdits;

// What a role may do in the window (the database enforces the rules that matter on its own).
enum class Capability {
    Calibrate,  // the bench: technicians (and administrators, in a small lab)
    Review,     // approve or return submitted work: reviewers and administrators
    Administer, // instruments, standards, people: administrators
};

class Workspace : public QObject {
    Q_OBJECT
public:
    explicit Workspace(QObject* parent = nullptr);
    ~Workspace() override;

    // Opens `path` with the cheap checks only (header, application id, version; an older
    // workbook is upgraded after a copy is kept), so the window is up at once whatever the
    // file's size; the full quick_check then runs on a connection of its own in the
    // background and refuses writes if it finds damage. Throws WorkbookError; on failure the
    // workbook open before stays open. Signs the previous person out.
    void open(const QString& path);
    void close();
    storage::Workbook* workbook() const { return workbook_.get(); }
    bool isOpen() const { return workbook_ != nullptr; }

    // True and the person signed in when the login and password are right (an inactive user
    // is refused the same way, without saying which was wrong).
    bool signIn(const QString& login, const QString& password);
    void signOut();
    const std::optional<User>& user() const { return user_; }
    bool can(Capability capability) const;
    // The lab's identity and settings as saved now (defaults until the lab is described).
    Lab lab() const;

    QUndoStack* undoStack() { return &undo_; }
    ChangeNotifier* notifier() { return &notifier_; }
    SessionEdits& edits() { return *edits_; }

    // Writes the daily automatic backup if one is due, on a connection of its own in the
    // background; the result arrives as backgroundMessage.
    void startAutomaticBackup();
    // True while a background check or backup runs (the window shows that it is busy).
    bool isBusy() const;
    // Waits for background work to finish (tests, and closing the window).
    void waitForBackgroundWork();

signals:
    void workbookChanged(); // opened, closed
    void userChanged();     // signed in or out
    void backgroundMessage(const QString& text);
    void busyChanged(bool busy);

private:
    void startFullCheck();

    std::unique_ptr<storage::Workbook> workbook_;
    std::optional<User> user_;
    QUndoStack undo_;
    ChangeNotifier notifier_;
    std::unique_ptr<SessionEdits> edits_;
    QFutureWatcher<QString> check_;
    QFutureWatcher<QString> backup_;
};

} // namespace mw::gui
