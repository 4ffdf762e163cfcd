// The test-point grid of the bench.
#include "app/gui/bench/reading_grid_model.h"

#include "app/gui/bench/bench_session.h"
#include "app/gui/session_edits.h"
#include "app/gui/status_icons.h"
#include "app/gui/workspace.h"
#include "core/units/quantity.h"

#include <QApplication>
#include <QFont>

#include <cmath>
#include <cstdio>

namespace mw::gui {
namespace {

QString text(const std::string& value) {
    return QString::fromStdString(value);
}

// The engineering power of ten of a range's scale (-6 for 50 µA, -3 for 100 mA, 0 for 10 V):
// the prefix its scale is read in, so a bare number typed is in that prefix.
int scalePrefix(const RangeSpec& range) {
    const double top = std::max(std::fabs(range.lower_limit), std::fabs(range.full_scale));
    if (!(top > 0.0)) {
        return 0;
    }
    return static_cast<int>(std::floor(std::log10(top) / 3.0)) * 3;
}

QString prefixSymbol(int power) {
    switch (power) {
    case -9:
        return QStringLiteral("n");
    case -6:
        return QStringLiteral("µ");
    case -3:
        return QStringLiteral("m");
    case 3:
        return QStringLiteral("k");
    default:
        return QString();
    }
}

const PointResult* pointOf(const EvaluationResult& result, int pointIndex) {
    for (const PointResult& point : result.points) {
        if (point.pointIndex == pointIndex) {
            return &point;
        }
    }
    return nullptr;
}

} // namespace

bool ReadingGridModel::Row::operator==(const Row& other) const {
    const bool sameResult =
        result.has_value() == other.result.has_value() &&
        (!result ||
         (result->error == other.result->error &&
          result->budget.expandedRounded == other.result->budget.expandedRounded &&
          result->decision == other.result->decision && result->turText == other.result->turText));
    return key == other.key && nominal == other.nominal && repeats == other.repeats &&
           reading == other.reading && sameResult;
}

ReadingGridModel::ReadingGridModel(Workspace& workspace, QObject* parent)
    : QAbstractTableModel(parent)
    , workspace_(workspace) {}

std::vector<ReadingGridModel::Row> ReadingGridModel::rowsOf(const BenchSession& bench) const {
    const CalibrationSession& session = bench.session();
    const std::vector<TestPoint> plan = effectivePlan(session);
    const EvaluationResult* result = nullptr;
    for (const RangeEvaluation& part : bench.evaluation().ranges) {
        if (part.rangeId == rangeId_ && part.phase == phase_ && part.result) {
            result = &*part.result;
        }
    }
    std::vector<Row> rows;
    CalibrationSession onePhase = session;
    onePhase.phases = phase_ == Phase::AsFound ? PhasePlan::AsFound : PhasePlan::AsLeft;
    for (const ReadingKey& key : plannedReadings(bench.instrument(), onePhase)) {
        if (key.range_id != rangeId_) {
            continue;
        }
        Row row;
        row.key = key;
        for (const TestPoint& point : plan) {
            if (point.range_id == key.range_id && point.point_index == key.point_index) {
                row.nominal = point.nominal;
                row.repeats = point.repeats;
            }
        }
        for (const Reading& reading : session.readings) {
            if (keyOf(reading) == key) {
                row.reading = reading;
            }
        }
        if (result) {
            if (const PointResult* point = pointOf(*result, key.point_index)) {
                row.result = *point;
            }
        }
        rows.push_back(std::move(row));
    }
    return rows;
}

void ReadingGridModel::show(const BenchSession& bench, std::int64_t rangeId, Phase phase) {
    const RangeSpec* range = bench.range(rangeId);
    const bool sameView = bench.id() == sessionId_ && rangeId == rangeId_ && phase == phase_;
    sessionId_ = bench.id();
    rangeId_ = rangeId;
    phase_ = phase;
    editable_ = bench.editable();
    if (range != nullptr) {
        unit_ = range->unit;
        prefixPower_ = scalePrefix(*range);
        try {
            fiducial_ =
                fiducialValue(ScaleRange{range->lower_limit, range->full_scale,
                                         bench.instrument().scale_type, range->fiducial_value});
        } catch (const std::exception&) {
            fiducial_ = 0.0;
        }
    }
    std::vector<Row> rows = range ? rowsOf(bench) : std::vector<Row>{};
    bool sameKeys = sameView && rows.size() == rows_.size();
    for (std::size_t i = 0; sameKeys && i < rows.size(); ++i) {
        sameKeys = rows[i].key == rows_[i].key;
    }
    if (!sameKeys) {
        beginResetModel();
        rows_ = std::move(rows);
        refused_.clear();
        endResetModel();
        return;
    }
    for (std::size_t i = 0; i < rows.size(); ++i) {
        if (rows[i] == rows_[i]) {
            continue;
        }
        rows_[i] = std::move(rows[i]);
        emit dataChanged(index(int(i), 0), index(int(i), ColumnCount - 1));
    }
}

int ReadingGridModel::rowOf(const ReadingKey& key) const {
    for (std::size_t i = 0; i < rows_.size(); ++i) {
        if (rows_[i].key == key) {
            return int(i);
        }
    }
    return -1;
}

int ReadingGridModel::rowCount(const QModelIndex& parent) const {
    return parent.isValid() ? 0 : int(rows_.size());
}

int ReadingGridModel::columnCount(const QModelIndex& parent) const {
    return parent.isValid() ? 0 : ColumnCount;
}

QString ReadingGridModel::formatted(double number) const {
    // In the range's own prefix, as many digits as the number has (up to ten), so what was
    // typed reads back as typed.
    char buffer[48];
    std::snprintf(buffer, sizeof buffer, "%.10g", number / std::pow(10.0, prefixPower_));
    QString out = QString::fromLatin1(buffer);
    if (decimalComma_) {
        out.replace(QLatin1Char('.'), QLatin1Char(','));
    }
    return out + QLatin1Char(' ') + prefixSymbol(prefixPower_) +
           text(std::string(unitSymbol(unit_)));
}

QVariant ReadingGridModel::value(const Row& row, int column) const {
    const std::optional<Reading>& reading = row.reading;
    switch (column) {
    case Applied:
        return reading ? reading->applied : row.nominal;
    case Indicated:
        return reading && reading->indicated ? QVariant(*reading->indicated) : QVariant();
    case Error:
        return reading && reading->indicated ? QVariant(*reading->indicated - reading->applied)
                                             : QVariant();
    case Uncertainty:
        return row.result ? QVariant(row.result->budget.expandedRounded) : QVariant();
    case Tur:
        return row.result && row.result->tur ? QVariant(*row.result->tur) : QVariant();
    default:
        return {};
    }
}

QVariant ReadingGridModel::display(const Row& row, int column) const {
    const std::optional<Reading>& reading = row.reading;
    const bool indicated = reading && reading->indicated;
    switch (column) {
    case Point:
        return tr("%1 · %2").arg(row.key.point_index + 1).arg(formatted(row.nominal));
    case DirectionColumn:
        return row.key.direction == Direction::Up ? tr("▲ up") : tr("▼ down");
    case Repeat:
        return row.repeats > 1 ? QVariant(row.key.repeat) : QVariant();
    case Applied:
        return formatted(reading ? reading->applied : row.nominal);
    case Indicated:
        return indicated ? formatted(*reading->indicated) : QString();
    case Error:
        return indicated ? text(formatEngineering(*reading->indicated - reading->applied, 3, unit_))
                         : QString();
    case ErrorOfReading:
        if (!indicated || reading->applied == 0.0) {
            return {};
        }
        return text(formatEngineering(
            (*reading->indicated - reading->applied) / reading->applied * 100.0, 3, Unit::Percent));
    case ErrorOfFiducial:
        if (!indicated || fiducial_ <= 0.0) {
            return {};
        }
        return text(formatEngineering((*reading->indicated - reading->applied) / fiducial_ * 100.0,
                                      3, Unit::Percent));
    case Uncertainty:
        if (!row.result) {
            return {};
        }
        return text(formatEngineering(row.result->budget.expandedRounded, 2, unit_));
    case Tur:
        if (!row.result) {
            return {};
        }
        return row.result->tur ? text(row.result->turText) : tr("no reference");
    case Decision:
        if (!row.result) {
            return {};
        }
        if (!decides(row)) {
            return row.result->decidingDirection == Direction::Up ? tr("judged on ▲")
                                                                  : tr("judged on ▼");
        }
        return text(std::string(displayName(row.result->decision)));
    default:
        return {};
    }
}

bool ReadingGridModel::decides(const Row& row) {
    // A point is judged by its direction with the larger error; with readings both ways the
    // other row names that direction instead of repeating a verdict its own error did not earn.
    return !row.result || !row.result->errorUp || !row.result->errorDown ||
           row.key.direction == row.result->decidingDirection;
}

QVariant ReadingGridModel::data(const QModelIndex& index, int role) const {
    if (!index.isValid() || index.row() >= rowCount()) {
        return {};
    }
    const Row& row = rows_[std::size_t(index.row())];
    const auto refused = refused_.find({index.row(), index.column()});
    if (refused != refused_.end()) {
        // The entry stays in its cell, marked by an icon and words, with the reason.
        switch (role) {
        case Qt::DisplayRole:
        case Qt::EditRole:
            return refused->second.text;
        case Qt::ToolTipRole:
            return tr("Not saved: %1").arg(refused->second.reason);
        case Qt::DecorationRole:
            return warningIcon(QApplication::palette());
        case RejectedRole:
            return true;
        default:
            return {};
        }
    }
    switch (role) {
    case Qt::DisplayRole:
        return display(row, index.column());
    case Qt::EditRole:
        if (index.column() == Indicated && !(row.reading && row.reading->indicated)) {
            return QString();
        }
        return display(row, index.column());
    case ValueRole:
        return value(row, index.column());
    case RejectedRole:
        return false;
    case OutcomeRole:
        return row.result ? QVariant(int(row.result->decision)) : QVariant();
    case Qt::DecorationRole:
        if (index.column() == Decision && row.result && decides(row)) {
            return outcomeIcon(row.result->decision, QApplication::palette());
        }
        if (index.column() == Tur && row.result && row.result->turBelowMinimum) {
            return warningIcon(QApplication::palette());
        }
        return {};
    case Qt::FontRole:
        if (index.column() == Applied && !row.reading) {
            QFont font;
            font.setItalic(true); // the nominal value, not yet a saved reading
            return font;
        }
        return {};
    case Qt::ToolTipRole:
        if (index.column() == Applied && !row.reading) {
            return tr("The nominal value of the point; type what the standard applied if it "
                      "differs. Saved with the indication.");
        }
        if (index.column() == Indicated && row.reading && !row.reading->indicated) {
            return tr("The applied value is saved; the indication is still to be typed.");
        }
        if (index.column() == Tur && row.result && row.result->turBelowMinimum) {
            return tr("TUR below 4:1: the calibration's uncertainty is large against the "
                      "tolerance");
        }
        if (index.column() == Decision && row.result && !decides(row)) {
            return tr("The point is judged by the direction with the larger error (%1): %2")
                .arg(row.result->decidingDirection == Direction::Up ? tr("up-scale")
                                                                    : tr("down-scale"),
                     text(std::string(displayName(row.result->decision))));
        }
        if (index.column() == Uncertainty && row.result) {
            return tr("Expanded uncertainty U = k·u_c with k = %1 (ν_eff = %2), rounded up to "
                      "two significant digits")
                .arg(row.result->budget.coverageFactor, 0, 'f', 2)
                .arg(std::isinf(row.result->budget.dofEffective)
                         ? QStringLiteral("∞")
                         : QString::number(row.result->budget.dofEffective, 'g', 3));
        }
        return display(row, index.column());
    case Qt::TextAlignmentRole:
        return index.column() >= Applied ? QVariant(Qt::AlignRight | Qt::AlignVCenter)
                                         : QVariant(Qt::AlignLeft | Qt::AlignVCenter);
    default:
        return {};
    }
}

std::optional<Reading> ReadingGridModel::edited(const Row& row, int column,
                                                const QString& typed) const {
    Reading reading;
    if (row.reading) {
        reading = *row.reading;
    } else {
        reading.range_id = row.key.range_id;
        reading.point_index = row.key.point_index;
        reading.direction = row.key.direction;
        reading.phase = row.key.phase;
        reading.repeat = row.key.repeat;
        reading.applied = row.nominal;
    }
    reading.unit = unit_;
    const QString trimmed = typed.trimmed();
    if (trimmed.isEmpty()) {
        if (column == Applied) {
            reading.applied = row.nominal; // back to the nominal value
            return row.reading ? std::optional(reading) : std::nullopt;
        }
        reading.indicated.reset();
        // Nothing worth keeping without an indication unless another value was applied.
        return reading.applied != row.nominal ? std::optional(reading) : std::nullopt;
    }
    ParseOptions options;
    options.decimalComma = decimalComma_;
    options.bareNumberPowerOfTen = prefixPower_;
    const double number = parseValue(trimmed.toStdString(), unit_, options);
    (column == Applied ? reading.applied : reading.indicated.emplace()) = number;
    return reading;
}

bool ReadingGridModel::setData(const QModelIndex& index, const QVariant& value, int role) {
    if (!index.isValid() || role != Qt::EditRole || !(flags(index) & Qt::ItemIsEditable)) {
        return false;
    }
    return pasteColumn(index, {value.toString()}) == 1;
}

int ReadingGridModel::pasteColumn(const QModelIndex& first, const QStringList& texts) {
    const int column = first.column();
    if (column != Applied && column != Indicated) {
        return 0;
    }
    std::vector<storage::ReadingChange> changes;
    std::vector<int> savedRows;
    for (int i = 0; i < texts.size() && first.row() + i < rowCount(); ++i) {
        const int row = first.row() + i;
        const Row& current = rows_[std::size_t(row)];
        try {
            const std::optional<Reading> reading = edited(current, column, texts[i]);
            if (reading || current.reading) {
                changes.push_back({current.key, reading});
            }
            if (refused_.erase({row, column}) > 0) {
                emit dataChanged(index(row, column), index(row, column));
            }
            savedRows.push_back(row);
        } catch (const std::exception& error) {
            refused_[{row, column}] = {texts[i], QString::fromUtf8(error.what())};
            emit dataChanged(index(row, column), index(row, column));
            emit entryRefused(QString::fromUtf8(error.what()));
        }
    }
    if (savedRows.empty()) {
        return 0;
    }
    const QString what =
        savedRows.size() == 1
            ? (column == Indicated ? tr("Indication at point %1 %2")
                                   : tr("Applied value at point %1 %2"))
                  .arg(rows_[std::size_t(savedRows.front())].key.point_index + 1)
                  .arg(rows_[std::size_t(savedRows.front())].key.direction == Direction::Up
                           ? tr("up-scale")
                           : tr("down-scale"))
            : tr("Paste %1 values").arg(savedRows.size());
    try {
        if (!changes.empty()) {
            workspace_.edits().changeReadings(sessionId_, std::move(changes), what);
        }
    } catch (const std::exception& error) {
        // The workbook refused: nothing was saved; the entries stay in their cells, marked.
        for (std::size_t i = 0; i < savedRows.size(); ++i) {
            const int row = savedRows[i];
            refused_[{row, column}] = {texts[row - first.row()], QString::fromUtf8(error.what())};
            emit dataChanged(index(row, column), index(row, column));
        }
        emit entryRefused(QString::fromUtf8(error.what()));
        return 0;
    }
    return int(savedRows.size());
}

Qt::ItemFlags ReadingGridModel::flags(const QModelIndex& index) const {
    if (!index.isValid()) {
        return Qt::NoItemFlags;
    }
    Qt::ItemFlags flags = Qt::ItemIsEnabled | Qt::ItemIsSelectable;
    if (editable_ && (index.column() == Applied || index.column() == Indicated)) {
        flags |= Qt::ItemIsEditable;
    }
    return flags;
}

QVariant ReadingGridModel::headerData(int section, Qt::Orientation orientation, int role) const {
    if (orientation != Qt::Horizontal || role != Qt::DisplayRole) {
        return {};
    }
    const QString unit = prefixSymbol(prefixPower_) + text(std::string(unitSymbol(unit_)));
    switch (section) {
    case Point:
        return tr("Point");
    case DirectionColumn:
        return tr("Direction");
    case Repeat:
        return tr("Repeat");
    case Applied:
        return tr("Applied (%1)").arg(unit);
    case Indicated:
        return tr("Indicated (%1)").arg(unit);
    case Error:
        return tr("Error");
    case ErrorOfReading:
        return tr("% of reading");
    case ErrorOfFiducial:
        return tr("% of fiducial");
    case Uncertainty:
        return tr("U");
    case Tur:
        return tr("TUR");
    case Decision:
        return tr("Decision");
    default:
        return {};
    }
}

} // namespace mw::gui
