// Thin table model over the instruments of the open workbook.
#include "app/gui/instrument_list_model.h"

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
    if (role == Qt::UserRole) {
        return QVariant::fromValue<qlonglong>(row.instrumentId);
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
    case Status:
        return row.status;
    case Due:
        return row.due;
    default:
        return {};
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
    case Status:
        return tr("Status");
    case Due:
        return tr("Calibration due");
    default:
        return {};
    }
}

} // namespace mw::gui
