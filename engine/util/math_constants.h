// Mathematical constants, defined once: the engine, the drive library and the
// tests all read pi from here (M_PI is POSIX, not C++).
#pragma once

namespace calctrail {

inline constexpr double kPi = 3.141592653589793238462643383279502884;
inline constexpr double kTwoPi = 2.0 * kPi;  // one revolution in radians

}  // namespace calctrail
