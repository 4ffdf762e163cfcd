// Which inputs a stored calibration is evaluated with when shown or printed: its sealed copies
// once submitted, the register while open and for records sealed before copies were kept.
// Invented demo data.
#include "core/history/evaluation_basis.h"

#include "core/evaluation/session_evaluation.h"
#include "support/calibration_fixture.h"

#include <catch2/catch.hpp>

#include <string>

using namespace mw;

namespace {

Instrument meter() {
    return mwtest::fixtureMeter();
}

std::vector<ReferenceStandard> register_(double percentOfReading) {
    ReferenceStandard calibrator;
    calibrator.id = 5;
    StandardRangeSpec dc;
    dc.label = "20 V DC";
    dc.full_scale = 20.0;
    dc.percent_of_reading = percentOfReading;
    calibrator.specs = {dc};
    return {calibrator};
}

CalibrationSession session(SessionState state) {
    return mwtest::fixtureCalibration(3, 0, 0.02, std::nullopt, state);
}

} // namespace

TEST_CASE("a submitted record is evaluated with what it was sealed with") {
    const CalibrationSession s = session(SessionState::Approved); // sealed at 0.004 %
    // The standard was recalibrated since: its spec on the register changed.
    const EvaluationBasis basis = evaluationBasis(meter(), s, register_(0.02));
    CHECK(basis.sealed);
    CHECK(basis.inputs == *s.sealed);
    CHECK(std::string(describeBasis(basis, s)).find("sealed with the session") !=
          std::string::npos);
}

TEST_CASE("open work and records without copies use the register as it stands") {
    CalibrationSession draft = session(SessionState::Draft);
    const EvaluationBasis forDraft = evaluationBasis(meter(), draft, register_(0.02));
    CHECK_FALSE(forDraft.sealed);
    REQUIRE(forDraft.inputs.specs.size() == 1);
    CHECK(forDraft.inputs.specs[0].spec.percent_of_reading == 0.02);
    CHECK(std::string(describeBasis(forDraft, draft)).find("not yet submitted") !=
          std::string::npos);

    // A record of format 1 was sealed before copies were kept.
    CalibrationSession old = session(SessionState::Approved);
    old.record_format = kRecordFormatWithoutInputs;
    old.sealed.reset();
    const EvaluationBasis forOld = evaluationBasis(meter(), old, register_(0.02));
    CHECK_FALSE(forOld.sealed);
    CHECK(std::string(describeBasis(forOld, old)).find("sealed before") != std::string::npos);

    // A returned session is open again even though it was sealed once.
    CalibrationSession returned = session(SessionState::Returned);
    returned.sealed = sealInputs(meter(), returned, mwtest::fixtureStandards());
    CHECK_FALSE(evaluationBasis(meter(), returned, register_(0.02)).sealed);
}
