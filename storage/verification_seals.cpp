// Verification of what version 4 adds to each approval: the reviewer's signature over the
// record's digest and the audit seal, and the audit log's own chain up to each seal.
#include "storage/audit_seal.h"
#include "storage/signing_keys.h"
#include "storage/sql_support.h"
#include "storage/verification.h"

#include <QSqlQuery>
#include <QVariant>

namespace mw::storage {
namespace {

struct SignedEntry {
    int position = 0;
    std::int64_t sessionId = 0;
    QString digest;
    std::optional<AuditSeal> seal;
    std::optional<std::int64_t> keyId;
    QByteArray signature;
    std::optional<std::int64_t> reviewerId;
};

std::vector<SignedEntry> signedEntries(const QSqlDatabase& db) {
    QSqlQuery q =
        sql::prepare(db, QStringLiteral("SELECT c.session_id, c.digest, c.audit_through_id, "
                                        "c.audit_digest, c.signing_key_id, c.signature, "
                                        "s.reviewer_id FROM record_chain c LEFT JOIN "
                                        "calibration_sessions s ON s.id = c.session_id ORDER BY "
                                        "c.id"));
    sql::exec(q, QStringLiteral("reading the signatures of approved records"));
    std::vector<SignedEntry> entries;
    int position = 0;
    while (q.next()) {
        SignedEntry e;
        e.position = ++position;
        e.sessionId = q.value(0).toLongLong();
        e.digest = q.value(1).toString();
        if (!q.value(2).isNull()) {
            e.seal = AuditSeal{q.value(2).toLongLong(), q.value(3).toString()};
        }
        if (!q.value(4).isNull()) {
            e.keyId = q.value(4).toLongLong();
        }
        e.signature = q.value(5).toByteArray();
        if (!q.value(6).isNull()) {
            e.reviewerId = q.value(6).toLongLong();
        }
        entries.push_back(std::move(e));
    }
    return entries;
}

// How many entries of the chain were made before approvals were signed, as the upgrade to
// version 4 recorded it; nullopt when the workbook does not say.
std::optional<int> unsignedEntriesAllowed(const QSqlDatabase& db) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT chain_length FROM schema_upgrades "
                                                  "WHERE version = 4"));
    sql::exec(q, QStringLiteral("reading when signed approvals began"));
    if (!q.next()) {
        return std::nullopt;
    }
    return q.value(0).toInt();
}

std::optional<QString> signatureProblem(const QSqlDatabase& db, const SignedEntry& e,
                                        int allowedUnsigned, VerificationReport& report) {
    if (!e.keyId || !e.seal) {
        if (e.position <= allowedUnsigned) {
            return std::nullopt; // approved before signatures, under version 3 or earlier
        }
        return QStringLiteral("it is not signed, yet it was approved after signed approvals "
                              "began (record %1 on)")
            .arg(allowedUnsigned + 1);
    }
    const std::optional<StoredPublicKey> key = storedPublicKey(db, *e.keyId);
    if (!key) {
        return QStringLiteral("the key it was signed with (key %1) is missing").arg(*e.keyId);
    }
    if (!e.reviewerId || key->userId != *e.reviewerId) {
        return QStringLiteral("it was signed with key %1 of user %2, not with a key of its "
                              "reviewer")
            .arg(key->id)
            .arg(key->userId);
    }
    if (!signatureValid(key->publicKey, approvalMessage(e.digest, *e.seal), e.signature)) {
        return QStringLiteral("its signature does not match its digest and audit seal (key %1, "
                              "fingerprint %2)")
            .arg(key->id)
            .arg(keyFingerprint(key->publicKey));
    }
    ++report.signaturesChecked;
    return std::nullopt;
}

} // namespace

void detail::checkSeals(const QSqlDatabase& db, VerificationReport& report) {
    const std::optional<int> allowed = unsignedEntriesAllowed(db);
    if (!allowed) {
        report.note(QStringLiteral("schema_upgrades: the workbook does not record when signed "
                                   "approvals began (no row for version 4)"));
    }
    for (const SignedEntry& e : signedEntries(db)) {
        if (const auto problem = signatureProblem(db, e, allowed.value_or(0), report)) {
            report.note(QStringLiteral("record %1 (session %2): %3")
                            .arg(e.position)
                            .arg(e.sessionId)
                            .arg(*problem),
                        e.sessionId);
        }
    }
    for (const QString& problem :
         auditSealProblems(db, report.auditRowsChecked, report.auditRowsUnsealed)) {
        report.note(problem);
    }
}

} // namespace mw::storage
