#include "engine/units/unit_preferences.h"

#include <algorithm>
#include <cctype>

#include "engine/units/unit_parser.h"

namespace calctrail {

namespace {

using D = Dimension;

// The unit a US customary sheet shows per dimension. Lengths in inches and
// torques in lbf*in are how US machine drawings and catalogues of power screws
// and jacks give them; a nut's speed in in/min and its pV in psi*ft/min are
// how feed rates and bearing-material pV limits are quoted there (common
// practice). Dimensions without a row fall back to the engine's choice (rpm,
// s, deg, ...), which both systems share.
struct UsRow {
  Dimension dim;
  const char* unit;
};
const std::vector<UsRow>& usTable() {
  // Exponents: length, mass, time, current, temperature, amount, luminous, angle.
  static const std::vector<UsRow> rows = {
      {D::exponents(1, 0, 0), "in"},
      {D::exponents(2, 0, 0), "in^2"},
      {D::exponents(3, 0, 0), "in^3"},
      {D::exponents(4, 0, 0), "in^4"},
      {D::exponents(0, 1, 0), "lb"},
      {D::exponents(1, 1, -2), "lbf"},
      {D::exponents(2, 1, -2), "lbf*in"},
      {D::exponents(2, 1, -3), "hp"},
      {D::exponents(-1, 1, -2), "psi"},
      {D::exponents(1, 0, -1), "in/min"},
      {D::exponents(1, 0, -2), "in/s^2"},
      {D::exponents(-3, 1, 0), "lb/in^3"},
      {D::exponents(-2, 1, -2), "lbf/in^3"},
      {D::exponents(0, 1, -2), "lbf/in"},
      {D::exponents(1, 0, 0, 0, 0, 0, 0, -1), "in/rev"},
      {D::exponents(-1, 0, 0, 0, 0, 0, 0, 1), "rev/in"},
      {D::exponents(-1, 0, 0), "1/in"},
      {D::exponents(2, 1, 0), "lb*in^2"},
      {D::exponents(2, 1, -2, 0, 0, 0, 0, -1), "lbf*in/rad"},
      {D::exponents(1, 1, -1), "lbf*s"},
      {D::exponents(0, 1, -3), "psi*ft/min"},
  };
  return rows;
}

bool isNameChar(char c) { return std::isalpha(static_cast<unsigned char>(c)) != 0 || c == '%'; }

UnitFamily familyOfName(const std::string& name) {
  static const char* const us[] = {"in", "ft", "yd", "mil", "lb", "lbf", "kip", "ozf", "slug",
                                   "psi", "ksi", "hp", "degF", "ddegF"};
  static const char* const si[] = {"m",  "km",  "cm",  "mm", "um", "kg", "g",    "t",   "N",
                                   "kN", "MN",  "kgf", "Pa", "kPa", "MPa", "GPa", "bar", "J",
                                   "kJ", "Wh",  "kWh", "W",  "kW", "degC", "ddegC"};
  for (const char* u : us)
    if (name == u) return UnitFamily::US;
  for (const char* u : si)
    if (name == u) return UnitFamily::SI;
  return UnitFamily::Neutral;
}

std::string trimmed(std::string_view s, size_t* lead) {
  size_t b = 0, e = s.size();
  while (b < e && (s[b] == ' ' || s[b] == '\t')) ++b;
  while (e > b && (s[e - 1] == ' ' || s[e - 1] == '\t')) --e;
  *lead = b;
  return std::string(s.substr(b, e - b));
}

std::string lower(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

const char* const kForm = "write `units: SI` or `units: US`, then any units to prefer, as in `units: US, ksi, in/s`";

}  // namespace

UnitFamily unitFamily(const Unit& u) {
  UnitFamily family = UnitFamily::Neutral;
  const std::string& t = u.text;
  size_t i = 0;
  while (i < t.size()) {
    if (!isNameChar(t[i])) {
      ++i;
      continue;
    }
    size_t j = i;
    while (j < t.size() && isNameChar(t[j])) ++j;
    const UnitFamily f = familyOfName(t.substr(i, j - i));
    if (f == UnitFamily::US) return UnitFamily::US;  // one US unit makes a mixed unit US
    if (f == UnitFamily::SI) family = UnitFamily::SI;
    i = j;
  }
  return family;
}

std::optional<Unit> UnitPreferences::systemUnit(const Dimension& dim) const {
  const char* text = nullptr;
  if (system_ == UnitSystem::SI) {
    if (dim.preferredSymbol().empty()) return std::nullopt;
    return preferredUnit(dim);
  }
  if (system_ == UnitSystem::US) {
    for (const UsRow& r : usTable())
      if (r.dim == dim) text = r.unit;
  }
  if (!text) return std::nullopt;
  Unit u;
  UnitError err;
  if (!parseUnit(text, &u, &err)) return std::nullopt;  // the table test keeps every row parsable
  return u;
}

Unit UnitPreferences::choose(const Dimension& dim, const Unit* natural) const {
  for (const Unit& c : chosen_)
    if (c.dim == dim) return c;
  const bool fits = natural && natural->dim == dim;
  if (fits) {
    const UnitFamily f = unitFamily(*natural);
    if (system_ == UnitSystem::Unstated || f == UnitFamily::Neutral ||
        (f == UnitFamily::SI && system_ == UnitSystem::SI) || (f == UnitFamily::US && system_ == UnitSystem::US))
      return *natural;
  }
  if (std::optional<Unit> u = systemUnit(dim)) return *u;
  return fits ? *natural : preferredUnit(dim);
}

bool UnitPreferences::parse(std::string_view text, UnitPreferences* out, std::string* error, size_t* at) {
  *out = UnitPreferences();
  size_t start = 0;
  bool first = true;
  while (true) {
    const size_t comma = text.find(',', start);
    const std::string_view part = text.substr(start, comma == std::string_view::npos ? text.npos : comma - start);
    size_t lead = 0;
    const std::string item = trimmed(part, &lead);
    *at = start + lead;
    if (first) {
      const std::string sys = lower(item);
      if (sys == "si") out->system_ = UnitSystem::SI;
      else if (sys == "us" || sys == "us customary") out->system_ = UnitSystem::US;
      else {
        *error = (item.empty() ? std::string("`units:` needs a system") : "`" + item + "` is not a system of units") +
                 "; " + kForm;
        return false;
      }
      first = false;
    } else {
      if (item.empty()) {
        *error = std::string("an empty item in `units:`; ") + kForm;
        return false;
      }
      Unit u;
      UnitError err;
      if (!parseUnit(item, &u, &err)) {
        *at += err.offset;
        *error = err.message;
        return false;
      }
      if (u.dim.dimensionless()) {
        *error = "`" + item + "` would show every plain number; prefer units that have a dimension";
        return false;
      }
      if (u.hasOffset()) {
        *error = "`" + item + "` is a temperature scale with its own zero; a preference takes K, ddegC or ddegF";
        return false;
      }
      for (const Unit& c : out->chosen_)
        if (c.dim == u.dim) {
          *error = "`" + item + "` and `" + c.text + "` are both " + u.dim.describe() +
                   "; prefer one unit per dimension";
          return false;
        }
      out->chosen_.push_back(u);
    }
    if (comma == std::string_view::npos) return true;
    start = comma + 1;
  }
}

std::vector<PreferenceRow> preferenceTable() {
  std::vector<PreferenceRow> rows;
  UnitPreferences us;
  std::string err;
  size_t at = 0;
  UnitPreferences::parse("US", &us, &err, &at);
  for (const UsRow& r : usTable()) {
    std::string words = r.dim.describe();
    words = words.substr(0, words.rfind(" ("));
    rows.push_back({words, preferredUnit(r.dim).text, us.systemUnit(r.dim)->text});
  }
  return rows;
}

}  // namespace calctrail
