// Warnings raised inside a template's instance (issue 12's rule): each
// points into the template at the call that raised it, names the `use`
// line that brought it in as the template's errors do, and is flagged at
// the instance's step in every format, never at a main-sheet step that
// happens to stand on the same line number.
#include <catch2/catch.hpp>

#include <cstdlib>

#include "tests/json_reader.h"
#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

struct Folder {
  std::string dir = tempDir();
  ~Folder() {
    if (std::system(("rm -rf '" + dir + "'").c_str()) != 0) {
      // Left behind in the temporary folder: harmless.
    }
  }
  void write(const std::string& name, const std::string& text) const { writeFile(dir + "/" + name, text); }
};

// The text from `begin` up to the first `end` after it; "" when `begin` is not there.
std::string block(const std::string& text, const std::string& begin, const std::string& end) {
  const size_t at = text.find(begin);
  if (at == std::string::npos) return "";
  const size_t stop = text.find(end, at + begin.size());
  return text.substr(at, stop == std::string::npos ? std::string::npos : stop - at);
}

bool contains(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

// f = 0.45 lies outside torque_raise's usual friction range (0.05 to 0.3,
// functions/plausibility.h), so the call warns; the template's lines 6 and 7
// are also lines of the using sheet, where T2 stands on line 6.
const char* kScrew =
    "param F [N]\n"
    "param f = 0.10\n"
    "d = 20 mm\n"
    "p = 4 mm\n"
    "l [mm/rev] = thread_lead(p, 1)\n"
    "d_m = trap_pitch_dia(d, p)\n"
    "T [N*m] = torque_raise(F, d_m, l, f, trap_flank_angle())\n";

const char* kSheet =
    "title: x\n"
    "note a note line here about things\n"
    "F_total = 20 kN\n"
    "use screw.calc as s with F = F_total, f = 0.45\n"
    "note another note\n"
    "T2 [N*m] = 2 * s.T\n";

const char* kWarning = "`torque_raise`: f = 0.45 is outside the usual range 0.05 to 0.3";

}  // namespace

TEST_CASE("a warning inside an instance points into the template, with the use line",
          "[template][warnings]") {
  Folder f;
  f.write("screw.calc", kScrew);
  f.write("a.calc", kSheet);
  const Run text = runCliIn(f.dir, "report a.calc");
  REQUIRE(text.status == 0);
  // As an error inside a template reads: the template's place, then the use line.
  const std::string headline = std::string("screw.calc:7:35: warning: ") + kWarning;
  CHECK(text.err.rfind(headline, 0) == 0);
  CHECK(contains(text.err,
                 "(in the instance `s` used at a.calc:4:19)\n"
                 "    T [N*m] = torque_raise(F, d_m, l, f, trap_flank_angle())\n"
                 "                                      ^\n"));
  CHECK(count(text.err, "warning:") == 1);
  CHECK_FALSE(contains(text.err, "a.calc:6"));

  // Text: flagged at s.T only.
  CHECK(contains(text.out, "WARNING: 1 warning, flagged at its step: s.T (screw.calc line 7)\n"));
  CHECK(contains(block(text.out, "\n  s.T\n", "\n\n"), "WARNING: `torque_raise`: f = 0.45"));
  CHECK_FALSE(contains(block(text.out, "\n  T2\n", "\n\n"), "WARNING"));
  CHECK_FALSE(contains(block(text.out, "\n  s.d_m\n", "\n\n"), "WARNING"));
  CHECK(contains(text.out, "  " + headline));

  // Markdown.
  const Run md = runCliIn(f.dir, "report a.calc --format md");
  REQUIRE(md.status == 0);
  CHECK(contains(md.out, "**WARNING: 1 warning, flagged at its step: s.T (screw.calc line 7)**"));
  CHECK(contains(block(md.out, "**`s.T`**", "\n\n"), "**WARNING:**"));
  CHECK_FALSE(contains(block(md.out, "**`T2`**", "\n\n"), "WARNING"));
  CHECK_FALSE(contains(block(md.out, "**`s.d_m`**", "\n\n"), "WARNING"));

  // HTML.
  const Run html = runCliIn(f.dir, "report a.calc --format html");
  REQUIRE(html.status == 0);
  CHECK(contains(html.out, "1 warning, flagged at its step: s.T (screw.calc line 7)"));
  CHECK(contains(block(html.out, "<div class=\"step\" id=\"q-s.T\">", "<section"), "WARNING"));
  CHECK_FALSE(
      contains(block(html.out, "<div class=\"step\" id=\"q-T2\">", "<div class=\"step\""), "WARNING"));
  CHECK_FALSE(
      contains(block(html.out, "<div class=\"step\" id=\"q-s.d_m\">", "<div class=\"step\""), "WARNING"));

  // JSON: the headline carries the file with its line; the quantity the message.
  const Run json = runCliIn(f.dir, "report a.calc --format json");
  REQUIRE(json.status == 0);
  Json j;
  std::string why;
  REQUIRE(parseJson(json.out, &j, &why));
  REQUIRE(j["warnings"].array.size() == 1);
  CHECK(j["warnings"][0].string.rfind(headline, 0) == 0);
  CHECK(contains(j["warnings"][0].string, "(in the instance `s` used at a.calc:4:19)"));
  CHECK(j["summary"]["warnings_at_steps"].number == 1);
  for (const Json& q : j["quantities"].array) {
    const std::string& name = q["name"].string;
    INFO(name);
    CHECK(q["file"].string == (name.rfind("s.", 0) == 0 ? "screw.calc" : "a.calc"));
    if (name == "s.T") {
      CHECK(q["line"].number == 7);
      REQUIRE(q["warnings"].array.size() == 1);
      CHECK(q["warnings"][0].string.rfind(kWarning, 0) == 0);
    } else {
      CHECK(q["warnings"].array.empty());
    }
  }
}

