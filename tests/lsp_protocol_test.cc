// The language server at the protocol level: every message it answers, in
// process through its message API (lsp::Server), the framing on its own,
// and once the real `calctrail lsp` over pipes. Bad input of every kind
// (malformed JSON, a bad Content-Length, positions outside the document, a
// document that is not open) gets an error response or an empty result.
#include <catch2/catch.hpp>

#include <regex>
#include <sstream>

#include <nlohmann/json.hpp>

#include "engine/lsp/completion.h"
#include "engine/lsp/document.h"
#include "engine/lsp/hover.h"
#include "engine/lsp/json_rpc.h"
#include "engine/lsp/lsp_server.h"
#include "engine/review/sheet_format.h"
#include "tests/test_support.h"

using namespace calctrail;
using namespace calctrail::test;
using nlohmann::json;

namespace {

const std::string kUri = "file:///sheets/lift%20table.calc";

// A client in the same process: sends messages to a Server and keeps what it answers.
struct Client {
  lsp::Server server;
  int next_id = 1;
  std::vector<json> notifications;  ///< every notification received, in order
  std::vector<json> responses;      ///< every response received, in order

  explicit Client(bool initialize = true) {
    if (initialize) {
      const json r = call("initialize", {{"capabilities", json::object()}});
      REQUIRE(r.contains("result"));
      notify("initialized", json::object());
    }
  }

  void collect() {
    for (json& m : server.takeOutgoing()) (m.contains("method") ? notifications : responses).push_back(m);
  }
  void sendRaw(const std::string& body) {
    server.receive(body);
    server.flush();
    collect();
  }
  // The whole response to one request.
  json call(const std::string& method, const json& params) {
    const int id = next_id++;
    sendRaw(lsp::dump({{"jsonrpc", "2.0"}, {"id", id}, {"method", method}, {"params", params}}));
    for (const json& r : responses)
      if (r.value("id", json()) == id) return r;
    FAIL("no response to " << method);
    return {};
  }
  json result(const std::string& method, const json& params) {
    const json r = call(method, params);
    INFO(r.dump());
    REQUIRE(r.contains("result"));
    return r["result"];
  }
  // Sends without flushing: as messages queued behind each other.
  void queue(const std::string& method, const json& params) {
    server.receive(lsp::dump({{"jsonrpc", "2.0"}, {"method", method}, {"params", params}}));
  }
  void notify(const std::string& method, const json& params) {
    queue(method, params);
    server.flush();
    collect();
  }
  void open(const std::string& text, const std::string& uri = kUri) {
    notify("textDocument/didOpen",
           {{"textDocument", {{"uri", uri}, {"languageId", "calc"}, {"version", 1}, {"text", text}}}});
  }
  void change(int version, const json& changes) {
    notify("textDocument/didChange",
           {{"textDocument", {{"uri", kUri}, {"version", version}}}, {"contentChanges", changes}});
  }
  // The diagnostics last published for the URI.
  json diagnostics(const std::string& uri = kUri) const {
    for (auto it = notifications.rbegin(); it != notifications.rend(); ++it)
      if ((*it)["method"] == "textDocument/publishDiagnostics" && (*it)["params"]["uri"] == uri)
        return (*it)["params"]["diagnostics"];
    FAIL("no diagnostics published for " << uri);
    return {};
  }
  int published() const {
    int n = 0;
    for (const json& m : notifications) n += m["method"] == "textDocument/publishDiagnostics";
    return n;
  }
};

json at(int line, int character) {
  return {{"line", line}, {"character", character}};
}
json range(int l0, int c0, int l1, int c1) {
  return {{"start", at(l0, c0)}, {"end", at(l1, c1)}};
}
json textPos(int line, int character, const std::string& uri = kUri) {
  return {{"textDocument", {{"uri", uri}}}, {"position", at(line, character)}};
}
json change(int l0, int c0, int l1, int c1, const std::string& text) {
  return {{"range", range(l0, c0, l1, c1)}, {"text", text}};
}

// A small lift: given values, formulas with library calls, two checks.
const std::string kSheet =
    "F = 20 kN                       # axial load\n"
    "d = 40 mm                       # major diameter\n"
    "p = trap_pitch(d)               # pitch of the size\n"
    "A [mm^2] = pi * d^2 / 4         # gross area\n"
    "sigma [MPa] = F / A             # axial stress\n"
    "check stress: sigma <= 50 MPa   # allowable\n"
    "check pitch: p >= 8 mm          # coarse enough\n";

// Every diagnostic `calctrail report` prints for `text`, as "LINE:COL+WIDTH: severity: MESSAGE",
// WIDTH the code points its caret underlines.
std::vector<std::string> cliDiagnostics(const std::string& text) {
  const std::string dir = tempDir();
  writeFile(dir + "/sheet.calc", text);
  const Run r = runCliIn(dir, "report sheet.calc");
  std::vector<std::string> out;
  std::istringstream in(r.err);
  std::string line;
  const std::regex headline(R"(^sheet\.calc:(\d+):(\d+): ((error|warning): .*)$)");
  const std::regex caret(R"(^ *(\^~*)$)");
  std::smatch m, c;
  while (std::getline(in, line)) {
    if (!std::regex_match(line, m, headline)) continue;
    std::string source, marks;
    std::getline(in, source);
    std::getline(in, marks);
    REQUIRE(std::regex_match(marks, c, caret));
    out.push_back(m[1].str() + ":" + m[2].str() + "+" + std::to_string(c[1].length()) + ": " + m[3].str());
  }
  std::remove((dir + "/sheet.calc").c_str());
  return out;
}

std::vector<lsp::Frame> frames(const std::string& bytes) {
  lsp::Framer framer;
  framer.feed(bytes);
  std::vector<lsp::Frame> out;
  lsp::Frame f;
  while (framer.next(&f)) out.push_back(f);
  return out;
}

}  // namespace

