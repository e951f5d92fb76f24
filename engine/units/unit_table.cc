#include "engine/units/unit_table.h"

#include <algorithm>
#include <cctype>
#include <unordered_map>

#include "engine/units/unit_preferences.h"
#include "engine/util/edit_distance.h"
#include "engine/util/math_constants.h"

namespace calctrail {

namespace {

// Exact defining values. Decimal literals are written in full where the exact
// value is a finite decimal, so that each is rounded to double only once.
constexpr double kInch = 0.0254;            // m, exact
constexpr double kFoot = 0.3048;            // m, exact (12 in)
constexpr double kPound = 0.45359237;       // kg, exact
constexpr double kGn = 9.80665;             // m/s^2, standard gravity, exact
constexpr double kLbf = 4.4482216152605;    // N, exact (kPound * kGn)

// Sources. Table and section numbers are cited from memory of:
//   SI Brochure, 9th edition (BIPM, 2019): Table 2 base units, Table 4 derived
//   units with special names, Table 7 prefixes, Table 8 non-SI units accepted
//   for use with the SI, section 5.4.7 dimensionless quantities (percent);
//   NIST Special Publication 811 (2008): Appendix B.8 conversion factors listed
//   alphabetically (exact ones in bold there), section 7.10.3 ppm.
const char* const kSiBase = "SI Brochure 9th ed. (2019) Table 2";
const char* const kSiDerived = "SI Brochure 9th ed. (2019) Table 4";
const char* const kSiPrefix = "SI Brochure 9th ed. (2019) Table 7 (prefixes)";
const char* const kSiAccepted = "SI Brochure 9th ed. (2019) Table 8";
const char* const kNist = "NIST SP 811 (2008) Appendix B.8";

Dimension dims(int length, int mass, int time, int current = 0, int temperature = 0,
               int angle = 0) {
  return Dimension::exponents(length, mass, time, current, temperature, 0, 0, angle);
}

UnitDef unit(std::string_view name, std::vector<std::string_view> aliases, double factor,
             Dimension dim, std::string_view quantity, std::string_view definition,
             std::string_view source, std::string_view oracle, double offset = 0.0) {
  return UnitDef{name, std::move(aliases), factor, offset, dim, quantity, definition, source, oracle};
}

std::vector<UnitDef> buildTable() {
  const Dimension length = dims(1, 0, 0);
  const Dimension mass = dims(0, 1, 0);
  const Dimension time = dims(0, 0, 1);
  const Dimension force = dims(1, 1, -2);
  const Dimension pressure = dims(-1, 1, -2);
  const Dimension energy = dims(2, 1, -2);
  const Dimension power = dims(2, 1, -3);
  const Dimension angle = dims(0, 0, 0, 0, 0, 1);
  const Dimension none;
  const Dimension temperature = dims(0, 0, 0, 0, 1);

  std::vector<UnitDef> t;
  t.reserve(64);  // the whole table without regrowing it
  // Length.
  t.push_back(unit("m", {}, 1.0, length, "length", "SI base unit", kSiBase, "meter"));
  t.push_back(unit("km", {}, 1e3, length, "length", "1000 m", kSiPrefix, "kilometer"));
  t.push_back(unit("cm", {}, 1e-2, length, "length", "0.01 m", kSiPrefix, "centimeter"));
  t.push_back(unit("mm", {}, 1e-3, length, "length", "0.001 m", kSiPrefix, "millimeter"));
  // Both the micro sign U+00B5 and the Greek mu U+03BC are what people type.
  t.push_back(unit("um", {"\u00B5m", "\u03BCm"}, 1e-6, length, "length", "1e-6 m",
                   kSiPrefix, "micrometer"));
  t.push_back(unit("in", {}, kInch, length, "length", "0.0254 m (exact)", kNist, "inch"));
  t.push_back(unit("ft", {}, kFoot, length, "length", "12 in = 0.3048 m (exact)", kNist,
                   "foot"));
  t.push_back(unit("yd", {}, 0.9144, length, "length", "3 ft = 0.9144 m (exact)", kNist,
                   "yard"));
  t.push_back(unit("mil", {"thou"}, 2.54e-5, length, "length",
                   "0.001 in = 2.54e-5 m (exact)", kNist, "mil"));
  // Mass.
  t.push_back(unit("kg", {}, 1.0, mass, "mass", "SI base unit", kSiBase, "kilogram"));
  t.push_back(unit("g", {}, 1e-3, mass, "mass", "0.001 kg", kSiPrefix, "gram"));
  t.push_back(unit("t", {}, 1e3, mass, "mass", "1000 kg (tonne)", kSiAccepted, "tonne"));
  t.push_back(unit("lb", {}, kPound, mass, "mass", "0.45359237 kg (exact)", kNist,
                   "pound"));
  t.push_back(unit("slug", {}, kLbf / kFoot, mass, "mass",
                   "1 lbf*s^2/ft = 14.5939029... kg (exact by definition)", kNist,
                   "slug"));
  // Force.
  t.push_back(unit("N", {}, 1.0, force, "force", "1 kg*m/s^2", kSiDerived, "newton"));
  t.push_back(unit("kN", {}, 1e3, force, "force", "1000 N", kSiPrefix, "kilonewton"));
  t.push_back(unit("MN", {}, 1e6, force, "force", "1e6 N", kSiPrefix, "meganewton"));
  t.push_back(unit("lbf", {}, kLbf, force, "force",
                   "1 lb * 9.80665 m/s^2 = 4.4482216152605 N (exact)", kNist, "lbf"));
  t.push_back(unit("kip", {}, 1e3 * kLbf, force, "force",
                   "1000 lbf = 4448.2216152605 N (exact)", kNist, "kip"));
  t.push_back(unit("kgf", {}, kGn, force, "force", "1 kg * 9.80665 m/s^2 = 9.80665 N (exact)",
                   kNist, "kgf"));
  t.push_back(unit("ozf", {}, kLbf / 16.0, force, "force",
                   "lbf/16 = 0.27801385095378125 N (exact)", kNist, "ounce force"));
  // Time.
  t.push_back(unit("s", {}, 1.0, time, "time", "SI base unit", kSiBase, "second"));
  t.push_back(unit("ms", {}, 1e-3, time, "time", "0.001 s", kSiPrefix, "millisecond"));
  t.push_back(unit("min", {}, 60.0, time, "time", "60 s", kSiAccepted, "minute"));
  t.push_back(unit("h", {}, 3600.0, time, "time", "3600 s", kSiAccepted, "hour"));
  // Pressure and stress.
  t.push_back(unit("Pa", {}, 1.0, pressure, "pressure or stress", "1 N/m^2", kSiDerived,
                   "pascal"));
  t.push_back(unit("kPa", {}, 1e3, pressure, "pressure or stress", "1000 Pa", kSiPrefix,
                   "kilopascal"));
  t.push_back(unit("MPa", {}, 1e6, pressure, "pressure or stress", "1e6 Pa = 1 N/mm^2",
                   kSiPrefix, "megapascal"));
  t.push_back(unit("GPa", {}, 1e9, pressure, "pressure or stress", "1e9 Pa", kSiPrefix,
                   "gigapascal"));
  t.push_back(unit("bar", {}, 1e5, pressure, "pressure", "1e5 Pa (exact)", kNist, "bar"));
  t.push_back(unit("psi", {}, kLbf / (kInch * kInch), pressure, "pressure or stress",
                   "1 lbf/in^2 = 6894.757... Pa (exact by definition)", kNist, "psi"));
  t.push_back(unit("ksi", {}, 1e3 * kLbf / (kInch * kInch), pressure, "pressure or stress",
                   "1000 psi", kNist, "ksi"));
  // Energy.
  t.push_back(unit("J", {}, 1.0, energy, "energy", "1 N*m", kSiDerived, "joule"));
  t.push_back(unit("kJ", {}, 1e3, energy, "energy", "1000 J", kSiPrefix, "kilojoule"));
  t.push_back(unit("Wh", {}, 3600.0, energy, "energy", "1 W*h = 3600 J (exact)", kNist,
                   "watt hour"));
  t.push_back(unit("kWh", {}, 3.6e6, energy, "energy", "1000 Wh = 3.6e6 J (exact)", kNist,
                   "kilowatt hour"));
  // Power.
  t.push_back(unit("W", {}, 1.0, power, "power", "1 J/s", kSiDerived, "watt"));
  t.push_back(unit("kW", {}, 1e3, power, "power", "1000 W", kSiPrefix, "kilowatt"));
  t.push_back(unit("hp", {}, 550.0 * kFoot * kLbf, power, "power",
                   "550 ft*lbf/s = 745.69987158227022 W (exact)", kNist, "horsepower"));
  // Angle: the radian is 1; the exponent is tracked (see dimension.h).
  t.push_back(unit("rad", {}, 1.0, angle, "angle", "1 m/m = 1", kSiDerived, "radian"));
  t.push_back(unit("deg", {"\u00B0"}, kPi / 180.0, angle, "angle", "pi/180 rad",
                   kSiAccepted, "degree"));
  t.push_back(unit("arcmin", {}, kPi / 10800.0, angle, "angle", "deg/60 = pi/10800 rad",
                   kSiAccepted, "arcminute"));
  t.push_back(unit("arcsec", {}, kPi / 648000.0, angle, "angle",
                   "arcmin/60 = pi/648000 rad", kSiAccepted, "arcsecond"));
  // One full turn; NIST SP 811 B.8 converts rpm with it (from memory).
  t.push_back(unit("rev", {}, 2.0 * kPi, angle, "angle", "2*pi rad (one full turn)", kNist,
                   "revolution"));
  // Rotational speed and frequency: the SI Brochure keeps Hz for 1/s, never
  // for angular velocity, so rpm carries the angle and Hz does not.
  t.push_back(unit("rpm", {}, 2.0 * kPi / 60.0, dims(0, 0, -1, 0, 0, 1), "rotational speed",
                   "1 rev/min = pi/30 rad/s", kNist, "rpm"));
  t.push_back(unit("Hz", {}, 1.0, dims(0, 0, -1), "frequency", "1/s", kSiDerived, "hertz"));
  // Dimensionless.
  t.push_back(unit("%", {}, 0.01, none, "dimensionless ratio", "0.01",
                   "SI Brochure 9th ed. (2019) 5.4.7", "percent"));
  t.push_back(unit("ppm", {}, 1e-6, none, "dimensionless ratio", "1e-6",
                   "NIST SP 811 (2008) 7.10.3", "ppm"));
  // Temperature. degC and degF are absolute (with an offset); the interval
  // units ddegC and ddegF are for differences (expansion, temperature rise).
  t.push_back(unit("K", {}, 1.0, temperature, "temperature", "SI base unit", kSiBase,
                   "kelvin"));
  t.push_back(unit("degC", {"\u00B0C", "\u2103"}, 1.0, temperature,
                   "temperature (absolute)", "T/K = t/degC + 273.15", kSiDerived,
                   "tempC(1)", 273.15));
  t.push_back(unit("degF", {"\u00B0F", "\u2109"}, 5.0 / 9.0, temperature,
                   "temperature (absolute)", "T/K = (t/degF + 459.67)/1.8", kNist,
                   "tempF(1)", 459.67 * 5.0 / 9.0));
  t.push_back(unit("ddegC", {"\u0394\u00B0C"}, 1.0, temperature, "temperature difference",
                   "1 K", kSiDerived, "degC"));
  t.push_back(unit("ddegF", {"\u0394\u00B0F"}, 5.0 / 9.0, temperature,
                   "temperature difference", "5/9 K", kNist, "degF"));
  // Electrical (motor current and voltage) and the remaining SI base units.
  t.push_back(unit("A", {}, 1.0, dims(0, 0, 0, 1), "electric current", "SI base unit",
                   kSiBase, "ampere"));
  t.push_back(unit("V", {}, 1.0, dims(2, 1, -3, -1), "voltage", "1 W/A", kSiDerived,
                   "volt"));
  t.push_back(unit("mol", {}, 1.0, Dimension::exponents(0, 0, 0, 0, 0, 1),
                   "amount of substance", "SI base unit", kSiBase, "mole"));
  t.push_back(unit("cd", {}, 1.0, Dimension::exponents(0, 0, 0, 0, 0, 0, 1),
                   "luminous intensity", "SI base unit", kSiBase, "candela"));
  return t;
}

// Every name and alias with its unit, sorted by length and then by bytes
// (spellingBefore). A sorted array of views into the table: built with one
// allocation and searched without copying the name looked up, where a hash
// map of strings made a node and a copy per spelling (it is built at every
// start-up, docs/performance.md).
using Spelling = std::pair<std::string_view, const UnitDef*>;
// Length first: most steps of a search then compare two sizes, not two texts.
bool spellingBefore(std::string_view a, std::string_view b) {
  return a.size() != b.size() ? a.size() < b.size() : a < b;
}
const std::vector<Spelling>& spellings() {
  static const std::vector<Spelling> sorted = [] {
    std::vector<Spelling> v;
    v.reserve(128);
    for (const UnitDef& d : unitTable()) {
      v.emplace_back(d.name, &d);
      for (std::string_view a : d.aliases) v.emplace_back(a, &d);
    }
    // A spelling given twice finds its first unit, as a map's emplace would keep it:
    // the units lie in one array, in table order.
    std::sort(v.begin(), v.end(), [](const Spelling& a, const Spelling& b) {
      return a.first != b.first ? spellingBefore(a.first, b.first) : a.second < b.second;
    });
    return v;
  }();
  return sorted;
}

// Names and ASCII aliases: what a suggestion may offer.
const std::vector<std::string>& suggestible() {
  static const std::vector<std::string> names = [] {
    std::vector<std::string> v;
    for (const UnitDef& d : unitTable()) {
      v.emplace_back(d.name);
      for (std::string_view a : d.aliases)
        if (std::all_of(a.begin(), a.end(),
                        [](char c) { return static_cast<unsigned char>(c) < 0x80; }))
          v.emplace_back(a);
    }
    return v;
  }();
  return names;
}

// Spellings engineers use that are not units here, with what they mean.
const std::unordered_map<std::string, std::vector<std::string>>& slips() {
  static const std::unordered_map<std::string, std::vector<std::string>> map = {
      {"sec", {"s"}},          {"secs", {"s"}},         {"second", {"s"}},
      {"seconds", {"s"}},      {"minute", {"min"}},     {"minutes", {"min"}},
      {"hr", {"h"}},           {"hrs", {"h"}},          {"hour", {"h"}},
      {"hours", {"h"}},        {"inch", {"in"}},        {"inches", {"in"}},
      {"foot", {"ft"}},        {"feet", {"ft"}},        {"yard", {"yd"}},
      {"yards", {"yd"}},       {"meter", {"m"}},        {"metre", {"m"}},
      {"meters", {"m"}},       {"metres", {"m"}},       {"micron", {"um"}},
      {"microns", {"um"}},     {"pound", {"lb", "lbf"}}, {"pounds", {"lb", "lbf"}},
      {"lbs", {"lb", "lbf"}},  {"newton", {"N"}},       {"newtons", {"N"}},
      {"tonne", {"t"}},        {"tonnes", {"t"}},       {"ton", {"t"}},
      {"tons", {"t"}},         {"gram", {"g"}},         {"grams", {"g"}},
      {"kp", {"kgf"}},         {"kips", {"kip"}},       {"psig", {"psi"}},
      {"psia", {"psi"}},       {"rps", {"rev/s"}},      {"RPM", {"rpm"}},
      {"cps", {"Hz"}},         {"degree", {"deg"}},     {"degrees", {"deg"}},
      {"radian", {"rad"}},     {"radians", {"rad"}},    {"revs", {"rev"}},
      {"revolution", {"rev"}}, {"revolutions", {"rev"}}, {"turn", {"rev"}},
      {"turns", {"rev"}},      {"percent", {"%"}},      {"kelvin", {"K"}},
      {"degK", {"K"}},         {"C", {"degC", "ddegC"}}, {"F", {"degF", "ddegF"}},
      {"ddeg", {"ddegC", "ddegF"}}, {"Nm", {"N*m"}},    {"Nmm", {"N*mm"}},
      {"kNm", {"kN*m"}},       {"ftlb", {"ft*lbf"}},    {"ftlbf", {"ft*lbf"}},
      {"lbft", {"lbf*ft"}},    {"inlb", {"in*lbf"}},    {"inlbf", {"in*lbf"}},
      {"lbin", {"lbf*in"}},    {"kph", {"km/h"}},       {"fpm", {"ft/min"}},
      {"ipm", {"in/min"}},     {"tpi", {"1/in"}},       {"sqmm", {"mm^2"}},
      {"sqin", {"in^2"}},
  };
  return map;
}

std::string lower(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

void addUnique(std::vector<std::string>* out, const std::string& s) {
  if (std::find(out->begin(), out->end(), s) == out->end()) out->push_back(s);
}

std::string escapeCell(std::string_view s) {
  std::string out;
  for (char c : s) {
    if (c == '|') out += '\\';
    out += c;
  }
  return out;
}

}  // namespace

const std::vector<UnitDef>& unitTable() {
  static const std::vector<UnitDef> table = buildTable();
  return table;
}

const UnitDef* findUnit(std::string_view name) {
  const auto& sorted = spellings();
  auto it = std::lower_bound(sorted.begin(), sorted.end(), name,
                             [](const Spelling& s, std::string_view n) { return spellingBefore(s.first, n); });
  return it == sorted.end() || it->first != name ? nullptr : it->second;
}

std::vector<std::string> suggestUnits(std::string_view name, size_t max) {
  std::vector<std::string> out;
  const std::string word(name);
  auto slip = slips().find(word);
  if (slip != slips().end())
    for (const std::string& s : slip->second) addUnique(&out, s);
  // A plural: "kgs" -> kg. One-letter stems are left to the split below ("Ns").
  if (out.empty() && word.size() > 2 && word.back() == 's' &&
      findUnit(word.substr(0, word.size() - 1)))
    addUnique(&out, word.substr(0, word.size() - 1));
  // A power typed as digits: "mm2" -> mm^2.
  const size_t digits = word.find_first_of("0123456789");
  if (out.empty() && digits != std::string::npos && digits > 0 &&
      word.find_first_not_of("0123456789", digits) == std::string::npos &&
      findUnit(word.substr(0, digits)))
    addUnique(&out, word.substr(0, digits) + "^" + word.substr(digits));
  // Only the case differs ("mPa", "KN"): the likeliest slip of all.
  const std::vector<std::string> near = nearestWords(word, suggestible(), max);
  for (const std::string& s : near)
    if (lower(s) == lower(word)) addUnique(&out, s);
  // Two units run together: "Nm" -> N*m. Not after a lone prefix letter:
  // "mN" is a millinewton typed, not a metre times a newton.
  if (out.empty())
    for (size_t i = 1; i < word.size(); ++i)
      if (!(i == 1 && std::string_view("kMGmcu").find(word[0]) != std::string_view::npos) &&
          findUnit(word.substr(0, i)) && findUnit(word.substr(i)))
        addUnique(&out, word.substr(0, i) + "*" + word.substr(i));
  for (const std::string& s : near) addUnique(&out, s);
  if (out.size() > max) out.resize(max);
  return out;
}

std::string unitTableMarkdown() {
  std::string md = R"md(# Units

<!-- Generated from engine/units/unit_table.cc; do not edit by hand. -->

Every unit calctrail knows, with its exact definition and the standard it
comes from. This is the table the engine uses: a test compares every factor
with GNU units, and another fails when this page is stale. Regenerate it with

    build/calctrail units --format md > docs/units.md

## Writing units

- A product is `*`, `·` or `⋅`; a quotient is `/`, read left to right
  (`N/m*s` is `(N/m)*s`); parentheses group (`W/(m*K)`); `1/in` is a
  reciprocal. Spaces around the signs are allowed, between two units not.
- Powers are whole numbers from -12 to 12: `^2`, `^-1`, `^(-1)`, or the
  superscripts `²`, `³`, `⁻¹`. The minus sign U+2212 of typeset documents is
  accepted in a power (`m^−1`).
- Names are case-sensitive (`MPa` is a unit, `mPa` is not). `µm` may be typed
  with the micro sign U+00B5 or the Greek mu U+03BC. Prefixed units are
  exactly the ones listed below; prefixes do not combine (`kkm`, `kMPa` are
  errors).
- Letters that only look like ASCII ones (Cyrillic `с`, `м`, Greek capitals,
  fullwidth letters, the Kelvin sign) are errors that name the character and
  the letter it resembles; every error gives the byte offset of the problem
  and, for an unknown unit, the nearest known ones (`lbs`: `lb` or `lbf`;
  `Nm`: `N*m`).
- Canonical spelling: calctrail keeps the structure you wrote and normalises
  the spelling to ASCII, `N·m` to `N*m`, `mm²` to `mm^2`, `µm` to `um`, and
  drops parentheses that change nothing. Human formats print the SI
  Brochure's style: `N·m`, `mm²`, `µm`, `°`, `°C`, and `Δ°C` for `ddegC`.

## Angles

As in the SI, the radian is 1: `rev` is 2*pi, `rpm` is rev/min, and a torque
times a speed in rpm is a power in W (100 N*m at 1450 rpm is 15184 W).
calctrail still tracks the angle exponent, to catch a lost 2*pi. A lead is
written per revolution, `5 [mm/rev]`, and `1450 rpm * 5 [mm/rev]` is a
speed, 7250 mm/min. A value whose dimension differs from its display unit by
angle alone is shown silently only when it is a torque or energy (torque
times angle) or a power (torque times rotational speed); anything else, such
as a rotational speed times a plain length `5 mm` shown in m/s, comes with a
warning. `Hz` is 1/s and carries no angle (the SI Brochure keeps it out of
angular velocity); use `rpm` or `rad/s` for a rotational speed.

## Temperatures

`degC` and `degF` are absolute temperatures with an offset: 20 degC =
293.15 K = 68 degF. Such a unit may only stand alone; `1/degC` or `degC^2`
is an error. For a temperature difference (an expansion coefficient, a
temperature rise) write the interval units `ddegC` (= 1 K) or `ddegF`
(= 5/9 K): `1/ddegC` or `1/K`.

## Roots

The square root of an even power is fine (the root of an area is a length).
A root of a dimension whose exponents are not all multiples of the root has
no unit (the square root of a length) and is an error.

## Units shown when none is declared

Chosen for a machine designer: lengths in mm (drawings), stresses in MPa
(N/mm²), `N*m` for torque or energy (torque is what a drive engineer meets
most; `J` is always available), `rpm` for rotational speed, `deg` for angles.

| Dimension | Unit |
|---|---|
)md";
  for (const Dimension& d : namedDimensions())
    md += "| " + escapeCell(d.name()) + " | `" + escapeCell(d.preferredSymbol()) + "` |\n";
  md += R"md(
A torque times an angle is shown in `N*m` and a torque times a rotational
speed in `W` (the radian is 1). Any other dimension is shown in coherent SI
base units, `kg*m^3/s` style, with `rad` for angles.

A library function declares the unit its result is shown in (`rev` for a
rating life, `1/in` for threads per inch, `%` for an efficiency, `kN`, `kW`;
docs/functions.md says it as "shown in"); a line whose formula is a call of
that function and which declares no unit of its own is shown in it.

## A sheet's preferred units

The metadata line `units:` (docs/format.md) chooses the units of a whole
sheet where a line declares none: `units: SI`, or `units: US` (US
customary), followed by any units to prefer, one per dimension:
`units: US, ksi, lbf*ft, in/s`. The unit shown for a line without one is, in
order:

1. the unit of a lone literal as written (`F = 500 lbf` stays in lbf);
2. a unit the `units:` line names for the line's dimension;
3. the unit the library function of the line declares, when it is of the
   sheet's system or of neither (`rev`, `rpm`, `%`, `deg`, `s`); a sheet
   without a `units:` line takes it whatever its system;
4. the sheet system's unit for the dimension (below);
5. the engine's unit for the dimension (the table above).

A unit with any US customary unit in it (`in`, `ft`, `lbf`, `lb`, `psi`,
`ksi`, `hp`, ...) is US, one made of SI and metric units only is SI, and
one with neither belongs to both. Values substituted into a formula are
shown in the unit of the quantity they come from, so a US sheet's
substitution lines stay in inches. An instance of a template is shown with
the preferences of the sheet that is run.

| Dimension | SI | US customary |
|---|---|---|
)md";
  for (const PreferenceRow& r : preferenceTable())
    md += "| " + escapeCell(r.quantity) + " | `" + escapeCell(r.si) + "` | `" + escapeCell(r.us) + "` |\n";
  md += R"md(
Dimensions not listed (time, rotational speed, angle, temperature, ...) are
shown alike in both systems.

## Table

| Name | Aliases | Quantity | Definition | Source |
|---|---|---|---|---|
)md";
  for (const UnitDef& d : unitTable()) {
    std::string aliases;
    for (std::string_view a : d.aliases) {
      if (!aliases.empty()) aliases += ", ";
      aliases += "`" + escapeCell(a) + "`";
    }
    md += "| `" + escapeCell(d.name) + "` | " + aliases + " | " + escapeCell(d.quantity) +
          " | " + escapeCell(d.definition) + " | " + escapeCell(d.source) + " |\n";
  }
  return md;
}

}  // namespace calctrail
