// Comparing the chain of approved records with an older copy of the workbook.
#include "storage/chain_anchor.h"

#include "storage/record_digest.h"
#include "storage/sql_support.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QFileInfo>
#include <QSet>

namespace mw::storage {
namespace {

using Kind = WorkbookError::Kind;

QSet<QString> columnsOf(const QSqlDatabase& db, const QString& table) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT name FROM pragma_table_info(?)"));
    q.addBindValue(table);
    sql::exec(q, QStringLiteral("reading the columns of table %1").arg(table));
    QSet<QString> columns;
    while (q.next()) {
        columns.insert(q.value(0).toString());
    }
    return columns;
}

// A column of the session or instrument that names the record, or NULL where an unexpected
// workbook lacks it: the chain itself is what is compared, the rest only helps to read it.
QString columnOrNull(const QSet<QString>& columns, const char* alias, const char* column) {
    return columns.contains(QLatin1String(column))
               ? QStringLiteral("%1.%2").arg(QLatin1String(alias), QLatin1String(column))
               : QStringLiteral("NULL");
}

QString labNameOf(const QSqlDatabase& db) {
    if (!columnsOf(db, QStringLiteral("lab")).contains(QStringLiteral("name"))) {
        return {};
    }
    return sql::scalar(db, QStringLiteral("SELECT name FROM lab WHERE id = 1"),
                       QStringLiteral("reading the laboratory's name"))
        .toString();
}

bool sameEntry(const ChainEntry& a, const ChainEntry& b) {
    return a.digest == b.digest;
}

} // namespace

QString describeEntry(const ChainEntry& entry) {
    QStringList parts{QStringLiteral("session %1").arg(entry.sessionId)};
    if (!entry.instrument.isEmpty()) {
        parts << QStringLiteral("instrument %1").arg(entry.instrument);
    }
    if (entry.revision) {
        parts << QStringLiteral("revision %1").arg(*entry.revision);
    }
    if (!entry.approvedAt.isEmpty()) {
        parts << QStringLiteral("approved %1").arg(entry.approvedAt);
    }
    return QStringLiteral("record %1 (%2)")
        .arg(entry.position)
        .arg(parts.join(QStringLiteral(", ")));
}

ChainHead headOf(const std::vector<ChainEntry>& entries) {
    return {int(entries.size()), entries.empty() ? QString() : entries.back().digest};
}

AnchorComparison compareWithCopy(const std::vector<ChainEntry>& copy,
                                 const std::vector<ChainEntry>& workbook, const QString& copyName) {
    AnchorComparison result;
    result.copyLength = int(copy.size());
    result.workbookLength = int(workbook.size());
    for (std::size_t i = 0; i < copy.size(); ++i) {
        const ChainEntry& kept = copy[i];
        const QString who = QStringLiteral("%1 in the copy %2").arg(describeEntry(kept), copyName);
        if (i >= workbook.size()) {
            result.firstDifference =
                who +
                QStringLiteral(" is missing from the workbook, whose chain ends at record %1 "
                               "(the copy's last %2 gone)")
                    .arg(workbook.size())
                    .arg(copy.size() - workbook.size() == 1
                             ? QStringLiteral("record is")
                             : QStringLiteral("%1 records are").arg(copy.size() - workbook.size()));
        } else if (!sameEntry(kept, workbook[i])) {
            const ChainEntry& now = workbook[i];
            QString why = now.sessionId == kept.sessionId
                              ? QStringLiteral(" changed since the copy: its digest was %1, the "
                                               "workbook holds %2")
                                    .arg(shortDigest(kept.digest), shortDigest(now.digest))
                              : QStringLiteral(" changed since the copy: the workbook holds %1 "
                                               "at that position")
                                    .arg(describeEntry(now));
            if (i == 0) {
                // Nothing in common from the first record on: most likely another workbook.
                why += QStringLiteral("; as the very first record differs, the copy may be of "
                                      "another workbook");
            }
            result.firstDifference = who + why;
        }
        if (result.firstDifference) {
            result.firstDifferenceSessionId = kept.sessionId;
            return result;
        }
        ++result.unchanged;
    }
    result.addedSince = int(workbook.size() - copy.size());
    return result;
}

