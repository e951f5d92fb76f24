// The drive library as listed: functions in groups (threads, power screws,
// ...), each group filled by one source file. functionLibrary() and
// findFunction() are declared in function_decl.h.
#pragma once

#include <cstddef>
#include <string_view>
#include <vector>

#include "functions/function_decl.h"

namespace calctrail {

struct FunctionGroup {
  std::string_view title;  // "Power screws"
  std::string_view intro;  // a short paragraph for the docs: conventions, practice values
  std::size_t first = 0;  // index into functionLibrary()
  std::size_t count = 0;
};

// The groups in listing order; together they cover functionLibrary() exactly.
const std::vector<FunctionGroup>& functionGroups();

// The group a function belongs to, or nullptr.
const FunctionGroup* groupOf(const FunctionDecl& decl);

// Filled by one source file each (threads.cc, power_screw.cc, ...): append the
// group's declarations and return its title and intro.
namespace fn {
struct GroupText {
  const char* title;
  const char* intro;
};
GroupText addThreads(std::vector<FunctionDecl>& out);
GroupText addPowerScrews(std::vector<FunctionDecl>& out);
GroupText addCollars(std::vector<FunctionDecl>& out);
GroupText addStresses(std::vector<FunctionDecl>& out);
GroupText addColumns(std::vector<FunctionDecl>& out);
GroupText addBallScrews(std::vector<FunctionDecl>& out);
GroupText addGears(std::vector<FunctionDecl>& out);
GroupText addMotors(std::vector<FunctionDecl>& out);
GroupText addServo(std::vector<FunctionDecl>& out);
}  // namespace fn

}  // namespace calctrail
