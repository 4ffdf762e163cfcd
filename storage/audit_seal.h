// The audit log as a hash chain of its own: every row, in id order, is folded into a running
// SHA-256 digest, and each approval records the digest through the newest row of its moment
// (record_chain.audit_through_id, audit_digest) under the reviewer's signature. A row edited or
// deleted up to a seal no longer gives the sealed digest.
#pragma once

#include <QByteArray>
#include <QSqlDatabase>
#include <QString>
#include <QStringList>

#include <cstdint>

namespace mw::storage {

struct AuditSeal {
    std::int64_t throughId = 0; // the newest row folded in (0: none)
    QString digest;             // lower-case hex; the start value before any row
};

// The digest before the first row: 64 zeros.
AuditSeal auditSealStart();

// The newest seal in the chain of approved records, or the start when none was made.
AuditSeal lastAuditSeal(const QSqlDatabase& db);

// `from` extended over every audit row after it, up to the newest (inside the caller's
// transaction, so no row can slip in between).
AuditSeal extendAuditSeal(const QSqlDatabase& db, const AuditSeal& from);

// What an approval signs: the record's chained digest and the audit seal it recorded.
QByteArray approvalMessage(const QString& recordDigest, const AuditSeal& seal);

// Folds every audit row and compares the result with each seal in the chain; names the first
// seal that no longer holds (and where the log has a gap, the first missing row). Adds the
// number of rows folded to `rowsChecked` and those after the newest seal to `rowsUnsealed`.
QStringList auditSealProblems(const QSqlDatabase& db, int& rowsChecked, int& rowsUnsealed);

} // namespace mw::storage
