// Thin table model over the instruments of the open workbook: reads rows, formats cells.
#pragma once

#include <QAbstractTableModel>
#include <QString>

#include <cstdint>
#include <vector>

namespace mw::gui {

// One row as the register shows it; filled from the workbook by the window's controller.
struct InstrumentRow {
    std::int64_t instrumentId = 0;
    QString assetTag;
    QString description;
    QString kind;
    QString status;
    QString due;
    bool attention = false; // overdue or never calibrated: shown with a caution icon
};

class InstrumentListModel : public QAbstractTableModel {
    Q_OBJECT
public:
    enum Column { AssetTag, Description, Kind, Status, Due, ColumnCount };

    explicit InstrumentListModel(QObject* parent = nullptr);

    void setRows(std::vector<InstrumentRow> rows);
    const InstrumentRow& rowAt(int row) const { return rows_.at(static_cast<std::size_t>(row)); }

    int rowCount(const QModelIndex& parent = {}) const override;
    int columnCount(const QModelIndex& parent = {}) const override;
    QVariant data(const QModelIndex& index, int role = Qt::DisplayRole) const override;
    QVariant headerData(int section, Qt::Orientation orientation,
                        int role = Qt::DisplayRole) const override;

private:
    std::vector<InstrumentRow> rows_;
};

} // namespace mw::gui