TEST_CASE("a warning three templates deep names the whole use chain and its step", "[template][warnings]") {
  Folder f;
  f.write("screw.calc", kScrew);
  f.write("low.calc", "param f = 0.1\nuse screw.calc as s with F = 10 kN, f = f\n");
  f.write("mid.calc", "param f = 0.1\nuse low.calc as k with f = f\n");
  f.write("a.calc",
          "use mid.calc as m with f = 0.45\nx = 1\ny = 2\nz = 3\nw = 4\nv = 5\nT2 [N*m] = m.k.s.T\n");
  const Run r = runCliIn(f.dir, "report a.calc");
  REQUIRE(r.status == 0);
  CHECK(r.err.rfind(std::string("screw.calc:7:35: warning: ") + kWarning, 0) == 0);
  CHECK(contains(r.err,
                 "(in the instance `m.k.s` used at low.calc:2:19, in the instance `m.k` used at "
                 "mid.calc:2:17, in the instance `m` used at a.calc:1:17)\n"));
  CHECK(contains(r.out, "WARNING: 1 warning, flagged at its step: m.k.s.T (screw.calc line 7)\n"));
  CHECK(contains(block(r.out, "\n  m.k.s.T\n", "\n\n"), "WARNING: `torque_raise`"));
  CHECK_FALSE(contains(block(r.out, "\n  T2\n", "\n\n"), "WARNING"));
}

TEST_CASE("the same template used twice: the warning at the instance that raised it",
          "[template][warnings]") {
  Folder f;
  f.write("screw.calc", kScrew);
  f.write("a.calc",
          "use screw.calc as dry with F = 20 kN, f = 0.45\n"
          "use screw.calc as oiled with F = 20 kN, f = 0.12\n");
  const Run r = runCliIn(f.dir, "report a.calc --format json");
  REQUIRE(r.status == 0);
  CHECK(count(r.err, "warning:") == 1);
  CHECK(contains(r.err, "(in the instance `dry` used at a.calc:1:19)"));
  Json j;
  std::string why;
  REQUIRE(parseJson(r.out, &j, &why));
  for (const Json& q : j["quantities"].array) {
    INFO(q["name"].string);
    CHECK(q["warnings"].array.size() == (q["name"].string == "dry.T" ? 1u : 0u));
  }
}

TEST_CASE("a load case run alone (--case) over an instance: its warning at the instance's step",
          "[template][warnings][cases]") {
  Folder f;
  f.write("screw.calc", kScrew);
  f.write("c.calc",
          "F_total = 20 kN\n"
          "use screw.calc as s with F = F_total, f = 0.12\n"
          "T2 [N*m] = 2 * s.T\n"
          "case dry: s.f = 0.45\n");
  const Run r = runCliIn(f.dir, "report c.calc --case dry");
  REQUIRE(r.status == 0);
  CHECK(r.err.rfind(std::string("screw.calc:7:35: warning: ") + kWarning, 0) == 0);
  CHECK(contains(r.err, "(in the instance `s` used at c.calc:2:19)"));
  CHECK(contains(r.out, "WARNING: 1 warning, flagged at its step: s.T (screw.calc line 7)\n"));
  CHECK(contains(block(r.out, "\n  s.T\n", "\n\n"), "WARNING: `torque_raise`"));
  CHECK_FALSE(contains(block(r.out, "\n  T2\n", "\n\n"), "WARNING"));
}
