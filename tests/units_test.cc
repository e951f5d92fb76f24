// The unit table's exact definitions, dimension algebra, the angle rules and
// absolute temperatures.
#include <catch2/catch.hpp>

#include <cmath>
#include <set>
#include <string>

#include "engine/units/dimension.h"
#include "engine/units/unit.h"
#include "engine/units/unit_parser.h"
#include "engine/units/unit_table.h"

using namespace calctrail;

namespace {

constexpr double kPi = 3.141592653589793238462643383279502884;

double relErr(double a, double b) { return std::fabs(a - b) / std::fabs(b); }

double factorOf(const char* name) {
  const UnitDef* d = findUnit(name);
  REQUIRE(d != nullptr);
  return d->factor;
}

Unit parsed(const std::string& text) {
  Unit u;
  UnitError err;
  INFO("parsing `" << text << "`: " << err.message);
  REQUIRE(parseUnit(text, &u, &err));
  return u;
}

const Dimension kLength = Dimension::exponents(1, 0, 0);
const Dimension kArea = Dimension::exponents(2, 0, 0);
const Dimension kForce = Dimension::exponents(1, 1, -2);
const Dimension kEnergy = Dimension::exponents(2, 1, -2);
const Dimension kPower = Dimension::exponents(2, 1, -3);
const Dimension kSpeed = Dimension::exponents(1, 0, -1);
const Dimension kAngle = Dimension::of(Base::Angle);
const Dimension kTime = Dimension::of(Base::Time);

}  // namespace

// Expected values are the exact decimal (or rational) results of the defining
// values, worked out by hand from the definitions cited beside each.
TEST_CASE("units: exact definitions of the customary units", "[units]") {
  // NIST SP 811 (2008) B.8: inch = 2.54 E-02 m, exact.
  CHECK(relErr(factorOf("in"), 0.0254) <= 1e-15);
  // NIST SP 811 (2008) B.8: foot = 3.048 E-01 m, exact.
  CHECK(relErr(factorOf("ft"), 0.3048) <= 1e-15);
  // NIST SP 811 (2008) B.8: pound (avoirdupois) = 4.5359237 E-01 kg, exact.
  CHECK(relErr(factorOf("lb"), 0.45359237) <= 1e-15);
  // NIST SP 811 (2008) B.8: pound-force = 0.45359237 kg * 9.80665 m/s^2
  // = 4.4482216152605 N, exact.
  CHECK(relErr(factorOf("lbf"), 4.4482216152605) <= 1e-15);
  // NIST SP 811 (2008) B.8: kilogram-force = 9.80665 N, exact.
  CHECK(relErr(factorOf("kgf"), 9.80665) <= 1e-15);
  // NIST SP 811 (2008) B.8: psi = lbf/in^2 = 4.4482216152605 / 0.00064516 Pa
  // = 6894.757293168361336... Pa.
  CHECK(relErr(factorOf("psi"), 6894.757293168361336722673) <= 1e-15);
  // NIST SP 811 (2008) B.8: ksi = 1000 psi.
  CHECK(relErr(factorOf("ksi"), 6894757.293168361336722673) <= 1e-15);
  // NIST SP 811 (2008) B.8: kip = 1000 lbf = 4448.2216152605 N, exact.
  CHECK(relErr(factorOf("kip"), 4448.2216152605) <= 1e-15);
  // NIST SP 811 (2008) B.8: slug = lbf*s^2/ft = 4.4482216152605 / 0.3048 kg
  // = 14.593902937206364829... kg.
  CHECK(relErr(factorOf("slug"), 14.593902937206364829396325) <= 1e-15);
  // NIST SP 811 (2008) B.8: horsepower (550 ft*lbf/s)
  // = 550 * 0.3048 * 4.4482216152605 W = 745.69987158227022 W, exact.
  CHECK(relErr(factorOf("hp"), 745.69987158227022) <= 1e-15);
  // NIST SP 811 (2008) B.8: ounce-force = lbf/16 = 0.27801385095378125 N, exact.
  CHECK(relErr(factorOf("ozf"), 0.27801385095378125) <= 1e-15);
  // NIST SP 811 (2008) B.8: yard = 0.9144 m; mil = 2.54 E-05 m, exact.
  CHECK(relErr(factorOf("yd"), 0.9144) <= 1e-15);
  CHECK(relErr(factorOf("mil"), 2.54e-5) <= 1e-15);
  CHECK(findUnit("thou") == findUnit("mil"));
  // SI Brochure 9th ed. Table 8 (from memory): deg = pi/180 rad; min = 60 s; h = 3600 s.
  CHECK(relErr(factorOf("deg"), kPi / 180) <= 1e-15);
  CHECK(relErr(factorOf("arcmin"), kPi / 180 / 60) <= 1e-15);
  CHECK(relErr(factorOf("arcsec"), kPi / 180 / 3600) <= 1e-15);
  CHECK(factorOf("min") == 60.0);
  CHECK(factorOf("h") == 3600.0);
  CHECK(relErr(factorOf("rev"), 2 * kPi) <= 1e-15);
  CHECK(relErr(factorOf("rpm"), 2 * kPi / 60) <= 1e-15);
  CHECK(factorOf("bar") == 1e5);
  CHECK(factorOf("Wh") == 3600.0);
  CHECK(factorOf("kWh") == 3.6e6);
  CHECK(factorOf("%") == 0.01);
  CHECK(factorOf("ppm") == 1e-6);
}

