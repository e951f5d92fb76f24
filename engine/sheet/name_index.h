// The quantities of a sheet by name: an open-addressing hash table of
// positions. It keeps no copy of the names (each entry is a hash and a
// position, 8 bytes); a lookup compares against the name at the position, so
// a 1M-line sheet pays about 16 bytes a name instead of a string per name.
#pragma once

#include <cstdint>
#include <functional>
#include <string_view>
#include <vector>

namespace calctrail {

class NameIndex {
 public:
  /// The position stored for `name`, or -1. `name_at(position)` gives the name at a position.
  template <class NameAt>
  int find(std::string_view name, const NameAt& name_at) const {
    if (table_.empty()) return -1;
    const uint32_t h = hashOf(name);
    for (size_t i = h & mask(); table_[i].at >= 0; i = (i + 1) & mask())
      if (table_[i].hash == h && std::string_view(name_at(table_[i].at)) == name) return table_[i].at;
    return -1;
  }
  /// Stores `at` for `name`; the caller has checked with find() that `name` is not there yet.
  void insert(std::string_view name, int at);
  /// Room for `n` names without growing.
  void reserve(size_t n);
  size_t size() const { return size_; }

 private:
  struct Entry {
    uint32_t hash = 0;
    int32_t at = -1;  // -1: empty
  };
  static uint32_t hashOf(std::string_view name) {
    return static_cast<uint32_t>(std::hash<std::string_view>()(name));
  }
  size_t mask() const { return table_.size() - 1; }
  void rehash(size_t capacity);

  std::vector<Entry> table_;  // a power of two in size, at most 3/4 full
  size_t size_ = 0;
};

}  // namespace calctrail
