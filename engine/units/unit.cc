#include "engine/units/unit.h"

#include <cctype>
#include <string_view>

#include "engine/units/unit_parser.h"

namespace calctrail {

namespace {

const Dimension kEnergy = Dimension::exponents(2, 1, -2);
const Dimension kPower = Dimension::exponents(2, 1, -3);

bool isNameChar(char c) {
  return std::isalpha(static_cast<unsigned char>(c)) != 0 || c == '%';
}

// Canonical names whose printed symbol differs from the ASCII spelling.
const char* prettyName(std::string_view name) {
  if (name == "um") return "\u00B5m";
  if (name == "deg") return "\u00B0";
  if (name == "degC") return "\u00B0C";
  if (name == "degF") return "\u00B0F";
  if (name == "ddegC") return "\u0394\u00B0C";
  if (name == "ddegF") return "\u0394\u00B0F";
  return nullptr;
}

const char* superscript(char c) {
  switch (c) {
    case '0': return "\u2070";
    case '1': return "\u00B9";
    case '2': return "\u00B2";
    case '3': return "\u00B3";
    case '4': return "\u2074";
    case '5': return "\u2075";
    case '6': return "\u2076";
    case '7': return "\u2077";
    case '8': return "\u2078";
    case '9': return "\u2079";
    case '-': return "\u207B";
    default: return nullptr;
  }
}

}  // namespace

// Called for every value a report shows (some 300 times for a demo), so it
// appends in place: no substring per name, and the text itself when there
// is nothing to change ("mm", "kN", "MPa"; docs/performance.md, startup_perftest).
std::string Unit::pretty() const {
  // No product, no power, and none of prettyName's names (um, deg, degC, ddegC...: each holds a u or a d).
  const bool plain = text.find_first_of("*^ud") == std::string::npos;
  if (plain) return text;
  std::string out;
  out.reserve(text.size() + 8);
  const std::string_view all(text);
  size_t i = 0;
  while (i < all.size()) {
    const char c = all[i];
    if (isNameChar(c)) {
      size_t j = i;
      while (j < all.size() && isNameChar(all[j])) ++j;
      const std::string_view name = all.substr(i, j - i);
      if (const char* p = prettyName(name))
        out += p;
      else
        out += name;
      i = j;
    } else if (c == '*') {
      out += "\u00B7";
      ++i;
    } else if (c == '^') {
      ++i;
      while (i < all.size() && superscript(all[i])) out += superscript(all[i++]);
    } else {
      out += c;
      ++i;
    }
  }
  return out;
}

UnitFit fitUnit(const Dimension& value, const Dimension& unit) {
  if (value == unit) return UnitFit::Exact;
  if (!value.sameIgnoringAngle(unit)) return UnitFit::Incompatible;
  // T*theta is work and T*omega is power: with the radian equal to 1 these are
  // right as they stand. Any other angle mismatch is likely a lost 2*pi.
  const Dimension plain = value.withoutAngle();
  if (plain == kEnergy || plain == kPower) return UnitFit::AngleDropped;
  return UnitFit::AngleWarning;
}

Unit preferredUnit(const Dimension& dim) {
  std::string symbol = dim.preferredSymbol();
  if (symbol.empty() && dim.exponent(Base::Angle) != 0) {
    const Dimension plain = dim.withoutAngle();
    if (plain == kEnergy || plain == kPower) symbol = plain.preferredSymbol();
  }
  Unit u;
  UnitError err;
  if (!symbol.empty() && parseUnit(symbol, &u, &err)) return u;
  return siUnit(dim);
}

Unit siUnit(const Dimension& dim) {
  Unit u;
  u.dim = dim;
  u.text = dim.siSymbol();
  return u;
}

}  // namespace calctrail
