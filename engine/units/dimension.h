// A physical dimension: integer exponents over the SI base quantities, plus
// plane angle tracked as a base of its own. The SI makes the radian equal to 1,
// and so does calctrail for values (rad = 1, rev = 2*pi); the angle exponent is
// tracked only so that a lost or stray 2*pi (a speed in rpm times a lead written
// as a plain length) can be caught and reported. See docs/units.md.
#pragma once

#include <array>
#include <cstdint>
#include <cstring>
#include <string>
#include <vector>

namespace calctrail {

enum class Base : int {
  Length = 0,
  Mass,
  Time,
  Current,
  Temperature,
  Amount,
  Luminous,
  Angle,
};

class Dimension {
 public:
  static constexpr int kBases = 8;

  constexpr Dimension() = default;
  static Dimension of(Base base, int power = 1);
  // Build from exponents in the order of Base: L, M, T, I, Theta, N, J, angle.
  static Dimension exponents(int length, int mass, int time, int current = 0,
                             int temperature = 0, int amount = 0,
                             int luminous = 0, int angle = 0);

  int exponent(Base base) const { return e_[static_cast<int>(base)]; }

  Dimension operator*(const Dimension& o) const;
  Dimension operator/(const Dimension& o) const;
  Dimension pow(int n) const;
  // The n-th root; false (and *out untouched) when an exponent is not a multiple of n.
  bool root(int n, Dimension* out) const;

  // The eight exponents compared as one 64-bit word: std::array's == is a call
  // to memcmp, and dimensions are compared at every node of every formula.
  bool operator==(const Dimension& o) const { return word() == o.word(); }
  bool operator!=(const Dimension& o) const { return word() != o.word(); }
  bool operator<(const Dimension& o) const { return e_ < o.e_; }

  // True when every exponent, angle included, is zero.
  bool dimensionless() const;
  Dimension withoutAngle() const;
  // True when the two differ at most in the angle exponent.
  bool sameIgnoringAngle(const Dimension& o) const { return withoutAngle() == o.withoutAngle(); }

  // In coherent SI units, ASCII: "kg*m^2/s^2", "m/s", "rad/s", "1".
  std::string siSymbol() const;
  // The usual name of this dimension in words ("force", "torque or energy",
  // "rotational speed"), or "" when it has none.
  std::string name() const;
  // For messages: "force (N)", "torque or energy (N*m)", or "kg*m^3/s (no common name)".
  std::string describe() const;
  // The unit an engineer expects for this dimension ("mm", "N*m", "MPa", "rpm"),
  // in unit syntax, or "" when the dimension has no common name. Used by
  // describe() and preferredUnit(); docs/units.md lists them.
  std::string preferredSymbol() const;

 private:
  std::uint64_t word() const {
    static_assert(sizeof e_ == sizeof(std::uint64_t), "eight one-byte exponents");
    std::uint64_t w;
    std::memcpy(&w, e_.data(), sizeof w);
    return w;
  }

  std::array<std::int8_t, kBases> e_{};
};

// Every dimension that has a name, in the order docs/units.md lists them.
std::vector<Dimension> namedDimensions();

}  // namespace calctrail
