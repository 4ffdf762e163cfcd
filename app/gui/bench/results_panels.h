// Two read-only panels beside the grid: the uncertainty budget of the point under the cursor
// (components, values, divisors, sensitivities, ν, then u_c, ν_eff, k and U) and the engine's
// adjustment advice for the range (likely cause in plain words, the corrected resistor with
// its nearest standard value and trim).
#pragma once

#include "core/evaluation/evaluation.h"

#include <QWidget>

#include <optional>

class QLabel;
class QTableWidget;

namespace mw::gui {

class BudgetPanel : public QWidget {
    Q_OBJECT
public:
    explicit BudgetPanel(QWidget* parent = nullptr);
    // The budget of one point, or a hint when none is chosen.
    void showPoint(const std::optional<PointResult>& point, Unit unit, const QString& title);

    QTableWidget* table() const { return table_; }
    QString summary() const;

private:
    QLabel* title_ = nullptr;
    QTableWidget* table_ = nullptr;
    QLabel* summary_ = nullptr;
};

class AdvicePanel : public QWidget {
    Q_OBJECT
public:
    explicit AdvicePanel(QWidget* parent = nullptr);
    void showResult(const std::optional<EvaluationResult>& result, Unit unit, bool isShunt);
    QString text() const;

private:
    QLabel* text_ = nullptr;
};

} // namespace mw::gui
