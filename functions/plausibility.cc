#include "functions/plausibility.h"

#include <cmath>
#include <cstdio>

namespace calctrail {

namespace {

std::string shown(double si, const FunctionArg& a) {
  char buf[40];
  std::snprintf(buf, sizeof buf, "%.4g", si / a.usual_factor);
  std::string s = buf;
  if (!a.usual_unit.empty()) {
    s += ' ';
    s += a.usual_unit;
  }
  return s;
}

std::string rangeOf(const FunctionArg& a) {
  if (a.usual_min > -HUGE_VAL && a.usual_max < HUGE_VAL) {
    char lo[40];
    std::snprintf(lo, sizeof lo, "%.4g", a.usual_min / a.usual_factor);
    return std::string(lo) + " to " + shown(a.usual_max, a);
  }
  if (a.usual_min > -HUGE_VAL) return "at least " + shown(a.usual_min, a);
  return "at most " + shown(a.usual_max, a);
}

bool outside(const FunctionArg& a, double v) {
  return v < a.usual_min || v > a.usual_max;
}

}  // namespace

bool isDoubtful(const FunctionDecl& decl, const double* args, int n) {
  for (int k = 0; k < n; ++k)
    if (outside(decl.argAt(k), args[k])) return true;
  if (!decl.advise) return false;
  int arg = -1;
  return !decl.advise(args, n, &arg).empty();
}

bool isDoubtful(const FunctionDecl& decl, const double* args, int n, uint32_t usual_args) {
  for (uint32_t bits = usual_args; bits != 0; bits &= bits - 1) {
    const int k = __builtin_ctz(bits);
    if (k >= n) break;
    if (outside(decl.argAt(k), args[k])) return true;
  }
  for (int k = 32; k < n; ++k)
    if (outside(decl.argAt(k), args[k])) return true;
  if (!decl.advise) return false;
  int arg = -1;
  return !decl.advise(args, n, &arg).empty();
}

uint32_t usualArgs(const FunctionDecl& decl) {
  const int declared = static_cast<int>(decl.args.size());
  if (declared == 0) return 0;
  uint32_t bits = 0;
  for (int k = 0; k < 32; ++k) {
    if (k >= declared && decl.repeat == 0) break;
    if (decl.argAt(k).hasUsualRange()) bits |= 1u << k;
  }
  return bits;
}

std::vector<Doubt> doubtsOf(const FunctionDecl& decl, const double* args, int n) {
  std::vector<Doubt> out;
  for (int k = 0; k < n; ++k) {
    const FunctionArg& a = decl.argAt(k);
    if (!outside(a, args[k])) continue;
    std::string m = decl.argName(k) + " = " + shown(args[k], a) + " is outside the usual range " +
                    rangeOf(a) + " of the " + std::string(a.description) + " (" + std::string(a.usual_why) + ")";
    // A factor of about 1000 from the middle of the range (geometric, for a two-sided
    // range of positive values) is a unit slip, not a design.
    double typical = args[k] < a.usual_min ? a.usual_min : a.usual_max;
    if (a.usual_min > 0 && a.usual_max < HUGE_VAL) typical = std::sqrt(a.usual_min * a.usual_max);
    const double ratio = typical != 0 && args[k] != 0 ? std::fabs(args[k] / typical) : 1.0;
    if (ratio >= 300 || ratio <= 1.0 / 300) m += ": off by a factor of about 1000? check the unit";
    out.push_back({k, std::move(m)});
  }
  if (decl.advise) {
    int arg = -1;
    std::string m = decl.advise(args, n, &arg);
    if (!m.empty()) out.push_back({arg, std::move(m)});
  }
  return out;
}

std::string usualRangeText(const FunctionArg& a) {
  if (!a.hasUsualRange()) return "";
  return std::string(a.name) + ": " + rangeOf(a) + " (" + std::string(a.usual_why) + ")";
}

}  // namespace calctrail