TEST_CASE("units: the table is complete and consistent", "[units]") {
  const char* const required[] = {
      "m", "km", "cm", "mm", "um", "\u00B5m", "\u03BCm", "in", "ft", "yd", "mil", "thou",
      "kg", "g", "t", "lb", "slug", "N", "kN", "MN", "lbf", "kip", "kgf", "ozf", "s", "ms",
      "min", "h", "Pa", "kPa", "MPa", "GPa", "bar", "psi", "ksi", "J", "kJ", "Wh", "kWh",
      "W", "kW", "hp", "rad", "deg", "rev", "arcmin", "arcsec", "rpm", "Hz", "%", "ppm",
      "K", "degC", "degF", "ddegC", "ddegF"};
  for (const char* name : required) {
    INFO(name);
    CHECK(findUnit(name) != nullptr);
  }
  std::set<std::string> spellings;
  for (const UnitDef& d : unitTable()) {
    INFO("unit " << d.name);
    CHECK(spellings.insert(std::string(d.name)).second);
    for (std::string_view a : d.aliases) CHECK(spellings.insert(std::string(a)).second);
    CHECK(std::isfinite(d.factor));
    CHECK(d.factor > 0);
    CHECK_FALSE(d.quantity.empty());
    CHECK_FALSE(d.definition.empty());
    CHECK_FALSE(d.source.empty());
    CHECK_FALSE(d.oracle.empty());
    CHECK((d.offset != 0.0) == (d.name == "degC" || d.name == "degF"));
    // Every name and alias parses to exactly its definition, spelled canonically.
    std::vector<std::string> all(d.aliases.begin(), d.aliases.end());
    all.emplace_back(d.name);
    for (const std::string& s : all) {
      Unit u = parsed(s);
      CHECK(u.text == d.name);
      CHECK(u.factor == d.factor);
      CHECK(u.offset == d.offset);
      CHECK(u.dim == d.dim);
    }
    // The human spelling reads back as the same unit.
    CHECK(parsed(parsed(std::string(d.name)).pretty()).text == d.name);
  }
  CHECK(findUnit("mPa") == nullptr);  // case-sensitive: MPa only
  CHECK(findUnit("") == nullptr);
}

