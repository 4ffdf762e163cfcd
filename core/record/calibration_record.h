// The calibration record of one session as a document: what ISO/IEC 17025:2017 7.8.2.1, 7.8.4
// and 7.8.6 ask a calibration certificate to carry, with every result, decision and statement
// taken from the session evaluator.
#pragma once

#include "core/model/calibration.h"
#include "core/model/instrument.h"
#include "core/model/lab.h"
#include "core/model/reference_standard.h"
#include "core/model/user.h"
#include "core/record/document.h"

#include <cstdint>
#include <optional>
#include <string>
#include <vector>

namespace mw::record {

// The approved amendment that replaced a record.
struct Successor {
    std::int64_t sessionId = 0;
    int revision = 2;
    std::string reason;
    std::optional<Timestamp> approvedAt;
};

// The workbook's chain of approved records when a record is printed: a later look at the
// workbook must still hold this head (or a longer chain through it).
struct ChainAtPrinting {
    int records = 0;
    std::string headDigest; // empty for an empty chain
};

// Everything a record is printed from; storage loads it, core turns it into the document.
struct RecordSource {
    std::optional<Lab> lab; // nullopt while the laboratory has not been described
    Instrument instrument;
    CalibrationSession session;
    // The register's standards: their identity (asset tag, description) for the record, and
    // the inputs of work not yet sealed.
    std::vector<ReferenceStandard> standards;
    std::vector<User> users;            // technician and reviewer are looked up here
    std::optional<Successor> successor; // set when this record is superseded
    // Fingerprint of the key the approver signed with, where the workbook keeps signed
    // approvals; printed beside the approval when present.
    std::optional<std::string> signerKeyFingerprint;
    Timestamp printedAt{}; // for the draft notice
    std::optional<ChainAtPrinting> chainAtPrinting;
};

// "CFM-201-00066": the asset tag and the session number, unique within a workbook (each
// revision of a record is its own session).
std::string recordIdentifier(const Instrument& instrument, std::int64_t sessionId);

// True when the session prints as a calibration record (approved, or approved and since
// superseded); anything else prints as a draft with a watermark.
bool isRecord(const CalibrationSession& session);

// The text of the line saying how to check the digest (the command to run).
inline constexpr const char* kVerifyCommand = "meterwright verify WORKBOOK";

// Builds the record. Throws std::invalid_argument when the session is not of the instrument.
Document buildCalibrationRecord(const RecordSource& source);

} // namespace mw::record
