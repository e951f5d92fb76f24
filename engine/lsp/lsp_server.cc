#include "engine/lsp/lsp_server.h"

#include <cctype>
#include <cstring>
#include <filesystem>
#include <stdexcept>

#include "engine/lsp/completion.h"
#include "engine/lsp/hover.h"
#include "engine/lsp/inlay_hints.h"
#include "engine/lsp/json_rpc.h"
#include "engine/lsp/lsp_diagnostics.h"
#include "engine/lsp/navigation.h"
#include "engine/lsp/protocol_json.h"
#include "engine/review/sheet_format.h"
#include "engine/template/template_path.h"

namespace calctrail::lsp {

namespace {

using nlohmann::json;

// A request refused with a code of its own (RequestFailed, InvalidParams...).
struct RequestError : std::runtime_error {
  RequestError(int c, const std::string& m) : std::runtime_error(m), code(c) {}
  int code;
};

int hexDigit(char c) {
  if (c >= '0' && c <= '9') return c - '0';
  if (c >= 'a' && c <= 'f') return c - 'a' + 10;
  if (c >= 'A' && c <= 'F') return c - 'A' + 10;
  return -1;
}

// The byte offset of params.position in `doc`; false when the position is
// not in the document (the request then has an empty result).
bool offsetOf(const Document& doc, const json& params, uint32_t* offset) {
  return doc.offset(positionFrom(params.at("position")), offset);
}

}  // namespace

std::string pathFromUri(const std::string& uri) {
  const std::string scheme = "file://";
  if (uri.compare(0, scheme.size(), scheme) != 0) return uri;
  std::string out;
  for (size_t i = scheme.size(); i < uri.size(); ++i) {
    int hi, lo;
    if (uri[i] == '%' && i + 2 < uri.size() && (hi = hexDigit(uri[i + 1])) >= 0 &&
        (lo = hexDigit(uri[i + 2])) >= 0) {
      out += static_cast<char>(hi * 16 + lo);
      i += 2;
    } else {
      out += uri[i];
    }
  }
  return out;
}

std::string uriFromPath(const std::string& path) {
  std::string absolute = path;
  if (!absolute.empty() && absolute[0] != '/') {
    std::error_code ec;
    absolute = std::filesystem::absolute(path, ec).lexically_normal().string();
    if (ec) absolute = path;
  }
  static const char* const kHex = "0123456789ABCDEF";
  std::string out = "file://";
  for (const char ch : absolute) {
    const unsigned char c = static_cast<unsigned char>(ch);
    if (std::isalnum(c) || std::strchr("/-._~", ch)) {
      out += ch;
    } else {
      out += '%';
      out += kHex[c >> 4];
      out += kHex[c & 0xf];
    }
  }
  return out;
}

void Server::receive(std::string_view body) {
  json message;
  try {
    message = json::parse(body.begin(), body.end());
  } catch (const json::parse_error& e) {
    out_.push_back(errorResponse(nullptr, kParseError, std::string("the message is not JSON: ") + e.what()));
    return;
  }
  dispatch(message);
}

void Server::receiveBroken(const std::string& why) {
  out_.push_back(errorResponse(nullptr, kParseError, why));
}

void Server::dispatch(const json& message) {
  if (!message.is_object()) {
    out_.push_back(errorResponse(nullptr, kInvalidRequest, "a message must be a JSON object"));
    return;
  }
  const auto id_it = message.find("id");
  const bool has_id = id_it != message.end();
  const json id = has_id ? *id_it : json(nullptr);
  if (has_id && !id.is_number_integer() && !id.is_string()) {
    out_.push_back(errorResponse(nullptr, kInvalidRequest, "a request id must be a number or a string"));
    return;
  }
  const auto method_it = message.find("method");
  if (method_it == message.end()) {
    // A response to a request of ours (workspace/inlayHint/refresh): nothing to do.
    if (has_id && (message.contains("result") || message.contains("error"))) return;
    out_.push_back(errorResponse(id, kInvalidRequest, "a message without a method"));
    return;
  }
  if (!method_it->is_string()) {
    out_.push_back(errorResponse(id, kInvalidRequest, "the method must be a string"));
    return;
  }
  const std::string method = *method_it;
  const json params = message.value("params", json::object());
  try {
    if (!has_id) {
      notify(method, params);
    } else if (!initialized_ && method != "initialize") {
      out_.push_back(errorResponse(id, kServerNotInitialized, "the server is not initialized yet"));
    } else if (shutdown_) {
      out_.push_back(errorResponse(id, kInvalidRequest, "the server is shut down; only `exit` is accepted"));
    } else {
      out_.push_back(response(id, request(method, params)));
    }
  } catch (const RequestError& e) {
    if (has_id)
      out_.push_back(errorResponse(id, e.code, e.what()));
    else
      log(method + ": " + e.what());
  } catch (const json::exception& e) {
    const std::string why = std::string("invalid parameters: ") + e.what();
    if (has_id)
      out_.push_back(errorResponse(id, kInvalidParams, why));
    else
      log(method + ": " + why);
  } catch (const std::exception& e) {
    const std::string why = std::string("internal error: ") + e.what();
    if (has_id)
      out_.push_back(errorResponse(id, kInternalError, why));
    else
      log(method + ": " + why);
  }
}

json Server::request(const std::string& method, const json& params) {
  if (method == "initialize") return initialize(params);
  if (method == "shutdown") {
    shutdown_ = true;
    return nullptr;
  }
  const bool on_document = method.rfind("textDocument/", 0) == 0;
  if (!on_document) throw RequestError(kMethodNotFound, "unknown method `" + method + "`");
  static const char* const kEmptyArray[] = {"textDocument/references", "textDocument/inlayHint"};
  OpenDocument* d = find(params);
  const bool known = method == "textDocument/hover" || method == "textDocument/definition" ||
                     method == "textDocument/references" || method == "textDocument/completion" ||
                     method == "textDocument/prepareRename" || method == "textDocument/rename" ||
                     method == "textDocument/inlayHint" || method == "textDocument/formatting";
  if (!known) throw RequestError(kMethodNotFound, "unknown method `" + method + "`");
  if (!d) {
    // A document that is not open: an empty answer, as for a place with no name.
    for (const char* m : kEmptyArray)
      if (method == m) return json::array();
    if (method == "textDocument/completion") return {{"isIncomplete", false}, {"items", json::array()}};
    return nullptr;
  }
  if (method == "textDocument/formatting") return formatting(d);
  if (method == "textDocument/inlayHint") {
    const Range r = rangeFrom(params.at("range"));
    return inlayHints(analysisOf(d), d->doc, r.start.line, r.end.line);
  }
  uint32_t offset = 0;
  const bool in_document = offsetOf(d->doc, params, &offset);
  if (method == "textDocument/references") {
    if (!in_document) return json::array();
    const bool declaration = params.value("/context/includeDeclaration"_json_pointer, false);
    return references(analysisOf(d), d->doc, offset, declaration);
  }
  if (method == "textDocument/completion") {
    if (!in_document) return {{"isIncomplete", false}, {"items", json::array()}};
    return completion(analysisOf(d), d->doc, offset);
  }
  if (!in_document) return nullptr;
  if (method == "textDocument/hover") return hover(analysisOf(d), d->doc, offset);
  if (method == "textDocument/definition") return definition(analysisOf(d), d->doc, offset);
  if (method == "textDocument/prepareRename") return prepareRename(analysisOf(d), d->doc, offset);
  // textDocument/rename
  const std::string new_name = params.at("newName").get<std::string>();
  const RenameResult r = rename(analysisOf(d), d->doc, offset, new_name);
  if (!r.error.empty()) throw RequestError(kRequestFailed, r.error);
  return r.edit;
}

void Server::notify(const std::string& method, const json& params) {
  if (method == "exit") {
    exited_ = true;
    return;
  }
  if (!initialized_ || shutdown_) return;  // dropped, as the protocol asks
  if (method == "textDocument/didOpen")
    didOpen(params);
  else if (method == "textDocument/didChange")
    didChange(params);
  else if (method == "textDocument/didClose")
    didClose(params);
  // initialized, didSave, $/cancelRequest, $/setTrace and the like need nothing.
}

json Server::initialize(const json& params) {
  if (initialized_) throw RequestError(kInvalidRequest, "the server is already initialized");
  initialized_ = true;
  inlay_refresh_ = params.value("/capabilities/workspace/inlayHint/refreshSupport"_json_pointer, false);
  json capabilities = {
      {"positionEncoding", "utf-16"},
      {"textDocumentSync", {{"openClose", true}, {"change", 2}}},  // 2: incremental
      {"hoverProvider", true},
      {"definitionProvider", true},
      {"referencesProvider", true},
      {"renameProvider", {{"prepareProvider", true}}},
      {"completionProvider", {{"triggerCharacters", {"["}}}},
      {"inlayHintProvider", true},
      {"documentFormattingProvider", true},
  };
  return {{"capabilities", capabilities},
          {"serverInfo", {{"name", "calctrail"}, {"version", CALCTRAIL_VERSION}}}};
}

Server::OpenDocument* Server::find(const json& params) {
  const auto it = docs_.find(params.at("/textDocument/uri"_json_pointer).get<std::string>());
  return it == docs_.end() ? nullptr : &it->second;
}

void Server::didOpen(const json& params) {
  const json& td = params.at("textDocument");
  const std::string uri = td.at("uri");
  const std::string text = td.at("text");
  const int64_t version = td.value("version", int64_t{0});
  docs_.erase(uri);
  OpenDocument& d = docs_.try_emplace(uri, Document(uri, text, version), pathFromUri(uri)).first->second;
  d.generation = 1;
  buffers_.open(d.path, &d.doc);
  touchDependents(d);
}

void Server::didChange(const json& params) {
  OpenDocument* d = find(params);
  if (!d) throw RequestError(kInvalidParams, "didChange for a document that is not open");
  for (const json& change : params.at("contentChanges")) {
    const std::string text = change.at("text");
    if (!change.contains("range")) {
      d->doc.replace(text);
    } else if (!d->doc.edit(rangeFrom(change.at("range")), text)) {
      throw RequestError(kInvalidParams, "a change whose range ends before it starts");
    }
  }
  d->doc.setVersion(params.at("textDocument").value("version", d->doc.version()));
  ++d->generation;
  touchDependents(*d);
}

void Server::touchDependents(const OpenDocument& changed) {
  const std::string path = normalizePath(changed.path);
  for (auto& [uri, d] : docs_) {
    if (&d == &changed || !d.analysis) continue;
    // A sheet not recalculated since its last change is recalculated anyway.
    if (d.analyzed == d.generation && d.analysis->templates.count(path)) ++d.generation;
  }
}

void Server::didClose(const json& params) {
  const std::string uri = params.at("/textDocument/uri"_json_pointer);
  const auto it = docs_.find(uri);
  if (it == docs_.end()) return;
  // The sheets using it read the file from the disk again.
  buffers_.close(it->second.path);
  touchDependents(it->second);
  docs_.erase(it);
  // Clear what the editor shows for the closed file.
  out_.push_back(
      notification("textDocument/publishDiagnostics", {{"uri", uri}, {"diagnostics", json::array()}}));
}

const Analysis& Server::analysisOf(OpenDocument* d) {
  if (!d->analysis || d->analyzed != d->generation) {
    d->analysis = std::make_unique<Analysis>(d->doc, d->path, &buffers_);
    d->analyzed = d->generation;
    ++recalculations_;
  }
  return *d->analysis;
}

void Server::publish(OpenDocument* d) {
  const Analysis& a = analysisOf(d);
  out_.push_back(notification(
      "textDocument/publishDiagnostics",
      {{"uri", d->doc.uri()}, {"version", d->doc.version()}, {"diagnostics", diagnosticsJson(a, d->doc)}}));
  d->published = d->generation;
}

bool Server::hasPendingWork() const {
  for (const auto& [uri, d] : docs_)
    if (d.published != d.generation) return true;
  return false;
}

void Server::flush() {
  bool any = false;
  for (auto& [uri, d] : docs_) {
    if (d.published == d.generation) continue;
    try {
      publish(&d);
      any = true;
    } catch (const std::exception& e) {
      d.published = d.generation;  // not again for the same text
      log("internal error while calculating " + uri + ": " + e.what());
    }
  }
  if (any && inlay_refresh_) {
    out_.push_back(
        {{"jsonrpc", "2.0"}, {"id", next_request_id_++}, {"method", "workspace/inlayHint/refresh"}});
  }
}

json Server::formatting(OpenDocument* d) {
  Diagnostics diags;
  const std::string& text = d->doc.text();
  ReadError limit;
  if (!checkSourceLimits(text, "the file", &limit)) return json::array();
  const std::string formatted = formatWorksheet(d->path, text, &diags);
  // Never reformat what did not parse: the layout of a broken line is unknown.
  if (diags.hasErrors() || formatted == text) return json::array();
  const Range whole{{0, 0}, d->doc.end()};
  return json::array({{{"range", toJson(whole)}, {"newText", formatted}}});
}

void Server::log(const std::string& message) {
  out_.push_back(notification("window/logMessage", {{"type", 1}, {"message", message}}));
}

std::vector<json> Server::takeOutgoing() {
  std::vector<json> out;
  out.swap(out_);
  return out;
}

}  // namespace calctrail::lsp
