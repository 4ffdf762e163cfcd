// A new, empty workbook for a lab: its identity and its first administrator, written to a
// temporary file beside the target and renamed into place only when complete, so that a failed
// or interrupted creation never leaves a half-made workbook under the chosen name.
#pragma once

#include "core/model/lab.h"
#include "core/model/user.h"

#include <QString>

namespace mw::storage {

// Shortest password a person may choose (NIST SP 800-63B 5.1.1.1: at least 8 characters for a
// memorized secret chosen by its owner).
constexpr int kMinimumPasswordLength = 8;

// Empty when `password` may be chosen; else why not, in words for the person choosing it.
QString passwordProblem(const QString& password);

struct NewWorkbook {
    QString path;
    Lab lab;
    User administrator; // login and full name; the role is set to administrator
    QString password;
};

// Creates the workbook. Refuses (WorkbookError BadInput) an existing file, a lab without a
// name, an administrator without a login and a password passwordProblem() refuses; nothing is
// left behind on any failure.
void createWorkbook(const NewWorkbook& request);

} // namespace mw::storage
