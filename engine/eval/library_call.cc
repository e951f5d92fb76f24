#include "engine/eval/library_call.h"

#include <vector>

#include "engine/util/math_constants.h"
#include "functions/plausibility.h"

namespace calctrail {

namespace {
bool givenPerAngle(bool per_revolution, const Dimension& given) {
  return per_revolution && given.exponent(Base::Angle) == -1;
}
}  // namespace

double argumentToLibrary(double si, bool per_revolution, const Dimension& given) {
  return givenPerAngle(per_revolution, given) ? si * kTwoPi : si;
}

double resultFromLibrary(double value, bool per_revolution) {
  return per_revolution ? value / kTwoPi : value;
}

LibraryCall LibraryCall::at(const FunctionDecl& decl, const std::vector<Dimension>& arg_dims) {
  LibraryCall c;
  c.decl = &decl;
  for (size_t k = 0; k < arg_dims.size() && k < 32; ++k)
    if (givenPerAngle(decl.argAt(static_cast<int>(k)).per_revolution, arg_dims[k])) c.per_angle_args |= 1u << k;
  return c;
}

namespace {
double evalDecl(const FunctionDecl& d, const double* args, int n) {
  return d.eval_n ? d.eval_n(args, n) : d.eval(args);
}
}  // namespace

const double* LibraryCall::converted(const double* args, int n, std::vector<double>* out) const {
  out->assign(args, args + n);
  for (int k = 0; k < n && k < 32; ++k)
    if (per_angle_args & (1u << k)) (*out)[static_cast<size_t>(k)] *= kTwoPi;
  return out->data();
}

double LibraryCall::operator()(const double* args, int n) const {
  double buffer[32];
  const double* in = args;
  if (per_angle_args != 0) {
    // Only the first 32 arguments can carry the bit; a longer call keeps the rest as given.
    if (n > 32) {
      std::vector<double> v;
      in = converted(args, n, &v);
      const double r = evalDecl(*decl, in, n);
      if (doubts && isDoubtful(*decl, in, n)) ++doubts->count;
      return resultFromLibrary(r, decl->result_per_revolution);
    }
    for (int k = 0; k < n; ++k) buffer[k] = per_angle_args & (1u << k) ? args[k] * kTwoPi : args[k];
    in = buffer;
  }
  const double r = evalDecl(*decl, in, n);
  if (doubts && isDoubtful(*decl, in, n)) ++doubts->count;
  return resultFromLibrary(r, decl->result_per_revolution);
}

std::string LibraryCall::compiledName() const {
  if (per_angle_args == 0) return decl->name;
  return decl->name + "__r" + std::to_string(per_angle_args);
}

}  // namespace calctrail
