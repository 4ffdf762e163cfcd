// Reading a password from the terminal without echo, or from a pipe.
#include "app/cli/password_input.h"

#include "app/cli/cli_support.h"
#include "storage/new_workbook.h"

#include <cstdio>
#include <optional>
#include <string>

#include <termios.h>
#include <unistd.h>

namespace mw::cli {
namespace {

// One line of standard input without its line end; nullopt at end of input.
std::optional<QString> readLine() {
    std::string line;
    int c = 0;
    bool any = false;
    while ((c = std::fgetc(stdin)) != EOF) {
        any = true;
        if (c == '\n') {
            break;
        }
        line.push_back(static_cast<char>(c));
        if (line.size() > 4096) {
            throw UsageError(QStringLiteral("the password line is longer than 4096 bytes"));
        }
    }
    if (!any) {
        return std::nullopt;
    }
    if (!line.empty() && line.back() == '\r') {
        line.pop_back();
    }
    return QString::fromUtf8(line.data(), static_cast<qsizetype>(line.size()));
}

// Restores the terminal's echo however the read ends.
class EchoOff {
public:
    EchoOff() {
        if (tcgetattr(STDIN_FILENO, &saved_) == 0) {
            termios quiet = saved_;
            quiet.c_lflag &= ~static_cast<tcflag_t>(ECHO);
            active_ = tcsetattr(STDIN_FILENO, TCSAFLUSH, &quiet) == 0;
        }
    }
    ~EchoOff() {
        if (active_) {
            tcsetattr(STDIN_FILENO, TCSAFLUSH, &saved_);
        }
    }
    EchoOff(const EchoOff&) = delete;
    EchoOff& operator=(const EchoOff&) = delete;

private:
    termios saved_{};
    bool active_ = false;
};

QString prompted(const QString& prompt) {
    std::fputs(prompt.toLocal8Bit().constData(), stderr);
    std::fflush(stderr);
    std::optional<QString> line;
    {
        const EchoOff quiet;
        line = readLine();
    }
    std::fputs("\n", stderr);
    if (!line) {
        throw UsageError(QStringLiteral("no password was typed"));
    }
    return *line;
}

} // namespace

QString readNewPassword(const QString& whom) {
    QString first;
    std::optional<QString> second;
    if (isatty(STDIN_FILENO) != 0) {
        first = prompted(QStringLiteral("New password for %1: ").arg(whom));
        second = prompted(QStringLiteral("The same password again: "));
    } else {
        const auto line = readLine();
        if (!line) {
            throw UsageError(QStringLiteral("no password on standard input (type it at a terminal, "
                                            "or pipe it in on one line)"));
        }
        first = *line;
        second = readLine();
        if (second && second->isEmpty() && !readLine()) {
            second.reset(); // a trailing empty line is only the end of the input
        }
    }
    if (second && *second != first) {
        throw UsageError(QStringLiteral("the two passwords differ; nothing was changed"));
    }
    if (const QString problem = storage::passwordProblem(first); !problem.isEmpty()) {
        throw UsageError(problem + QStringLiteral("; nothing was changed"));
    }
    return first;
}

QString readPassword(const QString& whom) {
    if (isatty(STDIN_FILENO) != 0) {
        return prompted(QStringLiteral("Password of %1: ").arg(whom));
    }
    const auto line = readLine();
    if (!line) {
        throw UsageError(QStringLiteral("no password on standard input (type it at a terminal, "
                                        "or pipe it in on one line)"));
    }
    return *line;
}

} // namespace mw::cli
