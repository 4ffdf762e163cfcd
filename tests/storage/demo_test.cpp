// The invented demo workbook: its register, people, standards and five years of records, the
// workflow states it shows, its soundness under verify, and that it is reproducible.
#include "storage/demo/demo_workbook.h"

#include "core/accuracy/accuracy_class.h"
#include "core/evaluation/session_evaluation.h"
#include "storage/audit_repository.h"
#include "storage/instrument_repository.h"
#include "storage/lab_repository.h"
#include "storage/record_digest.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "storage/user_repository.h"
#include "storage/verification.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"
#include "support/approx.h"

#include <catch2/catch.hpp>

#include <QFile>
#include <QTemporaryDir>

#include <algorithm>
#include <cmath>
#include <map>
#include <numbers>
#include <set>

using namespace std::chrono;
using mw::CalibrationSession;
using mw::Instrument;
using mw::SessionState;
using mw::Timestamp;
using mw::storage::InstrumentRepository;
using mw::storage::SessionRepository;
using mw::storage::Workbook;

namespace {

const sys_days kToday = sys_days{year{2026} / March / 16};

// One demo per test run: writing it hashes three passwords and records ~150 sessions.
struct DemoFile {
    QTemporaryDir dir;
    QString path = dir.filePath(QStringLiteral("demo.mwb"));
    mw::demo::DemoSummary summary = mw::demo::writeDemoWorkbook(path, kToday);
};

const DemoFile& demoFile() {
    static const DemoFile file;
    return file;
}

Workbook openDemo() {
    return Workbook(demoFile().path);
}

const Instrument& byTag(const std::vector<Instrument>& instruments, const std::string& tag) {
    const auto it = std::find_if(instruments.begin(), instruments.end(),
                                 [&tag](const Instrument& i) { return i.asset_tag == tag; });
    REQUIRE(it != instruments.end());
    return *it;
}

std::vector<CalibrationSession> allSessions(Workbook& workbook) {
    SessionRepository sessions(workbook);
    std::vector<CalibrationSession> all;
    for (const Instrument& instrument : InstrumentRepository(workbook).all()) {
        for (CalibrationSession& session : sessions.historyOf(instrument.id)) {
            all.push_back(std::move(session));
        }
    }
    return all;
}

double limitOf(const Instrument& instrument, std::int64_t rangeId) {
    for (const mw::RangeSpec& range : instrument.ranges) {
        if (range.id == rangeId) {
            const mw::ScaleRange scale{range.lower_limit, range.full_scale, instrument.scale_type,
                                       range.fiducial_value};
            return mw::permissibleError(instrument.accuracy_class, mw::fiducialValue(scale));
        }
    }
    FAIL("reading refers to a range the instrument does not have");
    return 0.0;
}

// Largest |indicated - applied| / limit of one phase; -1 when the phase has no reading.
double worstFraction(const Instrument& instrument, const CalibrationSession& session,
                     mw::Phase phase) {
    double worst = -1.0;
    for (const mw::Reading& reading : session.readings) {
        if (reading.phase == phase) {
            worst = std::max(worst, std::fabs(*reading.indicated - reading.applied) /
                                        limitOf(instrument, reading.range_id));
        }
    }
    return worst;
}

// Instrument has no operator== (its Movement has none): every field compared here.
bool sameInstrument(const Instrument& a, const Instrument& b) {
    return a.id == b.id && a.asset_tag == b.asset_tag && a.description == b.description &&
           a.manufacturer == b.manufacturer && a.model == b.model && a.serial == b.serial &&
           a.kind == b.kind && a.movement.amps_fs == b.movement.amps_fs &&
           a.movement.ohms_coil == b.movement.ohms_coil && a.ranges == b.ranges &&
           a.scale_type == b.scale_type && a.scale_divisions == b.scale_divisions &&
           a.accuracy_class == b.accuracy_class && a.interval_days == b.interval_days &&
           a.location == b.location && a.owner == b.owner && a.status == b.status;
}

} // namespace

