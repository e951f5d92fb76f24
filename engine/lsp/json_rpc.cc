#include "engine/lsp/json_rpc.h"

#include <algorithm>
#include <cctype>

namespace calctrail::lsp {

namespace {

constexpr std::string_view kLengthField = "content-length:";

bool startsWithNoCase(std::string_view s, std::string_view prefix) {
  if (s.size() < prefix.size()) return false;
  for (size_t i = 0; i < prefix.size(); ++i)
    if (std::tolower(static_cast<unsigned char>(s[i])) != prefix[i]) return false;
  return true;
}

std::string_view trim(std::string_view s) {
  while (!s.empty() && (s.front() == ' ' || s.front() == '\t')) s.remove_prefix(1);
  while (!s.empty() && (s.back() == ' ' || s.back() == '\t' || s.back() == '\r')) s.remove_suffix(1);
  return s;
}

// The header text as a message shows it: printable ASCII, at most 40 characters.
std::string shown(std::string_view s) {
  std::string out;
  for (char c : s.substr(0, 40)) out += c >= 0x20 && c < 0x7f ? c : '?';
  return out;
}

// The value of Content-Length in `headers`, or -1 with *why set.
long long contentLength(std::string_view headers, std::string* why) {
  long long length = -1;
  while (!headers.empty()) {
    const size_t eol = headers.find("\r\n");
    const std::string_view line = headers.substr(0, eol);
    headers = eol == std::string_view::npos ? std::string_view() : headers.substr(eol + 2);
    if (!startsWithNoCase(line, kLengthField)) continue;  // Content-Type and the like
    const std::string_view value = trim(line.substr(kLengthField.size()));
    if (value.empty() || value.size() > 12 ||
        !std::all_of(value.begin(), value.end(), [](char c) { return c >= '0' && c <= '9'; })) {
      *why = "bad Content-Length header `" + shown(value) + "`: it must be a number of bytes";
      return -1;
    }
    length = std::stoll(std::string(value));
  }
  if (length < 0)
    *why = "a message header without Content-Length";
  else if (static_cast<unsigned long long>(length) > kMaxBodyBytes)
    *why = "Content-Length " + std::to_string(length) + " is over the limit of " +
           std::to_string(kMaxBodyBytes) + " bytes";
  return static_cast<unsigned long long>(length) > kMaxBodyBytes ? -1 : length;
}

}  // namespace

void Framer::consume(size_t n) {
  start_ += n;
  // Drop consumed bytes now and then, not on every message.
  if (start_ > (size_t{1} << 16) && start_ * 2 > buffer_.size()) {
    buffer_.erase(0, start_);
    start_ = 0;
  }
}

// Skips to the next "Content-Length:" after `from` (relative to start_);
// false, keeping only a possible partial match, when there is none yet.
bool Framer::resync(size_t from) {
  const std::string_view rest = std::string_view(buffer_).substr(start_);
  for (size_t i = from; i < rest.size(); ++i) {
    if ((rest[i] == 'C' || rest[i] == 'c') && startsWithNoCase(rest.substr(i), kLengthField)) {
      consume(i);
      return true;
    }
  }
  // Keep a tail that may be the start of the field, cut off by the read.
  size_t keep = std::min(rest.size(), kLengthField.size() - 1);
  while (keep > 0 && !startsWithNoCase(rest.substr(rest.size() - keep), kLengthField.substr(0, keep))) --keep;
  consume(rest.size() - keep);
  return false;
}

bool Framer::next(Frame* out) {
  const std::string_view rest = std::string_view(buffer_).substr(start_);
  const size_t end = rest.find("\r\n\r\n");
  if (end == std::string_view::npos || end > kMaxHeaderBytes) {
    if (end == std::string_view::npos && rest.size() <= kMaxHeaderBytes) return false;
    out->kind = Frame::Broken;
    out->error = "a message header longer than " + std::to_string(kMaxHeaderBytes) + " bytes";
    resync(1);
    return true;
  }
  std::string why;
  const long long length = contentLength(rest.substr(0, end), &why);
  if (length < 0) {
    out->kind = Frame::Broken;
    out->error = why;
    resync(1);  // a Content-Length may follow stray bytes in the same block
    return true;
  }
  const size_t total = end + 4 + static_cast<size_t>(length);
  if (rest.size() < total) return false;
  out->kind = Frame::Body;
  out->body.assign(rest.substr(end + 4, static_cast<size_t>(length)));
  out->error.clear();
  consume(total);
  return true;
}

std::string frame(std::string_view body) {
  std::string out = "Content-Length: " + std::to_string(body.size()) + "\r\n\r\n";
  out.append(body.data(), body.size());
  return out;
}

std::string dump(const nlohmann::json& message) {
  return message.dump(-1, ' ', false, nlohmann::json::error_handler_t::replace);
}

nlohmann::json response(const nlohmann::json& id, nlohmann::json result) {
  return {{"jsonrpc", "2.0"}, {"id", id}, {"result", std::move(result)}};
}

nlohmann::json errorResponse(const nlohmann::json& id, int code, const std::string& message) {
  return {{"jsonrpc", "2.0"}, {"id", id}, {"error", {{"code", code}, {"message", message}}}};
}

nlohmann::json notification(const std::string& method, nlohmann::json params) {
  return {{"jsonrpc", "2.0"}, {"method", method}, {"params", std::move(params)}};
}

}  // namespace calctrail::lsp
