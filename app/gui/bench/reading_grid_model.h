// The test-point grid of one range and phase: one row per planned reading in the order the bench
// takes them (up-scale ascending, down-scale back), the applied value prefilled, the indication
// typed, and each point's results beside it. A thin model: values come from the session and its
// evaluation, edits go through the edits facade, formatting is done here for display only and
// the raw numbers are available in ValueRole.
#pragma once

#include "core/evaluation/session_evaluation.h"
#include "core/plan/session_plan.h"

#include <QAbstractTableModel>

#include <map>
#include <optional>
#include <vector>

namespace mw::gui {

class BenchSession;
class Workspace;

class ReadingGridModel : public QAbstractTableModel {
    Q_OBJECT
public:
    enum Column {
        Point,
        DirectionColumn,
        Repeat,
        Applied,
        Indicated,
        Error,
        ErrorOfReading,
        ErrorOfFiducial,
        Uncertainty,
        Tur,
        Decision,
        ColumnCount
    };
    enum Role {
        ValueRole = Qt::UserRole + 1, // the raw number (double) behind a cell, when there is one
        RejectedRole,                 // true while a cell holds an entry that was refused
        OutcomeRole,                  // the point's decision (int of mw::Outcome)
    };

    ReadingGridModel(Workspace& workspace, QObject* parent = nullptr);

    // Shows `rangeId` in `phase` of the bench session. The same rows as before are updated in
    // place (only those whose content changed are announced); other rows reset the model.
    void show(const BenchSession& bench, std::int64_t rangeId, Phase phase);
    // Decimal comma for typed values (the lab's setting).
    void setDecimalComma(bool decimalComma) { decimalComma_ = decimalComma; }

    std::int64_t rangeId() const { return rangeId_; }
    Phase phase() const { return phase_; }
    ReadingKey keyAt(int row) const { return rows_.at(std::size_t(row)).key; }
    int rowOf(const ReadingKey& key) const;

    // Saves typed text into cells going down from `first` (a pasted column): one undo step;
    // returns the number of values saved; entries that do not parse are marked in their cells.
    int pasteColumn(const QModelIndex& first, const QStringList& texts);

    int rowCount(const QModelIndex& parent = {}) const override;
    int columnCount(const QModelIndex& parent = {}) const override;
    QVariant data(const QModelIndex& index, int role = Qt::DisplayRole) const override;
    bool setData(const QModelIndex& index, const QVariant& value, int role = Qt::EditRole) override;
    Qt::ItemFlags flags(const QModelIndex& index) const override;
    QVariant headerData(int section, Qt::Orientation orientation,
                        int role = Qt::DisplayRole) const override;

signals:
    // An entry was refused: why, in words (the parser's or the workbook's reason).
    void entryRefused(const QString& reason);

private:
    struct Row {
        ReadingKey key;
        double nominal = 0.0;
        int repeats = 1;
        std::optional<Reading> reading;
        std::optional<PointResult> result;
        bool operator==(const Row& other) const;
    };
    struct Refusal {
        QString text;
        QString reason;
    };

    std::vector<Row> rowsOf(const BenchSession& bench) const;
    QVariant display(const Row& row, int column) const;
    QVariant value(const Row& row, int column) const;
    // The reading a typed text makes of `row`'s reading (nullopt: the reading is to be
    // removed); throws QuantityError for text that does not parse.
    std::optional<Reading> edited(const Row& row, int column, const QString& text) const;
    QString formatted(double value) const;
    static bool decides(const Row& row);

    Workspace& workspace_;
    std::int64_t sessionId_ = 0;
    std::int64_t rangeId_ = 0;
    Phase phase_ = Phase::AsFound;
    Unit unit_ = Unit::Volt;
    int prefixPower_ = 0; // the range's SI prefix: bare numbers are typed in it
    double fiducial_ = 0.0;
    bool editable_ = false;
    bool decimalComma_ = false;
    std::vector<Row> rows_;
    std::map<std::pair<int, int>, Refusal> refused_; // (row, column) -> what was typed
};

} // namespace mw::gui
