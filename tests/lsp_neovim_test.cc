// A real editor as the client: headless Neovim's built-in LSP client starts
// `calctrail lsp`, opens a worksheet with an error, waits for the published
// diagnostics, then asks for a hover and a definition; and jumps from a sheet
// to the definition of an instance's quantity in its template. The Lua
// scripts are written at run time; their results come back in a file, one per line.
#include <catch2/catch.hpp>

#include <sys/wait.h>
#include <cstdlib>
#include <sstream>

#include "tests/test_support.h"

using namespace calctrail::test;

namespace {

// Lua: Neovim 0.8 and later have vim.lsp.start; Debian 12's 0.7 starts and attaches by hand.
const char* kScript = R"lua(
local out = {}
local function put(s) table.insert(out, (s:gsub('\n', '\\n'))) end
local function finish() vim.fn.writefile(out, OUT) vim.cmd('qa!') end
vim.cmd('edit ' .. vim.fn.fnameescape(SHEET))
local config = { name = 'calctrail', cmd = { CALCTRAIL, 'lsp' }, root_dir = vim.fn.fnamemodify(SHEET, ':h') }
local id
if vim.lsp.start then
  id = vim.lsp.start(config)
else
  id = vim.lsp.start_client(config)
  vim.lsp.buf_attach_client(0, id)
end
put('client ' .. tostring(id ~= nil))
local got = vim.wait(20000, function() return #vim.diagnostic.get(0) > 0 end, 20)
put('diagnostics ' .. tostring(got))
for _, d in ipairs(vim.diagnostic.get(0)) do
  put(string.format('diag %d:%d-%d:%d %d %s', d.lnum, d.col, d.end_lnum, d.end_col, d.severity, d.message))
end
-- Fix the error as one would type it: the diagnostics clear and values appear.
vim.api.nvim_buf_set_lines(0, 4, 5, false, { 'τ_s [MPa] = 0.6 * 355 MPa   # shear limit' })
got = vim.wait(20000, function() return #vim.diagnostic.get(0) == 0 end, 20)
put('cleared ' .. tostring(got))
local uri = vim.uri_from_bufnr(0)
local function ask(method, line, character)
  local res = vim.lsp.buf_request_sync(0, method,
    { textDocument = { uri = uri }, position = { line = line, character = character } }, 10000)
  for _, r in pairs(res or {}) do
    if r.err then put(method .. ' error ' .. vim.inspect(r.err)) end
    return r.result
  end
end
local h = ask('textDocument/hover', 3, 18)
put('hover ' .. (h and h.contents and h.contents.value or 'none'))
local def = ask('textDocument/definition', 3, 18)
if def and def[1] then def = def[1] end
if def and def.range then
  put(string.format('definition %s %d:%d-%d:%d', vim.uri_to_fname(def.uri), def.range.start.line,
    def.range.start.character, def.range['end'].line, def.range['end'].character))
else
  put('definition none')
end
vim.lsp.stop_client(id)
finish()
)lua";

// Go to definition as a user does (vim.lsp.buf.definition on the cursor), on
// `left.T_raise` in a sheet that uses a template: Neovim opens the template
// and puts the cursor on T_raise's line.
const char* kJumpScript = R"lua(
local out = {}
local function put(s) table.insert(out, (s:gsub('\n', '\\n'))) end
vim.cmd('edit ' .. vim.fn.fnameescape(SHEET))
local ready = false
local config = { name = 'calctrail', cmd = { CALCTRAIL, 'lsp' }, root_dir = vim.fn.fnamemodify(SHEET, ':h'),
                 on_init = function() ready = true end }
local id = vim.lsp.start_client(config)
vim.lsp.buf_attach_client(0, id)
put('ready ' .. tostring(vim.wait(20000, function() return ready end, 20)))
vim.api.nvim_win_set_cursor(0, { 3, 22 })  -- on `T_raise` of `left.T_raise`
vim.lsp.buf.definition()
local moved = vim.wait(20000, function() return vim.api.nvim_buf_get_name(0) ~= SHEET end, 20)
put('moved ' .. tostring(moved))
local cursor = vim.api.nvim_win_get_cursor(0)
put(string.format('landed %s %d:%d', vim.api.nvim_buf_get_name(0), cursor[1], cursor[2]))
vim.lsp.stop_client(id)
vim.fn.writefile(out, OUT)
vim.cmd('qa!')
)lua";

// Runs `script` in headless Neovim in `dir` with SHEET, OUT and CALCTRAIL set; its output lines.
std::vector<std::string> runNeovim(const std::string& dir, const std::string& sheet, const char* script) {
  const std::string file = dir + "/client.lua", out = dir + "/out";
  auto lua = [](const std::string& s) { return "'" + s + "'"; };  // temporary paths hold no quote
  writeFile(file, "SHEET = " + lua(sheet) + "\nOUT = " + lua(out) + "\nCALCTRAIL = " + lua(CALCTRAIL_BINARY) +
                      "\n" + script);
  const std::string cmd = "cd '" + dir + "' && timeout 120 nvim --headless --clean -n -c 'luafile " + file +
                          "' >'" + dir + "/nvim.log' 2>&1 </dev/null";
  const int raw = std::system(cmd.c_str());
  INFO("nvim said: " << readFile(dir + "/nvim.log"));
  CHECK(WIFEXITED(raw));
  CHECK(WEXITSTATUS(raw) == 0);
  std::vector<std::string> lines;
  std::istringstream in(readFile(out));
  for (std::string line; std::getline(in, line);) lines.push_back(line);
  for (const char* f : {"/client.lua", "/out", "/nvim.log"}) std::remove((dir + f).c_str());
  return lines;
}

}  // namespace

