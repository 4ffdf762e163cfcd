// Loading and evaluating the session on the bench.
#include "app/gui/bench/bench_session.h"

#include "app/gui/workspace.h"
#include "core/plan/session_plan.h"
#include "storage/instrument_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "storage/workbook_error.h"

#include <algorithm>
#include <set>

namespace mw::gui {

BenchSession::BenchSession(Workspace& workspace, std::int64_t sessionId)
    : workspace_(workspace) {
    session_.id = sessionId;
    reload(true);
}

void BenchSession::reload(bool withRegister) {
    storage::Workbook& workbook = *workspace_.workbook();
    auto session = storage::SessionRepository(workbook).find(session_.id);
    if (!session) {
        throw storage::WorkbookError(
            storage::WorkbookError::Kind::NotFound,
            QObject::tr("calibration session %1 no longer exists").arg(session_.id));
    }
    session_ = std::move(*session);
    if (withRegister || instrument_.id != session_.instrument_id) {
        auto instrument = storage::InstrumentRepository(workbook).find(session_.instrument_id);
        if (!instrument) {
            throw storage::WorkbookError(
                storage::WorkbookError::Kind::NotFound,
                QObject::tr("the instrument of session %1 is missing").arg(session_.id));
        }
        instrument_ = std::move(*instrument);
        standards_ = storage::StandardRepository(workbook).all();
    }
    evaluate();
}

void BenchSession::evaluate() {
    const bool sealed = session_.state != SessionState::Draft &&
                        session_.state != SessionState::Returned && session_.sealed;
    if (sealed) {
        inputs_ = *session_.sealed;
    } else {
        inputs_ = sealInputs(instrument_, session_, standards_,
                             session_.supersedes_id ? session_.sealed : std::nullopt);
    }
    evaluation_ = evaluateSession(instrument_, session_, inputs_);
}

const RangeSpec* BenchSession::range(std::int64_t rangeId) const {
    for (const RangeSpec& r : instrument_.ranges) {
        if (r.id == rangeId) {
            return &r;
        }
    }
    return nullptr;
}

std::vector<const RangeSpec*> BenchSession::plannedRanges() const {
    std::set<std::int64_t> planned;
    for (const TestPoint& point : effectivePlan(session_)) {
        planned.insert(point.range_id);
    }
    std::vector<const RangeSpec*> ranges;
    for (const RangeSpec& r : instrument_.ranges) {
        if (planned.count(r.id)) {
            ranges.push_back(&r);
        }
    }
    return ranges;
}

bool BenchSession::editable() const {
    return (session_.state == SessionState::Draft || session_.state == SessionState::Returned) &&
           workspace_.can(Capability::Calibrate) && !workspace_.workbook()->isReadOnly();
}

} // namespace mw::gui
