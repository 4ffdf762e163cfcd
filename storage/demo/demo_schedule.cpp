// Five invented years at the bench. Each meter comes back once per calibration interval, give
// or take a few weeks, and most records are approved by the reviewer a few days later. A few
// meters are given a part to play: records waiting for review (one leaning on the overdue
// shunt with a written justification), one returned, one draft in progress, one amended after
// approval, one meter withdrawn with a damaged pivot, one retired, one overdue on loan.
#include "storage/demo/demo_schedule.h"

#include "core/plan/session_plan.h"

#include "core/units/quantity.h"
#include "storage/demo/demo_catalogue.h"
#include "storage/demo/demo_history.h"
#include "storage/demo/demo_random.h"

#include <algorithm>
#include <cmath>
#include <map>
#include <stdexcept>

namespace mw::demo {
namespace {

using std::chrono::days;
using std::chrono::hours;
using std::chrono::minutes;
using std::chrono::sys_days;

enum class Part { None, Submitted, SubmittedOverdueStandard, Returned, Draft, Amended, Damaged };

// How a meter's error moves over the years. Two meters play a steady part for the history
// screens: one drifts toward its limit (a significant trend whose projection reaches the limit
// before it is due again), one holds still (no significant drift).
enum class Drift { Random, Fast, TowardLimit, Still };

struct Profile {
    Part part = Part::None;
    Drift drift = Drift::Random;
    int latestLagDays = -1; // days before today of the latest visit; -1: drawn at random
};

Profile profileOf(const std::string& tag, int intervalDays) {
    static const std::map<std::string, Profile> parts{
        {"CFM-103", {Part::Submitted, Drift::Random, 3}},
        {"CFM-204", {Part::SubmittedOverdueStandard, Drift::Random, 2}},
        {"CFM-502", {Part::Submitted, Drift::Fast, 6}},
        {"CFM-301", {Part::Returned, Drift::Random, 9}},
        {"CFM-402", {Part::Draft, Drift::Random, 1}},
        {"CFM-201", {Part::Amended, Drift::Random, -1}},
        {"CFM-106", {Part::Damaged, Drift::Random, 75}},
        {"CFM-105", {Part::None, Drift::Random, 700}}, // retired since
        {"CFM-102", {Part::None, Drift::Fast, -1}},
        {"CFM-302", {Part::None, Drift::Fast, -1}},
        {"CFM-403", {Part::None, Drift::Fast, -1}},
        {"CFM-205", {Part::None, Drift::TowardLimit, -1}},
    };
    if (tag == "CFM-104") {
        // Out on loan, now overdue; steady for years before that.
        return {Part::None, Drift::Still, intervalDays + 45};
    }
    const auto it = parts.find(tag);
    return it == parts.end() ? Profile{} : it->second;
}

// Calibrations happen on working days: a weekend date moves back to the Friday.
sys_days workingDay(sys_days day) {
    const std::chrono::weekday weekday{day};
    if (weekday == std::chrono::Saturday) {
        return day - days(1);
    }
    if (weekday == std::chrono::Sunday) {
        return day - days(2);
    }
    return day;
}

// The span error of a meter with a steady part, in % of the fiducial value: toward the limit,
// it reaches 80 % of the limit at its latest visit, rising by 30 % of the limit a year, so the
// fitted line reaches the limit some eight months later, before the meter is due again.
std::optional<ScriptedDrift> scriptOf(const Instrument& instrument, Drift drift,
                                      const std::vector<sys_days>& visits) {
    const double limitPct = instrument.accuracy_class;
    if (drift == Drift::Still) {
        return ScriptedDrift{0.2 * limitPct, 0.0};
    }
    if (drift != Drift::TowardLimit || visits.empty()) {
        return std::nullopt;
    }
    const double years = (visits.back() - visits.front()).count() / 365.25;
    const double rate = 0.3 * limitPct;
    return ScriptedDrift{0.8 * limitPct - rate * years, rate};
}

std::vector<sys_days> visitDays(const Instrument& instrument, const Profile& profile,
                                sys_days today, DemoRandom& random) {
    const int interval = instrument.interval_days;
    const int lag = profile.latestLagDays >= 0 ? profile.latestLagDays
                                               : random.between(15, std::max(20, interval - 5));
    const sys_days first = today - days(kDemoSpanDays);
    std::vector<sys_days> visits;
    for (sys_days day = today - days(lag); day >= first;
         day -= days(interval + random.between(-10, 20))) {
        visits.push_back(workingDay(day));
    }
    std::reverse(visits.begin(), visits.end());
    return visits;
}

bool needsShunt(const Instrument& instrument) {
    return std::any_of(instrument.ranges.begin(), instrument.ranges.end(), [](const RangeSpec& r) {
        return r.unit == Unit::Ampere && std::max(std::fabs(r.lower_limit), r.full_scale) > 2.0;
    });
}

// The copy a session keeps of the certificate `standard` held on `day` (the register is updated
// early on the day a standard comes back, before the bench opens).
StandardUse useOf(const ReferenceStandard& standard, const std::vector<DemoCertificate>& history,
                  sys_days day) {
    const auto held = std::find_if(history.rbegin(), history.rend(),
                                   [day](const DemoCertificate& c) { return c.issued <= day; });
    if (held == history.rend()) {
        throw std::logic_error("demo: standard " + standard.asset_tag +
                               " has no certificate on a day the plan uses it");
    }
    StandardUse use;
    use.standard_id = standard.id;
    use.certificate_number = held->number;
    use.due_date = held->due;
    if (day > held->due) {
        use.overdue_justification =
            "Shunt CFS-03 is past its due date; its recalibration is booked. On the day it was "
            "compared at 1 A with the 1 ohm of the resistor set CFS-04 using the bench "
            "multimeter CFS-02 and agreed within 0.01 %, far inside the 2.5 % class of the "
            "meter under test.";
    }
    return use;
}

std::vector<StandardUse> standardsFor(const Instrument& instrument, const SessionContent& content,
                                      const DemoStandards& standards, sys_days day) {
    std::vector<int> indices;
    if (needsShunt(instrument)) {
        indices = {kBenchMultimeter, kCurrentShunt};
    } else {
        indices = {kCalibrator};
    }
    if (!content.resistor_checks.empty()) {
        indices.push_back(kBenchMultimeter);
        indices.push_back(kResistorSet);
    }
    std::sort(indices.begin(), indices.end());
    indices.erase(std::unique(indices.begin(), indices.end()), indices.end());
    std::vector<StandardUse> uses;
    for (int index : indices) {
        const auto i = static_cast<std::size_t>(index);
        uses.push_back(useOf(standards.register_rows.at(i), standards.certificates.at(i), day));
    }
    return uses;
}

std::string methodFor(const Instrument& instrument, bool resistorChecks) {
    const bool ac = std::any_of(instrument.ranges.begin(), instrument.ranges.end(), isAcRange);
    std::string text;
    if (needsShunt(instrument)) {
        text = "DC supply in series with the meter and the shunt CFS-03; current taken from the "
               "shunt voltage read on the bench multimeter CFS-02.";
    } else if (ac) {
        text = "Sinusoidal 50 Hz from the multifunction calibrator CFS-01 after 15 min warm-up.";
    } else {
        text = "Comparison with the multifunction calibrator CFS-01.";
    }
    text += " Pointer set on each numbered scale mark, applied value read from the standard; "
            "up-scale then down-scale, meter in its marked position, tapped lightly before each "
            "reading. Limit of error: class index in % of the fiducial value (IEC 60051-1).";
    if (resistorChecks) {
        text += " Multipliers and shunts measured out of circuit with CFS-02, checked against "
                "the resistor set CFS-04.";
    }
    return text;
}

Environment environmentOf(DemoRandom& random) {
    Environment environment;
    environment.ambient_celsius = std::round(random.normal(22.6, 0.7) * 10.0) / 10.0;
    environment.relative_humidity_percent =
        std::clamp(std::round(random.normal(46.0, 6.0)), 30.0, 65.0);
    return environment;
}

// Turns a true reading into the slip of the pen the amendment corrects: an applied value off by
// a fifth of the limit, so that the record's outcome does not change.
PlannedAmendment slipOfThePen(CalibrationSession& session, const Instrument& instrument,
                              Timestamp approvedAt) {
    auto it = std::find_if(session.readings.begin(), session.readings.end(), [](const Reading& r) {
        return r.phase == Phase::AsFound && r.direction == Direction::Up && r.point_index == 4;
    });
    if (it == session.readings.end()) {
        it = session.readings.begin();
    }
    PlannedAmendment amendment;
    amendment.corrected = *it;
    const double limit = instrument.accuracy_class / 100.0 * instrument.ranges.front().full_scale;
    it->applied = it->applied + 0.2 * limit;
    amendment.reason = "As-found applied value at " +
                       formatEngineering(*it->indicated, 3, it->unit) +
                       " up-scale was entered as " + formatEngineering(it->applied, 5, it->unit) +
                       "; the bench worksheet shows " +
                       formatEngineering(amendment.corrected.applied, 5, it->unit) +
                       ". Corrected; the outcome is unchanged.";
    const sys_days approvedDay = std::chrono::floor<days>(approvedAt);
    amendment.started_at = approvedDay + days(19) + hours(9) + minutes(10);
    amendment.submitted_at = amendment.started_at + minutes(25);
    amendment.approved_at = approvedDay + days(21) + hours(11) + minutes(40);
    return amendment;
}

Fate fateOf(Part part) {
    switch (part) {
    case Part::Submitted:
    case Part::SubmittedOverdueStandard:
        return Fate::Submitted;
    case Part::Returned:
        return Fate::Returned;
    case Part::Draft:
        return Fate::Draft;
    default:
        return Fate::Approved;
    }
}

// One visit: what was found and the record's place in the review workflow.
PlannedSession visit(const Instrument& instrument, std::size_t index, MeterSimulation& meter,
                     sys_days day, bool first, bool last, const Profile& profile,
                     const DemoStandards& standards, DemoRandom& random) {
    const Timestamp start = day + hours(8) + minutes(30 + 5 * random.between(0, 60));
    SessionContent content;
    if (last && profile.part == Part::Damaged) {
        content = meter.calibrateDamaged(start);
    } else if (last && profile.part == Part::Draft) {
        content = meter.partialAsFound(7);
    } else {
        content = meter.calibrate(start, first);
    }
    PlannedSession planned;
    planned.instrument = index;
    planned.fate = last ? fateOf(profile.part) : Fate::Approved;
    CalibrationSession& session = planned.session;
    session.instrument_id = instrument.id;
    session.started_at = start;
    session.environment = environmentOf(random);
    session.method = methodFor(instrument, !content.resistor_checks.empty());
    // The shop's procedure: laboratory meters (class 0.5 and better) are judged with guarded
    // acceptance, w = U (ILAC G8:09/2019 4.2.3), so a result near a limit is stated as
    // conditional; panel and portable meters with simple acceptance.
    if (instrument.accuracy_class <= 0.5) {
        session.decision_rule = DecisionRule::GuardedAcceptance;
        session.guard_factor = 1.0;
    }
    session.standards = standardsFor(instrument, content, standards, day);
    session.readings = std::move(content.readings);
    // Every range on its default points, up and down; both phases where the meter was adjusted.
    for (const RangeSpec& range : instrument.ranges) {
        const std::vector<TestPoint> points = defaultPoints(instrument, range);
        session.plan.insert(session.plan.end(), points.begin(), points.end());
    }
    const bool adjusted = std::any_of(session.readings.begin(), session.readings.end(),
                                      [](const Reading& r) { return r.phase == Phase::AsLeft; });
    session.phases = adjusted ? PhasePlan::AsFoundAndAsLeft : PhasePlan::AsFound;
    session.resistor_checks = std::move(content.resistor_checks);
    session.adjustments = std::move(content.adjustments);
    if (planned.fate != Fate::Draft) {
        session.finished_at = start + minutes(content.minutes);
        planned.submitted_at = *session.finished_at + minutes(10);
        const sys_days submittedDay = std::chrono::floor<days>(planned.submitted_at);
        planned.decided_at = planned.fate == Fate::Returned
                                 ? submittedDay + days(1) + hours(10) + minutes(20)
                                 : submittedDay + days(random.between(1, 4)) + hours(13) +
                                       minutes(5 * random.between(0, 36));
    }
    if (planned.fate == Fate::Returned) {
        planned.return_comment =
            "The method names 50 Hz but the calibrator log shows 400 Hz for the first up-scale "
            "run; please confirm the frequency used, repeat the run if needed and correct the "
            "method text before resubmitting.";
    }
    return planned;
}

} // namespace

sys_days firstDemoDay(sys_days today) {
    return today - days(kDemoSpanDays + 2); // a first visit on a Sunday moves back to Friday
}

std::vector<PlannedSession> planSessions(const std::vector<Instrument>& instruments,
                                         const DemoStandards& standards, sys_days today,
                                         std::uint64_t seed) {
    std::vector<PlannedSession> planned;
    for (std::size_t i = 0; i < instruments.size(); ++i) {
        const Instrument& instrument = instruments[i];
        const Profile profile = profileOf(instrument.asset_tag, instrument.interval_days);
        DemoRandom random(seed + 1000 * (i + 1));
        const std::vector<sys_days> visits = visitDays(instrument, profile, today, random);
        MeterSimulation meter(instrument, seed ^ (0x9E3779B97F4A7C15ULL * (i + 1)),
                              profile.drift == Drift::Fast,
                              scriptOf(instrument, profile.drift, visits));
        std::size_t amendedVisit = visits.size();
        if (profile.part == Part::Amended && visits.size() > 1) {
            const sys_days target = today - days(730);
            amendedVisit = 0;
            for (std::size_t v = 0; v + 1 < visits.size(); ++v) {
                if (std::chrono::abs(visits[v] - target) <
                    std::chrono::abs(visits[amendedVisit] - target)) {
                    amendedVisit = v;
                }
            }
        }
        for (std::size_t v = 0; v < visits.size(); ++v) {
            if (v > 0) {
                meter.age(static_cast<int>((visits[v] - visits[v - 1]).count()));
            }
            PlannedSession session = visit(instrument, i, meter, visits[v], v == 0,
                                           v + 1 == visits.size(), profile, standards, random);
            if (v == amendedVisit) {
                session.amendment = slipOfThePen(session.session, instrument, session.decided_at);
            }
            planned.push_back(std::move(session));
        }
    }
    std::stable_sort(planned.begin(), planned.end(), [](const auto& a, const auto& b) {
        return a.session.started_at < b.session.started_at;
    });
    return planned;
}

} // namespace mw::demo
