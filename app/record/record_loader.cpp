// Loading record and report sources from the workbook's repositories.
#include "app/record/record_loader.h"

#include "core/history/instrument_history.h"
#include "storage/chain_anchor.h"
#include "storage/instrument_repository.h"
#include "storage/lab_repository.h"
#include "storage/session_repository.h"
#include "storage/signing_keys.h"
#include "storage/standard_repository.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"

#include <chrono>

namespace mw::record {

RecordLoader::RecordLoader(storage::Workbook& workbook)
    : workbook_(workbook)
    , lab_(storage::LabRepository(workbook).load())
    , standards_(storage::StandardRepository(workbook).all())
    , users_(storage::UserRepository(workbook).all())
    , instruments_(storage::InstrumentRepository(workbook).all()) {}

const Instrument* RecordLoader::instrument(std::int64_t instrumentId) const {
    for (const Instrument& i : instruments_) {
        if (i.id == instrumentId) {
            return &i;
        }
    }
    return nullptr;
}

std::optional<RecordSource> RecordLoader::record(std::int64_t sessionId,
                                                 Timestamp printedAt) const {
    const storage::SessionRepository sessions(workbook_);
    std::optional<CalibrationSession> session = sessions.find(sessionId);
    const Instrument* item = session ? instrument(session->instrument_id) : nullptr;
    if (!session || !item) {
        return std::nullopt;
    }
    RecordSource source;
    source.lab = lab_;
    source.instrument = *item;
    source.standards = standards_;
    source.users = users_;
    source.printedAt = printedAt;
    if (const auto fingerprint =
            storage::approvalKeyFingerprint(workbook_.database(), session->id)) {
        source.signerKeyFingerprint = fingerprint->toStdString();
    }
    // Read at each printing, not once per loader: the head of the moment the record is printed.
    const storage::ChainHead head = storage::chainHead(workbook_);
    source.chainAtPrinting = ChainAtPrinting{head.length, head.digest.toStdString()};
    if (session->state == SessionState::Superseded) {
        // The amendment that replaced it, approved or not yet: the banner points to it.
        for (const CalibrationSession& later : sessions.historyOf(item->id)) {
            if (later.supersedes_id == sessionId) {
                source.successor =
                    Successor{later.id, later.revision, later.amendment_reason, later.approved_at};
            }
        }
    }
    source.session = std::move(*session);
    return source;
}

std::optional<HistoryReportSource> RecordLoader::history(std::int64_t instrumentId,
                                                         Timestamp printedAt) const {
    const Instrument* item = instrument(instrumentId);
    if (!item) {
        return std::nullopt;
    }
    HistoryReportSource source;
    source.lab = lab_;
    source.instrument = *item;
    source.history = buildHistory(*item, storage::SessionRepository(workbook_).historyOf(item->id),
                                  standards_, users_);
    source.printedAt = printedAt;
    return source;
}

std::optional<Instrument> RecordLoader::instrumentByTag(const QString& assetTag) const {
    for (const Instrument& i : instruments_) {
        if (QString::fromStdString(i.asset_tag) == assetTag) {
            return i;
        }
    }
    return std::nullopt;
}

std::optional<std::int64_t> RecordLoader::latestApproved(std::int64_t instrumentId) const {
    std::optional<std::int64_t> latest;
    std::optional<Timestamp> when;
    for (const CalibrationSession& s :
         storage::SessionRepository(workbook_).historyOf(instrumentId)) {
        if (s.state == SessionState::Approved && s.approved_at &&
            (!when || *s.approved_at >= *when)) {
            latest = s.id;
            when = s.approved_at;
        }
    }
    return latest;
}

Timestamp printTime() {
    return std::chrono::floor<std::chrono::seconds>(std::chrono::system_clock::now());
}

} // namespace mw::record
