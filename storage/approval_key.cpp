// Approval keys through libsodium: crypto_sign (Ed25519), crypto_pwhash (Argon2id13 at the
// interactive limits, as for password hashes) and crypto_secretbox (XSalsa20-Poly1305).
#include "storage/approval_key.h"

#include "storage/workbook_error.h"

#include <QCryptographicHash>
#include <QStringList>

#include <sodium.h>

#include <utility>

namespace mw::storage {
namespace {

const QByteArray kFormatTag = QByteArrayLiteral("mwk1");
constexpr qsizetype kSaltBytes = crypto_pwhash_SALTBYTES;
constexpr qsizetype kNonceBytes = crypto_secretbox_NONCEBYTES;
constexpr qsizetype kSealedBytes = crypto_sign_SECRETKEYBYTES + crypto_secretbox_MACBYTES;

void ensureSodium() {
    static const int status = sodium_init();
    if (status < 0) {
        throw WorkbookError(WorkbookError::Kind::Internal,
                            QStringLiteral("libsodium could not be initialised"));
    }
}

// The secretbox key for `password` and `salt`; wiped by the caller.
QByteArray derivedKey(const QString& password, const QByteArray& salt) {
    const QByteArray utf8 = password.toUtf8();
    QByteArray key(crypto_secretbox_KEYBYTES, '\0');
    if (crypto_pwhash(reinterpret_cast<unsigned char*>(key.data()),
                      static_cast<unsigned long long>(key.size()), utf8.constData(),
                      static_cast<unsigned long long>(utf8.size()),
                      reinterpret_cast<const unsigned char*>(salt.constData()),
                      crypto_pwhash_OPSLIMIT_INTERACTIVE, crypto_pwhash_MEMLIMIT_INTERACTIVE,
                      crypto_pwhash_ALG_ARGON2ID13) != 0) {
        throw WorkbookError(WorkbookError::Kind::Internal,
                            QStringLiteral("deriving a key from a password failed: not enough "
                                           "memory for Argon2id"));
    }
    return key;
}

void wipe(QByteArray& bytes) {
    if (!bytes.isEmpty()) {
        sodium_memzero(bytes.data(), static_cast<std::size_t>(bytes.size()));
    }
}

const unsigned char* bytesOf(const QByteArray& a) {
    return reinterpret_cast<const unsigned char*>(a.constData());
}

} // namespace

SealedKeyPair makeSealedKeyPair(const QString& password) {
    ensureSodium();
    QByteArray publicKey(crypto_sign_PUBLICKEYBYTES, '\0');
    QByteArray secret(crypto_sign_SECRETKEYBYTES, '\0');
    crypto_sign_keypair(reinterpret_cast<unsigned char*>(publicKey.data()),
                        reinterpret_cast<unsigned char*>(secret.data()));
    QByteArray salt(kSaltBytes, '\0');
    QByteArray nonce(kNonceBytes, '\0');
    randombytes_buf(salt.data(), static_cast<std::size_t>(salt.size()));
    randombytes_buf(nonce.data(), static_cast<std::size_t>(nonce.size()));
    QByteArray key = derivedKey(password, salt);
    QByteArray sealed(kSealedBytes, '\0');
    crypto_secretbox_easy(reinterpret_cast<unsigned char*>(sealed.data()), bytesOf(secret),
                          static_cast<unsigned long long>(secret.size()), bytesOf(nonce),
                          bytesOf(key));
    wipe(key);
    wipe(secret);
    return {publicKey, kFormatTag + salt + nonce + sealed};
}

SecretKey::SecretKey(QByteArray bytes)
    : bytes_(std::move(bytes)) {}

SecretKey::~SecretKey() {
    wipe(bytes_);
}

SecretKey::SecretKey(SecretKey&& other) noexcept
    : bytes_(std::exchange(other.bytes_, {})) {}

SecretKey& SecretKey::operator=(SecretKey&& other) noexcept {
    if (this != &other) {
        wipe(bytes_);
        bytes_ = std::exchange(other.bytes_, {});
    }
    return *this;
}

QByteArray SecretKey::sign(const QByteArray& message) const {
    QByteArray signature(crypto_sign_BYTES, '\0');
    crypto_sign_detached(reinterpret_cast<unsigned char*>(signature.data()), nullptr,
                         bytesOf(message), static_cast<unsigned long long>(message.size()),
                         bytesOf(bytes_));
    return signature;
}

std::optional<SecretKey> openSealedSecret(const QByteArray& sealedSecret, const QString& password) {
    ensureSodium();
    const qsizetype tag = kFormatTag.size();
    if (sealedSecret.size() != tag + kSaltBytes + kNonceBytes + kSealedBytes ||
        !sealedSecret.startsWith(kFormatTag)) {
        throw WorkbookError(WorkbookError::Kind::Corrupt,
                            QStringLiteral("a stored approval key is not in a form this program "
                                           "knows (%1 bytes)")
                                .arg(sealedSecret.size()));
    }
    const QByteArray salt = sealedSecret.mid(tag, kSaltBytes);
    const QByteArray nonce = sealedSecret.mid(tag + kSaltBytes, kNonceBytes);
    const QByteArray sealed = sealedSecret.mid(tag + kSaltBytes + kNonceBytes);
    QByteArray key = derivedKey(password, salt);
    QByteArray secret(crypto_sign_SECRETKEYBYTES, '\0');
    const bool opened =
        crypto_secretbox_open_easy(reinterpret_cast<unsigned char*>(secret.data()), bytesOf(sealed),
                                   static_cast<unsigned long long>(sealed.size()), bytesOf(nonce),
                                   bytesOf(key)) == 0;
    wipe(key);
    if (!opened) {
        wipe(secret);
        return std::nullopt;
    }
    return SecretKey(std::move(secret));
}

bool signatureValid(const QByteArray& publicKey, const QByteArray& message,
                    const QByteArray& signature) {
    ensureSodium();
    if (publicKey.size() != crypto_sign_PUBLICKEYBYTES || signature.size() != crypto_sign_BYTES) {
        return false;
    }
    return crypto_sign_verify_detached(bytesOf(signature), bytesOf(message),
                                       static_cast<unsigned long long>(message.size()),
                                       bytesOf(publicKey)) == 0;
}

QString keyFingerprint(const QByteArray& publicKey) {
    const QByteArray hex =
        QCryptographicHash::hash(publicKey, QCryptographicHash::Sha256).left(16).toHex();
    QStringList groups;
    for (qsizetype i = 0; i < hex.size(); i += 4) {
        groups << QString::fromLatin1(hex.mid(i, 4));
    }
    return groups.join(QLatin1Char(' '));
}

} // namespace mw::storage
