// Which quantities a study may vary: the given values (a formula that reads
// no other quantity and calls no function, or a --set value), and the given
// values a result depends on, walked up its formulas under the Inputs in
// force (a --set that reads other quantities replaces the sheet's edges).
#pragma once

#include <vector>

#include "engine/eval/slot.h"
#include "engine/model/inputs.h"
#include "engine/model/model.h"

namespace calctrail {

// `slot` holds a given value under `inputs`.
bool isGivenValue(const Model& model, const Inputs& inputs, Slot slot);

// The given values `slot` depends on (itself, when it is one), in sheet order.
std::vector<Slot> upstreamInputs(const Model& model, const Inputs& inputs, Slot slot);

}  // namespace calctrail
