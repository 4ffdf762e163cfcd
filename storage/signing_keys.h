// Reviewers' approval keys in the workbook: issued when a person first approves, opened with
// their password for each approval, retired (never deleted) when their password changes.
#pragma once

#include "core/model/calibration.h"
#include "storage/approval_key.h"

#include <QByteArray>
#include <QSqlDatabase>
#include <QString>

#include <cstdint>
#include <optional>

namespace mw::storage {

class Workbook;

// What signs an approval: a reviewer's key in use, opened with their password.
struct ApprovalSigner {
    std::int64_t userId = 0;
    std::int64_t keyId = 0;
    QByteArray publicKey;
    SecretKey secretKey;
};

// Opens the key in use of user `userId` with `password`. A person without one (a workbook from
// before signed approvals, or a first approval) is issued one under this password once it is
// checked against their sign-in. Throws WorkbookError: BadInput when the password is not
// theirs, NotFound for no such active user.
ApprovalSigner unlockApprovalKey(Workbook& workbook, std::int64_t userId, const QString& password,
                                 Timestamp at);

// Retires the key in use of `userId`, if any (inside the caller's transaction): a changed
// password leaves the old sealed secret unopenable, and its public key still verifies what it
// signed.
void retireApprovalKey(const QSqlDatabase& db, std::int64_t userId, Timestamp at);

// A stored key by id: its holder and public key (nullopt when there is none).
struct StoredPublicKey {
    std::int64_t id = 0;
    std::int64_t userId = 0;
    QByteArray publicKey;
    QString createdAt;
    QString retiredAt; // empty while in use
};
std::optional<StoredPublicKey> storedPublicKey(const QSqlDatabase& db, std::int64_t keyId);

// The fingerprint of the key that signed the approval of `sessionId` (nullopt when it is not
// approved, or was approved before approvals were signed).
std::optional<QString> approvalKeyFingerprint(const QSqlDatabase& db, std::int64_t sessionId);

} // namespace mw::storage
