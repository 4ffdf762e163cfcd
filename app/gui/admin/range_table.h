// The ranges of an instrument in its editor: one row per range (label, unit, limits, signal,
// diode model, multiplier or shunt, fiducial value), typed as on the bench, with the engine's
// designed resistor beside the one entered and each problem marked in its cell.
#pragma once

#include "core/model/instrument.h"

#include <QTableWidget>

#include <optional>
#include <string>
#include <vector>

namespace mw::gui {

class RangeTable : public QTableWidget {
    Q_OBJECT
public:
    enum Column {
        Label,
        UnitColumn,
        Lower,
        FullScale,
        Signal,
        Diode,
        Resistor,
        Fiducial,
        Designed
    };

    explicit RangeTable(QWidget* parent = nullptr);

    void setRanges(const std::vector<RangeSpec>& ranges);
    void addRange(Unit unit);
    void removeCurrentRange();
    // The ranges as typed; a cell that does not parse is reported in `problems` (row, column,
    // reason) and its value left at zero.
    std::vector<RangeSpec> ranges(std::vector<std::pair<QPoint, QString>>* problems) const;
    // Marks the cells of `problems` (shape and words in the tooltip), clears other marks, and
    // shows the designed resistor of each range of `instrument`.
    void showCheck(const Instrument& instrument,
                   const std::vector<std::pair<QPoint, QString>>& problems);
    // Makes the columns an approved record holds read-only for the rows already saved.
    void freezeSavedRows(bool frozen, const QString& reason);
    void setDecimalComma(bool decimalComma) { decimalComma_ = decimalComma; }

signals:
    void edited();

private:
    void addRow(const RangeSpec& range);
    double cellValue(int row, int column, Unit unit, bool* ok, QString* reason) const;

    std::vector<std::int64_t> ids_; // per row: the saved range's id, 0 for a new one
    bool decimalComma_ = false;
};

} // namespace mw::gui