TEST_CASE("lsp framing: bodies split anywhere, broken headers skipped", "[lsp][framing]") {
  const std::string a = "{\"id\":1}", b = "{\"id\":\"é\"}";
  const std::string stream =
      lsp::frame(a) + "Content-Type: application/vscode-jsonrpc; charset=utf-8\r\n" + lsp::frame(b);
  // Fed one byte at a time, as a slow pipe may deliver them.
  lsp::Framer framer;
  std::vector<std::string> bodies;
  lsp::Frame f;
  for (char c : stream) {
    framer.feed(std::string_view(&c, 1));
    while (framer.next(&f)) {
      REQUIRE(f.kind == lsp::Frame::Body);
      bodies.push_back(f.body);
    }
  }
  CHECK(bodies == std::vector<std::string>{a, b});
  CHECK(framer.pending() == 0);

  // A Content-Length that is not a number: reported, and the next message still read.
  auto got = frames("Content-Length: abc\r\n\r\n{}" + lsp::frame(a));
  REQUIRE(got.size() == 2);
  CHECK(got[0].kind == lsp::Frame::Broken);
  CHECK(got[0].error == "bad Content-Length header `abc`: it must be a number of bytes");
  CHECK(got[1].kind == lsp::Frame::Body);
  CHECK(got[1].body == a);

  got = frames("Content-Length: -5\r\n\r\n" + lsp::frame(a));
  REQUIRE(got.size() == 2);
  CHECK(got[0].kind == lsp::Frame::Broken);
  CHECK(got[1].body == a);

  got = frames("Content-Type: text/plain\r\n\r\nxyz" + lsp::frame(a));
  REQUIRE(got.size() == 2);
  CHECK(got[0].error == "a message header without Content-Length");
  CHECK(got[1].body == a);

  got = frames("Content-Length: 99999999999\r\n\r\n" + lsp::frame(a));
  REQUIRE(got.size() == 2);
  CHECK(got[0].error == "Content-Length 99999999999 is over the limit of 104857600 bytes");
  CHECK(got[1].body == a);

  got = frames(std::string(10000, 'x') + lsp::frame(a));
  REQUIRE(got.size() == 2);
  CHECK(got[0].error == "a message header longer than 8192 bytes");
  CHECK(got[1].body == a);

  // A body not yet complete waits for its bytes.
  got = frames("Content-Length: 10\r\n\r\n{\"id\"");
  CHECK(got.empty());
}

TEST_CASE("lsp document: UTF-16 positions, incremental edits, clamping", "[lsp][document][utf16]") {
  // α is 2 bytes, ² 2 bytes, 🔧 4 bytes and two UTF-16 units.
  lsp::Document doc("u", "α = 2 m²\nx = 1 # 🔧 ok\r\nlast", 1);
  CHECK(doc.lineCount() == 3);
  CHECK(doc.lineText(1) == "x = 1 # 🔧 ok");
  uint32_t off = 0;
  REQUIRE(doc.offset({0, 4}, &off));  // after "α = "
  CHECK(off == 5);
  REQUIRE(doc.offset({1, 10}, &off));  // after the wrench: 8 + 2 units
  CHECK(doc.text().substr(off, 3) == " ok");
  CHECK(doc.position(off).line == 1);
  CHECK(doc.position(off).character == 10);
  CHECK(doc.fromCodePoints(2, 10).character == 10);  // code point 10 (" ok") is UTF-16 unit 10
  CHECK(doc.fromCodePoints(2, 9).character == 8);    // the wrench itself starts at unit 8
  // A character past the line's end is the line's end (the CR is not part of the line).
  REQUIRE(doc.offset({1, 500}, &off));
  CHECK(doc.text()[off] == '\r');
  CHECK_FALSE(doc.offset({3, 0}, &off));
  CHECK_FALSE(doc.offset({-1, 0}, &off));

  REQUIRE(doc.edit({{1, 10}, {1, 13}}, " fine"));
  CHECK(doc.lineText(1) == "x = 1 # 🔧 fine");
  REQUIRE(doc.edit({{0, 0}, {0, 1}}, "beta"));  // replace the Greek letter
  CHECK(doc.lineText(0) == "beta = 2 m²");
  REQUIRE(doc.edit({{2, 4}, {99, 0}}, "\nnew"));  // clamped to the end
  CHECK(doc.text() == "beta = 2 m²\nx = 1 # 🔧 fine\r\nlast\nnew");
  CHECK_FALSE(doc.edit({{1, 5}, {0, 0}}, "x"));  // end before start: nothing changes
  CHECK(doc.end().line == 3);
  CHECK(doc.end().character == 3);
  CHECK(lsp::pathFromUri("file:///a%20b/c%C3%A9.calc") == "/a b/cé.calc");
}

TEST_CASE("lsp document: bytes that are not UTF-8 are one unit each", "[lsp][document][utf16]") {
  // As an editor decodes them (one U+FFFD a bad byte, the WHATWG decoder):
  // an overlong form, an encoded surrogate and a cut-short sequence are not
  // read as one character, so positions after them stay where the editor has them.
  CHECK(lsp::utf16Length("\xE0\x80\x80") == 3);        // overlong U+0000
  CHECK(lsp::utf16Length("\xED\xA0\x80") == 3);        // U+D800, a surrogate
  CHECK(lsp::utf16Length("\xF0\x9F\x94") == 3);        // the wrench cut short
  CHECK(lsp::utf16Length("a\xF0\x9F\x94\xA7" "b") == 4);  // the wrench: two units
  CHECK(lsp::bytesForUtf16("\xC0\xAFx", 2) == 2);       // overlong '/': two units, two bytes
  CHECK(lsp::bytesForUtf16("\xCE\xB1x", 1) == 2);       // α: one unit, two bytes
}

TEST_CASE("lsp initialize: capabilities, and requests before it", "[lsp][initialize]") {
  Client fresh(false);
  const json early = fresh.call("textDocument/hover", textPos(0, 0));
  CHECK(early["error"]["code"] == -32002);
  const json caps = fresh.result("initialize", {{"capabilities", json::object()}})["capabilities"];
  CHECK(caps["textDocumentSync"]["change"] == 2);
  CHECK(caps["textDocumentSync"]["openClose"] == true);
  CHECK(caps["positionEncoding"] == "utf-16");
  for (const char* p : {"hoverProvider", "definitionProvider", "referencesProvider", "inlayHintProvider",
                        "documentFormattingProvider"})
    CHECK(caps[p] == true);
  CHECK(caps["renameProvider"]["prepareProvider"] == true);
  CHECK(caps.contains("completionProvider"));
  CHECK(fresh.call("initialize", {{"capabilities", json::object()}})["error"]["code"] == -32600);
}

