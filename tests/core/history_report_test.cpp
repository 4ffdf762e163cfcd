// The history report of one instrument as a document: every calibration with its outcomes and
// people, the interval walk, and a drift chart per test point. Invented demo data.
#include "core/record/history_report.h"

#include "support/calibration_fixture.h"
#include "support/document_text.h"

#include <catch2/catch.hpp>

using namespace mw;
using namespace mw::record;
using Catch::Contains;

namespace {

HistoryReportSource reportOf(const std::vector<CalibrationSession>& sessions) {
    HistoryReportSource source;
    source.lab = Lab{"Demo Meter Lab", "1 Test Street", std::nullopt};
    source.instrument = mwtest::fixtureMeter();
    source.history = buildHistory(source.instrument, sessions, mwtest::fixtureStandards(),
                                  mwtest::fixturePeople());
    source.printedAt = Timestamp{mwtest::fixtureDay(1200)};
    return source;
}

} // namespace

TEST_CASE("the report lists every calibration, the interval walk and the drift charts") {
    const HistoryReportSource source = reportOf({
        mwtest::fixtureCalibration(1, 0, 0.03),
        mwtest::fixtureCalibration(2, 365, 0.20, 0.01),
        mwtest::fixtureCalibration(3, 730, 0.05),
        mwtest::fixtureCalibration(4, 1100, 0.02, std::nullopt, SessionState::Draft),
    });
    const Document document = buildHistoryReport(source);
    CHECK(document.title == "Instrument history: DEMO-1");
    CHECK(document.identifier == "History of DEMO-1 as of 2023-04-15");
    CHECK(document.runningHead == "Demo Meter Lab");
    CHECK_FALSE(document.watermark);

    const std::vector<Table> tables = mwtest::blocksOf<Table>(document);
    REQUIRE(tables.size() == 2);
    const Table& calibrations = tables[0];
    REQUIRE(calibrations.rows.size() == 4);
    // Out of tolerance as found: 0.20 V of the 0.15 V limit is 133 % (IEC 60051-1 limit).
    CHECK(calibrations.rows[1] == std::vector<std::string>{"2020-12-31", "DEMO-1-00002", "Approved",
                                                           "Fail", "Pass", "133 %", "10.000 V",
                                                           "Tess Demo", "Rowan Demo"});
    CHECK(calibrations.emphasised == std::vector<bool>{false, true, false, false});
    CHECK(calibrations.rows[3][2] == "Draft");
    CHECK(calibrations.rows[3][3] == "-");

    // Interval: three approved as-found results (the draft is not one). By hand, a = 10 %,
    // R = 90 % (NCSL RP-1 A1 steps): 365 × 1.1 = 401.5; × 1.1^−9 = 170.27; × 1.1 = 187.3.
    const Table& steps = tables[1];
    REQUIRE(steps.rows.size() == 3);
    CHECK(steps.rows[1] == std::vector<std::string>{"2020-12-31", "DEMO-1-00002",
                                                    "out of tolerance", "133 %", "shortened",
                                                    "170 days"});
    const std::string text = mwtest::documentText(document);
    CHECK_THAT(text, Contains("Registered interval: 365 days"));
    CHECK_THAT(text, Contains("Recommended interval: 187 days"));
    CHECK_THAT(text, Contains("agreed with the customer"));

    const std::vector<DriftChartGrid> grids = mwtest::blocksOf<DriftChartGrid>(document);
    REQUIRE(grids.size() == 1);
    REQUIRE(grids[0].charts.size() == 3); // 0, 5 and 10 V
    CHECK(grids[0].charts[2].caption == "10 V range at 10.000 V");
    CHECK(grids[0].charts[2].point.asFound.size() == 3);
    CHECK(document.endMark == "End of the history of DEMO-1.");
}

TEST_CASE("an instrument never calibrated gets a short report that says so") {
    const Document document = buildHistoryReport(reportOf({}));
    const std::string text = mwtest::documentText(document);
    CHECK_THAT(text, Contains("has not been calibrated yet"));
    CHECK_THAT(text, Contains("the registered interval of 365 days stands"));
    CHECK_THAT(text, Contains("No approved results yet"));
}
