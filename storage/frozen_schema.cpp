// Splitting and running the frozen SQL of earlier schema versions.
#include "storage/frozen_schema.h"

#include "storage/sql_support.h"

namespace mw::storage::frozen {

QStringList statements(const char* sql) {
    QStringList lines = QString::fromUtf8(sql).split(QLatin1Char('\n'));
    while (!lines.isEmpty() && lines.first().startsWith(QLatin1String("--"))) {
        lines.removeFirst();
    }
    QStringList result;
    QStringList current;
    for (const QString& line : lines) {
        if (line == QLatin1String(";")) {
            result << current.join(QLatin1Char('\n'));
            current.clear();
        } else {
            current << line;
        }
    }
    return result;
}

void run(const QSqlDatabase& db, const char* sql, int version) {
    for (const QString& statement : statements(sql)) {
        sql::execText(db, statement, QStringLiteral("creating schema version %1").arg(version));
    }
}

} // namespace mw::storage::frozen
