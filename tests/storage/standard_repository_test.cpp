// Reference standards round-trip with their specification rows; an edit updates each range in
// place by its position, so the audit log shows what changed.
#include "storage/standard_repository.h"

#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

TEST_CASE("a reference standard round-trips every field", "[standards]") {
    mwtest::TempWorkbook temp;
    mw::ReferenceStandard written;
    written.asset_tag = "STD-07";
    written.description = "Standard resistor set";
    written.certificate_number = "C-2025-0031";
    written.due_date = mwtest::date(2026, 1, 31);
    written.specs = {
        {"10 kOhm", mw::Unit::Ohm, 10e3, 0.0, 0.0, 0.0, 0.017, 2.0, 12.0, mw::SignalKind::Dc},
        {"2 V DC", mw::Unit::Volt, 2.0, 0.004, 0.0005, 5e-6, std::nullopt, 2.0, std::nullopt,
         mw::SignalKind::Dc},
        {"200 mA DC", mw::Unit::Ampere, 0.2, 0.01, 0.002, 1e-6, 3e-5, 2.1, std::nullopt,
         mw::SignalKind::Dc},
        {"20 V AC", mw::Unit::Volt, 20.0, 0.05, 0.01, 0.0, std::nullopt, 2.0, std::nullopt,
         mw::SignalKind::Ac},
    };
    {
        auto workbook = temp.open();
        mw::storage::StandardRepository(*workbook).add(written);
        REQUIRE(written.id > 0);
    }
    mw::storage::Workbook workbook(temp.path());
    mw::storage::StandardRepository standards(workbook);
    CHECK(standards.find(written.id) == written);
    CHECK(standards.findByTag(QStringLiteral("STD-07")) == written);

    mw::ReferenceStandard recalibrated = written;
    recalibrated.certificate_number = "C-2026-0007";
    recalibrated.due_date = mwtest::date(2027, 1, 31);
    recalibrated.calibrated_on = mwtest::date(2026, 1, 28);
    recalibrated.specs.pop_back();
    recalibrated.specs[1].percent_of_reading = 0.003;
    const auto idsBefore = mwtest::rawValues(temp.path(), "SELECT id FROM standard_specs ORDER BY "
                                                          "sort_order LIMIT 3");
    standards.update(recalibrated);
    CHECK(standards.find(written.id) == recalibrated);
    REQUIRE(standards.all().size() == 1);
    // The ranges kept their rows (and ids); the edit is in the audit log as old and new values.
    CHECK(mwtest::rawValues(temp.path(), "SELECT id FROM standard_specs ORDER BY sort_order") ==
          idsBefore);
    CHECK(mwtest::rawValues(temp.path(), "SELECT count(*) FROM audit_log WHERE table_name = "
                                         "'standard_specs' AND action = 'update' AND old_values "
                                         "LIKE '%0.004%' AND new_values LIKE '%0.003%'") ==
          QStringList{QStringLiteral("1")});

    // A calibration after its own due date is refused by the database.
    mw::ReferenceStandard backwards = recalibrated;
    backwards.calibrated_on = mwtest::date(2027, 2, 1);
    CHECK_THROWS_AS(standards.update(backwards), mw::storage::WorkbookError);
    CHECK(standards.find(written.id) == recalibrated);

    mw::ReferenceStandard badUnit = written;
    badUnit.asset_tag = "STD-08";
    badUnit.specs[0].unit = mw::Unit::Hertz;
    try {
        standards.add(badUnit);
        FAIL("a specification in hertz was stored");
    } catch (const mw::storage::WorkbookError& error) {
        CHECK(error.kind() == mw::storage::WorkbookError::Kind::BadInput);
        CHECK(error.message().contains(QStringLiteral("10 kOhm")));
    }
    CHECK(standards.all().size() == 1); // nothing half-written
}
