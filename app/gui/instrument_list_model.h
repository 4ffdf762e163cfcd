// Thin table model over the instruments of the open workbook: reads rows, formats cells.
#pragma once

#include "core/model/vocabulary.h"

#include <QAbstractTableModel>
#include <QString>

#include <chrono>
#include <cstdint>
#include <optional>
#include <vector>

namespace mw::gui {

// Where an instrument stands against its calibration interval (computed, never stored).
enum class DueState { Overdue, NeverCalibrated, DueSoon, InDate, Retired };

// One row as the register shows it; filled from the workbook by the window's controller. The
// raw values (for sorting and filtering) sit beside the words shown.
struct InstrumentRow {
    std::int64_t instrumentId = 0;
    QString assetTag;
    QString description;
    QString kind;
    QString location;
    QString status;
    QString due;
    QString lastOutcome;    // "—" when never approved
    bool attention = false; // overdue or never calibrated: shown with a caution icon
    InstrumentKind kindValue = InstrumentKind::DcVoltmeter;
    DueState dueState = DueState::InDate;
    std::optional<std::chrono::sys_days> dueDate;
    std::optional<Outcome> lastOutcomeValue;
};

class InstrumentListModel : public QAbstractTableModel {
    Q_OBJECT
public:
    enum Column { AssetTag, Description, Kind, Location, Status, Due, LastOutcome, ColumnCount };
    // Raw values: SortRole orders a column by what it means (dates as dates, outcomes worst
    // first); the others serve the register's filters.
    enum Role {
        SortRole = Qt::UserRole + 1,
        KindRole,
        DueStateRole,
        OutcomeRole,
        LocationRole,
        SearchTextRole
    };

    explicit InstrumentListModel(QObject* parent = nullptr);

    void setRows(std::vector<InstrumentRow> rows);
    const InstrumentRow& rowAt(int row) const { return rows_.at(static_cast<std::size_t>(row)); }

    int rowCount(const QModelIndex& parent = {}) const override;
    int columnCount(const QModelIndex& parent = {}) const override;
    QVariant data(const QModelIndex& index, int role = Qt::DisplayRole) const override;
    QVariant headerData(int section, Qt::Orientation orientation,
                        int role = Qt::DisplayRole) const override;

private:
    static QVariant sortValue(const InstrumentRow& row, int column);

    std::vector<InstrumentRow> rows_;
};

} // namespace mw::gui
