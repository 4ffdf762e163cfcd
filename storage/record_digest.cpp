// Canonical text of an approved record, the SHA-256 chain, and its verification.
//
// The text holds everything the conformity decision rests on: the session and its rows, the
// instrument as specified (class, scale, movement, the ranges used), who signed, and (format 2)
// the evaluation settings and the copies of the standards' specifications and of each range
// (signal type, diode model, fitted resistor, divisions, reference chosen) the session was
// sealed with. Per-point errors and verdicts are not written: the session evaluator computes
// them as a pure function of those inputs, so digesting the inputs covers them, and verify
// recomputes the verdict to compare it with the stored outcome. The register's current
// resistor of a range is left out on purpose: an adjustment may change it after approval; the
// record's copy and its resistor checks hold what applied.
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
    w.line("format", s.record_format == kRecordFormatWithoutInputs ? "meterwright-record 1"
                                                                   : "meterwright-record 2");
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
                              (r.indicated ? number(*r.indicated) : std::string("-")));
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

std::string optionalNumber(const std::optional<double>& value) {
    return value ? number(*value) : std::string("-");
}

std::string refText(const std::optional<SpecRef>& ref) {
    return ref ? std::to_string(ref->standard_id) + '|' + std::to_string(ref->sort_order)
               : std::string("-|-");
}

// Format 2: the plan, the settings and the copies the verdict was computed from.
void writeSealed(Writer& w, const CalibrationSession& s) {
    w.line("phases", std::string(toText(s.phases)));
    std::vector<TestPoint> plan = s.plan;
    std::sort(plan.begin(), plan.end(), [](const TestPoint& a, const TestPoint& b) {
        return std::tie(a.range_id, a.point_index) < std::tie(b.range_id, b.point_index);
    });
    for (const TestPoint& p : plan) {
        w.line("point", std::to_string(p.range_id) + '|' + std::to_string(p.point_index) + '|' +
                            number(p.nominal) + '|' + std::to_string(p.repeats));
    }
    const EvaluationSettings settings = s.settings.value_or(EvaluationSettings{});
    w.line("settings", s.settings ? number(settings.readability_fraction) + '|' +
                                        number(settings.coverage_probability) + '|' +
                                        number(settings.reference_celsius)
                                  : std::string("-"));
    const SealedInputs sealed = s.sealed.value_or(SealedInputs{});
    std::vector<std::string> lines;
    for (const StandardSpecCopy& c : sealed.specs) {
        const StandardRangeSpec& spec = c.spec;
        lines.push_back(
            std::to_string(c.standard_id) + '|' + std::to_string(c.sort_order) + '|' +
            escaped(spec.label) + '|' + std::string(unitSymbol(spec.unit)) + '|' +
            std::string(toText(spec.signal)) + '|' + number(spec.full_scale) + '|' +
            number(spec.percent_of_reading) + '|' + number(spec.percent_of_range) + '|' +
            number(spec.floor) + '|' + optionalNumber(spec.certificate_expanded_uncertainty) + '|' +
            number(spec.coverage_factor) + '|' + optionalNumber(spec.degrees_of_freedom));
    }
    std::sort(lines.begin(), lines.end());
    for (const std::string& l : lines) {
        w.line("spec_copy", l);
    }
    lines.clear();
    for (const RangeAsUsed& r : sealed.ranges) {
        std::string diode = "-";
        if (r.diode) {
            const DiodeParameters& d = *r.diode;
            diode = number(d.saturation_current_a) + ',' + number(d.emission_coefficient) + ',' +
                    number(d.series_ohms) + ',' + number(d.nominal_celsius) + ',' +
                    number(d.bandgap_ev) + ',' + number(d.saturation_temp_exponent);
        }
        lines.push_back(std::to_string(r.range_id) + '|' + std::string(toText(r.signal)) + '|' +
                        diode + '|' + optionalNumber(r.resistor_ohms) + '|' +
                        std::to_string(r.divisions) + '|' + refText(r.reference) + '|' +
                        refText(r.reference_shunt));
    }
    std::sort(lines.begin(), lines.end());
    for (const std::string& l : lines) {
        w.line("range_copy", l);
    }
}

} // namespace

QByteArray canonicalRecord(const CalibrationSession& session, const RecordContext& context) {
    Writer writer;
    writeHeader(writer, session);
    writeContext(writer, session, context);
    writeParts(writer, session);
    if (session.record_format != kRecordFormatWithoutInputs) {
        writeSealed(writer, session);
    }
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

} // namespace mw::storage
