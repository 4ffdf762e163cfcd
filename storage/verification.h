// Verification of a whole workbook: SQLite's integrity check, the digest chain of approved
// records, and the verdict of every session recomputed from the inputs it was sealed with.
#pragma once

#include <QString>

#include <cstdint>
#include <optional>

namespace mw::storage {

class Workbook;

struct VerificationReport {
    bool integrityOk = false; // PRAGMA integrity_check said "ok"
    QString integrityMessage; // its first complaint otherwise
    int recordsChecked = 0;   // approved records whose digest was recomputed
    int sessionsChecked = 0;  // every session, read and looked at
    // Sessions (submitted, returned, approved, superseded) whose stored outcome was compared
    // with the session evaluator's on their sealed inputs, and those sealed before the inputs
    // were recorded (record format 1), whose verdict cannot be recomputed as it was made.
    int verdictsChecked = 0;
    int verdictsNotRecorded = 0;
    // The first problem found, e.g. "record 3 (session 17, instrument 4, revision 1, approved
    // 2024-03-05T10:00:00Z): contents changed since approval", or a session whose stored
    // outcome no longer follows from its inputs, or one that cannot be read.
    std::optional<QString> firstMismatch;
    std::optional<std::int64_t> firstMismatchSessionId;
    // The chain head, to compare with a copy kept elsewhere: a chain cut back or rebuilt
    // inside the file still verifies, but its head no longer matches the copy.
    int chainLength = 0;     // entries in the chain
    QString chainHeadDigest; // digest of the last entry ("" when the chain is empty)

    bool sound() const { return integrityOk && !firstMismatch; }
};

// Recomputes every digest in approval order and checks each link of the chain, that every
// approved or superseded session has its entry, that a chained record is superseded exactly
// when a chained amendment supersedes it, that every session can be read, and that every stored
// outcome is the one the session evaluator gives on the inputs the session was sealed with.
// Reads only.
VerificationReport verifyWorkbook(const Workbook& workbook);

} // namespace mw::storage
