// Writes the demo through the repositories, so the demo obeys the same integrity rules and digest
// chain as any lab's workbook: the technician records and submits, a different person (the
// reviewer) approves, the administrator keeps the register, and the audit log names who did what.
#include "storage/demo/demo_workbook.h"

#include "core/evaluation/session_evaluation.h"

#include "storage/atomic_file.h"
#include "storage/demo/demo_catalogue.h"
#include "storage/demo/demo_history.h"
#include "storage/demo/demo_schedule.h"
#include "storage/instrument_repository.h"
#include "storage/lab_repository.h"
#include "storage/session_repository.h"
#include "storage/standard_repository.h"
#include "storage/transaction.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"
#include "storage/workbook_error.h"

#include <QFileInfo>

#include <algorithm>

namespace mw::demo {
namespace {

using std::chrono::days;
using std::chrono::hours;
using std::chrono::minutes;
using storage::SessionRepository;
using storage::Transaction;
using storage::Workbook;

struct People {
    std::int64_t technician = 0;
    std::int64_t reviewer = 0;
    std::int64_t administrator = 0;
    QString reviewerPassword; // opens the reviewer's approval key
};

People addUsers(Workbook& workbook) {
    storage::UserRepository users(workbook);
    std::vector<DemoUser> demo = demoUsers();
    // The administrator comes first, while nobody is signed in; the others are added by them.
    DemoUser& admin = demo[2];
    workbook.setActor(std::nullopt);
    users.add(admin.user, admin.password);
    workbook.setActor(admin.user.id);
    Transaction transaction(workbook);
    users.add(demo[0].user, demo[0].password);
    users.add(demo[1].user, demo[1].password);
    transaction.commit();
    return People{demo[0].user.id, demo[1].user.id, admin.user.id, demo[1].password};
}

// The register as it stood five years ago: each standard with the certificate it held then,
// every meter in service (the withdrawn and retired ones leave service later). `instruments`
// keep the status they end with and receive their ids.
void addRegister(Workbook& workbook, DemoStandards& standards,
                 std::vector<Instrument>& instruments) {
    Transaction transaction(workbook);
    storage::LabRepository(workbook).save(demoLab());
    storage::StandardRepository standardRepository(workbook);
    for (std::size_t i = 0; i < standards.register_rows.size(); ++i) {
        ReferenceStandard& standard = standards.register_rows[i];
        const DemoCertificate& first = standards.certificates[i].front();
        standard.certificate_number = first.number;
        standard.calibrated_on = first.issued - std::chrono::days(2); // came back two days later
        standard.due_date = first.due;
        standardRepository.add(standard);
    }
    storage::InstrumentRepository instrumentRepository(workbook);
    for (Instrument& instrument : instruments) {
        Instrument inService = instrument;
        inService.status = InstrumentStatus::InService;
        instrumentRepository.add(inService);
        instrument.id = inService.id;
        instrument.ranges = inService.ranges; // with their ids
    }
    transaction.commit();
}

// What happened, in the order it happened. Approvals in time order keep the digest chain running
// forward; a session's copy of a certificate is written when its work is recorded, and must be
// the standard's certificate of that moment, so each recalibration lands between the sessions
// before and after it.
enum class Action {
    Recalibrate,      // a standard back from its calibration: new certificate and due date
    Record,           // the technician records the work and, unless a draft, submits it
    Decide,           // the reviewer approves or returns it
    Amend,            // a correction of an approved record, submitted
    ApproveAmendment, // ...and approved
    LeaveService,     // a meter withdrawn or retired
};

struct Event {
    Timestamp at{};
    Action action = Action::Record;
    std::size_t subject = 0;     // standard, planned session or instrument, by action
    std::size_t certificate = 0; // of a recalibration
};

// Withdrawn the day its failure was approved; retired a fortnight after its last visit.
void addLeavingService(const std::vector<Instrument>& instruments,
                       const std::vector<Timestamp>& lastDecided, std::vector<Event>& events) {
    for (std::size_t i = 0; i < instruments.size(); ++i) {
        const InstrumentStatus status = instruments[i].status;
        if (status == InstrumentStatus::InService) {
            continue;
        }
        const days after = status == InstrumentStatus::Retired ? days(14) : days(0);
        events.push_back({lastDecided[i] + after + minutes(30), Action::LeaveService, i, 0});
    }
}

std::vector<Event> eventsOf(const DemoStandards& standards,
                            const std::vector<PlannedSession>& planned,
                            const std::vector<Instrument>& instruments) {
    std::vector<Event> events;
    for (std::size_t s = 0; s < standards.certificates.size(); ++s) {
        for (std::size_t c = 1; c < standards.certificates[s].size(); ++c) {
            // Entered in the register before the bench opens (sessions start at 08:30).
            const Timestamp enteredAt = standards.certificates[s][c].issued + hours(7);
            events.push_back({enteredAt, Action::Recalibrate, s, c});
        }
    }
    std::vector<Timestamp> lastDecided(instruments.size(), Timestamp{});
    for (std::size_t p = 0; p < planned.size(); ++p) {
        const PlannedSession& session = planned[p];
        events.push_back({session.session.started_at, Action::Record, p, 0});
        if (session.fate == Fate::Approved || session.fate == Fate::Returned) {
            events.push_back({session.decided_at, Action::Decide, p, 0});
            Timestamp& last = lastDecided[session.instrument];
            last = std::max(last, session.decided_at);
        }
        if (session.amendment) {
            events.push_back({session.amendment->started_at, Action::Amend, p, 0});
            events.push_back({session.amendment->approved_at, Action::ApproveAmendment, p, 0});
        }
    }
    addLeavingService(instruments, lastDecided, events);
    std::stable_sort(events.begin(), events.end(),
                     [](const Event& a, const Event& b) { return a.at < b.at; });
    return events;
}

// Replays the events through the repositories, each by the person who would have done it.
class Replay {
public:
    Replay(Workbook& workbook, const People& people, DemoStandards& standards,
           const std::vector<Instrument>& instruments, std::vector<PlannedSession>& planned)
        : workbook_(workbook)
        , sessions_(workbook)
        , people_(people)
        , standards_(standards)
        , instruments_(instruments)
        , planned_(planned)
        , ids_(planned.size(), 0)
        , revisionIds_(planned.size(), 0) {}

