// Approval keys: Ed25519 through libsodium, the secret sealed under a password.
#include "storage/approval_key.h"

#include "storage/workbook_error.h"

#include <catch2/catch.hpp>

#include <QRegularExpression>

using mw::storage::keyFingerprint;
using mw::storage::makeSealedKeyPair;
using mw::storage::openSealedSecret;
using mw::storage::SecretKey;
using mw::storage::signatureValid;

namespace {

QByteArray hex(const char* text) {
    return QByteArray::fromHex(QByteArray(text));
}

} // namespace

TEST_CASE("Ed25519 signs and verifies as RFC 8032 prints it", "[approval-key]") {
    // RFC 8032 section 7.1, TEST 1 (empty message) and TEST 2 (one byte 0x72), from memory.
    // libsodium's secret key is the 32-byte seed followed by the public key.
    struct Vector {
        const char* seed;
        const char* publicKey;
        QByteArray message;
        const char* signature;
    };
    const Vector vectors[] = {
        {"9d61b19deffd5a60ba844af492ec2cc44449c5697b326919703bac031cae7f60",
         "d75a980182b10ab7d54bfed3c964073a0ee172f3daa62325af021a68f707511a", QByteArray(),
         "e5564300c360ac729086e2cc806e828a84877f1eb8e5d974d873e065224901555fb8821590a33bacc61e39"
         "701cf9b46bd25bf5f0595bbe24655141438e7a100b"},
        {"4ccd089b28ff96da9db6c346ec114e0f5b8a319f35aba624da8cf6ed4fb8a6fb",
         "3d4017c3e843895a92b70aa74d1b7ebc9c982ccf2ec4968cc0cd55f12af4660c", hex("72"),
         "92a009a9f0d4cab8720e820b5f642540a2b27b5416503f8fb3762223ebdb69da085ac1e43e15996e458f36"
         "13d0f11d8c387b2eaeb4302aeeb00d291612bb0c00"},
    };
    for (const Vector& v : vectors) {
        const QByteArray publicKey = hex(v.publicKey);
        const QByteArray signature = hex(v.signature);
        const SecretKey secret(hex(v.seed) + publicKey);
        CHECK(secret.sign(v.message) == signature);
        CHECK(signatureValid(publicKey, v.message, signature));
        CHECK_FALSE(signatureValid(publicKey, v.message + 'x', signature));
        QByteArray flipped = signature;
        flipped[5] = char(flipped[5] ^ 0x01);
        CHECK_FALSE(signatureValid(publicKey, v.message, flipped));
    }
}

TEST_CASE("a sealed secret opens with its password only", "[approval-key]") {
    const auto pair = makeSealedKeyPair(QStringLiteral("correct horse"));
    CHECK(pair.publicKey.size() == 32);
    const auto secret = openSealedSecret(pair.sealedSecret, QStringLiteral("correct horse"));
    REQUIRE(secret);
    const QByteArray message = QByteArrayLiteral("record digest and audit seal");
    CHECK(signatureValid(pair.publicKey, message, secret->sign(message)));

    CHECK_FALSE(openSealedSecret(pair.sealedSecret, QStringLiteral("correct horse ")));
    CHECK_FALSE(openSealedSecret(pair.sealedSecret, QString()));
    // One byte of the sealed secret changed: the authenticated box refuses to open.
    QByteArray altered = pair.sealedSecret;
    altered[altered.size() - 3] = char(altered[altered.size() - 3] ^ 0x40);
    CHECK_FALSE(openSealedSecret(altered, QStringLiteral("correct horse")));
    // Not a sealed key of this form at all.
    CHECK_THROWS_AS(openSealedSecret(QByteArrayLiteral("short"), QStringLiteral("x")),
                    mw::storage::WorkbookError);
    // Two pairs made with one password share nothing.
    const auto other = makeSealedKeyPair(QStringLiteral("correct horse"));
    CHECK(other.publicKey != pair.publicKey);
    CHECK(other.sealedSecret != pair.sealedSecret);
}

TEST_CASE("a key's fingerprint is eight groups of four hex digits", "[approval-key]") {
    const QByteArray publicKey =
        hex("d75a980182b10ab7d54bfed3c964073a0ee172f3daa62325af021a68f707511a");
    const QString fingerprint = keyFingerprint(publicKey);
    CHECK(QRegularExpression(QStringLiteral("^([0-9a-f]{4} ){7}[0-9a-f]{4}$"))
              .match(fingerprint)
              .hasMatch());
    CHECK(keyFingerprint(publicKey) == fingerprint);
    QByteArray other = publicKey;
    other[0] = char(other[0] ^ 1);
    CHECK(keyFingerprint(other) != fingerprint);
}
