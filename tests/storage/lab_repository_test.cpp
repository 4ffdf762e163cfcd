// The lab identity round-trips, with and without an accreditation id, with its settings.
#include "storage/lab_repository.h"

#include "storage/workbook_error.h"
#include "tests/storage/workbook_fixture.h"

#include <catch2/catch.hpp>

TEST_CASE("the lab identity round-trips and can be changed", "[lab]") {
    mwtest::TempWorkbook temp;
    const mw::Lab first{"Invented Meter Shop", "12 Workshop Lane\nSpringfield", "LAB-0042"};
    {
        auto workbook = temp.open();
        mw::storage::LabRepository lab(*workbook);
        CHECK_FALSE(lab.load());
        lab.save(first);
    }
    mw::storage::Workbook workbook(temp.path());
    mw::storage::LabRepository lab(workbook);
    CHECK(lab.load() == first);
    const mw::Lab second{"Invented Meter Shop Ltd", "13 Workshop Lane", std::nullopt, true, 45};
    lab.save(second);
    CHECK(lab.load() == second);
    CHECK_THROWS_AS(lab.save({"", "", std::nullopt}), mw::storage::WorkbookError);
    CHECK(lab.load() == second);
}

TEST_CASE("the lab's settings are kept within their bounds", "[lab]") {
    mwtest::TempWorkbook temp;
    auto workbook = temp.open();
    mw::storage::LabRepository lab(*workbook);
    mw::Lab settings{"Invented Meter Shop", "", std::nullopt};
    CHECK_FALSE(settings.decimal_comma); // a new lab writes a decimal point
    CHECK(settings.due_window_days == 30);
    lab.save(settings);
    settings.due_window_days = 0;
    CHECK_THROWS_WITH(lab.save(settings), Catch::Contains("1 to 366 days"));
    settings.due_window_days = 367;
    CHECK_THROWS_AS(lab.save(settings), mw::storage::WorkbookError);
    CHECK(lab.load()->due_window_days == 30);
}
