// Input checks shared by the drive functions: each one throws DomainError with
// a message that names the quantity, the limit and the offending value, shown
// in the unit an engineer reads it in (mm, MPa, deg, rpm), never bare SI.
#pragma once

#include <string>

#include "functions/function_decl.h"

namespace calctrail::fn {

// How a value is shown in a message.
enum class Show { Plain, Force, Length, Lead, Torque, Stress, Modulus, Angle, Speed, Power, Density };

// "6400 N", "33.02 mm", "14.5 deg", "1450 rpm": four significant digits.
std::string show(double si, Show how);
// Four significant digits, no unit.
std::string num(double v);

[[noreturn]] void fail(int arg, const std::string& message);

// Each returns the value so checks read inline; each also rejects NaN and inf.
// `what` is the quantity in words with its argument name: "axial load F".
double finite(const double* a, int i, const char* what, Show how);
double positive(const double* a, int i, const char* what, Show how);
double nonNegative(const double* a, int i, const char* what, Show how);
double atMost(const double* a, int i, double limit, const char* what, Show how);
// 0 < v <= 1: efficiencies and load shares.
double fraction(const double* a, int i, const char* what);
// A friction coefficient: 0 <= f <= 1 (above 1 is no lubricated or dry
// metal pair of the trade; it is a slip of units or of a decimal point).
double friction(const double* a, int i, const char* what);
// A flank or pressure angle: 0 <= alpha <= 45 deg.
double flankAngle(const double* a, int i, const char* what);
// A whole number >= 1 (thread starts, number of screws).
double count(const double* a, int i, const char* what);

// The result, checked: overflow or an unforeseen case never escapes as NaN/inf.
double result(double v);

}  // namespace calctrail::fn
