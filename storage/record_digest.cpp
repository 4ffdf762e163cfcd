// Canonical text of an approved record, the SHA-256 chain, and its verification.
//
// The text holds everything the conformity decision rests on: the session and its rows, the
// instrument as specified (class, scale, movement, the ranges used) and who signed. Per-point
// errors and verdicts are not written: core/evaluation computes them as a pure function of the
// readings and that specification, so digesting the inputs covers them. The range's nominal
// multiplier or shunt is left out on purpose: an adjustment may change it after approval, and
// the record's resistor checks hold what was actually measured.
#include "storage/record_digest.h"

#include "storage/session_loader.h"
#include "storage/sql_support.h"
#include "storage/sqlite_dialect.h"
#include "storage/workbook.h"

#include <QCryptographicHash>

#include <algorithm>
#include <charconv>
#include <map>
#include <set>
#include <tuple>

namespace mw::storage {
namespace {

// Shortest text that reads back as the same double.
std::string number(double value) {
    char buffer[32];
    const auto result = std::to_chars(buffer, buffer + sizeof buffer, value);
    return std::string(buffer, result.ptr);
}

std::string escaped(const std::string& text) {
    std::string out;
    for (char c : text) {
        switch (c) {
        case '\\':
            out += "\\\\";
            break;
        case '\n':
            out += "\\n";
            break;
        case '|':
            out += "\\p";
            break;
        default:
            out += c;
        }
    }
    return out;
}

std::string stamp(const std::optional<Timestamp>& at) {
    return at ? sql::toIso(*at).toStdString() : std::string("-");
}

std::string idText(const std::optional<std::int64_t>& value) {
    return value ? std::to_string(*value) : std::string("-");
}

class Writer {
public:
    void line(const char* key, const std::string& value) {
        text_ += key;
        text_ += '=';
        text_ += value;
        text_ += '\n';
    }
    std::string take() { return std::move(text_); }

private:
    std::string text_;
};

void writeHeader(Writer& w, const CalibrationSession& s) {
    w.line("format", "meterwright-record 1");
    w.line("session", std::to_string(s.id));
    w.line("instrument", std::to_string(s.instrument_id));
    w.line("technician", std::to_string(s.technician_id));
    w.line("started", stamp(s.started_at));
    w.line("finished", stamp(s.finished_at));
    w.line("ambient_celsius", number(s.environment.ambient_celsius));
    w.line("relative_humidity_percent", number(s.environment.relative_humidity_percent));
    w.line("method", escaped(s.method));
    w.line("decision_rule", std::string(toText(s.decision_rule)));
    w.line("guard_factor", number(s.guard_factor));
    w.line("outcome", s.outcome ? std::string(toText(*s.outcome)) : "-");
    w.line("submitted", stamp(s.submitted_at));
    w.line("return_comment", escaped(s.return_comment));
    w.line("returned", stamp(s.returned_at));
    w.line("reviewer", idText(s.reviewer_id));
    w.line("approved", stamp(s.approved_at));
    w.line("revision", std::to_string(s.revision));
    w.line("supersedes", idText(s.supersedes_id));
    w.line("amendment_reason", escaped(s.amendment_reason));
    w.line("amended", stamp(s.amended_at));
}

void writeSignatory(Writer& w, const char* role, const std::optional<User>& user) {
    w.line(role, user ? escaped(user->login) + '|' + escaped(user->full_name) : "-");
}

void writeContext(Writer& w, const CalibrationSession& s, const RecordContext& context) {
    writeSignatory(w, "technician_signature", context.technician);
    writeSignatory(w, "reviewer_signature", context.reviewer);
    if (!context.instrument) {
        w.line("instrument_spec", "missing");
        return;
    }
    const Instrument& i = *context.instrument;
    w.line("instrument_spec",
           escaped(i.asset_tag) + '|' + escaped(i.serial) + '|' + std::string(toText(i.kind)) +
               '|' + number(i.movement.amps_fs) + '|' + number(i.movement.ohms_coil) + '|' +
               std::string(toText(i.scale_type)) + '|' + std::to_string(i.scale_divisions) + '|' +
               number(i.accuracy_class));
    std::set<std::int64_t> used;
    for (const Reading& r : s.readings) {
        used.insert(r.range_id);
    }
    for (const ResistorCheck& c : s.resistor_checks) {
        used.insert(c.range_id);
    }
    for (std::int64_t id : used) {
        const auto range = std::find_if(i.ranges.begin(), i.ranges.end(),
                                        [id](const RangeSpec& r) { return r.id == id; });
        if (range == i.ranges.end()) {
            w.line("range_spec", std::to_string(id) + "|missing");
            continue;
        }
        w.line("range_spec", std::to_string(id) + '|' + escaped(range->label) + '|' +
                                 std::string(unitSymbol(range->unit)) + '|' +
                                 number(range->lower_limit) + '|' + number(range->full_scale) +
                                 '|' +
                                 (range->fiducial_value ? number(*range->fiducial_value) : "-"));
    }
}

void writeParts(Writer& w, const CalibrationSession& s) {
    std::vector<std::string> lines;
    for (const StandardUse& u : s.standards) {
        lines.push_back(std::to_string(u.standard_id) + '|' + escaped(u.certificate_number) + '|' +
                        sql::toIsoDate(u.due_date).toStdString() + '|' +
                        escaped(u.overdue_justification));
    }
    std::sort(lines.begin(), lines.end());
    for (const std::string& l : lines) {
        w.line("standard", l);
    }
    std::vector<Reading> readings = s.readings;
    std::sort(readings.begin(), readings.end(), [](const Reading& a, const Reading& b) {
        return std::tie(a.range_id, a.point_index, a.direction, a.phase, a.repeat) <
               std::tie(b.range_id, b.point_index, b.direction, b.phase, b.repeat);
    });
    for (const Reading& r : readings) {
        w.line("reading", std::to_string(r.range_id) + '|' + std::to_string(r.point_index) + '|' +
                              std::string(toText(r.direction)) + '|' +
                              std::string(toText(r.phase)) + '|' + std::to_string(r.repeat) + '|' +
                              std::string(unitSymbol(r.unit)) + '|' + number(r.applied) + '|' +
                              number(r.indicated));
    }
    lines.clear();
    for (const ResistorCheck& c : s.resistor_checks) {
        lines.push_back(std::to_string(c.range_id) + '|' + escaped(c.component) + '|' +
                        number(c.computed_ohms) + '|' + number(c.measured_ohms) + '|' +
                        number(c.tolerance_percent));
    }
    std::sort(lines.begin(), lines.end());
    for (const std::string& l : lines) {
        w.line("resistor_check", l);
    }
    lines.clear();
    for (const AdjustmentNote& n : s.adjustments) {
        lines.push_back(stamp(n.at) + '|' + escaped(n.text));
    }
    std::sort(lines.begin(), lines.end());
    for (const std::string& l : lines) {
        w.line("adjustment", l);
    }
}

QString describe(int position, const CalibrationSession& s) {
    return QStringLiteral("record %1 (session %2, instrument %3, revision %4, approved %5)")
        .arg(position)
        .arg(s.id)
        .arg(s.instrument_id)
        .arg(s.revision)
        .arg(QString::fromStdString(stamp(s.approved_at)));
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

// The sessions that chained amendments supersede. An amendment later amended in turn is
// superseded itself, yet still supersedes the record it corrected.
std::set<std::int64_t>
supersededByChain(const std::map<std::int64_t, CalibrationSession>& chained) {
    std::set<std::int64_t> ids;
    for (const auto& [id, s] : chained) {
        if (s.supersedes_id &&
            (s.state == SessionState::Approved || s.state == SessionState::Superseded)) {
            ids.insert(*s.supersedes_id);
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
std::optional<std::pair<std::int64_t, QString>>
checkChain(const QSqlDatabase& db, const std::vector<ChainRow>& rows, VerificationReport& report) {
    const RecordContexts contexts(db);
    std::map<std::int64_t, CalibrationSession> sessions;
    for (CalibrationSession& s : detail::loadSessions(
             db, QStringLiteral("s.id IN (SELECT session_id FROM record_chain)"), QVariant())) {
        sessions.emplace(s.id, std::move(s));
    }
    const std::set<std::int64_t> supersededIds = supersededByChain(sessions);
    QString previous;
    int position = 0;
    for (const ChainRow& row : rows) {
        ++position;
        const auto found = sessions.find(row.sessionId);
        if (found == sessions.end()) {
            return std::pair(row.sessionId, QStringLiteral("record %1 (session %2): the session "
                                                           "is missing")
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

} // namespace

QByteArray canonicalRecord(const CalibrationSession& session, const RecordContext& context) {
    Writer writer;
    writeHeader(writer, session);
    writeContext(writer, session, context);
    writeParts(writer, session);
    const std::string text = writer.take();
    return QByteArray(text.data(), qsizetype(text.size()));
}

QString chainDigest(const QString& previousDigest, const QByteArray& canonical) {
    QCryptographicHash hash(QCryptographicHash::Sha256);
    hash.addData(previousDigest.toLatin1());
    hash.addData(QByteArrayView("\n", 1));
    hash.addData(canonical);
    return QString::fromLatin1(hash.result().toHex());
}

QString shortDigest(const QString& digest) {
    return digest.left(16);
}

VerificationReport verifyWorkbook(const Workbook& workbook) {
    const QSqlDatabase db = workbook.database();
    VerificationReport report;
    report.integrityMessage = dialect::integrityCheck(db);
    report.integrityOk = report.integrityMessage == QLatin1String("ok");
    const std::vector<ChainRow> rows = chainRows(db);
    report.chainLength = int(rows.size());
    report.chainHeadDigest = rows.empty() ? QString() : rows.back().digest;
    if (auto problem = checkChain(db, rows, report)) {
        report.firstMismatchSessionId = problem->first;
        report.firstMismatch = problem->second;
    }
    QSqlQuery q = sql::prepare(db, QStringLiteral("SELECT s.id, s.state, c.id FROM "
                                                  "calibration_sessions s LEFT JOIN record_chain "
                                                  "c ON c.session_id = s.id ORDER BY s.id"));
    sql::exec(q, QStringLiteral("listing calibration sessions"));
    while (q.next()) {
        ++report.sessionsChecked;
        const QString state = q.value(1).toString();
        const bool sealed = !q.value(2).isNull();
        if (!report.firstMismatch && !sealed &&
            (state == QLatin1String("approved") || state == QLatin1String("superseded"))) {
            report.firstMismatchSessionId = q.value(0).toLongLong();
            report.firstMismatch = QStringLiteral("session %1 is marked %2 but was never sealed "
                                                  "into the chain of approved records")
                                       .arg(q.value(0).toLongLong())
                                       .arg(state);
        }
    }
    return report;
}

} // namespace mw::storage
