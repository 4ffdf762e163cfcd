// The undo steps of the edits facade: each knows what it changed and what it replaced.
#include "app/gui/session_commands.h"

#include "app/gui/workspace.h"

#include <QCoreApplication>

namespace mw::gui::commands {
namespace {

using storage::ReadingChange;
using storage::SessionRepository;

SessionRepository sessions(Workspace& workspace) {
    return SessionRepository(*workspace.workbook());
}

QList<ReadingKey> keysOf(const std::vector<ReadingChange>& changes) {
    QList<ReadingKey> keys;
    for (const ReadingChange& change : changes) {
        keys.append(change.key);
    }
    return keys;
}

class ReadingsStep : public Step {
public:
    ReadingsStep(Workspace& workspace, std::int64_t sessionId, std::vector<ReadingChange> changes,
                 const QString& text)
        : Step(workspace, text)
        , session_(sessionId)
        , changes_(std::move(changes)) {}

    void apply() override {
        const auto before = sessions(workspace_).setReadings(session_, changes_);
        before_.clear();
        for (std::size_t i = 0; i < changes_.size(); ++i) {
            before_.push_back({changes_[i].key, before[i]});
        }
        emit workspace_.notifier()->readingsChanged(session_, keysOf(changes_));
    }
    void revert() override {
        sessions(workspace_).setReadings(session_, before_);
        emit workspace_.notifier()->readingsChanged(session_, keysOf(changes_));
    }

private:
    std::int64_t session_;
    std::vector<ReadingChange> changes_;
    std::vector<ReadingChange> before_;
};

class AddPointStep : public Step {
public:
    AddPointStep(Workspace& workspace, std::int64_t sessionId, TestPoint point)
        : Step(workspace, QCoreApplication::translate("edits", "Add a test point"))
        , session_(sessionId)
        , point_(point) {}

    void apply() override {
        if (!added_) {
            point_ = sessions(workspace_)
                         .addTestPoint(session_, point_.range_id, point_.nominal, point_.repeats);
            added_ = true;
        } else {
            sessions(workspace_).restoreTestPoint(session_, {point_, {}}); // the same index
        }
        emit workspace_.notifier()->planChanged(session_, point_.range_id);
    }
    void revert() override {
        sessions(workspace_).removeTestPoint(session_, point_.range_id, point_.point_index);
        emit workspace_.notifier()->planChanged(session_, point_.range_id);
    }
    const TestPoint& point() const { return point_; }

private:
    std::int64_t session_;
    TestPoint point_;
    bool added_ = false;
};

class ChangePointStep : public Step {
public:
    ChangePointStep(Workspace& workspace, std::int64_t sessionId, TestPoint point)
        : Step(workspace, QCoreApplication::translate("edits", "Change a test point"))
        , session_(sessionId)
        , after_(point) {}

    void apply() override {
        before_ = sessions(workspace_).updateTestPoint(session_, after_);
        emit workspace_.notifier()->planChanged(session_, after_.range_id);
    }
    void revert() override {
        sessions(workspace_).updateTestPoint(session_, before_);
        emit workspace_.notifier()->planChanged(session_, after_.range_id);
    }

private:
    std::int64_t session_;
    TestPoint after_;
    TestPoint before_;
};

class RemovePointStep : public Step {
public:
    RemovePointStep(Workspace& workspace, std::int64_t sessionId, std::int64_t rangeId, int index)
        : Step(workspace, QCoreApplication::translate("edits", "Remove a test point"))
        , session_(sessionId)
        , range_(rangeId)
        , index_(index) {}

