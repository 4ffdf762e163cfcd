// Dispatch of headless subcommands; every error becomes one line on stderr and exit code 2.
#include "app/cli/cli.h"

#include "app/cli/cli_support.h"
#include "app/cli/command_table.h"
#include "core/units/quantity.h"
#include "storage/workbook_error.h"

#include <QCoreApplication>
#include <QFileInfo>
#include <QGuiApplication>
#include <QTextStream>

#include <cstring>
#include <exception>
#include <memory>
#include <stdexcept>

namespace mw::cli {
namespace {

constexpr int kUsageError = 2;
constexpr int kInternalError = 3;

std::vector<Command> calcCommands() {
    std::vector<Command> all = dcCalcCommands();
    for (auto&& family : {rectifierCalcCommands(), evaluationCalcCommands()}) {
        all.insert(all.end(), family.begin(), family.end());
    }
    return all;
}

QString listing(const std::vector<Command>& commands, const QString& prefix) {
    QString text;
    for (const Command& command : commands) {
        text += QStringLiteral("  %1%2  %3\n")
                    .arg(prefix, command.name.leftJustified(14, QLatin1Char(' ')), command.summary);
    }
    return text;
}

QString generalHelp() {
    return QStringLiteral(
               "Usage: meterwright [WORKBOOK]           open the workbook in the main window\n"
               "       meterwright COMMAND [OPTIONS]    run a command without a window\n"
               "\n"
               "Calibration workbook for analog moving-coil instruments.\n"
               "\n"
               "Commands:\n") +
           listing(workbookCommands(), QString()) +
           QStringLiteral("  calc            engine calculations (meterwright calc --help)\n"
                          "\n"
                          "Options:\n"
                          "  --help          show this text\n"
                          "  --version       show the version\n"
                          "\n"
                          "Exit codes: 0 ok, 1 a check failed, 2 usage or input error, 3 internal "
                          "error.\n");
}

QString oneLine(QString text) {
    text.replace(QLatin1Char('\n'), QStringLiteral("; "));
    return text.simplified();
}

// Every error is one line of bounded length, whatever it quotes: control characters from the
// input are escaped, and a message quoting a huge value is cut.
void printError(const QString& where, const QString& message) {
    constexpr qsizetype kLongestMessage = 1000;
    QTextStream err(stderr);
    err << "meterwright " << where << ": " << excerpt(message, kLongestMessage) << '\n';
}

int runFrom(const std::vector<Command>& commands, const QString& family,
            const QStringList& arguments) {
    if (arguments.isEmpty()) {
        printError(family,
                   QStringLiteral("no command given; see meterwright %1 --help").arg(family));
        return kUsageError;
    }
    if (arguments.first() == QStringLiteral("--help") ||
        arguments.first() == QStringLiteral("-h")) {
        printLine(QStringLiteral("Usage: meterwright %1 COMMAND [OPTIONS]\n\nCommands:\n%2")
                      .arg(family, listing(commands, QString())));
        return 0;
    }
    const QString name = arguments.first();
    for (const Command& command : commands) {
        if (command.name != name) {
            continue;
        }
        const QString where = family.isEmpty() ? name : family + QLatin1Char(' ') + name;
        try {
            return command.run(arguments.mid(1));
        } catch (const UsageError& error) {
            printError(where, QString::fromStdString(error.what()));
        } catch (const QuantityError& error) {
            printError(where, QString::fromStdString(error.what()));
        } catch (const storage::WorkbookError& error) {
            // What the workbook refused is the input's fault; its own failures are not.
            const bool internal = error.kind() == storage::WorkbookError::Kind::Internal ||
                                  error.kind() == storage::WorkbookError::Kind::Sql;
            printError(where, (internal ? QStringLiteral("internal error: ") : QString()) +
                                  oneLine(error.message()));
            return internal ? kInternalError : kUsageError;
        } catch (const std::invalid_argument& error) {
            printError(where, QString::fromStdString(error.what())); // the engine refused input
        } catch (const std::domain_error& error) {
            printError(where, QString::fromStdString(error.what()));
        } catch (const std::exception& error) {
            printError(where, QStringLiteral("internal error: %1 (please report it)")
                                  .arg(QString::fromStdString(error.what())));
            return kInternalError;
        }
        return kUsageError;
    }
    const QString help = family.isEmpty() ? QStringLiteral("meterwright --help")
                                          : QStringLiteral("meterwright %1 --help").arg(family);
    printError(family.isEmpty() ? QStringLiteral("command") : family,
               QStringLiteral("unknown command \"%1\"; see %2").arg(name, help));
    return kUsageError;
}

// Scripts read stderr line by line: Qt's notice that it chose a runtime folder of its own (no
// XDG_RUNTIME_DIR on a server) is no news to them and would read as a second error line.
QtMessageHandler qtHandler = nullptr;

void quietRuntimeNotice(QtMsgType type, const QMessageLogContext& context, const QString& text) {
    if (text.startsWith(QLatin1String("QStandardPaths: XDG_RUNTIME_DIR not set"))) {
        return;
    }
    if (qtHandler != nullptr) {
        qtHandler(type, context, text);
    } else {
        QTextStream(stderr) << qFormatLogMessage(type, context, text) << '\n';
    }
}

// Commands that paint need fonts and paint devices, which need a QGuiApplication; offscreen,
// so that they never need a display. A QGuiApplication takes options of its own from the
// command line (-session, -platform, -style ...), so it is given the program's name only.
std::unique_ptr<QCoreApplication> applicationFor(int& argc, char* argv[]) {
    for (const Command& command : workbookCommands()) {
        if (command.paints && command.name == QLatin1String(argv[1])) {
            static int programOnly = 1;
            qputenv("QT_QPA_PLATFORM", "offscreen");
            qtHandler = qInstallMessageHandler(quietRuntimeNotice);
            return std::make_unique<QGuiApplication>(programOnly, argv);
        }
    }
    return std::make_unique<QCoreApplication>(argc, argv);
}

} // namespace

bool wantsHeadless(int argc, char* argv[]) {
    if (argc < 2) {
        return false;
    }
    const char* first = argv[1];
    if (std::strcmp(first, "--help") == 0 || std::strcmp(first, "-h") == 0 ||
        std::strcmp(first, "--version") == 0 || std::strcmp(first, "-v") == 0 ||
        std::strcmp(first, "calc") == 0) {
        return true;
    }
    for (const Command& command : workbookCommands()) {
        if (command.name == QLatin1String(first)) {
            return true;
        }
    }
    // Anything else starting with a dash, or a bare word that names no file, is a mistyped
    // option or command: say so without needing a display. A workbook path opens the window.
    const QString word = QString::fromLocal8Bit(first);
    if (word.startsWith(QLatin1Char('-'))) {
        return true;
    }
    return !QFileInfo::exists(word) && !word.contains(QLatin1Char('/')) &&
           !word.contains(QLatin1Char('.'));
}

int runHeadless(int argc, char* argv[]) {
    QStringList arguments; // as typed, whatever the application object takes for itself
    for (int i = 1; i < argc; ++i) {
        arguments << QString::fromLocal8Bit(argv[i]);
    }
    const std::unique_ptr<QCoreApplication> app = applicationFor(argc, argv);
    QCoreApplication::setApplicationName(QStringLiteral("meterwright"));
    QCoreApplication::setApplicationVersion(QStringLiteral(MW_VERSION));
    const QString first = arguments.first();
    if (first == QStringLiteral("--version") || first == QStringLiteral("-v")) {
        printLine(QStringLiteral("meterwright %1").arg(QStringLiteral(MW_VERSION)));
        return 0;
    }
    if (first == QStringLiteral("--help") || first == QStringLiteral("-h")) {
        printLine(generalHelp().trimmed());
        return 0;
    }
    if (first.startsWith(QLatin1Char('-'))) {
        printError(QStringLiteral("options"),
                   QStringLiteral("unknown option \"%1\"; see meterwright --help").arg(first));
        return kUsageError;
    }
    if (first == QStringLiteral("calc")) {
        return runFrom(calcCommands(), QStringLiteral("calc"), arguments.mid(1));
    }
    return runFrom(workbookCommands(), QString(), arguments);
}

} // namespace mw::cli
