// The base protocol of the Language Server Protocol: JSON-RPC messages framed
// by a `Content-Length: N` header and a blank line. The framer turns a byte
// stream into whole message bodies and reports a broken frame instead of
// giving up on the stream, so one bad message never ends a session.
#pragma once

#include <cstddef>
#include <string>
#include <string_view>

#include <nlohmann/json.hpp>

namespace calctrail::lsp {

// JSON-RPC error codes (JSON-RPC 2.0 and the LSP specification).
enum ErrorCode {
  kParseError = -32700,
  kInvalidRequest = -32600,
  kMethodNotFound = -32601,
  kInvalidParams = -32602,
  kInternalError = -32603,
  kServerNotInitialized = -32002,
  kRequestFailed = -32803,
};

// The largest body accepted: a worksheet at its size limit (16 MB) with
// every byte escaped as \u00XX still fits.
constexpr size_t kMaxBodyBytes = size_t{100} << 20;
// The longest header block; real clients send one or two short lines.
constexpr size_t kMaxHeaderBytes = 8192;

// One thing read from the stream: a whole body, or a frame that was broken.
struct Frame {
  enum Kind { Body, Broken };
  /// A body to parse as JSON, or a broken frame with `error` saying why.
  Kind kind = Body;
  /// The message bytes (Body).
  std::string body;
  /// Why the frame was refused (Broken): "bad Content-Length header `abc`".
  std::string error;
};

// Splits a byte stream into frames. Bytes are fed as they arrive; next()
// returns the frames that are complete. After a broken header it resumes at
// the next `Content-Length:` in the stream.
class Framer {
 public:
  void feed(std::string_view bytes) { buffer_.append(bytes.data(), bytes.size()); }
  // The next complete frame into *frame; false when more bytes are needed.
  bool next(Frame* frame);
  // Bytes fed but not yet returned in a frame.
  size_t pending() const { return buffer_.size() - start_; }

 private:
  void consume(size_t n);
  bool resync(size_t from);

  std::string buffer_;
  size_t start_ = 0;  // first byte not yet consumed
};

// `body` with its header, ready to write.
std::string frame(std::string_view body);

// JSON text for the wire: compact; bytes that are not UTF-8 become U+FFFD
// instead of throwing.
std::string dump(const nlohmann::json& message);

// {"jsonrpc": "2.0", "id": id, "result": result}
nlohmann::json response(const nlohmann::json& id, nlohmann::json result);
// {"jsonrpc": "2.0", "id": id, "error": {"code": code, "message": message}}
nlohmann::json errorResponse(const nlohmann::json& id, int code, const std::string& message);
// {"jsonrpc": "2.0", "method": method, "params": params}
nlohmann::json notification(const std::string& method, nlohmann::json params);

}  // namespace calctrail::lsp
