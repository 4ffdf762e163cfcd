// What every panel of the range designer shares: its entries, its results recomputed on each
// keystroke, a line saying why there is no result, and the resistor it designs (if any) for
// "use for this range".
#pragma once

#include "app/gui/designer/designer_fields.h"
#include "core/circuits/eseries.h"
#include "core/circuits/movement.h"
#include "core/model/vocabulary.h"

#include <QGroupBox>
#include <QWidget>

#include <optional>
#include <string>

class QFormLayout;
class QLabel;

namespace mw::gui {

// A multiplier or shunt the designer computed, with what it was computed for, so that it is
// only copied into a range of the same kind, full scale and movement.
struct DesignedValue {
    double ohms = 0.0;
    bool isShunt = false;
    Unit unit = Unit::Volt; // of the range: Volt for a multiplier, Ampere for a shunt
    double full_scale = 0.0;
    Movement movement;
    SignalType signal = SignalType::Dc;
    QString what; // "the multiplier of a 10 V bridge-rectifier range"
};

// The movement every range design starts from: I_fs and R_m, typed once for all panels.
class MovementBox : public QGroupBox {
    Q_OBJECT
public:
    explicit MovementBox(QWidget* parent = nullptr);
    // The movement as typed and checked by the engine; nullopt with the fields marked.
    std::optional<Movement> movement();
    void setMovement(const Movement& movement);
    void setDecimalComma(bool decimalComma);

signals:
    void edited();

private:
    QuantityField* amps_;
    QuantityField* ohms_;
};

class DesignerPanel : public QWidget {
    Q_OBJECT
public:
    DesignerPanel(MovementBox* movement, QWidget* parent);

    // Reads every entry and shows the results, or marks the entries and shows none.
    virtual void recompute() = 0;
    // The resistor this panel designed for one range, when it designs one and has a result.
    virtual std::optional<DesignedValue> designed() const { return std::nullopt; }
    void setDecimalComma(bool decimalComma);
    // Why there is no result ("" when there is one).
    QString problem() const;

signals:
    void recomputed();

protected:
    // A field in `form` that recomputes the panel as it is typed into.
    QuantityField* addField(QFormLayout* form, const QString& name, const QString& label, Unit unit,
                            const QString& text);
    // Shows the results (when `problem` is empty) or why there are none.
    void finish(const QString& problem);
    // Clears `results` and says why: the entries marked, or the engine's `reason` beside the
    // entry it blames.
    void noResult(ResultList* results, QuantityField* blamed = nullptr,
                  const QString& reason = QString());
    QLabel* statusLine() const { return status_; }

    MovementBox* movement_;

private:
    QLabel* status_;
};

// The message shown when an entry is marked.
QString markedEntriesProblem();

// The rating flag in shape and words: "✔ within its rating", "⚠ above the derated rating
// (50 %)", "✖ over its rating" (power or working voltage).
QString ratingFlag(const Dissipation& heat);

// Rows for a designed resistor: its E96 value not above with the trim, its dissipation at
// full scale and 120 % against a 0.25 W, 250 V part, and the cautions.
void addResistorRows(ResultList* results);
// `amps` flows in the resistor at full scale (rms for a rectifier multiplier); `hazard` is the
// live-voltage caution of the range, joined before the rating caution.
void showResistor(ResultList* results, double ohms, double amps, const char* part,
                  const std::optional<std::string>& hazard);

} // namespace mw::gui
