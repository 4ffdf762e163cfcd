// Adding or editing an instrument: identity, movement, scale, accuracy class, kind, interval,
// status (retiring is a status) and its ranges. The engine checks every value as it is typed
// and the reason stands beside its field; nothing is saved until the whole instrument holds
// together. Once an approved record refers to the meter, what the record rests on is shown
// read-only with the reason (a changed specification is a new instrument, or an amendment).
#pragma once

#include "core/model/instrument.h"

#include <QDialog>

#include <map>
#include <optional>
#include <string>

class QComboBox;
class QLabel;
class QLineEdit;
class QPushButton;
class QSpinBox;

namespace mw::gui {

class RangeTable;
class Workspace;

class InstrumentEditor : public QDialog {
    Q_OBJECT
public:
    // Edits `instrument` (nullopt: a new one).
    InstrumentEditor(Workspace& workspace, std::optional<Instrument> instrument,
                     QWidget* parent = nullptr);

    // Checks and saves; false with the reasons shown (nothing saved). The saved instrument's id
    // is then savedId().
    bool save();
    std::int64_t savedId() const { return savedId_; }
    // The reasons now standing beside the fields (empty when the instrument holds together).
    QStringList problems() const;
    bool frozen() const { return frozen_; }
    RangeTable* ranges() const { return ranges_; }
    QString message() const;

private:
    QLineEdit* addLine();
    void build();
    void fill(const Instrument& instrument);
    Instrument typed(std::vector<std::pair<std::string, QString>>* parseProblems) const;
    void check();
    void freeze();

    Workspace& workspace_;
    std::optional<Instrument> original_;
    std::int64_t savedId_ = 0;
    bool frozen_ = false;
    std::map<std::string, QWidget*> fields_;
    std::map<std::string, QLabel*> reasons_;
    QComboBox* kind_ = nullptr;
    QComboBox* status_ = nullptr;
    QComboBox* scale_ = nullptr;
    QComboBox* class_ = nullptr;
    QSpinBox* divisions_ = nullptr;
    QSpinBox* interval_ = nullptr;
    RangeTable* ranges_ = nullptr;
    QLabel* frozenNote_ = nullptr;
    QLabel* message_ = nullptr;
    QPushButton* save_ = nullptr;
};

} // namespace mw::gui
