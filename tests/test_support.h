// Helpers shared by the engine tests: calculate a worksheet from text, read
// its diagnostics, run the calctrail program and capture what it prints.
#pragma once

#include <memory>
#include <string>
#include <vector>

#include "engine/calculation.h"

namespace calctrail::test {

std::unique_ptr<Calculation> calc(const std::string& text, const std::vector<std::string>& sets = {});

// Every diagnostic headline, one per line ("sheet.calc:3:7: error: ...").
std::string diagnostics(const Calculation& c);

// SI value of a quantity; fails the test when it has none.
double si(const Calculation& c, const std::string& name);

struct Run {
  int status = -1;
  std::string out, err;
};
// Runs the built calctrail with `args` (a shell-quoted string) in the repository root.
Run runCli(const std::string& args);
// The same, in the directory `dir` (a temporary git repository, say).
Run runCliIn(const std::string& dir, const std::string& args);
// The same, run as `prefix 'calctrail' args` in a subshell: `args` may redirect
// standard input ("fmt - </dev/zero"), and `prefix` may feed it ("yes |") or
// run the program as another user ("setpriv --reuid=65534 ...").
Run runCliThrough(const std::string& dir, const std::string& prefix, const std::string& args);

std::string repoPath(const std::string& relative);
std::string readFile(const std::string& path);
void writeFile(const std::string& path, const std::string& text);
// A fresh empty directory under the system temporary folder.
std::string tempDir();

// How many times `part` stands in `text`, not overlapping.
size_t count(const std::string& text, const std::string& part);

}  // namespace calctrail::test
