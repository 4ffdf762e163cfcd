// The main window's pages built on first use: the review desk, an instrument's history, what
// is due, and the range designer.
#include "app/gui/bench/bench_view.h"
#include "app/gui/designer/range_designer_view.h"
#include "app/gui/desk/due_page.h"
#include "app/gui/desk/history_page.h"
#include "app/gui/desk/review_page.h"
#include "app/gui/main_window.h"
#include "app/gui/register_page.h"
#include "app/gui/workspace.h"
#include "app/record/record_actions.h"

#include <QMessageBox>
#include <QStackedWidget>

namespace mw::gui {

ReviewPage* MainWindow::review() {
    if (review_ == nullptr) {
        review_ = new ReviewPage(*workspace_, pages_);
        pages_->addWidget(review_);
        connect(review_, &ReviewPage::statusMessage, this, &MainWindow::report);
        connect(review_, &ReviewPage::printRequested, this, [this](qint64 sessionId) {
            record::printSessionRecord(this, *workspace_->workbook(), sessionId);
        });
        review_->reload();
    }
    return review_;
}

HistoryPage* MainWindow::history() {
    if (history_ == nullptr) {
        history_ = new HistoryPage(*workspace_, pages_);
        pages_->addWidget(history_);
        connect(history_, &HistoryPage::statusMessage, this, &MainWindow::report);
        const auto open = [this](qint64 sessionId) {
            QString error;
            if (!openCalibration(sessionId, &error)) {
                QMessageBox::warning(this, tr("Cannot open the calibration"), error);
            }
        };
        connect(history_, &HistoryPage::openRequested, this, open);
        connect(history_, &HistoryPage::amendStarted, this, open);
        connect(history_, &HistoryPage::printRequested, this, [this](qint64 sessionId) {
            record::printSessionRecord(this, *workspace_->workbook(), sessionId);
        });
        connect(history_, &HistoryPage::historyPrintRequested, this,
                &MainWindow::printOrExportHistory);
        connect(history_, &HistoryPage::instrumentChanged, this,
                [this] { reloadRegisterQuietly(); });
        history_->reload();
    }
    return history_;
}

DuePage* MainWindow::due() {
    if (due_ == nullptr) {
        due_ = new DuePage(*workspace_, pages_);
        pages_->addWidget(due_);
        connect(due_, &DuePage::statusMessage, this, &MainWindow::report);
        connect(due_, &DuePage::historyRequested, this, [this](qint64 instrumentId) {
            history()->reload();
            history_->showInstrument(instrumentId);
            showPage(Page::History);
        });
        due_->reload();
    }
    return due_;
}

RangeDesignerView* MainWindow::designer() {
    if (designer_ == nullptr) {
        designer_ = new RangeDesignerView(*workspace_, pages_);
        pages_->addWidget(designer_);
        // A designed resistor copied into a range: the register shows the change.
        connect(designer_, &RangeDesignerView::resistorSaved, this,
                [this] { reloadRegisterQuietly(); });
    }
    return designer_;
}

void MainWindow::showHistoryOfSelected() {
    const auto id = register_->selectedInstrument();
    if (!id || !workspace_->isOpen()) {
        report(tr("Choose an instrument in the register first."));
        return;
    }
    history()->reload();
    history_->showInstrument(*id);
    showPage(Page::History);
}

std::optional<std::int64_t> MainWindow::sessionOnShow() const {
    if (review_ != nullptr && pages_->currentWidget() == review_) {
        return review_->sessionId();
    }
    if (history_ != nullptr && pages_->currentWidget() == history_) {
        return history_->selectedSession();
    }
    return bench_ != nullptr ? bench_->sessionId() : std::nullopt;
}

} // namespace mw::gui
