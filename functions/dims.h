// The dimensions the drive functions speak in, named once so that every
// declaration reads in words of the trade. Angle is tracked (see dimension.h):
// rotational speeds are angle/time, leads and pitches are declared as lengths
// with per_revolution set.
#pragma once

#include "engine/units/dimension.h"

namespace calctrail::dims {

inline Dimension none() { return Dimension(); }
inline Dimension length() { return Dimension::exponents(1, 0, 0); }
inline Dimension perLength() { return Dimension::exponents(-1, 0, 0); }
inline Dimension mass() { return Dimension::exponents(0, 1, 0); }
inline Dimension inertia() { return Dimension::exponents(2, 1, 0); }
inline Dimension force() { return Dimension::exponents(1, 1, -2); }
inline Dimension torque() { return Dimension::exponents(2, 1, -2); }
inline Dimension stress() { return Dimension::exponents(-1, 1, -2); }
inline Dimension density() { return Dimension::exponents(-3, 1, 0); }
inline Dimension time() { return Dimension::exponents(0, 0, 1); }
inline Dimension power() { return Dimension::exponents(2, 1, -3); }
inline Dimension speed() { return Dimension::exponents(1, 0, -1); }
inline Dimension pressureSpeed() { return Dimension::exponents(0, 1, -3); }
inline Dimension angle() { return Dimension::of(Base::Angle); }
inline Dimension rotSpeed() { return Dimension::exponents(0, 0, -1, 0, 0, 0, 0, 1); }

}  // namespace calctrail::dims
