// What is due: instruments and reference standards due within the lab's window (or a number of
// days chosen here) and those overdue, most overdue first, each instrument with where it is and
// the reference standards its last calibration used (and whether those are in date now). The
// selection is core's (core/interval/due.h) through storage's dueReport; the page lays it out.
#pragma once

#include "storage/due_query.h"

#include <QWidget>

#include <optional>

class QLabel;
class QSpinBox;
class QTableWidget;

namespace mw::gui {

class Workspace;

class DuePage : public QWidget {
    Q_OBJECT
public:
    enum InstrumentColumn { Tag, Description, Location, DueDate, State, StandardsUsed, Columns };
    enum StandardColumn {
        StandardTag,
        StandardDescription,
        Certificate,
        StandardDue,
        StandardState,
        StandardColumns
    };

    explicit DuePage(Workspace& workspace, QWidget* parent = nullptr);

    // Reads the list again for today (the window follows the lab's setting until changed here).
    void reload();
    void setWindowDays(int days);
    const std::optional<storage::DueReport>& report() const { return report_; }

    QTableWidget* instruments() const { return instruments_; }
    QTableWidget* standards() const { return standards_; }
    QSpinBox* windowDays() const { return days_; }

signals:
    void statusMessage(const QString& text);
    void historyRequested(qint64 instrumentId);

private:
    void fill();

    Workspace& workspace_;
    std::optional<storage::DueReport> report_;
    bool windowChosen_ = false;
    QSpinBox* days_ = nullptr;
    QLabel* summary_ = nullptr;
    QTableWidget* instruments_ = nullptr;
    QTableWidget* standards_ = nullptr;
};

// "overdue by 12 days", "due today", "due in 5 days", "never calibrated".
QString dueStateText(const DueEntry& entry);

} // namespace mw::gui
