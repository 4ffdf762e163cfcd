// The people dialog and the own-password dialog.
#include "app/gui/admin/people_dialog.h"

#include "app/gui/admin/password_fields.h"
#include "app/gui/workspace.h"
#include "storage/new_workbook.h"
#include "storage/user_repository.h"

#include <QComboBox>
#include <QDialogButtonBox>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QLineEdit>
#include <QPushButton>
#include <QTableWidget>
#include <QVBoxLayout>

namespace mw::gui {
namespace {

QString roleText(Role role) {
    return QString::fromUtf8(displayName(role).data());
}

// A small form dialog: `build` adds rows to the form; OK runs `act`, which returns the reason
// it refused (the dialog then stays open, nothing lost) or an empty string.
template <typename Build, typename Act>
bool askInForm(QWidget* parent, const QString& title, Build build, Act act) {
    QDialog dialog(parent);
    dialog.setWindowTitle(title);
    auto* layout = new QVBoxLayout(&dialog);
    auto* form = new QFormLayout;
    build(form, &dialog);
    layout->addLayout(form);
    auto* reason = new QLabel(&dialog);
    reason->setWordWrap(true);
    layout->addWidget(reason);
    auto* buttons = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel, &dialog);
    layout->addWidget(buttons);
    QObject::connect(buttons, &QDialogButtonBox::accepted, &dialog, [&] {
        const QString why = act();
        if (why.isEmpty()) {
            dialog.accept();
        } else {
            reason->setText(QObject::tr("✖ %1").arg(why));
        }
    });
    QObject::connect(buttons, &QDialogButtonBox::rejected, &dialog, &QDialog::reject);
    return dialog.exec() == QDialog::Accepted;
}

} // namespace

PeopleDialog::PeopleDialog(Workspace& workspace, QWidget* parent)
    : QDialog(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("peopleDialog"));
    setWindowTitle(tr("People"));
    resize(620, 380);
    auto* layout = new QVBoxLayout(this);
    table_ = new QTableWidget(0, 4, this);
    table_->setHorizontalHeaderLabels({tr("Login"), tr("Name"), tr("Role"), tr("Status")});
    table_->setSelectionBehavior(QAbstractItemView::SelectRows);
    table_->setSelectionMode(QAbstractItemView::SingleSelection);
    table_->setEditTriggers(QAbstractItemView::NoEditTriggers);
    table_->horizontalHeader()->setStretchLastSection(true);
    table_->verticalHeader()->hide();
    layout->addWidget(table_, 1);
    auto* actions = new QHBoxLayout;
    add_ = new QPushButton(tr("Add a person…"), this);
    deactivate_ = new QPushButton(tr("Deactivate"), this);
    reset_ = new QPushButton(tr("Reset password…"), this);
    actions->addWidget(add_);
    actions->addWidget(deactivate_);
    actions->addWidget(reset_);
    actions->addStretch();
    layout->addLayout(actions);
    message_ = new QLabel(tr("People are deactivated, never deleted: the records they signed keep "
                             "their names."),
                          this);
    message_->setWordWrap(true);
    layout->addWidget(message_);
    auto* close = new QDialogButtonBox(QDialogButtonBox::Close, this);
    layout->addWidget(close);
    connect(close, &QDialogButtonBox::rejected, this, &QDialog::reject);

    connect(add_, &QPushButton::clicked, this, [this] {
        QLineEdit* login = nullptr;
        QLineEdit* name = nullptr;
        QComboBox* role = nullptr;
        PasswordFields* password = nullptr;
        askInForm(
            this, tr("Add a person"),
            [&](QFormLayout* form, QWidget* owner) {
                login = new QLineEdit(owner);
                name = new QLineEdit(owner);
                role = new QComboBox(owner);
                for (Role r : {Role::Technician, Role::Reviewer, Role::Administrator}) {
                    role->addItem(roleText(r), int(r));
                }
                form->addRow(tr("Login:"), login);
                form->addRow(tr("Full name:"), name);
                form->addRow(tr("Role:"), role);
                password = new PasswordFields(form, owner);
            },
            [&]() -> QString {
                if (!password->problem().isEmpty()) {
                    return password->problem();
                }
                return addPerson(login->text(), name->text(), Role(role->currentData().toInt()),
                                 password->password())
                           ? QString()
                           : message();
            });
    });
    connect(deactivate_, &QPushButton::clicked, this, [this] { deactivate(selectedLogin()); });
    connect(reset_, &QPushButton::clicked, this, [this] {
        const QString login = selectedLogin();
        PasswordFields* password = nullptr;
        askInForm(
            this, tr("Reset the password of %1").arg(login),
            [&](QFormLayout* form, QWidget* owner) { password = new PasswordFields(form, owner); },
            [&]() -> QString {
                if (!password->problem().isEmpty()) {
                    return password->problem();
                }
                return resetPassword(login, password->password()) ? QString() : message();
            });
    });
    connect(table_, &QTableWidget::itemSelectionChanged, this, [this] {
        deactivate_->setEnabled(!selectedLogin().isEmpty());
        reset_->setEnabled(!selectedLogin().isEmpty());
    });
    reload();
}

QString PeopleDialog::message() const {
    return message_->text();
}

void PeopleDialog::report(bool ok, const QString& text) {
    message_->setText(ok ? tr("✔ %1").arg(text) : tr("✖ %1").arg(text));
}

