// Argon2id password hashes: the stored form, salting, checking.
#include "storage/password_hash.h"

#include <catch2/catch.hpp>

using mw::storage::hashPassword;
using mw::storage::passwordMatches;
using mw::storage::passwordNeedsRehash;

TEST_CASE("a hash is an Argon2id string with the interactive limits", "[password]") {
    const QByteArray hash = hashPassword(QStringLiteral("correct horse"));
    // Argon2 version 0x13 = 19 (RFC 9106 section 3.1); libsodium's *_INTERACTIVE limits are
    // 2 passes and 67108864 bytes = 65536 KiB (crypto_pwhash_argon2id.h of libsodium 1.0.18).
    CHECK(hash.startsWith("$argon2id$v=19$m=65536,t=2,p=1$"));
    CHECK_FALSE(passwordNeedsRehash(hash));
}

TEST_CASE("the right password matches, a wrong one does not, salts differ", "[password]") {
    const QByteArray first = hashPassword(QStringLiteral("Grüße 123"));
    const QByteArray second = hashPassword(QStringLiteral("Grüße 123"));
    CHECK(first != second); // random salt per hash
    CHECK(passwordMatches(QStringLiteral("Grüße 123"), first));
    CHECK(passwordMatches(QStringLiteral("Grüße 123"), second));
    CHECK_FALSE(passwordMatches(QStringLiteral("Grusse 123"), first));
    CHECK_FALSE(passwordMatches(QString(), first));
    CHECK_FALSE(passwordMatches(QStringLiteral("Grüße 123"), QByteArray("$argon2id$garbage")));
}
