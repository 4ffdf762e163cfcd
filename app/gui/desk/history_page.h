// One meter over the years, for the supervisor: every calibration newest first (open one
// read-only, follow an amended record to the revision that replaced it, amend an approved
// record with a reason), the drift of each test point with its projection to the limit, and
// the interval the engine recommends beside the one registered, which an administrator can
// adopt. Every number is core's (buildHistory); the page lays it out.
#pragma once

#include "core/history/instrument_history.h"
#include "core/model/instrument.h"

#include <QWidget>

#include <cstdint>
#include <optional>

class QComboBox;
class QLabel;
class QPushButton;
class QTableWidget;

namespace mw::gui {

class DriftChartView;
class Workspace;

class HistoryPage : public QWidget {
    Q_OBJECT
public:
    enum Column {
        Started,
        Approved,
        Revision,
        State,
        AsFound,
        AsLeft,
        Worst,
        Technician,
        Reviewer,
        ColumnCount
    };

    explicit HistoryPage(Workspace& workspace, QWidget* parent = nullptr);

    // Fills the instrument chooser again (keeping the instrument shown) and rebuilds its history.
    void reload();
    // Shows the history of one instrument; false when it cannot be read (the reason is sent
    // as a status message).
    bool showInstrument(std::int64_t instrumentId);
    std::optional<std::int64_t> instrumentId() const;
    const InstrumentHistory* history() const;

    // Selects a calibration's row (false when the instrument has no such session).
    bool selectSession(std::int64_t sessionId);
    std::optional<std::int64_t> selectedSession() const;
    // Shows one test point's drift (index into history()->points) or, with nullopt, all.
    void showDriftOf(std::optional<int> pointIndex);

    // Starts an amendment of the selected approved record with `reason` (required); returns the
    // new revision's session, or nullopt with the reason in `message`.
    std::optional<std::int64_t> amendSelected(const QString& reason, QString* message);
    // Sets the instrument's interval to the recommended one (administrators; an audited edit).
    bool adoptRecommendation(QString* message);

    QTableWidget* calibrations() const { return table_; }
    QComboBox* pointChooser() const { return point_; }
    DriftChartView* chart() const { return chart_; }
    QLabel* driftSummary() const { return driftSummary_; }
    QLabel* recordLine() const { return recordLine_; }
    QLabel* intervalText() const { return interval_; }
    QTableWidget* intervalSteps() const { return steps_; }
    QPushButton* adoptButton() const { return adopt_; }
    QPushButton* amendButton() const { return amend_; }
    QPushButton* successorButton() const { return successor_; }

signals:
    void statusMessage(const QString& text);
    void openRequested(qint64 sessionId);  // show a calibration read-only (on the bench)
    void amendStarted(qint64 sessionId);   // a new revision to work on at the bench
    void printRequested(qint64 sessionId); // the record of one calibration
    void historyPrintRequested(qint64 instrumentId, bool toPdf);
    void instrumentChanged(qint64 instrumentId); // its interval was adopted

private:
    void build();
    QWidget* buildDrift(QWidget* parent);
    QWidget* buildInterval(QWidget* parent);
    void fillTable();
    void fillPoints();
    void fillInterval();
    void updateRecordActions();
    void askToAmend();
    void askToAdopt();
    const HistoryRow* row(std::int64_t sessionId) const;

    Workspace& workspace_;
    std::optional<Instrument> instrument_;
    std::optional<InstrumentHistory> history_;
    QComboBox* instruments_ = nullptr;
    QTableWidget* table_ = nullptr;
    QLabel* recordLine_ = nullptr;
    QPushButton* open_ = nullptr;
    QPushButton* successor_ = nullptr;
    QPushButton* amend_ = nullptr;
    QPushButton* printRecord_ = nullptr;
    QComboBox* point_ = nullptr;
    DriftChartView* chart_ = nullptr;
    QLabel* driftSummary_ = nullptr;
    QLabel* interval_ = nullptr;
    QTableWidget* steps_ = nullptr;
    QLabel* method_ = nullptr;
    QPushButton* adopt_ = nullptr;
};

} // namespace mw::gui