    void apply() override {
        removed_ = sessions(workspace_).removeTestPoint(session_, range_, index_);
        emit workspace_.notifier()->planChanged(session_, range_);
    }
    void revert() override {
        sessions(workspace_).restoreTestPoint(session_, removed_);
        emit workspace_.notifier()->planChanged(session_, range_);
    }

private:
    std::int64_t session_;
    std::int64_t range_;
    int index_;
    storage::RemovedPoint removed_;
};

// Adding and removing a note or a check are the same step run one way or the other.
template <typename Row, typename Add, typename Remove, typename Notify>
class RowStep : public Step {
public:
    RowStep(Workspace& workspace, IdRenames& renames, std::int64_t sessionId, Row row, bool adding,
            const QString& text, Add add, Remove remove, Notify notify)
        : Step(workspace, text)
        , renames_(renames)
        , session_(sessionId)
        , row_(std::move(row))
        , adding_(adding)
        , add_(add)
        , remove_(remove)
        , notify_(notify) {}

    void apply() override { adding_ ? put() : take(); }
    void revert() override { adding_ ? take() : put(); }

private:
    void put() {
        const std::int64_t old = row_.id;
        row_ = add_(sessions(workspace_), session_, row_);
        if (old != 0) {
            renames_.renamed(old, row_.id);
        }
        notify_(workspace_, session_);
    }
    void take() {
        row_ = remove_(sessions(workspace_), session_, renames_.current(row_.id));
        notify_(workspace_, session_);
    }

    IdRenames& renames_;
    std::int64_t session_;
    Row row_;
    bool adding_;
    Add add_;
    Remove remove_;
    Notify notify_;
};

template <typename Row, typename Add, typename Remove, typename Notify>
std::unique_ptr<Step> rowStep(Workspace& workspace, IdRenames& renames, std::int64_t sessionId,
                              Row row, bool adding, const QString& text, Add add, Remove remove,
                              Notify notify) {
    return std::make_unique<RowStep<Row, Add, Remove, Notify>>(
        workspace, renames, sessionId, std::move(row), adding, text, add, remove, notify);
}

auto notesNotify = [](Workspace& workspace, std::int64_t sessionId) {
    emit workspace.notifier()->notesChanged(sessionId);
};
auto checksNotify = [](Workspace& workspace, std::int64_t sessionId) {
    emit workspace.notifier()->resistorChecksChanged(sessionId);
};
auto noteAdd = [](SessionRepository repo, std::int64_t session, const AdjustmentNote& note) {
    return repo.addAdjustmentNote(session, note);
};
auto noteRemove = [](SessionRepository repo, std::int64_t session, std::int64_t id) {
    return repo.removeAdjustmentNote(session, id);
};
auto checkAdd = [](SessionRepository repo, std::int64_t session, const ResistorCheck& check) {
    return repo.addResistorCheck(session, check);
};
auto checkRemove = [](SessionRepository repo, std::int64_t session, std::int64_t id) {
    return repo.removeResistorCheck(session, id);
};

class DetailsStep : public Step {
public:
    DetailsStep(Workspace& workspace, CalibrationSession before, CalibrationSession after)
        : Step(workspace, QCoreApplication::translate("edits", "Change the calibration's set-up"))
        , before_(std::move(before))
        , after_(std::move(after)) {}

    void apply() override { save(after_); }
    void revert() override { save(before_); }

private:
    void save(const CalibrationSession& session) {
        sessions(workspace_).updateDetails(session);
        emit workspace_.notifier()->detailsChanged(session.id);
    }
    CalibrationSession before_;
    CalibrationSession after_;
};

class StandardsStep : public Step {
public:
    StandardsStep(Workspace& workspace, std::int64_t sessionId, std::vector<StandardUse> before,
                  std::vector<StandardUse> after)
        : Step(workspace, QCoreApplication::translate("edits", "Change the standards used"))
        , session_(sessionId)
        , before_(std::move(before))
        , after_(std::move(after)) {}