TEST_CASE("the demo register holds about 25 meters of every kind") {
    Workbook workbook = openDemo();
    const std::vector<Instrument> instruments = InstrumentRepository(workbook).all();
    CHECK(instruments.size() == 25);
    std::map<mw::InstrumentKind, int> perKind;
    for (const Instrument& instrument : instruments) {
        ++perKind[instrument.kind];
        CHECK_FALSE(instrument.ranges.empty());
        CHECK(instrument.movement.amps_fs >= 50e-6);
        CHECK(instrument.movement.amps_fs <= 1e-3);
        // Class indices of IEC 60051-1 (common practice): the workbook accepts no other.
        CHECK(mw::isStandardClassIndex(instrument.accuracy_class));
    }
    CHECK(perKind[mw::InstrumentKind::DcVoltmeter] == 6);
    CHECK(perKind[mw::InstrumentKind::DcAmmeter] == 5);
    CHECK(perKind[mw::InstrumentKind::HalfWaveAcVoltmeter] == 4);
    CHECK(perKind[mw::InstrumentKind::BridgeAcVoltmeter] == 4);
    CHECK(perKind[mw::InstrumentKind::MultiRange] == 6);
    CHECK(byTag(instruments, "CFM-105").status == mw::InstrumentStatus::Retired);
    CHECK(byTag(instruments, "CFM-106").status == mw::InstrumentStatus::OutOfService);
    CHECK(demoFile().summary.instruments == 25);
}

