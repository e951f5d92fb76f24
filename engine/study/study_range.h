// The values a study gives an input, as written on its command line:
// "NAME=FROM..TO" (linear or logarithmic steps, both ends included),
// "NAME=V1, V2, V3" (a list), a bracket "LO..HI". Every value is a literal
// with a unit, parsed, dimension-checked against the input and calculated
// once, by the same arithmetic as --set, so a point of a study is bit for
// bit the --set run of the same text. Problems go to Diagnostics, positioned
// in the option's text.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "engine/eval/slot.h"
#include "engine/model/inputs.h"
#include "engine/model/model.h"
#include "engine/sheet/diagnostics.h"
#include "engine/units/unit.h"

namespace calctrail {

struct StudyInput {
  /// The input's slot: a given value of the sheet (or of --set).
  Slot slot;
  /// Its name as the sheet writes it.
  std::string name;
  /// The unit its values are shown in: the quantity's display unit.
  Unit unit;
};

// NAME, bytes [begin, end) of `file`, must name a given value under
// `inputs`: an unknown name (with "did you mean") or a calculated quantity
// (with the given values it depends on) is an error.
bool resolveStudyInput(const Model& model, const Inputs& inputs, const SourceFile& file, uint32_t begin,
                       uint32_t end, Diagnostics* diags, StudyInput* out);

// One literal with a unit in bytes [begin, end) of `file`, of the input's dimension: its SI value.
bool parseStudyValue(const Model& model, const StudyInput& input, const SourceFile& file, uint32_t begin,
                     uint32_t end, Diagnostics* diags, double* si);

struct StudyRange {
  /// The input varied.
  StudyInput input;
  /// Its SI values, in the order of the study (a list as written, a range from FROM to TO).
  std::vector<double> values;
};

// --vary "NAME=FROM..TO" with `steps` points (>= 2, both ends exact;
// logarithmic when `log`, which needs both ends of one sign, not zero), or
// --vary "NAME=V1, V2, ..." (steps and log do not apply).
bool parseVary(const Model& model, const Inputs& inputs, const std::string& text, int steps, bool log,
               Diagnostics* diags, StudyRange* out);

// A bracket "LO..HI" for `input` (LO below HI): `origin` names the option.
bool parseBracket(const Model& model, const StudyInput& input, const std::string& text,
                  const std::string& origin, Diagnostics* diags, double* lo, double* hi);

// A list "V1, V2, ..." for `input`, at least one value.
bool parseValueList(const Model& model, const StudyInput& input, const std::string& text,
                    const std::string& origin, Diagnostics* diags, std::vector<double>* out);

}  // namespace calctrail