TEST_CASE("lsp diagnostics: the command line's messages, places and severities", "[lsp][diagnostics]") {
  // A lost 2*pi (a warning); a unit read two ways and an unknown name; a
  // division by zero found while evaluating. (`check` prints no warnings: compared with `report`.)
  const std::vector<std::string> texts = {
      "n = 1450 rpm\nlead = 5 mm\nv = n * lead\n",
      "d = 40 mm\nA = 3 mm^2\nT = F * d / 2\n",
      "d = 40 mm\nT = 1 / (d - d)\n",
  };
  Client c;
  json diags = json::array();
  std::vector<std::string> cli;
  for (size_t k = 0; k < texts.size(); ++k) {
    const std::string uri = "file:///sheets/s" + std::to_string(k) + ".calc";
    c.open(texts[k], uri);
    for (const json& d : c.diagnostics(uri)) diags.push_back(d);
    for (const std::string& line : cliDiagnostics(texts[k])) cli.push_back(line);
  }
  REQUIRE(cli.size() == 4);
  REQUIRE(diags.size() == cli.size());
  for (size_t i = 0; i < cli.size(); ++i) {
    const json& d = diags[i];
    // ASCII lines here: UTF-16 units are code points.
    const json& start = d["range"]["start"];
    const int line = start["line"].get<int>() + 1, col = start["character"].get<int>() + 1;
    const int width = d["range"]["end"]["character"].get<int>() - start["character"].get<int>();
    const std::string sev = d["severity"] == 1 ? "error" : "warning";
    CHECK(std::to_string(line) + ":" + std::to_string(col) + "+" + std::to_string(width) + ": " + sev + ": " +
              d["message"].get<std::string>() ==
          cli[i]);
    CHECK(d["source"] == "calctrail");
  }
  CHECK(diags[0]["severity"] == 2);  // the rpm times a plain length warning
  CHECK(diags[1]["severity"] == 1);
  // The range underlines what the caret underlines: `mm^2`.
  CHECK(diags[1]["range"] == range(1, 6, 1, 10));
  CHECK(diags[3]["message"].get<std::string>().find("division by zero") != std::string::npos);
}

TEST_CASE("lsp diagnostics: UTF-16 columns after non-ASCII characters", "[lsp][diagnostics][utf16]") {
  // β and α are one UTF-16 unit but two bytes; 𝜇 (U+1D707) is two units and one code point.
  const std::string text = "α = 2 mm   # ² per side\nβ = α * qq\ny = 𝜇 + zz\n";
  Client c;
  c.open(text);
  const json diags = c.diagnostics();
  const std::vector<std::string> cli = cliDiagnostics(text);
  REQUIRE(cli.size() == 2);
  CHECK(cli[0] == "2:9+2: error: unknown name `qq`; define it with `qq = ...`");
  REQUIRE(diags.size() == 2);
  CHECK(diags[0]["range"] == range(1, 8, 1, 10));  // bytes would say 10..12
  CHECK(diags[0]["message"] == "unknown name `qq`; define it with `qq = ...`");
  CHECK(cli[1] == "3:5+1: error: unexpected character 𝜇 (U+1D707)");
  CHECK(diags[1]["range"] == range(2, 4, 2, 6));  // one code point, two UTF-16 units
}

TEST_CASE("lsp didChange: incremental edits update the diagnostics", "[lsp][didChange]") {
  Client c;
  c.open(kSheet);
  CHECK(c.diagnostics().empty());
  // d = 40 mm -> d = 40 mx: an unknown unit.
  c.change(2, json::array({change(1, 8, 1, 9, "x")}));
  json diags = c.diagnostics();
  REQUIRE(diags.size() >= 1);  // and every formula that reads d
  CHECK(diags[0]["range"]["start"] == at(1, 7));
  CHECK(diags[0]["message"].get<std::string>().find("unknown unit `mx`") != std::string::npos);
  CHECK(c.notifications.back()["params"]["version"] == 2);
  // Two changes in one message apply in order: fix the unit, then break line 5.
  c.change(3, json::array({change(1, 7, 1, 9, "mm"), change(4, 14, 4, 15, "Q")}));
  diags = c.diagnostics();
  REQUIRE(diags.size() == 1);
  CHECK(diags[0]["message"] == "unknown name `Q`; define it with `Q = ...`");
  CHECK(diags[0]["range"] == range(4, 14, 4, 15));
  // A change without a range replaces the whole text.
  c.change(4, json::array({{{"text", kSheet}}}));
  CHECK(c.diagnostics().empty());
  // A range whose end is before its start changes nothing, and is logged.
  const size_t before = c.notifications.size();
  c.change(5, json::array({change(3, 5, 1, 0, "zzz")}));
  REQUIRE(c.notifications.size() == before + 1);
  CHECK(c.notifications.back()["method"] == "window/logMessage");
  CHECK(c.result("textDocument/hover", textPos(1, 0))["contents"]["value"].get<std::string>().find(
            "**d** = 40.00 mm") == 0);
}

TEST_CASE("lsp didChange: a burst of changes costs one recalculation", "[lsp][didChange][supersede]") {
  Client c;
  c.open(kSheet);
  const int published = c.published(), recalcs = c.server.recalculations();
  for (int v = 2; v <= 6; ++v) {
    c.queue("textDocument/didChange",
            {{"textDocument", {{"uri", kUri}, {"version", v}}},
             {"contentChanges", json::array({change(0, 4, 0, 6, std::to_string(v * 10))})}});
  }
  CHECK(c.server.hasPendingWork());
  c.server.flush();
  c.collect();
  CHECK(c.server.recalculations() == recalcs + 1);
  CHECK(c.published() == published + 1);
  CHECK(c.notifications.back()["params"]["version"] == 6);
  CHECK_FALSE(c.server.hasPendingWork());
  CHECK(c.result("textDocument/hover", textPos(0, 0))["contents"]["value"].get<std::string>().find(
            "**F** = 60.00 kN") == 0);
}

