// The range designer's building blocks: an entry that reads a value as typed on the bench and
// marks what it cannot read with the parser's reason, and a list of results that keeps each
// number beside its formatted text (tests and the "use for this range" box read the number).
#pragma once

#include "core/units/quantity.h"

#include <QWidget>

#include <map>
#include <optional>
#include <vector>

class QAction;
class QFormLayout;
class QLabel;
class QLineEdit;

namespace mw::gui {

// One value typed as on the bench ("4k7", "50 µA", "23 °C"). What was typed stays in the field
// whatever happens; a value that does not parse, or that the panel refuses, is marked with a
// warning shape in the field and "✖ reason" beneath it.
class QuantityField : public QWidget {
    Q_OBJECT
public:
    // `name` becomes the line edit's object name ("designer_<name>" for the box around it).
    QuantityField(const QString& name, Unit unit, const QString& text, QWidget* parent = nullptr);

    QLineEdit* line() const { return line_; }
    QString text() const;
    bool isEmpty() const;
    // The value in the field's unit; nullopt (and the field marked) when it does not parse.
    // An empty field is nullopt without a mark when `optional`.
    std::optional<double> value(bool optional = false);
    // Several values separated by ";" (or "," without the decimal comma), e.g. "1; 10; 100 V";
    // nullopt (and the field marked, naming the item) when one does not parse.
    std::optional<std::vector<double>> values();
    // Writes `value` in the field's unit as a person would type it (with the decimal comma
    // when the lab writes one).
    void setValue(double value);
    // Marks the field with `reason` (e.g. the engine's refusal of a value that parsed).
    void refuse(const QString& reason);
    QString reason() const;
    void setDecimalComma(bool decimalComma) { decimalComma_ = decimalComma; }

signals:
    void edited();

private:
    void clearMark();

    QLineEdit* line_;
    QLabel* reason_;
    QAction* mark_;
    Unit unit_;
    bool decimalComma_ = false;
};

// Results as label/value rows. Each value is a QLabel named "result_<key>" whose "value"
// property holds the number it shows (absent while there is no result).
class ResultList : public QWidget {
    Q_OBJECT
public:
    explicit ResultList(QWidget* parent = nullptr);

    void addRow(const char* key, const QString& label);
    void set(const char* key, double value, Unit unit, int digits = 5);
    void setText(const char* key, const QString& text);
    // A number shown in words of its own ("9.53 kΩ + trim 47 Ω").
    void set(const char* key, double value, const QString& text);
    // Every row back to "—" with no number: the inputs give no result.
    void clear();
    std::optional<double> value(const char* key) const;
    QString text(const char* key) const;

private:
    QFormLayout* form_;
    std::map<std::string, QLabel*> values_;
};

// Engineering notation of core (the one number format) as a QString.
QString engineering(double value, Unit unit, int digits = 5);

} // namespace mw::gui
