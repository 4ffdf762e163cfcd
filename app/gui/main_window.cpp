// The main window: menus, the instrument register with its detail, and the status bar.
#include "app/gui/main_window.h"

#include "app/gui/about_dialog.h"
#include "app/gui/instrument_detail_panel.h"
#include "app/gui/instrument_list_model.h"
#include "app/gui/register_rows.h"
#include "storage/backup.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QAction>
#include <QDateTime>
#include <QFileDialog>
#include <QFileInfo>
#include <QHeaderView>
#include <QLabel>
#include <QMenuBar>
#include <QMessageBox>
#include <QSplitter>
#include <QStackedWidget>
#include <QStatusBar>
#include <QTableView>

#include <chrono>

namespace mw::gui {

MainWindow::MainWindow(QWidget* parent)
    : QMainWindow(parent) {
    setObjectName(QStringLiteral("mainWindow"));
    setWindowTitle(tr("Meterwright"));
    setWindowIcon(QIcon(QStringLiteral(":/icons/meterwright.svg")));
    buildMenus();
    buildRegister();
    statusBar()->showMessage(tr("No workbook open"));
    resize(1180, 720);
}

MainWindow::~MainWindow() = default;

void MainWindow::buildMenus() {
    QMenu* workbookMenu = menuBar()->addMenu(tr("&Workbook"));
    QAction* open = workbookMenu->addAction(tr("&Open…"));
    open->setShortcut(QKeySequence::Open);
    connect(open, &QAction::triggered, this, &MainWindow::chooseWorkbook);
    QAction* backup = workbookMenu->addAction(tr("&Back up now…"));
    connect(backup, &QAction::triggered, this, &MainWindow::backUpNow);
    workbookMenu->addSeparator();
    QAction* quit = workbookMenu->addAction(tr("&Quit"));
    quit->setShortcut(QKeySequence::Quit);
    connect(quit, &QAction::triggered, this, &QWidget::close);

    QMenu* helpMenu = menuBar()->addMenu(tr("&Help"));
    QAction* about = helpMenu->addAction(tr("&About Meterwright"));
    connect(about, &QAction::triggered, this, &MainWindow::showAbout);
}

void MainWindow::buildRegister() {
    registerStack_ = new QStackedWidget(this);
    registerStack_->setObjectName(QStringLiteral("registerStack"));

    auto* splitter = new QSplitter(Qt::Horizontal, registerStack_);
    instrumentModel_ = new InstrumentListModel(this);
    instrumentView_ = new QTableView(splitter);
    instrumentView_->setObjectName(QStringLiteral("instrumentList"));
    instrumentView_->setModel(instrumentModel_);
    instrumentView_->setSelectionBehavior(QAbstractItemView::SelectRows);
    instrumentView_->setSelectionMode(QAbstractItemView::SingleSelection);
    instrumentView_->horizontalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);
    instrumentView_->horizontalHeader()->setSectionResizeMode(InstrumentListModel::Description,
                                                              QHeaderView::Stretch);
    instrumentView_->horizontalHeader()->setSectionResizeMode(InstrumentListModel::Kind,
                                                              QHeaderView::Interactive);
    instrumentView_->horizontalHeader()->resizeSection(InstrumentListModel::Kind, 150);
    instrumentView_->verticalHeader()->hide();
    instrumentView_->verticalHeader()->setDefaultSectionSize(fontMetrics().height() + 8);
    instrumentView_->setWordWrap(false);
    instrumentView_->setTextElideMode(Qt::ElideRight);
    detailPanel_ = new InstrumentDetailPanel(splitter);
    splitter->addWidget(instrumentView_);
    splitter->addWidget(detailPanel_);
    splitter->setStretchFactor(0, 3);
    splitter->setStretchFactor(1, 2);
    splitter->setSizes({800, 380});

    emptyStateLabel_ = new QLabel(
        tr("<p><b>No instruments to show.</b></p>"
           "<p>Open a workbook (Workbook → Open…) to see its register of instruments.</p>"),
        registerStack_);
    emptyStateLabel_->setObjectName(QStringLiteral("emptyState"));
    emptyStateLabel_->setAlignment(Qt::AlignCenter);

    registerStack_->addWidget(splitter);
    registerStack_->addWidget(emptyStateLabel_);
    setCentralWidget(registerStack_);

    connect(instrumentModel_, &QAbstractItemModel::modelReset, this, &MainWindow::updateEmptyState);
    connect(instrumentView_->selectionModel(), &QItemSelectionModel::currentRowChanged, this,
            &MainWindow::showSelectedInstrument);
    updateEmptyState();
}