TEST_CASE("lsp hover: value, formula, substituted formula, description, functions", "[lsp][hover]") {
  Client c;
  c.open(kSheet);
  const json h = c.result("textDocument/hover", textPos(4, 18));  // the A in F / A
  CHECK(h["contents"]["kind"] == "markdown");
  CHECK(h["contents"]["value"] ==
        "**A** [mm^2] = 1257 mm^2\n\n```\nA = pi * d^2 / 4\n  = pi * (40.00 mm)^2 / 4\n```\n\ngross area\n");
  CHECK(h["range"] == range(4, 18, 4, 19));
  CHECK(c.result("textDocument/hover", textPos(4, 0))["contents"]["value"] ==
        "**sigma** [MPa] = 15.92 MPa\n\n```\nsigma = F / A\n  = 20.00 kN / 1257 mm^2\n```\n\naxial stress\n");
  CHECK(c.result("textDocument/hover", textPos(0, 1))["contents"]["value"] ==
        "**F** = 20.00 kN\n\ngiven value `20 kN`\n\naxial load\n");
  // A library function: signature, formula or method, limits and source, from its declaration.
  const std::string fn = c.result("textDocument/hover", textPos(2, 6))["contents"]["value"];
  const FunctionDecl* decl = findFunction("trap_pitch");
  REQUIRE(decl);
  CHECK(fn.find("**trap_pitch(d [mm]) -> mm**") == 0);
  CHECK(fn.find(decl->formula) != std::string::npos);
  CHECK(fn.find("Limits: " + std::string(decl->limits)) != std::string::npos);
  CHECK(fn.find("Source: " + std::string(decl->source)) != std::string::npos);
  // A check: its condition, the two sides and the verdict.
  CHECK(c.result("textDocument/hover", textPos(5, 8))["contents"]["value"] ==
        "**check stress**: pass\n\n```\ncheck stress: sigma <= 50 MPa\n  15.92 MPa <= 50.00 "
        "MPa\n```\n\nallowable\n");
  // No name there, a line past the end, a position before the start, a document not open.
  CHECK(c.result("textDocument/hover", textPos(0, 30)).is_null());
  CHECK(c.result("textDocument/hover", textPos(40, 0)).is_null());
  CHECK(c.result("textDocument/hover", textPos(-1, 0)).is_null());
  CHECK(c.result("textDocument/hover", textPos(0, 0, "file:///nowhere.calc")).is_null());
}

TEST_CASE("lsp hover and definition after a Greek letter and an astral character", "[lsp][hover][utf16]") {
  Client c;
  c.open("α = 2 mm  # 🔧 tool\nβ [mm] = 3 * α  # 🔧 α\n");
  // On line 1, α in the formula starts at UTF-16 unit 13 (byte 14: β is two bytes).
  const json h = c.result("textDocument/hover", textPos(1, 13));
  CHECK(h["contents"]["value"].get<std::string>().find("**α** = 2.000 mm") == 0);
  CHECK(h["range"] == range(1, 13, 1, 14));
  CHECK(c.result("textDocument/definition", textPos(1, 13))["range"] == range(0, 0, 0, 1));
  // A position in the description, after the wrench (two units), is no name.
  CHECK(c.result("textDocument/hover", textPos(1, 20)).is_null());
}

TEST_CASE("lsp definition and references of a quantity", "[lsp][definition][references]") {
  Client c;
  c.open(kSheet);
  const json def = c.result("textDocument/definition", textPos(3, 16));  // d in pi * d^2
  CHECK(def["uri"] == kUri);
  CHECK(def["range"] == range(1, 0, 1, 1));
  CHECK(c.result("textDocument/definition", textPos(2, 6)).is_null());  // a function call
  json params = textPos(1, 0);
  params["context"] = {{"includeDeclaration", true}};
  const json refs = c.result("textDocument/references", params);
  REQUIRE(refs.size() == 3);
  CHECK(refs[0]["range"] == range(1, 0, 1, 1));
  CHECK(refs[1]["range"] == range(2, 15, 2, 16));
  CHECK(refs[2]["range"] == range(3, 16, 3, 17));
  params["context"]["includeDeclaration"] = false;
  CHECK(c.result("textDocument/references", params).size() == 2);
  params["position"] = at(99, 0);
  CHECK(c.result("textDocument/references", params) == json::array());
}

TEST_CASE("lsp rename: every use of a quantity, refused names", "[lsp][rename]") {
  Client c;
  c.open(kSheet);
  const json prep = c.result("textDocument/prepareRename", textPos(4, 14));
  CHECK(prep["placeholder"] == "F");
  json params = textPos(4, 14);
  params["newName"] = "F_axial";
  const json edit = c.result("textDocument/rename", params);
  const json edits = edit["changes"][kUri];
  REQUIRE(edits.size() == 2);
  // Applied back to front, the sheet reads the same with the new name.
  lsp::Document doc(kUri, kSheet, 1);
  for (auto it = edits.rbegin(); it != edits.rend(); ++it) {
    const json& r = (*it)["range"];
    REQUIRE(
        doc.edit({{r["start"]["line"], r["start"]["character"]}, {r["end"]["line"], r["end"]["character"]}},
                 (*it)["newText"].get<std::string>()));
  }
  CHECK(doc.lineText(0).substr(0, 11) == "F_axial = 2");
  CHECK(doc.lineText(4).substr(0, 25) == "sigma [MPa] = F_axial / A");
  auto renamed = calc(doc.text());
  CHECK_FALSE(renamed->hasErrors());
  CHECK(si(*renamed, "sigma") == Approx(20000 / (3.14159265358979 * 0.04 * 0.04 / 4)));

  for (const auto& [name, why] : std::vector<std::pair<std::string, std::string>>{
           {"d", "`d` is already defined on line 2"},
           {"2x", "`2x` is not a name: a letter, then letters, digits or `_`"},
           {"a b", "`a b` is not a name: a letter, then letters, digits or `_`"},
           {"pi", "`pi` is a reserved word of the worksheet format"},
           {"trap_pitch", "`trap_pitch` is the name of a library function"}}) {
    params["newName"] = name;
    const json r = c.call("textDocument/rename", params);
    CHECK(r["error"]["code"] == -32803);
    CHECK(r["error"]["message"] == why);
  }
  params["newName"] = "μ_F";  // a Greek letter starts a name
  CHECK(c.result("textDocument/rename", params)["changes"][kUri].size() == 2);
  params["position"] = at(0, 25);  // in the description
  CHECK(c.result("textDocument/rename", params).is_null());
  CHECK(c.result("textDocument/prepareRename", textPos(0, 25)).is_null());
}

