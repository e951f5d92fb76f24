// Texts joined at compile time. A declaration's text is a std::string_view
// into constant data (function_decl.h); where one is made of shared parts
// ("Ca > 0, Fm > 0, ..." and what one function adds), join() makes it a
// constant too, so that building the library joins no string at start-up.
#pragma once

#include <cstddef>
#include <string_view>

namespace calctrail::fn {

// A text of N - 1 characters and its terminating NUL, held by value.
template <std::size_t N>
struct ConstText {
  char chars[N] = {};
  constexpr std::string_view view() const { return {chars, N - 1}; }
};

namespace detail {
template <std::size_t N>
constexpr std::string_view textOf(const char (&s)[N]) { return {s, N - 1}; }
template <std::size_t N>
constexpr std::string_view textOf(const ConstText<N>& t) { return t.view(); }
// The length of a part, from its type alone (a size in a template argument).
template <typename T>
struct LengthOf;
template <std::size_t N>
struct LengthOf<char[N]> {
  static constexpr std::size_t value = N - 1;
};
template <std::size_t N>
struct LengthOf<ConstText<N>> {
  static constexpr std::size_t value = N - 1;
};
}  // namespace detail

// join("dr > 0, ", kCLimit, ", E > 0"): string literals, constexpr char arrays
// and ConstTexts, one after the other. Use it for a constexpr at namespace scope
// or a static constexpr: the result is a value, its view lives as long as it.
template <typename... Parts>
constexpr auto join(const Parts&... parts) {
  ConstText<(detail::LengthOf<Parts>::value + ... + 1)> out{};
  std::size_t at = 0;
  for (std::string_view part : {detail::textOf(parts)...})
    for (char c : part) out.chars[at++] = c;
  return out;
}

}  // namespace calctrail::fn