void PeopleDialog::reload() {
    const QString selected = selectedLogin();
    table_->setRowCount(0);
    for (const User& user : storage::UserRepository(*workspace_.workbook()).all()) {
        const int row = table_->rowCount();
        table_->insertRow(row);
        table_->setItem(row, 0, new QTableWidgetItem(QString::fromStdString(user.login)));
        table_->setItem(row, 1, new QTableWidgetItem(QString::fromStdString(user.full_name)));
        table_->setItem(row, 2, new QTableWidgetItem(roleText(user.role)));
        table_->setItem(row, 3,
                        new QTableWidgetItem(user.active ? tr("active") : tr("⊘ deactivated")));
        if (QString::fromStdString(user.login) == selected) {
            table_->selectRow(row);
        }
    }
    table_->resizeColumnsToContents();
    deactivate_->setEnabled(!selectedLogin().isEmpty());
    reset_->setEnabled(!selectedLogin().isEmpty());
}

QString PeopleDialog::selectedLogin() const {
    const auto rows = table_->selectionModel()->selectedRows();
    return rows.isEmpty() ? QString() : table_->item(rows.front().row(), 0)->text();
}

bool PeopleDialog::addPerson(const QString& login, const QString& name, Role role,
                             const QString& password) {
    try {
        if (!workspace_.can(Capability::Administer)) {
            throw std::runtime_error("only an administrator adds people");
        }
        storage::UserRepository users(*workspace_.workbook());
        if (users.findByLogin(login.trimmed())) {
            throw std::runtime_error(tr("the login \"%1\" is taken").arg(login).toStdString());
        }
        User user{0, login.trimmed().toStdString(), name.trimmed().toStdString(), role, true};
        users.add(user, password);
        reload();
        report(true, tr("%1 added as %2.").arg(login.trimmed(), roleText(role)));
        return true;
    } catch (const std::exception& error) {
        report(false, tr("Not added: %1").arg(QString::fromUtf8(error.what())));
        return false;
    }
}

bool PeopleDialog::deactivate(const QString& login) {
    try {
        storage::UserRepository users(*workspace_.workbook());
        auto user = users.findByLogin(login);
        if (!user) {
            throw std::runtime_error("choose a person first");
        }
        if (workspace_.user() && workspace_.user()->id == user->id) {
            throw std::runtime_error("you cannot deactivate yourself while signed in");
        }
        user->active = false;
        users.update(*user);
        reload();
        report(true, tr("%1 deactivated; the records they signed keep their name.").arg(login));
        return true;
    } catch (const std::exception& error) {
        report(false, tr("Not deactivated: %1").arg(QString::fromUtf8(error.what())));
        return false;
    }
}

bool PeopleDialog::resetPassword(const QString& login, const QString& password) {
    try {
        storage::UserRepository users(*workspace_.workbook());
        const auto user = users.findByLogin(login);
        if (!user) {
            throw std::runtime_error("choose a person first");
        }
        users.setPassword(user->id, password);
        report(true, tr("The password of %1 is reset; tell them in person.").arg(login));
        return true;
    } catch (const std::exception& error) {
        report(false, tr("Not reset: %1").arg(QString::fromUtf8(error.what())));
        return false;
    }
}

OwnPasswordDialog::OwnPasswordDialog(Workspace& workspace, QWidget* parent)
    : QDialog(parent)
    , workspace_(workspace) {
    setObjectName(QStringLiteral("ownPasswordDialog"));
    setWindowTitle(tr("Change my password"));
    auto* layout = new QVBoxLayout(this);
    auto* form = new QFormLayout;
    current_ = new QLineEdit(this);
    current_->setObjectName(QStringLiteral("currentPassword"));
    current_->setEchoMode(QLineEdit::Password);
    form->addRow(tr("Current password:"), current_);
    fields_ = new PasswordFields(form, this);
    layout->addLayout(form);
    message_ = new QLabel(this);
    message_->setWordWrap(true);
    layout->addWidget(message_);
    auto* buttons = new QDialogButtonBox(QDialogButtonBox::Ok | QDialogButtonBox::Cancel, this);
    layout->addWidget(buttons);
    connect(buttons, &QDialogButtonBox::accepted, this, [this] {
        if (!fields_->problem().isEmpty()) {
            message_->setText(tr("✖ %1").arg(fields_->problem()));
        } else if (change(current_->text(), fields_->password())) {
            accept();
        }
    });
    connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
}

QString OwnPasswordDialog::message() const {
    return message_->text();
}

bool OwnPasswordDialog::change(const QString& current, const QString& replacement) {
    try {
        if (!workspace_.user()) {
            throw std::runtime_error("nobody is signed in");
        }
        storage::UserRepository users(*workspace_.workbook());
        const QString login = QString::fromStdString(workspace_.user()->login);
        if (!users.authenticate(login, current)) {
            throw std::runtime_error("the current password is not right");
        }
        if (const QString problem = storage::passwordProblem(replacement); !problem.isEmpty()) {
            throw std::runtime_error(problem.toStdString());
        }
        users.setPassword(workspace_.user()->id, replacement);
        message_->setText(tr("✔ Your password is changed."));
        return true;
    } catch (const std::exception& error) {
        message_->setText(tr("✖ Not changed: %1").arg(QString::fromUtf8(error.what())));
        return false;
    }
}

} // namespace mw::gui
