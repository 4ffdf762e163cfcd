// Verification of a workbook's records: the chain of approved records and every verdict.
#include "storage/verification.h"

#include "core/evaluation/session_evaluation.h"
#include "storage/record_context.h"
#include "storage/record_digest.h"
#include "storage/session_loader.h"
#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"

#include <map>
#include <set>

namespace mw::storage {
namespace {

using Sessions = std::map<std::int64_t, CalibrationSession>;

QString stamp(const std::optional<Timestamp>& at) {
    return at ? sql::toIso(*at) : QStringLiteral("-");
}

QString describe(int position, const CalibrationSession& s) {
    return QStringLiteral("record %1 (session %2, instrument %3, revision %4, approved %5)")
        .arg(position)
        .arg(s.id)
        .arg(s.instrument_id)
        .arg(s.revision)
        .arg(stamp(s.approved_at));
}

void note(VerificationReport& report, std::int64_t sessionId, const QString& problem) {
    report.note(problem, sessionId);
}

struct ChainRow {
    std::int64_t sessionId = 0;
    QString previous;
    QString digest;
};

std::vector<ChainRow> chainRows(const QSqlDatabase& db) {
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT session_id, previous_digest, digest "
                                                  "FROM record_chain ORDER BY id"));
    sql::exec(q, QStringLiteral("reading the chain of approved records"));
    std::vector<ChainRow> rows;
    while (q.next()) {
        rows.push_back({q.value(0).toLongLong(), q.value(1).toString(), q.value(2).toString()});
    }
    return rows;
}

// Every session, each read on its own when reading them all at once fails, so that a value the
// workbook cannot read names its session instead of stopping the verification.
Sessions readSessions(const QSqlDatabase& db, VerificationReport& report) {
    Sessions sessions;
    try {
        for (CalibrationSession& s : detail::loadSessions(db, QStringLiteral("1 = 1"), {})) {
            sessions.emplace(s.id, std::move(s));
        }
        return sessions;
    } catch (const WorkbookError&) {
    }
    QSqlQuery ids = sql::prepare(db, QStringLiteral("SELECT id FROM calibration_sessions ORDER "
                                                    "BY id"));
    sql::exec(ids, QStringLiteral("listing calibration sessions"));
    while (ids.next()) {
        const std::int64_t id = ids.value(0).toLongLong();
        try {
            for (CalibrationSession& s :
                 detail::loadSessions(db, QStringLiteral("s.id = ?"), qint64(id))) {
                sessions.emplace(s.id, std::move(s));
            }
        } catch (const WorkbookError& error) {
            note(report, id,
                 QStringLiteral("session %1 cannot be read: %2").arg(id).arg(error.message()));
        }
    }
    return sessions;
}

// The sessions that chained amendments supersede. An amendment later amended in turn is
// superseded itself, yet still supersedes the record it corrected.
std::set<std::int64_t> supersededByChain(const Sessions& sessions,
                                         const std::vector<ChainRow>& rows) {
    std::set<std::int64_t> ids;
    for (const ChainRow& row : rows) {
        const auto found = sessions.find(row.sessionId);
        if (found != sessions.end() && found->second.supersedes_id &&
            (found->second.state == SessionState::Approved ||
             found->second.state == SessionState::Superseded)) {
            ids.insert(*found->second.supersedes_id);
        }
    }
    return ids;
}

// The state is not covered by the digest (a superseded record keeps it), so it is checked
// against the chain itself: with the triggers dropped, an approved record could otherwise be
// marked superseded (and drop out of the due list) or the reverse, unnoticed.
std::optional<QString> stateFlip(const CalibrationSession& s, bool amended) {
    if (amended && s.state != SessionState::Superseded) {
        return QStringLiteral(": an approved amendment supersedes it, yet it is marked \"%1\"")
            .arg(sql::enumText(s.state));
    }
    if (!amended && s.state == SessionState::Superseded) {
        return QStringLiteral(": it is marked superseded, but no approved amendment in the chain "
                              "supersedes it");
    }
    return std::nullopt;
}

