// Shared plumbing for headless commands.
#include "app/cli/cli_support.h"

#include <QDate>
#include <QJsonDocument>
#include <QTextStream>

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace mw::cli {

UsageError::UsageError(const QString& message)
    : std::runtime_error(message.toStdString()) {}

void parseOptions(QCommandLineParser& parser, const QString& commandLine,
                  const QStringList& arguments, ReadsValues readsValues) {
    parser.setSingleDashWordOptionMode(QCommandLineParser::ParseAsLongOptions);
    parser.addOption({QStringLiteral("json"), QStringLiteral("Print the result as JSON.")});
    if (readsValues == ReadsValues::Yes) {
        parser.addOption({QStringLiteral("decimal-comma"),
                          QStringLiteral("Read values written with a decimal comma (4,7k).")});
    }
    parser.addOption({{QStringLiteral("h"), QStringLiteral("help")},
                      QStringLiteral("Show the options of this command.")});
    QStringList withProgram = arguments;
    withProgram.prepend(commandLine);
    if (!parser.parse(withProgram)) {
        throw UsageError(parser.errorText());
    }
}

bool decimalCommaSet(const QCommandLineParser& parser) {
    // optionNames() lists the options given; isSet() would warn about an option not offered.
    return parser.optionNames().contains(QStringLiteral("decimal-comma"));
}

bool helpRequested(const QCommandLineParser& parser, const QString& commandLine) {
    if (!parser.isSet(QStringLiteral("help"))) {
        return false;
    }
    // Qt's first line names the program's path; say what a person types instead.
    QString text = parser.helpText();
    const qsizetype endOfFirstLine = text.indexOf(QLatin1Char('\n'));
    text.replace(0, endOfFirstLine,
                 QStringLiteral("Usage: meterwright %1 [options]").arg(commandLine));
    printLine(text.trimmed());
    return true;
}

std::optional<double> optionalQuantity(const QCommandLineParser& parser, const QString& option,
                                       Unit unit) {
    if (!parser.isSet(option)) {
        return std::nullopt;
    }
    const QString text = parser.value(option);
    try {
        ParseOptions options;
        options.decimalComma = decimalCommaSet(parser);
        return parseValue(text.toStdString(), unit, options);
    } catch (const QuantityError& error) {
        throw UsageError(QStringLiteral("option --%1 \"%2\": %3")
                             .arg(option, excerpt(text), QString::fromStdString(error.what())));
    }
}

double requireQuantity(const QCommandLineParser& parser, const QString& option, Unit unit) {
    const auto value = optionalQuantity(parser, option, unit);
    if (!value) {
        throw UsageError(QStringLiteral("option --%1 is required").arg(option));
    }
    return *value;
}

QString excerpt(const QString& text, qsizetype limit) {
    QString escaped;
    escaped.reserve(std::min(text.size(), limit) + 4);
    for (const QChar c : text.left(limit)) {
        const char16_t code = c.unicode();
        if (code < 0x20 || code == 0x7F || (code >= 0x80 && code < 0xA0)) {
            escaped +=
                QStringLiteral("\\x%1").arg(static_cast<uint>(code), 2, 16, QLatin1Char('0'));
        } else {
            escaped += c;
        }
    }
    if (text.size() > limit) {
        escaped += QStringLiteral("\u2026 (%1 characters)").arg(text.size());
    }
    return escaped;
}

QString requireText(const QCommandLineParser& parser, const QString& option) {
    if (!parser.isSet(option)) {
        throw UsageError(QStringLiteral("option --%1 is required").arg(option));
    }
    return parser.value(option);
}

std::optional<std::chrono::sys_days> optionalDate(const QCommandLineParser& parser,
                                                  const QString& option) {
    if (!parser.isSet(option)) {
        return std::nullopt;
    }
    const QString text = parser.value(option);
    const QDate date = QDate::fromString(text, Qt::ISODate);
    if (!date.isValid()) {
        throw UsageError(QStringLiteral("option --%1 \"%2\": expected a date as YYYY-MM-DD")
                             .arg(option, excerpt(text)));
    }
    return std::chrono::sys_days{std::chrono::year{date.year()} /
                                 static_cast<unsigned>(date.month()) /
                                 static_cast<unsigned>(date.day())};
}

QString fromEngine(std::string_view text) {
    return QString::fromUtf8(text.data(), static_cast<qsizetype>(text.size()));
}

QString chooseOne(const QCommandLineParser& parser, const QString& option,
                  const QStringList& choices, const QString& fallback) {
    if (!parser.isSet(option)) {
        return fallback;
    }
    const QString value = parser.value(option).trimmed().toLower();
    if (!choices.contains(value)) {
        throw UsageError(
            QStringLiteral("option --%1 \"%2\": expected one of %3")
                .arg(option, excerpt(parser.value(option)), choices.join(QStringLiteral("|"))));
    }
    return value;
}

void requireFinite(std::initializer_list<NamedResult> results, const QString& inputs) {
    for (const NamedResult& result : results) {
        if (!std::isfinite(result.value)) {
            throw UsageError(QStringLiteral("the %1 cannot be computed from the values of %2: it "
                                            "comes out beyond the numbers this program can hold "
                                            "(about 1e-300 to 1e300 in size); check those values")
                                 .arg(QString::fromUtf8(result.name), inputs));
        }
    }
}

QJsonValue jsonNumber(double value) {
    if (!std::isfinite(value)) {
        return QJsonValue(QJsonValue::Null);
    }
    return QJsonValue(value);
}

void printJson(const QJsonObject& object) {
    const QByteArray text = QJsonDocument(object).toJson(QJsonDocument::Indented);
    std::fwrite(text.constData(), 1, static_cast<std::size_t>(text.size()), stdout);
    std::fflush(stdout);
}

void printLine(const QString& line) {
    QTextStream out(stdout);
    out << line << '\n';
}

} // namespace mw::cli
