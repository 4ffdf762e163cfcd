// Writing the parts of a calibration session; used by the repository and by amendments.
#pragma once

#include "core/model/calibration.h"
#include "core/plan/session_plan.h"

#include <QSqlDatabase>
#include <QSqlQuery>

#include <optional>
#include <vector>

namespace mw::storage::detail {

// A StandardUse with an empty certificate number takes the standard's current one and its
// due date (the snapshot a record keeps).
void insertStandards(const QSqlDatabase& db, std::int64_t sessionId,
                     const std::vector<StandardUse>& standards);
// Inserts readings that are new to the session.
void insertReadings(const QSqlDatabase& db, std::int64_t sessionId,
                    const std::vector<Reading>& readings);
std::optional<Reading> findReading(const QSqlDatabase& db, std::int64_t sessionId,
                                   const ReadingKey& key);
// Updates the reading with the same key, else inserts it; returns the one it replaced.
std::optional<Reading> putReading(const QSqlDatabase& db, std::int64_t sessionId,
                                  const Reading& reading);
void deleteReading(const QSqlDatabase& db, std::int64_t sessionId, const ReadingKey& key);
void insertPlan(const QSqlDatabase& db, std::int64_t sessionId,
                const std::vector<TestPoint>& points);
// Return the new row's id.
std::int64_t insertResistorCheck(const QSqlDatabase& db, std::int64_t sessionId,
                                 const ResistorCheck& check);
std::int64_t insertAdjustmentNote(const QSqlDatabase& db, std::int64_t sessionId,
                                  const AdjustmentNote& note);
// The copies a session is sealed with: replaces any it holds.
void replaceSealedInputs(const QSqlDatabase& db, std::int64_t sessionId,
                         const SealedInputs& inputs);
// NotFound naming the session when an UPDATE or DELETE touched no row.
void requireOneRow(const QSqlQuery& query, std::int64_t sessionId);

} // namespace mw::storage::detail
