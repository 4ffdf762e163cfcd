// Adding, editing or recalibrating a reference standard: identity, certificate (number, day of
// calibration, due date) and the specification of each range it covers, typed in the engine's
// forms (0.004%rdg+0.0008%rng, 20ppm+5ppm, 0.5mV, U=1mV,k=2,dof=8). Recalibration records a
// new certificate; the records that used the old one keep their own copy of it.
#pragma once

#include "core/model/reference_standard.h"

#include <QDialog>

#include <optional>

class QCheckBox;
class QDateEdit;
class QLabel;
class QLineEdit;
class QPushButton;
class QTableWidget;

namespace mw::gui {

class Workspace;

class StandardEditor : public QDialog {
    Q_OBJECT
public:
    enum class Mode { New, Edit, Recalibrate };

    StandardEditor(Workspace& workspace, std::optional<ReferenceStandard> standard, Mode mode,
                   QWidget* parent = nullptr);

    // Checks and saves; false with the reasons shown and nothing saved.
    bool save();
    std::int64_t savedId() const { return savedId_; }
    QString message() const;
    QStringList problems() const;
    QTableWidget* ranges() const { return ranges_; }
    void addRange(Unit unit);

private:
    void build();
    void fill(const ReferenceStandard& standard);
    std::optional<ReferenceStandard> typed(QStringList* problems) const;
    void check();

    Workspace& workspace_;
    std::optional<ReferenceStandard> original_;
    Mode mode_;
    std::int64_t savedId_ = 0;
    QLineEdit* tag_ = nullptr;
    QLineEdit* description_ = nullptr;
    QLineEdit* certificate_ = nullptr;
    QCheckBox* calibratedKnown_ = nullptr;
    QDateEdit* calibrated_ = nullptr;
    QDateEdit* due_ = nullptr;
    QTableWidget* ranges_ = nullptr;
    QLabel* problems_ = nullptr;
    QLabel* message_ = nullptr;
    QPushButton* save_ = nullptr;
};

} // namespace mw::gui
