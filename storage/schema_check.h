// The schema a workbook must have, compared by definition: every table, index and trigger of
// its version as the program creates them, and every stored value held to those definitions.
#pragma once

#include <QSqlDatabase>
#include <QString>
#include <QStringList>

namespace mw::storage::schema {

// What differs between the schema objects of `db` and those a workbook of `version` must have:
// a missing object, one whose definition was changed, one the program never creates. Empty when
// they agree. For an earlier version, triggers the current version also installs with the same
// definition are accepted as additions (rules added to that version after it shipped).
QStringList differences(const QSqlDatabase& db, int version);

// The names of triggers of `version` missing from `db` or not as the program creates them.
QStringList missingRules(const QSqlDatabase& db, int version);

// Every row of the workbook at `path` (read-only) held to the tables' definitions of `version`
// (types of STRICT tables, NOT NULL, CHECK vocabularies and ranges, UNIQUE): the first row of
// each table that breaks one, naming the table, the row and its session where it has one, and
// SQLite's reason. Empty when every row holds.
QStringList valueProblems(const QString& path, int version);

} // namespace mw::storage::schema
