// The inputs a stored calibration is evaluated with.
#include "core/history/evaluation_basis.h"

#include "core/evaluation/session_evaluation.h"

namespace mw {
namespace {

bool open(const CalibrationSession& session) {
    return session.state == SessionState::Draft || session.state == SessionState::Returned;
}

} // namespace

EvaluationBasis evaluationBasis(const Instrument& instrument, const CalibrationSession& session,
                                const std::vector<ReferenceStandard>& registerStandards) {
    if (session.sealed && !open(session)) {
        return {*session.sealed, true};
    }
    return {sealInputs(instrument, session, registerStandards,
                       session.supersedes_id ? session.sealed : std::nullopt),
            false};
}

const char* describeBasis(const EvaluationBasis& basis, const CalibrationSession& session) {
    if (basis.sealed) {
        return "the copies of the standards' specifications and of the ranges sealed with the "
               "session at submission";
    }
    if (open(session)) {
        return "the register as it stands now, as the work is not yet submitted";
    }
    return "the register as it stands now, as this record was sealed before the workbook kept "
           "copies of the evaluation inputs";
}

} // namespace mw
