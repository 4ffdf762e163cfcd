// Reference-standard specifications: values at a reading, budget components, the text form.
#include "core/accuracy/reference_spec.h"

#include "support/approx.h"

#include <catch2/catch.hpp>

#include <cmath>
#include <stdexcept>

using namespace mw;

TEST_CASE("percent of reading plus percent of range") {
    // Common practice: ±(0.02 % of reading + 0.01 % of range); 5 V on a 10 V range
    // -> 1 mV + 1 mV = 2 mV, taken as rectangular limits (JCGM 100:2008 4.3.7).
    const ReferenceSpec spec = parseReferenceSpec("0.02%rdg+0.01%rng", Unit::Volt);
    CHECK(spec.form == ReferenceSpecForm::PercentReadingRange);
    CHECK(specValue(spec, 5.0, 10.0) == mwtest::relative(2e-3, 1e-12));
    const UncertaintyComponent c = referenceComponent(spec, 5.0, 10.0);
    CHECK(c.distribution == Distribution::Rectangular);
    CHECK(standardUncertainty(c) == mwtest::relative(2e-3 / std::sqrt(3.0), 1e-12));
    // A negative reading takes the modulus.
    CHECK(specValue(spec, -5.0, 10.0) == mwtest::relative(2e-3, 1e-12));
}

TEST_CASE("ppm of reading plus ppm of range") {
    // Common practice: ±(20 ppm + 5 ppm) at 10 V of a 10 V range -> 250 µV.
    const ReferenceSpec spec = parseReferenceSpec("20ppm+5ppm", Unit::Volt);
    CHECK(spec.form == ReferenceSpecForm::PpmReadingRange);
    CHECK(specValue(spec, 10.0, 10.0) == mwtest::relative(250e-6, 1e-12));
    const ReferenceSpec named = parseReferenceSpec("5 ppmrng + 20 ppmrdg", Unit::Volt);
    CHECK(specValue(named, 10.0, 10.0) == mwtest::relative(250e-6, 1e-12));
}

TEST_CASE("a fixed value and a certificate's expanded uncertainty") {
    const ReferenceSpec fixed = parseReferenceSpec("±0.5mV", Unit::Volt);
    CHECK(fixed.form == ReferenceSpecForm::Fixed);
    CHECK(specValue(fixed, 7.0, 10.0) == mwtest::relative(0.5e-3, 1e-12));
    // JCGM 100:2008 4.3.3: a certificate's U with its k gives u = U/k, normal.
    const ReferenceSpec certificate = parseReferenceSpec("U=1.2mV, k=2", Unit::Volt);
    CHECK(certificate.form == ReferenceSpecForm::Certificate);
    const UncertaintyComponent c = referenceComponent(certificate, 7.0, 10.0);
    CHECK(c.distribution == Distribution::Normal);
    CHECK(standardUncertainty(c) == mwtest::relative(0.6e-3, 1e-12));
    CHECK(std::isinf(c.dof)); // none stated: taken as exactly known (JCGM 100:2008 G.4.3)
}

TEST_CASE("a certificate's degrees of freedom are read and carried into the component") {
    // JCGM 100:2008 G.4.1: a certificate stating ν_eff = 8 for its U gives the component ν = 8.
    const ReferenceSpec spec = parseReferenceSpec("U=1mV,k=2,dof=8", Unit::Volt);
    CHECK(spec.form == ReferenceSpecForm::Certificate);
    CHECK(spec.fixedValue == mwtest::relative(1e-3, 1e-12));
    CHECK(spec.dof == 8.0);
    CHECK(referenceComponent(spec, 5.0, 10.0).dof == 8.0);
    CHECK(parseReferenceSpec("0.02%rdg+0.01%rng, DOF=50", Unit::Volt).dof == 50.0);
    CHECK(std::isinf(parseReferenceSpec("U=1mV,k=2,dof=inf", Unit::Volt).dof));
    CHECK_THROWS_WITH(parseReferenceSpec("U=1mV,k=2,dof=0", Unit::Volt),
                      Catch::Contains("degrees of freedom"));
    CHECK_THROWS_WITH(parseReferenceSpec("U=1mV,k=2,dof=x", Unit::Volt),
                      Catch::Contains("character 15"));
    // Round trip keeps it; a bare number takes the range's prefix when asked.
    CHECK(parseReferenceSpec(formatReferenceSpec(spec), Unit::Volt).dof == 8.0);
    ParseOptions micro;
    micro.bareNumberPowerOfTen = -6;
    CHECK(parseReferenceSpec("U=0.5,k=2", Unit::Ampere, micro).fixedValue == 0.5e-6);
    CHECK(describeReferenceSpec(spec, Unit::Volt) == "U = 1.00 mV (k = 2, \u03BD = 8)");
}

TEST_CASE("the text form round-trips") {
    for (const char* text : {"0.02%rdg+0.01%rng", "20ppm+5ppm", "0.0005", "U=0.0012,k=2"}) {
        const ReferenceSpec spec = parseReferenceSpec(text, Unit::Volt);
        const ReferenceSpec back = parseReferenceSpec(formatReferenceSpec(spec), Unit::Volt);
        INFO(text);
        CHECK(back.form == spec.form);
        CHECK(specValue(back, 3.0, 10.0) == mwtest::relative(specValue(spec, 3.0, 10.0), 1e-12));
        CHECK(back.coverageK == spec.coverageK);
    }
}

TEST_CASE("bad spec text is refused naming the place and the reason") {
    CHECK_THROWS_WITH(parseReferenceSpec("", Unit::Volt), Catch::Contains("empty"));
    CHECK_THROWS_WITH(parseReferenceSpec("0.02%rdg+x%rng", Unit::Volt),
                      Catch::Contains("character 10") && Catch::Contains("expected a number"));
    CHECK_THROWS_WITH(parseReferenceSpec("0.02%rdg+0.01%abc", Unit::Volt),
                      Catch::Contains("unknown term"));
    CHECK_THROWS_WITH(parseReferenceSpec("U=1mV", Unit::Volt), Catch::Contains("coverage factor"));
    CHECK_THROWS_WITH(parseReferenceSpec("U=1mV,k=0", Unit::Volt),
                      Catch::Contains("coverage factor"));
    CHECK_THROWS_AS(parseReferenceSpec("0.5mA", Unit::Volt), std::invalid_argument);
}

TEST_CASE("error positions count characters of the text as typed") {
    // "±" is one character and spaces are kept in the count: 'x' is character 15.
    CHECK_THROWS_WITH(parseReferenceSpec("\xC2\xB1 0.02 %rdg + x%rng", Unit::Volt),
                      Catch::Contains("at character 15"));
}
