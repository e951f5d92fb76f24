// Templates (docs/templates.md): `param` and `use` lines, instances expanded
// into one model under dotted names, bindings, the path rules, the cache,
// and every diagnostic case by case, each in the right file with the `use`
// line that brought it in.
#include <catch2/catch.hpp>

#include <sys/stat.h>
#include <unistd.h>
#include <cmath>
#include <cstdlib>
#include <thread>

#include "engine/report/json_renderer.h"
#include "engine/report/text_renderer.h"
#include "engine/report/trail.h"
#include "engine/review/sheet_format.h"
#include "engine/sheet/sheet_parser.h"
#include "engine/template/template_path.h"
#include "engine/util/sha256.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

// A folder of worksheets for one test, removed afterwards. Diagnostics are
// read with the folder's path taken out, so they read as in the folder.
struct Folder {
  std::string dir = tempDir();
  ~Folder() {
    if (std::system(("rm -rf '" + dir + "'").c_str()) != 0) {
      // Left behind in the temporary folder: harmless.
    }
  }
  void write(const std::string& name, const std::string& text) const {
    const size_t slash = name.rfind('/');
    if (slash != std::string::npos)
      REQUIRE(std::system(("mkdir -p '" + dir + "/" + name.substr(0, slash) + "'").c_str()) == 0);
    writeFile(dir + "/" + name, text);
  }
  std::unique_ptr<Calculation> calc(const std::string& name, const std::vector<std::string>& sets = {},
                                    TemplateCache* cache = nullptr) const {
    CalcOptions options;
    options.sets = sets;
    options.templates = cache;
    return Calculation::fromFile(dir + "/" + name, options);
  }
  std::string diags(const Calculation& c) const {
    std::string out = diagnostics(c);
    for (size_t at; (at = out.find(dir + "/")) != std::string::npos;) out.erase(at, dir.size() + 1);
    return out;
  }
};

const char* kScrew =
    "title: Test screw\n"
    "param F [N]                 # axial load\n"
    "param f = 0.1               # friction\n"
    "param d [mm] = 20 mm        # diameter\n"
    "T [N*m] = F * f * d / 2     # torque\n"
    "check small: T < 100 [N*m]  # within the wrench\n";

bool contains(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

}  // namespace

TEST_CASE("param lines: the three forms, and what is wrong with others", "[template][parser]") {
  Diagnostics d;
  Sheet s = parseSheet(
      std::make_shared<SourceFile>("t.calc", "param F [N]\nparam f = 0.1\nparam d [mm] = 2 * f * 1 mm\n"),
      &d);
  REQUIRE_FALSE(d.hasErrors());
  REQUIRE(s.quantities.size() == 3);
  CHECK(s.quantities[0].param);
  CHECK(s.quantities[0].required);
  CHECK(s.quantities[0].expr == nullptr);
  CHECK(s.quantities[0].unit_written == "N");
  CHECK(s.quantities[1].param);
  CHECK_FALSE(s.quantities[1].required);
  CHECK(s.quantities[2].param);
  CHECK(s.statements[0].kind == Statement::Define);
  // `param` stays usable as a quantity's name.
  Diagnostics d2;
  Sheet named = parseSheet(std::make_shared<SourceFile>("t.calc", "param = 3\n"), &d2);
  CHECK_FALSE(d2.hasErrors());
  CHECK_FALSE(named.quantities[0].param);

  auto errors = [](const std::string& text) {
    Diagnostics e;
    parseSheet(std::make_shared<SourceFile>("t.calc", text), &e);
    std::string out;
    for (const Diagnostic& x : e.list()) out += x.headline() + "\n";
    return out;
  };
  CHECK(errors("param F\n") ==
        "t.calc:1:7: error: the parameter `F` needs a unit or a default: `param F [N]`, "
        "`param F [N] = 10 kN` or `param F = 0.1`\n");
  CHECK(errors("x = 1\nparam d = 2 * x\n") ==
        "t.calc:2:11: error: the parameter `d` takes its dimension from its default, which then reads no "
        "quantity; declare its unit: `param d [UNIT] = ...`\n");
  CHECK(errors("param F [N] 3\n") ==
        "t.calc:1:13: error: expected `=` or the end of the line after `param F [N]`\n");
  CHECK(errors("param F [N]\nparam F [N]\n") ==
        "t.calc:2:7: error: `F` is defined twice; the first definition is on line 1\n");
}