TEST_CASE("demo multipliers and shunts follow the textbook design formulas") {
    Workbook workbook = openDemo();
    const std::vector<Instrument> instruments = InstrumentRepository(workbook).all();
    // DC voltmeter multiplier R_s = V_fs / I_fs - R_m (common practice; Helfrick & Cooper ch. 4,
    // from memory): 15 V on a 1 mA, 100 ohm movement.
    CHECK(*byTag(instruments, "CFM-101").ranges.at(0).nominal_ohms ==
          mwtest::relative(14'900.0, 1e-12));
    // Shunt R_sh = I_fs R_m / (I - I_fs) (common practice): 1 A on 1 mA, 100 ohm.
    CHECK(*byTag(instruments, "CFM-201").ranges.at(0).nominal_ohms ==
          mwtest::relative(0.1 / 0.999, 1e-12));
    // Half-wave rectifier voltmeter on a sine: average = (sqrt 2 / pi) V_rms, the "0.45" of the
    // textbooks (common practice): 250 V rms on 1 mA, 100 ohm, ideal diodes.
    CHECK(*byTag(instruments, "CFM-301").ranges.at(0).nominal_ohms ==
          mwtest::relative(std::numbers::sqrt2 / std::numbers::pi * 250.0 / 1e-3 - 100.0, 1e-12));
    // Bridge: average = (2 sqrt 2 / pi) V_rms, the textbooks' "0.9" (common practice).
    CHECK(
        *byTag(instruments, "CFM-401").ranges.at(0).nominal_ohms ==
        mwtest::relative(2 * std::numbers::sqrt2 / std::numbers::pi * 300.0 / 1e-3 - 100.0, 1e-12));
    // A 100 uA movement measuring 500 uA: shunt = 100e-6 * 1000 / 400e-6 = 250 ohm.
    CHECK(*byTag(instruments, "CFM-205").ranges.at(0).nominal_ohms ==
          mwtest::relative(250.0, 1e-12));
    // The 1 mA range of a 100 uA movement uses a shunt, none of the ranges is the bare movement.
    const Instrument& multiRange = byTag(instruments, "CFM-502");
    REQUIRE(multiRange.ranges.size() == 4);
    CHECK(*multiRange.ranges[0].nominal_ohms == mwtest::relative(1e-4 * 1000 / 9e-4, 1e-12));
    // Each range of a multi-range voltmeter has its own multiplier, V / I_fs - R_m (common
    // practice): 3 V and 300 V on a 50 uA, 2 kohm movement.
    const Instrument& voltmeter = byTag(instruments, "CFM-501");
    REQUIRE(voltmeter.ranges.size() == 5);
    CHECK(*voltmeter.ranges[0].nominal_ohms == mwtest::relative(58'000.0, 1e-12));
    CHECK(*voltmeter.ranges[4].nominal_ohms == mwtest::relative(5'998'000.0, 1e-12));
    // The service multimeter's AC range is half-wave: (sqrt 2 / pi) 250 V / 50 uA - 3 kohm.
    const Instrument& multimeter = byTag(instruments, "CFM-503");
    REQUIRE(multimeter.ranges.size() == 5);
    CHECK(*multimeter.ranges[4].nominal_ohms ==
          mwtest::relative(std::numbers::sqrt2 / std::numbers::pi * 250.0 / 50e-6 - 3000.0, 1e-12));
    // A centre-zero ammeter's shunt carries the current of either side, 10 A here (common
    // practice): 500 uA x 200 ohm / (10 A - 500 uA).
    CHECK(*byTag(instruments, "CFM-204").ranges.at(0).nominal_ohms ==
          mwtest::relative(500e-6 * 200.0 / (10.0 - 500e-6), 1e-12));
}

TEST_CASE("the demo lab has one user per role and the stated demo passwords") {
    Workbook workbook = openDemo();
    mw::storage::UserRepository users(workbook);
    REQUIRE(users.all().size() == 3);
    const auto tess = users.authenticate(QStringLiteral("tess"), QStringLiteral("demo-tech"));
    const auto rowan = users.authenticate(QStringLiteral("rowan"), QStringLiteral("demo-review"));
    const auto morgan = users.authenticate(QStringLiteral("morgan"), QStringLiteral("demo-admin"));
    REQUIRE(tess);
    REQUIRE(rowan);
    REQUIRE(morgan);
    CHECK(tess->role == mw::Role::Technician);
    CHECK(rowan->role == mw::Role::Reviewer);
    CHECK(morgan->role == mw::Role::Administrator);
    CHECK_FALSE(users.authenticate(QStringLiteral("tess"), QStringLiteral("demo-review")));
    const auto lab = mw::storage::LabRepository(workbook).load();
    REQUIRE(lab);
    CHECK(lab->name.find("Copperfen") != std::string::npos);
}

TEST_CASE("the demo has four reference standards, exactly one past its due date") {
    Workbook workbook = openDemo();
    const auto standards = mw::storage::StandardRepository(workbook).all();
    REQUIRE(standards.size() == 4);
    std::vector<std::string> overdue;
    for (const auto& standard : standards) {
        CHECK_FALSE(standard.specs.empty());
        if (standard.due_date < kToday) {
            overdue.push_back(standard.asset_tag);
        }
    }
    CHECK(overdue == std::vector<std::string>{"CFS-03"});
    CHECK(demoFile().summary.overdueStandards == 1);
}

TEST_CASE("the demo records span five years and show every workflow state") {
    Workbook workbook = openDemo();
    const std::vector<CalibrationSession> sessions = allSessions(workbook);
    std::map<SessionState, int> perState;
    Timestamp earliest = sessions.front().started_at;
    Timestamp latest = earliest;
    for (const CalibrationSession& session : sessions) {
        ++perState[session.state];
        earliest = std::min(earliest, session.started_at);
        latest = std::max(latest, session.started_at);
        if (session.reviewer_id) {
            CHECK(*session.reviewer_id != session.technician_id);
        }
        if (session.submitted_at) {
            CHECK(*session.submitted_at >= session.started_at);
        }
        if (session.approved_at) {
            REQUIRE(session.submitted_at);
            CHECK(*session.approved_at >= *session.submitted_at);
        }
    }
    CHECK(perState[SessionState::Approved] > 80);
    CHECK(perState[SessionState::Submitted] == 3);
    CHECK(perState[SessionState::Returned] == 1);
    CHECK(perState[SessionState::Draft] == 1);
    CHECK(perState[SessionState::Superseded] == 1);
    CHECK(floor<days>(earliest) >= kToday - days(5 * 365 + 3));
    CHECK(floor<days>(earliest) <= kToday - days(4 * 365));
    CHECK(latest < Timestamp(kToday));
    CHECK(demoFile().summary.sessions == static_cast<int>(sessions.size()));
    CHECK(SessionRepository(workbook).readingCount() == demoFile().summary.readings);
    CHECK(demoFile().summary.readings > 3000);
}

TEST_CASE("one approved record was amended by a later revision with its reason") {
    Workbook workbook = openDemo();
    SessionRepository sessions(workbook);
    const auto superseded = sessions.withState(SessionState::Superseded);
    REQUIRE(superseded.size() == 1);
    std::vector<CalibrationSession> revisions;
    for (const CalibrationSession& session : allSessions(workbook)) {
        if (session.supersedes_id) {
            revisions.push_back(session);
        }
    }
    REQUIRE(revisions.size() == 1);
    const CalibrationSession& amendment = revisions.front();
    const CalibrationSession& original = superseded.front();
    CHECK(*amendment.supersedes_id == original.id);
    CHECK(amendment.revision == original.revision + 1);
    CHECK(amendment.state == SessionState::Approved);
    CHECK_FALSE(amendment.amendment_reason.empty());
    CHECK_FALSE(original.digest.empty());
    CHECK_FALSE(amendment.digest.empty());
    // The correction is one applied value; everything else was carried over.
    REQUIRE(amendment.readings.size() == original.readings.size());
    int changed = 0;
    for (std::size_t i = 0; i < original.readings.size(); ++i) {
        changed += original.readings[i] == amendment.readings[i] ? 0 : 1;
    }
    CHECK(changed == 1);
}

TEST_CASE("some meters were found out of tolerance, adjusted and left within limits") {
    Workbook workbook = openDemo();
    const std::vector<Instrument> instruments = InstrumentRepository(workbook).all();
    SessionRepository sessions(workbook);
    int adjustedAfterFailing = 0;
    int failedUnrepaired = 0;
    for (const Instrument& instrument : instruments) {
        for (const CalibrationSession& session : sessions.historyOf(instrument.id)) {
            if (session.state != SessionState::Approved) {
                continue;
            }
            const double asFound = worstFraction(instrument, session, mw::Phase::AsFound);
            const double asLeft = worstFraction(instrument, session, mw::Phase::AsLeft);
            if (asLeft >= 0.0) {
                CHECK_FALSE(session.adjustments.empty());
                CHECK(asLeft <= 1.0);
                CHECK((session.outcome == mw::Outcome::Pass ||
                       session.outcome == mw::Outcome::ConditionalPass));
            }
            if (asFound > 1.0 && asLeft >= 0.0) {
                ++adjustedAfterFailing;
            } else if (asFound > 1.0) {
                ++failedUnrepaired;
                CHECK(session.outcome == mw::Outcome::Fail);
            }
        }
    }
    CHECK(adjustedAfterFailing >= 3);
    CHECK(failedUnrepaired == 1); // the meter withdrawn with a damaged pivot
}

TEST_CASE("every stored demo outcome is the session evaluator's on the sealed inputs") {
    Workbook workbook = openDemo();
    SessionRepository sessions(workbook);
    std::map<mw::Outcome, int> seen;
    int evaluated = 0;
    for (const Instrument& instrument : InstrumentRepository(workbook).all()) {
        for (const CalibrationSession& session : sessions.historyOf(instrument.id)) {
            if (session.state == SessionState::Draft) {
                CHECK_FALSE(session.outcome);
                continue;
            }
            CAPTURE(instrument.asset_tag, session.id);
            REQUIRE(session.sealed);
            REQUIRE(session.settings);
            const mw::SessionEvaluation evaluation =
                mw::evaluateSession(instrument, session, *session.sealed);
            CHECK(evaluation.problems.empty());
            REQUIRE(evaluation.overall);
            CHECK(session.outcome == evaluation.overall);
            ++seen[*evaluation.overall];
            ++evaluated;
            // A reference standard covers every range the demo calibrates.
            for (const mw::RangeEvaluation& part : evaluation.ranges) {
                CHECK_FALSE(part.reference.empty());
            }
        }
    }
    CHECK(evaluated == demoFile().summary.sessions - demoFile().summary.drafts);
    // The laboratory meters are judged with guarded acceptance, so some results near a limit
    // are stated as conditional (ILAC G8:09/2019 4.2.3).
    CHECK(seen[mw::Outcome::ConditionalPass] >= 1);
    CHECK(seen[mw::Outcome::Fail] >= 1);
    CHECK(seen[mw::Outcome::Pass] > 50);
}

TEST_CASE("a record waiting for review leans on the overdue shunt with a justification") {
    Workbook workbook = openDemo();
    const auto shunt =
        mw::storage::StandardRepository(workbook).findByTag(QStringLiteral("CFS-03"));
    REQUIRE(shunt);
    int justified = 0;
    for (const CalibrationSession& session :
         SessionRepository(workbook).withState(SessionState::Submitted)) {
        for (const mw::StandardUse& use : session.standards) {
            if (use.standard_id == shunt->id && use.due_date < kToday) {
                CHECK_FALSE(use.overdue_justification.empty());
                ++justified;
            }
        }
    }
    CHECK(justified == 1);
}

TEST_CASE("each record keeps the certificate its standards held on the day of the work") {
    Workbook workbook = openDemo();
    const auto standards = mw::storage::StandardRepository(workbook).all();
    // Per standard, the day of each use and the certificate copied.
    std::map<std::int64_t, std::vector<std::pair<sys_days, mw::StandardUse>>> uses;
    for (const CalibrationSession& session : allSessions(workbook)) {
        const sys_days day = floor<days>(session.started_at);
        for (const mw::StandardUse& use : session.standards) {
            // A certificate is issued at most a year before it falls due (the demo recalibrates
            // its standards yearly, common practice), and covers the day unless justified.
            CHECK(use.due_date - days(365) <= day);
            if (use.due_date < day) {
                CHECK_FALSE(use.overdue_justification.empty());
            }
            uses[use.standard_id].emplace_back(day, use);
        }
    }
    mw::storage::AuditRepository audit(workbook);
    const auto morgan = mw::storage::UserRepository(workbook).findByLogin(QStringLiteral("morgan"));
    REQUIRE(morgan);
    int latestOnCurrent = 0;
    for (const mw::ReferenceStandard& standard : standards) {
        INFO(standard.asset_tag);
        auto& used = uses[standard.id];
        REQUIRE_FALSE(used.empty());
        std::stable_sort(used.begin(), used.end(),
                         [](const auto& a, const auto& b) { return a.first < b.first; });
        // Later work never carries an older certificate; one number, one due date.
        std::map<std::string, sys_days> dueOf;
        for (std::size_t i = 0; i < used.size(); ++i) {
            const mw::StandardUse& use = used[i].second;
            if (i > 0) {
                CHECK(use.due_date >= used[i - 1].second.due_date);
            }
            const auto [it, added] = dueOf.emplace(use.certificate_number, use.due_date);
            CHECK(it->second == use.due_date);
        }
        // Five years of use span at least four certificates of each standard.
        CHECK(dueOf.size() >= 4);
        // Work done since the register's certificate was issued copied that certificate.
        const auto& [latestDay, latest] = used.back();
        if (latestDay >= standard.due_date - days(365)) {
            ++latestOnCurrent;
            CHECK(latest.certificate_number == standard.certificate_number);
            CHECK(latest.due_date == standard.due_date);
        }
        // Each recalibration was entered in the register by the administrator.
        int updates = 0;
        for (const auto& entry :
             audit.entries(QStringLiteral("reference_standards"), standard.id)) {
            if (entry.action == QStringLiteral("update")) {
                ++updates;
                CHECK(entry.user_id == morgan->id);
            }
        }
        CHECK(updates >= 4);
    }
    CHECK(latestOnCurrent >= 2); // the calibrator and the overdue shunt at least
}

TEST_CASE("the withdrawn and the retired meter left service after their records were approved") {
    Workbook workbook = openDemo();
    InstrumentRepository instruments(workbook);
    mw::storage::AuditRepository audit(workbook);
    for (const char* tag : {"CFM-105", "CFM-106"}) {
        INFO(tag);
        const auto instrument = instruments.findByTag(QString::fromLatin1(tag));
        REQUIRE(instrument);
        std::vector<mw::storage::AuditEntry> updates;
        for (const auto& entry : audit.entries(QStringLiteral("instruments"), instrument->id)) {
            if (entry.action == QStringLiteral("update")) {
                updates.push_back(entry);
            }
        }
        REQUIRE(updates.size() == 1);
        CHECK(updates.front().oldValues.contains(QStringLiteral("\"status\":\"in-service\"")));
        CHECK_FALSE(updates.front().newValues.contains(QStringLiteral("in-service")));
        // Written after every change to the meter's records, the approvals included: a status
        // change is allowed on a meter with approved records.
        std::int64_t lastRecordEntry = 0;
        int approved = 0;
        for (const CalibrationSession& session :
             SessionRepository(workbook).historyOf(instrument->id)) {
            approved += session.state == SessionState::Approved ? 1 : 0;
            for (const auto& entry :
                 audit.entries(QStringLiteral("calibration_sessions"), session.id)) {
                lastRecordEntry = std::max(lastRecordEntry, entry.id);
            }
        }
        CHECK(approved > 0);
        CHECK(updates.front().id > lastRecordEntry);
    }
}

TEST_CASE("the demo due list shows an overdue meter and leaves the retired one out") {
    Workbook workbook = openDemo();
    const auto due = InstrumentRepository(workbook).dueList();
    CHECK(due.size() == 24);
    const auto loaned = std::find_if(due.begin(), due.end(),
                                     [](const auto& item) { return item.asset_tag == "CFM-104"; });
    REQUIRE(loaned != due.end());
    REQUIRE(loaned->due_date);
    CHECK(*loaned->due_date < kToday);
    CHECK(std::none_of(due.begin(), due.end(),
                       [](const auto& item) { return item.asset_tag == "CFM-105"; }));
}

TEST_CASE("the demo workbook passes verification") {
    Workbook workbook = openDemo();
    const mw::storage::VerificationReport report = mw::storage::verifyWorkbook(workbook);
    CHECK(report.integrityOk);
    CHECK_FALSE(report.firstMismatch);
    CHECK(report.recordsChecked == demoFile().summary.approved + demoFile().summary.superseded);
    CHECK(report.verdictsChecked == demoFile().summary.sessions - demoFile().summary.drafts);
    CHECK(report.verdictsNotRecorded == 0);
    CHECK(report.sound());
}

TEST_CASE("a second demo for the same day has identical content, digests included") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("again.mwb"));
    mw::demo::writeDemoWorkbook(path, kToday);
    Workbook first = openDemo();
    Workbook second(path);
    CHECK(mw::storage::LabRepository(first).load() == mw::storage::LabRepository(second).load());
    CHECK(mw::storage::UserRepository(first).all() == mw::storage::UserRepository(second).all());
    CHECK(mw::storage::StandardRepository(first).all() ==
          mw::storage::StandardRepository(second).all());
    const auto instrumentsOfFirst = InstrumentRepository(first).all();
    const auto instrumentsOfSecond = InstrumentRepository(second).all();
    REQUIRE(instrumentsOfFirst.size() == instrumentsOfSecond.size());
    for (std::size_t i = 0; i < instrumentsOfFirst.size(); ++i) {
        CHECK(sameInstrument(instrumentsOfFirst[i], instrumentsOfSecond[i]));
    }
    const auto sessionsOfFirst = allSessions(first);
    const auto sessionsOfSecond = allSessions(second);
    REQUIRE(sessionsOfFirst.size() == sessionsOfSecond.size());
    for (std::size_t i = 0; i < sessionsOfFirst.size(); ++i) {
        CHECK(sessionsOfFirst[i] == sessionsOfSecond[i]);
    }
}

TEST_CASE("the demo is never written over an existing file") {
    QTemporaryDir dir;
    const QString path = dir.filePath(QStringLiteral("taken.mwb"));
    {
        QFile file(path);
        REQUIRE(file.open(QIODevice::WriteOnly));
        file.write("not yours");
    }
    try {
        mw::demo::writeDemoWorkbook(path, kToday);
        FAIL("an existing file was accepted");
    } catch (const mw::storage::WorkbookError& error) {
        CHECK(error.kind() == mw::storage::WorkbookError::Kind::Io);
        CHECK(error.message().contains(QStringLiteral("already exists")));
    }
    QFile file(path);
    REQUIRE(file.open(QIODevice::ReadOnly));
    CHECK(file.readAll() == QByteArray("not yours"));
}
