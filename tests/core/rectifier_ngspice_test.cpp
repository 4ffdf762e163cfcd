// Independent check of the rectifier models: ngspice transients of the same circuits with the
// same SPICE level-1 diode model, compared with the engine's period-average movement current.
#include "core/circuits/rectifier_design.h"
#include "core/circuits/rectifier_meter.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <array>
#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <limits>
#include <map>
#include <random>
#include <regex>
#include <sstream>
#include <string>
#include <vector>

using namespace mw;

namespace {

constexpr double kFrequency_Hz = 50.0;
constexpr double kPeriod_s = 1.0 / kFrequency_Hz;

struct MeterDesign {
    const char* label;
    Rectifier rectifier;
    DiodePreset preset;
    double amps_fs;
    double movement_ohms;
    double shunt_ohms; // across the movement; infinity for none
    double range_volts;
    double celsius;
};

struct Case {
    MeterDesign design;
    double multiplier_ohms;
    WaveShape shape;
    double fraction_of_range;
    double engine_amps;
};

std::string number(double value) {
    std::ostringstream out;
    out.precision(12);
    out << value;
    return out.str();
}

std::string source(const Case& c) {
    const Waveform input = Waveform::withRms(c.shape, c.fraction_of_range * c.design.range_volts);
    const std::string a = number(input.peakVolts());
    const std::string minus_a = number(-input.peakVolts());
    const double t = kPeriod_s;
    switch (c.shape) {
    case WaveShape::Sine:
        return "SIN(0 " + a + " " + number(kFrequency_Hz) + ")";
    case WaveShape::Square: {
        // Edges of 1e-5 of the period: the engine's square has none; the difference this makes
        // to the average is of that order, far inside the comparison's tolerance.
        const double edge = 1e-5 * t;
        return "PULSE(" + a + " " + minus_a + " " + number(t / 2 - edge) + " " + number(edge) +
               " " + number(edge) + " " + number(t / 2 - edge) + " " + number(t) + ")";
    }
    case WaveShape::Triangle:
        return "PWL(0 0 " + number(t / 4) + " " + a + " " + number(3 * t / 4) + " " + minus_a +
               " " + number(t) + " 0) r=0";
    default:
        break;
    }
    throw std::logic_error("no ngspice source for this waveform");
}

std::string modelCard(const std::string& name, DiodePreset preset) {
    const DiodeParameters p = diodePreset(preset);
    return ".model " + name + " D(IS=" + number(p.saturation_current_a) +
           " N=" + number(p.emission_coefficient) + " RS=" + number(p.series_ohms) +
           " EG=" + number(p.bandgap_ev) + " XTI=" + number(p.saturation_temp_exponent) +
           " TNOM=" + number(p.nominal_celsius) + ")\n";
}

// The half-wave meter: multiplier to node a; series diode a→b; reverse-path diode from the
// return to a; the movement (with a zero-volt source as ammeter) from b to the return, the
// optional shunt resistor across it. The bridge: D1 p→plus, D2 0→plus, D3 minus→0, D4 minus→p.
std::string circuit(const Case& c, int i, const std::string& model) {
    const std::string n = std::to_string(i);
    std::string text = "V" + n + " in" + n + " 0 " + source(c) + "\n";
    text += "RS" + n + " in" + n + " a" + n + " " + number(c.multiplier_ohms) + "\n";
    if (c.design.rectifier == Rectifier::HalfWave) {
        text += "D1_" + n + " a" + n + " b" + n + " " + model + "\n";
        text += "D2_" + n + " 0 a" + n + " " + model + "\n";
        text += "VM" + n + " b" + n + " m" + n + " 0\n";
        text += "RM" + n + " m" + n + " 0 " + number(c.design.movement_ohms) + "\n";
        if (std::isfinite(c.design.shunt_ohms)) {
            text += "RSH" + n + " b" + n + " 0 " + number(c.design.shunt_ohms) + "\n";
        }
    } else {
        text += "D1_" + n + " a" + n + " plus" + n + " " + model + "\n";
        text += "D2_" + n + " 0 plus" + n + " " + model + "\n";
        text += "D3_" + n + " minus" + n + " 0 " + model + "\n";
        text += "D4_" + n + " minus" + n + " a" + n + " " + model + "\n";
        text += "VM" + n + " plus" + n + " m" + n + " 0\n";
        text += "RM" + n + " m" + n + " minus" + n + " " + number(c.design.movement_ohms) + "\n";
        if (std::isfinite(c.design.shunt_ohms)) {
            text +=
                "RSH" + n + " plus" + n + " minus" + n + " " + number(c.design.shunt_ohms) + "\n";
        }
    }
    text += ".meas tran iavg" + n + " AVG i(VM" + n + ") from=" + number(kPeriod_s) +
            " to=" + number(2 * kPeriod_s) + "\n";
    return text;
}

// Runs one batch transient holding every case of one design; returns iavg<i> by case index.
std::map<int, double> runNgspice(const std::vector<Case>& cases) {
    const MeterDesign& d = cases.front().design;
    std::string netlist = "* rectifier meter cross-check\n";
    // Tight Newton tolerances so that the simulator's own convergence error (reltol defaults to
    // 1e-3) is far below the comparison; GMIN (1e-12 S across every junction by default) is
    // lowered because the engine has no such conductance -- at the few volts across a junction
    // here its default would add picoamperes, already negligible, so this only removes doubt.
    netlist += ".options temp=" + number(d.celsius) +
               " tnom=27 reltol=1e-7 abstol=1e-15 vntol=1e-9 gmin=1e-15\n";
    netlist += modelCard("dmod", d.preset);
    for (std::size_t i = 0; i < cases.size(); ++i) {
        netlist += circuit(cases[i], static_cast<int>(i), "dmod");
    }
    // Two periods: the circuit stores no energy, so the second period repeats the first; the
    // average is taken over it with at most 1/4000 of a period per step.
    netlist += ".tran " + number(kPeriod_s / 4000) + " " + number(2 * kPeriod_s) + " 0 " +
               number(kPeriod_s / 4000) + "\n.end\n";

    std::mt19937_64 random(std::random_device{}());
    const auto path = std::filesystem::temp_directory_path() /
                      ("mw_rectifier_" + std::to_string(random()) + ".cir");
    std::ofstream(path) << netlist;
    const std::string command = "ngspice -b '" + path.string() + "' 2>&1";
    std::string output;
    if (FILE* pipe = popen(command.c_str(), "r")) {
        std::array<char, 4096> buffer{};
        while (std::fgets(buffer.data(), static_cast<int>(buffer.size()), pipe) != nullptr) {
            output += buffer.data();
        }
        pclose(pipe);
    }
    std::filesystem::remove(path);

    std::map<int, double> results;
    const std::regex line(R"(iavg(\d+)\s*=\s*([-+0-9.eE]+))");
    for (std::sregex_iterator it(output.begin(), output.end(), line), end; it != end; ++it) {
        results[std::stoi((*it)[1])] = std::stod((*it)[2]);
    }
    INFO("ngspice output:\n" << output.substr(0, 3000));
    REQUIRE(results.size() == cases.size());
    return results;
}

void compareWithNgspice(const MeterDesign& design) {
    RectifierCircuit circuit{design.rectifier, design.amps_fs, design.movement_ohms, 0.0,
                             design.shunt_ohms};
    const RectifierMeter prototype(circuit, diodePreset(design.preset), design.celsius);
    const double multiplier_ohms = solveMultiplier(prototype, design.range_volts).multiplier_ohms;
    const RectifierMeter meter = prototype.withMultiplier(multiplier_ohms);

    std::vector<Case> cases;
    for (WaveShape shape : {WaveShape::Sine, WaveShape::Square, WaveShape::Triangle}) {
        for (double fraction : {0.25, 0.5, 1.0}) {
            const Waveform input = Waveform::withRms(shape, fraction * design.range_volts);
            cases.push_back(
                {design, multiplier_ohms, shape, fraction, meter.average(input).movement_amps});
        }
    }
    const std::map<int, double> simulated = runNgspice(cases);
    for (std::size_t i = 0; i < cases.size(); ++i) {
        const Case& c = cases[i];
        const double spice_amps = simulated.at(static_cast<int>(i));
        INFO(design.label << ", " << shapeName(c.shape) << " at " << c.fraction_of_range * 100
                          << " % of range: engine " << c.engine_amps << " A, ngspice " << spice_amps
                          << " A");
        // Issue requirement: agreement within 0.5 % of reading at 25 % of scale and above.
        // Observed: about 1e-5 for silicon; up to 2e-4 where the leakage is large (Schottky at
        // 40 °C, germanium), because SPICE replaces the exponential by a cubic more than 3·nV_T
        // into reverse bias (Berkeley SPICE 3 diode load equations) while the engine keeps the
        // exact Shockley form.
        CHECK(c.engine_amps == mwtest::relative(spice_amps, 0.005));
        if (c.shape == WaveShape::Sine && c.fraction_of_range == 1.0) {
            // The solved multiplier gives full scale in the independent simulation too.
            CHECK(spice_amps == Approx(design.amps_fs).epsilon(0.005));
        }
    }
}

} // namespace

