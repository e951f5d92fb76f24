#include "engine/eval/library_call.h"

#include "engine/util/math_constants.h"

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
  for (size_t k = 0; k < decl.args.size() && k < arg_dims.size() && k < 32; ++k)
    if (givenPerAngle(decl.args[k].per_revolution, arg_dims[k])) c.per_angle_args |= 1u << k;
  return c;
}

double LibraryCall::operator()(const double* args, int n) const {
  if (per_angle_args == 0) return resultFromLibrary(decl->eval(args), decl->result_per_revolution);
  double converted[32];
  for (int k = 0; k < n && k < 32; ++k)
    converted[k] = per_angle_args & (1u << k) ? args[k] * kTwoPi : args[k];
  return resultFromLibrary(decl->eval(converted), decl->result_per_revolution);
}

std::string LibraryCall::compiledName() const {
  if (per_angle_args == 0) return decl->name;
  return decl->name + "__r" + std::to_string(per_angle_args);
}

}  // namespace calctrail
