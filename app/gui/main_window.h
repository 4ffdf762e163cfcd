// The main window: menu bar, the instrument register, and a status bar.
#pragma once

#include <QMainWindow>

class QLabel;
class QTableView;

namespace mw::gui {

class InstrumentListModel;

class MainWindow : public QMainWindow {
    Q_OBJECT
public:
    explicit MainWindow(QWidget* parent = nullptr);

    InstrumentListModel* instrumentModel() const { return instrumentModel_; }

public slots:
    void showAbout();

private:
    void buildMenus();
    void buildRegister();
    void updateEmptyState();

    InstrumentListModel* instrumentModel_ = nullptr;
    QTableView* instrumentView_ = nullptr;
    QLabel* emptyStateLabel_ = nullptr;
};

} // namespace mw::gui
