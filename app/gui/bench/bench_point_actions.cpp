// The bench's test-point actions: add a point, move one to another value, remove one. Each is
// one undoable edit through the edits facade.
#include "app/gui/bench/bench_view.h"

#include "app/gui/bench/reading_grid_model.h"
#include "app/gui/bench/reading_grid_view.h"
#include "app/gui/session_edits.h"
#include "app/gui/workspace.h"
#include "core/plan/session_plan.h"
#include "core/units/quantity.h"
#include "storage/sql_support.h"

#include <QComboBox>
#include <QInputDialog>
#include <QPushButton>

#include <algorithm>
#include <cmath>

namespace mw::gui {
namespace {

using storage::sql::text;

// A typed point value: what the grid accepts (a bare number is in the range's unit, written
// with the lab's decimal mark).
double parsePointValue(const RangeSpec& range, const QString& typed, bool decimalComma) {
    ParseOptions options;
    options.decimalComma = decimalComma;
    const double top = std::max(std::fabs(range.lower_limit), std::fabs(range.full_scale));
    options.bareNumberPowerOfTen = top > 0.0 ? int(std::floor(std::log10(top) / 3.0)) * 3 : 0;
    return parseValue(typed.trimmed().toStdString(), range.unit, options);
}

} // namespace

void BenchView::connectPointActions() {
    const auto ask = [this](const QString& title, const QString& current, auto action) {
        bool ok = false;
        const QString typed = QInputDialog::getText(
            this, title, tr("Value of the point (a bare number is in the range's unit):"),
            QLineEdit::Normal, current, &ok);
        if (ok && !typed.trimmed().isEmpty()) {
            QString message;
            action(typed, &message);
            emit statusMessage(message);
        }
    };
    connect(addPoint_, &QPushButton::clicked, this, [this, ask] {
        ask(tr("Add a test point"), QString(),
            [this](const QString& typed, QString* message) { addPoint(typed, message); });
    });
    connect(movePoint_, &QPushButton::clicked, this, [this, ask] {
        const QModelIndex current = grid_->currentIndex();
        if (!bench_ || !current.isValid()) {
            emit statusMessage(tr("Choose a point in the grid first."));
            return;
        }
        ask(tr("Move a test point"),
            model_->index(current.row(), ReadingGridModel::Applied).data().toString(),
            [this](const QString& typed, QString* message) { moveCurrentPoint(typed, message); });
    });
    connect(removePoint_, &QPushButton::clicked, this, [this] {
        QString message;
        removeCurrentPoint(&message);
        emit statusMessage(message);
    });
}

bool BenchView::addPoint(const QString& typed, QString* message) {
    if (!bench_) {
        return false;
    }
    const RangeSpec* range = bench_->range(range_->currentData().toLongLong());
    try {
        const double nominal = parsePointValue(*range, typed, workspace_.lab().decimal_comma);
        int repeats = 1;
        for (const TestPoint& point : effectivePlan(bench_->session())) {
            if (point.range_id == range->id) {
                repeats = std::max(repeats, point.repeats);
            }
        }
        const TestPoint added =
            workspace_.edits().addPoint(bench_->id(), range->id, nominal, repeats);
        *message = tr("Point %1 added at %2.")
                       .arg(added.point_index + 1)
                       .arg(text(formatEngineering(nominal, 4, range->unit)));
        return true;
    } catch (const std::exception& error) {
        *message = tr("Point not added: %1").arg(QString::fromUtf8(error.what()));
        return false;
    }
}

bool BenchView::moveCurrentPoint(const QString& typed, QString* message) {
    const QModelIndex current = grid_->currentIndex();
    if (!bench_ || !current.isValid()) {
        *message = tr("Choose a point in the grid first.");
        return false;
    }
    const ReadingKey key = model_->keyAt(current.row());
    // Readings taken at the old value would no longer belong to the point: a point is moved
    // before it is measured, or its readings are cleared first (both undoable).
    const std::vector<Reading>& readings = bench_->session().readings;
    if (std::any_of(readings.begin(), readings.end(), [&](const Reading& reading) {
            return reading.range_id == key.range_id && reading.point_index == key.point_index;
        })) {
        *message = tr("Point %1 not moved: it already has readings. Clear them (Delete) or add a "
                      "new point instead.")
                       .arg(key.point_index + 1);
        return false;
    }
    const RangeSpec* range = bench_->range(key.range_id);
    try {
        TestPoint point;
        for (const TestPoint& planned : effectivePlan(bench_->session())) {
            if (planned.range_id == key.range_id && planned.point_index == key.point_index) {
                point = planned;
            }
        }
        point.nominal = parsePointValue(*range, typed, workspace_.lab().decimal_comma);
        workspace_.edits().changePoint(bench_->id(), point);
        *message = tr("Point %1 moved to %2.")
                       .arg(key.point_index + 1)
                       .arg(text(formatEngineering(point.nominal, 4, range->unit)));
        return true;
    } catch (const std::exception& error) {
        *message = tr("Point not moved: %1").arg(QString::fromUtf8(error.what()));
        return false;
    }
}

bool BenchView::removeCurrentPoint(QString* message) {
    const QModelIndex current = grid_->currentIndex();
    if (!bench_ || !current.isValid()) {
        *message = tr("Choose a point in the grid first.");
        return false;
    }
    const ReadingKey key = model_->keyAt(current.row());
    try {
        workspace_.edits().removePoint(bench_->id(), key.range_id, key.point_index);
        *message =
            tr("Point %1 removed with its readings (Undo puts it back).").arg(key.point_index + 1);
        return true;
    } catch (const std::exception& error) {
        *message = tr("Point not removed: %1").arg(QString::fromUtf8(error.what()));
        return false;
    }
}

} // namespace mw::gui
