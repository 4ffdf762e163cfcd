// Loading whole calibration sessions (header, standards, readings, checks, notes, digest) with
// one query per table, however many sessions match. Shared by repository and verification.
#pragma once

#include "core/model/calibration.h"

#include <QSqlDatabase>
#include <QString>
#include <QVariant>

#include <vector>

namespace mw::storage::detail {

// `condition` is an SQL condition on calibration_sessions aliased "s" with at most one "?"
// bound to `value` (e.g. "s.instrument_id = ?"); sessions come oldest first.
std::vector<CalibrationSession> loadSessions(const QSqlDatabase& db, const QString& condition,
                                             const QVariant& value);

} // namespace mw::storage::detail
