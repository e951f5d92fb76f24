#include "functions/series_tables.h"

#include <stdexcept>

#include "functions/function_decl.h"

namespace calctrail::fn {

namespace {

// The sizes k * step (k = 1 .. count) in a unit of `factor` metres that the
// function named `name` (one argument) accepts: it throws DomainError for a
// size its table does not hold. Each size is (k * step) * factor, the double
// a worksheet literal of that size in that unit gives.
std::vector<double> accepted(const char* name, double factor, double step, int count) {
  const FunctionDecl* f = findFunction(name);
  if (!f) throw std::logic_error(std::string("the drive library has no `") + name + "`");
  std::vector<double> out;
  for (int k = 1; k <= count; ++k) {
    const double d = (step * k) * factor;
    try {
      f->eval(&d);
      out.push_back(d);
    } catch (const DomainError&) {
      // not a size of the table
    }
  }
  return out;
}

}  // namespace

const std::vector<double>& trapezoidalDiameters() {
  static const std::vector<double> sizes = accepted("trap_pitch", 1e-3, 1, 1000);
  return sizes;
}

const std::vector<double>& acmeDiameters() {
  static const std::vector<double> sizes = accepted("acme_tpi", 0.0254, 1.0 / 16, 12 * 16);
  return sizes;
}

const std::vector<double>& ratedMotorOutputs() {
  static const std::vector<double> outputs = [] {
    const FunctionDecl* f = findFunction("standard_motor_power");
    if (!f) throw std::logic_error("the drive library has no `standard_motor_power`");
    std::vector<double> out;
    double p = 1e-3;  // 1 mW: below any motor
    for (int guard = 0; guard < 1000; ++guard) {
      double rated = 0;
      try {
        rated = f->eval(&p);
      } catch (const DomainError&) {
        break;  // above the largest output of the table
      }
      out.push_back(rated);
      p = rated * (1 + 1e-6);  // just above it: the next size up
    }
    return out;
  }();
  return outputs;
}

}  // namespace calctrail::fn
