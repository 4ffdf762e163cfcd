// The invented instrument shop of the demo workbook: its lab, people, standards and meters.
#pragma once

#include "core/model/instrument.h"
#include "core/model/lab.h"
#include "core/model/reference_standard.h"
#include "core/model/user.h"

#include <QString>

#include <chrono>
#include <string>
#include <vector>

namespace mw::demo {

struct DemoUser {
    User user;
    QString password; // stated in resources/demo/README.md; demo only
};

Lab demoLab();

// Technician, reviewer and administrator, in that order.
std::vector<DemoUser> demoUsers();

// Positions in demoStandards().
enum DemoStandardIndex : int {
    kCalibrator = 0,
    kBenchMultimeter = 1,
    kCurrentShunt = 2, // the one past its due date
    kResistorSet = 3,
};
inline constexpr int kOverdueStandard = kCurrentShunt;

// The standards as they stand on `today`, each with its current certificate. Due dates are
// relative to `today`, so that the demo shows a live due list whenever it is made.
std::vector<ReferenceStandard> demoStandards(std::chrono::sys_days today);

// One certificate of an outside calibration of a standard.
struct DemoCertificate {
    std::string number;
    std::chrono::sys_days issued{}; // the day the standard came back and the register was updated
    std::chrono::sys_days due{};    // a year after issue
};

// The certificates standard `standardIndex` has held, oldest first: the first was issued on or
// before `from`, the last is the one it holds on `today` (demoStandards()). Each year the
// standard goes away a few days before its certificate runs out and comes back with a new one,
// except the shunt, whose current certificate has run out.
std::vector<DemoCertificate> certificateHistory(int standardIndex, std::chrono::sys_days today,
                                                std::chrono::sys_days from);

// About 25 meters of every kind, with ranges whose multipliers and shunts are designed from the
// movement (ideal rectifier diodes), each range with its signal type (and silicon diodes for the
// rectifier ranges).
std::vector<Instrument> demoInstruments();

// True when the range is a rectifier (AC) range.
bool isAcRange(const RangeSpec& range);

// The component name of a range's multiplier or shunt as it would appear on a circuit diagram.
std::string resistorName(const Instrument& instrument, std::size_t rangeIndex);

} // namespace mw::demo