TEST_CASE("use lines: paths, quotes, bindings with calls, and their errors", "[template][parser]") {
  Diagnostics d;
  Sheet s = parseSheet(std::make_shared<SourceFile>(
                           "t.calc",
                           "use \"my templates/s.calc\" as left with F = max(a, b) / 2, f = 0.1  # one\n"
                           "use s.calc as right\n"),
                       &d);
  REQUIRE_FALSE(d.hasErrors());
  REQUIRE(s.uses.size() == 2);
  CHECK(s.uses[0].path == "my templates/s.calc");
  CHECK(s.uses[0].instance == "left");
  REQUIRE(s.uses[0].bindings.size() == 2);
  CHECK(s.uses[0].bindings[0].param == "F");
  CHECK(renderExpr(*s.uses[0].bindings[0].expr) == "max(a, b) / 2");
  CHECK(s.uses[0].bindings[1].param == "f");
  CHECK(s.uses[0].description == "one");
  CHECK(s.uses[1].path == "s.calc");
  CHECK(s.uses[1].bindings.empty());
  CHECK(s.statements[0].kind == Statement::UseStmt);

  auto errors = [](const std::string& text) {
    Diagnostics e;
    parseSheet(std::make_shared<SourceFile>("t.calc", text), &e);
    std::string out;
    for (const Diagnostic& x : e.list()) out += x.headline() + "\n";
    return out;
  };
  CHECK(contains(errors("use s.calc left\n"), "t.calc:1:12: error: expected `as INSTANCE` after the path"));
  CHECK(contains(errors("use s.calc as\n"), "error: `as` needs the name of the instance"));
  CHECK(contains(errors("use \"s.calc as a\n"), "t.calc:1:5: error: this `\"` is never closed"));
  CHECK(errors("use s.calc as a with F = 1, F = 2\n") ==
        "t.calc:1:29: error: the parameter `F` is bound twice\n");
  CHECK(errors("use s.calc as a\nuse t.calc as a\n") ==
        "t.calc:2:15: error: the instance `a` is used twice; the first is on line 1\n");
  CHECK(errors("a = 1\nuse s.calc as a\n") ==
        "t.calc:2:15: error: the instance `a` has the name of the quantity `a` defined on line 1; rename one "
        "of them\n");
}

TEST_CASE("a template runs on its own: params at their defaults, a required one needs --set", "[template]") {
  Folder f;
  f.write("screw.calc", kScrew);
  auto alone = f.calc("screw.calc");
  CHECK(
      f.diags(*alone) ==
      "screw.calc:2:7: error: the parameter `F` has no default: give it a value with --set \"F=...\", or use "
      "this worksheet as a template (`use ... with F = ...`)\n");
  auto set = f.calc("screw.calc", {"F=1 kN"});
  REQUIRE_FALSE(set->hasErrors());
  CHECK(si(*set, "T") == Approx(1000 * 0.1 * 0.020 / 2));
  CHECK(set->isInput(set->sheet.find("f")));
  auto wrong = f.calc("screw.calc", {"F=1 mm"});
  CHECK(contains(f.diags(*wrong), "error: `F` is declared in [N], force"));
}