TEST_CASE("lsp completion: names, functions with arguments, units", "[lsp][completion]") {
  Client c;
  c.open(kSheet + "x = 2 * \ny = 3 \nz = 4 [\n");
  auto labels = [](const json& list, int kind) {
    std::vector<std::string> out;
    for (const json& i : list["items"])
      if (i["kind"] == kind) out.push_back(i["label"]);
    return out;
  };
  const json names = c.result("textDocument/completion", textPos(7, 8));
  const auto vars = labels(names, 6);
  CHECK(vars == std::vector<std::string>{"F", "d", "p", "A", "sigma", "y"});
  const auto fns = labels(names, 3);
  CHECK(std::find(fns.begin(), fns.end(), "torque_raise") != fns.end());
  CHECK(std::find(fns.begin(), fns.end(), "sqrt") != fns.end());
  CHECK(labels(names, 11).empty());
  for (const json& i : names["items"]) {
    if (i["label"] == "torque_raise") CHECK(i["detail"] == lsp::signature(*findFunction("torque_raise")));
    if (i["label"] == "trap_pitch") CHECK(i["detail"] == "trap_pitch(d [mm]) -> mm");
    if (i["label"] == "F") CHECK(i["documentation"]["value"] == "axial load");
  }
  // x and z do not parse, so they are no names yet.
  // After a number and a blank, and inside [ ]: units.
  for (const json& pos : {textPos(8, 6), textPos(9, 7)}) {
    const json units = c.result("textDocument/completion", pos);
    const auto u = labels(units, 11);
    CHECK(std::find(u.begin(), u.end(), "kN") != u.end());
    CHECK(std::find(u.begin(), u.end(), "rpm") != u.end());
    CHECK(labels(units, 6).empty());
  }
  // In a description: nothing.
  CHECK(c.result("textDocument/completion", textPos(0, 40))["items"].empty());
  CHECK(lsp::completionContext("x = n2 ") == lsp::CompletionContext::Names);
  CHECK(lsp::completionContext("x = 1.5 k") == lsp::CompletionContext::Units);
  CHECK(c.result("textDocument/completion", textPos(50, 0))["items"].empty());
}

TEST_CASE("lsp inlay hints: values and check verdicts, updated as one types", "[lsp][inlayHint]") {
  Client c;
  c.open(kSheet);
  json params = {{"textDocument", {{"uri", kUri}}}, {"range", range(0, 0, 10, 0)}};
  json hints = c.result("textDocument/inlayHint", params);
  std::vector<std::string> labels;
  for (const json& h : hints)
    labels.push_back(std::to_string(h["position"]["line"].get<int>()) + " " + h["label"].get<std::string>());
  CHECK(labels == std::vector<std::string>{"2 = 7.000 mm", "3 = 1257 mm^2", "4 = 15.92 MPa",
                                           "5 pass (15.92 MPa <= 50.00 MPa)",
                                           "6 FAIL (7.000 mm >= 8.000 mm)"});
  CHECK(hints[0]["position"]["character"] == 51);  // the end of the line
  // A bigger load: the stress check now fails.
  c.change(2, json::array({change(0, 4, 0, 6, "200")}));
  hints = c.result("textDocument/inlayHint", params);
  REQUIRE(hints.size() == 5);
  CHECK(hints[3]["label"] == "FAIL (159.2 MPa <= 50.00 MPa)");
  // Only the lines asked for.
  params["range"] = range(5, 0, 5, 10);
  CHECK(c.result("textDocument/inlayHint", params).size() == 1);
  // A worksheet with errors shows no values.
  c.change(3, json::array({change(1, 4, 1, 6, "q")}));
  params["range"] = range(0, 0, 10, 0);
  CHECK(c.result("textDocument/inlayHint", params) == json::array());
}

TEST_CASE("lsp inlay hints: the client is asked to refresh them after a change", "[lsp][inlayHint]") {
  Client c(false);
  c.result("initialize", {{"capabilities", {{"workspace", {{"inlayHint", {{"refreshSupport", true}}}}}}}});
  c.open(kSheet);
  c.change(2, json::array({change(0, 4, 0, 6, "30")}));
  int refreshes = 0;
  for (const json& m : c.notifications) refreshes += m["method"] == "workspace/inlayHint/refresh";
  CHECK(refreshes == 2);  // after the open and after the change
  const json& last = c.notifications.back();
  CHECK(last["method"] == "workspace/inlayHint/refresh");
  REQUIRE(last.contains("id"));
  // The client's answer needs no reply of ours.
  const size_t n = c.responses.size();
  c.sendRaw(lsp::dump({{"jsonrpc", "2.0"}, {"id", last["id"]}, {"result", nullptr}}));
  CHECK(c.responses.size() == n);
  // Without the capability, no such request.
  Client plain;
  plain.open(kSheet);
  for (const json& m : plain.notifications) CHECK(m["method"] != "workspace/inlayHint/refresh");
}

TEST_CASE("lsp formatting: calctrail fmt as one edit", "[lsp][formatting]") {
  Client c;
  const std::string messy = "F=20 kN # load\nd   =  40 mm\nA [mm^2] = pi*d^2/4\n";
  c.open(messy);
  const json params = {{"textDocument", {{"uri", kUri}}},
                       {"options", {{"tabSize", 4}, {"insertSpaces", true}}}};
  const json edits = c.result("textDocument/formatting", params);
  REQUIRE(edits.size() == 1);
  Diagnostics diags;
  const std::string expected = formatWorksheet("lift table.calc", messy, &diags);
  REQUIRE_FALSE(diags.hasErrors());
  CHECK(edits[0]["newText"] == expected);
  CHECK(edits[0]["range"] == range(0, 0, 3, 0));
  // Already canonical: no edit. With an error: no edit either.
  c.change(2, json::array({{{"text", expected}}}));
  CHECK(c.result("textDocument/formatting", params) == json::array());
  c.change(3, json::array({{{"text", "F = 20 kN\nd = (40 mm\n"}}}));
  CHECK(c.result("textDocument/formatting", params) == json::array());
  CHECK(c.result("textDocument/formatting", {{"textDocument", {{"uri", "file:///x.calc"}}}}).is_null());
}

