// The bench screen: layout, and keeping every part in step with the saved session.
#include "app/gui/bench/bench_view.h"

#include "app/gui/bench/reading_grid_model.h"
#include "app/gui/bench/reading_grid_view.h"
#include "app/gui/bench/results_panels.h"
#include "app/gui/bench/session_chart_view.h"
#include "app/gui/bench/work_panels.h"
#include "app/gui/safety_notice.h"
#include "app/gui/session_edits.h"
#include "app/gui/status_icons.h"
#include "app/gui/workspace.h"
#include "core/evaluation/session_chart.h"
#include "core/units/quantity.h"
#include "storage/session_repository.h"
#include "storage/sql_support.h"
#include "storage/user_repository.h"

#include <QButtonGroup>
#include <QComboBox>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QPushButton>
#include <QSplitter>
#include <QTabWidget>
#include <QToolButton>
#include <QVBoxLayout>

#include <algorithm>
#include <chrono>
#include <cmath>

namespace mw::gui {
namespace {

// Where the session stands among the revisions of its record.
QString revisionLine(const CalibrationSession& s) {
    QString line;
    if (s.supersedes_id) {
        line += QObject::tr("<br>Revision %1: amends an earlier record — %2")
                    .arg(s.revision)
                    .arg(QString::fromStdString(s.amendment_reason).toHtmlEscaped());
    }
    if (s.state == SessionState::Superseded) {
        line += QObject::tr("<br><b>⊘ Superseded:</b> a later revision replaces this record; "
                            "the instrument's history links to it.");
    }
    return line;
}

QString text(std::string_view value) {
    return QString::fromUtf8(value.data(), qsizetype(value.size()));
}

QString unitLabel(const RangeSpec& range) {
    const double top = std::max(std::fabs(range.lower_limit), std::fabs(range.full_scale));
    const int power = top > 0.0 ? int(std::floor(std::log10(top) / 3.0)) * 3 : 0;
    const QString prefix = power == -6   ? QStringLiteral("µ")
                           : power == -3 ? QStringLiteral("m")
                           : power == 3  ? QStringLiteral("k")
                                         : QString();
    return prefix + text(unitSymbol(range.unit));
}

} // namespace

BenchView::BenchView(Workspace& workspace, QWidget* parent)
    : QWidget(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("bench"));
    build();
    ChangeNotifier* notifier = workspace_.notifier();
    auto mine = [this](qint64 sessionId) {
        return bench_ && bench_->id() == sessionId;
    };
    connect(notifier, &ChangeNotifier::readingsChanged, this,
            [this, mine](qint64 id, const QList<ReadingKey>&) {
                if (mine(id)) {
                    reload();
                }
            });
    for (auto signal :
         {&ChangeNotifier::detailsChanged, &ChangeNotifier::notesChanged,
          &ChangeNotifier::resistorChecksChanged, &ChangeNotifier::sessionStateChanged}) {
        connect(notifier, signal, this, [this, mine](qint64 id) {
            if (mine(id)) {
                reload(true);
            }
        });
    }
    connect(notifier, &ChangeNotifier::planChanged, this, [this, mine](qint64 id, qint64) {
        if (mine(id)) {
            reload();
        }
    });
    connect(notifier, &ChangeNotifier::editRefused, this, &BenchView::statusMessage);
}

BenchView::~BenchView() = default;

