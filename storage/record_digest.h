// Tamper evidence: the canonical text of an approved record, its SHA-256 digest chained with
// the previously approved record, and the verification of the whole chain.
#pragma once

#include "core/model/calibration.h"
#include "storage/record_context.h"

#include <QByteArray>
#include <QString>

#include <cstdint>
#include <optional>

namespace mw::storage {

class Workbook;

// Canonical serialisation (UTF-8, one "key=value" line per field, fixed order, readings sorted
// by their key, numbers in shortest round-trip form), followed by the instrument's
// conformity-defining specification, the ranges used and the signatories' login and name from
// `context`. State and digest are not part of it: an approved record later superseded keeps
// its digest.
QByteArray canonicalRecord(const CalibrationSession& session, const RecordContext& context);

// Lower-case hex SHA-256 of previousDigest + "\n" + canonical; previousDigest is "" for the
// first record of a workbook.
QString chainDigest(const QString& previousDigest, const QByteArray& canonical);

struct VerificationReport {
    bool integrityOk = false; // PRAGMA integrity_check said "ok"
    QString integrityMessage; // its first complaint otherwise
    int recordsChecked = 0;   // approved records whose digest was recomputed
    int sessionsChecked = 0;  // all sessions looked at for a missing chain entry
    // The first record that no longer matches, e.g. "record 3 (session 17, instrument VM-004,
    // revision 1, approved 2024-03-05T10:00:00Z): contents changed since approval".
    std::optional<QString> firstMismatch;
    std::optional<std::int64_t> firstMismatchSessionId;
    // The chain head, to compare with a copy kept elsewhere: a chain cut back or rebuilt
    // inside the file still verifies, but its head no longer matches the copy.
    int chainLength = 0;     // entries in the chain
    QString chainHeadDigest; // digest of the last entry ("" when the chain is empty)

    bool sound() const { return integrityOk && !firstMismatch; }
};

// Recomputes every digest in approval order and checks each link of the chain, that every
// approved or superseded session has its entry, and that a chained record is superseded exactly
// when a chained amendment supersedes it. Reads only.
VerificationReport verifyWorkbook(const Workbook& workbook);

// The short form of a digest shown to people: its first 16 hex digits.
QString shortDigest(const QString& digest);

} // namespace mw::storage
