// Password fields with the policy of storage/new_workbook.h.
#include "app/gui/admin/password_fields.h"

#include "storage/new_workbook.h"

#include <QFormLayout>
#include <QLabel>
#include <QLineEdit>

namespace mw::gui {

PasswordFields::PasswordFields(QFormLayout* form, QWidget* parent)
    : QObject(parent) {
    first_ = new QLineEdit(parent);
    first_->setObjectName(QStringLiteral("newPassword"));
    first_->setEchoMode(QLineEdit::Password);
    second_ = new QLineEdit(parent);
    second_->setObjectName(QStringLiteral("repeatPassword"));
    second_->setEchoMode(QLineEdit::Password);
    reason_ = new QLabel(parent);
    reason_->setObjectName(QStringLiteral("passwordReason"));
    reason_->setWordWrap(true);
    form->addRow(tr("New password:"), first_);
    form->addRow(tr("The same again:"), second_);
    form->addRow(QString(), reason_);
    connect(first_, &QLineEdit::textChanged, this, &PasswordFields::update);
    connect(second_, &QLineEdit::textChanged, this, &PasswordFields::update);
    update();
}

QString PasswordFields::password() const {
    return first_->text();
}

QString PasswordFields::problem() const {
    if (const QString problem = storage::passwordProblem(first_->text()); !problem.isEmpty()) {
        return problem;
    }
    if (second_->text() != first_->text()) {
        return tr("the two passwords differ");
    }
    return {};
}

void PasswordFields::clear() {
    first_->clear();
    second_->clear();
}

void PasswordFields::update() {
    const QString why = problem();
    // Words and a mark, not colour alone; nothing is said before anything is typed.
    reason_->setText(first_->text().isEmpty()
                         ? tr("At least %1 characters.").arg(storage::kMinimumPasswordLength)
                     : why.isEmpty() ? tr("✔ The password can be used.")
                                     : tr("✖ %1").arg(why));
    emit changed();
}

} // namespace mw::gui
