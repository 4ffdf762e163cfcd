// Read-only detail of the instrument selected in the register: movement, ranges, scale, class.
#pragma once

#include "core/model/instrument.h"

#include <QWidget>

#include <optional>

class QFormLayout;
class QLabel;
class QTableWidget;

namespace mw::gui {

class InstrumentDetailPanel : public QWidget {
    Q_OBJECT
public:
    explicit InstrumentDetailPanel(QWidget* parent = nullptr);

    void showInstrument(const std::optional<Instrument>& instrument);

    // The text shown for a field, by its object name; for tests.
    QString fieldText(const QString& name) const;

private:
    QLabel* addField(QFormLayout* form, const QString& name, const QString& label);

    QLabel* heading_ = nullptr;
    QTableWidget* ranges_ = nullptr;
    QWidget* body_ = nullptr;
};

} // namespace mw::gui
