// Approval keys: the rows of signing_keys and the password checks around them.
#include "storage/signing_keys.h"

#include "storage/password_hash.h"
#include "storage/sql_support.h"
#include "storage/transaction.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QSqlQuery>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

WorkbookError wrongPassword() {
    return WorkbookError(Kind::BadInput,
                         QStringLiteral("the password is not right, so the approval cannot be "
                                        "signed"));
}

struct KeyRow {
    std::int64_t id = 0;
    QByteArray publicKey;
    QByteArray sealedSecret;
};

std::optional<KeyRow> keyInUse(const QSqlDatabase& db, std::int64_t userId) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT id, public_key, sealed_secret FROM "
                                                  "signing_keys WHERE user_id = ? AND "
                                                  "retired_at IS NULL"));
    q.addBindValue(qint64(userId));
    sql::exec(q, QStringLiteral("reading the approval key of user %1").arg(userId));
    if (!q.next()) {
        return std::nullopt;
    }
    return KeyRow{q.value(0).toLongLong(), q.value(1).toByteArray(), q.value(2).toByteArray()};
}

// Issues a key sealed under `password` after checking it is the user's sign-in password.
KeyRow issueKey(Workbook& workbook, std::int64_t userId, const QString& password, Timestamp at) {
    const QSqlDatabase db = workbook.database();
    QSqlQuery user = sql::prepare(db, QStringLiteral("SELECT password_hash FROM users WHERE id = "
                                                     "? AND active = 1"));
    user.addBindValue(qint64(userId));
    sql::exec(user, QStringLiteral("reading user %1").arg(userId));
    if (!user.next()) {
        throw WorkbookError(Kind::NotFound,
                            QStringLiteral("no active user with id %1").arg(userId));
    }
    if (!passwordMatches(password, user.value(0).toString().toLatin1())) {
        throw wrongPassword();
    }
    const SealedKeyPair pair = makeSealedKeyPair(password);
    Transaction transaction(workbook);
    QSqlQuery insert = sql::prepare(db, QStringLiteral("INSERT INTO signing_keys (user_id, "
                                                       "public_key, sealed_secret, created_at) "
                                                       "VALUES (?, ?, ?, ?) RETURNING id"));
    insert.addBindValue(qint64(userId));
    insert.addBindValue(pair.publicKey);
    insert.addBindValue(pair.sealedSecret);
    insert.addBindValue(sql::toIso(at));
    sql::exec(insert, QStringLiteral("issuing an approval key for user %1").arg(userId));
    insert.next();
    const std::int64_t id = insert.value(0).toLongLong();
    insert.finish();
    transaction.commit();
    return {id, pair.publicKey, pair.sealedSecret};
}

} // namespace

ApprovalSigner unlockApprovalKey(Workbook& workbook, std::int64_t userId, const QString& password,
                                 Timestamp at) {
    std::optional<KeyRow> key = keyInUse(workbook.database(), userId);
    if (!key) {
        key = issueKey(workbook, userId, password, at);
    }
    std::optional<SecretKey> secret = openSealedSecret(key->sealedSecret, password);
    if (!secret) {
        throw wrongPassword();
    }
    return ApprovalSigner{userId, key->id, key->publicKey, std::move(*secret)};
}

void retireApprovalKey(const QSqlDatabase& db, std::int64_t userId, Timestamp at) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("UPDATE signing_keys SET retired_at = max(?, "
                                                  "created_at) WHERE user_id = ? AND retired_at "
                                                  "IS NULL"));
    q.addBindValue(sql::toIso(at));
    q.addBindValue(qint64(userId));
    sql::exec(q, QStringLiteral("retiring the approval key of user %1").arg(userId));
}

std::optional<StoredPublicKey> storedPublicKey(const QSqlDatabase& db, std::int64_t keyId) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT id, user_id, public_key, created_at, "
                                                  "retired_at FROM signing_keys WHERE id = ?"));
    q.addBindValue(qint64(keyId));
    sql::exec(q, QStringLiteral("reading approval key %1").arg(keyId));
    if (!q.next()) {
        return std::nullopt;
    }
    return StoredPublicKey{q.value(0).toLongLong(), q.value(1).toLongLong(),
                           q.value(2).toByteArray(), q.value(3).toString(),
                           q.value(4).isNull() ? QString() : q.value(4).toString()};
}

std::optional<QString> approvalKeyFingerprint(const QSqlDatabase& db, std::int64_t sessionId) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT k.public_key FROM record_chain c JOIN "
                                                  "signing_keys k ON k.id = c.signing_key_id "
                                                  "WHERE c.session_id = ?"));
    q.addBindValue(qint64(sessionId));
    sql::exec(q, QStringLiteral("reading the key that signed session %1").arg(sessionId));
    if (!q.next()) {
        return std::nullopt;
    }
    return keyFingerprint(q.value(0).toByteArray());
}

} // namespace mw::storage
