// The results of a calibration record: per range and phase the points as the session evaluator
// found them, its statement and cautions, the session chart; the adjustments and resistor
// checks; the statement of conformity of the whole record.
#include "core/advice/resistor_correction.h"
#include "core/evaluation/statement.h"
#include "core/history/calendar.h"
#include "core/record/record_format.h"
#include "core/record/record_parts.h"
#include "core/units/decimal.h"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace mw::record::detail {
namespace {

std::string coverageFactorText(double k) {
    char value[16];
    std::snprintf(value, sizeof value, "%.2f", k);
    return value;
}

std::optional<SignalType> signalOf(const RecordFacts& facts, const RangeSpec& range) {
    for (const RangeAsUsed& used : facts.basis.inputs.ranges) {
        if (used.range_id == range.id) {
            return used.signal;
        }
    }
    return range.signal;
}

// The power of ten of the SI prefix in which a range's errors, limit and U are printed: that of
// its limit of error, so that a column reads in one prefix.
int columnPrefix(double permissibleError) {
    if (!(permissibleError > 0.0)) {
        return 0;
    }
    const int leading = ExactDecimal::fromDouble(permissibleError).leadingExponent();
    return std::clamp(static_cast<int>(std::floor(leading / 3.0)) * 3, -12, 9);
}

// `value` to the last of `digits` significant digits, in the prefix 10^prefix.
std::string inPrefix(double value, int digits, Unit unit, int prefix) {
    if (value == 0.0) {
        return formatAtExponent(0.0, prefix, unit, prefix);
    }
    const int leading = ExactDecimal::fromDouble(value).leadingExponent();
    return formatAtExponent(value, leading - digits + 1, unit, prefix);
}

Table pointTable(const RecordFacts& facts, const RangeSpec& range, const EvaluationResult& r) {
    Table table;
    table.columns = {
        {"Point", Align::Right}, {"Applied", Align::Right}, {"Indicated", Align::Right},
        {"Error", Align::Right}, {"% FV", Align::Right},    {"Limit \u00B1", Align::Right},
        {"U", Align::Right},     {"k", Align::Right},       {"Decision"}};
    const double classIndex = facts.source.instrument.accuracy_class;
    const int prefix = columnPrefix(r.permissibleError);
    for (const PointResult& p : r.points) {
        // U is already rounded up to two significant digits: printed exactly as decided with.
        const double u = p.budget.expandedRounded;
        table.rows.push_back({
            p.pointIndex >= 0 ? std::to_string(p.pointIndex + 1) : std::string("-"),
            scaleValue(p.applied, range),
            scaleValue(p.indicated, range),
            formatErrorLikeU(p.error, u, p.permissibleError, guardBand(facts.decision, u),
                             range.unit, prefix),
            signedPercent(p.errorPercentOfFiducial, classIndex),
            inPrefix(p.permissibleError, 3, range.unit, prefix),
            inPrefix(u, 2, range.unit, prefix),
            coverageFactorText(p.budget.coverageFactor),
            text(displayName(p.decision)),
        });
        table.emphasised.push_back(p.decision != Outcome::Pass);
    }
    return table;
}

void addPhase(const RecordFacts& facts, const RangeSpec& range, const RangeEvaluation& part,
              Document& document) {
    std::string heading = rangeWords(range, signalOf(facts, range));
    heading += part.phase == Phase::AsFound ? ", as found" : ", as left";
    document.blocks.push_back(Heading{heading, 2});
    if (!part.result) {
        document.blocks.push_back(Paragraph{part.problem, ParagraphStyle::Caution});
        return;
    }
    const EvaluationResult& r = *part.result;
    document.blocks.push_back(pointTable(facts, range, r));
    std::string notes = "Fiducial value " + quantity(r.fiducialValue, range.unit) +
                        "; limit of error \u00B1" + quantity(r.permissibleError, range.unit) +
                        "; reference: " + (part.reference.empty() ? "none" : part.reference) +
                        "; overall " + text(displayName(r.overall)) + ".";
    document.blocks.push_back(Paragraph{notes, ParagraphStyle::Small});
    document.blocks.push_back(Paragraph{r.statement, ParagraphStyle::Statement});
    for (const std::string& caution : r.cautions) {
        // The hazard caution stands once, boxed, under the outcome on the first page.
        if (!r.hazardCaution || caution != *r.hazardCaution) {
            document.blocks.push_back(Paragraph{caution, ParagraphStyle::Small});
        }
    }
}

} // namespace

