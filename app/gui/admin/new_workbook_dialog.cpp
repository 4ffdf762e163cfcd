// The new-workbook dialog.
#include "app/gui/admin/new_workbook_dialog.h"

#include "app/gui/admin/password_fields.h"
#include "storage/new_workbook.h"

#include <QDialogButtonBox>
#include <QDir>
#include <QFileDialog>
#include <QFileInfo>
#include <QFormLayout>
#include <QHBoxLayout>
#include <QLabel>
#include <QLineEdit>
#include <QPlainTextEdit>
#include <QPushButton>
#include <QVBoxLayout>

namespace mw::gui {

NewWorkbookDialog::NewWorkbookDialog(QWidget* parent)
    : QDialog(parent) {
    setObjectName(QStringLiteral("newWorkbookDialog"));
    setWindowTitle(tr("New workbook"));
    auto* layout = new QVBoxLayout(this);
    auto* intro = new QLabel(tr("A workbook holds one lab's instruments, reference standards, "
                                "people and calibration records in one file. You become its "
                                "first administrator."),
                             this);
    intro->setWordWrap(true);
    layout->addWidget(intro);
    auto* form = new QFormLayout;
    path_ = new QLineEdit(this);
    path_->setObjectName(QStringLiteral("path"));
    path_->setText(QDir::home().filePath(QStringLiteral("lab.meterwright")));
    auto* browse = new QPushButton(tr("Choose…"), this);
    auto* where = new QHBoxLayout;
    where->addWidget(path_, 1);
    where->addWidget(browse);
    form->addRow(tr("File:"), where);
    lab_ = new QLineEdit(this);
    lab_->setObjectName(QStringLiteral("labName"));
    form->addRow(tr("Lab's name:"), lab_);
    address_ = new QPlainTextEdit(this);
    address_->setObjectName(QStringLiteral("labAddress"));
    address_->setTabChangesFocus(true);
    address_->setFixedHeight(70);
    form->addRow(tr("Address (on records):"), address_);
    login_ = new QLineEdit(this);
    login_->setObjectName(QStringLiteral("adminLogin"));
    form->addRow(tr("Your login:"), login_);
    name_ = new QLineEdit(this);
    name_->setObjectName(QStringLiteral("adminName"));
    form->addRow(tr("Your full name:"), name_);
    password_ = new PasswordFields(form, this);
    layout->addLayout(form);
    message_ = new QLabel(this);
    message_->setObjectName(QStringLiteral("newWorkbookMessage"));
    message_->setWordWrap(true);
    layout->addWidget(message_);
    auto* buttons = new QDialogButtonBox(QDialogButtonBox::Cancel, this);
    create_ = buttons->addButton(tr("&Create"), QDialogButtonBox::AcceptRole);
    create_->setDefault(true);
    layout->addWidget(buttons);
    connect(buttons, &QDialogButtonBox::accepted, this, [this] {
        if (create()) {
            accept();
        }
    });
    connect(buttons, &QDialogButtonBox::rejected, this, &QDialog::reject);
    connect(browse, &QPushButton::clicked, this, [this] {
        const QString chosen = QFileDialog::getSaveFileName(
            this, tr("New workbook"), path_->text(), tr("Meterwright workbooks (*.meterwright)"),
            nullptr, QFileDialog::DontConfirmOverwrite);
        if (!chosen.isEmpty()) {
            path_->setText(chosen.endsWith(QLatin1String(".meterwright"))
                               ? chosen
                               : chosen + QStringLiteral(".meterwright"));
        }
    });
    for (QLineEdit* field : {path_, lab_, login_, name_}) {
        connect(field, &QLineEdit::textChanged, this, &NewWorkbookDialog::updateState);
    }
    connect(password_, &PasswordFields::changed, this, &NewWorkbookDialog::updateState);
    updateState();
}

QString NewWorkbookDialog::path() const {
    return path_->text().trimmed();
}

QString NewWorkbookDialog::login() const {
    return login_->text().trimmed();
}

QString NewWorkbookDialog::password() const {
    return password_->password();
}

QString NewWorkbookDialog::message() const {
    return message_->text();
}

void NewWorkbookDialog::fill(const QString& path, const QString& lab, const QString& address,
                             const QString& login, const QString& name, const QString& password) {
    path_->setText(path);
    lab_->setText(lab);
    address_->setPlainText(address);
    login_->setText(login);
    name_->setText(name);
    password_->first()->setText(password);
    password_->second()->setText(password);
}

void NewWorkbookDialog::updateState() {
    QString missing;
    if (path().isEmpty()) {
        missing = tr("Choose where the file goes.");
    } else if (QFileInfo::exists(path())) {
        missing = tr("✖ %1 already exists; a new workbook never replaces a file.").arg(path());
    } else if (lab_->text().trimmed().isEmpty()) {
        missing = tr("Give the lab's name.");
    } else if (login().isEmpty()) {
        missing = tr("Choose your login.");
    } else if (!password_->problem().isEmpty()) {
        missing = tr("Choose a password.");
    }
    message_->setText(missing);
    create_->setEnabled(missing.isEmpty());
}

bool NewWorkbookDialog::create() {
    storage::NewWorkbook request;
    request.path = path();
    request.lab.name = lab_->text().trimmed().toStdString();
    request.lab.address = address_->toPlainText().trimmed().toStdString();
    request.administrator.login = login().toStdString();
    request.administrator.full_name =
        (name_->text().trimmed().isEmpty() ? login() : name_->text().trimmed()).toStdString();
    request.password = password_->password();
    if (const QString problem = password_->problem(); !problem.isEmpty()) {
        message_->setText(tr("✖ Not created: %1.").arg(problem));
        return false;
    }
    try {
        storage::createWorkbook(request);
    } catch (const std::exception& error) {
        message_->setText(tr("✖ Not created: %1").arg(QString::fromUtf8(error.what())));
        return false;
    }
    return true;
}

} // namespace mw::gui
