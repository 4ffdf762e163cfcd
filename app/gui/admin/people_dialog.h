// People of the workbook, for administrators: add a person (login, name, role, a first
// password), deactivate one (never delete: records keep their signatures), reset a password.
// Also the dialog where anyone changes their own password.
#pragma once

#include "core/model/vocabulary.h"

#include <QDialog>

#include <cstdint>

class QComboBox;
class QLabel;
class QLineEdit;
class QPushButton;
class QTableWidget;

namespace mw::gui {

class PasswordFields;
class Workspace;

class PeopleDialog : public QDialog {
    Q_OBJECT
public:
    PeopleDialog(Workspace& workspace, QWidget* parent = nullptr);

    // The actions behind the buttons, for tests and scripted use; false with the reason shown.
    bool addPerson(const QString& login, const QString& name, Role role, const QString& password);
    bool deactivate(const QString& login);
    bool resetPassword(const QString& login, const QString& password);
    QTableWidget* table() const { return table_; }
    QString message() const;

private:
    void reload();
    QString selectedLogin() const;
    void report(bool ok, const QString& text);

    Workspace& workspace_;
    QTableWidget* table_ = nullptr;
    QPushButton* add_ = nullptr;
    QPushButton* deactivate_ = nullptr;
    QPushButton* reset_ = nullptr;
    QLabel* message_ = nullptr;
};

// Asks for the current password and a new one typed twice.
class OwnPasswordDialog : public QDialog {
    Q_OBJECT
public:
    OwnPasswordDialog(Workspace& workspace, QWidget* parent = nullptr);
    bool change(const QString& current, const QString& replacement);
    QString message() const;

private:
    Workspace& workspace_;
    QLineEdit* current_ = nullptr;
    PasswordFields* fields_ = nullptr;
    QLabel* message_ = nullptr;
};

} // namespace mw::gui
