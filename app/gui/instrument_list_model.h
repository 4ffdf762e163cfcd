// Thin table model over the instruments of the open workbook: reads rows, formats cells.
#pragma once

#include <QAbstractTableModel>
#include <QString>

#include <vector>

namespace mw::gui {

// One row as the register shows it; filled from the workbook by the window's controller.
struct InstrumentRow {
    QString assetTag;
    QString description;
    QString kind;
    QString status;
    QString due;
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
