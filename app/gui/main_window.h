// The main window: menus, the pages (register, bench), the person signed in and what the
// workbook is doing in the background, always visible in the status bar. It owns the workspace
// (the open workbook, the person, the undo stack) and hands it to the pages.
#pragma once

#include "app/gui/sign_in_throttle.h"

#include <QMainWindow>
#include <QSettings>

#include <map>
#include <memory>
#include <optional>

class QAction;
class QLabel;
class QProgressBar;
class QStackedWidget;

namespace mw::storage {
class Workbook;
}

namespace mw::gui {

class BenchView;
class DuePage;
class RangeDesignerView;
class HistoryPage;
class ReviewPage;
class InstrumentDetailPanel;
class InstrumentListModel;
class RegisterPage;
class StandardsPage;
class Workspace;
struct SessionSetup;

class MainWindow : public QMainWindow {
    Q_OBJECT
public:
    explicit MainWindow(QWidget* parent = nullptr);
    ~MainWindow() override;

    Workspace& workspace() { return *workspace_; }
    storage::Workbook* workbook() const;
    RegisterPage* registerPage() const { return register_; }
    BenchView* bench();            // the bench page, built on first use
    StandardsPage* standards();    // the reference standards, built on first use
    ReviewPage* review();          // the review desk, built on first use
    HistoryPage* history();        // one instrument over the years, built on first use
    DuePage* due();                // what is due, built on first use
    RangeDesignerView* designer(); // the range designer, built on first use
    enum class Page { Register, Standards, Bench, Review, History, Due, Designer };
    void showPage(Page page);
    InstrumentListModel* instrumentModel() const;
    InstrumentDetailPanel* detailPanel() const;
    QLabel* personLabel() const { return person_; }

    // Opens the workbook at `path` and shows its register (nobody signed in yet). On failure
    // the previous workbook stays open, nothing is changed on disk, and `error` says why.
    bool openWorkbook(const QString& path, QString* error);
    // Opens and asks who is working; closes the workbook again when nobody signs in.
    bool openAndSignIn(const QString& path);
    // Signs in without the dialog (tests, scripted use); false for a wrong login or password.
    bool signIn(const QString& login, const QString& password);

    // Starts a calibration of `instrumentId` as set up and shows it on the bench.
    bool startCalibration(std::int64_t instrumentId, const SessionSetup& setup, QString* error);
    bool openCalibration(std::int64_t sessionId, QString* error);
    void showRegister();
    void showBench();
    // The history page for the instrument selected in the register.
    void showHistoryOfSelected();
    // Opens the workbook opened last, if it still exists, asking who is working (on start).
    void openLastWorkbook();
    // Writes a new workbook as `dialog`-like fields say and opens it signed in as its
    // administrator (NewWorkbookDialog::create() has written it).
    bool openNewWorkbook(const QString& path, const QString& login, const QString& password);

public slots:
    void showAbout();
    void chooseWorkbook();
    void backUpNow();
    void promptSignIn();
    void signOut();
    void askForNewWorkbook();
    void showPeople();
    void changeOwnPassword();
    // Opens the instrument editor (nullopt: a new instrument); the register follows the save.
    void editInstrument(std::optional<std::int64_t> instrumentId);

protected:
    void closeEvent(QCloseEvent* event) override;

private:
    void buildMenus();
    void buildPages();
    void buildStatusBar();
    void updateForPerson();
    void reloadRegisterQuietly();
    void askToStart(qint64 instrumentId);
    void askToChangeSetup();
    void askToSubmit();
    void exportChart();
    void report(const QString& text);
    void fillRecentMenu();
    void buildInstrumentMenu();
    // The record of the calibration on the bench: print with preview, or export as PDF.
    void printOrExportRecord(bool toPdf);
    // The calibration the page shown is about (bench, review, history), if any.
    std::optional<std::int64_t> sessionOnShow() const;
    void printOrExportHistory(std::int64_t instrumentId, bool toPdf);

    std::unique_ptr<Workspace> workspace_;
    SignInThrottle throttle_;
    QStackedWidget* pages_ = nullptr;
    RegisterPage* register_ = nullptr;
    BenchView* bench_ = nullptr;
    StandardsPage* standards_ = nullptr;
    ReviewPage* review_ = nullptr;
    HistoryPage* history_ = nullptr;
    DuePage* due_ = nullptr;
    RangeDesignerView* designer_ = nullptr;
    std::map<Page, QAction*> pageActions_;
    QAction* startAction_ = nullptr;
    QAction* signOutAction_ = nullptr;
    QAction* peopleAction_ = nullptr;
    QAction* ownPasswordAction_ = nullptr;
    QMenu* recentMenu_ = nullptr;
    QSettings settings_;
    QLabel* person_ = nullptr;
    QProgressBar* busy_ = nullptr;
};

} // namespace mw::gui
