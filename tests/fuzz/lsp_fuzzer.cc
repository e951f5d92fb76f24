// libFuzzer target: the language server's message handling. The input is
// split at NUL bytes; each part is handed to the server twice: as a raw
// message body (mostly malformed JSON-RPC), and as the full text of the open
// document in a didChange, followed by hover, definition, completion, inlay
// hints and formatting at a position taken from the part's first bytes.
// Holds: no crash, no exception out of the server, no sanitizer report, and
// every request gets exactly one answer.
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <string>

#include <nlohmann/json.hpp>

#include "engine/lsp/lsp_server.h"

namespace {

const char* kUri = "file:///calctrail-fuzz/sheet.calc";

nlohmann::json at(const std::string& part) {
  const int line = part.empty() ? 0 : static_cast<unsigned char>(part[0]) % 40;
  const int character = part.size() < 2 ? 0 : static_cast<unsigned char>(part[1]) % 120;
  return {{"textDocument", {{"uri", kUri}}}, {"position", {{"line", line}, {"character", character}}}};
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  const std::string input(reinterpret_cast<const char*>(data), size);
  calctrail::lsp::Server server;
  int id = 0, requests = 0;
  auto send = [&](const std::string& method, const nlohmann::json& params, bool is_request) {
    nlohmann::json m = {{"jsonrpc", "2.0"}, {"method", method}, {"params", params}};
    if (is_request) m["id"] = ++id, ++requests;
    server.receive(m.dump(-1, ' ', false, nlohmann::json::error_handler_t::replace));
  };
  send("initialize", {{"capabilities", nlohmann::json::object()}}, true);
  send("initialized", nlohmann::json::object(), false);
  send("textDocument/didOpen",
       {{"textDocument", {{"uri", kUri}, {"languageId", "calc"}, {"version", 1}, {"text", ""}}}}, false);
  size_t from = 0;
  int version = 1;
  while (from <= input.size()) {
    size_t end = input.find('\0', from);
    if (end == std::string::npos) end = input.size();
    const std::string part = input.substr(from, end - from);
    server.receive(part);
    send("textDocument/didChange",
         {{"textDocument", {{"uri", kUri}, {"version", ++version}}}, {"contentChanges", {{{"text", part}}}}},
         false);
    for (const char* method : {"textDocument/hover", "textDocument/definition", "textDocument/completion",
                               "textDocument/references"})
      send(method, at(part), true);
    send("textDocument/inlayHint",
         {{"textDocument", {{"uri", kUri}}},
          {"range", {{"start", {{"line", 0}, {"character", 0}}}, {"end", {{"line", 1000}, {"character", 0}}}}}},
         true);
    send("textDocument/formatting", {{"textDocument", {{"uri", kUri}}}, {"options", nlohmann::json::object()}},
         true);
    server.flush();
    from = end + 1;
  }
  int answers = 0;
  for (const nlohmann::json& m : server.takeOutgoing())
    if (m.contains("id") && (m.contains("result") || m.contains("error")) && m["id"].is_number_integer() &&
        m["id"].get<int>() >= 1 && m["id"].get<int>() <= id)
      ++answers;
  if (answers != requests) {
    std::fprintf(stderr, "fuzz invariant broken: %d requests, %d answers\n", requests, answers);
    std::abort();
  }
  return 0;
}
