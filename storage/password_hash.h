// Password hashing with libsodium's Argon2id (crypto_pwhash_str), interactive limits.
#pragma once

#include <QByteArray>
#include <QString>

namespace mw::storage {

// Argon2id13, opslimit = crypto_pwhash_OPSLIMIT_INTERACTIVE (2 passes), memlimit =
// crypto_pwhash_MEMLIMIT_INTERACTIVE (64 MiB), random 16-byte salt; the result is the
// self-describing "$argon2id$v=19$m=65536,t=2,p=1$..." string. Throws WorkbookError
// (Internal) when libsodium cannot be initialised or cannot allocate the memory.
QByteArray hashPassword(const QString& password);

// Constant-time check of `password` against a stored hash string.
bool passwordMatches(const QString& password, const QByteArray& storedHash);

// True when the stored hash uses weaker parameters than hashPassword() would now.
bool passwordNeedsRehash(const QByteArray& storedHash);

} // namespace mw::storage
