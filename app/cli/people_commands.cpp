// The commands that start a lab and keep its people: `new` writes an empty workbook with the
// lab's identity and its first administrator; `user add|disable|passwd` manage people. Passwords
// come from the terminal or a pipe only (see password_input.h).
#include "app/cli/cli_support.h"
#include "app/cli/command_table.h"
#include "app/cli/password_input.h"
#include "app/cli/workbook_access.h"
#include "storage/new_workbook.h"
#include "storage/transaction.h"
#include "storage/user_repository.h"
#include "storage/workbook.h"

#include <QCommandLineParser>
#include <QFileInfo>
#include <QJsonObject>

namespace mw::cli {
namespace {

int runNew(const QStringList& arguments) {
    const QString command = QStringLiteral("new");
    QCommandLineParser parser;
    parser.setApplicationDescription(
        QStringLiteral("Writes a new, empty workbook for a lab with its first administrator. "
                       "The password is typed at the terminal (twice, not shown) or piped on "
                       "standard input; it is never given as an option. An existing file is "
                       "never overwritten."));
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"),
                                 QStringLiteral("The new workbook file (e.g. lab.meterwright)."));
    parser.addOption({QStringLiteral("lab"), QStringLiteral("The lab's name, as records print it."),
                      QStringLiteral("NAME")});
    parser.addOption({QStringLiteral("address"),
                      QStringLiteral("The lab's address (\\n for a new line)."),
                      QStringLiteral("TEXT")});
    parser.addOption({QStringLiteral("admin"), QStringLiteral("Login of the first administrator."),
                      QStringLiteral("LOGIN")});
    parser.addOption({QStringLiteral("name"),
                      QStringLiteral("Full name of the first administrator (default: the login)."),
                      QStringLiteral("FULL NAME")});
    parseOptions(parser, command, arguments);
    if (helpRequested(parser, command)) {
        return 0;
    }
    storage::NewWorkbook request;
    request.path = onlyWorkbookArgument(parser.positionalArguments());
    request.lab.name = requireText(parser, QStringLiteral("lab")).trimmed().toStdString();
    request.lab.address = parser.value(QStringLiteral("address"))
                              .replace(QStringLiteral("\\n"), QStringLiteral("\n"))
                              .toStdString();
    const QString login = requireText(parser, QStringLiteral("admin")).trimmed();
    request.administrator.login = login.toStdString();
    request.administrator.full_name =
        (parser.isSet(QStringLiteral("name")) ? parser.value(QStringLiteral("name")) : login)
            .toStdString();
    if (QFileInfo::exists(request.path)) {
        throw UsageError(QStringLiteral("%1 already exists; a new workbook is only written to a "
                                        "new file")
                             .arg(request.path));
    }
    request.password = readNewPassword(login);
    storage::createWorkbook(request);
    if (parser.isSet(QStringLiteral("json"))) {
        printJson(QJsonObject{{QStringLiteral("workbook"), request.path},
                              {QStringLiteral("lab"), QString::fromStdString(request.lab.name)},
                              {QStringLiteral("administrator"), login}});
    } else {
        printLine(QStringLiteral("wrote the new workbook %1 for %2; sign in as %3 "
                                 "(administrator)")
                      .arg(request.path, QString::fromStdString(request.lab.name), login));
    }
    return 0;
}

Role roleNamed(const QString& text) {
    if (const auto role = fromText<Role>(text.toStdString())) {
        return *role;
    }
    throw UsageError(QStringLiteral("option --role \"%1\": expected technician, reviewer or "
                                    "administrator")
                         .arg(text));
}

User requireUser(storage::UserRepository& users, const QString& login) {
    const auto user = users.findByLogin(login);
    if (!user) {
        throw UsageError(QStringLiteral("no user with the login \"%1\"").arg(login));
    }
    return *user;
}

int runUser(const QStringList& arguments) {
    const QString action = arguments.value(0);
    const QString command = QStringLiteral("user ") + action;
    if (action.isEmpty() || action == QLatin1String("--help") || action == QLatin1String("-h")) {
        printLine(QStringLiteral(
            "Usage: meterwright user add WORKBOOK --login L --name NAME --role "
            "technician|reviewer|administrator\n"
            "       meterwright user disable WORKBOOK --login L\n"
            "       meterwright user passwd WORKBOOK --login L\n\n"
            "Passwords are typed at the terminal (twice, not shown) or piped on standard input, "
            "never given as options. A person who signed records is disabled, never deleted."));
        return action.isEmpty() ? 2 : 0;
    }
    if (action != QLatin1String("add") && action != QLatin1String("disable") &&
        action != QLatin1String("passwd")) {
        throw UsageError(
            QStringLiteral("unknown action \"%1\"; expected add, disable or passwd").arg(action));
    }
    QCommandLineParser parser;
    parser.addPositionalArgument(QStringLiteral("WORKBOOK"), QStringLiteral("The workbook."));
    parser.addOption(
        {QStringLiteral("login"), QStringLiteral("The person's login."), QStringLiteral("LOGIN")});
    if (action == QLatin1String("add")) {
        parser.addOption({QStringLiteral("name"), QStringLiteral("The person's full name."),
                          QStringLiteral("FULL NAME")});
        parser.addOption({QStringLiteral("role"),
                          QStringLiteral("technician, reviewer or administrator."),
                          QStringLiteral("ROLE")});
    }
    parseOptions(parser, command, arguments.mid(1));
    if (helpRequested(parser, command)) {
        return 0;
    }
    const QString path = onlyWorkbookArgument(parser.positionalArguments());
    const QString login = requireText(parser, QStringLiteral("login")).trimmed();
    if (action == QLatin1String("add")) {
        const Role role = roleNamed(requireText(parser, QStringLiteral("role")));
        const QString name = requireText(parser, QStringLiteral("name")).trimmed();
        const auto workbook = openForWriting(path);
        storage::UserRepository users(*workbook);
        if (users.findByLogin(login)) {
            throw UsageError(QStringLiteral("the login \"%1\" is taken").arg(login));
        }
        User user{0, login.toStdString(), name.toStdString(), role, true};
        users.add(user, readNewPassword(login));
        printLine(QStringLiteral("added %1 (%2, %3)")
                      .arg(login, name, QString::fromUtf8(displayName(role).data())));
        return 0;
    }
    const auto workbook = openForWriting(path);
    storage::UserRepository users(*workbook);
    User user = requireUser(users, login);
    if (action == QLatin1String("disable")) {
        user.active = false;
        users.update(user);
        printLine(
            QStringLiteral("disabled %1; the records they signed keep their name").arg(login));
        return 0;
    }
    users.setPassword(user.id, readNewPassword(login));
    printLine(QStringLiteral("changed the password of %1").arg(login));
    return 0;
}

} // namespace

std::vector<Command> peopleCommands() {
    return {
        {QStringLiteral("new"),
         QStringLiteral("write a new, empty workbook for a lab with its first administrator"),
         runNew},
        {QStringLiteral("user"), QStringLiteral("add a person, disable one, or set a password"),
         runUser},
    };
}

} // namespace mw::cli
