// The review workflow of calibration sessions: submit, return, reopen, approve (sealing the
// record into the digest chain) and amend.
#include "storage/record_digest.h"
#include "storage/session_loader.h"
#include "storage/session_parts.h"
#include "storage/session_repository.h"
#include "storage/sql_support.h"
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

void SessionRepository::submit(std::int64_t sessionId, Timestamp at) {
    Transaction transaction(workbook_);
    QSqlQuery q = sql::prepare(workbook_.database(),
                               QStringLiteral("UPDATE calibration_sessions SET state = "
                                              "'submitted', submitted_at = ? WHERE id = ?"));
    q.addBindValue(sql::toIso(at));
    q.addBindValue(qint64(sessionId));
    sql::exec(q, QStringLiteral("submitting calibration session %1").arg(sessionId));
    detail::requireOneRow(q, sessionId);
    transaction.commit();
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
    QSqlQuery q = sql::prepare(workbook_.database(),
                               QStringLiteral("UPDATE calibration_sessions SET state = 'draft' "
                                              "WHERE id = ? AND state = 'returned'"));
    q.addBindValue(qint64(sessionId));
    sql::exec(q, QStringLiteral("reopening calibration session %1").arg(sessionId));
    if (q.numRowsAffected() != 1) {
        throw WorkbookError(
            Kind::RuleViolation,
            QStringLiteral("calibration session %1 is not a returned session").arg(sessionId));
    }
    transaction.commit();
}

QString SessionRepository::approve(std::int64_t sessionId, std::int64_t reviewerId, Timestamp at) {
    const QSqlDatabase db = workbook_.database();
    Transaction transaction(workbook_, Transaction::Durability::Full);
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
    QSqlQuery seal = sql::prepare(db, QStringLiteral("INSERT INTO record_chain (session_id, "
                                                     "previous_digest, digest, recorded_at) "
                                                     "VALUES (?, ?, ?, ?)"));
    seal.addBindValue(qint64(sessionId));
    seal.addBindValue(previous);
    seal.addBindValue(digest);
    seal.addBindValue(sql::toIso(at));
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
    create(revision); // joins this transaction
    transaction.commit();
    return revision.id;
}

} // namespace mw::storage
