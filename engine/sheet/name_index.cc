#include "engine/sheet/name_index.h"

namespace calctrail {

void NameIndex::insert(std::string_view name, int at) {
  if ((size_ + 1) * 4 > table_.size() * 3) rehash(table_.empty() ? 16 : table_.size() * 2);
  const uint32_t h = hashOf(name);
  size_t i = h & mask();
  while (table_[i].at >= 0) i = (i + 1) & mask();
  table_[i] = {h, at};
  ++size_;
}

void NameIndex::reserve(size_t n) {
  size_t capacity = 16;
  while (n * 4 > capacity * 3) capacity *= 2;
  if (capacity > table_.size()) rehash(capacity);
}

void NameIndex::rehash(size_t capacity) {
  std::vector<Entry> old;
  old.swap(table_);
  table_.assign(capacity, Entry());
  for (const Entry& e : old) {
    if (e.at < 0) continue;
    size_t i = e.hash & mask();
    while (table_[i].at >= 0) i = (i + 1) & mask();
    table_[i] = e;
  }
}

}  // namespace calctrail