void addResults(const RecordFacts& facts, Document& document) {
    const Instrument& instrument = facts.source.instrument;
    document.blocks.push_back(Heading{"Results", 1});
    document.blocks.push_back(Paragraph{
        "Applied: the value the reference standard delivered or measured. Indicated: the mean "
        "indication in the direction (up- or down-scale) with the larger error. Error: indicated "
        "\u2212 applied, to the last digit of U. % FV: the error in percent of the fiducial "
        "value. Limit: the permissible error of the accuracy class. U: the expanded uncertainty, "
        "with its coverage factor k. Points that did not pass are set in bold.",
        ParagraphStyle::Small});
    for (const RangeSpec& range : instrument.ranges) {
        bool any = false;
        for (const RangeEvaluation& part : facts.evaluation.ranges) {
            if (part.rangeId == range.id) {
                addPhase(facts, range, part, document);
                any = true;
            }
        }
        if (!any) {
            continue;
        }
        RangeChart chart = rangeChart(instrument, facts.source.session, facts.basis.inputs,
                                      facts.evaluation, range.id);
        if (!chart.series.empty()) {
            char limit[32];
            std::snprintf(limit, sizeof limit, "%g", chart.limitPercent);
            document.blocks.push_back(ErrorChart{"Errors of the " + range.label +
                                                     " range in % of the fiducial value, with U as "
                                                     "bars and the limits of class " +
                                                     limit + " (\u00B1" + limit + " %)",
                                                 std::move(chart), range.unit});
        }
    }
    if (facts.evaluation.ranges.empty()) {
        document.blocks.push_back(Paragraph{"No readings were recorded."});
    }
}

void addWorkDone(const RecordFacts& facts, Document& document) {
    const CalibrationSession& s = facts.source.session;
    document.blocks.push_back(Heading{"Adjustments and resistor checks", 1});
    if (s.adjustments.empty()) {
        document.blocks.push_back(Paragraph{"No adjustment was made."});
    } else {
        Table adjustments;
        adjustments.columns = {{"Time"}, {"Adjustment made"}};
        for (const AdjustmentNote& note : s.adjustments) {
            adjustments.rows.push_back({formatTimeUtc(note.at), note.text});
        }
        document.blocks.push_back(adjustments);
    }
    if (s.resistor_checks.empty()) {
        document.blocks.push_back(Paragraph{"No multiplier or shunt was measured."});
        return;
    }
    Table checks;
    checks.columns = {{"Range"},
                      {"Resistor"},
                      {"Designed", Align::Right},
                      {"Measured", Align::Right},
                      {"Deviation", Align::Right},
                      {"Tolerance \u00B1", Align::Right},
                      {"Within tolerance"}};
    for (const ResistorCheck& c : s.resistor_checks) {
        const RangeSpec* range = rangeById(facts.source.instrument, c.range_id);
        const ResistorDeviation d =
            compareResistor(c.computed_ohms, c.measured_ohms, c.tolerance_percent);
        char deviation[32];
        std::snprintf(deviation, sizeof deviation, "%+.3f %%", d.deviationPercent);
        char tolerance[32];
        std::snprintf(tolerance, sizeof tolerance, "%g %%", c.tolerance_percent);
        checks.rows.push_back({range ? range->label : std::string("-"), c.component,
                               formatEngineering(c.computed_ohms, 5, Unit::Ohm),
                               formatEngineering(c.measured_ohms, 5, Unit::Ohm), deviation,
                               tolerance, d.withinTolerance ? "yes" : "no"});
        checks.emphasised.push_back(!d.withinTolerance);
    }
    document.blocks.push_back(checks);
}

void addConformity(const RecordFacts& facts, Document& document) {
    const SessionEvaluation& e = facts.evaluation;
    document.blocks.push_back(Heading{"Statement of conformity", 1});
    char classIndex[32];
    std::snprintf(classIndex, sizeof classIndex, "%g", facts.source.instrument.accuracy_class);
    std::string statement = "Specification: accuracy class " + std::string(classIndex) + " (" +
                            kClassStandard + "), a limit of error of \u00B1" + classIndex +
                            " % of the fiducial value on every range. The statement covers every "
                            "range and test point listed above; each range's own statement "
                            "stands with its results.";
    statement += " Outcome as found: " +
                 (e.asFound ? text(displayName(*e.asFound)) : std::string("not evaluated"));
    if (e.asLeft) {
        statement += "; as left, after adjustment: " + text(displayName(*e.asLeft));
    }
    statement += "; the instrument leaves the laboratory in the condition: " +
                 (e.overall ? text(displayName(*e.overall)) : std::string("not evaluated")) + ".";
    document.blocks.push_back(Paragraph{statement, ParagraphStyle::Statement});
    document.blocks.push_back(
        Paragraph{"Decision rule, documented with the session and applied as recorded: " +
                      describeRule(facts.decision) + ".",
                  ParagraphStyle::Statement});
    for (const std::string& problem : e.problems) {
        document.blocks.push_back(
            Paragraph{"Not evaluated, so not covered by this statement: " + problem + ".",
                      ParagraphStyle::Caution});
    }
}

} // namespace mw::record::detail
