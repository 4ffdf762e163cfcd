// The grid as a spreadsheet: typing starts editing the current cell, Enter saves it and moves
// down, Tab across; Ctrl+V pastes a column of values from a spreadsheet, Delete clears cells.
#pragma once

#include <QTableView>

namespace mw::gui {

class ReadingGridView : public QTableView {
    Q_OBJECT
public:
    explicit ReadingGridView(QWidget* parent = nullptr);

    // Pastes lines of text (cells separated by tabs: the first of each line is taken) into the
    // current column going down: one undo step. Returns the number of values saved.
    int pasteText(const QString& text);
    // Saves what is being typed in a cell, if anything (before the window closes, the person
    // signs out or the session is submitted: a typed value is never dropped).
    void finishEditing();

protected:
    void keyPressEvent(QKeyEvent* event) override;
    void closeEditor(QWidget* editor, QAbstractItemDelegate::EndEditHint hint) override;
};

} // namespace mw::gui
