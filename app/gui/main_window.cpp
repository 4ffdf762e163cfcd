// The main window: menus, pages, the person signed in and the status bar.
#include "app/gui/main_window.h"

#include "app/gui/about_dialog.h"
#include "app/gui/admin/standards_page.h"
#include "app/gui/bench/bench_view.h"
#include "app/gui/bench/session_chart_view.h"
#include "app/gui/bench/session_setup_dialog.h"
#include "app/gui/designer/range_designer_view.h"
#include "app/gui/desk/due_page.h"
#include "app/gui/desk/history_page.h"
#include "app/gui/desk/review_page.h"
#include "app/gui/instrument_list_model.h"
#include "app/gui/recent_workbooks.h"
#include "app/gui/register_page.h"
#include "app/gui/sign_in_dialog.h"
#include "app/gui/workspace.h"
#include "storage/backup.h"
#include "storage/chain_anchor.h"
#include "storage/record_digest.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QAction>
#include <QActionGroup>
#include <QCloseEvent>
#include <QDateTime>
#include <QFileDialog>
#include <QFileInfo>
#include <QLabel>
#include <QMenuBar>
#include <QMessageBox>
#include <QProgressBar>
#include <QStackedWidget>
#include <QStatusBar>
#include <QToolBar>

namespace mw::gui {
namespace {

const QString kWorkbookFilter =
    QObject::tr("Meterwright workbooks (*.meterwright *.mwb);;All files (*)");

} // namespace

MainWindow::MainWindow(QWidget* parent)
    : QMainWindow(parent)
    , workspace_(std::make_unique<Workspace>()) {
    setObjectName(QStringLiteral("mainWindow"));
    setWindowTitle(tr("Meterwright"));
    setWindowIcon(QIcon(QStringLiteral(":/icons/meterwright.svg")));
    buildPages();
    buildMenus();
    buildStatusBar();
    statusBar()->showMessage(tr("No workbook open"));
    resize(1280, 780);
    connect(workspace_.get(), &Workspace::userChanged, this, &MainWindow::updateForPerson);
    // Also when the background check turns the workbook read-only.
    connect(workspace_.get(), &Workspace::workbookChanged, this, &MainWindow::updateForPerson);
    connect(workspace_.get(), &Workspace::backgroundMessage, this, &MainWindow::report);
    connect(workspace_.get(), &Workspace::busyChanged, busy_, &QWidget::setVisible);
    connect(workspace_->notifier(), &ChangeNotifier::editRefused, this,
            [this](const QString& why) { report(tr("Not saved: %1").arg(why)); });
    connect(workspace_->notifier(), &ChangeNotifier::sessionStateChanged, this,
            [this] { reloadRegisterQuietly(); });
    updateForPerson();
}

MainWindow::~MainWindow() {
    // The pages use the workspace to their last moment (a cell being typed in is saved as the
    // window goes), so they go first.
    if (bench_ != nullptr) {
        bench_->finishEditing();
    }
    delete pages_;
}

storage::Workbook* MainWindow::workbook() const {
    return workspace_->workbook();
}

InstrumentListModel* MainWindow::instrumentModel() const {
    return register_->model();
}

InstrumentDetailPanel* MainWindow::detailPanel() const {
    return register_->detail();
}

void MainWindow::buildPages() {
    pages_ = new QStackedWidget(this);
    register_ = new RegisterPage(*workspace_, pages_);
    pages_->addWidget(register_);
    setCentralWidget(pages_);
    connect(register_, &RegisterPage::startRequested, this, &MainWindow::askToStart);
    connect(register_, &RegisterPage::openRequested, this, [this](qint64 sessionId) {
        QString error;
        if (!openCalibration(sessionId, &error)) {
            QMessageBox::warning(this, tr("Cannot open the calibration"), error);
        }
    });
    connect(register_, &RegisterPage::statusMessage, this, &MainWindow::report);
    connect(register_, &RegisterPage::editRequested, this, &MainWindow::editInstrument);
}

StandardsPage* MainWindow::standards() {
    if (standards_ == nullptr) {
        standards_ = new StandardsPage(*workspace_, pages_);
        pages_->addWidget(standards_);
        connect(standards_, &StandardsPage::statusMessage, this, &MainWindow::report);
        standards_->reload();
    }
    return standards_;
}

BenchView* MainWindow::bench() {
    // Built when first needed: the window is up sooner, and a reviewer may never need it.
    if (bench_ == nullptr) {
        bench_ = new BenchView(*workspace_, pages_);
        pages_->addWidget(bench_);
        connect(bench_, &BenchView::statusMessage, this, &MainWindow::report);
        connect(bench_, &BenchView::setupRequested, this, &MainWindow::askToChangeSetup);
        connect(bench_, &BenchView::submitRequested, this, &MainWindow::askToSubmit);
    }
    return bench_;
}

void MainWindow::buildMenus() {
    QMenu* workbookMenu = menuBar()->addMenu(tr("&Workbook"));
    QAction* create = workbookMenu->addAction(tr("&New…"));
    create->setShortcut(QKeySequence::New);
    connect(create, &QAction::triggered, this, &MainWindow::askForNewWorkbook);
    QAction* open = workbookMenu->addAction(tr("&Open…"));
    open->setShortcut(QKeySequence::Open);
    connect(open, &QAction::triggered, this, &MainWindow::chooseWorkbook);
    recentMenu_ = workbookMenu->addMenu(tr("Open &recent"));
    fillRecentMenu();
    QAction* backup = workbookMenu->addAction(tr("&Back up now…"));
    connect(backup, &QAction::triggered, this, &MainWindow::backUpNow);
    workbookMenu->addSeparator();
    peopleAction_ = workbookMenu->addAction(tr("P&eople…"));
    connect(peopleAction_, &QAction::triggered, this, &MainWindow::showPeople);
    ownPasswordAction_ = workbookMenu->addAction(tr("&Change my password…"));
    connect(ownPasswordAction_, &QAction::triggered, this, &MainWindow::changeOwnPassword);
    QAction* switchPerson = workbookMenu->addAction(tr("Sign in as another &person…"));
    connect(switchPerson, &QAction::triggered, this, &MainWindow::promptSignIn);
    signOutAction_ = workbookMenu->addAction(tr("Sign &out"));
    connect(signOutAction_, &QAction::triggered, this, &MainWindow::signOut);
    workbookMenu->addSeparator();
    QAction* quit = workbookMenu->addAction(tr("&Quit"));
    quit->setShortcut(QKeySequence::Quit);
    connect(quit, &QAction::triggered, this, &QWidget::close);

    QMenu* editMenu = menuBar()->addMenu(tr("&Edit"));
    QAction* undo = workspace_->undoStack()->createUndoAction(this, tr("&Undo"));
    undo->setShortcut(QKeySequence::Undo);
    QAction* redo = workspace_->undoStack()->createRedoAction(this, tr("&Redo"));
    redo->setShortcuts({QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_Z), QKeySequence::Redo});
    editMenu->addAction(undo);
    editMenu->addAction(redo);

