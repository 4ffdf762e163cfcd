// The editor of a grid cell: a line edit that starts with the cell's text selected, so typing
// replaces it; what it commits is parsed by the model.
#pragma once

#include <QStyledItemDelegate>

namespace mw::gui {

class ReadingDelegate : public QStyledItemDelegate {
    Q_OBJECT
public:
    using QStyledItemDelegate::QStyledItemDelegate;

    QWidget* createEditor(QWidget* parent, const QStyleOptionViewItem& option,
                          const QModelIndex& index) const override;
    void setEditorData(QWidget* editor, const QModelIndex& index) const override;
};

} // namespace mw::gui
