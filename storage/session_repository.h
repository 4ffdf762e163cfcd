// Calibration sessions: creating and editing drafts (readings, resistor checks, adjustment
// notes, standards used), loading records and histories, and the review workflow
// draft -> submitted -> approved / returned, and amendment of an approved record.
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"

#include <QString>

#include <optional>
#include <vector>

namespace mw::storage {

class Workbook;

class SessionRepository {
public:
    explicit SessionRepository(Workbook& workbook)
        : workbook_(workbook) {}

    // Inserts a draft session with everything it holds; sets session.id. A StandardUse with an
    // empty certificate_number gets the standard's current certificate number and due date.
    void create(CalibrationSession& session);
    // Saves the header fields a technician edits on a draft: finish time, environment, method,
    // decision rule, guard factor, evaluation settings. Refused by the database once submitted.
    // The outcome is never written here: submit() computes it.
    void updateDetails(const CalibrationSession& session);
    // Sets the standards used: those no longer listed are removed (with their copies), those
    // kept keep their certificate copy and take the new justification, new ones are added with
    // the same snapshot rule as create().
    void setStandards(std::int64_t sessionId, std::vector<StandardUse> standards);
    // Inserts or replaces the reading with the same (range, point, direction, phase, repeat).
    void saveReading(std::int64_t sessionId, const Reading& reading);
    // Saves many readings in one transaction (a whole grid).
    void saveReadings(std::int64_t sessionId, const std::vector<Reading>& readings);
    void removeReading(std::int64_t sessionId, const Reading& key);
    void addResistorCheck(std::int64_t sessionId, const ResistorCheck& check);
    void addAdjustmentNote(std::int64_t sessionId, const AdjustmentNote& note);
    void removeDraft(std::int64_t sessionId); // drafts and returned sessions only

    std::optional<CalibrationSession> find(std::int64_t sessionId) const;
    // Every session of one instrument with all it holds, oldest first.
    std::vector<CalibrationSession> historyOf(std::int64_t instrumentId) const;
    // Sessions in one state with all they hold, oldest first (e.g. the review queue).
    std::vector<CalibrationSession> withState(SessionState state) const;
    std::int64_t readingCount() const;

    // draft/returned -> submitted: copies the standards' specifications and each range as the
    // register holds them now (an amendment keeps the copies it started with), evaluates the
    // session with those copies (core/evaluation/session_evaluation.h) and stores the outcome.
    // Refused, saying why, when a range cannot be evaluated, when there are no readings, or by
    // the database when a standard used is past its due date on `at` without a justification.
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
    // record, and commits with synchronous=FULL. When the session
    // amends an earlier one, that one becomes superseded in the same commit. Returns the digest.
    QString approve(std::int64_t sessionId, std::int64_t reviewerId, Timestamp at);
    // Starts an amendment of an approved session: a new draft revision holding a copy of its
    // readings, checks, notes and standards, referring to it, with the reason (required).
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
