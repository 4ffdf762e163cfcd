// The calibration record as a document: every item ISO/IEC 17025:2017 7.8.2.1, 7.8.4 and 7.8.6
// ask of a calibration certificate, numbers as the session evaluator found them, and the marks
// of drafts, amendments and superseded records. Meter, lab and people are invented demo data.
#include "core/record/calibration_record.h"

#include "support/calibration_fixture.h"
#include "support/document_text.h"

#include <catch2/catch.hpp>

#include <stdexcept>

using namespace mw;
using namespace mw::record;
using Catch::Contains;

namespace {

const std::string kDigest(64, 'c');

RecordSource sourceFor(CalibrationSession session) {
    RecordSource source;
    source.lab = Lab{"Demo Meter Lab", "1 Test Street\nDemo Town", std::string("ACC-0001")};
    source.instrument = mwtest::fixtureMeter();
    source.standards = mwtest::fixtureStandards();
    source.users = mwtest::fixturePeople();
    source.printedAt = Timestamp{mwtest::fixtureDay(900)};
    if (session.state == SessionState::Approved || session.state == SessionState::Superseded) {
        session.digest = kDigest;
    }
    source.session = std::move(session);
    return source;
}

std::string textOf(const RecordSource& source) {
    return mwtest::documentText(buildCalibrationRecord(source));
}

// The table of points of one range and phase (the first table after its heading).
Table pointsAfter(const Document& document, const std::string& heading) {
    bool seen = false;
    for (const Block& block : document.blocks) {
        if (const auto* h = std::get_if<Heading>(&block)) {
            seen = h->text.find(heading) != std::string::npos;
        } else if (const auto* t = std::get_if<Table>(&block); t && seen) {
            return *t;
        }
    }
    FAIL("no table after a heading with \"" << heading << "\"");
    return {};
}

} // namespace

TEST_CASE("an approved record carries every item a calibration certificate needs") {
    // ISO/IEC 17025:2017 7.8.2.1 a-o, 7.8.4.1 a-e, 7.8.6.2.
    const RecordSource source = sourceFor(mwtest::fixtureCalibration(42, 0, 0.05));
    const Document document = buildCalibrationRecord(source);
    const std::string text = mwtest::documentText(document);
    CHECK(document.title == "Calibration record");                         // a
    CHECK(document.runningHead == "Demo Meter Lab");                       // b, every page
    CHECK_THAT(text, Contains("1 Test Street\nDemo Town"));                // b
    CHECK_THAT(text, Contains("Place of calibration"));                    // c
    CHECK(document.identifier == "Record DEMO-1-00042, revision 1");       // d, every page
    CHECK(document.endMark == "End of record DEMO-1-00042 (revision 1)."); // d, clear end
    CHECK_THAT(text, Contains("Customer (owner): Demo customer"));         // e
    CHECK_THAT(text, Contains("Method: Comparison with a calibrator"));    // f
    CHECK_THAT(text, Contains("Serial number: SN-0001"));                  // g
    CHECK_THAT(text, Contains("Asset tag: DEMO-1"));
    CHECK_THAT(text, Contains("Maker and model: Demo Works PV-10"));
    CHECK_THAT(text, Contains("10 V (0.00 V to 10.0 V, DC)"));
    CHECK_THAT(text, Contains("class 1.5 (IEC 60051-2)"));
    CHECK_THAT(text, Contains("Zero at one end, 50 divisions"));
    CHECK_THAT(text, Contains("Date of calibration: 2020-01-01 09:00 UTC to 11:00 UTC"));   // i
    CHECK_THAT(text, Contains("Date of issue: 2020-01-03"));                                // j
    CHECK_THAT(text, Contains("relate only to the item calibrated"));                       // l
    CHECK_THAT(text, Contains("Approved by: Rowan Demo (Reviewer), 2020-01-03 09:00 UTC")); // o
    CHECK_THAT(text, Contains("Calibrated by: Tess Demo (Technician)"));
    CHECK_THAT(text,
               Contains("Environment: ambient 23.0 \u00B0C, relative humidity 50 %")); // 7.8.4.1 b
    CHECK_THAT(text,
               Contains("STD-5 | Demo calibrator | C-1 | 2020-07-19 | 20 V DC for 10 V")); // c
    CHECK_THAT(text, Contains("Traceability"));
    CHECK_THAT(text, Contains("coverage probability of about 95.45 %")); // a: U with k and p
    // 7.8.6.2: the rule named and what it means, and the specification.
    CHECK_THAT(text, Contains("binary statement for simple acceptance (ILAC G8:09/2019 4.2.1): "
                              "each measured error is compared with the limit as it stands"));
    CHECK_THAT(text, Contains("accuracy class 1.5 (IEC 60051-1:2016 and IEC 60051-2)"));
    // The digest and how to check it.
    CHECK_THAT(text, Contains("Digest (SHA-256): " + kDigest));
    CHECK_THAT(text, Contains("meterwright verify WORKBOOK"));
    CHECK_FALSE(document.watermark);
    CHECK_FALSE(document.banner);
    CHECK(mwtest::blocksOf<ErrorChart>(document).size() == 1);
}

