// The one way the widgets change a calibration session: plain functions, each one undoable step
// on the workspace's undo stack, saved to the workbook at once in its own short transaction (so
// nothing shown as accepted is lost if the program is killed), announced by the notifier. The
// QUndoCommand classes stay private behind it (session_commands.cpp).
#pragma once

#include "core/model/calibration.h"
#include "core/plan/session_plan.h"
#include "storage/session_repository.h"

#include <QString>

#include <memory>
#include <optional>
#include <vector>

namespace mw::gui {

class Workspace;
namespace commands {
class IdRenames;
}

class SessionEdits {
public:
    explicit SessionEdits(Workspace& workspace);
    ~SessionEdits();
    SessionEdits(const SessionEdits&) = delete;
    SessionEdits& operator=(const SessionEdits&) = delete;

    // Every function saves at once and returns normally, or throws WorkbookError with the
    // workbook's reason and leaves the workbook and the undo stack as they were.

    // Saves readings (one typed value, or a pasted column: one undo step named `what`).
    void setReadings(std::int64_t sessionId, const std::vector<Reading>& readings,
                     const QString& what);
    void removeReadings(std::int64_t sessionId, const std::vector<ReadingKey>& keys,
                        const QString& what);
    // Saves and removals together (a paste that fills some cells and clears others).
    void changeReadings(std::int64_t sessionId, std::vector<storage::ReadingChange> changes,
                        const QString& what);

    TestPoint addPoint(std::int64_t sessionId, std::int64_t rangeId, double nominal, int repeats);
    void changePoint(std::int64_t sessionId, const TestPoint& point);
    void removePoint(std::int64_t sessionId, std::int64_t rangeId, int pointIndex);

    void addNote(std::int64_t sessionId, const AdjustmentNote& note);
    void removeNote(std::int64_t sessionId, std::int64_t noteId);
    void addResistorCheck(std::int64_t sessionId, const ResistorCheck& check);
    void removeResistorCheck(std::int64_t sessionId, std::int64_t checkId);

    // Header fields (environment, method, rule, phases, settings): `after` replaces `before`.
    void changeDetails(const CalibrationSession& before, const CalibrationSession& after);
    void changeStandards(std::int64_t sessionId, const std::vector<StandardUse>& before,
                         const std::vector<StandardUse>& after);

private:
    Workspace& workspace_;
    // Notes and checks written again by an undo or redo get new ids; steps find them here.
    std::unique_ptr<commands::IdRenames> renames_;
};

} // namespace mw::gui
