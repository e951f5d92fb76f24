// Calling a library function by name with SI arguments, as the function tests
// do: the value, or the DomainError message when an input is out of limits,
// or the doubts (warnings) a call within its limits raises. A function with a
// repeated argument group takes any number of whole groups.
#pragma once

#include <catch2/catch.hpp>

#include <string>
#include <vector>

#include "functions/function_decl.h"
#include "functions/plausibility.h"

namespace calctrail::test {

inline double call(const char* name, std::vector<double> args) {
  const FunctionDecl* decl = findFunction(name);
  REQUIRE(decl != nullptr);
  const int n = static_cast<int>(args.size());
  REQUIRE(decl->takes(n));
  return decl->eval_n ? decl->eval_n(args.data(), n) : decl->eval(args.data());
}

inline std::string errorOf(const char* name, std::vector<double> args) {
  try {
    call(name, args);
  } catch (const DomainError& e) {
    return e.what();
  }
  return "(no error)";
}

// The doubts of a call, "; "-joined ("" when none); the call itself must succeed.
inline std::string doubtsOf(const char* name, std::vector<double> args) {
  call(name, args);
  std::string out;
  for (const Doubt& d : calctrail::doubtsOf(*findFunction(name), args.data(), static_cast<int>(args.size())))
    out += (out.empty() ? "" : "; ") + d.message;
  return out;
}

}  // namespace calctrail::test
