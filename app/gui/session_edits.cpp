// The edits facade: each edit made once, then kept on the undo stack.
#include "app/gui/session_edits.h"

#include "app/gui/session_commands.h"
#include "app/gui/workspace.h"

#include <QCoreApplication>

namespace mw::gui {
namespace {

// Makes the change; only a change the workbook accepted goes on the undo stack.
void push(Workspace& workspace, std::unique_ptr<commands::Step> step) {
    workspace.workbook()->requireWritable(QStringLiteral("change the calibration"));
    step->apply(); // throws what the workbook refuses; nothing then reaches the stack
    workspace.undoStack()->push(step.release());
}

} // namespace

SessionEdits::SessionEdits(Workspace& workspace)
    : workspace_(workspace)
    , renames_(std::make_unique<commands::IdRenames>()) {}

SessionEdits::~SessionEdits() = default;

void SessionEdits::setReadings(std::int64_t sessionId, const std::vector<Reading>& readings,
                               const QString& what) {
    std::vector<storage::ReadingChange> changes;
    for (const Reading& reading : readings) {
        changes.push_back({keyOf(reading), reading});
    }
    changeReadings(sessionId, std::move(changes), what);
}

void SessionEdits::removeReadings(std::int64_t sessionId, const std::vector<ReadingKey>& keys,
                                  const QString& what) {
    std::vector<storage::ReadingChange> changes;
    for (const ReadingKey& key : keys) {
        changes.push_back({key, std::nullopt});
    }
    changeReadings(sessionId, std::move(changes), what);
}

void SessionEdits::changeReadings(std::int64_t sessionId,
                                  std::vector<storage::ReadingChange> changes,
                                  const QString& what) {
    push(workspace_, commands::setReadings(workspace_, sessionId, std::move(changes), what));
}

TestPoint SessionEdits::addPoint(std::int64_t sessionId, std::int64_t rangeId, double nominal,
                                 int repeats) {
    auto step = commands::addPoint(workspace_, sessionId, {rangeId, 0, nominal, repeats});
    commands::Step& added = *step;
    push(workspace_, std::move(step));
    return commands::addedPoint(added);
}

void SessionEdits::changePoint(std::int64_t sessionId, const TestPoint& point) {
    push(workspace_, commands::changePoint(workspace_, sessionId, point));
}

void SessionEdits::removePoint(std::int64_t sessionId, std::int64_t rangeId, int pointIndex) {
    push(workspace_, commands::removePoint(workspace_, sessionId, rangeId, pointIndex));
}

void SessionEdits::addNote(std::int64_t sessionId, const AdjustmentNote& note) {
    push(workspace_, commands::addNote(workspace_, *renames_, sessionId, note));
}

void SessionEdits::removeNote(std::int64_t sessionId, std::int64_t noteId) {
    push(workspace_, commands::removeNote(workspace_, *renames_, sessionId, noteId));
}

void SessionEdits::addResistorCheck(std::int64_t sessionId, const ResistorCheck& check) {
    push(workspace_, commands::addCheck(workspace_, *renames_, sessionId, check));
}

void SessionEdits::removeResistorCheck(std::int64_t sessionId, std::int64_t checkId) {
    push(workspace_, commands::removeCheck(workspace_, *renames_, sessionId, checkId));
}

void SessionEdits::changeDetails(const CalibrationSession& before,
                                 const CalibrationSession& after) {
    push(workspace_, commands::changeDetails(workspace_, before, after));
}

void SessionEdits::changeStandards(std::int64_t sessionId, const std::vector<StandardUse>& before,
                                   const std::vector<StandardUse>& after) {
    push(workspace_, commands::changeStandards(workspace_, sessionId, before, after));
}

} // namespace mw::gui
