// The invented shop: Copperfen Instrument Works and its meter lab. Every name, tag, serial and
// certificate number here is made up for the demo.
#include "storage/demo/demo_catalogue.h"

#include "core/circuits/ammeter.h"
#include "core/circuits/dc_voltmeter.h"
#include "core/circuits/rectifier_design.h"
#include "core/circuits/waveform.h"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <iterator>
#include <optional>
#include <stdexcept>

namespace mw::demo {
namespace {

using std::chrono::days;

struct RangeRow {
    const char* label;
    Unit unit;
    double lower;
    double full_scale;
    SignalType signal;
};

struct InstrumentRow {
    const char* tag;
    const char* description;
    const char* maker;
    const char* model;
    const char* serial;
    InstrumentKind kind;
    double amps_fs;
    double ohms;
    ScaleType scale;
    int divisions;
    double accuracy_class;
    int interval_days;
    const char* location;
    const char* owner;
    InstrumentStatus status;
    std::vector<RangeRow> ranges;
};

constexpr auto V = Unit::Volt;
constexpr auto A = Unit::Ampere;
constexpr auto DC = SignalType::Dc;
constexpr auto HW = SignalType::HalfWave;
constexpr auto BR = SignalType::Bridge;
constexpr auto kEnd = ScaleType::ZeroAtEnd;
constexpr auto kInService = InstrumentStatus::InService;

const char* const kVennmoor = "Vennmoor Instruments";
const char* const kQuillbrook = "Quillbrook Electric";
const char* const kOrrinVale = "Orrin-Vale Meters";
const char* const kOwnBuild = "Copperfen Instrument Works (own build)";
const char* const kBench = "Shop test bench";
const char* const kFleet = "Rental fleet";

using K = InstrumentKind;

// The register of the demo, one row per meter.
// clang-format off
const std::vector<InstrumentRow> kRows{
    {"CFM-101", "Panel voltmeter, 0-15 V DC", kVennmoor, "P72-V", "V72-1187", K::DcVoltmeter,
     1e-3, 100, kEnd, 30, 1.5, 365, "Bench 2 test rack", kBench, kInService,
     {{"15 V", V, 0, 15, DC}}},
    {"CFM-102", "Switchboard voltmeter, 0-300 V DC", kQuillbrook, "SB-96", "QB-30311",
     K::DcVoltmeter, 1e-3, 75, kEnd, 60, 2.5, 730, "Rental shelf B", kFleet, kInService,
     {{"300 V", V, 0, 300, DC}}},
    {"CFM-103", "Laboratory voltmeter, 0-10 V DC, mirror scale", kOrrinVale, "L-100",
     "OV-L100-0452", K::DcVoltmeter, 50e-6, 2000, kEnd, 100, 0.5, 365, "Standards room",
     kBench, kInService, {{"10 V", V, 0, 10, DC}}},
    {"CFM-104", "Portable voltmeter, 0-50 V DC", kVennmoor, "PV-5", "V5-2290", K::DcVoltmeter,
     100e-6, 1000, kEnd, 50, 1.0, 365, "Field kit 1 (on loan)", "Customer job 2417",
     kInService, {{"50 V", V, 0, 50, DC}}},
    {"CFM-105", "Battery-room voltmeter, 0-150 V DC", kQuillbrook, "SB-72", "QB-11842",
     K::DcVoltmeter, 1e-3, 50, kEnd, 30, 1.5, 730, "Stores", "Customer job 1980",
     InstrumentStatus::Retired, {{"150 V", V, 0, 150, DC}}},
    {"CFM-106", "Charger panel voltmeter, 0-30 V DC", kOwnBuild, "CF-30", "CF-0093",
     K::DcVoltmeter, 500e-6, 200, kEnd, 30, 2.5, 365, "Repair shelf", kFleet,
     InstrumentStatus::OutOfService, {{"30 V", V, 0, 30, DC}}},
    {"CFM-201", "Panel ammeter, 0-1 A DC", kVennmoor, "P72-A", "A72-0615", K::DcAmmeter, 1e-3,
     100, kEnd, 50, 1.5, 365, "Bench 2 test rack", kBench, kInService,
     {{"1 A", A, 0, 1, DC}}},
    {"CFM-202", "Panel ammeter, 0-5 A DC", kQuillbrook, "SB-96A", "QB-30877", K::DcAmmeter,
     1e-3, 60, kEnd, 50, 2.5, 730, "Rental shelf B", kFleet, kInService,
     {{"5 A", A, 0, 5, DC}}},
    {"CFM-203", "Laboratory milliammeter, 0-100 mA DC", kOrrinVale, "L-100mA", "OV-L100-0613",
     K::DcAmmeter, 50e-6, 1500, kEnd, 100, 0.5, 365, "Standards room", kBench, kInService,
     {{"100 mA", A, 0, 0.1, DC}}},
    {"CFM-204", "Charge/discharge ammeter, centre zero, -10...0...+10 A DC", kQuillbrook,
     "CZ-10", "QB-CZ-5521", K::DcAmmeter, 500e-6, 200, ScaleType::ZeroInside, 40, 2.5, 365,
     "Rental shelf B", kFleet, kInService, {{"10-0-10 A", A, -10, 10, DC}}},
    {"CFM-205", "Microammeter, 0-500 µA DC", kOrrinVale, "L-500u", "OV-L500-0077",
     K::DcAmmeter, 100e-6, 1000, kEnd, 50, 1.0, 365, "Standards room", kBench, kInService,
     {{"500 µA", A, 0, 500e-6, DC}}},
    {"CFM-301", "AC panel voltmeter, 0-250 V, half-wave rectifier", kVennmoor, "P72-VAC",
     "VAC-3390", K::HalfWaveAcVoltmeter, 1e-3, 100, kEnd, 50, 2.5, 730, "Bench 1", kBench,
     kInService, {{"250 V~", V, 0, 250, HW}}},
    {"CFM-302", "AC voltmeter, 0-10 V, half-wave rectifier", kOwnBuild, "CF-10AC", "CF-0118",
     K::HalfWaveAcVoltmeter, 100e-6, 1000, kEnd, 50, 2.5, 365, "Rental shelf A", kFleet,
     kInService, {{"10 V~", V, 0, 10, HW}}},
    {"CFM-303", "Portable AC voltmeter, 0-50 V, half-wave rectifier", kOrrinVale, "PA-50",
     "OV-PA-1204", K::HalfWaveAcVoltmeter, 200e-6, 500, kEnd, 50, 1.5, 365, "Field kit 2",
     "Customer job 2503", kInService, {{"50 V~", V, 0, 50, HW}}},
    {"CFM-304", "Pump-panel AC voltmeter, 0-150 V, half-wave rectifier", kQuillbrook,
     "SB-72AC", "QB-12077", K::HalfWaveAcVoltmeter, 500e-6, 250, kEnd, 30, 2.5, 730,
     "Rental shelf B", kFleet, kInService, {{"150 V~", V, 0, 150, HW}}},
    {"CFM-401", "AC voltmeter, 0-300 V, bridge rectifier", kVennmoor, "PV-300AC", "VB-4410",
     K::BridgeAcVoltmeter, 1e-3, 100, kEnd, 60, 1.5, 365, "Bench 1", kBench, kInService,
     {{"300 V~", V, 0, 300, BR}}},
    {"CFM-402", "AC voltmeter, 0-15 V, bridge rectifier", kOrrinVale, "PA-15", "OV-PA-1377",
     K::BridgeAcVoltmeter, 50e-6, 2000, kEnd, 30, 1.5, 365, "Bench 1", kBench, kInService,
     {{"15 V~", V, 0, 15, BR}}},
    {"CFM-403", "Generator-panel AC voltmeter, 0-500 V, bridge rectifier", kQuillbrook,
     "GP-500", "QB-GP-0904", K::BridgeAcVoltmeter, 1e-3, 80, kEnd, 50, 2.5, 730,
     "Rental shelf B", kFleet, kInService, {{"500 V~", V, 0, 500, BR}}},
    {"CFM-404", "Laboratory AC voltmeter, 0-30 V, bridge rectifier", kOrrinVale, "L-30AC",
     "OV-L30-0231", K::BridgeAcVoltmeter, 200e-6, 750, kEnd, 60, 1.0, 365, "Standards room",
     kBench, kInService, {{"30 V~", V, 0, 30, BR}}},
    {"CFM-501", "Multi-range DC voltmeter, 3/10/30/100/300 V", kOrrinVale, "MR-5V",
     "OV-MR-2208", K::MultiRange, 50e-6, 2000, kEnd, 50, 1.0, 365, "Bench 1", kBench,
     kInService,
     {{"3 V", V, 0, 3, DC}, {"10 V", V, 0, 10, DC}, {"30 V", V, 0, 30, DC},
      {"100 V", V, 0, 100, DC}, {"300 V", V, 0, 300, DC}}},
    {"CFM-502", "Multi-range DC milliammeter, 1/10/100 mA and 1 A", kVennmoor, "MA-4",
     "V-MA4-0561", K::MultiRange, 100e-6, 1000, kEnd, 50, 1.0, 365, "Bench 2 test rack",
     kBench, kInService,
     {{"1 mA", A, 0, 1e-3, DC}, {"10 mA", A, 0, 10e-3, DC}, {"100 mA", A, 0, 0.1, DC},
      {"1 A", A, 0, 1, DC}}},
    {"CFM-503", "Service multimeter, DC V / DC mA / AC V", kOwnBuild, "CF-SM3", "CF-0207",
     K::MultiRange, 50e-6, 3000, kEnd, 50, 2.5, 182, "Rental shelf A", kFleet, kInService,
     {{"10 V", V, 0, 10, DC}, {"50 V", V, 0, 50, DC}, {"250 V", V, 0, 250, DC},
      {"10 mA", A, 0, 10e-3, DC}, {"250 V~", V, 0, 250, HW}}},
    {"CFM-504", "Precision multi-range DC voltmeter, 1.5/15/150 V", kOrrinVale, "L-3V",
     "OV-L3V-0019", K::MultiRange, 1e-3, 100, kEnd, 150, 0.5, 365, "Standards room", kBench,
     kInService, {{"1.5 V", V, 0, 1.5, DC}, {"15 V", V, 0, 15, DC}, {"150 V", V, 0, 150, DC}}},
    {"CFM-505", "Multi-range AC voltmeter, 15/150/300 V, bridge rectifier", kQuillbrook,
     "MR-3AC", "QB-MR-7730", K::MultiRange, 1e-3, 100, kEnd, 30, 1.5, 365, "Bench 1", kBench,
     kInService,
     {{"15 V~", V, 0, 15, BR}, {"150 V~", V, 0, 150, BR}, {"300 V~", V, 0, 300, BR}}},
    {"CFM-506", "Multi-range milliammeter, 5/50/500 mA", kVennmoor, "MA-3", "V-MA3-0734",
     K::MultiRange, 1e-3, 50, kEnd, 50, 1.5, 365, "Rental shelf A", kFleet, kInService,
     {{"5 mA", A, 0, 5e-3, DC}, {"50 mA", A, 0, 50e-3, DC}, {"500 mA", A, 0, 0.5, DC}}},
};
// clang-format on

// Designed resistor of one range, from the engine's own design functions: the multiplier of a
// DC voltmeter, the shunt of an ammeter, and the ideal-diode multiplier of a rectifier voltmeter
// with the exact sine average per rms (the bench trims for the diode drop). A centre-zero range
// is designed for its larger side.
std::optional<double> designedOhms(const InstrumentRow& row, const RangeRow& range) {
    const double top = std::max(std::abs(range.lower), std::abs(range.full_scale));
    const Movement movement{row.amps_fs, row.ohms};
    if (range.unit == Unit::Ampere) {
        if (std::abs(top - row.amps_fs) <= 1e-12 * top) {
            return std::nullopt; // the bare movement
        }
        return shunt_ohm(movement, top);
    }
    if (range.signal == SignalType::Dc) {
        return multiplier_ohm(movement, top);
    }
    RectifierCircuit circuit;
    circuit.movement_amps_fs = row.amps_fs;
    circuit.movement_ohms = row.ohms;
    const bool bridge = range.signal == SignalType::Bridge;
    circuit.rectifier = bridge ? Rectifier::Bridge : Rectifier::HalfWave;
    const double averagePerRms =
        sineAveragePerRms(bridge ? Rectification::FullWave : Rectification::HalfWave);
    return idealMultiplierOhms(circuit, top, averagePerRms);
}

Instrument fromRow(const InstrumentRow& row) {
    Instrument instrument;
    instrument.asset_tag = row.tag;
    instrument.description = row.description;
    instrument.manufacturer = row.maker;
    instrument.model = row.model;
    instrument.serial = row.serial;
    instrument.kind = row.kind;
    instrument.movement = Movement{row.amps_fs, row.ohms};
    instrument.scale_type = row.scale;
    instrument.scale_divisions = row.divisions;
    instrument.accuracy_class = row.accuracy_class;
    instrument.interval_days = row.interval_days;
    instrument.location = row.location;
    instrument.owner = row.owner;
    instrument.status = row.status;
    for (const RangeRow& rangeRow : row.ranges) {
        RangeSpec range;
        range.label = rangeRow.label;
        range.unit = rangeRow.unit;
        range.lower_limit = rangeRow.lower;
        range.full_scale = rangeRow.full_scale;
        range.nominal_ohms = designedOhms(row, rangeRow);
        range.signal = rangeRow.signal;
        if (rangeRow.signal != SignalType::Dc) {
            range.diode = DiodePreset::SmallSignalSilicon;
        }
        instrument.ranges.push_back(range);
    }
    return instrument;
}

StandardRangeSpec spec(const char* label, Unit unit, double full_scale, double pctReading,
                       double pctRange, SignalKind signal = SignalKind::Dc) {
    StandardRangeSpec result;
    result.label = label;
    result.unit = unit;
    result.signal = signal;
    result.full_scale = full_scale;
    result.percent_of_reading = pctReading;
    result.percent_of_range = pctRange;
    return result;
}

StandardRangeSpec certified(const char* label, Unit unit, double value, double expanded) {
    StandardRangeSpec result;
    result.label = label;
    result.unit = unit;
    result.full_scale = value;
    result.certificate_expanded_uncertainty = expanded;
    result.coverage_factor = 2.0;
    return result;
}

} // namespace

Lab demoLab() {
    Lab lab;
    lab.name = "Copperfen Instrument Works - Meter Lab";
    lab.address = "Unit 7, Lantern Yard\nCopperfen\n(an invented address for the demo)";
    lab.accreditation_id = std::nullopt; // the shop works to its own procedures
    return lab;
}

std::vector<DemoUser> demoUsers() {
    auto make = [](const char* login, const char* name, Role role, const char* password) {
        DemoUser demoUser;
        demoUser.user.login = login;
        demoUser.user.full_name = name;
        demoUser.user.role = role;
        demoUser.password = QString::fromLatin1(password);
        return demoUser;
    };
    return {make("tess", "Tess Marlowe-Quine", Role::Technician, "demo-tech"),
            make("rowan", "Rowan Ettrick", Role::Reviewer, "demo-review"),
            make("morgan", "Morgan Dallow", Role::Administrator, "demo-admin")};
}

std::vector<ReferenceStandard> demoStandards(std::chrono::sys_days today) {
    std::vector<ReferenceStandard> standards(4);
    ReferenceStandard& calibrator = standards[kCalibrator];
    calibrator.asset_tag = "CFS-01";
    calibrator.description = "Multifunction calibrator: DC/AC voltage to 1000 V, DC current to 2 A";
    calibrator.specs = {spec("2 V DC", V, 2, 0.004, 0.0008),
                        spec("20 V DC", V, 20, 0.004, 0.0008),
                        spec("200 V DC", V, 200, 0.005, 0.001),
                        spec("1000 V DC", V, 1000, 0.006, 0.001),
                        spec("20 V AC 45 Hz-1 kHz", V, 20, 0.05, 0.01, SignalKind::Ac),
                        spec("200 V AC 45 Hz-1 kHz", V, 200, 0.05, 0.01, SignalKind::Ac),
                        spec("1000 V AC 45 Hz-1 kHz", V, 1000, 0.07, 0.01, SignalKind::Ac),
                        spec("2 mA DC", A, 2e-3, 0.02, 0.005),
                        spec("20 mA DC", A, 20e-3, 0.02, 0.005),
                        spec("200 mA DC", A, 0.2, 0.02, 0.005),
                        spec("2 A DC", A, 2, 0.05, 0.01)};

    ReferenceStandard& multimeter = standards[kBenchMultimeter];
    multimeter.asset_tag = "CFS-02";
    multimeter.description = "Six-and-a-half-digit bench multimeter (resistance, shunt voltage)";
    multimeter.specs = {
        spec("100 mV DC", V, 0.1, 0.005, 0.0035), spec("100 ohm", Unit::Ohm, 100, 0.01, 0.004),
        spec("10 kohm", Unit::Ohm, 10e3, 0.01, 0.001), spec("1 Mohm", Unit::Ohm, 1e6, 0.01, 0.001),
        spec("10 Mohm", Unit::Ohm, 10e6, 0.04, 0.001)};

    ReferenceStandard& shunt = standards[kCurrentShunt];
    shunt.asset_tag = "CFS-03";
    shunt.description = "Four-terminal current shunt, 0.01 ohm, 20 A";
    shunt.specs = {certified("0.01 ohm at 10 A", Unit::Ohm, 0.01, 2e-6)};

    ReferenceStandard& resistors = standards[kResistorSet];
    resistors.asset_tag = "CFS-04";
    resistors.description = "Standard resistor set, 1 ohm to 100 kohm in decades";
    resistors.specs = {
        certified("1 ohm", Unit::Ohm, 1, 20e-6),    certified("10 ohm", Unit::Ohm, 10, 100e-6),
        certified("100 ohm", Unit::Ohm, 100, 1e-3), certified("1 kohm", Unit::Ohm, 1e3, 10e-3),
        certified("10 kohm", Unit::Ohm, 10e3, 0.1), certified("100 kohm", Unit::Ohm, 100e3, 1.0)};

    for (std::size_t i = 0; i < standards.size(); ++i) {
        const DemoCertificate current =
            certificateHistory(static_cast<int>(i), today, today).back();
        standards[i].certificate_number = current.number;
        standards[i].calibrated_on = current.issued - days(2);
        standards[i].due_date = current.due;
    }
    return standards;
}

std::vector<DemoCertificate> certificateHistory(int standardIndex, std::chrono::sys_days today,
                                                std::chrono::sys_days from) {
    // Days from `today` to the due date of the certificate each standard holds now; the shunt's
    // ran out 23 days ago and it has not been sent away yet.
    static const int currentDueInDays[] = {213, 118, -23, 301};
    static const char* const prefixes[] = {"EXT-CAL-0412/", "EXT-DMM-0877/", "EXT-SHU-0131/",
                                           "EXT-RES-0540/"};
    if (standardIndex < 0 || standardIndex >= static_cast<int>(std::size(prefixes))) {
        throw std::out_of_range("demo: no reference standard number " +
                                std::to_string(standardIndex));
    }
    const auto index = static_cast<std::size_t>(standardIndex);
    std::vector<DemoCertificate> history;
    std::chrono::sys_days due = today + days(currentDueInDays[index]);
    for (int back = 0;; ++back) {
        DemoCertificate certificate;
        certificate.issued = due - days(365);
        certificate.due = due;
        // The calibrating lab's own numbering: year of issue and a running number.
        const std::chrono::year_month_day issuedOn{certificate.issued};
        const auto dayOfYear =
            (certificate.issued - std::chrono::sys_days{issuedOn.year() / 1 / 1}).count();
        char running[8];
        std::snprintf(running, sizeof running, "-%03d",
                      static_cast<int>((dayOfYear * 37 + standardIndex * 211) % 900 + 100));
        certificate.number = std::string(prefixes[index]) +
                             std::to_string(static_cast<int>(issuedOn.year())) + running;
        history.push_back(certificate);
        if (certificate.issued <= from) {
            break;
        }
        // The standard went away a few days before its previous certificate ran out.
        due = certificate.issued + days(3 + (5 * standardIndex + 11 * back) % 10);
    }
    std::reverse(history.begin(), history.end());
    return history;
}

std::vector<Instrument> demoInstruments() {
    std::vector<Instrument> instruments;
    for (const InstrumentRow& row : kRows) {
        instruments.push_back(fromRow(row));
    }
    return instruments;
}

bool isAcRange(const RangeSpec& range) {
    return range.signal && *range.signal != SignalType::Dc;
}

std::string resistorName(const Instrument& instrument, std::size_t rangeIndex) {
    const bool shunt = instrument.ranges.at(rangeIndex).unit == Unit::Ampere;
    // Appending piece by piece: "R" + std::to_string(...) trips GCC 12's -Wrestrict.
    std::string name(1, 'R');
    name.append(std::to_string(rangeIndex + 1));
    name.append(shunt ? " shunt" : " multiplier");
    return name;
}

} // namespace mw::demo
