// WorkbookError carries its kind beside the message.
#include "storage/workbook_error.h"

namespace mw::storage {

WorkbookError::WorkbookError(Kind kind, const QString& message)
    : std::runtime_error(message.toStdString())
    , kind_(kind) {}

} // namespace mw::storage
