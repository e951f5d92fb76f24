// Input checks shared by the drive functions: each one throws DomainError with
// a message that names the quantity, the limit and the offending value, shown
// in the unit an engineer reads it in (mm, MPa, deg, rpm), never bare SI.
#pragma once

#include <cmath>
#include <string>

#include "engine/util/math_constants.h"

#include "functions/function_decl.h"

namespace calctrail::fn {

// How a value is shown in a message.
enum class Show { Plain, Force, Length, Lead, Torque, Stress, Modulus, Angle, Speed, Power, Density, Mass, Inertia, Time };

// "6400 N", "33.02 mm", "14.5 deg", "1450 rpm": four significant digits.
std::string show(double si, Show how);
// Four significant digits, no unit.
std::string num(double v);

// An argument with the range met in practice (SI values), shown as `how`
// shows it; outside it a call gives a warning (functions/plausibility.h).
FunctionArg usually(FunctionArg a, double lo, double hi, Show how, const char* why);

[[noreturn]] void fail(int arg, const std::string& message);

// The checks below run on every library call, so the success path is a
// compare and a branch: no message is built, no string lives in the frame,
// and the failure path (failLimit, out of line and cold) builds the message
// only when a limit is broken.
enum class Limit { Finite, Positive, NonNegative, AtMost, Fraction, Friction, Whole, Result };
[[noreturn]] [[gnu::cold]] [[gnu::noinline]] void failLimit(Limit limit, int arg, const char* what, double v,
                                                           Show how, double bound = 0.0);

#define CALCTRAIL_UNLIKELY(x) __builtin_expect(!!(x), 0)

// Each returns the value so checks read inline; each also rejects NaN and inf.
// `what` is the quantity in words with its argument name: "axial load F".
inline double finite(const double* a, int i, const char* what, Show how) {
  const double v = a[i];
  if (CALCTRAIL_UNLIKELY(!std::isfinite(v))) failLimit(Limit::Finite, i, what, v, how);
  return v;
}
inline double positive(const double* a, int i, const char* what, Show how) {
  const double v = finite(a, i, what, how);
  if (CALCTRAIL_UNLIKELY(!(v > 0))) failLimit(Limit::Positive, i, what, v, how);
  return v;
}
inline double nonNegative(const double* a, int i, const char* what, Show how) {
  const double v = finite(a, i, what, how);
  if (CALCTRAIL_UNLIKELY(!(v >= 0))) failLimit(Limit::NonNegative, i, what, v, how);
  return v;
}
inline double atMost(const double* a, int i, double limit, const char* what, Show how) {
  const double v = a[i];
  if (CALCTRAIL_UNLIKELY(!(v <= limit))) failLimit(Limit::AtMost, i, what, v, how, limit);
  return v;
}
// 0 < v <= 1: efficiencies and load shares.
inline double fraction(const double* a, int i, const char* what) {
  const double v = positive(a, i, what, Show::Plain);
  if (CALCTRAIL_UNLIKELY(!(v <= 1))) failLimit(Limit::Fraction, i, what, v, Show::Plain);
  return v;
}
// A friction coefficient: 0 <= f <= 1 (above 1 is no lubricated or dry
// metal pair of the trade; it is a slip of units or of a decimal point).
inline double friction(const double* a, int i, const char* what) {
  const double v = nonNegative(a, i, what, Show::Plain);
  if (CALCTRAIL_UNLIKELY(!(v <= 1))) failLimit(Limit::Friction, i, what, v, Show::Plain);
  return v;
}
// A flank or pressure angle: 0 <= alpha <= 45 deg.
inline double flankAngle(const double* a, int i, const char* what) {
  nonNegative(a, i, what, Show::Angle);
  return atMost(a, i, 45.0 * kPi / 180.0, what, Show::Angle);
}
// A whole number >= 1 (thread starts, number of screws).
inline double count(const double* a, int i, const char* what) {
  const double v = positive(a, i, what, Show::Plain);
  if (CALCTRAIL_UNLIKELY(!(v >= 1) || std::fabs(v - std::round(v)) > 1e-9))
    failLimit(Limit::Whole, i, what, v, Show::Plain);
  return std::round(v);
}

// The result, checked: overflow or an unforeseen case never escapes as NaN/inf.
inline double result(double v) {
  if (CALCTRAIL_UNLIKELY(!std::isfinite(v))) failLimit(Limit::Result, -1, "", v, Show::Plain);
  return v;
}

#undef CALCTRAIL_UNLIKELY

}  // namespace calctrail::fn
