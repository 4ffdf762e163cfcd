// What the window calls to print or export a record or a history report: from the review and
// history screens, the register's menus, or anywhere a session or instrument is selected. Each
// entry point reads the open workbook, builds the document in core and shows any problem in a
// message box over `parent`; none of them changes the workbook.
#pragma once

#include "core/record/document.h"

#include <QString>

#include <cstdint>
#include <optional>

class QPrintPreviewDialog;
class QWidget;

namespace mw::storage {
class Workbook;
}

namespace mw::record {

// The record of a session (a draft, watermarked, when it is not approved), and the history
// report of an instrument; nullopt when there is no such session or instrument.
std::optional<Document> sessionRecord(storage::Workbook& workbook, std::int64_t sessionId);
std::optional<Document> instrumentHistory(storage::Workbook& workbook, std::int64_t instrumentId);

// Opens the print preview of a document, window-modal over `parent`, with its print button
// leading to the system's print dialog; returns the dialog (it deletes itself when closed).
QPrintPreviewDialog* previewAndPrint(QWidget* parent, Document document);

// Print with preview.
void printSessionRecord(QWidget* parent, storage::Workbook& workbook, std::int64_t sessionId);
void printInstrumentHistory(QWidget* parent, storage::Workbook& workbook,
                            std::int64_t instrumentId);

// Asks where to save (suggesting the record's identifier as the name), then writes the PDF
// atomically. Returns the path written, or an empty string when cancelled or refused.
QString exportSessionRecordPdf(QWidget* parent, storage::Workbook& workbook,
                               std::int64_t sessionId);
QString exportInstrumentHistoryPdf(QWidget* parent, storage::Workbook& workbook,
                                   std::int64_t instrumentId);

} // namespace mw::record
