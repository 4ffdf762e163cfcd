// The review workflow of calibration sessions: submit, return, reopen, approve (sealing the
// record into the digest chain) and amend.
#include "core/evaluation/session_evaluation.h"
#include "storage/audit_seal.h"
#include "storage/instrument_repository.h"
#include "storage/record_digest.h"
#include "storage/session_loader.h"
#include "storage/session_parts.h"
#include "storage/session_repository.h"
#include "storage/sql_support.h"
#include "storage/standard_repository.h"
#include "storage/transaction.h"
#include "storage/workbook.h"

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

void requireText(const QString& value, const QString& what) {
    if (value.trimmed().isEmpty()) {
        throw WorkbookError(Kind::BadInput, what + QStringLiteral(" is required"));
    }
}

// The digest of the last approved record, or "" (never NULL) for the first record.
QString lastDigest(const QSqlDatabase& db) {
    const QString digest =
        sql::scalar(db,
                    QStringLiteral("SELECT digest FROM record_chain ORDER BY id DESC "
                                   "LIMIT 1"),
                    QStringLiteral("reading the last approved record"))
            .toString();
    return digest.isNull() ? QStringLiteral("") : digest;
}

CalibrationSession loadOne(const QSqlDatabase& db, std::int64_t sessionId) {
    auto found = detail::loadSessions(db, QStringLiteral("s.id = ?"), qint64(sessionId));
    if (found.empty()) {
        throw WorkbookError(Kind::NotFound,
                            QStringLiteral("no calibration session with id %1").arg(sessionId));
    }
    return std::move(found.front());
}

} // namespace

Instrument SessionRepository::instrumentOf(const CalibrationSession& session) const {
    auto instrument = InstrumentRepository(workbook_).find(session.instrument_id);
    if (!instrument) {
        throw WorkbookError(Kind::NotFound, QStringLiteral("calibration session %1 refers to "
                                                           "instrument %2, which does not exist")
                                                .arg(session.id)
                                                .arg(session.instrument_id));
    }
    return *instrument;
}

// A session notes each standard's certificate when the standard is chosen; a standard
// recalibrated since then is used under its new certificate, so it must be chosen again.
void SessionRepository::requireCurrentCertificates(
    const CalibrationSession& session, const std::vector<ReferenceStandard>& standards) const {
    for (const StandardUse& use : session.standards) {
        for (const ReferenceStandard& standard : standards) {
            if (standard.id == use.standard_id &&
                standard.certificate_number != use.certificate_number) {
                throw WorkbookError(
                    Kind::RuleViolation,
                    QStringLiteral("reference standard %1 was recalibrated after it was chosen "
                                   "for calibration session %2 (certificate %3, now %4); choose "
                                   "it again so the record names the certificate in force")
                        .arg(QString::fromStdString(standard.asset_tag))
                        .arg(session.id)
                        .arg(QString::fromStdString(use.certificate_number),
                             QString::fromStdString(standard.certificate_number)));
            }
        }
    }
}

// The session evaluator's overall outcome, or RuleViolation saying why there is none.
Outcome SessionRepository::outcomeOf(const Instrument& instrument,
                                     const CalibrationSession& session, const QString& action) {
    const SessionEvaluation evaluation =
        evaluateSession(instrument, session, session.sealed.value_or(SealedInputs{}));
    if (evaluation.overall) {
        return *evaluation.overall;
    }
    QString why = evaluation.problems.empty() ? QStringLiteral("it has no readings")
                                              : QString::fromStdString(evaluation.problems.front());
    if (evaluation.problems.size() > 1) {
        why += QStringLiteral(" (and %1 more)").arg(evaluation.problems.size() - 1);
    }
    throw WorkbookError(Kind::RuleViolation, QStringLiteral("cannot %1 calibration session %2: %3")
                                                 .arg(action)
                                                 .arg(session.id)
                                                 .arg(why));
}

