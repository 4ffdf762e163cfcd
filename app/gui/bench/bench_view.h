// The bench: one calibration in progress. A caution banner when a test value is hazardous, the
// session's header, the range and phase chooser, the keyboard-first grid of test points with
// each point's results, the overall outcome and statement of conformity, and beside them the
// chart, the point's budget, the advice, resistor checks, adjustment notes and the session log.
// Every number comes from the session evaluator; every change goes through the edits facade.
#pragma once

#include "app/gui/bench/bench_session.h"

#include <QWidget>

#include <memory>
#include <optional>

class QButtonGroup;
class QComboBox;
class QLabel;
class QPushButton;
class QTabWidget;
class QToolButton;

namespace mw::gui {

class AdvicePanel;
class BudgetPanel;
class NotesPanel;
class ReadingGridModel;
class ReadingGridView;
class ResistorPanel;
class SessionChartView;
class SessionLogPanel;
class Workspace;

class BenchView : public QWidget {
    Q_OBJECT
public:
    explicit BenchView(Workspace& workspace, QWidget* parent = nullptr);
    ~BenchView() override;

    // Shows a session (throws WorkbookError when it cannot be read); closeSession() empties it.
    void openSession(std::int64_t sessionId);
    void closeSession();
    std::optional<std::int64_t> sessionId() const;
    const BenchSession* bench() const { return bench_.get(); }

    void showRange(std::int64_t rangeId, Phase phase);
    // For showing finished work read-only (review, history): hides the buttons that change
    // the plan or the session, and says `emptyText` when nothing is open.
    void setViewOnly(const QString& emptyText);

    // Submits after checking completeness; false with the reason in `message` (what is missing,
    // or what the workbook refused). Asks nothing: the window confirms before calling it.
    bool submit(QString* message);
    // Adds a point at a value typed as on the bench (the range's unit is implied).
    bool addPoint(const QString& nominal, QString* message);
    bool moveCurrentPoint(const QString& value, QString* message);
    bool removeCurrentPoint(QString* message);
    // Saves a value still being typed in the grid (see ReadingGridView::finishEditing).
    void finishEditing();

    ReadingGridView* grid() const { return grid_; }
    ReadingGridModel* gridModel() const { return model_; }
    SessionChartView* chart() const { return chart_; }
    BudgetPanel* budget() const { return budget_; }
    AdvicePanel* advice() const { return advice_; }
    ResistorPanel* resistors() const { return resistors_; }
    NotesPanel* notes() const { return notes_; }
    SessionLogPanel* log() const { return log_; }
    QString overallText() const;
    QString statementText() const;
    QString cautionText() const;
    bool cautionShown() const;

signals:
    void statusMessage(const QString& text);
    void setupRequested();      // the window opens the set-up dialog
    void submitRequested();     // the window confirms and calls submit()
    void sessionStateChanged(); // submitted (or otherwise changed state)

private:
    void build();
    void connectPointActions();
    void reload(bool withRegister = false);
    void refresh();
    void refreshResults();
    void showCurrentPointBudget();
    void fillRanges();
    Phase chosenPhase() const;

    Workspace& workspace_;
    std::unique_ptr<BenchSession> bench_;
    QString emptyText_;
    QLabel* caution_ = nullptr;
    QLabel* header_ = nullptr;
    QComboBox* range_ = nullptr;
    QToolButton* asFound_ = nullptr;
    QToolButton* asLeft_ = nullptr;
    QButtonGroup* phaseGroup_ = nullptr;
    QPushButton* addPoint_ = nullptr;
    QPushButton* movePoint_ = nullptr;
    QPushButton* removePoint_ = nullptr;
    QPushButton* setup_ = nullptr;
    QPushButton* submit_ = nullptr;
    ReadingGridView* grid_ = nullptr;
    ReadingGridModel* model_ = nullptr;
    QLabel* overall_ = nullptr;
    QLabel* statement_ = nullptr;
    QTabWidget* tabs_ = nullptr;
    SessionChartView* chart_ = nullptr;
    BudgetPanel* budget_ = nullptr;
    AdvicePanel* advice_ = nullptr;
    ResistorPanel* resistors_ = nullptr;
    NotesPanel* notes_ = nullptr;
    SessionLogPanel* log_ = nullptr;
};

} // namespace mw::gui
