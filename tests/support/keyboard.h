// Typing as a person does, for GUI tests and the screenshot tour: each key goes to the widget
// that would have the keyboard focus — the cell's editor once typing has opened it — which an
// offscreen window does not always give the focus to by itself.
#pragma once

#include <QAbstractItemView>
#include <QCoreApplication>
#include <QLineEdit>
#include <QTest>

namespace mwtest {

// The open cell editor (the grid's delegate names it "cellEditor"), else the view itself.
inline QWidget* keyTarget(QAbstractItemView* view) {
    for (QWidget* editor : view->viewport()->findChildren<QWidget*>(QStringLiteral("cellEditor"))) {
        if (editor->isVisible()) {
            return editor;
        }
    }
    return view;
}

// Types `text` into the view's current cell (the first key opens the editor) and ends with
// `end` (Return saves and moves down, Tab saves and moves across, Escape drops what was typed).
inline void typeInto(QAbstractItemView* view, const QString& text, Qt::Key end = Qt::Key_Return) {
    for (const QChar c : text) {
        QTest::keyClicks(keyTarget(view), QString(c));
    }
    QTest::keyClick(keyTarget(view), end);
    // The delegate saves and closes its editor from the event loop, as it does for a person
    // between two keystrokes.
    QCoreApplication::processEvents();
}

// Replaces the text of the line edit named `field` inside `parent` by typing `text` into it;
// false when there is no such field.
inline bool typeIntoField(QWidget& parent, const char* field, const QString& text) {
    auto* line = parent.findChild<QLineEdit*>(QLatin1String(field));
    if (line == nullptr) {
        return false;
    }
    line->clear();
    line->setFocus();
    QTest::keyClicks(line, text);
    return true;
}

} // namespace mwtest
