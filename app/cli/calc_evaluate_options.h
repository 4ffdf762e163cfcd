// The options of `calc evaluate` and the evaluation input they describe: range, class, budget
// parts, reference standard, temperature, decision rule, phase and the readings CSV.
#pragma once

#include "app/cli/readings_csv.h"
#include "core/evaluation/evaluation.h"

#include <QCommandLineParser>

namespace mw::cli {

// What one run of `calc evaluate` asks for.
struct EvaluateRequest {
    EvaluationInput input;
    ReadingsFile readings;
    int rangePrefixPower = 0; // the SI prefix typed in --range: -6 for 50uA
};

void addEvaluateOptions(QCommandLineParser& parser);

// Reads every option and the readings file; UsageError names the option, line or column.
EvaluateRequest evaluateRequestFrom(const QCommandLineParser& parser);

} // namespace mw::cli