    QMenu* calibrationMenu = menuBar()->addMenu(tr("&Calibration"));
    startAction_ = calibrationMenu->addAction(tr("&Start calibration of the selected meter…"));
    connect(startAction_, &QAction::triggered, this, [this] {
        if (const auto id = register_->selectedInstrument()) {
            askToStart(*id);
        }
    });
    QAction* setup = calibrationMenu->addAction(tr("Set-&up…"));
    connect(setup, &QAction::triggered, this, &MainWindow::askToChangeSetup);
    QAction* submit = calibrationMenu->addAction(tr("Su&bmit for review…"));
    connect(submit, &QAction::triggered, this, &MainWindow::askToSubmit);
    QAction* exportChart = calibrationMenu->addAction(tr("&Export chart…"));
    connect(exportChart, &QAction::triggered, this, &MainWindow::exportChart);
    calibrationMenu->addSeparator();
    QAction* printRecord = calibrationMenu->addAction(tr("&Print record…"));
    printRecord->setShortcut(QKeySequence::Print);
    connect(printRecord, &QAction::triggered, this, [this] { printOrExportRecord(false); });
    QAction* exportRecord = calibrationMenu->addAction(tr("Export record as P&DF…"));
    connect(exportRecord, &QAction::triggered, this, [this] { printOrExportRecord(true); });
    buildInstrumentMenu();

    QToolBar* pagesBar = addToolBar(tr("Pages"));
    pagesBar->setObjectName(QStringLiteral("pagesBar"));
    pagesBar->setMovable(false);
    auto* group = new QActionGroup(this);
    const std::pair<Page, QString> pages[] = {
        {Page::Register, tr("Register")}, {Page::Standards, tr("Standards")},
        {Page::Bench, tr("Bench")},       {Page::Review, tr("Review")},
        {Page::History, tr("History")},   {Page::Due, tr("Due")},
        {Page::Designer, tr("Designer")}};
    for (const auto& [page, name] : pages) {
        QAction* action = pagesBar->addAction(name);
        action->setCheckable(true);
        group->addAction(action);
        pageActions_[page] = action;
        connect(action, &QAction::triggered, this, [this, page = page] { showPage(page); });
    }
    pageActions_[Page::Register]->setChecked(true);

