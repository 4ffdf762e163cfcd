// The sign-in dialog.
#include "app/gui/sign_in_dialog.h"

#include "app/gui/workspace.h"

#include <QDialogButtonBox>
#include <QFileInfo>
#include <QFormLayout>
#include <QLabel>
#include <QLineEdit>
#include <QPushButton>
#include <QTimer>
#include <QVBoxLayout>

namespace mw::gui {

SignInDialog::SignInDialog(Workspace& workspace, SignInThrottle& throttle, QWidget* parent)
    : QDialog(parent)
    , workspace_(workspace)
    , throttle_(throttle) {
    setObjectName(QStringLiteral("signInDialog"));
    setWindowTitle(tr("Sign in"));
    auto* layout = new QVBoxLayout(this);
    auto* intro = new QLabel(
        tr("Sign in to <b>%1</b>. Your name goes on everything you save.")
            .arg(QFileInfo(workspace.workbook() ? workspace.workbook()->path() : QString())
                     .fileName()
                     .toHtmlEscaped()),
        this);
    intro->setWordWrap(true);
    layout->addWidget(intro);
    auto* form = new QFormLayout;
    login_ = new QLineEdit(this);
    login_->setObjectName(QStringLiteral("login"));
    password_ = new QLineEdit(this);
    password_->setObjectName(QStringLiteral("password"));
    password_->setEchoMode(QLineEdit::Password);
    form->addRow(tr("&Login:"), login_);
    form->addRow(tr("&Password:"), password_);
    layout->addLayout(form);
    message_ = new QLabel(this);
    message_->setObjectName(QStringLiteral("signInMessage"));
    message_->setWordWrap(true);
    layout->addWidget(message_);
    auto* buttons = new QDialogButtonBox(QDialogButtonBox::Cancel, this);
    signIn_ = buttons->addButton(tr("&Sign in"), QDialogButtonBox::AcceptRole);
    signIn_->setDefault(true);
    layout->addWidget(buttons);
    connect(buttons, &QDialogButtonBox::accepted, this, &SignInDialog::trySignIn);
    connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
    countdown_ = new QTimer(this);
    countdown_->setInterval(250);
    connect(countdown_, &QTimer::timeout, this, &SignInDialog::updateWait);
    updateWait();
}

void SignInDialog::attempt(const QString& login, const QString& password) {
    login_->setText(login);
    password_->setText(password);
    trySignIn();
}

QString SignInDialog::message() const {
    return message_->text();
}

void SignInDialog::trySignIn() {
    const auto wait = throttle_.waitBefore(SignInThrottle::Clock::now());
    if (wait.count() > 0) {
        updateWait();
        return;
    }
    if (workspace_.signIn(login_->text().trimmed(), password_->text())) {
        throttle_.recordSuccess();
        password_->clear();
        accept();
        return;
    }
    throttle_.recordFailure(SignInThrottle::Clock::now());
    password_->clear();
    password_->setFocus();
    // Never which of the two: that would tell a stranger which logins exist.
    message_->setText(tr("✖ Login or password not accepted. Check both and try again."));
    updateWait();
}

void SignInDialog::updateWait() {
    const auto wait = throttle_.waitBefore(SignInThrottle::Clock::now());
    const bool waiting = wait.count() > 0;
    signIn_->setEnabled(!waiting);
    if (waiting) {
        message_->setText(tr("✖ Login or password not accepted. Too many tries: wait %1 s.")
                              .arg((wait.count() + 999) / 1000));
        if (!countdown_->isActive()) {
            countdown_->start();
        }
    } else if (countdown_->isActive()) {
        countdown_->stop();
        message_->setText(tr("You may try again."));
    }
}

} // namespace mw::gui
