// The calibration record: its frame (identity, notices, item, method, traceability, signatures,
// digest) around the results built in record_results.cpp.
#include "core/record/calibration_record.h"

#include "core/history/calendar.h"
#include "core/record/record_format.h"
#include "core/record/record_parts.h"

#include <cstdio>
#include <map>
#include <stdexcept>

namespace mw::record {
namespace {

using detail::RecordFacts;
using detail::text;

std::string userWords(const std::vector<User>& users, std::int64_t id) {
    for (const User& user : users) {
        if (user.id == id) {
            return (user.full_name.empty() ? user.login : user.full_name) + " (" +
                   text(displayName(user.role)) + ")";
        }
    }
    return "user " + std::to_string(id) + " (no longer on the register)";
}

std::string outcomeWords(const std::optional<Outcome>& outcome) {
    return outcome ? text(displayName(*outcome)) : std::string("not evaluated");
}

// A reason as typed, closed with a full stop unless it ends in one already.
std::string sentence(const std::string& reason) {
    if (reason.empty()) {
        return "not recorded.";
    }
    const char last = reason.back();
    return last == '.' || last == '!' || last == '?' ? reason : reason + ".";
}

std::string revisionLabel(const CalibrationSession& session) {
    return "revision " + std::to_string(session.revision);
}

void addNotices(const RecordFacts& facts, Document& document) {
    const RecordSource& source = facts.source;
    const CalibrationSession& s = source.session;
    if (!isRecord(s)) {
        document.blocks.push_back(Paragraph{
            "This is not a calibration record. The work is in the state \"" +
                text(displayName(s.state)) +
                "\" and has not been approved; it is printed as a draft on " +
                formatTimeUtc(source.printedAt) +
                " for checking only. Its results may still change and it carries no digest.",
            ParagraphStyle::Notice});
    }
    if (s.supersedes_id) {
        std::string notice = "Amendment: this record (" + revisionLabel(s) +
                             ") supersedes record " +
                             recordIdentifier(source.instrument, *s.supersedes_id) + ".";
        if (s.amended_at) {
            notice += " The amendment was started " + formatTimeUtc(*s.amended_at) + ".";
        }
        notice += " Reason: " + sentence(s.amendment_reason);
        document.blocks.push_back(Paragraph{notice, ParagraphStyle::Notice});
    }
}

std::string supersededBanner(const RecordSource& source) {
    std::string banner = "SUPERSEDED. ";
    if (!source.successor) {
        return banner + "This record was replaced by a later revision; use that one.";
    }
    const Successor& next = *source.successor;
    banner += "Replaced by record " + recordIdentifier(source.instrument, next.sessionId) +
              " (revision " + std::to_string(next.revision) + ")";
    if (next.approvedAt) {
        banner += ", approved " + formatDay(dayOf(*next.approvedAt));
    }
    banner += ". Reason: " + sentence(next.reason);
    return banner + " Kept for the history only; use the successor.";
}

void addOutcome(const RecordFacts& facts, Document& document) {
    const SessionEvaluation& e = facts.evaluation;
    std::vector<Field> fields;
    if (e.asFound) {
        fields.push_back({"As found", outcomeWords(e.asFound)});
    }
    if (e.asLeft) {
        fields.push_back({"As left (after adjustment)", outcomeWords(e.asLeft)});
    }
    fields.push_back({"On leaving the laboratory", outcomeWords(e.overall)});
    document.blocks.push_back(Heading{"Outcome", 1});
    document.blocks.push_back(FieldList{fields});
    if (e.hazardCaution) {
        document.blocks.push_back(Paragraph{
            *e.hazardCaution +
                " Follow your laboratory's procedures and local electrical codes, and work within "
                "your qualifications; this record does not replace the judgement of a competent "
                "person.",
            ParagraphStyle::Caution});
    }
}

std::string calibratedWhen(const CalibrationSession& s) {
    std::string when = formatTimeUtc(s.started_at);
    if (s.finished_at) {
        const bool sameDay = dayOf(*s.finished_at) == dayOf(s.started_at);
        const std::string end = formatTimeUtc(*s.finished_at);
        when += " to " + (sameDay ? end.substr(11) : end);
    }
    return when;
}

void addIdentification(const RecordFacts& facts, Document& document) {
    const RecordSource& source = facts.source;
    const CalibrationSession& s = source.session;
    document.blocks.push_back(Heading{"Laboratory and record", 1});
    std::vector<Field> fields = detail::labFields(source.lab);
    fields.push_back({"Record", recordIdentifier(source.instrument, s.id) + ", " +
                                    revisionLabel(s) + " (" + text(displayName(s.state)) + ")"});
    fields.push_back({"Customer (owner)",
                      source.instrument.owner.empty() ? "not recorded" : source.instrument.owner});
    fields.push_back({"Date of calibration", calibratedWhen(s)});
    fields.push_back({"Date of issue", s.approved_at && isRecord(s)
                                           ? formatDay(dayOf(*s.approved_at))
                                           : std::string("not issued (draft)")});
    fields.push_back({"Place of calibration", "the laboratory (address above)"});
    document.blocks.push_back(FieldList{fields});
    document.blocks.push_back(Heading{"Item calibrated", 1});
    document.blocks.push_back(FieldList{detail::instrumentFields(source.instrument)});
}

void addMethod(const RecordFacts& facts, Document& document) {
    const CalibrationSession& s = facts.source.session;
    const EvaluationSettings settings = s.settings.value_or(EvaluationSettings{});
    std::vector<Field> fields;
    fields.push_back({"Method", s.method.empty() ? "not recorded" : s.method});
    char environment[96];
    std::snprintf(environment, sizeof environment,
                  "ambient %.1f \u00B0C, relative humidity %.0f %%", s.environment.ambient_celsius,
                  s.environment.relative_humidity_percent);
    fields.push_back({"Environment", environment});
    char reference[96];
    std::snprintf(reference, sizeof reference,
                  "%.1f \u00B0C (IEC 60051-1); the pointer read to %.2g of a scale division",
                  settings.reference_celsius, settings.readability_fraction);
    fields.push_back({"Reference temperature", reference});
    fields.push_back({"Uncertainty", "expanded uncertainty U for a coverage probability of " +
                                         coverageWords(facts.probability) +
                                         ", k from Student's t at the effective degrees of "
                                         "freedom (JCGM 100:2008 G.4)"});
    fields.push_back({"Decision rule", text(displayName(s.decision_rule))});
    std::string basis = describeBasis(facts.basis, s);
    if (!facts.evaluation.settingsRecorded) {
        basis += "; the evaluation settings were not recorded, and the defaults were assumed";
    }
    fields.push_back({"Evaluated with", basis});
    document.blocks.push_back(Heading{"Method and conditions", 1});
    document.blocks.push_back(FieldList{fields});
}

// Which ranges of the instrument each standard's range served, from the inputs evaluated.
std::map<std::int64_t, std::string> usesOfStandards(const RecordFacts& facts) {
    std::map<std::int64_t, std::string> uses;
    for (const RangeAsUsed& used : facts.basis.inputs.ranges) {
        const RangeSpec* range = detail::rangeById(facts.source.instrument, used.range_id);
        for (const std::optional<SpecRef>& ref : {used.reference, used.reference_shunt}) {
            if (!ref || !range) {
                continue;
            }
            for (const StandardSpecCopy& copy : facts.basis.inputs.specs) {
                if (copy.standard_id == ref->standard_id && copy.sort_order == ref->sort_order) {
                    std::string& line = uses[ref->standard_id];
                    if (!line.empty()) {
                        line += "; ";
                    }
                    line += copy.spec.label + " for " + range->label;
                }
            }
        }
    }
    return uses;
}

void addStandards(const RecordFacts& facts, Document& document) {
    const RecordSource& source = facts.source;
    const auto uses = usesOfStandards(facts);
    Table table;
    table.columns = {{"Standard"}, {"Description"}, {"Certificate"}, {"Due"}, {"Used for"}};
    std::vector<std::string> overdue;
    for (const StandardUse& use : source.session.standards) {
        std::string tag = "standard " + std::to_string(use.standard_id);
        std::string description = "no longer on the register";
        for (const ReferenceStandard& standard : source.standards) {
            if (standard.id == use.standard_id) {
                tag = standard.asset_tag;
                description = standard.description;
            }
        }
        const auto used = uses.find(use.standard_id);
        table.rows.push_back({tag, description, use.certificate_number, formatDay(use.due_date),
                              used == uses.end() ? std::string("-") : used->second});
        if (use.due_date < dayOf(source.session.started_at)) {
            overdue.push_back(tag +
                              " was past its due date on the day of calibration; it was used "
                              "because: " +
                              sentence(use.overdue_justification));
        }
    }
    document.blocks.push_back(Heading{"Reference standards and traceability", 1});
    if (table.rows.empty()) {
        document.blocks.push_back(
            Paragraph{"No reference standard is recorded for this calibration, so its results "
                      "are not shown to be traceable.",
                      ParagraphStyle::Caution});
        return;
    }
    document.blocks.push_back(table);
    document.blocks.push_back(Paragraph{
        "Traceability: every applied value was delivered or measured by a reference standard "
        "above, used under the calibration certificate shown (copied into this record on the "
        "day of the work), and that certificate states the standard's own traceability to the "
        "SI through national measurement standards.",
        ParagraphStyle::Small});
    for (const std::string& line : overdue) {
        document.blocks.push_back(Paragraph{line, ParagraphStyle::Notice});
    }
}

void addSignatures(const RecordFacts& facts, Document& document) {
    const RecordSource& source = facts.source;
    const CalibrationSession& s = source.session;
    std::vector<Field> fields;
    std::string technician = userWords(source.users, s.technician_id);
    if (s.submitted_at) {
        technician += ", submitted " + formatTimeUtc(*s.submitted_at);
    }
    fields.push_back({"Calibrated by", technician});
    if (isRecord(s) && s.reviewer_id && s.approved_at) {
        fields.push_back({"Approved by", userWords(source.users, *s.reviewer_id) + ", " +
                                             formatTimeUtc(*s.approved_at)});
        if (source.signerKeyFingerprint) {
            fields.push_back({"Approval signed with key", *source.signerKeyFingerprint, true});
        }
    } else {
        fields.push_back({"Approved by", "not approved"});
    }
    document.blocks.push_back(Heading{"Authorisation", 1});
    document.blocks.push_back(FieldList{fields});
}

void addClosing(const RecordFacts& facts, Document& document) {
    const RecordSource& source = facts.source;
    const CalibrationSession& s = source.session;
    document.blocks.push_back(Heading{"Integrity of this record", 1});
    const std::string id = recordIdentifier(source.instrument, s.id);
    if (isRecord(s) && !s.digest.empty()) {
        document.blocks.push_back(FieldList{{
            {"Digest (SHA-256)", s.digest, true},
            {"How to check it",
             "run \"" + std::string(kVerifyCommand) +
                 "\" on the laboratory's workbook: it recomputes the digest of every approved "
                 "record from its stored contents and the chain of records approved before it, "
                 "checks each approval's signature against its reviewer's key, and names any "
                 "record changed since approval. The digest stored for record " +
                 id + " must equal the one printed here" +
                 (source.signerKeyFingerprint ? ", and the key that signed it must have this "
                                                "fingerprint."
                                              : ".")},
        }});
    } else {
        document.blocks.push_back(
            Paragraph{"No digest: a record is sealed into the digest chain when it is approved."});
    }
    if (const auto& chain = source.chainAtPrinting) {
        // The short form people compare, as verify prints it.
        const std::string head =
            chain->records == 0 ? std::string("none") : "head " + chain->headDigest.substr(0, 16);
        document.blocks.push_back(FieldList{{
            {"Record chain at printing",
             std::to_string(chain->records) + " approved records, " + head},
        }});
    }
    document.blocks.push_back(
        Paragraph{"The results relate only to the item calibrated, in the condition described "
                  "above, at the time of calibration. This record may be reproduced only in "
                  "full."});
}

} // namespace

std::string recordIdentifier(const Instrument& instrument, std::int64_t sessionId) {
    char number[24];
    std::snprintf(number, sizeof number, "%05lld", static_cast<long long>(sessionId));
    return instrument.asset_tag + "-" + number;
}

bool isRecord(const CalibrationSession& session) {
    return session.state == SessionState::Approved || session.state == SessionState::Superseded;
}

Document buildCalibrationRecord(const RecordSource& source) {
    const CalibrationSession& s = source.session;
    if (s.instrument_id != source.instrument.id) {
        throw std::invalid_argument("record: session " + std::to_string(s.id) +
                                    " is not a calibration of " + source.instrument.asset_tag);
    }
    EvaluationBasis basis = evaluationBasis(source.instrument, s, source.standards);
    SessionEvaluation evaluation = evaluateSession(source.instrument, s, basis.inputs);
    const RecordFacts facts{source, std::move(basis), std::move(evaluation),
                            DecisionSettings{s.decision_rule, s.guard_factor},
                            s.settings.value_or(EvaluationSettings{}).coverage_probability};
    Document document;
    const std::string id = recordIdentifier(source.instrument, s.id);
    document.identifier = "Record " + id + ", " + revisionLabel(s);
    document.runningHead = detail::runningHead(source.lab);
    document.title = isRecord(s) ? "Calibration record" : "Calibration record (draft)";
    if (!isRecord(s)) {
        document.watermark = "DRAFT \u2013 NOT A CALIBRATION RECORD";
    }
    if (s.state == SessionState::Superseded) {
        document.banner = supersededBanner(source);
    }
    addNotices(facts, document);
    addOutcome(facts, document);
    addIdentification(facts, document);
    addMethod(facts, document);
    addStandards(facts, document);
    detail::addResults(facts, document);
    detail::addWorkDone(facts, document);
    detail::addConformity(facts, document);
    addSignatures(facts, document);
    addClosing(facts, document);
    document.endMark = "End of record " + id + " (" + revisionLabel(s) + ").";
    return document;
}

} // namespace mw::record
