// A resolved unit of measure (a product of table units with integer powers)
// and the conversions to and from coherent SI values. Units are resolved once,
// when a worksheet is compiled; evaluation only ever sees SI doubles.
#pragma once

#include <string>

#include "engine/units/dimension.h"

namespace calctrail {

struct Unit {
  double factor = 1.0;  // SI value of one unit
  double offset = 0.0;  // non-zero only for absolute temperatures (degC, degF)
  Dimension dim;
  std::string text;     // canonical ASCII spelling: "N*m", "kg/m^3", "in/rev"

  double toSI(double value) const { return value * factor + offset; }
  double fromSI(double si) const { return (si - offset) / factor; }
  bool hasOffset() const { return offset != 0.0; }
  // An absolute temperature scale with its own zero (degC, degF).
  bool isAbsoluteTemperature() const { return hasOffset(); }
  // An interval unit of temperature (ddegC, ddegF); K serves for both.
  bool isTemperatureDifference() const { return text == "ddegC" || text == "ddegF"; }
  // Human spelling with the SI Brochure's product dot and superscripts: "N·m", "mm²".
  std::string pretty() const;
};

// How a value of one dimension may be shown in a unit of another.
enum class UnitFit {
  Exact,         // same dimension
  AngleDropped,  // differs only by angle, and the result is work or power
                 // (T*theta, T*omega): the radian is 1, silent and right
  AngleWarning,  // differs only by angle otherwise: a likely lost 2*pi
                 // (rpm * plain lead); shown, with a warning that gives the fix
  Incompatible,  // different physical dimensions
};
UnitFit fitUnit(const Dimension& value, const Dimension& unit);

// The unit an engineer expects for a dimension when none was declared:
// N*m for torque, MPa for stress, W for power, m/s for speed, rpm for rotational
// speed, ... and the coherent SI spelling for anything else. A torque or power
// that carries a stray angle exponent (T*theta, T*omega) gets N*m or W, whose
// dimension differs by angle only: fitUnit() says AngleDropped for those.
Unit preferredUnit(const Dimension& dim);

// The coherent SI unit of a dimension (factor 1), spelled as Dimension::siSymbol.
Unit siUnit(const Dimension& dim);

}  // namespace calctrail