TEST_CASE("each point shows applied, indicated, error, % of FV, limit, U with k and decision") {
    const Document document =
        buildCalibrationRecord(sourceFor(mwtest::fixtureCalibration(42, 0, 0.05)));
    const Table table = pointsAfter(document, "as found");
    REQUIRE(table.columns.size() == 9);
    REQUIRE(table.rows.size() == 3);
    // At 10 V: error +0.05 V. By hand (JCGM 100:2008): readability ½ × 0.2 × 0.2 V = 20 mV
    // rectangular -> 11.55 mV; reference 0.004 % of 10 V = 0.4 mV rectangular -> 0.23 mV;
    // u_c = 11.55 mV, k = 2 (ν infinite), U = 23.1 mV rounded up to two digits: 24 mV. The
    // error to U's last digit: +50 mV; 0.5 % of the fiducial value 10 V, to a hundredth of the
    // class index: +0.50 %. Limit: 1.5 % of 10 V = 150 mV (IEC 60051-1).
    CHECK(table.rows[2] == std::vector<std::string>{"3", "10.000 V", "10.050 V", "+50 mV",
                                                    "+0.50 %", "150 mV", "24 mV", "2.00", "Pass"});
    CHECK(table.rows[0][1] == "0.000 V");
    CHECK(table.rows[0][3] == "0 mV");
    CHECK(table.emphasised == std::vector<bool>{false, false, false});
}

TEST_CASE("as-found and as-left both print, and a point that did not pass stands out") {
    // 0.20 V > 0.15 V as found (fail); adjusted to 0.01 V.
    CalibrationSession s = mwtest::fixtureCalibration(43, 0, 0.20, 0.01);
    s.adjustments = {{1, s.started_at + std::chrono::minutes{40}, "Span trimmed by 2 %"}};
    s.resistor_checks = {{1, mwtest::kFixtureRange, "R1 multiplier", 9900.0, 9950.0, 1.0}};
    const Document document = buildCalibrationRecord(sourceFor(s));
    const Table asFound = pointsAfter(document, "as found");
    CHECK(asFound.rows[2][3] == "+200 mV");
    CHECK(asFound.rows[2][8] == "Fail");
    CHECK(asFound.emphasised[2]);
    const Table asLeft = pointsAfter(document, "as left");
    CHECK(asLeft.rows[2][8] == "Pass");
    const std::string text = mwtest::documentText(document);
    CHECK_THAT(text, Contains("As found: Fail"));
    CHECK_THAT(text, Contains("As left (after adjustment): Pass"));
    CHECK_THAT(text, Contains("On leaving the laboratory: Pass"));
    CHECK_THAT(text, Contains("2020-01-01 09:40 UTC | Span trimmed by 2 % |"));
    // (9950 − 9900)/9900 = +0.505 %, within ±1 %.
    CHECK_THAT(text, Contains("10 V | R1 multiplier | 9.9000 k\u03A9 | 9.9500 k\u03A9 | "
                              "+0.505 % | 1 % | yes |"));
}

TEST_CASE("work that is not approved prints only as a draft, watermarked") {
    for (SessionState state :
         {SessionState::Draft, SessionState::Submitted, SessionState::Returned}) {
        const Document document =
            buildCalibrationRecord(sourceFor(mwtest::fixtureCalibration(44, 0, 0.05, {}, state)));
        REQUIRE(document.watermark);
        CHECK_THAT(*document.watermark, Contains("NOT A CALIBRATION RECORD"));
        CHECK(document.title == "Calibration record (draft)");
        const std::string text = mwtest::documentText(document);
        CHECK_THAT(text, Contains("This is not a calibration record"));
        CHECK_THAT(text, Contains("Approved by: not approved"));
        CHECK_THAT(text, Contains("No digest"));
        CHECK_THAT(text, Contains("Date of issue: not issued (draft)"));
    }
}

