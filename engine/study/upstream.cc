#include "engine/study/upstream.h"

namespace calctrail {

bool isGivenValue(const Model& m, const Inputs& inputs, Slot slot) {
  if (const Binding* b = inputs.find(slot)) return !b->reads_slots;
  return m.slot(slot).input;
}

std::vector<Slot> upstreamInputs(const Model& m, const Inputs& inputs, Slot slot) {
  std::vector<char> seen(m.slotCount(), 0);
  std::vector<Slot> stack{slot};  // iterative: no sheet can overflow the stack
  seen[slot.index()] = 1;
  while (!stack.empty()) {
    const Slot s = stack.back();
    stack.pop_back();
    if (isGivenValue(m, inputs, s)) continue;
    const Binding* b = inputs.find(s);
    const NodeList reads = b ? NodeList(b->program.inputs) : m.graph().uses(static_cast<int>(s.index()));
    for (int j : reads) {
      if (seen[j]) continue;
      seen[j] = 1;
      stack.push_back(Slot(static_cast<uint32_t>(j)));
    }
  }
  std::vector<Slot> out;
  for (uint32_t i = 0; i < m.slotCount(); ++i)
    if (seen[i] && isGivenValue(m, inputs, Slot(i))) out.push_back(Slot(i));
  return out;
}

}  // namespace calctrail
