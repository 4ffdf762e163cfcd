// The upgrade steps that rebuild tables (as opposed to the frozen steps that only add).
#pragma once

#include <QSqlDatabase>

namespace mw::storage::schema {

// Version 2 -> 3, inside the caller's transaction with foreign keys off. Throws WorkbookError
// (Corrupt) naming the table and row a version 3 check refuses.
void upgradeToVersion3(const QSqlDatabase& db);

} // namespace mw::storage::schema
