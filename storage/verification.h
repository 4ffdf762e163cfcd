// Verification of a whole workbook: SQLite's integrity and foreign key checks, the schema and
// every stored value against the definitions of the workbook's version, the digest chain of
// approved records, and the verdict of every session recomputed from the inputs it was sealed
// with.
#pragma once

#include <QSqlDatabase>
#include <QString>
#include <QStringList>

#include <cstdint>
#include <optional>

namespace mw::storage {

class Workbook;

struct VerificationReport {
    int schemaVersion = 0;    // the workbook's version, checked as it is
    bool integrityOk = false; // PRAGMA integrity_check said "ok"
    QString integrityMessage; // its first complaint otherwise
    int recordsChecked = 0;   // approved records whose digest was recomputed
    int sessionsChecked = 0;  // every session, read and looked at
    // Sessions (submitted, returned, approved, superseded) whose stored outcome was compared
    // with the session evaluator's on their sealed inputs, and those sealed before the inputs
    // were recorded (record format 1), whose verdict cannot be recomputed as it was made.
    int verdictsChecked = 0;
    int verdictsNotRecorded = 0;
    // Every problem found, in the order of the checks (integrity, foreign keys, schema, values,
    // chain, sessions), e.g. "trigger sessions_sealed is missing", "table calibration_readings,
    // row id 7 (session 3): cannot store TEXT value in REAL column ...", "record 3 (session 17,
    // instrument 4, revision 1, approved 2024-03-05T10:00:00Z): contents changed since approval".
    QStringList problems;
    // The first of them that names a record (else the first of them), and its session (0 when
    // it names none).
    std::optional<QString> firstMismatch;
    std::optional<std::int64_t> firstMismatchSessionId;
    // The chain head, to compare with a copy kept elsewhere: a chain cut back or rebuilt
    // inside the file still verifies, but its head no longer matches the copy.
    int signaturesChecked = 0; // approvals whose reviewer's signature was checked
    int auditRowsChecked = 0;  // audit log rows folded into its chain
    int auditRowsUnsealed = 0; // of those, rows after the newest approval (sealed by the next)
    int chainLength = 0;       // entries in the chain
    QString chainHeadDigest;   // digest of the last entry ("" when the chain is empty)

    bool sound() const { return integrityOk && problems.isEmpty(); }
    // Records a problem; `at` places it before those found since (e.g. the chain before the
    // sessions it explains).
    void note(const QString& problem, std::int64_t sessionId = 0, qsizetype at = -1);
};

// Runs every check on an open workbook (of any version it opened at; an older one's records
// are checked in an upgraded throw-away copy, the workbook itself is only read).
VerificationReport verifyWorkbook(const Workbook& workbook);

// Opens the workbook file at `path` read-only, as it is (an older version is not upgraded),
// and verifies it; writes nothing and leaves no file behind. Throws WorkbookError when the file
// cannot be opened as a workbook at all.
VerificationReport verifyWorkbookFile(const QString& path);

namespace detail {
// The chain and the sessions of a workbook at the current version (verification.cpp).
void checkRecords(const QSqlDatabase& db, VerificationReport& report);
// The signatures of the chain and the audit log's seals (verification_seals.cpp).
void checkSeals(const QSqlDatabase& db, VerificationReport& report);
} // namespace detail

} // namespace mw::storage
