// Thin table model over the instruments of the open workbook.
#include "app/gui/instrument_list_model.h"

#include <limits>

#include <QIcon>

namespace mw::gui {

InstrumentListModel::InstrumentListModel(QObject* parent)
    : QAbstractTableModel(parent) {}

void InstrumentListModel::setRows(std::vector<InstrumentRow> rows) {
    beginResetModel();
    rows_ = std::move(rows);
    endResetModel();
}

int InstrumentListModel::rowCount(const QModelIndex& parent) const {
    return parent.isValid() ? 0 : static_cast<int>(rows_.size());
}

int InstrumentListModel::columnCount(const QModelIndex& parent) const {
    return parent.isValid() ? 0 : ColumnCount;
}

QVariant InstrumentListModel::data(const QModelIndex& index, int role) const {
    if (!index.isValid() || index.row() >= rowCount()) {
        return {};
    }
    const InstrumentRow& row = rows_[static_cast<std::size_t>(index.row())];
    if (role == Qt::DecorationRole && index.column() == Due && row.attention) {
        return QIcon(QStringLiteral(":/icons/attention.svg"));
    }
    switch (role) {
    case Qt::UserRole:
        return QVariant::fromValue<qlonglong>(row.instrumentId);
    case KindRole:
        return int(row.kindValue);
    case DueStateRole:
        return int(row.dueState);
    case OutcomeRole:
        return row.lastOutcomeValue ? QVariant(int(*row.lastOutcomeValue)) : QVariant();
    case LocationRole:
        return row.location;
    case SearchTextRole:
        return QStringList{row.assetTag, row.description, row.location, row.kind}.join(
            QLatin1Char(' '));
    case SortRole:
        return sortValue(row, index.column());
    default:
        break;
    }
    // The whole text as a tooltip, since narrow columns elide it.
    if (role != Qt::DisplayRole && role != Qt::ToolTipRole) {
        return {};
    }
    switch (index.column()) {
    case AssetTag:
        return row.assetTag;
    case Description:
        return row.description;
    case Kind:
        return row.kind;
    case Location:
        return row.location;
    case Status:
        return row.status;
    case Due:
        return row.due;
    case LastOutcome:
        return row.lastOutcome;
    default:
        return {};
    }
}

QVariant InstrumentListModel::sortValue(const InstrumentRow& row, int column) {
    switch (column) {
    case Due:
        // Overdue and never calibrated first, then by date; retired last.
        if (row.dueState == DueState::Retired) {
            return std::numeric_limits<qlonglong>::max();
        }
        return row.dueDate ? qlonglong(row.dueDate->time_since_epoch().count())
                           : std::numeric_limits<qlonglong>::min();
    case LastOutcome:
        // Worst first: fail, conditional fail, conditional pass, pass; never approved last.
        return row.lastOutcomeValue ? 3 - int(*row.lastOutcomeValue) : 4; // Outcome runs pass..fail
    case Kind:
        return row.kind;
    case Location:
        return row.location;
    case Status:
        return row.status;
    case Description:
        return row.description;
    default:
        return row.assetTag;
    }
}

QVariant InstrumentListModel::headerData(int section, Qt::Orientation orientation, int role) const {
    if (orientation != Qt::Horizontal || role != Qt::DisplayRole) {
        return {};
    }
    switch (section) {
    case AssetTag:
        return tr("Asset tag");
    case Description:
        return tr("Description");
    case Kind:
        return tr("Kind");
    case Location:
        return tr("Location");
    case Status:
        return tr("Status");
    case Due:
        return tr("Calibration due");
    case LastOutcome:
        return tr("Last outcome");
    default:
        return {};
    }
}

} // namespace mw::gui
