// The reference standards of the lab: certificate, day of calibration, due date and whether the
// standard may be used today (an overdue one is marked "not usable" in words and by a shape),
// with the specification of each range of the one selected. Administrators add, edit and record
// a recalibration.
#pragma once

#include <QWidget>

#include <cstdint>
#include <optional>

class QLabel;
class QPushButton;
class QTableWidget;

namespace mw::gui {

class Workspace;

class StandardsPage : public QWidget {
    Q_OBJECT
public:
    StandardsPage(Workspace& workspace, QWidget* parent = nullptr);

    void reload();
    QTableWidget* list() const { return list_; }
    QTableWidget* ranges() const { return ranges_; }
    std::optional<std::int64_t> selectedStandard() const;
    bool selectByTag(const QString& tag);

signals:
    void statusMessage(const QString& text);

private:
    void showSelected();
    void updateActions();
    void openEditor(int mode);

    Workspace& workspace_;
    QTableWidget* list_ = nullptr;
    QTableWidget* ranges_ = nullptr;
    QLabel* note_ = nullptr;
    QPushButton* add_ = nullptr;
    QPushButton* edit_ = nullptr;
    QPushButton* recalibrate_ = nullptr;
};

} // namespace mw::gui
