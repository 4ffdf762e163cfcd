// The register page: the instruments of the workbook with their due state, the detail of the one
// selected, and what can be done with it (start a calibration, continue the open one, view the
// one awaiting review). Reads through the workspace; changes nothing itself.
#pragma once

#include <QWidget>

#include <cstdint>
#include <optional>

class QLabel;
class QPushButton;
class QStackedWidget;
class QTableView;

namespace mw::gui {

class InstrumentDetailPanel;
class InstrumentListModel;
class Workspace;

class RegisterPage : public QWidget {
    Q_OBJECT
public:
    explicit RegisterPage(Workspace& workspace, QWidget* parent = nullptr);

    // Reads the register again (throws what the workbook throws; the window reports it).
    void reload();
    InstrumentListModel* model() const { return model_; }
    InstrumentDetailPanel* detail() const { return detail_; }
    QTableView* list() const { return list_; }
    std::optional<std::int64_t> selectedInstrument() const;
    // The open calibration (draft, returned or submitted) of the selected instrument.
    std::optional<std::int64_t> openSessionOfSelected() const;
    bool selectByTag(const QString& tag);
    // Enables what the person signed in may do with the selected instrument (cheap: no reload).
    void updateActions();

signals:
    void startRequested(qint64 instrumentId);
    void openRequested(qint64 sessionId);
    void statusMessage(const QString& text);

private:
    void showSelected();
    void updateEmptyState();

    Workspace& workspace_;
    InstrumentListModel* model_ = nullptr;
    QTableView* list_ = nullptr;
    InstrumentDetailPanel* detail_ = nullptr;
    QStackedWidget* stack_ = nullptr;
    QPushButton* start_ = nullptr;
    QPushButton* open_ = nullptr;
    QLabel* openNote_ = nullptr;
};

} // namespace mw::gui