std::vector<ChainEntry> readChain(const QSqlDatabase& db) {
    const QSet<QString> chain = columnsOf(db, QStringLiteral("record_chain"));
    for (const char* needed : {"id", "session_id", "digest"}) {
        if (!chain.contains(QLatin1String(needed))) {
            throw WorkbookError(
                Kind::NotAWorkbook,
                chain.isEmpty()
                    ? QStringLiteral("%1 has no chain of approved records (table record_chain)")
                          .arg(db.databaseName())
                    : QStringLiteral("%1: the chain of approved records (table record_chain) has "
                                     "no column %2")
                          .arg(db.databaseName(), QLatin1String(needed)));
        }
    }
    const QSet<QString> sessions = columnsOf(db, QStringLiteral("calibration_sessions"));
    const QSet<QString> instruments = columnsOf(db, QStringLiteral("instruments"));
    const QString sessionJoin =
        sessions.contains(QStringLiteral("id"))
            ? QStringLiteral(" LEFT JOIN calibration_sessions s ON s.id = c.session_id")
            : QString();
    const QString instrumentId = sessionJoin.isEmpty()
                                     ? QStringLiteral("NULL")
                                     : columnOrNull(sessions, "s", "instrument_id");
    const QString instrumentJoin =
        !sessionJoin.isEmpty() && instruments.contains(QStringLiteral("id")) &&
                instrumentId != QLatin1String("NULL")
            ? QStringLiteral(" LEFT JOIN instruments i ON i.id = s.instrument_id")
            : QString();
    const QString tag = instrumentJoin.isEmpty() ? QStringLiteral("NULL")
                                                 : columnOrNull(instruments, "i", "asset_tag");
    const QString revision =
        sessionJoin.isEmpty() ? QStringLiteral("NULL") : columnOrNull(sessions, "s", "revision");
    const QString approved =
        sessionJoin.isEmpty() ? QStringLiteral("NULL") : columnOrNull(sessions, "s", "approved_at");
    QSqlQuery q = sql::prepare(
        db, QStringLiteral("SELECT c.session_id, c.digest, %1, %2, %3, %4 FROM record_chain c%5%6 "
                           "ORDER BY c.id")
                .arg(instrumentId, tag, revision, approved, sessionJoin, instrumentJoin));
    sql::exec(q, QStringLiteral("reading the chain of approved records"));
    std::vector<ChainEntry> entries;
    while (q.next()) {
        ChainEntry entry;
        entry.position = int(entries.size()) + 1;
        entry.sessionId = q.value(0).toLongLong();
        entry.digest = q.value(1).toString();
        entry.instrument = !q.value(3).isNull()   ? q.value(3).toString()
                           : !q.value(2).isNull() ? q.value(2).toString()
                                                  : QString();
        if (!q.value(4).isNull()) {
            entry.revision = q.value(4).toInt();
        }
        entry.approvedAt = q.value(5).toString();
        entries.push_back(std::move(entry));
    }
    return entries;
}

ChainHead chainHead(const Workbook& workbook) {
    const QSqlDatabase db = workbook.database();
    ChainHead head;
    head.length = sql::scalar(db, QStringLiteral("SELECT count(*) FROM record_chain"),
                              QStringLiteral("counting the chain of approved records"))
                      .toInt();
    head.digest = sql::scalar(db,
                              QStringLiteral("SELECT digest FROM record_chain ORDER BY id DESC "
                                             "LIMIT 1"),
                              QStringLiteral("reading the head of the chain of approved records"))
                      .toString();
    return head;
}

namespace {

OpenOptions asItIs() {
    OpenOptions options; // the options verifyWorkbookFile opens with: read-only, as it is
    options.readOnly = true;
    options.acceptOlderSchema = true;
    return options;
}

} // namespace

StoredChain readChainFile(const QString& path) {
    const Workbook workbook(path, asItIs());
    StoredChain stored;
    stored.schemaVersion = workbook.schemaVersion();
    stored.labName = labNameOf(workbook.database());
    stored.entries = readChain(workbook.database());
    return stored;
}

ChainHead chainHeadOfFile(const QString& path) {
    OpenOptions options = asItIs();
    options.quickCheck = false;
    const Workbook workbook(path, options);
    return chainHead(workbook);
}

AnchorComparison compareWorkbookWithCopy(const QString& workbookPath, const QString& copyPath) {
    const StoredChain workbook = readChainFile(workbookPath);
    const StoredChain copy = readChainFile(copyPath);
    const bool firstRecordShared = !workbook.entries.empty() && !copy.entries.empty() &&
                                   sameEntry(workbook.entries.front(), copy.entries.front());
    if (!workbook.labName.isEmpty() && !copy.labName.isEmpty() &&
        workbook.labName != copy.labName && !firstRecordShared) {
        throw WorkbookError(Kind::BadInput,
                            QStringLiteral("%1 is not a copy of this workbook: it is the workbook "
                                           "of \"%2\", this one is of \"%3\"")
                                .arg(copyPath, copy.labName, workbook.labName));
    }
    return compareWithCopy(copy.entries, workbook.entries, QFileInfo(copyPath).fileName());
}

} // namespace mw::storage
