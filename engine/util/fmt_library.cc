// fmt's compiled part (what libfmt.so holds: vformat, the shortest-double
// algorithm, the locale's separators), built into the program from fmt's own
// header instead of loaded as a shared library. One library fewer to map and
// relocate at every start: `calctrail report` about 0.14 M instructions and,
// measured, 6 page faults cheaper (docs/performance.md, startup_perftest).
// Every other file includes fmt as before; the templates that libfmt.so
// instantiates for char are instantiated here.
#include <fmt/format-inl.h>

FMT_BEGIN_NAMESPACE
namespace detail {
template auto dragonbox::to_decimal(float x) noexcept -> dragonbox::decimal_fp<float>;
template auto dragonbox::to_decimal(double x) noexcept -> dragonbox::decimal_fp<double>;
template auto thousands_sep_impl(locale_ref) -> thousands_sep_result<char>;
template auto decimal_point_impl(locale_ref) -> char;
}  // namespace detail
FMT_END_NAMESPACE