    void run(const Event& event) {
        switch (event.action) {
        case Action::Recalibrate:
            recalibrate(event.subject, event.certificate);
            break;
        case Action::Record:
            record(event.subject);
            break;
        case Action::Decide:
            decide(event.subject);
            break;
        case Action::Amend:
            amend(event.subject);
            break;
        case Action::ApproveAmendment:
            workbook_.setActor(people_.reviewer);
            sessions_.approve(revisionIds_[event.subject],
                              signer(planned_[event.subject].amendment->approved_at),
                              planned_[event.subject].amendment->approved_at);
            break;
        case Action::LeaveService:
            leaveService(event.subject);
            break;
        }
    }

private:
    // The reviewer's approval key, opened once (issued at the first approval).
    const storage::ApprovalSigner& signer(Timestamp at) {
        if (!signer_) {
            signer_.emplace(storage::unlockApprovalKey(workbook_, people_.reviewer,
                                                       people_.reviewerPassword, at));
        }
        return *signer_;
    }

    void recalibrate(std::size_t standardIndex, std::size_t certificateIndex) {
        ReferenceStandard& standard = standards_.register_rows[standardIndex];
        const DemoCertificate& certificate =
            standards_.certificates[standardIndex][certificateIndex];
        standard.certificate_number = certificate.number;
        standard.calibrated_on = certificate.issued - std::chrono::days(2);
        standard.due_date = certificate.due;
        workbook_.setActor(people_.administrator);
        storage::StandardRepository(workbook_).update(standard);
    }

    void record(std::size_t index) {
        PlannedSession& planned = planned_[index];
        workbook_.setActor(people_.technician);
        planned.session.technician_id = people_.technician;
        Transaction transaction(workbook_);
        sessions_.create(planned.session);
        if (planned.fate != Fate::Draft) {
            sessions_.submit(planned.session.id, planned.submitted_at);
        }
        transaction.commit();
        ids_[index] = planned.session.id;
    }

    void decide(std::size_t index) {
        const PlannedSession& planned = planned_[index];
        workbook_.setActor(people_.reviewer);
        if (planned.fate == Fate::Approved) {
            sessions_.approve(ids_[index], signer(planned.decided_at), planned.decided_at);
        } else {
            sessions_.returnToTechnician(ids_[index], people_.reviewer,
                                         QString::fromStdString(planned.return_comment),
                                         planned.decided_at);
        }
    }

    void amend(std::size_t index) {
        const PlannedAmendment& amendment = *planned_[index].amendment;
        workbook_.setActor(people_.technician);
        Transaction transaction(workbook_);
        const std::int64_t revisionId =
            sessions_.amend(ids_[index], people_.technician,
                            QString::fromStdString(amendment.reason), amendment.started_at);
        sessions_.putReading(revisionId, amendment.corrected);
        sessions_.submit(revisionId, amendment.submitted_at);
        transaction.commit();
        revisionIds_[index] = revisionId;
    }

    // Only the status changes; the meter's approved records keep what they rest on.
    void leaveService(std::size_t instrumentIndex) {
        storage::InstrumentRepository instruments(workbook_);
        Instrument stored = instruments.find(instruments_[instrumentIndex].id).value();
        stored.status = instruments_[instrumentIndex].status;
        workbook_.setActor(people_.administrator);
        instruments.update(stored);
    }

