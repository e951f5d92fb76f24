// Calling a library function by name with SI arguments, as the function tests
// do: the value, or the DomainError message when an input is out of limits.
#pragma once

#include <catch2/catch.hpp>

#include <string>
#include <vector>

#include "functions/function_decl.h"

namespace calctrail::test {

inline double call(const char* name, std::vector<double> args) {
  const FunctionDecl* decl = findFunction(name);
  REQUIRE(decl != nullptr);
  REQUIRE(args.size() == decl->args.size());
  return decl->eval(args.data());
}

inline std::string errorOf(const char* name, std::vector<double> args) {
  try {
    call(name, args);
  } catch (const DomainError& e) {
    return e.what();
  }
  return "(no error)";
}

}  // namespace calctrail::test
