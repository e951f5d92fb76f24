// The language server: one object that takes message bodies in and gives
// messages out, with no input or output of its own, so tests drive it in
// process and the stdio transport (stdio_transport.h) drives it for
// `calctrail lsp`.
//
// Responsiveness: an edit only changes the text. A document is recalculated
// when its diagnostics are published (flush(), which the transport calls
// once no more input is waiting) or when a request needs its values. So a
// burst of didChange messages costs one recalculation, of the newest text.
//
// Templates: every calculation reads the files its `use` lines name through
// the open documents first (BufferSource), and an edit of an open document
// also recalculates the open sheets that use it, directly or nested.
#pragma once

#include <cstdint>
#include <map>
#include <memory>
#include <string>
#include <string_view>
#include <vector>

#include <nlohmann/json.hpp>

#include "engine/lsp/analysis.h"
#include "engine/lsp/buffer_source.h"
#include "engine/lsp/document.h"

namespace calctrail::lsp {

class Server {
 public:
  // Handles one message body (a request, a notification, or a response to
  // a request of ours). Never throws: every problem is answered or logged.
  void receive(std::string_view body);
  // A frame the transport could not read: answered with a parse error.
  void receiveBroken(const std::string& why);
  // Recalculates every document changed since its diagnostics were last
  // published, and queues its publishDiagnostics.
  void flush();
  // Some document waits for flush().
  bool hasPendingWork() const;
  // The messages to send, in order, and forgets them.
  std::vector<nlohmann::json> takeOutgoing();

  // `exit` was received; the process ends with exitCode() (0 after shutdown, 1 otherwise).
  bool exited() const { return exited_; }
  int exitCode() const { return shutdown_ ? 0 : 1; }
  // Recalculations so far (a figure for the tests and the benchmark).
  int recalculations() const { return recalculations_; }

 private:
  // One open document and its latest calculation.
  struct OpenDocument {
    OpenDocument(Document d, std::string p) : doc(std::move(d)), path(std::move(p)) {}
    /// The text as the editor has it.
    Document doc;
    /// The file path diagnostics name (from the URI).
    std::string path;
    /// Bumped by every change; analysis and publication record the one they saw.
    uint64_t generation = 0;
    /// The latest calculation, of generation `analyzed`.
    std::unique_ptr<Analysis> analysis;
    uint64_t analyzed = 0;
    /// The generation whose diagnostics were published; none yet when below `generation`.
    uint64_t published = 0;
  };

  void dispatch(const nlohmann::json& message);
  nlohmann::json request(const std::string& method, const nlohmann::json& params);
  void notify(const std::string& method, const nlohmann::json& params);
  nlohmann::json initialize(const nlohmann::json& params);
  void didOpen(const nlohmann::json& params);
  void didChange(const nlohmann::json& params);
  void didClose(const nlohmann::json& params);
  OpenDocument* find(const nlohmann::json& params);
  const Analysis& analysisOf(OpenDocument* d);
  void publish(OpenDocument* d);
  void log(const std::string& message);
  // Marks for recalculation every other open document whose templates include `changed`.
  void touchDependents(const OpenDocument& changed);
  nlohmann::json formatting(OpenDocument* d);

  std::map<std::string, OpenDocument> docs_;
  // The open documents as the files templates are read from (their unsaved text first).
  BufferSource buffers_;
  std::vector<nlohmann::json> out_;
  bool initialized_ = false, shutdown_ = false, exited_ = false;
  bool inlay_refresh_ = false;  // the client asks to be told when hints change
  int64_t next_request_id_ = 1;
  int recalculations_ = 0;
};

// The file path of a `file://` URI (percent-decoded); other URIs as given.
std::string pathFromUri(const std::string& uri);
// The `file://` URI of a path (made absolute, percent-encoded where a URI must be).
std::string uriFromPath(const std::string& path);

}  // namespace calctrail::lsp
