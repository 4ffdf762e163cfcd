// Spreadsheet keys on the bench grid.
#include "app/gui/bench/reading_grid_view.h"

#include "app/gui/bench/reading_delegate.h"
#include "app/gui/bench/reading_grid_model.h"

#include <QApplication>
#include <QClipboard>
#include <QHeaderView>
#include <QKeyEvent>

namespace mw::gui {

ReadingGridView::ReadingGridView(QWidget* parent)
    : QTableView(parent) {
    setObjectName(QStringLiteral("readingGrid"));
    setItemDelegate(new ReadingDelegate(this));
    setEditTriggers(QAbstractItemView::AnyKeyPressed | QAbstractItemView::DoubleClicked |
                    QAbstractItemView::EditKeyPressed);
    setSelectionBehavior(QAbstractItemView::SelectItems);
    setSelectionMode(QAbstractItemView::ContiguousSelection);
    setTabKeyNavigation(true);
    setWordWrap(false);
    verticalHeader()->hide();
    horizontalHeader()->setSectionResizeMode(QHeaderView::ResizeToContents);
    horizontalHeader()->setStretchLastSection(true);
}

int ReadingGridView::pasteText(const QString& text) {
    auto* grid = qobject_cast<ReadingGridModel*>(model());
    if (grid == nullptr || !currentIndex().isValid()) {
        return 0;
    }
    QStringList values;
    for (const QString& line : text.split(QLatin1Char('\n'))) {
        QString cell = line.section(QLatin1Char('\t'), 0, 0);
        cell.remove(QLatin1Char('\r'));
        values << cell;
    }
    while (!values.isEmpty() && values.back().trimmed().isEmpty()) {
        values.removeLast(); // the line break a spreadsheet puts after the last cell
    }
    return grid->pasteColumn(currentIndex(), values);
}

void ReadingGridView::finishEditing() {
    if (state() != QAbstractItemView::EditingState) {
        return;
    }
    for (QWidget* editor : viewport()->findChildren<QWidget*>(QStringLiteral("cellEditor"))) {
        if (editor->isVisible()) {
            commitData(editor);
            QTableView::closeEditor(editor, QAbstractItemDelegate::NoHint);
            return;
        }
    }
}

void ReadingGridView::keyPressEvent(QKeyEvent* event) {
    if (event->matches(QKeySequence::Paste)) {
        pasteText(QApplication::clipboard()->text());
        event->accept();
        return;
    }
    if ((event->key() == Qt::Key_Delete || event->key() == Qt::Key_Backspace) &&
        state() != QAbstractItemView::EditingState) {
        // Clears the selected cells of one column as one step.
        const QModelIndexList selected = selectionModel()->selectedIndexes();
        auto* grid = qobject_cast<ReadingGridModel*>(model());
        if (grid != nullptr && !selected.isEmpty()) {
            int top = selected.front().row();
            int bottom = top;
            for (const QModelIndex& index : selected) {
                top = std::min(top, index.row());
                bottom = std::max(bottom, index.row());
            }
            QStringList blanks;
            for (int row = top; row <= bottom; ++row) {
                blanks << QString();
            }
            grid->pasteColumn(grid->index(top, currentIndex().column()), blanks);
        }
        event->accept();
        return;
    }
    if ((event->key() == Qt::Key_Return || event->key() == Qt::Key_Enter) &&
        state() != QAbstractItemView::EditingState) {
        // Enter on a cell not being edited moves down, as in a spreadsheet.
        const QModelIndex below = model()->index(currentIndex().row() + 1, currentIndex().column());
        if (below.isValid()) {
            setCurrentIndex(below);
        }
        event->accept();
        return;
    }
    QTableView::keyPressEvent(event);
}

void ReadingGridView::closeEditor(QWidget* editor, QAbstractItemDelegate::EndEditHint hint) {
    // Enter (which the delegate reports as SubmitModelCache) saves and moves down one row.
    const bool moveDown = hint == QAbstractItemDelegate::SubmitModelCache;
    QTableView::closeEditor(editor, moveDown ? QAbstractItemDelegate::NoHint : hint);
    if (moveDown) {
        const QModelIndex below = model()->index(currentIndex().row() + 1, currentIndex().column());
        if (below.isValid()) {
            setCurrentIndex(below);
        }
    }
}

} // namespace mw::gui
