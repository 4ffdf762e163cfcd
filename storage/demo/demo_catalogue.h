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

// Due dates are relative to `today`, so that the demo shows a live due list whenever it is made.
std::vector<ReferenceStandard> demoStandards(std::chrono::sys_days today);

// Prefix of every certificate number of standard `index`; the year of issue follows it.
std::string certificatePrefix(int standardIndex);

// About 25 meters of every kind, with ranges whose multipliers and shunts are designed from the
// movement (ideal rectifier diodes).
std::vector<Instrument> demoInstruments();

// True when the range is marked for AC (its label ends in "~").
bool isAcRange(const RangeSpec& range);

// The component name of a range's multiplier or shunt as it would appear on a circuit diagram.
std::string resistorName(const Instrument& instrument, std::size_t rangeIndex);

} // namespace mw::demo
