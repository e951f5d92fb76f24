#include "tests/json_reader.h"

#include <cstdlib>

namespace calctrail::test {

namespace {
struct Reader {
  const std::string& s;
  size_t i = 0;
  std::string error;

  void space() {
    while (i < s.size() && (s[i] == ' ' || s[i] == '\n' || s[i] == '\r' || s[i] == '\t')) ++i;
  }
  bool fail(const std::string& why) {
    if (error.empty()) error = why + " at byte " + std::to_string(i);
    return false;
  }
  bool literal(const char* word) {
    const std::string w = word;
    if (s.compare(i, w.size(), w) != 0) return fail("expected " + w);
    i += w.size();
    return true;
  }
  bool str(std::string* out) {
    if (s[i] != '"') return fail("expected a string");
    ++i;
    while (i < s.size() && s[i] != '"') {
      if (static_cast<unsigned char>(s[i]) < 0x20) return fail("control character in a string");
      if (s[i] == '\\') {
        ++i;
        if (i >= s.size()) return fail("unfinished escape");
        const char c = s[i];
        if (c == 'n') *out += '\n';
        else if (c == 't') *out += '\t';
        else if (c == 'r') *out += '\r';
        else if (c == 'b') *out += '\b';
        else if (c == 'f') *out += '\f';
        else if (c == '"' || c == '\\' || c == '/') *out += c;
        else if (c == 'u') {
          if (i + 4 >= s.size()) return fail("short \\u escape");
          const unsigned v = static_cast<unsigned>(std::strtoul(s.substr(i + 1, 4).c_str(), nullptr, 16));
          if (v < 0x80) *out += static_cast<char>(v);
          else *out += '?';  // tests compare ASCII only through escapes
          i += 4;
        } else {
          return fail("bad escape");
        }
        ++i;
        continue;
      }
      *out += s[i++];
    }
    if (i >= s.size()) return fail("unterminated string");
    ++i;
    return true;
  }
  bool value(Json* v, int depth) {
    if (depth > 64) return fail("too deep");
    space();
    if (i >= s.size()) return fail("unexpected end");
    const char c = s[i];
    if (c == '{') {
      v->type = Json::Object;
      ++i;
      space();
      if (i < s.size() && s[i] == '}') { ++i; return true; }
      for (;;) {
        space();
        std::string key;
        if (!str(&key)) return false;
        space();
        if (i >= s.size() || s[i] != ':') return fail("expected ':'");
        ++i;
        if (v->object.count(key)) return fail("duplicate key " + key);
        if (!value(&v->object[key], depth + 1)) return false;
        space();
        if (i < s.size() && s[i] == ',') { ++i; continue; }
        if (i < s.size() && s[i] == '}') { ++i; return true; }
        return fail("expected ',' or '}'");
      }
    }
    if (c == '[') {
      v->type = Json::Array;
      ++i;
      space();
      if (i < s.size() && s[i] == ']') { ++i; return true; }
      for (;;) {
        v->array.emplace_back();
        if (!value(&v->array.back(), depth + 1)) return false;
        space();
        if (i < s.size() && s[i] == ',') { ++i; continue; }
        if (i < s.size() && s[i] == ']') { ++i; return true; }
        return fail("expected ',' or ']'");
      }
    }
    if (c == '"') {
      v->type = Json::String;
      return str(&v->string);
    }
    if (c == 't') { v->type = Json::Bool; v->boolean = true; return literal("true"); }
    if (c == 'f') { v->type = Json::Bool; v->boolean = false; return literal("false"); }
    if (c == 'n') { v->type = Json::Null; return literal("null"); }
    const size_t start = i;
    if (s[i] == '-') ++i;
    if (i >= s.size() || !(s[i] >= '0' && s[i] <= '9')) return fail("bad value");
    while (i < s.size() && ((s[i] >= '0' && s[i] <= '9') || s[i] == '.' || s[i] == 'e' || s[i] == 'E' ||
                            s[i] == '+' || s[i] == '-'))
      ++i;
    char* end = nullptr;
    const std::string text = s.substr(start, i - start);
    v->type = Json::Number;
    v->number = std::strtod(text.c_str(), &end);
    if (end != text.c_str() + text.size()) return fail("bad number");
    return true;
  }
};
}  // namespace

bool parseJson(const std::string& text, Json* out, std::string* error) {
  Reader r{text, 0, {}};
  if (!r.value(out, 0)) {
    *error = r.error;
    return false;
  }
  r.space();
  if (r.i != text.size()) {
    *error = "trailing text at byte " + std::to_string(r.i);
    return false;
  }
  return true;
}

}  // namespace calctrail::test