// The first complaint about the chain itself, or nullopt when every link holds.
std::optional<std::pair<std::int64_t, QString>> checkChain(const Sessions& sessions,
                                                           const RecordContexts& contexts,
                                                           const std::vector<ChainRow>& rows,
                                                           VerificationReport& report) {
    const std::set<std::int64_t> supersededIds = supersededByChain(sessions, rows);
    QString previous;
    int position = 0;
    for (const ChainRow& row : rows) {
        ++position;
        const auto found = sessions.find(row.sessionId);
        if (found == sessions.end()) {
            return std::pair(row.sessionId, QStringLiteral("record %1 (session %2): the session "
                                                           "is missing or cannot be read")
                                                .arg(position)
                                                .arg(row.sessionId));
        }
        const CalibrationSession& s = found->second;
        const QString who = describe(position, s);
        if (row.previous != previous) {
            return std::pair(s.id, who + QStringLiteral(": the link to the previous record is "
                                                        "broken (a record was removed or "
                                                        "replaced)"));
        }
        if (s.state != SessionState::Approved && s.state != SessionState::Superseded) {
            return std::pair(s.id, who + QStringLiteral(": its state was changed to \"%1\"")
                                             .arg(sql::enumText(s.state)));
        }
        if (const auto flip = stateFlip(s, supersededIds.count(s.id) > 0)) {
            return std::pair(s.id, who + *flip);
        }
        if (chainDigest(row.previous, canonicalRecord(s, contexts.of(s))) != row.digest) {
            return std::pair(s.id, who + QStringLiteral(": its contents no longer match the "
                                                        "digest taken at approval"));
        }
        ++report.recordsChecked;
        previous = row.digest;
    }
    return std::nullopt;
}

// A session out of the technician's hands carries the outcome computed at its submission; it
// must still be what the session evaluator gives on the inputs the session was sealed with.
void checkVerdict(const CalibrationSession& s, const RecordContext& context,
                  VerificationReport& report) {
    if (s.state == SessionState::Draft) {
        return;
    }
    if (s.record_format == kRecordFormatWithoutInputs) {
        ++report.verdictsNotRecorded;
        return;
    }
    ++report.verdictsChecked;
    const QString who =
        QStringLiteral("session %1 (instrument %2, %3)")
            .arg(s.id)
            .arg(context.instrument ? QString::fromStdString(context.instrument->asset_tag)
                                    : QString::number(s.instrument_id))
            .arg(sql::text(displayName(s.state)).toLower());
    if (!context.instrument) {
        note(report, s.id, who + QStringLiteral(": its instrument is missing"));
        return;
    }
    const SessionEvaluation evaluation =
        evaluateSession(*context.instrument, s, s.sealed.value_or(SealedInputs{}));
    if (!evaluation.overall) {
        const QString why = evaluation.problems.empty()
                                ? QStringLiteral("it has no readings")
                                : QString::fromStdString(evaluation.problems.front());
        note(report, s.id,
             who + QStringLiteral(": its sealed inputs can no longer be evaluated (%1)").arg(why));
        return;
    }
    if (s.outcome != evaluation.overall) {
        note(report, s.id,
             who + QStringLiteral(": its stored outcome \"%1\" no longer follows from its "
                                  "inputs, which give \"%2\"")
                       .arg(s.outcome ? sql::text(toText(*s.outcome)) : QStringLiteral("none"),
                            sql::text(toText(*evaluation.overall))));
    }
}

} // namespace

void detail::checkRecords(const QSqlDatabase& db, VerificationReport& report) {
    const qsizetype recordsFrom = report.problems.size();
    const std::vector<ChainRow> rows = chainRows(db);
    report.chainLength = int(rows.size());
    report.chainHeadDigest = rows.empty() ? QString() : rows.back().digest;

    std::optional<RecordContexts> contexts;
    try {
        contexts.emplace(db);
    } catch (const WorkbookError& error) {
        note(report, 0,
             QStringLiteral("the instruments or users cannot be read: %1").arg(error.message()));
        return;
    }
    const Sessions sessions = readSessions(db, report);
    if (auto problem = checkChain(sessions, *contexts, rows, report)) {
        report.note(problem->second, problem->first, recordsFrom); // the chain says the most
    }
    std::set<std::int64_t> chained;
    for (const ChainRow& row : rows) {
        chained.insert(row.sessionId);
    }
    for (const auto& [id, s] : sessions) {
        ++report.sessionsChecked;
        if (!chained.count(id) &&
            (s.state == SessionState::Approved || s.state == SessionState::Superseded)) {
            note(report, id,
                 QStringLiteral("session %1 is marked %2 but was never sealed into the chain of "
                                "approved records")
                     .arg(id)
                     .arg(sql::enumText(s.state)));
        }
        checkVerdict(s, contexts->of(s), report);
    }
    checkSeals(db, report);
}

} // namespace mw::storage
