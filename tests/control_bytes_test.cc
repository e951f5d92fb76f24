// Control characters in a worksheet (docs/format.md, "Lines"): an error at
// their exact place, in every kind of line, so that none reaches a terminal
// or an HTML report raw; TAB stays a blank. Diagnostics and the textconv
// view never print one either. engine/sheet/control_chars.h.
#include <catch2/catch.hpp>

#include <algorithm>
#include <string>

#include "engine/review/annotated_sheet.h"
#include "engine/sheet/control_chars.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;

namespace {

const std::string kRest =
    ") is not allowed in worksheet text: it would reach terminals and reports as it is; delete it (a TAB "
    "is the only one allowed)";

// A control character other than the LF that ends each printed line.
bool hasControl(std::string s) {
  s.erase(std::remove(s.begin(), s.end(), '\n'), s.end());
  size_t length;
  return findControlChar(s, &length) != std::string::npos;
}

}  // namespace

TEST_CASE("control bytes: an error at their position in every kind of line", "[control][diagnostics]") {
  struct Case {
    std::string text;
    std::string headline;
  };
  const Case cases[] = {
      {"title: Gate \x1B[31mhoist\nx = 1\n", "sheet.calc:1:13: error: a control character (ESC, 0x1B"},
      {"project: a\x07\nx = 1\n", "sheet.calc:1:11: error: a control character (BEL, 0x07"},
      {"x = 1\nsection Lo\x1B" "ads\n", "sheet.calc:2:11: error: a control character (ESC, 0x1B"},
      {"note a\x08\x08\x08" "b\nx = 1\n", "sheet.calc:1:7: error: a control character (BS, 0x08"},
      {"# comment \x1B]0;title\x07\nx = 1\n", "sheet.calc:1:11: error: a control character (ESC, 0x1B"},
      {"x = 1   # load \x7F\n", "sheet.calc:1:16: error: a control character (DEL, 0x7F"},
      {"x = 1 \x0C+ 2\n", "sheet.calc:1:7: error: a control character (FF, 0x0C"},
      {"check ok: 1 < 2 # \x1B[2J\nx = 1\n", "sheet.calc:1:19: error: a control character (ESC, 0x1B"},
      {std::string("x = 1 # nul \0 here\n", 19), "sheet.calc:1:13: error: a control character (NUL, 0x00"},
      {"x = 1\x0B\n", "sheet.calc:1:6: error: a control character (VT, 0x0B"},
      {"x\x1F = 1\n", "sheet.calc:1:2: error: a control character (US, 0x1F"},
      // A C1 control (U+009B, the 8-bit CSI) is a control character too; columns count code points.
      {"note \xCE\xB1 \xC2\x9B" "2J\nx = 1\n", "sheet.calc:1:8: error: a control character (U+009B"},
  };
  for (const Case& c : cases) {
    INFO("text: " << c.text);
    auto calc_ = calc(c.text);
    const std::string d = diagnostics(*calc_);
    CHECK(d == c.headline + kRest + "\n");
    CHECK(calc_->hasErrors());
    // Neither the message nor the shown source line carries the character.
    for (const Diagnostic& diag : calc_->diags.list()) CHECK_FALSE(hasControl(diag.render()));
  }
}

TEST_CASE("control bytes: a TAB is a blank anywhere", "[control][sheet]") {
  auto c = calc("title:\tGate\nx\t=\t1\t#\tload\n#\tcomment\nnote\ta\tb\n");
  INFO(diagnostics(*c));
  REQUIRE_FALSE(c->hasErrors());
  CHECK(c->sheet.meta.get("title") == "Gate");
  CHECK(c->sheet.quantities[0].description == "load");
}

TEST_CASE("control bytes: every problem of the file, one per line", "[control][diagnostics]") {
  auto c = calc("title: a\x1B\nx = 1\x07\ny = 2\n");
  CHECK(c->diags.errorCount() == 2);
  const std::string d = diagnostics(*c);
  CHECK(d.find("sheet.calc:1:9: error: a control character (ESC, 0x1B") != std::string::npos);
  CHECK(d.find("sheet.calc:2:6: error: a control character (BEL, 0x07") != std::string::npos);
}

TEST_CASE("control bytes: nothing reaches the terminal from report, check, fmt or textconv",
          "[control][cli]") {
  const std::string dir = tempDir();
  const std::string file = dir + "/sheet.calc";
  const std::string bytes = "title: \x1B[2Jwiped\nx = 1 # \x07\n";
  writeFile(file, bytes);
  for (const char* command : {"report", "check", "fmt", "textconv"}) {
    INFO(command);
    const Run r = runCli(std::string(command) + " '" + file + "'");
    const bool named = r.err.find("control character (ESC, 0x1B)") != std::string::npos ||
                       r.out.find("control character (ESC, 0x1B)") != std::string::npos;
    CHECK(named);
    CHECK_FALSE(hasControl(r.out));
    CHECK_FALSE(hasControl(r.err));
  }
  CHECK(readFile(file) == bytes);
  // --set text has not been through the worksheet's lines: the same rule, at its place.
  writeFile(file, "x = 1\n");
  const Run set = runCli("report '" + file + "' --set \"$(printf 'x=2\\033[2J')\"");
  CHECK(set.status == 2);
  CHECK(set.err.rfind("--set:1:4: error: a control character (ESC, 0x1B" + kRest + "\n", 0) == 0);
  CHECK_FALSE(hasControl(set.err));
}

TEST_CASE("control bytes: the helpers", "[control]") {
  size_t length = 0;
  CHECK(findControlChar("abc", &length) == std::string::npos);
  CHECK(findControlChar("a\tb", &length) == std::string::npos);
  CHECK(findControlChar("ab\x1B", &length) == 2);
  CHECK(length == 1);
  CHECK(findControlChar("\xC2\xB5m \xC2\x85", &length) == 4);  // micro sign is fine, U+0085 NEL is not
  CHECK(length == 2);
  CHECK(findControlChar("\xC2", &length) == std::string::npos);  // a broken sequence is not misread
  CHECK(withoutControlChars("a\x1B[1mb\tc\xC2\x9B") == "a?[1mb\tc?");
  CHECK(isForbiddenControl(0x1B));
  CHECK(isForbiddenControl(0x7F));
  CHECK(isForbiddenControl(0x9F));
  CHECK_FALSE(isForbiddenControl('\t'));
  CHECK_FALSE(isForbiddenControl(0xA0));
}
