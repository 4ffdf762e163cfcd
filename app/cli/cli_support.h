// Shared plumbing for headless commands: option parsing with the core quantity parser,
// one-line errors, JSON output.
#pragma once

#include "core/units/quantity.h"

#include <QCommandLineParser>
#include <QJsonObject>
#include <QString>
#include <QStringList>

#include <chrono>
#include <initializer_list>
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>
#include <utility>

namespace mw::cli {

// Thrown for anything the user got wrong; the dispatcher prints it as one line, exit code 2.
class UsageError : public std::runtime_error {
public:
    explicit UsageError(const QString& message);
};

// Whether a command reads values (quantities, CSV cells): only those offer --decimal-comma.
enum class ReadsValues { No, Yes };

// Parses `arguments` (those after the command name) against the options added to `parser`;
// adds --json, --help and, for a command that reads values, --decimal-comma. Throws
// UsageError naming the unknown or malformed option.
void parseOptions(QCommandLineParser& parser, const QString& commandLine,
                  const QStringList& arguments, ReadsValues readsValues = ReadsValues::No);

// True when --decimal-comma was given (false for commands that do not offer it).
bool decimalCommaSet(const QCommandLineParser& parser);

// True when --help was given: the usage text has then been printed to stdout.
bool helpRequested(const QCommandLineParser& parser, const QString& commandLine);

// Reads a required option as a quantity of `unit`; the error names the option and the reason.
double requireQuantity(const QCommandLineParser& parser, const QString& option, Unit unit);
std::optional<double> optionalQuantity(const QCommandLineParser& parser, const QString& option,
                                       Unit unit);

// Reads a required option's raw text; UsageError when it is missing.
// `text` as a message quotes it: control characters written as \xNN (a newline or a CR can
// neither cut nor garble the one-line message) and cut with a count past `limit` characters,
// so that a cell of megabytes is not echoed back whole.
QString excerpt(const QString& text, qsizetype limit = 40);

// One computed result by name, for requireFinite.
struct NamedResult {
    const char* name;
    double value;
};

// Refuses (UsageError) the first computed result that is not a finite number, naming it and
// `inputs`, the options it is computed from ("--ifs, --rm and --range"): inputs that far apart
// overflow a double on the way, and "inf" or "nan" is no answer to print.
void requireFinite(std::initializer_list<NamedResult> results, const QString& inputs);

QString requireText(const QCommandLineParser& parser, const QString& option);

// Reads an option given as a day, YYYY-MM-DD; nullopt when absent. The error names the option.
std::optional<std::chrono::sys_days> optionalDate(const QCommandLineParser& parser,
                                                  const QString& option);

// Text the engine wrote (UTF-8) as a QString.
QString fromEngine(std::string_view text);

// Reads an option that must be one of `choices` (or `fallback` when absent).
QString chooseOne(const QCommandLineParser& parser, const QString& option,
                  const QStringList& choices, const QString& fallback);

// JSON number or null for non-finite values (JSON has no NaN/inf).
QJsonValue jsonNumber(double value);

// Prints compact-but-readable JSON followed by a newline to stdout.
void printJson(const QJsonObject& object);

// Prints one line of text to stdout.
void printLine(const QString& line);

} // namespace mw::cli
