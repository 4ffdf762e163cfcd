// The register page.
#include "app/gui/register_page.h"

#include "app/gui/instrument_detail_panel.h"
#include "app/gui/instrument_list_model.h"
#include "app/gui/register_rows.h"
#include "app/gui/workspace.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"

#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QPushButton>
#include <QSplitter>
#include <QStackedWidget>
#include <QTableView>
#include <QVBoxLayout>

#include <chrono>

namespace mw::gui {

RegisterPage::RegisterPage(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("registerPage"));
    auto* layout = new QVBoxLayout(this);
    layout->setContentsMargins(0, 0, 0, 0);
    stack_ = new QStackedWidget(this);
    stack_->setObjectName(QStringLiteral("registerStack"));
    auto* splitter = new QSplitter(Qt::Horizontal, stack_);
    model_ = new InstrumentListModel(this);
    list_ = new QTableView(splitter);
    list_->setObjectName(QStringLiteral("instrumentList"));
    list_->setModel(model_);
    list_->setSelectionBehavior(QAbstractItemView::SelectRows);
    list_->setSelectionMode(QAbstractItemView::SingleSelection);
    list_->horizontalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);
    list_->horizontalHeader()->setSectionResizeMode(InstrumentListModel::Description,
                                                    QHeaderView::Stretch);
    list_->horizontalHeader()->setSectionResizeMode(InstrumentListModel::Kind,
                                                    QHeaderView::Interactive);
    list_->horizontalHeader()->resizeSection(InstrumentListModel::Kind, 150);
    list_->verticalHeader()->hide();
    list_->verticalHeader()->setDefaultSectionSize(fontMetrics().height() + 8);
    list_->setWordWrap(false);
    list_->setTextElideMode(Qt::ElideRight);
    auto* right = new QWidget(splitter);
    auto* rightLayout = new QVBoxLayout(right);
    rightLayout->setContentsMargins(0, 0, 0, 0);
    detail_ = new InstrumentDetailPanel(right);
    rightLayout->addWidget(detail_, 1);
    openNote_ = new QLabel(right);
    openNote_->setWordWrap(true);
    rightLayout->addWidget(openNote_);
    auto* buttons = new QHBoxLayout;
    start_ = new QPushButton(tr("Start calibration…"), right);
    start_->setObjectName(QStringLiteral("startCalibration"));
    open_ = new QPushButton(tr("Continue calibration"), right);
    open_->setObjectName(QStringLiteral("openCalibration"));
    buttons->addStretch();
    buttons->addWidget(open_);
    buttons->addWidget(start_);
    rightLayout->addLayout(buttons);
    splitter->addWidget(list_);
    splitter->addWidget(right);
    splitter->setStretchFactor(0, 3);
    splitter->setStretchFactor(1, 2);
    splitter->setSizes({800, 380});
    auto* empty = new QLabel(
        tr("<p><b>No instruments to show.</b></p>"
           "<p>Open a workbook (Workbook → Open…) to see its register of instruments.</p>"),
        stack_);
    empty->setObjectName(QStringLiteral("emptyState"));
    empty->setAlignment(Qt::AlignCenter);
    stack_->addWidget(splitter);
    stack_->addWidget(empty);
    layout->addWidget(stack_);

    connect(model_, &QAbstractItemModel::modelReset, this, &RegisterPage::updateEmptyState);
    connect(list_->selectionModel(), &QItemSelectionModel::currentRowChanged, this,
            &RegisterPage::showSelected);
    connect(list_, &QTableView::doubleClicked, this, [this] {
        if (open_->isEnabled()) {
            open_->click();
        }
    });
    connect(start_, &QPushButton::clicked, this, [this] {
        if (const auto id = selectedInstrument()) {
            emit startRequested(*id);
        }
    });
    connect(open_, &QPushButton::clicked, this, [this] {
        if (const auto id = openSessionOfSelected()) {
            emit openRequested(*id);
        }
    });
    updateEmptyState();
    updateActions();
}

void RegisterPage::reload() {
    const auto previous = selectedInstrument();
    if (!workspace_.isOpen()) {
        model_->setRows({});
        detail_->showInstrument(std::nullopt);
        updateActions();
        return;
    }
    storage::Workbook& workbook = *workspace_.workbook();
    const storage::InstrumentRepository instruments(workbook);
    const auto today = std::chrono::floor<std::chrono::days>(std::chrono::system_clock::now());
    OpenCalibrations open;
    for (const storage::OpenSession& session :
         storage::SessionRepository(workbook).openSessions()) {
        open[session.instrument_id] = session.state;
    }
    model_->setRows(buildRegisterRows(instruments.all(), instruments.dueList(), open, today));
    detail_->showInstrument(std::nullopt);
    int row = 0;
    for (int i = 0; i < model_->rowCount(); ++i) {
        if (previous && model_->rowAt(i).instrumentId == *previous) {
            row = i;
        }
    }
    if (model_->rowCount() > 0) {
        list_->setCurrentIndex(model_->index(row, 0));
    }
    updateActions();
}

std::optional<std::int64_t> RegisterPage::selectedInstrument() const {
    const QModelIndex current = list_->currentIndex();
    if (!current.isValid() || current.row() >= model_->rowCount()) {
        return std::nullopt;
    }
    return model_->rowAt(current.row()).instrumentId;
}

std::optional<std::int64_t> RegisterPage::openSessionOfSelected() const {
    const auto instrument = selectedInstrument();
    if (!instrument || !workspace_.isOpen()) {
        return std::nullopt;
    }
    const auto open = storage::SessionRepository(*workspace_.workbook()).openSessions(*instrument);
    return open.empty() ? std::nullopt : std::optional(open.back().id);
}

bool RegisterPage::selectByTag(const QString& tag) {
    for (int i = 0; i < model_->rowCount(); ++i) {
        if (model_->rowAt(i).assetTag == tag) {
            list_->setCurrentIndex(model_->index(i, 0));
            return true;
        }
    }
    return false;
}

void RegisterPage::showSelected() {
    const auto id = selectedInstrument();
    try {
        detail_->showInstrument(
            id && workspace_.isOpen()
                ? storage::InstrumentRepository(*workspace_.workbook()).find(*id)
                : std::nullopt);
    } catch (const std::exception& failure) {
        detail_->showInstrument(std::nullopt);
        emit statusMessage(tr("This instrument could not be read: %1").arg(failure.what()));
    }
    updateActions();
}

void RegisterPage::updateActions() {
    std::optional<std::int64_t> open;
    try {
        open = openSessionOfSelected();
    } catch (const std::exception&) {
        open.reset();
    }
    const bool calibrate = workspace_.can(Capability::Calibrate) && workspace_.isOpen() &&
                           !workspace_.workbook()->isReadOnly();
    start_->setEnabled(calibrate && selectedInstrument().has_value() && !open);
    open_->setEnabled(open.has_value() && workspace_.user().has_value());
    openNote_->setText(open ? tr("This instrument has a calibration open: continue it (or view "
                                 "it while it awaits review) rather than start another.")
                            : QString());
    if (!workspace_.user()) {
        start_->setToolTip(tr("Sign in to calibrate."));
    } else if (!workspace_.can(Capability::Calibrate)) {
        start_->setToolTip(
            tr("Your role (%1) does not calibrate; a technician does.")
                .arg(QString::fromUtf8(displayName(workspace_.user()->role).data())));
    } else {
        start_->setToolTip(QString());
    }
}

void RegisterPage::updateEmptyState() {
    stack_->setCurrentIndex(model_->rowCount() == 0 ? 1 : 0);
}

} // namespace mw::gui
