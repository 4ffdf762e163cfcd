// The parts of a calibration record built in record_results.cpp and the pieces the record and
// the history report share. Internal to core/record.
#pragma once

#include "core/decision/decision.h"
#include "core/evaluation/session_evaluation.h"
#include "core/history/evaluation_basis.h"
#include "core/record/calibration_record.h"

#include <string>
#include <string_view>
#include <vector>

namespace mw::record::detail {

// What the parts of one record are built from: the source, the inputs it was evaluated with
// and the session evaluator's result.
struct RecordFacts {
    const RecordSource& source;
    EvaluationBasis basis;
    SessionEvaluation evaluation;
    DecisionSettings decision;
    double probability = 0.0; // coverage probability of U
};

std::string text(std::string_view view);
const RangeSpec* rangeById(const Instrument& instrument, std::int64_t rangeId);
// "10 V (0 V to 10 V, DC)".
std::string rangeWords(const RangeSpec& range, std::optional<SignalType> signal);
// The identification of the item (ISO/IEC 17025:2017 7.8.2.1 g), for records and reports.
std::vector<Field> instrumentFields(const Instrument& instrument);
// The laboratory's name, address and accreditation (7.8.2.1 b).
std::vector<Field> labFields(const std::optional<Lab>& lab);
std::string runningHead(const std::optional<Lab>& lab);

// Per range: the session chart, then per phase the table of points, its notes, statement and
// cautions (7.8.4.1 a, d; 7.8.6).
void addResults(const RecordFacts& facts, Document& document);
// Adjustments made and resistor checks.
void addWorkDone(const RecordFacts& facts, Document& document);
// The statement of conformity of the whole record with the rule named and explained (7.8.6.2).
void addConformity(const RecordFacts& facts, Document& document);

} // namespace mw::record::detail
