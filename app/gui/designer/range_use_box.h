// "Use for this range": copies a multiplier or shunt the designer computed into one range of an
// instrument on the register, as an audited edit by a signed-in administrator. It refuses a
// value designed for another kind of range, another full scale or another movement, and an
// instrument that approved calibration records rest on.
#pragma once

#include "app/gui/designer/designer_panel.h"
#include "core/model/instrument.h"

#include <QGroupBox>

#include <optional>
#include <vector>

class QComboBox;
class QLabel;
class QPushButton;

namespace mw::gui {

class Workspace;

class RangeUseBox : public QGroupBox {
    Q_OBJECT
public:
    RangeUseBox(Workspace& workspace, QWidget* parent = nullptr);

    // Reads the register again, keeping the instrument and range chosen.
    void reload();
    // The value the panel shown now designed (nullopt: none, or no result).
    void setDesigned(std::optional<DesignedValue> designed);
    // Chooses an instrument and range by asset tag and label; false when there is none such.
    bool choose(const QString& assetTag, const QString& rangeLabel);
    // Saves the designed value into the chosen range; false with the reason in message().
    bool use();
    QString message() const;
    QPushButton* useButton() const { return use_; }

signals:
    void saved(qint64 instrumentId, qint64 rangeId);
    // "Take this range's values": the designer takes the instrument's movement and the range.
    void rangeTaken(const mw::Instrument& instrument, const mw::RangeSpec& range);

private:
    void fillRanges();
    const Instrument* instrument() const;
    const RangeSpec* range() const;
    // Why the designed value cannot go into the chosen range, or "" when it can.
    QString refusal() const;
    void showState();

    Workspace& workspace_;
    std::vector<Instrument> instruments_;
    std::optional<DesignedValue> designed_;
    bool frozen_ = false; // approved records rest on the chosen instrument
    QString savedNote_;   // what the last save did, shown until the choice or value changes
    QComboBox* instrument_;
    QComboBox* range_;
    QPushButton* take_;
    QPushButton* use_;
    QLabel* designedLine_;
    QLabel* message_;
};

} // namespace mw::gui
