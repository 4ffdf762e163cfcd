// The register page: the instruments of the workbook with their due state, the detail of the one
// selected, and what can be done with it (start a calibration, continue the open one, view the
// one awaiting review). Reads through the workspace; changes nothing itself.
#pragma once

#include <QWidget>

#include <cstdint>
#include <optional>

class QComboBox;
class QHBoxLayout;
class QLabel;
class QLineEdit;
class QPushButton;
class QStackedWidget;
class QTableView;

namespace mw::gui {

class InstrumentDetailPanel;
class InstrumentListModel;
class RegisterFilter;
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
    // Selects the instrument if the filter shows it.
    bool selectInstrument(std::int64_t instrumentId);
    RegisterFilter* filter() const { return filter_; }
    QLineEdit* search() const { return search_; }
    // Enables what the person signed in may do with the selected instrument (cheap: no reload).
    void updateActions();

signals:
    void startRequested(qint64 instrumentId);
    void editRequested(std::optional<std::int64_t> instrumentId); // nullopt: a new one
    void openRequested(qint64 sessionId);
    void statusMessage(const QString& text);

private:
    void showSelected();
    QHBoxLayout* buildFilterBar();
    void fillLocations();
    void updateEmptyState();

    Workspace& workspace_;
    InstrumentListModel* model_ = nullptr;
    RegisterFilter* filter_ = nullptr;
    QLineEdit* search_ = nullptr;
    QComboBox* kindFilter_ = nullptr;
    QComboBox* locationFilter_ = nullptr;
    QComboBox* dueFilter_ = nullptr;
    QComboBox* outcomeFilter_ = nullptr;
    QPushButton* add_ = nullptr;
    QPushButton* edit_ = nullptr;
    QTableView* list_ = nullptr;
    InstrumentDetailPanel* detail_ = nullptr;
    QStackedWidget* stack_ = nullptr;
    QPushButton* start_ = nullptr;
    QPushButton* open_ = nullptr;
    QLabel* openNote_ = nullptr;
};

} // namespace mw::gui
