// What `calc evaluate` prints: the JSON document, or a table of points with the budget of the
// worst point, the cautions, the statement and the advice.
#pragma once

#include "app/cli/calc_evaluate_options.h"
#include "core/evaluation/evaluation.h"

#include <QJsonObject>

namespace mw::cli {

QJsonObject evaluationJson(const EvaluationResult& result, const EvaluateRequest& request);
// The same document for any evaluation of one range and phase (the session evaluator's too):
// the keys of `calc evaluate --json`.
QJsonObject evaluationJson(const EvaluationResult& result, const EvaluationInput& input);

void printEvaluation(const EvaluationResult& result, const EvaluateRequest& request);

} // namespace mw::cli