TEST_CASE("units: dimension algebra", "[units]") {
  CHECK(kForce / kArea == parsed("Pa").dim);
  CHECK(kForce * kLength == kEnergy);
  CHECK(kEnergy / kTime == kPower);
  CHECK(kLength.pow(3) == Dimension::exponents(3, 0, 0));
  CHECK(kLength.pow(-2) == Dimension::exponents(-2, 0, 0));
  CHECK(Dimension::of(Base::Mass, 2) == Dimension::exponents(0, 2, 0));
  CHECK(kLength.exponent(Base::Length) == 1);
  CHECK(Dimension().dimensionless());
  CHECK_FALSE(kAngle.dimensionless());
  CHECK(kAngle.withoutAngle().dimensionless());
  CHECK(parsed("rpm").dim.sameIgnoringAngle(parsed("Hz").dim));
  CHECK_FALSE(parsed("rpm").dim.sameIgnoringAngle(kSpeed));

  SECTION("roots of even powers work; odd ones are refused") {
    Dimension out = kForce;
    CHECK(kArea.root(2, &out));
    CHECK(out == kLength);
    CHECK(Dimension::exponents(-2, 0, 2).root(2, &out));
    CHECK(out == Dimension::exponents(-1, 0, 1));
    CHECK(Dimension::exponents(3, 0, 0).root(3, &out));
    CHECK(out == kLength);
    out = kForce;
    CHECK_FALSE(kLength.root(2, &out));
    CHECK(out == kForce);  // untouched
    CHECK_FALSE(Dimension::exponents(3, 0, 0).root(2, &out));
    CHECK_FALSE(kArea.root(0, &out));
    CHECK(out == kForce);
    CHECK(Dimension().root(2, &out));
    CHECK(out == Dimension());
  }
  SECTION("SI symbols, which parse back to the same dimension at factor 1") {
    CHECK(kEnergy.siSymbol() == "kg*m^2/s^2");
    CHECK(kSpeed.siSymbol() == "m/s");
    CHECK(parsed("rpm").dim.siSymbol() == "rad/s");
    CHECK(Dimension().siSymbol() == "1");
    CHECK(kTime.pow(-1).siSymbol() == "1/s");
    CHECK(parsed("Pa").dim.siSymbol() == "kg/(m*s^2)");
    CHECK(parsed("mm/rev").dim.siSymbol() == "m/rad");
    const Dimension odd = Dimension::exponents(3, 1, -1, 1, -1, 1, 1, 2);
    for (const Dimension& d : {kEnergy, kSpeed, odd, odd.pow(-1), Dimension(), kAngle}) {
      const Unit u = parsed(d.siSymbol());
      CHECK(u.dim == d);
      CHECK(u.factor == 1.0);
      CHECK(siUnit(d).text == d.siSymbol());
      CHECK(siUnit(d).factor == 1.0);
    }
  }
  SECTION("names and descriptions") {
    CHECK(kForce.describe() == "force (N)");
    CHECK(kEnergy.describe() == "torque or energy (N*m)");
    CHECK(kSpeed.describe() == "speed (m/s)");
    CHECK(kPower.name() == "power");
    CHECK(parsed("MPa").dim.describe() == "pressure or stress (MPa)");
    CHECK(parsed("rpm").dim.name() == "rotational speed");
    CHECK(parsed("Hz").dim.name() == "frequency");
    CHECK(parsed("mm/rev").dim.name() == "length per revolution");
    CHECK(parsed("N/m").dim.name() == "stiffness or force per length");
    CHECK(parsed("kg/m^3").dim.name() == "density");
    CHECK(parsed("m/s^2").dim.name() == "acceleration");
    CHECK(kLength.name() == "length");
    CHECK(kArea.name() == "area");
    CHECK(kAngle.name() == "angle");
    CHECK(parsed("K").dim.name() == "temperature");
    CHECK(Dimension().name() == "dimensionless");
    CHECK(Dimension::exponents(3, 1, -1).name().empty());
    CHECK(Dimension::exponents(3, 1, -1).describe() == "kg*m^3/s (no common name)");
  }
  SECTION("every named dimension's preferred unit has exactly that dimension") {
    std::set<Dimension> seen;
    for (const Dimension& d : namedDimensions()) {
      INFO(d.name());
      CHECK(seen.insert(d).second);
      const Unit u = preferredUnit(d);
      CHECK(u.text == d.preferredSymbol());
      CHECK(u.dim == d);
    }
  }
}