TEST_CASE("lsp errors: malformed messages get error responses, never a crash", "[lsp][errors]") {
  Client c;
  c.open(kSheet);
  auto last = [&] { return c.responses.back(); };
  c.sendRaw("{\"jsonrpc\": \"2.0\", \"id\": 5, \"method\": ");
  CHECK(last()["error"]["code"] == -32700);
  CHECK(last()["id"].is_null());
  c.sendRaw("[1, 2]");
  CHECK(last()["error"]["code"] == -32600);
  c.sendRaw("{\"jsonrpc\": \"2.0\", \"id\": [1], \"method\": \"shutdown\"}");
  CHECK(last()["error"]["code"] == -32600);
  c.sendRaw("{\"jsonrpc\": \"2.0\", \"id\": 700}");
  CHECK(last()["error"]["code"] == -32600);
  CHECK(c.call("workspace/symbol", json::object())["error"]["code"] == -32601);
  CHECK(c.call("textDocument/codeLens", {{"textDocument", {{"uri", kUri}}}})["error"]["code"] == -32601);
  // Parameters of the wrong shape.
  CHECK(c.call("textDocument/hover", {{"textDocument", {{"uri", kUri}}}})["error"]["code"] == -32602);
  CHECK(c.call("textDocument/hover", {{"textDocument", 3}, {"position", at(0, 0)}})["error"]["code"] ==
        -32602);
  json bad_position = textPos(0, 0);
  bad_position["position"]["line"] = "x";
  CHECK(c.call("textDocument/hover", bad_position)["error"]["code"] == -32602);
  // A notification with bad parameters cannot be answered: it is logged.
  const size_t before = c.responses.size();
  c.notify("textDocument/didOpen", {{"textDocument", 1}});
  CHECK(c.responses.size() == before);
  CHECK(c.notifications.back()["method"] == "window/logMessage");
  c.notify("$/cancelRequest", {{"id", 1}});  // unknown notifications are ignored
  c.notify("textDocument/didChange",
           {{"textDocument", {{"uri", "file:///not-open.calc"}}}, {"contentChanges", json::array()}});
  CHECK(c.notifications.back()["method"] == "window/logMessage");
  // A response to a request of ours needs no answer.
  const size_t n = c.responses.size();
  c.sendRaw("{\"jsonrpc\": \"2.0\", \"id\": 1, \"result\": null}");
  CHECK(c.responses.size() == n);
  // The server still works.
  CHECK(c.result("textDocument/hover", textPos(0, 0))["contents"]["value"].get<std::string>().find("**F**") ==
        0);
}

TEST_CASE("lsp didClose, shutdown and exit", "[lsp][shutdown]") {
  Client c;
  c.open(kSheet + "bad = qq\n");
  CHECK(c.diagnostics().size() == 1);
  c.notify("textDocument/didClose", {{"textDocument", {{"uri", kUri}}}});
  CHECK(c.diagnostics().empty());  // cleared for the closed file
  CHECK(c.result("textDocument/hover", textPos(0, 0)).is_null());
  CHECK(c.result("shutdown", nullptr).is_null());
  CHECK(c.call("textDocument/hover", textPos(0, 0))["error"]["code"] == -32600);
  CHECK_FALSE(c.server.exited());
  c.notify("exit", nullptr);
  CHECK(c.server.exited());
  CHECK(c.server.exitCode() == 0);
  Client abrupt;
  abrupt.notify("exit", nullptr);
  CHECK(abrupt.server.exited());
  CHECK(abrupt.server.exitCode() == 1);  // exit without shutdown
}

TEST_CASE("lsp over pipes: `calctrail lsp` as a subprocess", "[lsp][subprocess]") {
  const std::string dir = tempDir();
  auto msg = [](const json& m) { return lsp::frame(lsp::dump(m)); };
  const std::string uri = "file://" + dir + "/pipe.calc";
  std::string in =
      msg({{"jsonrpc", "2.0"}, {"id", 1}, {"method", "initialize"}, {"params", {{"capabilities", {}}}}});
  in += msg({{"jsonrpc", "2.0"}, {"method", "initialized"}, {"params", json::object()}});
  in += msg(
      {{"jsonrpc", "2.0"},
       {"method", "textDocument/didOpen"},
       {"params", {{"textDocument", {{"uri", uri}, {"version", 1}, {"text", "α = 2 mm\nβ = α * qq\n"}}}}}});
  // Three edits behind each other, read together: only the newest text is calculated.
  for (int v = 2; v <= 4; ++v) {
    in += msg({{"jsonrpc", "2.0"},
               {"method", "textDocument/didChange"},
               {"params",
                {{"textDocument", {{"uri", uri}, {"version", v}}},
                 {"contentChanges", json::array({change(1, 8, 1, 10, v == 4 ? "zz" : "q")})}}}});
  }
  in += "Content-Length: twelve\r\n\r\n{}";
  in += lsp::frame("{not json");
  in +=
      msg({{"jsonrpc", "2.0"}, {"id", 2}, {"method", "textDocument/hover"}, {"params", textPos(1, 4, uri)}});
  in += msg({{"jsonrpc", "2.0"}, {"id", 3}, {"method", "shutdown"}});
  REQUIRE(in.size() < 4096);  // one atomic write into the pipe
  writeFile(dir + "/in", in);
  // `exit` comes later, once the server has found no more input and published.
  writeFile(dir + "/exit", msg({{"jsonrpc", "2.0"}, {"method", "exit"}}));
  const Run r = runCliThrough(dir, "(cat in; sleep 0.5; cat exit) |", "lsp");
  CHECK(r.status == 0);
  CHECK(r.err.empty());
  std::vector<json> out;
  for (const lsp::Frame& f : frames(r.out)) {
    REQUIRE(f.kind == lsp::Frame::Body);
    out.push_back(json::parse(f.body));
  }
  std::vector<json> published, errors;
  json hover;
  for (const json& m : out) {
    if (m.value("method", "") == "textDocument/publishDiagnostics") published.push_back(m["params"]);
    if (m.contains("error")) errors.push_back(m["error"]);
    if (m.value("id", json()) == 2) hover = m["result"];
  }
  REQUIRE(out.size() >= 4);
  CHECK(out[0]["result"]["serverInfo"]["name"] == "calctrail");
  REQUIRE(errors.size() == 2);
  CHECK(errors[0]["code"] == -32700);
  CHECK(errors[0]["message"] == "bad Content-Length header `twelve`: it must be a number of bytes");
  CHECK(errors[1]["code"] == -32700);
  // The hover needed the newest text; the burst was calculated once, for version 4.
  REQUIRE(published.size() == 1);
  CHECK(published[0]["version"] == 4);
  REQUIRE(published[0]["diagnostics"].size() == 1);
  CHECK(published[0]["diagnostics"][0]["message"] == "unknown name `zz`; define it with `zz = ...`");
  CHECK(published[0]["diagnostics"][0]["range"] == range(1, 8, 1, 10));
  CHECK(hover["contents"]["value"].get<std::string>().find("**α** (no value: the worksheet has errors)") ==
        0);
  std::remove((dir + "/in").c_str());
  std::remove((dir + "/exit").c_str());
}