    QMenu* helpMenu = menuBar()->addMenu(tr("&Help"));
    QAction* about = helpMenu->addAction(tr("&About Meterwright"));
    connect(about, &QAction::triggered, this, &MainWindow::showAbout);
}

void MainWindow::buildStatusBar() {
    busy_ = new QProgressBar(this);
    busy_->setRange(0, 0); // busy, no percentage
    busy_->setMaximumWidth(90);
    busy_->setToolTip(tr("Checking or backing up the workbook in the background"));
    busy_->hide();
    person_ = new QLabel(this);
    person_->setObjectName(QStringLiteral("signedInPerson"));
    statusBar()->addPermanentWidget(busy_);
    statusBar()->addPermanentWidget(person_);
}

void MainWindow::updateForPerson() {
    const auto& user = workspace_->user();
    person_->setText(user ? tr("Signed in: %1 (%2)")
                                .arg(QString::fromStdString(user->full_name),
                                     QString::fromUtf8(displayName(user->role).data()))
                     : workspace_->isOpen() ? tr("Nobody signed in")
                                            : QString());
    signOutAction_->setEnabled(user.has_value());
    ownPasswordAction_->setEnabled(user.has_value());
    peopleAction_->setEnabled(workspace_->can(Capability::Administer));
    startAction_->setEnabled(workspace_->can(Capability::Calibrate));
    // What the register offers depends on the person; what it lists does not.
    register_->updateActions();
    if (standards_ != nullptr) {
        standards_->reload(); // cheap: a handful of standards
    }
    if (review_ != nullptr) {
        review_->reload(); // what may be approved follows the person
    }
    if (history_ != nullptr) {
        history_->reload();
    }
    if (due_ != nullptr) {
        due_->reload();
    }
    if (bench_ != nullptr && bench_->sessionId()) {
        // The bench follows the person: read-only for someone who may not calibrate.
        QString error;
        openCalibration(*bench_->sessionId(), &error);
    }
}

void MainWindow::report(const QString& text) {
    statusBar()->showMessage(text, 15000);
}

bool MainWindow::openWorkbook(const QString& path, QString* error) {
    // The calibration on the bench belongs to the workbook open now: it goes first (every
    // accepted value is already saved), so nothing reopens it in the next workbook.
    if (bench_ != nullptr) {
        bench_->closeSession();
    }
    try {
        workspace_->open(path);
        register_->reload(); // reads every row the register shows: bad values fail here
    } catch (const std::exception& failure) {
        workspace_->close();
        reloadRegisterQuietly();
        if (error != nullptr) {
            *error = QString::fromUtf8(failure.what());
        }
        return false;
    }
    showRegister();
    setWindowTitle(tr("%1 — Meterwright").arg(QFileInfo(path).fileName()));
    QString status = tr("Workbook %1: %2 instruments")
                         .arg(QFileInfo(path).fileName())
                         .arg(register_->model()->rowCount());
    statusBar()->setToolTip(QFileInfo(path).absoluteFilePath());
    if (workspace_->workbook()->isReadOnly()) {
        status += tr(" — read-only (%1)").arg(workspace_->workbook()->readOnlyReason());
    }
    if (!workspace_->workbook()->upgradeBackupPath().isEmpty()) {
        status += tr(" — upgraded from an earlier version; the file as it was is kept as %1")
                      .arg(QFileInfo(workspace_->workbook()->upgradeBackupPath()).fileName());
    }
    statusBar()->showMessage(status);
    RecentWorkbooks(settings_).remember(path);
    fillRecentMenu();
    workspace_->startAutomaticBackup();
    updateForPerson();
    return true;
}

bool MainWindow::openAndSignIn(const QString& path) {
    QString error;
    if (!openWorkbook(path, &error)) {
        QMessageBox::warning(this, tr("Cannot open workbook"),
                             tr("%1\n\nThe file was not changed.").arg(error));
        return false;
    }
    promptSignIn();
    if (!workspace_->user()) {
        workspace_->close();
        reloadRegisterQuietly();
        setWindowTitle(tr("Meterwright"));
        statusBar()->showMessage(tr("Nobody signed in, so the workbook was closed."));
        return false;
    }
    return true;
}