    void apply() override { save(after_); }
    void revert() override { save(before_); }

private:
    void save(const std::vector<StandardUse>& standards) {
        sessions(workspace_).setStandards(session_, standards);
        emit workspace_.notifier()->detailsChanged(session_);
    }
    std::int64_t session_;
    std::vector<StandardUse> before_;
    std::vector<StandardUse> after_;
};

} // namespace

std::int64_t IdRenames::current(std::int64_t id) const {
    for (auto next = next_.find(id); next != next_.end(); next = next_.find(id)) {
        id = next->second;
    }
    return id;
}

void IdRenames::renamed(std::int64_t from, std::int64_t to) {
    if (from != to) {
        next_[current(from)] = to;
    }
}

void Step::redo() {
    if (!applied_) {
        applied_ = true; // the facade already made the change before pushing this step
        return;
    }
    guarded([this] { apply(); });
}

void Step::undo() {
    guarded([this] { revert(); });
}

void Step::guarded(const std::function<void()>& work) {
    try {
        work();
    } catch (const std::exception& error) {
        // The workbook refused (e.g. the session was submitted meanwhile): the step can no
        // longer be undone or redone, and the stack drops it.
        setObsolete(true);
        emit workspace_.notifier()->editRefused(QString::fromUtf8(error.what()));
    }
}

std::unique_ptr<Step> setReadings(Workspace& workspace, std::int64_t sessionId,
                                  std::vector<ReadingChange> changes, const QString& text) {
    return std::make_unique<ReadingsStep>(workspace, sessionId, std::move(changes), text);
}

std::unique_ptr<Step> addPoint(Workspace& workspace, std::int64_t sessionId, TestPoint point) {
    return std::make_unique<AddPointStep>(workspace, sessionId, point);
}

TestPoint addedPoint(const Step& step) {
    return dynamic_cast<const AddPointStep&>(step).point();
}

std::unique_ptr<Step> changePoint(Workspace& workspace, std::int64_t sessionId, TestPoint point) {
    return std::make_unique<ChangePointStep>(workspace, sessionId, point);
}

std::unique_ptr<Step> removePoint(Workspace& workspace, std::int64_t sessionId,
                                  std::int64_t rangeId, int pointIndex) {
    return std::make_unique<RemovePointStep>(workspace, sessionId, rangeId, pointIndex);
}

std::unique_ptr<Step> addNote(Workspace& workspace, IdRenames& renames, std::int64_t sessionId,
                              AdjustmentNote note) {
    return rowStep(workspace, renames, sessionId, std::move(note), true,
                   QCoreApplication::translate("edits", "Add an adjustment note"), noteAdd,
                   noteRemove, notesNotify);
}

std::unique_ptr<Step> removeNote(Workspace& workspace, IdRenames& renames, std::int64_t sessionId,
                                 std::int64_t noteId) {
    AdjustmentNote note;
    note.id = noteId;
    return rowStep(workspace, renames, sessionId, note, false,
                   QCoreApplication::translate("edits", "Remove an adjustment note"), noteAdd,
                   noteRemove, notesNotify);
}

std::unique_ptr<Step> addCheck(Workspace& workspace, IdRenames& renames, std::int64_t sessionId,
                               ResistorCheck check) {
    return rowStep(workspace, renames, sessionId, std::move(check), true,
                   QCoreApplication::translate("edits", "Add a resistor check"), checkAdd,
                   checkRemove, checksNotify);
}

std::unique_ptr<Step> removeCheck(Workspace& workspace, IdRenames& renames, std::int64_t sessionId,
                                  std::int64_t checkId) {
    ResistorCheck check;
    check.id = checkId;
    return rowStep(workspace, renames, sessionId, check, false,
                   QCoreApplication::translate("edits", "Remove a resistor check"), checkAdd,
                   checkRemove, checksNotify);
}

std::unique_ptr<Step> changeDetails(Workspace& workspace, CalibrationSession before,
                                    CalibrationSession after) {
    return std::make_unique<DetailsStep>(workspace, std::move(before), std::move(after));
}

std::unique_ptr<Step> changeStandards(Workspace& workspace, std::int64_t sessionId,
                                      std::vector<StandardUse> before,
                                      std::vector<StandardUse> after) {
    return std::make_unique<StandardsStep>(workspace, sessionId, std::move(before),
                                           std::move(after));
}

} // namespace mw::gui::commands
