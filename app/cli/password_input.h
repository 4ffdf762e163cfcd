// Passwords for headless commands: never on the command line (it shows in process lists and
// shell history), only typed at the terminal without echo, or piped on standard input.
#pragma once

#include <QString>

namespace mw::cli {

// Reads a new password for `whom`: at a terminal, typed twice without echo (they must match);
// from a pipe, the first line of standard input (a second line, if there is one, must repeat
// it). Throws UsageError when nothing was given, the two differ, or the password is too short.
QString readNewPassword(const QString& whom);

// Reads the password of `whom` to sign in with: typed once without echo at a terminal, or the
// first line of standard input. Throws UsageError when nothing was given.
QString readPassword(const QString& whom);

} // namespace mw::cli
