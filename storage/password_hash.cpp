// Argon2id password hashes through libsodium's crypto_pwhash_str family.
#include "storage/password_hash.h"

#include "storage/workbook_error.h"

#include <sodium.h>

namespace mw::storage {
namespace {

void ensureSodium() {
    static const int status = sodium_init(); // 0 first time, 1 when already initialised
    if (status < 0) {
        throw WorkbookError(WorkbookError::Kind::Internal,
                            QStringLiteral("libsodium could not be initialised"));
    }
}

constexpr unsigned long long kOpsLimit = crypto_pwhash_OPSLIMIT_INTERACTIVE;
constexpr std::size_t kMemLimit = crypto_pwhash_MEMLIMIT_INTERACTIVE;

} // namespace

QByteArray hashPassword(const QString& password) {
    ensureSodium();
    const QByteArray utf8 = password.toUtf8();
    char out[crypto_pwhash_STRBYTES];
    if (crypto_pwhash_str_alg(out, utf8.constData(), static_cast<unsigned long long>(utf8.size()),
                              kOpsLimit, kMemLimit, crypto_pwhash_ALG_ARGON2ID13) != 0) {
        throw WorkbookError(WorkbookError::Kind::Internal,
                            QStringLiteral("hashing a password failed: not enough memory for "
                                           "Argon2id"));
    }
    return QByteArray(out);
}

bool passwordMatches(const QString& password, const QByteArray& storedHash) {
    ensureSodium();
    const QByteArray utf8 = password.toUtf8();
    const QByteArray terminated = storedHash + '\0';
    return crypto_pwhash_str_verify(terminated.constData(), utf8.constData(),
                                    static_cast<unsigned long long>(utf8.size())) == 0;
}

bool passwordNeedsRehash(const QByteArray& storedHash) {
    ensureSodium();
    const QByteArray terminated = storedHash + '\0';
    return crypto_pwhash_str_needs_rehash(terminated.constData(), kOpsLimit, kMemLimit) != 0;
}

} // namespace mw::storage
