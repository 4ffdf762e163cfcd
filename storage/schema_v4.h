// Schema version 3: every table with its columns listed explicitly, and the indexes.
#pragma once

#include <QString>
#include <QStringList>

#include <vector>

namespace mw::storage::schema4 {

struct TableDefinition {
    const char* name;
    const char* createSql;            // with placeholders; see expand()
    std::vector<const char*> columns; // every column, in the table's order
    // The key of a table without an id of its own (after session_id), logged with an insert.
    std::vector<const char*> keyColumns = {};
};

// The tables in the order they are created (a table after those it refers to).
const std::vector<TableDefinition>& tables();
// Throws std::invalid_argument for a name that is not a table of version 3.
const TableDefinition& table(const QString& name);

QStringList indexes();

// The CREATE statement with its placeholders expanded into SQLite's checks.
QString expand(const char* sql);

} // namespace mw::storage::schema4