Outcome SessionRepository::submit(std::int64_t sessionId, Timestamp at) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_);
    CalibrationSession session = loadOne(db, sessionId);
    if (session.state != SessionState::Draft && session.state != SessionState::Returned) {
        throw WorkbookError(Kind::RuleViolation,
                            QStringLiteral("calibration session %1 is %2; only a draft or a "
                                           "returned session can be submitted")
                                .arg(sessionId)
                                .arg(sql::enumText(session.state)));
    }
    const Instrument instrument = instrumentOf(session);
    const std::vector<ReadingKey> missing = missingReadings(instrument, session);
    if (!missing.empty()) {
        throw WorkbookError(
            Kind::RuleViolation,
            QStringLiteral("cannot submit calibration session %1: %2 of the plan %3 not taken: "
                           "%4")
                .arg(sessionId)
                .arg(missing.size() == 1 ? QStringLiteral("one reading")
                                         : QStringLiteral("%1 readings").arg(missing.size()))
                .arg(missing.size() == 1 ? QStringLiteral("was") : QStringLiteral("were"))
                .arg(QString::fromStdString(describeMissing(instrument, session, missing))));
    }
    const std::vector<ReferenceStandard> standards = StandardRepository(workbook_).all();
    const bool amendment = session.supersedes_id.has_value();
    if (!amendment) {
        requireCurrentCertificates(session, standards);
    }
    const SealedInputs inputs =
        sealInputs(instrument, session, standards, amendment ? session.sealed : std::nullopt);
    detail::replaceSealedInputs(db, sessionId, inputs);
    session.sealed = inputs;
    const Outcome outcome = outcomeOf(instrument, session, QStringLiteral("submit"));
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("UPDATE calibration_sessions SET state = 'submitted', submitted_at = "
                           "?, outcome = ?, record_format = ?, readability_fraction = "
                           "COALESCE(readability_fraction, ?), coverage_probability = "
                           "COALESCE(coverage_probability, ?), reference_celsius = "
                           "COALESCE(reference_celsius, ?) WHERE id = ?"));
    const EvaluationSettings defaults;
    q.addBindValue(sql::toIso(at));
    q.addBindValue(sql::enumText(outcome));
    q.addBindValue(kRecordFormat);
    q.addBindValue(defaults.readability_fraction);
    q.addBindValue(defaults.coverage_probability);
    q.addBindValue(defaults.reference_celsius);
    q.addBindValue(qint64(sessionId));
    sql::exec(q, QStringLiteral("submitting calibration session %1").arg(sessionId));
    detail::requireOneRow(q, sessionId);
    transaction.commit();
    return outcome;
}

void SessionRepository::returnToTechnician(std::int64_t sessionId, std::int64_t reviewerId,
                                           const QString& comment, Timestamp at) {
    requireText(comment, QStringLiteral("a comment saying why the session is returned"));
    Transaction transaction(workbook_);
    QSqlQuery q = sql::prepare(workbook_.database(),
                               QStringLiteral("UPDATE calibration_sessions SET state = "
                                              "'returned', reviewer_id = ?, return_comment = ?, "
                                              "returned_at = ? WHERE id = ?"));
    q.addBindValue(qint64(reviewerId));
    q.addBindValue(comment);
    q.addBindValue(sql::toIso(at));
    q.addBindValue(qint64(sessionId));
    sql::exec(q, QStringLiteral("returning calibration session %1").arg(sessionId));
    detail::requireOneRow(q, sessionId);
    transaction.commit();
}

void SessionRepository::reopen(std::int64_t sessionId) {
    Transaction transaction(workbook_);
    const QSqlDatabase db = workbook_.database();
    const EvaluationSettings defaults;
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("UPDATE calibration_sessions SET state = 'draft', outcome = NULL, "
                           "record_format = ?, readability_fraction = "
                           "COALESCE(readability_fraction, ?), coverage_probability = "
                           "COALESCE(coverage_probability, ?), reference_celsius = "
                           "COALESCE(reference_celsius, ?) WHERE id = ? AND state = 'returned'"));
    q.addBindValue(kRecordFormat);
    q.addBindValue(defaults.readability_fraction);
    q.addBindValue(defaults.coverage_probability);
    q.addBindValue(defaults.reference_celsius);
    q.addBindValue(qint64(sessionId));
    sql::exec(q, QStringLiteral("reopening calibration session %1").arg(sessionId));
    if (q.numRowsAffected() != 1) {
        throw WorkbookError(
            Kind::RuleViolation,
            QStringLiteral("calibration session %1 is not a returned session").arg(sessionId));
    }
    // The copies of a plain session are taken again at its next submission.
    QSqlQuery copies = sql::prepare(db, QStringLiteral("SELECT supersedes_id FROM "
                                                       "calibration_sessions WHERE id = ?"));
    copies.addBindValue(qint64(sessionId));
    sql::exec(copies, QStringLiteral("reopening calibration session %1").arg(sessionId));
    if (copies.next() && copies.value(0).isNull()) {
        copies.finish();
        detail::replaceSealedInputs(db, sessionId, SealedInputs{});
    }
    transaction.commit();
}

