// The upgrade steps that rebuild tables (as opposed to the frozen steps that only add).
#pragma once

#include "core/model/calibration.h"

#include <QSqlDatabase>

namespace mw::storage::schema {

// Version 2 -> 3, to the frozen SQL of version 3, inside the caller's transaction with foreign
// keys off. Throws WorkbookError (Corrupt) naming the table and row a version 3 check refuses.
void upgradeToVersion3(const QSqlDatabase& db);

// Version 3 -> 4 (schema_v4.cpp), likewise; `at` is recorded as the moment version 4 was
// reached, with the length of the chain then (its unsigned entries).
void upgradeToVersion4(const QSqlDatabase& db, Timestamp at);

// Records in schema_upgrades that `version` was reached at `at` (version 4 on).
void recordVersionReached(const QSqlDatabase& db, int version, Timestamp at);

} // namespace mw::storage::schema
