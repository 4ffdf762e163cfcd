// Inserting the parts of a calibration session; used by the repository and by amendments.
#pragma once

#include "core/model/calibration.h"

#include <QSqlDatabase>
#include <QSqlQuery>

#include <vector>

namespace mw::storage::detail {

// A StandardUse with an empty certificate number takes the standard's current one and its
// due date (the snapshot a record keeps).
void insertStandards(const QSqlDatabase& db, std::int64_t sessionId,
                     const std::vector<StandardUse>& standards);
// Inserts or replaces each reading by its key (range, point, direction, phase, repeat).
void insertReadings(const QSqlDatabase& db, std::int64_t sessionId,
                    const std::vector<Reading>& readings);
void insertResistorCheck(const QSqlDatabase& db, std::int64_t sessionId,
                         const ResistorCheck& check);
void insertAdjustmentNote(const QSqlDatabase& db, std::int64_t sessionId,
                          const AdjustmentNote& note);
// The copies a session is sealed with: replaces any it holds.
void replaceSealedInputs(const QSqlDatabase& db, std::int64_t sessionId,
                         const SealedInputs& inputs);
// NotFound naming the session when an UPDATE or DELETE touched no row.
void requireOneRow(const QSqlQuery& query, std::int64_t sessionId);

} // namespace mw::storage::detail