TEST_CASE("units: preferred units", "[units]") {
  CHECK(preferredUnit(kEnergy).text == "N*m");
  CHECK(preferredUnit(kPower).text == "W");
  CHECK(preferredUnit(kForce).text == "N");
  CHECK(preferredUnit(kLength).text == "mm");
  CHECK(preferredUnit(kSpeed).text == "m/s");
  CHECK(preferredUnit(parsed("Pa").dim).text == "MPa");
  CHECK(preferredUnit(parsed("rpm").dim).text == "rpm");
  CHECK(preferredUnit(kAngle).text == "deg");
  CHECK(preferredUnit(Dimension()).text == "1");
  // Torque times an angle or a rotational speed: the radian is 1.
  CHECK(preferredUnit(kEnergy * kAngle).text == "N*m");
  CHECK(preferredUnit(kPower * kAngle).text == "W");
  // No common name: coherent SI.
  const Dimension odd = Dimension::exponents(3, 1, -1);
  CHECK(preferredUnit(odd).text == "kg*m^3/s");
  CHECK(preferredUnit(odd).factor == 1.0);
  // A rotational speed times a plain length is not silently made a speed.
  CHECK(preferredUnit(parsed("rpm").dim * kLength).text == "m*rad/s");
}

TEST_CASE("units: the angle rules", "[units]") {
  SECTION("torque times rpm is a power in W") {
    // 100 N*m at 1450 rpm: P = T*omega = 100 * 1450 * 2*pi/60 W = 15184.36 W.
    const Unit nm = parsed("N*m"), rpm = parsed("rpm"), w = parsed("W");
    const double si = nm.toSI(100) * rpm.toSI(1450);
    const Dimension dim = nm.dim * rpm.dim;
    CHECK(fitUnit(dim, w.dim) == UnitFit::AngleDropped);
    CHECK(relErr(w.fromSI(si), 100.0 * 1450.0 * 2 * kPi / 60) <= 1e-14);
    CHECK(w.fromSI(si) == Approx(15184.36).epsilon(1e-6));
    CHECK(parsed("kW").fromSI(si) == Approx(15.18436).epsilon(1e-6));
  }
  SECTION("torque times an angle is work in J") {
    CHECK(fitUnit(kEnergy * kAngle, parsed("J").dim) == UnitFit::AngleDropped);
    CHECK(fitUnit(kEnergy / kAngle, parsed("N*m").dim) == UnitFit::AngleDropped);
  }
  SECTION("nut speed: rpm times a lead per revolution is a plain speed") {
    // 1450 rpm * 5 mm/rev = 7250 mm/min = 0.120833 m/s; the angles cancel.
    const Unit rpm = parsed("rpm"), lead = parsed("mm/rev");
    const double si = rpm.toSI(1450) * lead.toSI(5);
    const Dimension dim = rpm.dim * lead.dim;
    CHECK(dim == kSpeed);
    CHECK(fitUnit(dim, parsed("m/s").dim) == UnitFit::Exact);
    CHECK(relErr(parsed("mm/min").fromSI(si), 7250.0) <= 1e-14);
    CHECK(relErr(si, 7250.0 / 1000 / 60) <= 1e-14);
    CHECK(si == Approx(0.120833).epsilon(1e-5));
    // The same with an inch lead: 1450 rpm * 0.2 in/rev = 290 in/min.
    const Unit in_lead = parsed("in/rev");
    CHECK(relErr(parsed("in/min").fromSI(rpm.toSI(1450) * in_lead.toSI(0.2)), 290.0) <= 1e-14);
  }
  SECTION("rpm times a plain length is a likely lost 2*pi") {
    const Dimension dim = parsed("rpm").dim * parsed("mm").dim;
    CHECK(fitUnit(dim, parsed("m/s").dim) == UnitFit::AngleWarning);
    CHECK(fitUnit(parsed("rpm").dim, parsed("Hz").dim) == UnitFit::AngleWarning);
    CHECK(fitUnit(kAngle, Dimension()) == UnitFit::AngleWarning);
  }
  SECTION("other fits") {
    CHECK(fitUnit(kForce, kForce) == UnitFit::Exact);
    CHECK(fitUnit(kForce, kEnergy) == UnitFit::Incompatible);
    CHECK(fitUnit(kEnergy * kAngle, kForce) == UnitFit::Incompatible);
  }
}

