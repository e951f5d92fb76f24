// engine/util/find_worksheets: how the benchmark programs find worksheets/
// without a path from __FILE__ (relative to build/ under ccache's base_dir).
#include "engine/util/find_worksheets.h"

#include <catch2/catch.hpp>
#include <filesystem>
#include <string>
#include <unistd.h>

#include "tests/test_support.h"

using namespace calctrail;
namespace fs = std::filesystem;

namespace {

// A tree root/src/worksheets/demo.calc, root/src/build/bin, root/other.
std::string makeTree() {
  const std::string root = test::tempDir();
  fs::create_directories(root + "/src/worksheets/templates");
  fs::create_directories(root + "/src/build/bin");
  fs::create_directories(root + "/other");
  test::writeFile(root + "/src/worksheets/demo.calc", "x = 1\n");
  test::writeFile(root + "/src/worksheets/templates/stage.calc", "param F [N]\n");
  return root;
}

// Runs fn with `dir` as the current directory, and goes back.
template <typename Fn>
void inDirectory(const std::string& dir, Fn fn) {
  const fs::path back = fs::current_path();
  fs::current_path(dir);
  fn();
  fs::current_path(back);
}

}  // namespace

TEST_CASE("find worksheets: from a start folder or any of its parents", "[find_worksheets]") {
  const std::string root = makeTree();
  // From the program's folder two levels down, and from the source folder itself.
  CHECK(findWorksheets("demo.calc", {root + "/src/build/bin"}) == root + "/src/worksheets");
  CHECK(findWorksheets("demo.calc", {root + "/src"}) == root + "/src/worksheets");
  // A marker inside a subfolder of worksheets/.
  CHECK(findWorksheets("templates/stage.calc", {root + "/src/build"}) == root + "/src/worksheets");
  // Not below the start's parents, or not there at all: empty.
  CHECK(findWorksheets("demo.calc", {root + "/other"}).empty());
  CHECK(findWorksheets("missing.calc", {root + "/src/build/bin"}).empty());
  CHECK(findWorksheets("demo.calc", {}).empty());
  // An unknown start is skipped.
  CHECK(findWorksheets("demo.calc", {"", root + "/src/build"}) == root + "/src/worksheets");
  // The marker must be a file: a folder of that name does not count.
  fs::create_directories(root + "/other/worksheets/demo.calc");
  CHECK(findWorksheets("demo.calc", {root + "/other"}).empty());
  // The first start that finds one wins, before the next start is tried.
  fs::remove_all(root + "/other/worksheets");
  fs::create_directories(root + "/other/worksheets");
  test::writeFile(root + "/other/worksheets/demo.calc", "y = 2\n");
  CHECK(findWorksheets("demo.calc", {root + "/src/build", root + "/other"}) == root + "/src/worksheets");
  CHECK(findWorksheets("demo.calc", {root + "/other", root + "/src/build"}) == root + "/other/worksheets");
  fs::remove_all(root);
}

TEST_CASE("find worksheets: relative to the current directory when found from it", "[find_worksheets]") {
  const std::string root = makeTree();
  inDirectory(root + "/src/build/bin", [&] {
    CHECK(findWorksheets("demo.calc", {fs::current_path().string()}) == "../../worksheets");
    CHECK(findWorksheets("demo.calc") == "../../worksheets");  // the current directory is the first start
  });
  inDirectory(root + "/src", [&] { CHECK(findWorksheets("demo.calc") == "worksheets"); });
  fs::remove_all(root);
}

TEST_CASE("find worksheets: the program's own folder is the second start", "[find_worksheets]") {
  // The test program lives in build/tests/ of this source tree, so from a
  // folder outside the tree it finds the tree's worksheets/ through itself.
  const std::string root = makeTree();
  const std::vector<std::string> starts = worksheetSearchStarts();
  REQUIRE(starts.size() == 2);
  CHECK(starts[0] == fs::current_path().string());
  CHECK(fs::exists(starts[1] + "/calctrail_tests"));
  inDirectory(root + "/other", [&] {
    const std::string found = findWorksheets("twin-screw-lift.calc");
    REQUIRE_FALSE(found.empty());
    CHECK(fs::equivalent(found, test::repoPath("worksheets")));
  });
  fs::remove_all(root);
}

TEST_CASE("find worksheets: the message says what was looked for and what to pass", "[find_worksheets]") {
  const std::string m = worksheetsNotFound("sweep_perftest", "twin-screw-lift.calc");
  CHECK(m.rfind("sweep_perftest: found no worksheets/twin-screw-lift.calc in the current directory or the program's (",
                0) == 0);
  CHECK(m.find(worksheetSearchStarts()[1]) != std::string::npos);
  CHECK(m.find(") or their parents; pass --worksheets DIR (the worksheets/ folder of the source tree)") !=
        std::string::npos);
  CHECK(worksheetsNotFound("startup_perftest", "twin-screw-lift.calc", "--worksheet FILE")
            .find("; pass --worksheet FILE") != std::string::npos);
}
