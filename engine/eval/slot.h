// A quantity's place in a model: the index of its value in every slot array
// (Results::values, an evaluation's muparser variables). A type of its own so
// that a slot is never confused with a check index, a line or a node count.
#pragma once

#include <cstdint>
#include <functional>

namespace calctrail {

class Slot {
 public:
  constexpr Slot() = default;
  constexpr explicit Slot(uint32_t index) : index_(index) {}

  /// The position in the slot arrays; quantity i of the sheet is slot i.
  constexpr uint32_t index() const { return index_; }
  /// False for the default-constructed "no slot".
  constexpr bool valid() const { return index_ != kNone; }

  friend constexpr bool operator==(Slot a, Slot b) { return a.index_ == b.index_; }
  friend constexpr bool operator!=(Slot a, Slot b) { return a.index_ != b.index_; }
  friend constexpr bool operator<(Slot a, Slot b) { return a.index_ < b.index_; }

 private:
  static constexpr uint32_t kNone = 0xFFFFFFFFu;
  uint32_t index_ = kNone;
};

}  // namespace calctrail

template <>
struct std::hash<calctrail::Slot> {
  size_t operator()(calctrail::Slot s) const noexcept { return s.index(); }
};
