// Calibration sessions: creating and editing drafts (plan, readings, resistor checks,
// adjustment notes, standards used), loading records and histories, and the review workflow
// draft -> submitted -> approved / returned, and amendment of an approved record. Every edit of
// a draft is its own short transaction and returns what undoing it needs.
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"
#include "core/plan/session_plan.h"
#include "storage/signing_keys.h"

#include <QString>

#include <map>
#include <optional>
#include <vector>

namespace mw::storage {

class Workbook;

// One reading to set: `value` saved under `key`, or the reading under `key` removed (nullopt).
struct ReadingChange {
    ReadingKey key;
    std::optional<Reading> value;
};

// A test point taken out of a plan together with its readings, so that it can be put back.
struct RemovedPoint {
    TestPoint point;
    std::vector<Reading> readings;
};

// A calibration not yet approved (draft, returned or submitted), without its contents.
struct OpenSession {
    std::int64_t id = 0;
    std::int64_t instrument_id = 0;
    SessionState state = SessionState::Draft;
};

class SessionRepository {
public:
    explicit SessionRepository(Workbook& workbook)
        : workbook_(workbook) {}

    // Inserts a draft session with everything it holds; sets session.id and the ids of its
    // notes and checks. A StandardUse with an empty certificate_number gets the standard's
    // current certificate number and due date.
    void create(CalibrationSession& session);
    // Saves the header fields a technician edits on a draft: finish time, environment, method,
    // decision rule, guard factor, phases planned, evaluation settings. Refused by the database
    // once submitted. The outcome is never written here: submit() computes it.
    void updateDetails(const CalibrationSession& session);
    // Sets the standards used: those no longer listed are removed (with their copies), those
    // kept keep their certificate copy and take the new justification, new ones are added with
    // the same snapshot rule as create().
    void setStandards(std::int64_t sessionId, std::vector<StandardUse> standards);

    // Saves a reading by its key (the existing one updated, else a new one inserted) and
    // returns the reading it replaced, or nullopt when there was none.
    std::optional<Reading> putReading(std::int64_t sessionId, const Reading& reading);
    // Several readings in one transaction (a paste), each replaced reading in the same order.
    std::vector<std::optional<Reading>> putReadings(std::int64_t sessionId,
                                                    const std::vector<Reading>& readings);
    // Removes the reading with that key and returns it; NotFound when there is none.
    Reading removeReading(std::int64_t sessionId, const ReadingKey& key);
    // Any mix of saves and removals in one transaction; returns what each key held before
    // (nullopt: nothing), so that setting those back undoes the change exactly.
    std::vector<std::optional<Reading>> setReadings(std::int64_t sessionId,
                                                    const std::vector<ReadingChange>& changes);

    // The plan: the points of a range get the next free point indices when added.
    TestPoint addTestPoint(std::int64_t sessionId, std::int64_t rangeId, double nominal,
                           int repeats);
    // Replaces a point's nominal value and repeats; returns it as it was.
    TestPoint updateTestPoint(std::int64_t sessionId, const TestPoint& point);
    // Takes a point and its readings out of the plan; restoreTestPoint() puts them back.
    RemovedPoint removeTestPoint(std::int64_t sessionId, std::int64_t rangeId, int pointIndex);
    void restoreTestPoint(std::int64_t sessionId, const RemovedPoint& removed);

    ResistorCheck addResistorCheck(std::int64_t sessionId, ResistorCheck check); // id set
    ResistorCheck removeResistorCheck(std::int64_t sessionId, std::int64_t checkId);
    AdjustmentNote addAdjustmentNote(std::int64_t sessionId, AdjustmentNote note); // id set
    AdjustmentNote removeAdjustmentNote(std::int64_t sessionId, std::int64_t noteId);
    void removeDraft(std::int64_t sessionId); // drafts and returned sessions only

    std::optional<CalibrationSession> find(std::int64_t sessionId) const;
    // Every session of one instrument with all it holds, oldest first.
    std::vector<CalibrationSession> historyOf(std::int64_t instrumentId) const;
    // Sessions in one state with all they hold, oldest first (e.g. the review queue).
    std::vector<CalibrationSession> withState(SessionState state) const;
    // Every calibration not yet approved, oldest first, of one instrument or of all; reads no
    // readings, so the register stays quick however large the workbook grows.
    std::vector<OpenSession> openSessions(std::optional<std::int64_t> instrumentId = {}) const;
    // True when an approved (or superseded) record refers to the instrument: its identity,
    // movement, scale, class and range limits are then frozen by the database.
    bool hasApprovedRecords(std::int64_t instrumentId) const;
    // The outcome of each instrument's latest approved record (by instrument id); instruments
    // without one are absent.
    std::map<std::int64_t, Outcome> latestApprovedOutcomes() const;
    std::int64_t readingCount() const;

    // draft/returned -> submitted: checks that every reading the plan asks for is there,
    // copies the standards' specifications and each range as the register holds them now (an
    // amendment keeps the copies it started with), evaluates the session with those copies
    // (core/evaluation/session_evaluation.h) and stores the outcome. Refused, saying why, when
    // readings are missing, when a range cannot be evaluated, or by the database when a
    // standard used is past its due date on `at` without a justification.
    Outcome submit(std::int64_t sessionId, Timestamp at);
    // submitted -> returned, with the reviewer's comment (required).
    void returnToTechnician(std::int64_t sessionId, std::int64_t reviewerId, const QString& comment,
                            Timestamp at);
    // returned -> draft, so that the technician can edit again; the outcome is cleared and the
    // copies taken at submission dropped (an amendment keeps those it started with).
    void reopen(std::int64_t sessionId);
    // submitted -> approved: evaluates the session again from its sealed copies and refuses
    // when the outcome differs from the one submitted (something changed); records the
    // reviewer and time, computes the record digest chained with the previously approved
    // record, seals the audit log up to its newest row, signs both with the reviewer's opened
    // key (`signer`, storage/signing_keys.h), and commits with synchronous=FULL. When the
    // session amends an earlier one, that one becomes superseded in the same commit. Returns
    // the digest.
    QString approve(std::int64_t sessionId, const ApprovalSigner& signer, Timestamp at);
    // Starts an amendment of an approved session: a new draft revision holding a copy of its
    // plan, readings, checks, notes, standards and sealed copies, referring to it, with the
    // reason (required).
    std::int64_t amend(std::int64_t approvedSessionId, std::int64_t technicianId,
                       const QString& reason, Timestamp at);

private:
    Instrument instrumentOf(const CalibrationSession& session) const;
    void requireCurrentCertificates(const CalibrationSession& session,
                                    const std::vector<ReferenceStandard>& standards) const;
    static Outcome outcomeOf(const Instrument& instrument, const CalibrationSession& session,
                             const QString& action);
    void requireUnchangedOutcome(const CalibrationSession& session) const;

    Workbook& workbook_;
};

} // namespace mw::storage
