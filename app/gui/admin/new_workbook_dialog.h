// Workbook → New: where the file goes, the lab's name and address (printed on records), and the
// first administrator with a password typed twice. The workbook is written only on Create, and
// completely or not at all.
#pragma once

#include <QDialog>

class QLabel;
class QLineEdit;
class QPlainTextEdit;
class QPushButton;

namespace mw::gui {

class PasswordFields;

class NewWorkbookDialog : public QDialog {
    Q_OBJECT
public:
    explicit NewWorkbookDialog(QWidget* parent = nullptr);

    // After Create succeeded: the file written, and who to sign in as.
    QString path() const;
    QString login() const;
    QString password() const;

    // Fills the fields (tests and scripted use); create() then writes the workbook, returning
    // false with the reason shown in the dialog.
    void fill(const QString& path, const QString& lab, const QString& address, const QString& login,
              const QString& name, const QString& password);
    bool create();
    QString message() const;

private:
    void updateState();

    QLineEdit* path_ = nullptr;
    QLineEdit* lab_ = nullptr;
    QPlainTextEdit* address_ = nullptr;
    QLineEdit* login_ = nullptr;
    QLineEdit* name_ = nullptr;
    PasswordFields* password_ = nullptr;
    QLabel* message_ = nullptr;
    QPushButton* create_ = nullptr;
};

} // namespace mw::gui