// ---- Sheets with `use` lines (docs/editors/lsp.md, "Templates") ----

namespace {

// A screw template and a sheet using it, in a folder of their own on disk.
// The sheet's first line is a long comment, so that every byte range of the
// template (up to its length) falls inside the comment in the sheet's text.
const std::string kScrewTemplate =
    "param F [kN] = 10 kN                # axial load\n"
    "param f = 0.1                       # thread friction\n"
    "d_m [mm] = 36 mm                    # mean diameter\n"
    "T_raise [N*m] = F * d_m / 2 * f     # simplified torque\n"
    "check torque: T_raise < 100 [N*m]\n";
const std::string kUsingSheet = "# " + std::string(260, '-') + "\n" +
                                "use \"screw.calc\" as left with F = load / 2, f = 0.15\n"
                                "load = 30 kN\n"
                                "T_total [N*m] = left.T_raise * 2\n";

struct UseFolder {
  std::string dir = tempDir();
  std::string sheet_uri = "file://" + dir + "/sheet.calc";
  std::string screw_uri = "file://" + dir + "/screw.calc";
  UseFolder(const std::string& screw = kScrewTemplate, const std::string& sheet = kUsingSheet) {
    writeFile(dir + "/screw.calc", screw);
    writeFile(dir + "/sheet.calc", sheet);
  }
};

void changeWhole(Client& c, const std::string& uri, int version, const std::string& text) {
  c.notify("textDocument/didChange", {{"textDocument", {{"uri", uri}, {"version", version}}},
                                      {"contentChanges", json::array({{{"text", text}}})}});
}

}  // namespace

TEST_CASE("lsp use: hover, definition and hints index the sheet's own text only", "[lsp][use]") {
  const UseFolder f;
  Client c;
  c.open(kUsingSheet, f.sheet_uri);
  CHECK(c.diagnostics(f.sheet_uri) == json::array());
  // Every place of the comment line: nothing there (the template's ranges once were looked up here).
  for (int col = 0; col <= 262; ++col) {
    INFO("column " << col);
    CHECK(c.result("textDocument/hover", textPos(0, col, f.sheet_uri)).is_null());
    CHECK(c.result("textDocument/definition", textPos(0, col, f.sheet_uri)).is_null());
  }
  // The sheet's own names.
  const json h = c.result("textDocument/hover", textPos(3, 2, f.sheet_uri));
  CHECK_THAT(h["contents"]["value"].get<std::string>(), Catch::StartsWith("**T_total** [N*m] = "));
  CHECK(h["range"] == range(3, 0, 3, 7));
  // `load` in a binding is a use of the sheet's `load`.
  const json def = c.result("textDocument/definition", textPos(1, 35, f.sheet_uri));
  CHECK(def["uri"] == f.sheet_uri);
  CHECK(def["range"] == range(2, 0, 2, 4));
  json params = textPos(2, 1, f.sheet_uri);
  params["context"] = {{"includeDeclaration", true}};
  const json refs = c.result("textDocument/references", params);
  REQUIRE(refs.size() == 2);
  CHECK(refs[0]["range"] == range(1, 34, 1, 38));
  CHECK(refs[1]["range"] == range(2, 0, 2, 4));
  // Hints on the sheet's lines only: the one formula of its own, at its line's end.
  const json hints = c.result("textDocument/inlayHint",
                              {{"textDocument", {{"uri", f.sheet_uri}}}, {"range", range(0, 0, 99, 0)}});
  REQUIRE(hints.size() == 1);
  CHECK(hints[0]["position"] == at(3, 32));
  // F = 15 kN, f = 0.15, d_m = 36 mm: T_raise = 15000 * 0.036 / 2 * 0.15 = 40.5 N*m; twice: 81 N*m.
  CHECK(hints[0]["label"] == "= 81.00 N*m");
  // An instance's quantity is renamed in its template, not from the sheet.
  CHECK(c.result("textDocument/prepareRename", textPos(3, 20, f.sheet_uri)).is_null());
}

TEST_CASE("lsp use: definition across `use` into the template file", "[lsp][use][definition]") {
  const UseFolder f;
  Client c;
  c.open(kUsingSheet, f.sheet_uri);
  // `left.T_raise`: T_raise's line in the template.
  const json dotted = c.result("textDocument/definition", textPos(3, 22, f.sheet_uri));
  CHECK(dotted["uri"] == f.screw_uri);
  CHECK(dotted["range"] == range(3, 0, 3, 7));
  // The path of the `use` line: the start of the template.
  const json file = c.result("textDocument/definition", textPos(1, 8, f.sheet_uri));
  CHECK(file["uri"] == f.screw_uri);
  CHECK(file["range"] == range(0, 0, 0, 0));
  // A parameter's name in the binding: its `param` line.
  const json param = c.result("textDocument/definition", textPos(1, 45, f.sheet_uri));
  CHECK(param["uri"] == f.screw_uri);
  CHECK(param["range"] == range(1, 6, 1, 7));
  // Hover on the dotted name: its value and the template's formula, as for a plain name.
  const std::string hover = c.result("textDocument/hover", textPos(3, 22, f.sheet_uri))["contents"]["value"];
  CHECK_THAT(hover, Catch::StartsWith("**left.T_raise** [N*m] = 40.50 N*m"));
  CHECK_THAT(hover, Catch::Contains("left.T_raise = left.F * left.d_m / 2 * left.f"));
  CHECK_THAT(hover, Catch::Contains("simplified torque"));
}

TEST_CASE("lsp use: definition columns in the template count UTF-16 units", "[lsp][use][utf16]") {
  // An astral character (two UTF-16 units, four bytes) before the name on its line.
  const std::string screw = "param F [kN] = 10 kN  # \xF0\x9F\x94\xA9 bolt\nτ_0 = 2 * F\n";
  const std::string sheet = "use screw.calc as s\ny = s.τ_0\n";
  const UseFolder f(screw, sheet);
  Client c;
  c.open(sheet, f.sheet_uri);
  const json d = c.result("textDocument/definition", textPos(1, 7, f.sheet_uri));
  CHECK(d["uri"] == f.screw_uri);
  CHECK(d["range"] == range(1, 0, 1, 3));
}

