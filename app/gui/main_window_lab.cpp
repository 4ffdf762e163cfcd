// The main window's actions on the workbook itself and its people: a new workbook, the recent
// ones, the people dialog and changing one's own password.
#include "app/gui/admin/instrument_editor.h"
#include "app/gui/admin/new_workbook_dialog.h"
#include "app/gui/admin/people_dialog.h"
#include "app/gui/bench/bench_view.h"
#include "app/gui/main_window.h"
#include "app/gui/recent_workbooks.h"
#include "app/gui/register_page.h"
#include "app/gui/workspace.h"
#include "app/record/record_actions.h"
#include "storage/instrument_repository.h"

#include <QFileInfo>
#include <QMenu>
#include <QMenuBar>
#include <QMessageBox>

namespace mw::gui {

void MainWindow::fillRecentMenu() {
    recentMenu_->clear();
    const QStringList recent = RecentWorkbooks(settings_).list();
    for (const QString& path : recent) {
        QAction* action = recentMenu_->addAction(QFileInfo(path).fileName());
        action->setToolTip(path);
        action->setStatusTip(path);
        connect(action, &QAction::triggered, this, [this, path] { openAndSignIn(path); });
    }
    recentMenu_->setEnabled(!recent.isEmpty());
}

void MainWindow::openLastWorkbook() {
    const QStringList recent = RecentWorkbooks(settings_).list();
    if (!recent.isEmpty()) {
        openAndSignIn(recent.front());
    }
}

void MainWindow::askForNewWorkbook() {
    NewWorkbookDialog dialog(this);
    if (dialog.exec() != QDialog::Accepted) {
        return;
    }
    if (!openNewWorkbook(dialog.path(), dialog.login(), dialog.password())) {
        QMessageBox::warning(
            this, tr("New workbook"),
            tr("The workbook %1 was written but could not be opened.").arg(dialog.path()));
    }
}

bool MainWindow::openNewWorkbook(const QString& path, const QString& login,
                                 const QString& password) {
    QString error;
    if (!openWorkbook(path, &error)) {
        report(error);
        return false;
    }
    if (!signIn(login, password)) {
        return false;
    }
    report(tr("New workbook %1: add the reference standards, the instruments and the people "
              "who work with them.")
               .arg(QFileInfo(path).fileName()));
    return true;
}

void MainWindow::showPeople() {
    if (!workspace_->can(Capability::Administer)) {
        report(tr("Only an administrator manages people."));
        return;
    }
    PeopleDialog dialog(*workspace_, this);
    dialog.exec();
}

void MainWindow::changeOwnPassword() {
    if (!workspace_->user()) {
        report(tr("Sign in first."));
        return;
    }
    OwnPasswordDialog dialog(*workspace_, this);
    if (dialog.exec() == QDialog::Accepted) {
        report(tr("Your password is changed."));
    }
}

void MainWindow::editInstrument(std::optional<std::int64_t> instrumentId) {
    try {
        std::optional<Instrument> instrument;
        if (instrumentId) {
            instrument = storage::InstrumentRepository(*workspace_->workbook()).find(*instrumentId);
        }
        InstrumentEditor editor(*workspace_, instrument, this);
        if (editor.exec() == QDialog::Accepted) {
            reloadRegisterQuietly();
            register_->selectInstrument(editor.savedId());
            report(tr("Instrument saved."));
        }
    } catch (const std::exception& error) {
        QMessageBox::warning(this, tr("Instrument"), QString::fromUtf8(error.what()));
    }
}

void MainWindow::buildInstrumentMenu() {
    QMenu* menu = menuBar()->addMenu(tr("&Instrument"));
    QAction* add = menu->addAction(tr("&New instrument…"));
    connect(add, &QAction::triggered, this, [this] { editInstrument(std::nullopt); });
    QAction* edit = menu->addAction(tr("&Edit the selected instrument…"));
    connect(edit, &QAction::triggered, this, [this] {
        if (const auto id = register_->selectedInstrument()) {
            editInstrument(*id);
        }
    });
    menu->addSeparator();
    QAction* history = menu->addAction(tr("Its &history and drift"));
    history->setShortcut(QKeySequence(Qt::CTRL | Qt::Key_H));
    connect(history, &QAction::triggered, this, &MainWindow::showHistoryOfSelected);
    QAction* print = menu->addAction(tr("&Print its history report…"));
    connect(print, &QAction::triggered, this, [this] {
        if (const auto id = register_->selectedInstrument()) {
            printOrExportHistory(*id, false);
        }
    });
    QAction* pdf = menu->addAction(tr("Export its history report as P&DF…"));
    connect(pdf, &QAction::triggered, this, [this] {
        if (const auto id = register_->selectedInstrument()) {
            printOrExportHistory(*id, true);
        }
    });
}

void MainWindow::printOrExportHistory(std::int64_t instrumentId, bool toPdf) {
    if (!workspace_->isOpen()) {
        return;
    }
    if (!toPdf) {
        record::printInstrumentHistory(this, *workspace_->workbook(), instrumentId);
        return;
    }
    const QString written =
        record::exportInstrumentHistoryPdf(this, *workspace_->workbook(), instrumentId);
    if (!written.isEmpty()) {
        report(tr("History report written to %1").arg(written));
    }
}

void MainWindow::printOrExportRecord(bool toPdf) {
    const std::optional<std::int64_t> session = sessionOnShow();
    if (!session || !workspace_->isOpen()) {
        report(tr("Open a calibration on the bench, in review or in a history first (a record "
                  "not yet approved prints as a draft)."));
        return;
    }
    if (!toPdf) {
        record::printSessionRecord(this, *workspace_->workbook(), *session);
        return;
    }
    const QString written = record::exportSessionRecordPdf(this, *workspace_->workbook(), *session);
    if (!written.isEmpty()) {
        report(tr("Record written to %1").arg(written));
    }
}

} // namespace mw::gui
