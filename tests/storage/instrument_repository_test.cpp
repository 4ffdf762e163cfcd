// Instruments: every field and range round-trips, ranges are added/changed/removed on update,
// and the due list follows the last approved calibration.
#include "storage/instrument_repository.h"

#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

#include <cmath>

using mw::Instrument;
using mw::storage::InstrumentRepository;
using mw::storage::WorkbookError;

namespace {

void checkSame(const Instrument& a, const Instrument& b) {
    CHECK(a.id == b.id);
    CHECK(a.asset_tag == b.asset_tag);
    CHECK(a.description == b.description);
    CHECK(a.manufacturer == b.manufacturer);
    CHECK(a.model == b.model);
    CHECK(a.serial == b.serial);
    CHECK(a.kind == b.kind);
    CHECK(a.movement.amps_fs == b.movement.amps_fs);
    CHECK(a.movement.ohms_coil == b.movement.ohms_coil);
    CHECK(a.ranges == b.ranges);
    CHECK(a.scale_type == b.scale_type);
    CHECK(a.scale_divisions == b.scale_divisions);
    CHECK(a.accuracy_class == b.accuracy_class);
    CHECK(a.interval_days == b.interval_days);
    CHECK(a.location == b.location);
    CHECK(a.owner == b.owner);
    CHECK(a.status == b.status);
}

} // namespace

TEST_CASE("an instrument round-trips every field and range", "[instruments]") {
    mwtest::TempWorkbook temp;
    Instrument written = mwtest::demoInstrument();
    written.kind = mw::InstrumentKind::BridgeAcVoltmeter;
    written.scale_type = mw::ScaleType::ZeroInside;
    written.ranges[0].lower_limit = -5.0;
    written.ranges[0].fiducial_value = 15.0;
    written.status = mw::InstrumentStatus::OutOfService;
    {
        auto workbook = temp.open();
        InstrumentRepository(*workbook).add(written);
        REQUIRE(written.id > 0);
        REQUIRE(written.ranges[0].id > 0);
        REQUIRE(written.ranges[1].id > written.ranges[0].id);
    }
    mw::storage::Workbook workbook(temp.path());
    InstrumentRepository instruments(workbook);
    const auto byId = instruments.find(written.id);
    REQUIRE(byId);
    checkSame(*byId, written);
    const auto byTag = instruments.findByTag(QStringLiteral("VM-001"));
    REQUIRE(byTag);
    checkSame(*byTag, written);
    REQUIRE(instruments.all().size() == 1);
    checkSame(instruments.all()[0], written);
    CHECK_FALSE(instruments.find(written.id + 1));
}

TEST_CASE("updating an instrument adds, changes and removes ranges", "[instruments]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    InstrumentRepository instruments(*workbook);
    Instrument meter = mwtest::demoInstrument();
    instruments.add(meter);
    meter.location = "Store room";
    meter.ranges[0].full_scale = 12.0;
    meter.ranges.erase(meter.ranges.begin() + 1);
    meter.ranges.push_back(
        {0, "100 V", mw::Unit::Volt, 0.0, 100.0, 1998800.0, std::nullopt, mw::SignalType::Dc, {}});
    instruments.update(meter);
    CHECK(meter.ranges[1].id > 0);
    checkSame(*instruments.find(meter.id), meter);

    Instrument wrongUnit = meter;
    wrongUnit.ranges[0].unit = mw::Unit::Ohm;
    CHECK_THROWS_AS(instruments.update(wrongUnit), WorkbookError); // the CHECK on unit
    checkSame(*instruments.find(meter.id), meter);                 // and nothing half-saved
}

TEST_CASE("a range with readings cannot be removed", "[instruments]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    mwtest::Seed seed = mwtest::seed(*workbook);
    mw::CalibrationSession session = mwtest::draft(seed);
    mw::storage::SessionRepository(*workbook).create(session);
    seed.instrument.ranges.erase(seed.instrument.ranges.begin());
    try {
        InstrumentRepository(*workbook).update(seed.instrument);
        FAIL("a range with readings was removed");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::RuleViolation);
        CHECK(error.message().contains(QStringLiteral("removing a range")));
    }
}

TEST_CASE("the due list: never calibrated first, then by due date, retired left out",
          "[instruments]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    const mwtest::Seed seed = mwtest::seed(*workbook); // VM-001, interval 365 days
    InstrumentRepository instruments(*workbook);
    Instrument never = mwtest::demoInstrument("VM-002");
    instruments.add(never);
    Instrument retired = mwtest::demoInstrument("VM-003");
    retired.status = mw::InstrumentStatus::Retired;
    instruments.add(retired);
    Instrument shortInterval = mwtest::demoInstrument("VM-004");
    shortInterval.interval_days = 90;
    instruments.add(shortInterval);

    mw::storage::SessionRepository sessions(*workbook);
    auto approve = [&](std::int64_t instrumentId, mw::Timestamp started) {
        mwtest::Seed forIt = seed;
        forIt.instrument = *instruments.find(instrumentId);
        mw::CalibrationSession s = mwtest::draft(forIt, started);
        sessions.create(s);
        sessions.submit(s.id, started + std::chrono::hours{4});
        sessions.approve(s.id, mwtest::signer(*workbook, seed.reviewer),
                         started + std::chrono::hours{6});
    };
    approve(seed.instrument.id, mwtest::at(2024, 1, 10));
    approve(seed.instrument.id, mwtest::at(2025, 1, 10)); // the later one counts
    approve(shortInterval.id, mwtest::at(2025, 1, 20));
    mw::CalibrationSession draftOnly = mwtest::draft(seed, mwtest::at(2025, 6, 1));
    sessions.create(draftOnly); // drafts do not count

    const auto due = instruments.dueList();
    REQUIRE(due.size() == 3);
    CHECK(due[0].asset_tag == "VM-002");
    CHECK_FALSE(due[0].due_date);
    CHECK(due[1].asset_tag == "VM-004");
    CHECK(due[1].last_calibrated == mwtest::date(2025, 1, 20));
    CHECK(due[1].due_date == mwtest::date(2025, 4, 20)); // 90 days later
    CHECK(due[2].asset_tag == "VM-001");
    CHECK(due[2].due_date == mwtest::date(2026, 1, 10)); // 365 days later
}

TEST_CASE("an accuracy class outside the IEC 60051-2 series is refused before any SQL",
          "[instruments]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    InstrumentRepository instruments(*workbook);
    Instrument odd = mwtest::demoInstrument("VM-ODD");
    odd.accuracy_class = 4.0; // not a class index of IEC 60051-2 (0.05 ... 5; from memory)
    try {
        instruments.add(odd);
        FAIL("an accuracy class of 4 was stored");
    } catch (const WorkbookError& error) {
        CHECK(error.kind() == WorkbookError::Kind::BadInput);
        CHECK(error.message().contains(QStringLiteral("instrument \"VM-ODD\"")));
        CHECK(error.message().contains(QStringLiteral("accuracy class 4 is not a class index")));
    }
    CHECK(instruments.count() == 0);
    // A class index computed with a rounding error is stored as the exact series member.
    Instrument fine = mwtest::demoInstrument("VM-FINE");
    fine.accuracy_class = std::nextafter(1.5, 2.0);
    instruments.add(fine);
    CHECK(instruments.find(fine.id)->accuracy_class == 1.5);
}
