// The undo steps behind the edits facade (session_edits.h): private to it. Each step saved its
// change once when the facade made it; redo saves it again, undo puts back what it replaced.
#pragma once

#include "storage/session_repository.h"

#include <QUndoCommand>

#include <functional>
#include <map>
#include <memory>

namespace mw::gui {

class Workspace;

namespace commands {

// Notes and resistor checks get a new id each time they are written again by an undo or a
// redo; later steps that remember the first id find the current one here.
class IdRenames {
public:
    std::int64_t current(std::int64_t id) const;
    void renamed(std::int64_t from, std::int64_t to);

private:
    std::map<std::int64_t, std::int64_t> next_;
};

class Step : public QUndoCommand {
public:
    Step(Workspace& workspace, const QString& text)
        : QUndoCommand(text)
        , workspace_(workspace) {}

    // The change itself, first made by the facade (throws what the workbook refuses).
    virtual void apply() = 0;
    virtual void revert() = 0;

    void redo() final;
    void undo() final;

protected:
    Workspace& workspace_;

private:
    void guarded(const std::function<void()>& work);
    bool applied_ = false; // the facade applied it before pushing
};

std::unique_ptr<Step> setReadings(Workspace& workspace, std::int64_t sessionId,
                                  std::vector<storage::ReadingChange> changes, const QString& text);
std::unique_ptr<Step> addPoint(Workspace& workspace, std::int64_t sessionId, TestPoint point);
// The point an addPoint step added (with its index), once applied.
TestPoint addedPoint(const Step& step);
std::unique_ptr<Step> changePoint(Workspace& workspace, std::int64_t sessionId, TestPoint point);
std::unique_ptr<Step> removePoint(Workspace& workspace, std::int64_t sessionId,
                                  std::int64_t rangeId, int pointIndex);
std::unique_ptr<Step> addNote(Workspace& workspace, IdRenames& renames, std::int64_t sessionId,
                              AdjustmentNote note);
std::unique_ptr<Step> removeNote(Workspace& workspace, IdRenames& renames, std::int64_t sessionId,
                                 std::int64_t noteId);
std::unique_ptr<Step> addCheck(Workspace& workspace, IdRenames& renames, std::int64_t sessionId,
                               ResistorCheck check);
std::unique_ptr<Step> removeCheck(Workspace& workspace, IdRenames& renames, std::int64_t sessionId,
                                  std::int64_t checkId);
std::unique_ptr<Step> changeDetails(Workspace& workspace, CalibrationSession before,
                                    CalibrationSession after);
std::unique_ptr<Step> changeStandards(Workspace& workspace, std::int64_t sessionId,
                                      std::vector<StandardUse> before,
                                      std::vector<StandardUse> after);

} // namespace commands
} // namespace mw::gui
