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

LibraryCall LibraryCall::at(const FunctionDecl& decl, const std::vector<Dimension>& arg_dims) {
  LibraryCall c;
  c.decl = &decl;
  c.usual_args = usualArgs(decl);
  for (size_t k = 0; k < arg_dims.size() && k < 32; ++k)
    if (givenPerAngle(decl.argAt(static_cast<int>(k)).per_revolution, arg_dims[k])) c.per_angle_args |= 1u << k;
  return c;
}

const double* LibraryCall::converted(const double* args, int n, std::vector<double>* out) const {
  out->assign(args, args + n);
  for (int k = 0; k < n && k < 32; ++k) (*out)[static_cast<size_t>(k)] = argumentIn(k, args[k]);
  return out->data();
}

namespace {
// A call of more than 32 arguments with a lead among them: converted on the heap.
[[gnu::noinline]] double callMany(const LibraryCall& c, const double* args, int n, DoubtCounter* counter) {
  std::vector<double> v;
  return c.callConverted(c.converted(args, n, &v), n, counter);
}
}  // namespace

double LibraryCall::call(const double* args, int n, DoubtCounter* counter) const {
  if (per_angle_args == 0) return callConverted(args, n, counter);
  // Only the first 32 arguments can carry the bit; a longer call keeps the rest as given.
  if (n > 32) return callMany(*this, args, n, counter);
  double buffer[32];
  for (int k = 0; k < n; ++k) buffer[k] = argumentIn(k, args[k]);
  return callConverted(buffer, n, counter);
}

std::string LibraryCall::compiledName() const {
  if (per_angle_args == 0) return std::string(decl->name);
  return std::string(decl->name) + "__r" + std::to_string(per_angle_args);
}

}  // namespace calctrail
