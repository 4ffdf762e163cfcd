// Tamper evidence: the canonical text of an approved record and its SHA-256 digest chained with
// the previously approved record (storage/verification.h checks the whole chain).
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

// The short form of a digest shown to people: its first 16 hex digits.
QString shortDigest(const QString& digest);

} // namespace mw::storage