void BenchView::build() {
    auto* layout = new QVBoxLayout(this);
    caution_ = new QLabel(this);
    caution_->setObjectName(QStringLiteral("hazardBanner"));
    caution_->setWordWrap(true);
    caution_->setFrameShape(QFrame::Box);
    caution_->setMargin(6);
    caution_->setAutoFillBackground(true);
    QPalette warn = caution_->palette();
    warn.setColor(QPalette::Window, QColor(0xff, 0xe0, 0x8a));
    warn.setColor(QPalette::WindowText, Qt::black);
    caution_->setPalette(warn);
    caution_->hide();
    layout->addWidget(caution_);
    header_ = new QLabel(this);
    header_->setObjectName(QStringLiteral("benchHeader"));
    header_->setWordWrap(true);
    header_->setTextFormat(Qt::RichText);
    layout->addWidget(header_);

    auto* controls = new QHBoxLayout;
    range_ = new QComboBox(this);
    range_->setObjectName(QStringLiteral("benchRange"));
    asFound_ = new QToolButton(this);
    asFound_->setText(tr("As found"));
    asLeft_ = new QToolButton(this);
    asLeft_->setText(tr("As left"));
    phaseGroup_ = new QButtonGroup(this);
    for (QToolButton* button : {asFound_, asLeft_}) {
        button->setCheckable(true);
        button->setAutoRaise(false);
        phaseGroup_->addButton(button);
    }
    asFound_->setChecked(true);
    addPoint_ = new QPushButton(tr("Add point…"), this);
    movePoint_ = new QPushButton(tr("Move point…"), this);
    removePoint_ = new QPushButton(tr("Remove point"), this);
    setup_ = new QPushButton(tr("Set-up…"), this);
    submit_ = new QPushButton(tr("Submit for review…"), this);
    submit_->setObjectName(QStringLiteral("benchSubmit"));
    controls->addWidget(new QLabel(tr("Range:"), this));
    controls->addWidget(range_);
    controls->addSpacing(12);
    controls->addWidget(asFound_);
    controls->addWidget(asLeft_);
    controls->addSpacing(12);
    controls->addWidget(addPoint_);
    controls->addWidget(movePoint_);
    controls->addWidget(removePoint_);
    controls->addStretch();
    controls->addWidget(setup_);
    controls->addWidget(submit_);
    layout->addLayout(controls);

    auto* splitter = new QSplitter(Qt::Horizontal, this);
    auto* left = new QWidget(splitter);
    auto* leftLayout = new QVBoxLayout(left);
    leftLayout->setContentsMargins(0, 0, 0, 0);
    grid_ = new ReadingGridView(left);
    model_ = new ReadingGridModel(workspace_, this);
    grid_->setModel(model_);
    leftLayout->addWidget(grid_, 1);
    auto* outcomeRow = new QHBoxLayout;
    overall_ = new QLabel(left);
    overall_->setObjectName(QStringLiteral("benchOverall"));
    overall_->setTextFormat(Qt::RichText);
    outcomeRow->addWidget(overall_, 1);
    leftLayout->addLayout(outcomeRow);
    statement_ = new QLabel(left);
    statement_->setObjectName(QStringLiteral("benchStatement"));
    statement_->setWordWrap(true);
    statement_->setTextInteractionFlags(Qt::TextSelectableByMouse);
    leftLayout->addWidget(statement_);
    tabs_ = new QTabWidget(splitter);
    chart_ = new SessionChartView(tabs_);
    budget_ = new BudgetPanel(tabs_);
    advice_ = new AdvicePanel(tabs_);
    resistors_ = new ResistorPanel(workspace_, tabs_);
    notes_ = new NotesPanel(workspace_, tabs_);
    log_ = new SessionLogPanel(workspace_, tabs_);
    tabs_->addTab(chart_, tr("Chart"));
    tabs_->addTab(budget_, tr("Budget"));
    tabs_->addTab(advice_, tr("Advice"));
    tabs_->addTab(resistors_, tr("Resistors"));
    tabs_->addTab(notes_, tr("Adjustments"));
    tabs_->addTab(log_, tr("Log"));
    splitter->addWidget(left);
    splitter->addWidget(tabs_);
    splitter->setStretchFactor(0, 3);
    splitter->setStretchFactor(1, 2);
    splitter->setSizes({780, 500});
    layout->addWidget(splitter, 1);

    connect(range_, &QComboBox::currentIndexChanged, this, [this] { refresh(); });
    connect(phaseGroup_, &QButtonGroup::buttonClicked, this, [this] { refresh(); });
    connect(grid_->selectionModel(), &QItemSelectionModel::currentChanged, this,
            &BenchView::showCurrentPointBudget);
    connect(model_, &ReadingGridModel::entryRefused, this, &BenchView::statusMessage);
    connect(resistors_, &ResistorPanel::statusMessage, this, &BenchView::statusMessage);
    connect(notes_, &NotesPanel::statusMessage, this, &BenchView::statusMessage);
    connectPointActions();
    connect(setup_, &QPushButton::clicked, this, &BenchView::setupRequested);
    connect(submit_, &QPushButton::clicked, this, &BenchView::submitRequested);
}

void BenchView::setViewOnly(const QString& emptyText) {
    emptyText_ = emptyText;
    for (QWidget* w :
         std::initializer_list<QWidget*>{addPoint_, movePoint_, removePoint_, setup_, submit_}) {
        w->hide();
    }
    refresh();
}

void BenchView::openSession(std::int64_t sessionId) {
    bench_ = std::make_unique<BenchSession>(workspace_, sessionId);
    model_->setDecimalComma(workspace_.lab().decimal_comma);
    fillRanges();
    asFound_->setChecked(bench_->session().phases != PhasePlan::AsLeft);
    asLeft_->setChecked(bench_->session().phases == PhasePlan::AsLeft);
    refresh();
    grid_->setFocus();
    grid_->setCurrentIndex(model_->index(0, ReadingGridModel::Indicated));
}

void BenchView::closeSession() {
    grid_->finishEditing();
    bench_.reset();
    range_->clear();
    refresh();
}

std::optional<std::int64_t> BenchView::sessionId() const {
    return bench_ ? std::optional(bench_->id()) : std::nullopt;
}