TEST_CASE("lsp use: an error inside a template, at the use line, as the command line says it",
          "[lsp][use][diagnostics]") {
  const std::string broken = kScrewTemplate + "bad = 3 *\n";
  const UseFolder f(broken);
  // The command line, run in the sheet's folder: the error is in the template.
  const Run cli = runCliIn(f.dir, "report sheet.calc");
  CHECK(cli.status == 2);
  std::smatch m;
  const std::regex headline(R"(screw\.calc:(\d+):(\d+): error: ([^\n]*))");
  REQUIRE(std::regex_search(cli.err, m, headline));
  Client c;
  c.open(kUsingSheet, f.sheet_uri);
  const json diags = c.diagnostics(f.sheet_uri);
  REQUIRE(diags.size() >= 1);
  const json& d = diags[0];
  CHECK(d["message"] == "in template screw.calc:" + m[1].str() + ":" + m[2].str() + ": " + m[3].str());
  CHECK(d["severity"] == 1);
  const std::string use_line = "use \"screw.calc\" as left with F = load / 2, f = 0.15";  // ASCII
  CHECK(d["range"] == range(1, 0, 1, static_cast<int>(use_line.size())));
  REQUIRE(d.contains("relatedInformation"));
  const json& where = d["relatedInformation"][0]["location"];
  CHECK(where["uri"] == f.screw_uri);
  CHECK(where["range"]["start"] == at(std::stoi(m[1].str()) - 1, std::stoi(m[2].str()) - 1));
  // The template opened: its own diagnostics are published on its own URI.
  c.open(broken, f.screw_uri);
  const json own = c.diagnostics(f.screw_uri);
  REQUIRE(own.size() == 1);
  CHECK(own[0]["range"]["start"] == at(5, 8));
}

TEST_CASE("lsp use: an unsaved template edit reaches the sheets using it, nested too",
          "[lsp][use][buffers]") {
  const UseFolder f;
  // A middle template between the sheet and the screw: the sheet uses the screw through it.
  writeFile(f.dir + "/pair.calc", "use screw.calc as one\nT_pair [N*m] = 2 * one.T_raise\n");
  const std::string outer = "use pair.calc as drive\nT [N*m] = drive.T_pair\n";
  const std::string outer_uri = "file://" + f.dir + "/outer.calc";
  Client c;
  c.open(kUsingSheet, f.sheet_uri);
  c.open(outer, outer_uri);
  CHECK(c.diagnostics(f.sheet_uri) == json::array());
  CHECK(c.diagnostics(outer_uri) == json::array());
  c.open(kScrewTemplate, f.screw_uri);
  const int before = c.published();
  // Break the template in the editor, unsaved: both sheets are recalculated and republished.
  changeWhole(c, f.screw_uri, 2, kScrewTemplate + "bad = 3 *\n");
  CHECK(c.published() == before + 3);
  const json direct = c.diagnostics(f.sheet_uri);
  REQUIRE(direct.size() >= 1);
  CHECK_THAT(direct[0]["message"].get<std::string>(), Catch::StartsWith("in template screw.calc:6:9: "));
  const json nested = c.diagnostics(outer_uri);
  REQUIRE(nested.size() >= 1);
  CHECK(nested[0]["range"]["start"] == at(0, 0));
  CHECK_THAT(nested[0]["message"].get<std::string>(),
             Catch::Contains("in the instance `drive` used at outer.calc:1:18"));
  // A new value in the buffer, still unsaved: the sheet's value follows it (the disk has d_m = 36 mm).
  std::string wider = kScrewTemplate;
  wider.replace(wider.find("36 mm"), 5, "72 mm");
  changeWhole(c, f.screw_uri, 3, wider);
  CHECK(c.diagnostics(f.sheet_uri) == json::array());
  const json hints = c.result("textDocument/inlayHint",
                              {{"textDocument", {{"uri", f.sheet_uri}}}, {"range", range(3, 0, 3, 99)}});
  REQUIRE(hints.size() == 1);
  CHECK(hints[0]["label"] == "= 162.0 N*m");  // twice the 81 N*m of 36 mm
  // Closing the template: the sheets read the disk again.
  c.notify("textDocument/didClose", {{"textDocument", {{"uri", f.screw_uri}}}});
  const json again = c.result("textDocument/inlayHint",
                              {{"textDocument", {{"uri", f.sheet_uri}}}, {"range", range(3, 0, 3, 99)}});
  REQUIRE(again.size() == 1);
  CHECK(again[0]["label"] == "= 81.00 N*m");
  // A sheet that does not use the edited file is not recalculated.
  const int recalcs = c.server.recalculations();
  c.open("x = 1 m\n", "file://" + f.dir + "/other.calc");
  changeWhole(c, "file://" + f.dir + "/other.calc", 2, "x = 2 m\n");
  CHECK(c.server.recalculations() == recalcs + 2);
}

TEST_CASE("lsp use: a template that cannot be read, and requests on its use line", "[lsp][use][errors]") {
  const UseFolder f;
  const std::string sheet = "use missing.calc as m with F = 2 kN\ny = m.T_raise\n";
  Client c;
  c.open(sheet, f.sheet_uri);
  const json diags = c.diagnostics(f.sheet_uri);
  REQUIRE(diags.size() >= 1);
  CHECK_THAT(diags[0]["message"].get<std::string>(),
             Catch::StartsWith("cannot read the template `missing.calc`"));
  CHECK(diags[0]["range"] == range(0, 4, 0, 16));
  // No template, no place to go; the binding's parameter and the dotted name neither.
  for (int col = 0; col < 36; ++col) {
    INFO("column " << col);
    CHECK(c.result("textDocument/definition", textPos(0, col, f.sheet_uri)).is_null());
  }
  CHECK(c.result("textDocument/definition", textPos(1, 6, f.sheet_uri)).is_null());
  CHECK(c.result("textDocument/hover", textPos(1, 6, f.sheet_uri))["contents"]["value"] ==
        "`m.T_raise` is not defined in this worksheet\n");
  // Opening the missing file in the editor (not saved) makes the sheet calculate.
  c.open("param F [kN] = 1 kN\nT_raise [N*m] = F * 10 mm\n", "file://" + f.dir + "/missing.calc");
  CHECK(c.diagnostics(f.sheet_uri) == json::array());
  const json d = c.result("textDocument/definition", textPos(1, 6, f.sheet_uri));
  CHECK(d["uri"] == "file://" + f.dir + "/missing.calc");
  CHECK(d["range"] == range(1, 0, 1, 7));
}
