// The bench's record-keeping panels: resistor checks (the multiplier or shunt the engine
// designs beside the one measured, with its deviation and verdict against the resistor's
// tolerance), adjustment notes (time-stamped free text between as-found and as-left) and the
// session log (what was saved when, and by whom, from the audit log).
#pragma once

#include <QWidget>

#include <cstdint>

class QComboBox;
class QDoubleSpinBox;
class QLabel;
class QLineEdit;
class QListWidget;
class QPlainTextEdit;
class QPushButton;
class QTableWidget;

namespace mw::gui {

class BenchSession;
class Workspace;

class ResistorPanel : public QWidget {
    Q_OBJECT
public:
    ResistorPanel(Workspace& workspace, QWidget* parent = nullptr);
    void showSession(const BenchSession& bench);

    // Records a measured value typed as on the bench ("9k93"); false with the reason in
    // `message` when it does not parse or the workbook refuses.
    bool recordMeasured(const QString& text, QString* message);
    QTableWidget* checks() const { return checks_; }

signals:
    void statusMessage(const QString& text);

private:
    void showDesign();

    Workspace& workspace_;
    const BenchSession* bench_ = nullptr;
    QComboBox* range_ = nullptr;
    QLabel* designed_ = nullptr;
    QLineEdit* measured_ = nullptr;
    QDoubleSpinBox* tolerance_ = nullptr;
    QPushButton* record_ = nullptr;
    QTableWidget* checks_ = nullptr;
    QPushButton* remove_ = nullptr;
};

class NotesPanel : public QWidget {
    Q_OBJECT
public:
    NotesPanel(Workspace& workspace, QWidget* parent = nullptr);
    void showSession(const BenchSession& bench);
    bool addNote(const QString& text, QString* message);
    QListWidget* notes() const { return notes_; }

signals:
    void statusMessage(const QString& text);

private:
    Workspace& workspace_;
    std::int64_t sessionId_ = 0;
    QListWidget* notes_ = nullptr;
    QPlainTextEdit* text_ = nullptr;
    QPushButton* add_ = nullptr;
    QPushButton* remove_ = nullptr;
};

class SessionLogPanel : public QWidget {
    Q_OBJECT
public:
    SessionLogPanel(Workspace& workspace, QWidget* parent = nullptr);
    void showSession(std::int64_t sessionId);
    QTableWidget* table() const { return table_; }

private:
    Workspace& workspace_;
    QTableWidget* table_ = nullptr;
};

} // namespace mw::gui
