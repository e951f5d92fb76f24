#include "engine/units/dimension.h"

namespace calctrail {

namespace {

// One row per dimension that has a common name: the words for messages and the
// unit a machine designer expects to read it in (see docs/units.md for why).
struct NamedDimension {
  Dimension dim;
  const char* name;
  const char* preferred;
};

const std::vector<NamedDimension>& namedTable() {
  using D = Dimension;
  // Exponents: length, mass, time, current, temperature, amount, luminous, angle.
  static const std::vector<NamedDimension> table = {
      {D(), "dimensionless", "1"},
      {D::exponents(1, 0, 0), "length", "mm"},
      {D::exponents(2, 0, 0), "area", "mm^2"},
      {D::exponents(3, 0, 0), "volume or section modulus", "mm^3"},
      {D::exponents(4, 0, 0), "second moment of area", "mm^4"},
      {D::exponents(0, 1, 0), "mass", "kg"},
      {D::exponents(0, 0, 1), "time", "s"},
      {D::exponents(0, 0, 0, 1), "electric current", "A"},
      {D::exponents(0, 0, 0, 0, 1), "temperature", "K"},
      {D::exponents(0, 0, 0, 0, 0, 1), "amount of substance", "mol"},
      {D::exponents(0, 0, 0, 0, 0, 0, 1), "luminous intensity", "cd"},
      {D::exponents(0, 0, 0, 0, 0, 0, 0, 1), "angle", "deg"},
      {D::exponents(1, 0, -1), "speed", "m/s"},
      {D::exponents(1, 0, -2), "acceleration", "m/s^2"},
      {D::exponents(1, 1, -2), "force", "N"},
      {D::exponents(2, 1, -2), "torque or energy", "N*m"},
      {D::exponents(2, 1, -3), "power", "W"},
      {D::exponents(-1, 1, -2), "pressure or stress", "MPa"},
      {D::exponents(-3, 1, 0), "density", "kg/m^3"},
      {D::exponents(-2, 1, -2), "weight per volume", "N/m^3"},
      {D::exponents(0, 1, -2), "stiffness or force per length", "N/mm"},
      {D::exponents(0, 0, -1, 0, 0, 0, 0, 1), "rotational speed", "rpm"},
      {D::exponents(0, 0, -2, 0, 0, 0, 0, 1), "angular acceleration", "rad/s^2"},
      {D::exponents(0, 0, -1), "frequency", "Hz"},
      {D::exponents(1, 0, 0, 0, 0, 0, 0, -1), "length per revolution", "mm/rev"},
      {D::exponents(-1, 0, 0, 0, 0, 0, 0, 1), "revolutions per length", "rev/mm"},
      {D::exponents(-1, 0, 0), "per length", "1/mm"},
      {D::exponents(2, 1, 0), "moment of inertia", "kg*m^2"},
      {D::exponents(2, 1, -2, 0, 0, 0, 0, -1), "torsional stiffness", "N*m/rad"},
      {D::exponents(1, 1, -1), "momentum or impulse", "N*s"},
      {D::exponents(0, 1, -1), "mass flow rate", "kg/s"},
      {D::exponents(3, 0, -1), "volume flow rate", "m^3/s"},
      {D::exponents(-1, 1, -1), "dynamic viscosity", "Pa*s"},
      {D::exponents(2, 0, -1), "kinematic viscosity", "m^2/s"},
      // Nut wear is judged by bearing pressure times sliding speed (pV).
      {D::exponents(0, 1, -3), "pressure times speed (pV) or heat flux", "MPa*m/s"},
      {D::exponents(1, 1, -3, 0, -1), "thermal conductivity", "W/(m*K)"},
      {D::exponents(2, 0, -2, 0, -1), "specific heat capacity", "J/(kg*K)"},
      {D::exponents(0, 0, 0, 0, -1), "per temperature", "1/K"},
      {D::exponents(2, 1, -3, -1), "voltage", "V"},
  };
  return table;
}

const NamedDimension* findNamed(const Dimension& d) {
  for (const NamedDimension& n : namedTable())
    if (n.dim == d) return &n;
  return nullptr;
}

// Base symbols in the order the SI Brochure writes derived units (kg before m).
struct BaseSymbol {
  Base base;
  const char* symbol;
};
constexpr BaseSymbol kSymbolOrder[] = {
    {Base::Mass, "kg"},     {Base::Length, "m"},   {Base::Time, "s"},
    {Base::Current, "A"},   {Base::Temperature, "K"}, {Base::Amount, "mol"},
    {Base::Luminous, "cd"}, {Base::Angle, "rad"},
};

// Appends `symbol` with its power ("m", "s^2") to *out.
void appendFactor(std::string* out, const char* symbol, int power) {
  *out += symbol;
  if (power != 1) {
    *out += '^';
    *out += std::to_string(power);
  }
}

}  // namespace

Dimension Dimension::of(Base base, int power) {
  Dimension d;
  d.e_[static_cast<int>(base)] = static_cast<std::int8_t>(power);
  return d;
}

Dimension Dimension::exponents(int length, int mass, int time, int current,
                               int temperature, int amount, int luminous, int angle) {
  Dimension d;
  const int e[kBases] = {length, mass, time, current, temperature, amount, luminous, angle};
  for (int i = 0; i < kBases; ++i) d.e_[i] = static_cast<std::int8_t>(e[i]);
  return d;
}

// Exponents are small integers; the unit parser bounds the powers it accepts.
Dimension Dimension::operator*(const Dimension& o) const {
  Dimension d;
  for (int i = 0; i < kBases; ++i) d.e_[i] = static_cast<std::int8_t>(e_[i] + o.e_[i]);
  return d;
}

Dimension Dimension::operator/(const Dimension& o) const {
  Dimension d;
  for (int i = 0; i < kBases; ++i) d.e_[i] = static_cast<std::int8_t>(e_[i] - o.e_[i]);
  return d;
}

Dimension Dimension::pow(int n) const {
  Dimension d;
  for (int i = 0; i < kBases; ++i) d.e_[i] = static_cast<std::int8_t>(e_[i] * n);
  return d;
}

bool Dimension::root(int n, Dimension* out) const {
  if (n <= 0) return false;
  Dimension d;
  for (int i = 0; i < kBases; ++i) {
    if (e_[i] % n != 0) return false;
    d.e_[i] = static_cast<std::int8_t>(e_[i] / n);
  }
  *out = d;
  return true;
}

bool Dimension::dimensionless() const {
  for (std::int8_t e : e_)
    if (e != 0) return false;
  return true;
}

Dimension Dimension::withoutAngle() const {
  Dimension d = *this;
  d.e_[static_cast<int>(Base::Angle)] = 0;
  return d;
}

std::string Dimension::siSymbol() const {
  // Written into one string, numerator first and then the denominator, with
  // no string made for a part (most symbols fit the string's own buffer): the
  // trail asks for it once per step.
  std::string out;
  int den_count = 0;
  for (const BaseSymbol& b : kSymbolOrder) {
    const int e = exponent(b.base);
    if (e > 0) {
      if (!out.empty()) out += '*';
      appendFactor(&out, b.symbol, e);
    } else if (e < 0) {
      ++den_count;
    }
  }
  if (out.empty()) out = "1";
  if (den_count == 0) return out;
  // Parenthesised so that the text reads (and parses) as one quotient.
  out += den_count > 1 ? "/(" : "/";
  bool first = true;
  for (const BaseSymbol& b : kSymbolOrder) {
    const int e = exponent(b.base);
    if (e >= 0) continue;
    if (!first) out += '*';
    first = false;
    appendFactor(&out, b.symbol, -e);
  }
  if (den_count > 1) out += ')';
  return out;
}

std::string Dimension::name() const {
  const NamedDimension* n = findNamed(*this);
  return n ? n->name : "";
}

std::string Dimension::preferredSymbol() const {
  const NamedDimension* n = findNamed(*this);
  return n ? n->preferred : "";
}

std::string Dimension::describe() const {
  const NamedDimension* n = findNamed(*this);
  if (n) return std::string(n->name) + " (" + n->preferred + ")";
  return siSymbol() + " (no common name)";
}

std::vector<Dimension> namedDimensions() {
  std::vector<Dimension> out;
  for (const NamedDimension& n : namedTable()) out.push_back(n.dim);
  return out;
}

}  // namespace calctrail
