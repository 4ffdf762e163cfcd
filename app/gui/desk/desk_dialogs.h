// The two small dialogs of the supervisor's pages: a signature (the person's own password,
// typed again to approve) and a required comment (why a calibration is returned, why a record
// is amended). Both stay open after a refusal, saying why, so nothing typed is lost.
#pragma once

#include <QDialog>

class QDialogButtonBox;
class QLabel;
class QLineEdit;
class QPlainTextEdit;

namespace mw::gui {

class SignatureDialog : public QDialog {
    Q_OBJECT
public:
    // `what` says in one sentence what the signature approves.
    SignatureDialog(const QString& what, QWidget* parent = nullptr);
    QString password() const;
    // Shows why the last attempt was refused and clears the password for another try.
    void showRefusal(const QString& reason);

private:
    QLineEdit* password_ = nullptr;
    QLabel* refusal_ = nullptr;
    QDialogButtonBox* buttons_ = nullptr;
};

class CommentDialog : public QDialog {
    Q_OBJECT
public:
    CommentDialog(const QString& title, const QString& prompt, QWidget* parent = nullptr);
    QString text() const;
    void showRefusal(const QString& reason);
    QPlainTextEdit* editor() const { return text_; }

private:
    QPlainTextEdit* text_ = nullptr;
    QLabel* refusal_ = nullptr;
    QDialogButtonBox* buttons_ = nullptr;
};

} // namespace mw::gui