TEST_CASE("instances: dotted names, bindings in the using sheet, the same template twice, --set inside",
          "[template]") {
  Folder f;
  f.write("templates/screw.calc", kScrew);
  f.write("main.calc",
          "F_total = 10 kN\n"
          "screws = 2\n"
          "use templates/screw.calc as left with F = F_total / screws\n"
          "use \"templates/screw.calc\" as right with F = F_total / 4, f = 0.2\n"
          "T_sum [N*m] = left.T + right.T   # both\n"
          "check both: T_sum < 20 [N*m]\n");
  auto c = f.calc("main.calc");
  INFO(f.diags(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(si(*c, "left.F") == Approx(5000));
  CHECK(si(*c, "left.T") == Approx(5000 * 0.1 * 0.020 / 2));
  CHECK(si(*c, "right.T") == Approx(2500 * 0.2 * 0.020 / 2));
  CHECK(si(*c, "T_sum") == Approx(5.0 + 5.0));
  // Instance checks under dotted names.
  std::vector<std::string> checks;
  for (const Check& k : c->sheet.checks) checks.push_back(k.name);
  CHECK(checks == std::vector<std::string>{"both", "left.small", "right.small"});
  // --set reaches into an instance, and a binding can be replaced too.
  auto set = f.calc("main.calc", {"left.f=0.3", "right.F=1 kN"});
  REQUIRE_FALSE(set->hasErrors());
  CHECK(si(*set, "left.T") == Approx(5000 * 0.3 * 0.020 / 2));
  CHECK(si(*set, "right.T") == Approx(1000 * 0.2 * 0.020 / 2));
  auto unknown = f.calc("main.calc", {"left.g=0.3"});
  CHECK(contains(f.diags(*unknown), "--set: the worksheet defines no quantity `left.g`"));
}

TEST_CASE("templates nest three levels deep", "[template]") {
  Folder f;
  f.write("lib/screw.calc", kScrew);
  f.write("lib/pair.calc",
          "param F_pair [N]\n"
          "use screw.calc as a with F = F_pair / 2\n"
          "use screw.calc as b with F = F_pair / 2, f = 0.2\n"
          "T_pair [N*m] = a.T + b.T\n");
  f.write("lib/drive.calc",
          "title: Drive\n"
          "param F_drive [N] = 8 kN\n"
          "use pair.calc as front with F_pair = F_drive * 0.75\n"
          "use pair.calc as rear with F_pair = F_drive * 0.25\n"
          "T_drive [N*m] = front.T_pair + rear.T_pair\n");
  f.write("main.calc",
          "use lib/drive.calc as drive with F_drive = 12 kN\n"
          "T [N*m] = drive.T_drive\n");
  auto c = f.calc("main.calc");
  INFO(f.diags(*c));
  REQUIRE_FALSE(c->hasErrors());
  const double front = 12000 * 0.75, rear = 12000 * 0.25;
  CHECK(si(*c, "drive.front.a.T") == Approx(front / 2 * 0.1 * 0.020 / 2));
  CHECK(si(*c, "drive.rear.b.T") == Approx(rear / 2 * 0.2 * 0.020 / 2));
  CHECK(si(*c, "T") == Approx((front + rear) / 2 * (0.1 + 0.2) * 0.020 / 2));
  CHECK(c->sheet.find("drive.front.b.small") < 0);  // a check is no quantity
  CHECK(c->sheet.checks.size() == 4);
  CHECK(c->sheet.checks[3].name == "drive.rear.b.small");
  // Every file once, relative to the main sheet, with its hash.
  REQUIRE(c->sheet.files.size() == 4);
  CHECK(c->sheet.files[0].path == "main.calc");
  CHECK(c->sheet.files[1].path == "lib/drive.calc");
  CHECK(c->sheet.files[2].path == "lib/pair.calc");
  CHECK(c->sheet.files[3].path == "lib/screw.calc");
  CHECK(c->sheet.files[3].sha256 == sha256Hex(kScrew));
  CHECK(c->sheet.files[0].sha256 == c->sha256);
  // --set three levels down.
  auto set = f.calc("main.calc", {"drive.rear.b.f=0.4"});
  REQUIRE_FALSE(set->hasErrors());
  CHECK(si(*set, "drive.rear.b.T") == Approx(rear / 2 * 0.4 * 0.020 / 2));
}

TEST_CASE("template diagnostics, case by case, in the right file with the use line",
          "[template][diagnostics]") {
  Folder f;
  f.write("templates/screw.calc", kScrew);

  SECTION("a binding of another dimension than its parameter (declared unit)") {
    f.write("main.calc", "L = 3 m\nuse templates/screw.calc as left with F = L * 2\n");
    CHECK(f.diags(*f.calc("main.calc")) ==
          "main.calc:2:43: error: the binding of `F` in the instance `left` gives length (mm), but the "
          "parameter `F` of templates/screw.calc is declared in [N], force (N)\n");
  }
  SECTION("a binding of another dimension than its parameter (dimension of the default)") {
    f.write("main.calc", "use templates/screw.calc as left with F = 1 kN, f = 2 mm\n");
    CHECK(f.diags(*f.calc("main.calc")) ==
          "main.calc:1:53: error: the binding of `f` in the instance `left` gives length (mm), but the "
          "parameter `f` of templates/screw.calc is dimensionless (1) (the dimension of its default)\n");
  }
  SECTION("a required parameter left unbound") {
    f.write("main.calc", "use templates/screw.calc as left with f = 0.2\n");
    CHECK(f.diags(*f.calc("main.calc")) ==
          "main.calc:1:29: error: the instance `left` needs a value for the parameter `F` [N] of "
          "templates/screw.calc, which has no default: add `with F = ...`\n");
  }
  SECTION("a binding of a name that is no parameter lists the parameters") {
    f.write("main.calc", "use templates/screw.calc as left with F = 1 kN, ff = 0.2, T = 3 [N*m]\n");
    CHECK(
        f.diags(*f.calc("main.calc")) ==
        "main.calc:1:49: error: `ff` is not a parameter of templates/screw.calc; its parameters are `F`, `f` "
        "or `d`; did you mean `f`?\n"
        "main.calc:1:59: error: `T` is not a parameter of templates/screw.calc; its parameters are `F`, `f` "
        "or `d`\n");
  }
  SECTION("a template not found names the path tried") {
    f.write("main.calc", "use templates/scrw.calc as left\n");
    CHECK(f.diags(*f.calc("main.calc")) ==
          "main.calc:1:5: error: cannot read the template `templates/scrw.calc` (tried templates/scrw.calc): "
          "cannot read file: No such file or directory\n");
  }
  SECTION("an absolute path is refused") {
    f.write("main.calc", "use " + f.dir + "/templates/screw.calc as left with F = 1 kN\n");
    CHECK(contains(
        f.diags(*f.calc("main.calc")),
        "main.calc:1:5: error: `templates/screw.calc` is an absolute path: a worksheet must calculate "
        "on a colleague's checkout too; write the path relative to this file"));
  }
  SECTION("a cycle of uses names the whole chain") {
    f.write("a.calc", "x = 1\nuse b.calc as b\n");
    f.write("b.calc", "y = 2\nuse c.calc as c\n");
    f.write("c.calc", "z = 3\nuse a.calc as a\n");
    CHECK(f.diags(*f.calc("a.calc")) ==
          "c.calc:2:5: error: a template that uses itself: a.calc -> b.calc -> c.calc -> a.calc (uses form a "
          "cycle; a template cannot be part of itself) (in the instance `b.c` used at b.calc:2:15, in the "
          "instance `b` used at a.calc:2:15)\n");
    f.write("self.calc", "x = 1\nuse self.calc as me\n");
    CHECK(f.diags(*f.calc("self.calc")) ==
          "self.calc:2:5: error: a template that uses itself: self.calc -> self.calc (uses form a cycle; a "
          "template cannot be part of itself)\n");
  }
  SECTION("an error inside a template names the use line, the whole chain when nested") {
    f.write("bad.calc", "param F [N]\nT [N*m] = F * 2\n");
    f.write("pair.calc", "use bad.calc as one with F = 1 kN\n");
    f.write("main.calc", "use pair.calc as p\n");
    CHECK(
        f.diags(*f.calc("main.calc")) ==
        "bad.calc:2:4: error: `p.one.T` is declared in [N*m], torque or energy (N*m), but its formula gives "
        "force (N) (in the instance `p.one` used at pair.calc:1:17, in the instance `p` used at "
        "main.calc:1:18)\n");
  }
  SECTION("an unknown name inside a template is said in the template's names") {
    f.write("bad.calc", "diameter = 2 mm\nr = diametr / 2\n");
    f.write("main.calc", "use bad.calc as b\n");
    CHECK(
        f.diags(*f.calc("main.calc")) ==
        "bad.calc:2:5: error: unknown name `diametr`; did you mean `diameter`? (in the instance `b` used at "
        "main.calc:1:17)\n");
  }
  SECTION("a parse error inside a template") {
    f.write("bad.calc", "x = 1 +\n");
    f.write("main.calc", "use bad.calc as b\n");
    CHECK(contains(f.diags(*f.calc("main.calc")), "bad.calc:1:7: error: "));
    CHECK(contains(f.diags(*f.calc("main.calc")), "(in the instance `b` used at main.calc:1:17)\n"));
  }
  SECTION("a fault while evaluating inside a template") {
    f.write("div.calc", "param a = 1\nb = 1 / a\n");
    f.write("main.calc", "zero = 0\nuse div.calc as d with a = zero\n");
    CHECK(contains(f.diags(*f.calc("main.calc")),
                   "div.calc:2:5: error: `d.b` cannot be calculated: division by zero"));
    CHECK(contains(f.diags(*f.calc("main.calc")), "(in the instance `d` used at main.calc:2:17)\n"));
  }
  SECTION("a name clash between an instance and a quantity") {
    f.write("main.calc", "left = 3\nuse templates/screw.calc as left with F = 1 kN\n");
    CHECK(f.diags(*f.calc("main.calc")) ==
          "main.calc:2:29: error: the instance `left` has the name of the quantity `left` defined on line 1; "
          "rename one of them\n");
  }
  SECTION("an unknown instance quantity in the using sheet") {
    f.write("main.calc", "use templates/screw.calc as left with F = 1 kN\nx = left.TT\n");
    CHECK(f.diags(*f.calc("main.calc")) ==
          "main.calc:2:5: error: unknown name `left.TT`; did you mean `left.T`, `left.F` "
          "or `left.f`?\n");
  }
}

TEST_CASE("paths: relative to the using file, `../` allowed, a symbolic link out of the tree refused",
          "[template][paths]") {
  CHECK(normalizePath("a/./b/../c") == "a/c");
  CHECK(normalizePath("../a/../../b") == "../../b");
  CHECK(normalizePath("/x/../../y") == "/y");
  CHECK(joinPath("sheets", "../lib/s.calc") == "lib/s.calc");
  CHECK(joinPath("", "./s.calc") == "s.calc");
  CHECK(leadingParents("../../lib/s.calc") == 2);
  CHECK(leadingParents("lib/../s.calc") == 0);
  CHECK(isAbsolutePath("/x"));
  CHECK(isAbsolutePath("C:\\x"));
  CHECK(isAbsolutePath("~/x"));
  CHECK_FALSE(isAbsolutePath("x/y"));
  CHECK(insideFolder("/a/b/c", "/a/b"));
  CHECK_FALSE(insideFolder("/a/bc", "/a/b"));

  Folder f;
  f.write("lib/screw.calc", kScrew);
  f.write("sheets/main.calc", "use ../lib/screw.calc as s with F = 1 kN\n");
  auto up = f.calc("sheets/main.calc");
  CHECK(f.diags(*up).empty());
  CHECK(up->sheet.files[1].path == "../lib/screw.calc");
  // The same file through a link inside sheets/ that leads out of it: refused.
  REQUIRE(symlink((f.dir + "/lib").c_str(), (f.dir + "/sheets/lib").c_str()) == 0);
  f.write("sheets/linked.calc", "use lib/screw.calc as s with F = 1 kN\n");
  const std::string msg = f.diags(*f.calc("sheets/linked.calc"));
  CHECK(contains(msg,
                 "sheets/linked.calc:1:5: error: the template `lib/screw.calc` is reached through a "
                 "symbolic link that leads out of the folder the path names"));
  // A link that stays inside the tree is fine.
  REQUIRE(symlink((f.dir + "/lib/screw.calc").c_str(), (f.dir + "/lib/alias.calc").c_str()) == 0);
  f.write("lib/user.calc", "use alias.calc as s with F = 1 kN\n");
  CHECK(f.diags(*f.calc("lib/user.calc")).empty());
}

TEST_CASE("a template shared by sheets checked on many threads is parsed once", "[template][cache][jobs]") {
  Folder f;
  f.write("templates/screw.calc", kScrew);
  constexpr int kSheets = 16;
  for (int i = 0; i < kSheets; ++i)
    f.write("s" + std::to_string(i) + ".calc",
            "use templates/screw.calc as x with F = " + std::to_string(i + 1) + " kN\n");
  TemplateCache cache;
  std::vector<std::unique_ptr<Calculation>> calcs(kSheets);
  std::vector<std::thread> threads;
  for (int i = 0; i < kSheets; ++i)
    threads.emplace_back([&, i] { calcs[static_cast<size_t>(i)] = f.calc("s" + std::to_string(i) + ".calc", {}, &cache); });
  for (std::thread& t : threads) t.join();
  CHECK(cache.parses() == 1);
  for (int i = 0; i < kSheets; ++i) {
    const Calculation& c = *calcs[static_cast<size_t>(i)];
    REQUIRE_FALSE(c.hasErrors());
    // T = F * f * dm / 2 with the template's f = 0.1 and dm = 20 mm, as the test below.
    CHECK(si(c, "x.T") == Approx((i + 1) * 1000.0 * 0.1 * 0.020 / 2));
  }
}

TEST_CASE("a template shared by many sheets is parsed once per run", "[template][cache]") {
  Folder f;
  f.write("templates/screw.calc", kScrew);
  f.write("a.calc",
          "use templates/screw.calc as l with F = 1 kN\nuse templates/screw.calc as r with F = 2 kN\n");
  f.write("b.calc", "use templates/screw.calc as x with F = 3 kN\n");
  TemplateCache cache;
  auto a = f.calc("a.calc", {}, &cache);
  auto b = f.calc("b.calc", {}, &cache);
  REQUIRE_FALSE(a->hasErrors());
  REQUIRE_FALSE(b->hasErrors());
  CHECK(cache.parses() == 1);
  CHECK(si(*b, "x.T") == Approx(3000 * 0.1 * 0.020 / 2));
  // The check command shares one cache: both sheets still check, each with the other's template.
  Run r = runCliIn(f.dir, "check a.calc b.calc");
  CHECK(r.status == 0);
  CHECK(r.out == "2 worksheets, 3 checks: 0 failed\n");
}

TEST_CASE("the trail: files with hashes, an instance part with its parameters, checks under dotted names",
          "[template][report]") {
  Folder f;
  f.write("templates/screw.calc", kScrew);
  f.write("main.calc",
          "title: Two screws\nF_total = 10 kN\n"
          "use templates/screw.calc as left with F = F_total / 2\n"
          "use templates/screw.calc as right with F = 1 kN, f = 0.2\n");
  auto c = f.calc("main.calc");
  REQUIRE_FALSE(c->hasErrors());
  const Trail t = buildTrail(*c, 4);
  REQUIRE(t.files.size() == 2);
  CHECK(t.files[1].path == "templates/screw.calc");
  CHECK(t.files[1].sha256 == sha256Hex(kScrew));
  REQUIRE(t.instances.size() == 2);
  CHECK(t.instances[0].heading == "Instance left: Test screw (templates/screw.calc)");
  REQUIRE(t.instances[0].params.size() == 3);
  CHECK(t.instances[0].params[0].name == "F");
  CHECK(t.instances[0].params[0].binding == "F_total / 2");
  CHECK(t.instances[0].params[1].binding.empty());
  // Within its part, an instance's formula reads in the template's names.
  const TrailSteps::Held torque_held = t.steps.get(c->sheet.find("left.T"));
  const TrailStep& torque = *torque_held;
  CHECK(torque.formula == "F * f * d / 2");
  CHECK(torque.local_name == "T");
  CHECK(t.steps.get(c->sheet.find("left.F"))->formula == "F_total / 2");

  const std::string text = renderText(t);
  CHECK(contains(text, "template  templates/screw.calc\nsha256    " + sha256Hex(kScrew) + "\n"));
  CHECK(contains(text, "\nInstance left: Test screw (templates/screw.calc)\n"));
  std::vector<std::string> notes;
  for (const TrailBlock& b : t.blocks)
    if (b.kind == TrailBlock::Note) notes.push_back(t.blockText(b));
  CHECK(notes == std::vector<std::string>{
                     "Parameters: F = F_total / 2 = 5000 N; f = 0.1 (default); d = 20 mm (default).",
                     "Parameters: F = 1 kN = 1000 N; f = 0.2; d = 20 mm (default)."});
  CHECK(contains(text,
                 "  parameter  value   bound by\n  F          5000 N  F_total / 2\n"
                 "  f          0.1     (default)  friction\n  d          20 mm   (default)  diameter\n"));
  CHECK(contains(text, "  pass  right.small  right.T < 100 [N*m]\n"));

  const std::string json = renderJson(t);
  CHECK(contains(json,
                 "\"files\": [\n    {\n      \"path\": \"main.calc\",\n      \"sha256\": \"" + c->sha256));
  CHECK(
      contains(json, "\"path\": \"templates/screw.calc\",\n      \"sha256\": \"" + sha256Hex(kScrew) + "\""));
  CHECK(contains(json, "\"name\": \"left.T\""));
  CHECK(contains(json, "\"name\": \"right.small\""));
  CHECK(contains(json, "\"binding\": \"F_total / 2\""));
}

TEST_CASE("fmt writes param and use lines canonically and keeps their meaning", "[template][review]") {
  Diagnostics d;
  const std::string text =
      formatWorksheet("t.calc",
                      "param   F [N]   # load\n"
                      "param f=0.1\n"
                      "use  \"my t/s.calc\"   as  a  with  F=2*b , f = max(1, 2)  # one\n"
                      "use s.calc as c\n"
                      "b = 1 N\n",
                      &d);
  REQUIRE_FALSE(d.hasErrors());
  CHECK(text ==
        "param F [N]                                             # load\n"
        "param f = 0.1\n"
        "use \"my t/s.calc\" as a with F = 2 * b, f = max(1, 2)    # one\n"
        "use s.calc as c\n"
        "b = 1 N\n");
  Diagnostics again;
  CHECK(formatWorksheet("t.calc", text, &again) == text);
}