TEST_CASE("units: absolute temperatures and differences", "[units]") {
  const Unit c = parsed("degC"), f = parsed("degF"), k = parsed("K");
  // SI Brochure 9th ed. Table 4, degree Celsius (from memory): t/degC = T/K - 273.15.
  CHECK(c.toSI(20) == Approx(293.15).epsilon(1e-14));
  CHECK(c.hasOffset());
  // NIST SP 811 (2008) B.8, degree Fahrenheit (from memory): T/K = (t/degF + 459.67)/1.8.
  CHECK(f.toSI(68) == Approx(293.15).epsilon(1e-14));
  CHECK(f.fromSI(c.toSI(20)) == Approx(68).epsilon(1e-14));
  CHECK(f.fromSI(c.toSI(100)) == Approx(212).epsilon(1e-14));
  CHECK(f.toSI(32) == Approx(273.15).epsilon(1e-14));
  CHECK(f.toSI(-40) == Approx(c.toSI(-40)).epsilon(1e-14));
  CHECK(k.fromSI(c.toSI(0)) == Approx(273.15).epsilon(1e-14));
  const Unit dc = parsed("ddegC"), df = parsed("ddegF");
  CHECK_FALSE(dc.hasOffset());
  CHECK(dc.factor == 1.0);
  CHECK(relErr(df.factor, 5.0 / 9.0) <= 1e-15);
  CHECK(df.dim == k.dim);
  // An expansion coefficient of 12e-6 per ddegC is 12e-6 per K.
  CHECK(parsed("1/ddegC").toSI(12e-6) == Approx(12e-6).epsilon(1e-15));
  CHECK(relErr(parsed("1/ddegF").toSI(1), 1.8) <= 1e-15);
}

TEST_CASE("units: human spelling", "[units]") {
  CHECK(parsed("N*m").pretty() == "N\u00B7m");
  CHECK(parsed("mm^2").pretty() == "mm\u00B2");
  CHECK(parsed("m/s^2").pretty() == "m/s\u00B2");
  CHECK(parsed("um").pretty() == "\u00B5m");
  CHECK(parsed("kg/m^3").pretty() == "kg/m\u00B3");
  CHECK(parsed("m^-1").pretty() == "m\u207B\u00B9");
  CHECK(parsed("mm^4").pretty() == "mm\u2074");
  CHECK(parsed("W/(m*K)").pretty() == "W/(m\u00B7K)");
  CHECK(parsed("degC").pretty() == "\u00B0C");
  CHECK(parsed("deg").pretty() == "\u00B0");
  CHECK(parsed("1/in").pretty() == "1/in");
  CHECK(parsed("%").pretty() == "%");
  CHECK(siUnit(kEnergy).pretty() == "kg\u00B7m\u00B2/s\u00B2");
  // Units with nothing to change come back as written (pretty() returns the
  // text at once when it holds no `*`, `^`, `u` or `d`).
  CHECK(parsed("rpm").pretty() == "rpm");
  CHECK(parsed("kN").pretty() == "kN");
  CHECK(parsed("MPa").pretty() == "MPa");
  CHECK(parsed("in/rev").pretty() == "in/rev");
  CHECK(parsed("mm/deg").pretty() == "mm/\u00B0");
  CHECK(parsed("ddegC").pretty() == "\u0394\u00B0C");
  CHECK(parsed("um/s").pretty() == "\u00B5m/s");
}

TEST_CASE("units: suggestions for unknown units", "[units]") {
  using V = std::vector<std::string>;
  const auto first = [](const std::string& s) { return suggestUnits(s).at(0); };
  CHECK(suggestUnits("lbs") == V{"lb", "lbf"});
  CHECK(first("Nm") == "N*m");
  CHECK(first("kNm") == "kN*m");
  CHECK(first("kgs") == "kg");
  CHECK(first("sec") == "s");
  CHECK(first("mins") == "min");
  CHECK(first("RPM") == "rpm");
  CHECK(first("inch") == "in");
  CHECK(first("mPa") == "MPa");
  CHECK(first("Mpa") == "MPa");
  CHECK(first("KN") == "kN");
  CHECK(first("hr") == "h");
  CHECK(first("mm2") == "mm^2");
  CHECK(first("kkm") == "km");
  CHECK(suggestUnits("C", 2) == V{"degC", "ddegC"});
  CHECK(suggestUnits("xyzzyq").empty());
  CHECK(suggestUnits("lbs", 1) == V{"lb"});
  for (const std::string& s : suggestUnits("mN")) CHECK(s != "m*N");
}