bool MainWindow::signIn(const QString& login, const QString& password) {
    return workspace_->signIn(login, password);
}

void MainWindow::promptSignIn() {
    if (!workspace_->isOpen()) {
        report(tr("Open a workbook first."));
        return;
    }
    SignInDialog dialog(*workspace_, throttle_, this);
    dialog.exec();
}

void MainWindow::signOut() {
    if (bench_ != nullptr) {
        bench_->finishEditing();
    }
    workspace_->signOut();
    showRegister();
    report(tr("Signed out. Workbook → Sign in as another person… to go on."));
}

void MainWindow::reloadRegisterQuietly() {
    try {
        register_->reload();
    } catch (const std::exception& failure) {
        workspace_->close();
        register_->reload();
        statusBar()->showMessage(
            tr("The workbook was closed: it could not be read (%1)").arg(failure.what()));
    }
}

void MainWindow::showRegister() {
    showPage(Page::Register);
}

void MainWindow::showBench() {
    showPage(Page::Bench);
}

void MainWindow::showPage(Page page) {
    QWidget* widget = register_;
    switch (page) {
    case Page::Register:
        break;
    case Page::Standards:
        widget = standards();
        break;
    case Page::Bench:
        widget = bench();
        break;
    case Page::Review:
        widget = review();
        review_->reload();
        break;
    case Page::History:
        widget = history();
        if (!history_->instrumentId()) {
            history_->reload();
        }
        break;
    case Page::Due:
        widget = due();
        due_->reload();
        break;
    case Page::Designer:
        widget = designer();
        break;
    }
    pages_->setCurrentWidget(widget);
    pageActions_.at(page)->setChecked(true);
}

void MainWindow::chooseWorkbook() {
    const QString path =
        QFileDialog::getOpenFileName(this, tr("Open workbook"), QString(), kWorkbookFilter);
    if (!path.isEmpty()) {
        openAndSignIn(path);
    }
}

void MainWindow::backUpNow() {
    if (!workspace_->isOpen()) {
        QMessageBox::information(this, tr("Back up workbook"), tr("Open a workbook first."));
        return;
    }
    const QString target = QFileDialog::getSaveFileName(
        this, tr("Back up workbook to"),
        workspace_->workbook()->path() + QDateTime::currentDateTime().toString(QStringLiteral(
                                             "'.backup-'yyyyMMdd-HHmm'.meterwright'")),
        kWorkbookFilter, nullptr, QFileDialog::DontConfirmOverwrite);
    if (target.isEmpty()) {
        return;
    }
    if (QFileInfo::exists(target)) {
        // A backup never replaces a file: it could be the only copy of something.
        QMessageBox::warning(this, tr("Backup not written"),
                             tr("%1 already exists. Choose a new file name; a backup never "
                                "overwrites a file.")
                                 .arg(target));
        return;
    }
    try {
        storage::backupWorkbook(*workspace_->workbook(), target);
        // The head the copy holds, read back from it: noted with the backup, it anchors the
        // chain (meterwright verify --against).
        const storage::ChainHead head = storage::chainHeadOfFile(target);
        report(head.length == 0
                   ? tr("Backup written to %1 (no approved records yet)").arg(target)
                   : tr("Backup written to %1 (record chain: %2 approved records, head %3)")
                         .arg(target)
                         .arg(head.length)
                         .arg(storage::shortDigest(head.digest)));
    } catch (const std::exception& failure) {
        QMessageBox::warning(this, tr("Backup failed"), QString::fromUtf8(failure.what()));
    }
}

void MainWindow::showAbout() {
    AboutDialog dialog(this);
    dialog.exec();
}

void MainWindow::exportChart() {
    if (bench_ == nullptr || !bench_->sessionId()) {
        report(tr("Open a calibration on the bench first."));
        return;
    }
    const QString path = QFileDialog::getSaveFileName(
        this, tr("Export chart"), QString(), tr("PNG picture (*.png);;SVG drawing (*.svg)"));
    if (path.isEmpty()) {
        return;
    }
    QString error;
    if (bench_->chart()->exportTo(path, &error)) {
        report(tr("Chart written to %1").arg(path));
    } else {
        QMessageBox::warning(this, tr("Chart not written"), error);
    }
}

void MainWindow::closeEvent(QCloseEvent* event) {
    if (bench_ != nullptr) {
        bench_->finishEditing();
    }
    workspace_->waitForBackgroundWork();
    event->accept();
}

} // namespace mw::gui