    Workbook& workbook_;
    SessionRepository sessions_;
    const People& people_;
    DemoStandards& standards_;
    const std::vector<Instrument>& instruments_;
    std::vector<PlannedSession>& planned_;
    std::vector<std::int64_t> ids_;         // per planned session, once recorded
    std::vector<std::int64_t> revisionIds_; // its amendment, if any
    std::optional<storage::ApprovalSigner> signer_;
};

DemoSummary summarise(Workbook& workbook, const std::vector<Instrument>& instruments,
                      const std::vector<ReferenceStandard>& standards,
                      const std::vector<PlannedSession>& planned, std::chrono::sys_days today) {
    SessionRepository sessions(workbook);
    DemoSummary summary;
    summary.instruments = static_cast<int>(instruments.size());
    summary.standards = static_cast<int>(standards.size());
    summary.overdueStandards = static_cast<int>(std::count_if(
        standards.begin(), standards.end(), [today](const auto& s) { return s.due_date < today; }));
    summary.users = static_cast<int>(storage::UserRepository(workbook).all().size());
    auto count = [&sessions](SessionState state) {
        return static_cast<int>(sessions.withState(state).size());
    };
    summary.approved = count(SessionState::Approved);
    summary.superseded = count(SessionState::Superseded);
    summary.submitted = count(SessionState::Submitted);
    summary.returned = count(SessionState::Returned);
    summary.drafts = count(SessionState::Draft);
    summary.sessions = summary.approved + summary.superseded + summary.submitted +
                       summary.returned + summary.drafts;
    for (const PlannedSession& session : planned) {
        summary.amendments += session.amendment ? 1 : 0;
    }
    // Found out of tolerance as found: the session evaluator's as-found verdict (fail or
    // conditional fail) on what each first revision was submitted with.
    for (SessionState state : {SessionState::Approved, SessionState::Superseded,
                               SessionState::Submitted, SessionState::Returned}) {
        for (const CalibrationSession& session : sessions.withState(state)) {
            const auto instrument = std::find_if(
                instruments.begin(), instruments.end(),
                [&session](const Instrument& i) { return i.id == session.instrument_id; });
            if (session.revision != 1 || instrument == instruments.end()) {
                continue;
            }
            const SessionEvaluation evaluation =
                evaluateSession(*instrument, session, session.sealed.value_or(SealedInputs{}));
            if (evaluation.asFound && (*evaluation.asFound == Outcome::Fail ||
                                       *evaluation.asFound == Outcome::ConditionalFail)) {
                ++summary.outOfToleranceAsFound;
            }
        }
    }
    summary.readings = static_cast<int>(sessions.readingCount());
    return summary;
}

DemoSummary fill(const QString& path, std::chrono::sys_days today, std::uint64_t seed) {
    storage::OpenOptions options;
    options.createIfMissing = true;
    Workbook workbook(path, options);
    const People people = addUsers(workbook);
    DemoStandards standards;
    standards.register_rows = demoStandards(today);
    for (std::size_t i = 0; i < standards.register_rows.size(); ++i) {
        standards.certificates.push_back(
            certificateHistory(static_cast<int>(i), today, firstDemoDay(today)));
    }
    std::vector<Instrument> instruments = demoInstruments();
    addRegister(workbook, standards, instruments);

    std::vector<PlannedSession> planned = planSessions(instruments, standards, today, seed);
    Replay replay(workbook, people, standards, instruments, planned);
    for (const Event& event : eventsOf(standards, planned, instruments)) {
        replay.run(event);
    }
    workbook.setActor(std::nullopt);
    return summarise(workbook, instruments, standards.register_rows, planned, today);
}

} // namespace

DemoSummary writeDemoWorkbook(const QString& path, std::chrono::sys_days today,
                              std::uint64_t seed) {
    if (QFileInfo::exists(path)) {
        throw storage::WorkbookError(
            storage::WorkbookError::Kind::Io,
            QStringLiteral("%1 already exists; the demo is only written to a new file").arg(path));
    }
    // Written under a partial name and renamed when complete: a killed run leaves no
    // half-made workbook under the chosen name, and the next run clears its leftover.
    storage::AtomicFile file(path);
    try {
        const DemoSummary summary = fill(file.partialPath(), today, seed);
        file.commit();
        return summary;
    } catch (const storage::WorkbookError&) {
        throw;
    } catch (const std::exception& error) {
        throw storage::WorkbookError(storage::WorkbookError::Kind::Internal,
                                     QStringLiteral("writing the demo workbook failed: %1")
                                         .arg(QString::fromUtf8(error.what())));
    }
}

} // namespace mw::demo