bool MainWindow::openWorkbook(const QString& path, QString* error) {
    std::unique_ptr<storage::Workbook> previous = std::move(workbook_);
    try {
        workbook_ = std::make_unique<storage::Workbook>(path);
        reloadRegister(); // reads every row the register shows: a value it cannot read fails here
    } catch (const std::exception& failure) {
        // The file stays as it was; the workbook open before stays open.
        workbook_ = std::move(previous);
        reloadRegisterQuietly();
        if (error != nullptr) {
            *error = QString::fromUtf8(failure.what());
        }
        return false;
    }
    setWindowTitle(tr("%1 — Meterwright").arg(QFileInfo(path).fileName()));
    const QString backupNote = takeAutomaticBackup();
    QString status = tr("Workbook %1: %2 instruments")
                         .arg(QFileInfo(path).fileName())
                         .arg(instrumentModel_->rowCount());
    statusBar()->setToolTip(QFileInfo(path).absoluteFilePath());
    if (workbook_->isReadOnly()) {
        status += tr(" — read-only (%1)").arg(workbook_->readOnlyReason());
    }
    if (!backupNote.isEmpty()) {
        status += QStringLiteral(" — ") + backupNote;
    }
    statusBar()->showMessage(status);
    return true;
}

QString MainWindow::takeAutomaticBackup() {
    // A daily rolling set beside the workbook; a failed backup is reported, never fatal, and
    // never touches the workbook itself.
    if (workbook_->isReadOnly()) {
        return {};
    }
    try {
        const auto written =
            storage::backupIfDue(*workbook_, storage::BackupPolicy{}, QDateTime::currentDateTime());
        return written ? tr("automatic backup written (%1)").arg(QFileInfo(*written).fileName())
                       : QString();
    } catch (const std::exception& failure) {
        return tr("automatic backup failed: %1").arg(QString::fromUtf8(failure.what()));
    }
}

void MainWindow::backUpNow() {
    if (!workbook_) {
        QMessageBox::information(this, tr("Back up workbook"), tr("Open a workbook first."));
        return;
    }
    const QString target = QFileDialog::getSaveFileName(
        this, tr("Back up workbook to"),
        workbook_->path() +
            QDateTime::currentDateTime().toString(QStringLiteral("'.backup-'yyyyMMdd-HHmm'.mwb'")),
        tr("Meterwright workbooks (*.mwb)"), nullptr, QFileDialog::DontConfirmOverwrite);
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
        storage::backupWorkbook(*workbook_, target);
        statusBar()->showMessage(tr("Backup written to %1").arg(target));
    } catch (const std::exception& failure) {
        QMessageBox::warning(this, tr("Backup failed"), QString::fromUtf8(failure.what()));
    }
}

void MainWindow::chooseWorkbook() {
    const QString path = QFileDialog::getOpenFileName(
        this, tr("Open workbook"), QString(), tr("Meterwright workbooks (*.mwb);;All files (*)"));
    if (path.isEmpty()) {
        return;
    }
    QString error;
    if (!openWorkbook(path, &error)) {
        QMessageBox::warning(this, tr("Cannot open workbook"),
                             tr("%1\n\nThe file was not changed.").arg(error));
    }
}

void MainWindow::reloadRegister() {
    if (!workbook_) {
        instrumentModel_->setRows({});
        return;
    }
    const storage::InstrumentRepository instruments(*workbook_);
    const auto today = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
    OpenCalibrations open;
    const storage::SessionRepository sessions(*workbook_);
    for (const SessionState state :
         {SessionState::Draft, SessionState::Returned, SessionState::Submitted}) {
        for (const CalibrationSession& session : sessions.withState(state)) {
            open[session.instrument_id] = state;
        }
    }
    instrumentModel_->setRows(
        buildRegisterRows(instruments.all(), instruments.dueList(), open, today));
    detailPanel_->showInstrument(std::nullopt);
    if (instrumentModel_->rowCount() > 0) {
        instrumentView_->setCurrentIndex(instrumentModel_->index(0, 0));
    }
}

void MainWindow::reloadRegisterQuietly() {
    try {
        reloadRegister();
    } catch (const std::exception& failure) {
        workbook_.reset();
        instrumentModel_->setRows({});
        statusBar()->showMessage(
            tr("The workbook was closed: it could not be read (%1)").arg(failure.what()));
    }
}

void MainWindow::showSelectedInstrument() {
    const QModelIndex current = instrumentView_->currentIndex();
    if (!workbook_ || !current.isValid()) {
        detailPanel_->showInstrument(std::nullopt);
        return;
    }
    const auto id = instrumentModel_->rowAt(current.row()).instrumentId;
    try {
        detailPanel_->showInstrument(storage::InstrumentRepository(*workbook_).find(id));
    } catch (const std::exception& failure) {
        detailPanel_->showInstrument(std::nullopt);
        statusBar()->showMessage(tr("This instrument could not be read: %1").arg(failure.what()));
    }
}

void MainWindow::updateEmptyState() {
    registerStack_->setCurrentIndex(instrumentModel_->rowCount() == 0 ? 1 : 0);
}

void MainWindow::showAbout() {
    AboutDialog dialog(this);
    dialog.exec();
}

} // namespace mw::gui
