// Widgets the supervisor's pages share.
#pragma once

#include <QHeaderView>
#include <QStringList>
#include <QTableWidget>

namespace mw::gui {

// A table a person reads and picks rows from, never types into.
inline QTableWidget* readOnlyTable(const QStringList& headers, QWidget* parent) {
    auto* table = new QTableWidget(0, int(headers.size()), parent);
    table->setHorizontalHeaderLabels(headers);
    table->setSelectionBehavior(QAbstractItemView::SelectRows);
    table->setSelectionMode(QAbstractItemView::SingleSelection);
    table->setEditTriggers(QAbstractItemView::NoEditTriggers);
    table->verticalHeader()->hide();
    table->horizontalHeader()->setStretchLastSection(true);
    table->setWordWrap(false);
    return table;
}

} // namespace mw::gui