TEST_CASE("half-wave meter: engine agrees with an ngspice transient of the same circuit") {
    const double none = std::numeric_limits<double>::infinity();
    compareWithNgspice({"half-wave, silicon, 1 mA / 1 kΩ, 10 V", Rectifier::HalfWave,
                        DiodePreset::SmallSignalSilicon, 1e-3, 1000.0, none, 10.0, 23.0});
    compareWithNgspice({"half-wave, germanium, 200 µA / 1.5 kΩ shunted by 1.5 kΩ, 2.5 V",
                        Rectifier::HalfWave, DiodePreset::Germanium, 200e-6, 1500.0, 1500.0, 2.5,
                        15.0});
}

TEST_CASE("bridge meter: engine agrees with an ngspice transient of the same circuit") {
    const double none = std::numeric_limits<double>::infinity();
    compareWithNgspice({"bridge, silicon, 1 mA / 1 kΩ, 10 V", Rectifier::Bridge,
                        DiodePreset::SmallSignalSilicon, 1e-3, 1000.0, none, 10.0, 23.0});
    compareWithNgspice({"bridge, Schottky, 100 µA / 2 kΩ, 2.5 V, 40 °C", Rectifier::Bridge,
                        DiodePreset::Schottky, 100e-6, 2000.0, none, 2.5, 40.0});
    compareWithNgspice({"bridge, germanium, 50 µA / 2 kΩ, 50 V", Rectifier::Bridge,
                        DiodePreset::Germanium, 50e-6, 2000.0, none, 50.0, 27.0});
}
