// The register page.
#include "app/gui/register_page.h"

#include "app/gui/instrument_detail_panel.h"
#include "app/gui/instrument_list_model.h"
#include "app/gui/register_filter.h"
#include "app/gui/register_rows.h"
#include "app/gui/workspace.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"

#include <QComboBox>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLineEdit>
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
    filter_ = new RegisterFilter(this);
    filter_->setSourceModel(model_);
    auto* left = new QWidget(splitter);
    auto* leftLayout = new QVBoxLayout(left);
    leftLayout->setContentsMargins(0, 0, 0, 0);
    leftLayout->addLayout(buildFilterBar());
    list_ = new QTableView(left);
    leftLayout->addWidget(list_, 1);
    list_->setObjectName(QStringLiteral("instrumentList"));
    list_->setModel(filter_);
    list_->setSortingEnabled(true);
    list_->sortByColumn(InstrumentListModel::AssetTag, Qt::AscendingOrder);
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
    openNote_->setObjectName(QStringLiteral("registerOpenNote"));
    openNote_->setWordWrap(true);
    rightLayout->addWidget(openNote_);
    auto* buttons = new QHBoxLayout;
    add_ = new QPushButton(tr("New instrument…"), right);
    add_->setObjectName(QStringLiteral("addInstrument"));
    edit_ = new QPushButton(tr("Edit…"), right);
    edit_->setObjectName(QStringLiteral("editInstrument"));
    buttons->addWidget(add_);
    buttons->addWidget(edit_);
    start_ = new QPushButton(tr("Start calibration…"), right);
    start_->setObjectName(QStringLiteral("startCalibration"));
    open_ = new QPushButton(tr("Continue calibration"), right);
    open_->setObjectName(QStringLiteral("openCalibration"));
    buttons->addStretch();
    buttons->addWidget(open_);
    buttons->addWidget(start_);
    rightLayout->addLayout(buttons);
    splitter->addWidget(left);
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
    connect(add_, &QPushButton::clicked, this, [this] { emit editRequested(std::nullopt); });
    connect(edit_, &QPushButton::clicked, this, [this] {
        if (const auto id = selectedInstrument()) {
            emit editRequested(*id);
        }
    });
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
    model_->setRows(buildRegisterRows(instruments.all(), instruments.dueList(), open, today,
                                      storage::SessionRepository(workbook).latestApprovedOutcomes(),
                                      workspace_.lab().due_window_days));
    fillLocations();
    detail_->showInstrument(std::nullopt);
    // The selection stays on the same instrument across reloads (when the filter shows it).
    if (!previous || !selectInstrument(*previous)) {
        if (filter_->rowCount() > 0) {
            list_->setCurrentIndex(filter_->index(0, 0));
        }
    }
    updateActions();
}

std::optional<std::int64_t> RegisterPage::selectedInstrument() const {
    const QModelIndex current = list_->currentIndex();
    if (!current.isValid()) {
        return std::nullopt;
    }
    return current.siblingAtColumn(0).data(Qt::UserRole).toLongLong();
}

