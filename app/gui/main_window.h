// The main window: menu bar, the instrument register with its detail, and a status bar.
#pragma once

#include <QMainWindow>

#include <memory>

class QLabel;
class QStackedWidget;
class QTableView;

namespace mw::storage {
class Workbook;
}

namespace mw::gui {

class InstrumentDetailPanel;
class InstrumentListModel;

class MainWindow : public QMainWindow {
    Q_OBJECT
public:
    explicit MainWindow(QWidget* parent = nullptr);
    ~MainWindow() override;

    InstrumentListModel* instrumentModel() const { return instrumentModel_; }
    InstrumentDetailPanel* detailPanel() const { return detailPanel_; }
    storage::Workbook* workbook() const { return workbook_.get(); }

    // Opens the workbook at `path` and shows its register. On failure the previous workbook
    // stays open, nothing is changed on disk, and `error` says why.
    bool openWorkbook(const QString& path, QString* error);

public slots:
    void showAbout();
    void chooseWorkbook();
    void backUpNow();

private:
    void buildMenus();
    // Writes the daily automatic backup if one is due; returns what to tell the user.
    QString takeAutomaticBackup();
    void buildRegister();
    // Throws what the workbook throws; reloadRegisterQuietly() closes the workbook instead.
    void reloadRegister();
    void reloadRegisterQuietly();
    void showSelectedInstrument();
    void updateEmptyState();

    std::unique_ptr<storage::Workbook> workbook_;
    InstrumentListModel* instrumentModel_ = nullptr;
    QTableView* instrumentView_ = nullptr;
    InstrumentDetailPanel* detailPanel_ = nullptr;
    QStackedWidget* registerStack_ = nullptr;
    QLabel* emptyStateLabel_ = nullptr;
};

} // namespace mw::gui
