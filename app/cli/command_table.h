// Subcommand registry: each command family lives in its own file and returns its table.
#pragma once

#include <QString>
#include <QStringList>

#include <functional>
#include <vector>

namespace mw::cli {

struct Command {
    QString name;    // e.g. "shunt" for "meterwright calc shunt"
    QString summary; // one line for --help
    // Receives the arguments after the command name; returns the exit code.
    std::function<int(const QStringList& arguments)> run;
    // Paints (fonts, PDF): runs under an offscreen QGuiApplication instead of a QCoreApplication.
    bool paints = false;
};

// `meterwright calc …` families, one per file in app/cli/.
std::vector<Command> dcCalcCommands(); // calc_dc.cpp: shunt, ayrton, temperature, eseries
std::vector<Command>
rectifierCalcCommands(); // calc_rectifier.cpp: multiplier, indication, waveform
std::vector<Command> evaluationCalcCommands(); // calc_evaluate.cpp: coverage, evaluate

// Top-level workbook commands (workbook_commands.cpp): demo, verify, ...
std::vector<Command> workbookCommands();
// people_commands.cpp: new (a lab's first workbook), user add|disable|passwd.
std::vector<Command> peopleCommands();

} // namespace mw::cli
