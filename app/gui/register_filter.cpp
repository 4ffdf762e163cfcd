// Filtering and sorting the register.
#include "app/gui/register_filter.h"

#include "app/gui/instrument_list_model.h"

namespace mw::gui {

RegisterFilter::RegisterFilter(QObject* parent)
    : QSortFilterProxyModel(parent) {
    setSortRole(InstrumentListModel::SortRole);
    setSortCaseSensitivity(Qt::CaseInsensitive);
    setDynamicSortFilter(true);
}

void RegisterFilter::setText(const QString& text) {
    text_ = text.trimmed();
    invalidateFilter();
}

void RegisterFilter::setKind(std::optional<int> kind) {
    kind_ = kind;
    invalidateFilter();
}

void RegisterFilter::setLocation(const QString& location) {
    location_ = location;
    invalidateFilter();
}

void RegisterFilter::setDue(DueChoice due) {
    due_ = due;
    invalidateFilter();
}

void RegisterFilter::setOutcome(std::optional<int> outcome) {
    outcome_ = outcome;
    invalidateFilter();
}

bool RegisterFilter::filterAcceptsRow(int sourceRow, const QModelIndex& sourceParent) const {
    const QModelIndex row = sourceModel()->index(sourceRow, 0, sourceParent);
    const auto value = [&](int role) {
        return row.data(role);
    };
    if (!text_.isEmpty() && !value(InstrumentListModel::SearchTextRole)
                                 .toString()
                                 .contains(text_, Qt::CaseInsensitive)) {
        return false;
    }
    if (kind_ && value(InstrumentListModel::KindRole).toInt() != *kind_) {
        return false;
    }
    if (!location_.isEmpty() && value(InstrumentListModel::LocationRole).toString() != location_) {
        return false;
    }
    const auto state = DueState(value(InstrumentListModel::DueStateRole).toInt());
    switch (due_) {
    case DueChoice::Any:
        break;
    case DueChoice::NeedsAttention:
        if (state != DueState::Overdue && state != DueState::NeverCalibrated) {
            return false;
        }
        break;
    case DueChoice::DueSoon:
        if (state != DueState::DueSoon) {
            return false;
        }
        break;
    case DueChoice::InDate:
        if (state != DueState::InDate && state != DueState::DueSoon) {
            return false;
        }
        break;
    case DueChoice::Retired:
        if (state != DueState::Retired) {
            return false;
        }
        break;
    }
    if (outcome_) {
        const QVariant outcome = value(InstrumentListModel::OutcomeRole);
        if (*outcome_ < 0 ? outcome.isValid()
                          : (!outcome.isValid() || outcome.toInt() != *outcome_)) {
            return false;
        }
    }
    return true;
}

} // namespace mw::gui
