// The main window: menus, the instrument register and the status bar.
#include "app/gui/main_window.h"

#include "app/gui/about_dialog.h"
#include "app/gui/instrument_list_model.h"

#include <QAction>
#include <QApplication>
#include <QHeaderView>
#include <QLabel>
#include <QMenuBar>
#include <QStackedWidget>
#include <QStatusBar>
#include <QTableView>
#include <QVBoxLayout>

namespace mw::gui {

MainWindow::MainWindow(QWidget* parent)
    : QMainWindow(parent) {
    setObjectName(QStringLiteral("mainWindow"));
    setWindowTitle(tr("Meterwright"));
    setWindowIcon(QIcon(QStringLiteral(":/icons/meterwright.svg")));
    buildMenus();
    buildRegister();
    statusBar()->showMessage(tr("No workbook open"));
    resize(1100, 700);
}

void MainWindow::buildMenus() {
    QMenu* workbookMenu = menuBar()->addMenu(tr("&Workbook"));
    QAction* quit = workbookMenu->addAction(tr("&Quit"));
    quit->setShortcut(QKeySequence::Quit);
    connect(quit, &QAction::triggered, this, &QWidget::close);

    QMenu* helpMenu = menuBar()->addMenu(tr("&Help"));
    QAction* about = helpMenu->addAction(tr("&About Meterwright"));
    connect(about, &QAction::triggered, this, &MainWindow::showAbout);
}

void MainWindow::buildRegister() {
    auto* stack = new QStackedWidget(this);
    stack->setObjectName(QStringLiteral("registerStack"));

    instrumentModel_ = new InstrumentListModel(this);
    instrumentView_ = new QTableView(stack);
    instrumentView_->setObjectName(QStringLiteral("instrumentList"));
    instrumentView_->setModel(instrumentModel_);
    instrumentView_->setSelectionBehavior(QAbstractItemView::SelectRows);
    instrumentView_->setSelectionMode(QAbstractItemView::SingleSelection);
    instrumentView_->horizontalHeader()->setStretchLastSection(true);
    instrumentView_->verticalHeader()->hide();

    emptyStateLabel_ = new QLabel(tr("<p><b>No instruments to show.</b></p>"
                                     "<p>Open a workbook to see its register of instruments.</p>"),
                                  stack);
    emptyStateLabel_->setObjectName(QStringLiteral("emptyState"));
    emptyStateLabel_->setAlignment(Qt::AlignCenter);

    stack->addWidget(instrumentView_);
    stack->addWidget(emptyStateLabel_);
    setCentralWidget(stack);

    connect(instrumentModel_, &QAbstractItemModel::modelReset, this, &MainWindow::updateEmptyState);
    updateEmptyState();
}

void MainWindow::updateEmptyState() {
    auto* stack = static_cast<QStackedWidget*>(centralWidget());
    stack->setCurrentWidget(instrumentModel_->rowCount() == 0
                                ? static_cast<QWidget*>(emptyStateLabel_)
                                : static_cast<QWidget*>(instrumentView_));
}

void MainWindow::showAbout() {
    AboutDialog dialog(this);
    dialog.exec();
}

} // namespace mw::gui
