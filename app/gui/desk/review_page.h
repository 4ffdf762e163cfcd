// The review desk: the calibrations waiting for a reviewer, and the one chosen shown read-only
// with the same grid, results, budgets, chart and advice as the bench. A reviewer approves it
// by signing with their password, or returns it with a comment. Technicians see the queue but
// cannot act on it; nobody approves or returns their own work (the workbook refuses it too).
#pragma once

#include "app/gui/sign_in_throttle.h"

#include <QWidget>

#include <cstdint>
#include <optional>

class QLabel;
class QPushButton;
class QTableWidget;

namespace mw::gui {

class BenchView;
class Workspace;

class ReviewPage : public QWidget {
    Q_OBJECT
public:
    enum Column { Instrument, Technician, Submitted, Outcome, Standards, ColumnCount };

    explicit ReviewPage(Workspace& workspace, QWidget* parent = nullptr);

    // Reads the queue again; keeps the chosen calibration when it is still waiting.
    void reload();
    // Shows a submitted (or just approved) session read-only; false when it cannot be read.
    bool openSession(std::int64_t sessionId);
    std::optional<std::int64_t> sessionId() const;

    // Why the signed-in person may not approve or return the session shown ("" when they may).
    QString actionBlocker() const;
    // Approves the session shown, `password` being the reviewer's own as a signature. False
    // with the reason in `message` (wrong password, own work, the outcome changed since it
    // was submitted …); on success `message` holds the sealed digest.
    bool approve(const QString& password, QString* message);
    // Returns the session shown to its technician; the comment is required.
    bool returnToTechnician(const QString& comment, QString* message);

    QTableWidget* queue() const { return queue_; }
    BenchView* view() const { return view_; }
    QLabel* verdictLabel() const { return verdict_; }
    QPushButton* approveButton() const { return approve_; }
    QPushButton* returnButton() const { return return_; }

signals:
    void statusMessage(const QString& text);
    void printRequested(qint64 sessionId);

private:
    void build();
    void updateActions();
    void askToApprove();
    void askToReturn();
    void showVerdict(const QString& html);

    Workspace& workspace_;
    SignInThrottle throttle_;
    QTableWidget* queue_ = nullptr;
    QLabel* queueSummary_ = nullptr;
    BenchView* view_ = nullptr;
    QLabel* blocker_ = nullptr;
    QLabel* verdict_ = nullptr;
    QPushButton* approve_ = nullptr;
    QPushButton* return_ = nullptr;
    QPushButton* print_ = nullptr;
};

} // namespace mw::gui