TEST_CASE("an amendment names what it supersedes; the superseded record points to it") {
    CalibrationSession amendment = mwtest::fixtureCalibration(66, 30, 0.05);
    amendment.revision = 2;
    amendment.supersedes_id = 63;
    amendment.amendment_reason = "Applied value at 5 V transposed";
    const std::string text = textOf(sourceFor(amendment));
    CHECK_THAT(text, Contains("this record (revision 2) supersedes record DEMO-1-00063"));
    CHECK_THAT(text, Contains("Reason: Applied value at 5 V transposed"));

    RecordSource old =
        sourceFor(mwtest::fixtureCalibration(63, 0, 0.05, {}, SessionState::Superseded));
    old.successor = Successor{66, 2, amendment.amendment_reason, amendment.approved_at};
    const Document document = buildCalibrationRecord(old);
    REQUIRE(document.banner);
    CHECK_THAT(*document.banner, Contains("SUPERSEDED") && Contains("DEMO-1-00066") &&
                                     Contains("approved 2020-02-02") &&
                                     Contains("Applied value at 5 V transposed"));
    CHECK_FALSE(document.watermark); // it was a record, and stays one
}

TEST_CASE("the hazardous-live caution is carried where the session reached it") {
    // IEC 61010-1:2010 6.3.1 a: above 60 V DC is hazardous live.
    RecordSource source = sourceFor(mwtest::fixtureCalibration(45, 0, 0.05));
    CHECK_THAT(textOf(source), !Contains("IEC 61010-1"));
    RangeSpec& range = source.instrument.ranges[0];
    range.label = "100 V";
    range.full_scale = 100.0;
    range.nominal_ohms = 99900.0;
    for (Reading& r : source.session.readings) {
        r.applied *= 10.0;
        r.indicated = *r.indicated * 10.0;
    }
    source.session.sealed = sealInputs(source.instrument, source.session, source.standards);
    const Document document = buildCalibrationRecord(source);
    bool boxed = false;
    for (const Paragraph& p : mwtest::blocksOf<Paragraph>(document)) {
        boxed =
            boxed || (p.style == ParagraphStyle::Caution &&
                      p.text.find("hazardous-live limits of IEC 61010-1") != std::string::npos &&
                      p.text.find("local electrical codes") != std::string::npos);
    }
    CHECK(boxed);
}

TEST_CASE("the signing key is printed only when the approval was signed") {
    RecordSource source = sourceFor(mwtest::fixtureCalibration(46, 0, 0.05));
    CHECK_THAT(textOf(source), !Contains("signed with key"));
    source.signerKeyFingerprint = "SHA256:demo-key-fingerprint";
    CHECK_THAT(textOf(source), Contains("Approval signed with key: SHA256:demo-key-fingerprint"));
}

TEST_CASE("the chain head at printing is printed, shortened, when it is known") {
    RecordSource source = sourceFor(mwtest::fixtureCalibration(47, 0, 0.05));
    CHECK_THAT(textOf(source), !Contains("Record chain at printing"));
    source.chainAtPrinting = ChainAtPrinting{12, "0123456789abcdef" + std::string(48, 'e')};
    CHECK_THAT(textOf(source),
               Contains("Record chain at printing: 12 approved records, head 0123456789abcdef\n"));
    source.chainAtPrinting = ChainAtPrinting{};
    CHECK_THAT(textOf(source), Contains("Record chain at printing: 0 approved records, none"));
}

TEST_CASE("record identifiers and the session they must belong to") {
    CHECK(recordIdentifier(mwtest::fixtureMeter(), 7) == "DEMO-1-00007");
    CHECK(recordIdentifier(mwtest::fixtureMeter(), 1234567) == "DEMO-1-1234567");
    RecordSource source = sourceFor(mwtest::fixtureCalibration(47, 0, 0.05));
    source.session.instrument_id = 2;
    CHECK_THROWS_WITH(buildCalibrationRecord(source), Contains("session 47") && Contains("DEMO-1"));
}
