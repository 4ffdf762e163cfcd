// A reviewer's approval key: an Ed25519 key pair (libsodium crypto_sign) whose secret half is
// stored sealed under a key derived from the holder's password (Argon2id, then
// XSalsa20-Poly1305 secretbox), so that signing an approval needs the password. No SQL here.
#pragma once

#include <QByteArray>
#include <QString>

#include <optional>

namespace mw::storage {

struct SealedKeyPair {
    QByteArray publicKey;    // 32 bytes
    QByteArray sealedSecret; // format tag, Argon2id salt, nonce, sealed 64-byte secret key
};

// A new key pair with its secret sealed under `password`. Throws WorkbookError (Internal) when
// libsodium cannot be initialised or Argon2id cannot have its memory.
SealedKeyPair makeSealedKeyPair(const QString& password);

// The secret key of a sealed pair, wiped from memory when it goes.
class SecretKey {
public:
    explicit SecretKey(QByteArray bytes);
    ~SecretKey();
    SecretKey(SecretKey&& other) noexcept;
    SecretKey& operator=(SecretKey&& other) noexcept;
    SecretKey(const SecretKey&) = delete;
    SecretKey& operator=(const SecretKey&) = delete;

    // The detached 64-byte Ed25519 signature of `message`.
    QByteArray sign(const QByteArray& message) const;

private:
    QByteArray bytes_;
};

// Opens a sealed secret with `password`; nullopt when the password is not the one it was
// sealed under (or the sealed bytes were altered). Throws WorkbookError (Corrupt) for bytes
// that are not a sealed key of this format at all.
std::optional<SecretKey> openSealedSecret(const QByteArray& sealedSecret, const QString& password);

bool signatureValid(const QByteArray& publicKey, const QByteArray& message,
                    const QByteArray& signature);

// How a person recognises a key: the first 16 bytes of the SHA-256 of the public key, in
// lower-case hexadecimal groups of four ("3f2a 09c1 …").
QString keyFingerprint(const QByteArray& publicKey);

} // namespace mw::storage
