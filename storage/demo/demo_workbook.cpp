// Writes the demo through the repositories, so the demo obeys the same integrity rules and digest
// chain as any lab's workbook: the technician records and submits, a different person (the
// reviewer) approves, and the audit log names who did what.
#include "storage/demo/demo_workbook.h"

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

#include <QFile>
#include <QFileInfo>

#include <algorithm>

namespace mw::demo {
namespace {

using storage::SessionRepository;
using storage::Transaction;
using storage::Workbook;

struct People {
    std::int64_t technician = 0;
    std::int64_t reviewer = 0;
    std::int64_t administrator = 0;
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
    return People{demo[0].user.id, demo[1].user.id, admin.user.id};
}

void addRegister(Workbook& workbook, std::vector<ReferenceStandard>& standards,
                 std::vector<Instrument>& instruments) {
    Transaction transaction(workbook);
    storage::LabRepository(workbook).save(demoLab());
    storage::StandardRepository standardRepository(workbook);
    for (ReferenceStandard& standard : standards) {
        standardRepository.add(standard);
    }
    storage::InstrumentRepository instrumentRepository(workbook);
    for (Instrument& instrument : instruments) {
        instrumentRepository.add(instrument);
    }
    transaction.commit();
}

// The technician records and submits; the reviewer approves or returns.
std::int64_t record(Workbook& workbook, PlannedSession& planned, const People& people) {
    SessionRepository sessions(workbook);
    workbook.setActor(people.technician);
    planned.session.technician_id = people.technician;
    {
        Transaction transaction(workbook);
        sessions.create(planned.session);
        if (planned.fate != Fate::Draft) {
            sessions.submit(planned.session.id, planned.submitted_at);
        }
        transaction.commit();
    }
    workbook.setActor(people.reviewer);
    if (planned.fate == Fate::Approved) {
        sessions.approve(planned.session.id, people.reviewer, planned.decided_at);
    } else if (planned.fate == Fate::Returned) {
        sessions.returnToTechnician(planned.session.id, people.reviewer,
                                    QString::fromStdString(planned.return_comment),
                                    planned.decided_at);
    }
    return planned.session.id;
}

void amend(Workbook& workbook, std::int64_t approvedId, const PlannedAmendment& amendment,
           const People& people) {
    SessionRepository sessions(workbook);
    workbook.setActor(people.technician);
    std::int64_t revisionId = 0;
    {
        Transaction transaction(workbook);
        revisionId = sessions.amend(approvedId, people.technician,
                                    QString::fromStdString(amendment.reason), amendment.started_at);
        sessions.saveReading(revisionId, amendment.corrected);
        sessions.submit(revisionId, amendment.submitted_at);
        transaction.commit();
    }
    workbook.setActor(people.reviewer);
    sessions.approve(revisionId, people.reviewer, amendment.approved_at);
}

struct Step {
    Timestamp at{};
    std::size_t planned = 0;
    bool amendment = false;
};

// Approvals in the order they happened, so the digest chain runs forward in time; the records
// still open (submitted, returned, draft) come last.
std::vector<Step> stepsInOrder(const std::vector<PlannedSession>& planned) {
    std::vector<Step> approvals;
    std::vector<Step> open;
    for (std::size_t i = 0; i < planned.size(); ++i) {
        if (planned[i].fate != Fate::Approved) {
            open.push_back({planned[i].session.started_at, i, false});
            continue;
        }
        approvals.push_back({planned[i].decided_at, i, false});
        if (planned[i].amendment) {
            approvals.push_back({planned[i].amendment->approved_at, i, true});
        }
    }
    std::stable_sort(approvals.begin(), approvals.end(),
                     [](const Step& a, const Step& b) { return a.at < b.at; });
    approvals.insert(approvals.end(), open.begin(), open.end());
    return approvals;
}

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
        const Instrument& instrument = instruments[session.instrument];
        if (worstErrorFraction(instrument, session.session.readings, Phase::AsFound) > 1.0) {
            ++summary.outOfToleranceAsFound;
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
    std::vector<ReferenceStandard> standards = demoStandards(today);
    std::vector<Instrument> instruments = demoInstruments();
    addRegister(workbook, standards, instruments);

    std::vector<PlannedSession> planned = planSessions(instruments, standards, today, seed);
    std::vector<std::int64_t> ids(planned.size(), 0);
    for (const Step& step : stepsInOrder(planned)) {
        if (step.amendment) {
            amend(workbook, ids[step.planned], *planned[step.planned].amendment, people);
        } else {
            ids[step.planned] = record(workbook, planned[step.planned], people);
        }
    }
    workbook.setActor(std::nullopt);
    return summarise(workbook, instruments, standards, planned, today);
}

void removeWithCompanions(const QString& path) {
    for (const char* suffix : {"", "-wal", "-shm", "-journal"}) {
        QFile::remove(path + QLatin1String(suffix));
    }
}

} // namespace

DemoSummary writeDemoWorkbook(const QString& path, std::chrono::sys_days today,
                              std::uint64_t seed) {
    if (QFileInfo::exists(path)) {
        throw storage::WorkbookError(
            storage::WorkbookError::Kind::Io,
            QStringLiteral("%1 already exists; the demo is only written to a new file").arg(path));
    }
    try {
        return fill(path, today, seed);
    } catch (...) {
        removeWithCompanions(path); // the workbook was closed as fill() unwound
        throw;
    }
}

} // namespace mw::demo
