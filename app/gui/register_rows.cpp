// Builds the register's rows from workbook data.
#include "app/gui/register_rows.h"
#include "app/gui/calendar_days.h"

#include <QDate>

#include <map>

namespace mw::gui {
namespace {

QString toQString(std::string_view text) {
    return QString::fromUtf8(text.data(), static_cast<qsizetype>(text.size()));
}

QString openCalibrationNote(SessionState state) {
    switch (state) {
    case SessionState::Submitted:
        return QStringLiteral("record awaiting review");
    case SessionState::Returned:
        return QStringLiteral("record returned to technician");
    case SessionState::Draft:
        return QStringLiteral("calibration in progress");
    case SessionState::Approved:
    case SessionState::Superseded:
        break;
    }
    return {};
}

} // namespace

std::vector<InstrumentRow> buildRegisterRows(const std::vector<Instrument>& instruments,
                                             const std::vector<storage::DueItem>& dueList,
                                             const OpenCalibrations& open,
                                             std::chrono::sys_days today,
                                             const std::map<std::int64_t, Outcome>& lastOutcomes,
                                             int dueSoonDays) {
    std::map<std::int64_t, const storage::DueItem*> dueById;
    for (const storage::DueItem& item : dueList) {
        dueById[item.instrument_id] = &item;
    }
    std::vector<InstrumentRow> rows;
    rows.reserve(instruments.size());
    for (const Instrument& instrument : instruments) {
        InstrumentRow row;
        row.instrumentId = instrument.id;
        row.assetTag = QString::fromStdString(instrument.asset_tag);
        row.description = QString::fromStdString(instrument.description);
        row.kind = toQString(displayName(instrument.kind));
        row.kindValue = instrument.kind;
        row.location = QString::fromStdString(instrument.location);
        row.status = toQString(displayName(instrument.status));
        const auto found = dueById.find(instrument.id);
        if (found != dueById.end()) {
            row.dueDate = found->second->due_date;
        }
        if (instrument.status == InstrumentStatus::Retired) {
            row.due = QStringLiteral("—");
            row.dueState = DueState::Retired;
        } else if (!row.dueDate) {
            row.due = QStringLiteral("Never calibrated");
            row.dueState = DueState::NeverCalibrated;
            row.attention = true;
        } else if (*row.dueDate < today) {
            row.due = QStringLiteral("Overdue since %1").arg(isoDate(*row.dueDate));
            row.dueState = DueState::Overdue;
            row.attention = true;
        } else {
            row.due = isoDate(*row.dueDate);
            row.dueState = *row.dueDate <= today + std::chrono::days(dueSoonDays)
                               ? DueState::DueSoon
                               : DueState::InDate;
            if (row.dueState == DueState::DueSoon) {
                row.due += QStringLiteral(" (due soon)");
            }
        }
        if (const auto outcome = lastOutcomes.find(instrument.id); outcome != lastOutcomes.end()) {
            row.lastOutcomeValue = outcome->second;
            row.lastOutcome = toQString(displayName(outcome->second));
        } else {
            row.lastOutcome = QStringLiteral("—");
        }
        if (const auto pending = open.find(instrument.id); pending != open.end()) {
            row.due += QStringLiteral(" · ") + openCalibrationNote(pending->second);
        }
        rows.push_back(std::move(row));
    }
    return rows;
}

} // namespace mw::gui
