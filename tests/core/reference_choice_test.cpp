// Choosing the reference standard's range for an instrument's range, and the components it
// contributes, checked by hand against the GUM's rules for Type B inputs. The standards'
// figures are invented demo data.
#include "core/evaluation/reference_choice.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>

using namespace mw;

namespace {

StandardSpecCopy limits(std::int64_t standard, int order, const char* label, Unit unit,
                        double fullScale, double pctReading, double pctRange,
                        SignalKind signal = SignalKind::Dc) {
    StandardSpecCopy copy;
    copy.standard_id = standard;
    copy.sort_order = order;
    copy.spec.label = label;
    copy.spec.unit = unit;
    copy.spec.full_scale = fullScale;
    copy.spec.percent_of_reading = pctReading;
    copy.spec.percent_of_range = pctRange;
    copy.spec.signal = signal;
    return copy;
}

StandardSpecCopy certificate(std::int64_t standard, int order, const char* label, Unit unit,
                             double value, double expanded, double k,
                             std::optional<double> dof = std::nullopt) {
    StandardSpecCopy copy;
    copy.standard_id = standard;
    copy.sort_order = order;
    copy.spec.label = label;
    copy.spec.unit = unit;
    copy.spec.full_scale = value;
    copy.spec.certificate_expanded_uncertainty = expanded;
    copy.spec.coverage_factor = k;
    copy.spec.degrees_of_freedom = dof;
    return copy;
}

// A calibrator (standard 1), a bench multimeter (2) and a current shunt (3).
std::vector<StandardSpecCopy> bench() {
    return {
        limits(1, 0, "2 V DC", Unit::Volt, 2.0, 0.004, 0.0008),
        limits(1, 1, "20 V DC", Unit::Volt, 20.0, 0.004, 0.0008),
        limits(1, 2, "200 V DC", Unit::Volt, 200.0, 0.005, 0.001),
        limits(1, 3, "20 V AC", Unit::Volt, 20.0, 0.05, 0.01, SignalKind::Ac),
        limits(1, 4, "2 A DC", Unit::Ampere, 2.0, 0.05, 0.01),
        limits(2, 0, "100 mV DC", Unit::Volt, 0.1, 0.005, 0.0035),
        certificate(3, 0, "0.01 ohm", Unit::Ohm, 0.01, 2e-6, 2.0, 30.0),
    };
}

} // namespace

TEST_CASE("the covering range of the same unit and signal with the smallest uncertainty") {
    const auto specs = bench();
    // A 10 V DC range: 20 V DC covers it (2 V does not); 200 V DC would too, with more.
    auto choice = chooseReference(Unit::Volt, SignalType::Dc, 10.0, specs);
    REQUIRE(choice);
    CHECK(choice->reference == SpecRef{1, 1});
    CHECK_FALSE(choice->shunt);
    // A bridge rectifier range needs an AC range.
    choice = chooseReference(Unit::Volt, SignalType::Bridge, 15.0, specs);
    REQUIRE(choice);
    CHECK(choice->reference == SpecRef{1, 3});
    // Nothing covers 30 V AC, or 1000 V DC.
    CHECK_FALSE(chooseReference(Unit::Volt, SignalType::HalfWave, 30.0, specs));
    CHECK_FALSE(chooseReference(Unit::Volt, SignalType::Dc, 1000.0, specs));
    // The order the standards are listed in does not matter.
    auto reversed = specs;
    std::reverse(reversed.begin(), reversed.end());
    CHECK(chooseReference(Unit::Volt, SignalType::Dc, 10.0, reversed)->reference == SpecRef{1, 1});
}

TEST_CASE("a current no range covers is read as the voltage across a shunt") {
    const auto specs = bench();
    // 1 A: the calibrator's 2 A DC range delivers it directly.
    CHECK(chooseReference(Unit::Ampere, SignalType::Dc, 1.0, specs)->reference == SpecRef{1, 4});
    // 10 A: 0.1 V across 0.01 ohm, read on the 100 mV range (common practice).
    const auto choice = chooseReference(Unit::Ampere, SignalType::Dc, 10.0, specs);
    REQUIRE(choice);
    CHECK(choice->reference == SpecRef{2, 0});
    CHECK(choice->shunt == SpecRef{3, 0});
    CHECK(describeChoice(*choice, specs) == "100 mV DC across 0.01 ohm");

    // At 5 A: I = V/R, so u(I) from the voltage is u(V)/R and from the shunt I·u(R)/R
    // (JCGM 100:2008 5.1.6, relative uncertainties of a quotient).
    const auto components = referenceComponents(*choice, specs, 5.0);
    REQUIRE(components.size() == 2);
    // Voltage 0.05 V: a = 0.005 % · 0.05 V + 0.0035 % · 0.1 V = 6 µV, rectangular (JCGM
    // 100:2008 4.3.7), divided by 0.01 ohm: a = 0.6 mA, u = 0.6 mA/√3.
    CHECK(components[0].distribution == Distribution::Rectangular);
    CHECK(components[0].value == mwtest::relative(6e-4, 1e-12));
    CHECK(standardUncertainty(components[0]) == mwtest::relative(6e-4 / std::sqrt(3.0), 1e-12));
    // Shunt: U = 2 µohm at k = 2 (JCGM 100:2008 4.3.3), relative 2e-4, times 5 A: U = 1 mA,
    // u = 0.5 mA, with the certificate's 30 degrees of freedom.
    CHECK(components[1].distribution == Distribution::Normal);
    CHECK(components[1].value == mwtest::relative(1e-3, 1e-12));
    CHECK(standardUncertainty(components[1]) == mwtest::relative(5e-4, 1e-12));
    CHECK(components[1].dof == 30.0);
}

TEST_CASE("limits are rectangular, a certificate's U is normal with its k and dof") {
    // ±(0.004 % rdg + 0.0008 % rng) on 20 V at 10 V: a = 0.4 mV + 0.16 mV = 0.56 mV, u = a/√3
    // (JCGM 100:2008 4.3.7).
    const UncertaintyComponent spec = standardComponent(bench()[1].spec, 10.0);
    CHECK(spec.value == mwtest::relative(5.6e-4, 1e-12));
    CHECK(standardUncertainty(spec) == mwtest::relative(5.6e-4 / std::sqrt(3.0), 1e-12));
    CHECK(std::isinf(spec.dof));
    // A floor adds to the limits.
    StandardRangeSpec floored = bench()[1].spec;
    floored.floor = 1e-4;
    CHECK(standardComponent(floored, 10.0).value == mwtest::relative(6.6e-4, 1e-12));
    // Certificate only: U/k (JCGM 100:2008 4.3.3).
    const UncertaintyComponent cert = standardComponent(bench()[6].spec, 0.01);
    CHECK(standardUncertainty(cert) == mwtest::relative(1e-6, 1e-12));
    // Both stated: the limits, because the standard is used without its corrections.
    StandardRangeSpec both = bench()[1].spec;
    both.certificate_expanded_uncertainty = 1e-5;
    CHECK(standardComponent(both, 10.0).distribution == Distribution::Rectangular);
    // A range that states nothing is never chosen.
    StandardRangeSpec silent;
    silent.unit = Unit::Volt;
    silent.full_scale = 50.0;
    CHECK_FALSE(statesUncertainty(silent));
    CHECK_FALSE(chooseReference(Unit::Volt, SignalType::Dc, 30.0, {{9, 0, silent}}));
}