// What the reviewer approves is what the technician submitted: the evaluator, run again on the
// sealed copies, must give the outcome stored at submission.
void SessionRepository::requireUnchangedOutcome(const CalibrationSession& session) const {
    if (session.state != SessionState::Submitted) {
        throw WorkbookError(Kind::RuleViolation,
                            QStringLiteral("calibration session %1 is %2; only a submitted "
                                           "session can be approved")
                                .arg(session.id)
                                .arg(sql::enumText(session.state)));
    }
    if (session.record_format < kRecordFormat) {
        throw WorkbookError(Kind::RuleViolation,
                            QStringLiteral("calibration session %1 was submitted before the "
                                           "workbook kept a copy of the inputs its verdict rests "
                                           "on; return it to the technician to be submitted "
                                           "again")
                                .arg(session.id));
    }
    const Outcome now = outcomeOf(instrumentOf(session), session, QStringLiteral("approve"));
    if (!session.outcome || *session.outcome != now) {
        throw WorkbookError(
            Kind::RuleViolation,
            QStringLiteral("cannot approve calibration session %1: its readings and sealed "
                           "inputs now give \"%2\", not the \"%3\" it was submitted with; "
                           "something changed since submission, so return it to be checked")
                .arg(session.id)
                .arg(sql::text(displayName(now)), session.outcome
                                                      ? sql::text(displayName(*session.outcome))
                                                      : QStringLiteral("no outcome")));
    }
}

QString SessionRepository::approve(std::int64_t sessionId, const ApprovalSigner& signer,
                                   Timestamp at) {
    const std::int64_t reviewerId = signer.userId;
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_, Transaction::Durability::Full);
    requireUnchangedOutcome(loadOne(db, sessionId));
    QSqlQuery q = sql::prepare(db, QStringLiteral("UPDATE calibration_sessions SET state = "
                                                  "'approved', reviewer_id = ?, approved_at = ? "
                                                  "WHERE id = ?"));
    q.addBindValue(qint64(reviewerId));
    q.addBindValue(sql::toIso(at));
    q.addBindValue(qint64(sessionId));
    sql::exec(q, QStringLiteral("approving calibration session %1").arg(sessionId));
    detail::requireOneRow(q, sessionId);

    const CalibrationSession record = loadOne(db, sessionId);
    const QString previous = lastDigest(db);
    const RecordContexts contexts(db, record.instrument_id);
    const QString digest = chainDigest(previous, canonicalRecord(record, contexts.of(record)));
    // Inside this transaction no other writer can add to the audit log between the seal and
    // the chain entry that records it.
    const AuditSeal audit = extendAuditSeal(db, lastAuditSeal(db));
    QSqlQuery seal = sql::prepare(
        db, QStringLiteral("INSERT INTO record_chain (session_id, previous_digest, digest, "
                           "recorded_at, audit_through_id, audit_digest, signing_key_id, "
                           "signature) VALUES (?, ?, ?, ?, ?, ?, ?, ?)"));
    seal.addBindValue(qint64(sessionId));
    seal.addBindValue(previous);
    seal.addBindValue(digest);
    seal.addBindValue(sql::toIso(at));
    seal.addBindValue(audit.throughId > 0 ? QVariant(qint64(audit.throughId)) : QVariant());
    seal.addBindValue(audit.throughId > 0 ? QVariant(audit.digest) : QVariant());
    seal.addBindValue(qint64(signer.keyId));
    seal.addBindValue(signer.secretKey.sign(approvalMessage(digest, audit)));
    sql::exec(seal, QStringLiteral("sealing calibration session %1").arg(sessionId));
    if (record.supersedes_id) {
        QSqlQuery old = sql::prepare(db, QStringLiteral("UPDATE calibration_sessions SET state "
                                                        "= 'superseded' WHERE id = ?"));
        old.addBindValue(qint64(*record.supersedes_id));
        sql::exec(old, QStringLiteral("marking session %1 superseded").arg(*record.supersedes_id));
    }
    transaction.commit();
    return digest;
}

std::int64_t SessionRepository::amend(std::int64_t approvedSessionId, std::int64_t technicianId,
                                      const QString& reason, Timestamp at) {
    requireText(reason, QStringLiteral("the reason for an amendment"));
    Transaction transaction(workbook_);
    CalibrationSession revision = loadOne(workbook_.database(), approvedSessionId);
    if (revision.state != SessionState::Approved) {
        throw WorkbookError(Kind::RuleViolation,
                            QStringLiteral("calibration session %1 is %2; only an approved "
                                           "record can be amended")
                                .arg(approvedSessionId)
                                .arg(sql::enumText(revision.state)));
    }
    revision.id = 0;
    revision.technician_id = technicianId;
    revision.state = SessionState::Draft;
    revision.submitted_at.reset();
    revision.return_comment.clear();
    revision.returned_at.reset();
    revision.reviewer_id.reset();
    revision.approved_at.reset();
    revision.revision += 1;
    revision.supersedes_id = approvedSessionId;
    revision.amendment_reason = reason.toStdString();
    revision.amended_at = at;
    revision.digest.clear();
    revision.outcome.reset();
    revision.record_format = kRecordFormat;
    if (!revision.settings) {
        revision.settings = EvaluationSettings{};
    }
    create(revision); // joins this transaction
    transaction.commit();
    return revision.id;
}

} // namespace mw::storage