bool RegisterPage::selectInstrument(std::int64_t instrumentId) {
    for (int i = 0; i < filter_->rowCount(); ++i) {
        const QModelIndex index = filter_->index(i, 0);
        if (index.data(Qt::UserRole).toLongLong() == instrumentId) {
            list_->setCurrentIndex(index);
            return true;
        }
    }
    return false;
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
            return selectInstrument(model_->rowAt(i).instrumentId);
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
    const bool administer = workspace_.can(Capability::Administer) && workspace_.isOpen() &&
                            !workspace_.workbook()->isReadOnly();
    add_->setEnabled(administer);
    edit_->setEnabled(administer && selectedInstrument().has_value());
    const QString why = workspace_.user() ? tr("Only an administrator edits the register.")
                                          : tr("Sign in to edit the register.");
    add_->setToolTip(administer ? QString() : why);
    edit_->setToolTip(administer ? QString() : why);
    open_->setEnabled(open.has_value() && workspace_.user().has_value());
    QString note = open ? tr("This instrument has a calibration open: continue it (or view "
                             "it while it awaits review) rather than start another.")
                        : QString();
    if (open) {
        try {
            // The reviewer's reason belongs where the technician looks first.
            const auto session = storage::SessionRepository(*workspace_.workbook()).find(*open);
            if (session && session->state == SessionState::Returned &&
                !session->return_comment.empty()) {
                note = tr("↩ Returned by the reviewer: %1")
                           .arg(QString::fromStdString(session->return_comment));
            }
        } catch (const std::exception&) {
            // The note is a courtesy; opening the session reports what cannot be read.
        }
    }
    openNote_->setText(note);
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

QHBoxLayout* RegisterPage::buildFilterBar() {
    auto* bar = new QHBoxLayout;
    search_ = new QLineEdit(this);
    search_->setObjectName(QStringLiteral("registerSearch"));
    search_->setPlaceholderText(tr("Find: tag, description, location…"));
    search_->setClearButtonEnabled(true);
    kindFilter_ = new QComboBox(this);
    kindFilter_->setObjectName(QStringLiteral("kindFilter"));
    kindFilter_->addItem(tr("All kinds"), -1);
    for (InstrumentKind kind : {InstrumentKind::DcVoltmeter, InstrumentKind::DcAmmeter,
                                InstrumentKind::HalfWaveAcVoltmeter,
                                InstrumentKind::BridgeAcVoltmeter, InstrumentKind::MultiRange}) {
        kindFilter_->addItem(QString::fromUtf8(displayName(kind).data()), int(kind));
    }
    locationFilter_ = new QComboBox(this);
    locationFilter_->setObjectName(QStringLiteral("locationFilter"));
    dueFilter_ = new QComboBox(this);
    dueFilter_->setObjectName(QStringLiteral("dueFilter"));
    using Due = RegisterFilter::DueChoice;
    dueFilter_->addItem(tr("Any due state"), int(Due::Any));
    dueFilter_->addItem(tr("Overdue or never calibrated"), int(Due::NeedsAttention));
    dueFilter_->addItem(tr("Due soon"), int(Due::DueSoon));
    dueFilter_->addItem(tr("In date"), int(Due::InDate));
    dueFilter_->addItem(tr("Retired"), int(Due::Retired));
    outcomeFilter_ = new QComboBox(this);
    outcomeFilter_->setObjectName(QStringLiteral("outcomeFilter"));
    outcomeFilter_->addItem(tr("Any last outcome"), QVariant());
    for (Outcome outcome :
         {Outcome::Fail, Outcome::ConditionalFail, Outcome::ConditionalPass, Outcome::Pass}) {
        outcomeFilter_->addItem(QString::fromUtf8(displayName(outcome).data()), int(outcome));
    }
    outcomeFilter_->addItem(tr("Never approved"), -1);
    bar->addWidget(search_, 1);
    for (QComboBox* combo : {kindFilter_, locationFilter_, dueFilter_, outcomeFilter_}) {
        bar->addWidget(combo);
    }
    connect(search_, &QLineEdit::textChanged, filter_, &RegisterFilter::setText);
    connect(kindFilter_, &QComboBox::currentIndexChanged, this, [this] {
        const int kind = kindFilter_->currentData().toInt();
        filter_->setKind(kind < 0 ? std::nullopt : std::optional(kind));
    });
    connect(locationFilter_, &QComboBox::currentIndexChanged, this,
            [this] { filter_->setLocation(locationFilter_->currentData().toString()); });
    connect(dueFilter_, &QComboBox::currentIndexChanged, this, [this] {
        filter_->setDue(RegisterFilter::DueChoice(dueFilter_->currentData().toInt()));
    });
    connect(outcomeFilter_, &QComboBox::currentIndexChanged, this, [this] {
        const QVariant outcome = outcomeFilter_->currentData();
        filter_->setOutcome(outcome.isValid() ? std::optional(outcome.toInt()) : std::nullopt);
    });
    return bar;
}

void RegisterPage::fillLocations() {
    const QString chosen = locationFilter_->currentData().toString();
    QStringList locations;
    for (int i = 0; i < model_->rowCount(); ++i) {
        if (!model_->rowAt(i).location.isEmpty() &&
            !locations.contains(model_->rowAt(i).location)) {
            locations << model_->rowAt(i).location;
        }
    }
    locations.sort(Qt::CaseInsensitive);
    QSignalBlocker quiet(locationFilter_);
    locationFilter_->clear();
    locationFilter_->addItem(tr("Any location"), QString());
    for (const QString& location : locations) {
        locationFilter_->addItem(location, location);
    }
    const int index = locationFilter_->findData(chosen);
    locationFilter_->setCurrentIndex(index >= 0 ? index : 0);
    filter_->setLocation(locationFilter_->currentData().toString());
}

void RegisterPage::updateEmptyState() {
    stack_->setCurrentIndex(model_->rowCount() == 0 ? 1 : 0);
}

} // namespace mw::gui