void BenchView::fillRanges() {
    const QVariant current = range_->currentData();
    QSignalBlocker block(range_);
    range_->clear();
    if (!bench_) {
        return;
    }
    for (const RangeSpec* range : bench_->plannedRanges()) {
        range_->addItem(text(range->label), qint64(range->id));
    }
    const int index = range_->findData(current);
    range_->setCurrentIndex(index >= 0 ? index : 0);
}

Phase BenchView::chosenPhase() const {
    return asLeft_->isChecked() ? Phase::AsLeft : Phase::AsFound;
}

void BenchView::showRange(std::int64_t rangeId, Phase phase) {
    range_->setCurrentIndex(range_->findData(qint64(rangeId)));
    (phase == Phase::AsFound ? asFound_ : asLeft_)->setChecked(true);
    refresh();
}

void BenchView::reload(bool withRegister) {
    if (!bench_) {
        return;
    }
    try {
        bench_->reload(withRegister);
    } catch (const std::exception& error) {
        emit statusMessage(tr("The session could not be read again: %1").arg(error.what()));
        return;
    }
    fillRanges();
    refresh();
}

void BenchView::refresh() {
    const bool open = bench_ != nullptr;
    for (QWidget* w :
         std::initializer_list<QWidget*>{range_, asFound_, asLeft_, addPoint_, movePoint_,
                                         removePoint_, setup_, submit_, grid_}) {
        w->setEnabled(open);
    }
    if (!open) {
        header_->setText(emptyText_.isEmpty()
                             ? tr("<b>No calibration open.</b> Choose an instrument in the "
                                  "register and start or continue its calibration.")
                             : emptyText_);
        caution_->hide();
        overall_->clear();
        statement_->clear();
        return;
    }
    const CalibrationSession& s = bench_->session();
    const Instrument& instrument = bench_->instrument();
    const bool editable = bench_->editable();
    for (QWidget* w :
         std::initializer_list<QWidget*>{addPoint_, movePoint_, removePoint_, setup_, submit_}) {
        w->setEnabled(editable);
    }
    const auto technician = storage::UserRepository(*workspace_.workbook()).find(s.technician_id);
    header_->setText(tr("<b>%1</b> — %2 · class %3 · %4<br>%5, started %6 by %7 · %8 · %9%10")
                         .arg(text(instrument.asset_tag).toHtmlEscaped(),
                              text(instrument.description).toHtmlEscaped())
                         .arg(instrument.accuracy_class)
                         .arg(text(displayName(instrument.scale_type)), text(displayName(s.state)),
                              storage::sql::toIso(s.started_at)
                                  .left(16)
                                  .replace(QLatin1Char('T'), QLatin1Char(' ')),
                              technician ? text(technician->full_name).toHtmlEscaped() : tr("?"),
                              text(displayName(s.phases)), text(displayName(s.decision_rule)))
                         .arg(s.return_comment.empty() || s.state != SessionState::Returned
                                  ? QString()
                                  : tr("<br><b>Returned by the reviewer:</b> %1")
                                        .arg(text(s.return_comment).toHtmlEscaped()))
                         .append(revisionLine(s)));
    const SessionEvaluation& evaluation = bench_->evaluation();
    if (evaluation.hazardCaution) {
        caution_->setText(QStringLiteral("⚠ ") + text(*evaluation.hazardCaution) +
                          QStringLiteral(" ") + safetyNoticeText());
        caution_->show();
    } else {
        caution_->hide();
    }
    const std::int64_t rangeId = range_->currentData().toLongLong();
    // A change of plan rebuilds the rows; the cursor stays on the reading it was on.
    const QModelIndex before = grid_->currentIndex();
    const std::optional<ReadingKey> keyBefore =
        before.isValid() && before.row() < model_->rowCount()
            ? std::optional(model_->keyAt(before.row()))
            : std::nullopt;
    model_->show(*bench_, rangeId, chosenPhase());
    if (keyBefore && !grid_->currentIndex().isValid()) {
        const int row = model_->rowOf(*keyBefore);
        if (row >= 0) {
            grid_->setCurrentIndex(model_->index(row, before.column()));
        }
    }
    const auto plan = effectivePlan(s);
    grid_->setColumnHidden(
        ReadingGridModel::Repeat,
        std::none_of(plan.begin(), plan.end(), [](const TestPoint& p) { return p.repeats > 1; }));
    const RangeSpec* range = bench_->range(rangeId);
    if (range != nullptr) {
        chart_->showChart(rangeChart(instrument, s, bench_->inputs(), evaluation, rangeId),
                          unitLabel(*range));
    }
    refreshResults();
    resistors_->showSession(*bench_);
    notes_->showSession(*bench_);
    log_->showSession(bench_->id());
}

