#include "engine/study/json_reader.h"

#include <cstdlib>

namespace calctrail {

const JsonValue* JsonValue::find(const std::string& key) const {
  for (const auto& [k, v] : object)
    if (k == key) return &v;
  return nullptr;
}

namespace {

class Reader {
 public:
  explicit Reader(const std::string& text) : s_(text) {}

  bool document(JsonValue* out, std::string* error) {
    if (!value(out, 0) || (space(), pos_ != s_.size())) {
      *error = (error_.empty() ? std::string("text after the JSON value") : error_) + " at byte " +
               std::to_string(pos_);
      return false;
    }
    return true;
  }

 private:
  static constexpr int kMaxDepth = 64;  // our files nest 5 deep; no input can exhaust the stack

  void space() {
    while (pos_ < s_.size() && (s_[pos_] == ' ' || s_[pos_] == '\n' || s_[pos_] == '\r' || s_[pos_] == '\t'))
      ++pos_;
  }
  bool fail(const char* why) {
    if (error_.empty()) error_ = why;
    return false;
  }
  bool literal(const char* word) {
    const std::string w(word);
    if (s_.compare(pos_, w.size(), w) != 0) return fail("an unexpected word");
    pos_ += w.size();
    return true;
  }

  bool string(std::string* out) {
    if (pos_ >= s_.size() || s_[pos_] != '"') return fail("a string expected");
    ++pos_;
    while (pos_ < s_.size() && s_[pos_] != '"') {
      char c = s_[pos_++];
      if (static_cast<unsigned char>(c) < 0x20) return fail("a control character in a string");
      if (c != '\\') {
        out->push_back(c);
        continue;
      }
      if (pos_ >= s_.size()) return fail("an unfinished escape");
      c = s_[pos_++];
      switch (c) {
        case '"':
        case '\\':
        case '/': out->push_back(c); break;
        case 'b': out->push_back('\b'); break;
        case 'f': out->push_back('\f'); break;
        case 'n': out->push_back('\n'); break;
        case 'r': out->push_back('\r'); break;
        case 't': out->push_back('\t'); break;
        case 'u': {
          if (pos_ + 4 > s_.size()) return fail("an unfinished \\u escape");
          const unsigned long cp = std::strtoul(s_.substr(pos_, 4).c_str(), nullptr, 16);
          pos_ += 4;
          if (cp >= 0x80) return fail("a \\u escape beyond ASCII (calctrail writes UTF-8 as it is)");
          out->push_back(static_cast<char>(cp));
          break;
        }
        default: return fail("an unknown escape");
      }
    }
    if (pos_ >= s_.size()) return fail("an unfinished string");
    ++pos_;
    return true;
  }

  bool value(JsonValue* out, int depth) {
    if (depth > kMaxDepth) return fail("nesting too deep");
    space();
    if (pos_ >= s_.size()) return fail("a value expected");
    const char c = s_[pos_];
    if (c == 'n') return literal("null");
    if (c == 't') return (out->type = JsonValue::Bool, out->boolean = true, literal("true"));
    if (c == 'f') return (out->type = JsonValue::Bool, literal("false"));
    if (c == '"') return (out->type = JsonValue::String, string(&out->string));
    if (c == '[') {
      out->type = JsonValue::Array;
      ++pos_;
      space();
      if (pos_ < s_.size() && s_[pos_] == ']') return ++pos_, true;
      for (;;) {
        out->array.emplace_back();
        if (!value(&out->array.back(), depth + 1)) return false;
        space();
        if (pos_ < s_.size() && s_[pos_] == ',') {
          ++pos_;
          continue;
        }
        if (pos_ < s_.size() && s_[pos_] == ']') return ++pos_, true;
        return fail("`,` or `]` expected");
      }
    }
    if (c == '{') {
      out->type = JsonValue::Object;
      ++pos_;
      space();
      if (pos_ < s_.size() && s_[pos_] == '}') return ++pos_, true;
      for (;;) {
        space();
        std::string key;
        if (!string(&key)) return false;
        space();
        if (pos_ >= s_.size() || s_[pos_] != ':') return fail("`:` expected");
        ++pos_;
        out->object.emplace_back(std::move(key), JsonValue());
        if (!value(&out->object.back().second, depth + 1)) return false;
        space();
        if (pos_ < s_.size() && s_[pos_] == ',') {
          ++pos_;
          continue;
        }
        if (pos_ < s_.size() && s_[pos_] == '}') return ++pos_, true;
        return fail("`,` or `}` expected");
      }
    }
    if (c == '-' || (c >= '0' && c <= '9')) {
      const size_t start = pos_;
      while (pos_ < s_.size() && std::string("+-0123456789.eE").find(s_[pos_]) != std::string::npos) ++pos_;
      const std::string digits = s_.substr(start, pos_ - start);
      char* end = nullptr;
      out->type = JsonValue::Number;
      out->number = std::strtod(digits.c_str(), &end);
      if (end != digits.c_str() + digits.size()) return fail("a malformed number");
      return true;
    }
    return fail("a value expected");
  }

  const std::string& s_;
  size_t pos_ = 0;
  std::string error_;
};

}  // namespace

bool parseJsonText(const std::string& text, JsonValue* out, std::string* error) {
  *out = JsonValue();
  Reader r(text);
  return r.document(out, error);
}

}  // namespace calctrail
