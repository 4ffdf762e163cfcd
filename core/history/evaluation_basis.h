// Which inputs a stored calibration is evaluated with when it is shown, printed or analysed:
// those it was sealed with, or, for work still open and for records sealed before inputs were
// kept, the register as it stands now (and the reader is told which).
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"

#include <vector>

namespace mw {

struct EvaluationBasis {
    SealedInputs inputs;
    bool sealed = false; // true: the copies sealed with the session at submission
};

// A submitted, approved or superseded session with sealed copies is evaluated with them; a
// draft, a returned session and a record of format 1 (no copies) with sealInputs() of
// `registerStandards` (an amendment's draft keeps the copies it inherited).
EvaluationBasis evaluationBasis(const Instrument& instrument, const CalibrationSession& session,
                                const std::vector<ReferenceStandard>& registerStandards);

// The basis in words, for a record or a report: "sealed with the session at submission" or why
// the register was used.
const char* describeBasis(const EvaluationBasis& basis, const CalibrationSession& session);

} // namespace mw