void BenchView::refreshResults() {
    const SessionEvaluation& evaluation = bench_->evaluation();
    auto words = [](const std::optional<Outcome>& outcome) {
        return outcome ? text(displayName(*outcome)) : tr("—");
    };
    // Work still open is judged "so far"; submitted work has its outcome.
    const QString heading = bench_->editable() ? tr("Outcome so far") : tr("Outcome");
    overall_->setText(
        tr("<b>%1: %2</b> (as-found: %3, as-left: %4)%5")
            .arg(heading, words(evaluation.overall), words(evaluation.asFound),
                 words(evaluation.asLeft))
            .arg(evaluation.problems.empty()
                     ? QString()
                     : tr("<br>⚠ %1").arg(text(evaluation.problems.front()).toHtmlEscaped())));
    const std::int64_t rangeId = range_->currentData().toLongLong();
    const RangeEvaluation* shown = nullptr;
    for (const RangeEvaluation& part : evaluation.ranges) {
        if (part.rangeId == rangeId && part.phase == chosenPhase()) {
            shown = &part;
        }
    }
    const RangeSpec* range = bench_->range(rangeId);
    if (shown && shown->result) {
        QString statement = text(shown->result->statement);
        for (const std::string& caution : shown->result->cautions) {
            if (!shown->result->hazardCaution || caution != *shown->result->hazardCaution) {
                statement += QStringLiteral("\n⚠ ") + text(caution);
            }
        }
        statement_->setText(statement);
        advice_->showResult(shown->result, range ? range->unit : Unit::Volt,
                            range && range->unit == Unit::Ampere);
    } else {
        statement_->setText(shown ? text(shown->problem)
                                  : tr("No readings in this range and phase yet."));
        advice_->showResult(std::nullopt, Unit::Volt, false);
    }
    showCurrentPointBudget();
}

void BenchView::showCurrentPointBudget() {
    if (!bench_) {
        return;
    }
    const QModelIndex current = grid_->currentIndex();
    const RangeSpec* range = bench_->range(model_->rangeId());
    if (!current.isValid() || range == nullptr) {
        budget_->showPoint(std::nullopt, Unit::Volt, QString());
        return;
    }
    const ReadingKey key = model_->keyAt(current.row());
    for (const RangeEvaluation& part : bench_->evaluation().ranges) {
        if (part.rangeId != key.range_id || part.phase != key.phase || !part.result) {
            continue;
        }
        for (const PointResult& point : part.result->points) {
            if (point.pointIndex == key.point_index) {
                budget_->showPoint(
                    point, range->unit,
                    tr("point %1 (%2)")
                        .arg(key.point_index + 1)
                        .arg(text(formatEngineering(point.applied, 4, range->unit))));
                return;
            }
        }
    }
    budget_->showPoint(std::nullopt, range->unit, QString());
}

bool BenchView::submit(QString* message) {
    if (!bench_) {
        return false;
    }
    grid_->finishEditing();
    const std::vector<ReadingKey> missing =
        missingReadings(bench_->instrument(), bench_->session());
    if (!missing.empty()) {
        *message =
            tr("Not submitted: %1 of the plan %2 not taken yet: %3")
                .arg(missing.size() == 1 ? tr("one reading")
                                         : tr("%1 readings").arg(missing.size()))
                .arg(missing.size() == 1 ? tr("is") : tr("are"))
                .arg(text(describeMissing(bench_->instrument(), bench_->session(), missing)));
        return false;
    }
    if (bench_->session().standards.empty()) {
        *message = tr("Not submitted: no reference standard is chosen (Set-up…).");
        return false;
    }
    try {
        storage::SessionRepository sessions(*workspace_.workbook());
        const Timestamp now =
            std::chrono::floor<std::chrono::seconds>(std::chrono::system_clock::now());
        if (!bench_->session().finished_at) {
            CalibrationSession finished = bench_->session();
            finished.finished_at = now;
            sessions.updateDetails(finished);
        }
        const Outcome outcome = sessions.submit(bench_->id(), now);
        workspace_.undoStack()->clear(); // a submitted session is no longer the technician's
        *message = tr("Submitted for review. Outcome: %1.").arg(text(displayName(outcome)));
    } catch (const std::exception& error) {
        *message = tr("Not submitted: %1").arg(QString::fromUtf8(error.what()));
        reload(true);
        return false;
    }
    emit workspace_.notifier()->sessionStateChanged(bench_->id());
    emit sessionStateChanged();
    return true;
}

void BenchView::finishEditing() {
    grid_->finishEditing();
}

QString BenchView::overallText() const {
    return overall_->text();
}

QString BenchView::statementText() const {
    return statement_->text();
}

QString BenchView::cautionText() const {
    return caution_->text();
}

bool BenchView::cautionShown() const {
    return !caution_->isHidden();
}

} // namespace mw::gui
