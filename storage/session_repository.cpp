// Calibration sessions: drafts and their parts, and loading records.
#include "storage/session_repository.h"

#include "storage/session_loader.h"
#include "storage/session_parts.h"
#include "storage/sql_support.h"
#include "storage/transaction.h"
#include "storage/workbook.h"

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

// The settings of a session that has none (a record of format 1 reopened) are the defaults.
void bindDetails(QSqlQuery& q, const CalibrationSession& s) {
    const EvaluationSettings settings = s.settings.value_or(EvaluationSettings{});
    q.addBindValue(sql::nullableTime(s.finished_at));
    q.addBindValue(s.environment.ambient_celsius);
    q.addBindValue(s.environment.relative_humidity_percent);
    q.addBindValue(QString::fromStdString(s.method));
    q.addBindValue(sql::enumText(s.decision_rule));
    q.addBindValue(s.guard_factor);
    q.addBindValue(settings.readability_fraction);
    q.addBindValue(settings.coverage_probability);
    q.addBindValue(settings.reference_celsius);
    q.addBindValue(sql::enumText(s.phases));
}

std::int64_t insertHeader(const QSqlDatabase& db, const CalibrationSession& s) {
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("INSERT INTO calibration_sessions (finished_at, ambient_celsius, "
                           "relative_humidity_percent, method, decision_rule, guard_factor, "
                           "readability_fraction, coverage_probability, reference_celsius, "
                           "phases, instrument_id, technician_id, started_at, state, "
                           "return_comment, revision, supersedes_id, amendment_reason, "
                           "amended_at, record_format) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, "
                           "?, ?, 'draft', '', ?, ?, ?, ?, ?) RETURNING id"));
    bindDetails(q, s);
    q.addBindValue(qint64(s.instrument_id));
    q.addBindValue(qint64(s.technician_id));
    q.addBindValue(sql::toIso(s.started_at));
    q.addBindValue(s.revision);
    q.addBindValue(sql::nullableId(s.supersedes_id));
    q.addBindValue(QString::fromStdString(s.amendment_reason));
    q.addBindValue(sql::nullableTime(s.amended_at));
    q.addBindValue(kRecordFormat);
    sql::exec(
        q, QStringLiteral("creating a calibration session of instrument %1").arg(s.instrument_id));
    q.next();
    const std::int64_t id = q.value(0).toLongLong();
    q.finish();
    return id;
}

} // namespace

void SessionRepository::create(CalibrationSession& session) {
    if (session.state != SessionState::Draft) {
        throw WorkbookError(Kind::BadInput,
                            QStringLiteral("a new calibration session is a draft; submit and "
                                           "approve it through the workflow"));
    }
    if (session.outcome) {
        throw WorkbookError(Kind::BadInput,
                            QStringLiteral("a new calibration session has no outcome: the "
                                           "outcome is computed from its readings when it is "
                                           "submitted"));
    }
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    const std::int64_t id = insertHeader(db, session);
    detail::insertStandards(db, id, session.standards);
    detail::insertPlan(db, id, session.plan);
    detail::insertReadings(db, id, session.readings);
    for (ResistorCheck& check : session.resistor_checks) {
        check.id = detail::insertResistorCheck(db, id, check);
    }
    for (AdjustmentNote& note : session.adjustments) {
        note.id = detail::insertAdjustmentNote(db, id, note);
    }
    if (session.sealed) {
        detail::replaceSealedInputs(db, id, *session.sealed);
    }
    transaction.commit();
    session.id = id;
}

void SessionRepository::updateDetails(const CalibrationSession& session) {
    Transaction transaction(workbook_);
    QSqlQuery q = sql::prepare(
        workbook_.database(),
        QStringLiteral("UPDATE calibration_sessions SET finished_at = ?, ambient_celsius = ?, "
                       "relative_humidity_percent = ?, method = ?, decision_rule = ?, "
                       "guard_factor = ?, readability_fraction = ?, coverage_probability = ?, "
                       "reference_celsius = ?, phases = ? WHERE id = ?"));
    bindDetails(q, session);
    q.addBindValue(qint64(session.id));
    sql::exec(q, QStringLiteral("saving calibration session %1").arg(session.id));
    detail::requireOneRow(q, session.id);
    transaction.commit();
}

void SessionRepository::setStandards(std::int64_t sessionId, std::vector<StandardUse> standards) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    QStringList kept;
    for (const StandardUse& use : standards) {
        kept << QString::number(use.standard_id);
    }
    const QString keptList = kept.isEmpty() ? QStringLiteral("NULL") : kept.join(QLatin1Char(','));
    // Range copies naming a standard no longer used go first (they refer to its copies).
    QSqlQuery ranges = sql::prepare(
        db, QStringLiteral("DELETE FROM session_ranges WHERE session_id = ? AND "
                           "(reference_standard_id NOT IN (%1) OR shunt_standard_id NOT IN (%1))")
                .arg(keptList));
    ranges.addBindValue(qint64(sessionId));
    sql::exec(ranges, QStringLiteral("changing the standards of session %1").arg(sessionId));
    QSqlQuery removed = sql::prepare(
        db, QStringLiteral("DELETE FROM session_standards WHERE session_id = ? AND standard_id "
                           "NOT IN (%1)")
                .arg(keptList));
    removed.addBindValue(qint64(sessionId));
    sql::exec(removed, QStringLiteral("changing the standards of session %1").arg(sessionId));
    QSqlQuery justify = sql::prepare(
        db, QStringLiteral("UPDATE session_standards SET overdue_justification = ? WHERE "
                           "session_id = ? AND standard_id = ?"));
    std::vector<StandardUse> added;
    for (const StandardUse& use : standards) {
        justify.addBindValue(QString::fromStdString(use.overdue_justification));
        justify.addBindValue(qint64(sessionId));
        justify.addBindValue(qint64(use.standard_id));
        sql::exec(justify,
                  QStringLiteral("recording why standard %1 is used").arg(use.standard_id));
        if (justify.numRowsAffected() == 0) {
            added.push_back(use);
        }
    }
    detail::insertStandards(db, sessionId, added);
    transaction.commit();
}

void SessionRepository::removeDraft(std::int64_t sessionId) {
    Transaction transaction(workbook_);
    QSqlQuery q = sql::prepare(workbook_.database(),
                               QStringLiteral("DELETE FROM calibration_sessions WHERE id = ?"));
    q.addBindValue(qint64(sessionId));
    sql::exec(q, QStringLiteral("deleting calibration session %1").arg(sessionId));
    detail::requireOneRow(q, sessionId);
    transaction.commit();
}

std::optional<CalibrationSession> SessionRepository::find(std::int64_t sessionId) const {
    auto found =
        detail::loadSessions(workbook_.database(), QStringLiteral("s.id = ?"), qint64(sessionId));
    return found.empty() ? std::nullopt : std::optional(std::move(found.front()));
}

std::vector<CalibrationSession> SessionRepository::historyOf(std::int64_t instrumentId) const {
    return detail::loadSessions(workbook_.database(), QStringLiteral("s.instrument_id = ?"),
                                qint64(instrumentId));
}

std::vector<CalibrationSession> SessionRepository::withState(SessionState state) const {
    return detail::loadSessions(workbook_.database(), QStringLiteral("s.state = ?"),
                                sql::enumText(state));
}

std::int64_t SessionRepository::readingCount() const {
    return sql::scalar(workbook_.database(), QStringLiteral("SELECT COUNT(*) FROM readings"),
                       QStringLiteral("counting readings"))
        .toLongLong();
}

} // namespace mw::storage
