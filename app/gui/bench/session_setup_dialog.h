// Setting up a calibration: which ranges, which phases, the reference standards (an overdue one
// only with a written justification), the environment, the decision rule and the method. Used to
// start a calibration and to change the set-up of one in progress.
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/reference_standard.h"

#include <QDialog>

#include <chrono>
#include <optional>
#include <vector>

class QComboBox;
class QDoubleSpinBox;
class QLabel;
class QLineEdit;
class QListWidget;
class QPlainTextEdit;
class QSpinBox;

namespace mw::gui {

struct SessionSetup {
    std::vector<std::int64_t> ranges; // the instrument's ranges to calibrate
    PhasePlan phases = PhasePlan::AsFound;
    int repeats = 1;
    std::vector<StandardUse> standards; // certificate copied by the workbook when saved
    Environment environment;
    DecisionRule rule = DecisionRule::SimpleAcceptance;
    double guardFactor = 0.0;
    EvaluationSettings settings;
    std::string method;
};

class SessionSetupDialog : public QDialog {
    Q_OBJECT
public:
    // `current`: the session whose set-up is changed (its ranges with readings cannot be
    // dropped), or nullopt to start a new one. Overdue is judged against `today`.
    SessionSetupDialog(const Instrument& instrument,
                       const std::vector<ReferenceStandard>& standards,
                       const std::optional<CalibrationSession>& current,
                       std::chrono::sys_days today, QWidget* parent = nullptr);

    // The set-up as entered; call after the dialog was accepted.
    SessionSetup setup() const;

    // Checks what was entered: empty when it can be saved, else what is missing.
    QString problem() const;

    // For tests: tick or untick a range or standard by its row, set a justification.
    QListWidget* rangeList() const { return ranges_; }
    QListWidget* standardList() const { return standards_; }
    QLineEdit* justification() const { return justification_; }
    QComboBox* ruleBox() const { return rule_; }
    QDoubleSpinBox* guardBox() const { return guard_; }

    void accept() override;

private:
    QWidget* buildStandards(const std::vector<ReferenceStandard>& standards,
                            const std::optional<CalibrationSession>& current,
                            std::chrono::sys_days today);
    QWidget* buildJudgement(const std::optional<CalibrationSession>& current);
    void updateState();

    const Instrument& instrument_;
    std::vector<std::int64_t> lockedRanges_; // ranges with readings: cannot be dropped
    QListWidget* ranges_ = nullptr;
    QComboBox* phases_ = nullptr;
    QSpinBox* repeats_ = nullptr;
    QListWidget* standards_ = nullptr;
    QLineEdit* justification_ = nullptr;
    QDoubleSpinBox* ambient_ = nullptr;
    QDoubleSpinBox* humidity_ = nullptr;
    QComboBox* rule_ = nullptr;
    QDoubleSpinBox* guard_ = nullptr;
    QDoubleSpinBox* readability_ = nullptr;
    QComboBox* probability_ = nullptr;
    QPlainTextEdit* method_ = nullptr;
    QLabel* problem_ = nullptr;
};

} // namespace mw::gui
