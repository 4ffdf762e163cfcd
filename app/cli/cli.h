// The headless side of the meterwright executable: subcommands for scripts and batch work.
#pragma once

namespace mw::cli {

// True when the arguments ask for a subcommand, --help or --version: no display needed.
bool wantsHeadless(int argc, char* argv[]);

// Runs the subcommand. Exit codes: 0 ok, 1 a check failed, 2 usage or input error (one line on
// stderr saying what and where).
int runHeadless(int argc, char* argv[]);

} // namespace mw::cli