TEST_CASE("lsp in Neovim: definition across `use` opens the template on the quantity's line",
          "[lsp][neovim][use]") {
  const int has_nvim = std::system("command -v nvim >/dev/null 2>&1");
  INFO("Neovim is needed for this test: apt-get install neovim (.ci/install-deps)");
  REQUIRE(has_nvim == 0);
  const std::string dir = tempDir();
  writeFile(dir + "/screw.calc",
            "param F [kN] = 10 kN\n"
            "d_m [mm] = 36 mm\n"
            "f = 0.1\n"
            "T_raise [N*m] = F * d_m / 2 * f\n");
  const std::string sheet = dir + "/lift.calc";
  writeFile(sheet,
            "use screw.calc as left with F = 15 kN\n"
            "n = 2\n"
            "T_total [N*m] = left.T_raise * n\n");
  const std::vector<std::string> lines = runNeovim(dir, sheet, kJumpScript);
  REQUIRE(lines.size() == 3);
  CHECK(lines[0] == "ready true");
  CHECK(lines[1] == "moved true");
  // Neovim's cursor: 1-based line, 0-based byte column.
  CHECK(lines[2] == "landed " + dir + "/screw.calc 4:0");
  for (const char* f : {"/screw.calc", "/lift.calc"}) std::remove((dir + f).c_str());
}

TEST_CASE("lsp in Neovim: diagnostics, hover and definition through its built-in client", "[lsp][neovim]") {
  const int has_nvim = std::system("command -v nvim >/dev/null 2>&1");
  INFO("Neovim is needed for this test: apt-get install neovim (.ci/install-deps)");
  REQUIRE(has_nvim == 0);

  const std::string dir = tempDir();
  const std::string sheet = dir + "/jack.calc";
  // Line 5 reads an undefined name after a Greek letter: the server says
  // UTF-16 unit 18, which Neovim turns into its byte column 19.
  writeFile(sheet,
            "F = 12 kN        # load\n"
            "d = 30 mm        # diameter\n"
            "A [mm^2] = pi * d^2 / 4\n"
            "sigma [MPa] = F / A     # stress\n"
            "τ_s [MPa] = 0.6 * S_y   # shear limit\n");
  const std::vector<std::string> lines = runNeovim(dir, sheet, kScript);
  REQUIRE(lines.size() == 6);
  CHECK(lines[0] == "client true");
  CHECK(lines[1] == "diagnostics true");
  // Neovim turns the protocol's severity 1 into its own ERROR (1).
  CHECK(lines[2] == "diag 4:19-4:22 1 unknown name `S_y`; define it with `S_y = ...`");
  CHECK(lines[3] == "cleared true");
  CHECK(lines[4] ==
        "hover **A** [mm^2] = 706.9 mm^2\\n\\n```\\nA = pi * d^2 / 4\\n  = pi * (30.00 mm)^2 / 4\\n```\\n");
  CHECK(lines[5] == "definition " + sheet + " 2:0-2:1");
  std::remove(sheet.c_str());
}
