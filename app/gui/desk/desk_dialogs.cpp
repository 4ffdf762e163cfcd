#include "app/gui/desk/desk_dialogs.h"

#include <QDialogButtonBox>
#include <QLabel>
#include <QLineEdit>
#include <QPlainTextEdit>
#include <QPushButton>
#include <QVBoxLayout>

namespace mw::gui {
namespace {

QLabel* refusalLabel(QWidget* parent) {
    auto* label = new QLabel(parent);
    label->setObjectName(QStringLiteral("refusal"));
    label->setWordWrap(true);
    label->hide();
    return label;
}

} // namespace

SignatureDialog::SignatureDialog(const QString& what, QWidget* parent)
    : QDialog(parent) {
    setObjectName(QStringLiteral("signatureDialog"));
    setWindowTitle(tr("Sign the approval"));
    auto* layout = new QVBoxLayout(this);
    auto* intro = new QLabel(what + QStringLiteral("\n\n") +
                                 tr("Type your password: it is your signature on the record. "
                                    "Once approved, the record is sealed and can only be "
                                    "corrected by an amendment."),
                             this);
    intro->setWordWrap(true);
    layout->addWidget(intro);
    password_ = new QLineEdit(this);
    password_->setObjectName(QStringLiteral("signaturePassword"));
    password_->setEchoMode(QLineEdit::Password);
    password_->setPlaceholderText(tr("Your password"));
    layout->addWidget(password_);
    refusal_ = refusalLabel(this);
    layout->addWidget(refusal_);
    buttons_ = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel, this);
    buttons_->button(QDialogButtonBox::Ok)->setText(tr("Approve"));
    buttons_->button(QDialogButtonBox::Ok)->setEnabled(false);
    layout->addWidget(buttons_);
    connect(password_, &QLineEdit::textChanged, this, [this](const QString& text) {
        buttons_->button(QDialogButtonBox::Ok)->setEnabled(!text.isEmpty());
    });
    connect(buttons_, &QDialogButtonBox::accepted, this, &QDialog::accept);
    connect(buttons_, &QDialogButtonBox::rejected, this, &QDialog::reject);
    resize(460, sizeHint().height());
}

QString SignatureDialog::password() const {
    return password_->text();
}

void SignatureDialog::showRefusal(const QString& reason) {
    refusal_->setText(QStringLiteral("✖ ") + reason);
    refusal_->show();
    password_->clear();
    password_->setFocus();
}

CommentDialog::CommentDialog(const QString& title, const QString& prompt, QWidget* parent)
    : QDialog(parent) {
    setObjectName(QStringLiteral("commentDialog"));
    setWindowTitle(title);
    auto* layout = new QVBoxLayout(this);
    auto* intro = new QLabel(prompt, this);
    intro->setWordWrap(true);
    layout->addWidget(intro);
    text_ = new QPlainTextEdit(this);
    text_->setObjectName(QStringLiteral("commentText"));
    text_->setTabChangesFocus(true);
    layout->addWidget(text_);
    refusal_ = refusalLabel(this);
    layout->addWidget(refusal_);
    buttons_ = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel, this);
    buttons_->button(QDialogButtonBox::Ok)->setEnabled(false);
    buttons_->button(QDialogButtonBox::Ok)->setToolTip(tr("Write the comment first"));
    layout->addWidget(buttons_);
    connect(text_, &QPlainTextEdit::textChanged, this,
            [this] { buttons_->button(QDialogButtonBox::Ok)->setEnabled(!text().isEmpty()); });
    connect(buttons_, &QDialogButtonBox::accepted, this, &QDialog::accept);
    connect(buttons_, &QDialogButtonBox::rejected, this, &QDialog::reject);
    resize(480, 260);
}

QString CommentDialog::text() const {
    return text_->toPlainText().trimmed();
}

void CommentDialog::showRefusal(const QString& reason) {
    refusal_->setText(QStringLiteral("✖ ") + reason);
    refusal_->show();
}

} // namespace mw::gui
