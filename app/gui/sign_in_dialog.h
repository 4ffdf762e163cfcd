// Signing in to the open workbook: login and password, a refusal that never says which of the
// two was wrong, and repeated wrong attempts slowed down.
#pragma once

#include "app/gui/sign_in_throttle.h"

#include <QDialog>

class QLabel;
class QLineEdit;
class QPushButton;
class QTimer;

namespace mw::gui {

class Workspace;

class SignInDialog : public QDialog {
    Q_OBJECT
public:
    SignInDialog(Workspace& workspace, SignInThrottle& throttle, QWidget* parent = nullptr);

    // For tests and scripted use: fills the fields and presses Sign in.
    void attempt(const QString& login, const QString& password);
    QString message() const;

private:
    void trySignIn();
    void updateWait();

    Workspace& workspace_;
    SignInThrottle& throttle_;
    QLineEdit* login_ = nullptr;
    QLineEdit* password_ = nullptr;
    QLabel* message_ = nullptr;
    QPushButton* signIn_ = nullptr;
    QTimer* countdown_ = nullptr;
};

} // namespace mw::gui
