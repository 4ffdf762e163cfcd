// What the bench works on for one calibration session: the instrument, the session with all it
// holds, the inputs it is evaluated with (the register as it stands for a draft, its sealed
// copies once submitted) and the session evaluator's results. Reloaded from the workbook after
// each change, so the screen always shows what is saved.
#pragma once

#include "core/evaluation/session_evaluation.h"
#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"

#include <cstdint>
#include <optional>
#include <vector>

namespace mw::gui {

class Workspace;

class BenchSession {
public:
    // Throws WorkbookError when the session or its instrument cannot be read.
    BenchSession(Workspace& workspace, std::int64_t sessionId);

    // Reads the session again and evaluates it; the register (instrument, standards) too
    // when `withRegister`.
    void reload(bool withRegister = false);

    std::int64_t id() const { return session_.id; }
    const Instrument& instrument() const { return instrument_; }
    const CalibrationSession& session() const { return session_; }
    const std::vector<ReferenceStandard>& standards() const { return standards_; }
    const SealedInputs& inputs() const { return inputs_; }
    const SessionEvaluation& evaluation() const { return evaluation_; }
    const RangeSpec* range(std::int64_t rangeId) const;
    // The ranges the plan covers, in the instrument's order.
    std::vector<const RangeSpec*> plannedRanges() const;
    // True while the signed-in person may change it (a draft or returned session, a writable
    // workbook, and the right to calibrate).
    bool editable() const;

private:
    void evaluate();

    Workspace& workspace_;
    Instrument instrument_;
    CalibrationSession session_;
    std::vector<ReferenceStandard> standards_;
    SealedInputs inputs_;
    SessionEvaluation evaluation_;
};

} // namespace mw::gui
