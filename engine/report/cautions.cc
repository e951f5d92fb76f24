#include "engine/report/cautions.h"

namespace calctrail {

const std::vector<Caution>& cautionCatalogue() {
  // Where a general caution and a function's said the same thing, the entry
  // keeps every point either made, so merging them loses nothing.
  static const std::vector<Caution> c = {
      {"friction",
       "Friction values vary widely: size torque, motors and brakes with the high value, and check "
       "self-locking, holding and back-driving with the low one.",
       true},
      {"self-locking",
       "Self-locking is no brake: vibration, shock, low friction, lubrication and wear can back-drive a "
       "screw or a worm that is self-locking on paper. Provide a brake or lock where a load is held.",
       true},
      {"buckling",
       "Long screws in compression buckle: the column loads assume a straight screw loaded on its axis; "
       "check the column with its real end conditions and length, take the end-condition constant "
       "conservatively and apply a design factor.",
       true},
      {"design-aid",
       "These results are a design aid. They are to be reviewed by a qualified engineer under the codes, "
       "standards and local rules that apply to the machine, above all where a load is lifted or clamped "
       "over people.",
       true},
      {"euler-range", "Below the transition slenderness Euler's load is unsafe.", false},
      {"starting-friction",
       "Use the starting value for the breakaway torque of a motor and the running value, at its low end, "
       "for self-locking.",
       false},
      {"collar-friction",
       "Collar friction is often the larger part of the torque: use the high value for motor sizing; it also "
       "helps hold the load, but do not count on it for self-locking.",
       false},
      {"motor-sizing",
       "Size the motor for starting friction and for the worst load case, not the running average.", false},
      {"stress",
       "A stress is half a check: compare it with an allowable value under the applicable code, and check "
       "fatigue where the load cycles.",
       false},
      {"nut-material",
       "Allowable bearing pressure and pV depend on the nut material, lubrication and duty: take them from "
       "the nut maker or a handbook table, not from habit.",
       false},
      {"ball-screw-brake",
       "A ball screw is not self-locking: a held load needs a brake sized for this torque, with the high "
       "efficiency value.",
       false},
      {"ball-screw-life",
       "L10 is a statistical life: one screw in ten fails sooner; shock loads, misalignment and poor "
       "lubrication shorten it.",
       false},
      {"critical-speed",
       "A screw run near its critical speed whips: keep the working speed at most about 80 % of it, with the "
       "longest unsupported length of the stroke.",
       false},
      {"thread-stripping",
       "Stripping is sudden: the thread shears along its whole engagement at once. Check the softer part on "
       "its own side: a bronze nut strips before a steel screw.",
       false},
      {"ball-screw-static",
       "A load above C0a dents the raceways (brinelling): the peak of a crash or an emergency stop "
       "counts, not the mean load.",
       false},
      {"brake-dynamic",
       "A brake that holds the static load may not stop a falling one: check the dynamic braking "
       "torque and the stopping distance too.",
       false},
      {"peak-torque",
       "Size the peak torque for the worst case: the highest load, the shortest ramp, and friction "
       "at its high value.",
       false},
      {"rms-torque",
       "The RMS torque judges heating over a cycle much shorter than the motor's thermal time "
       "constant; a long peak heats the winding on its own.",
       false},
  };
  return c;
}

const Caution* findCaution(std::string_view id) {
  for (const Caution& c : cautionCatalogue())
    if (c.id == id) return &c;
  return nullptr;
}

std::vector<const Caution*> cautionsForFunctionText(std::string_view text) {
  // Each caution text of the library (functions/*.cc), as written there, and
  // the entries it stands for. A text not listed maps to nothing, which the
  // catalogue test reports.
  struct Mapping {
    std::string_view text;  // its length known, so another text is passed over at once
    std::vector<const char*> ids;
  };
  static const std::vector<Mapping> map = {
      {"Friction varies widely: size motors and brakes with the high value and check holding with the low "
       "one.",
       {"friction"}},
      {"Self-locking is no brake: vibration and low friction can back-drive the screw; provide a brake where "
       "a load is held.",
       {"self-locking"}},
      {"A self-locking worm is no brake: vibration, running friction and wear can let it back-drive; provide "
       "a brake where a load is held.",
       {"self-locking"}},
      {"Long screws buckle: these loads assume a straight screw loaded on its axis; take the end-condition "
       "constant conservatively and apply a design factor.",
       {"buckling"}},
      {"Long screws buckle: these loads assume a straight screw loaded on its axis; take the end-condition "
       "constant conservatively and apply a design factor. Below the transition slenderness Euler's load is "
       "unsafe.",
       {"buckling", "euler-range"}},
      {"Use the starting value for the breakaway torque of a motor and the running value, at its low end, "
       "for "
       "self-locking.",
       {"starting-friction"}},
      {"Collar friction is often the larger part of the torque: use the high value for motor sizing; it also "
       "helps hold the load, but do not count on it for self-locking.",
       {"collar-friction"}},
      {"Size the motor for starting friction and for the worst load case, not the running average.",
       {"motor-sizing"}},
      {"A stress is half a check: compare it with an allowable value under the applicable code, and check "
       "fatigue where the load cycles.",
       {"stress"}},
      {"Allowable bearing pressure and pV depend on the nut material, lubrication and duty: take them from "
       "the nut maker or a handbook table, not from habit.",
       {"nut-material"}},
      {"A ball screw is not self-locking: a held load needs a brake sized for this torque, with the high "
       "efficiency value.",
       {"ball-screw-brake"}},
      {"L10 is a statistical life: one screw in ten fails sooner; shock loads, misalignment and poor "
       "lubrication shorten it.",
       {"ball-screw-life"}},
      {"A screw run near its critical speed whips: keep the working speed at most about 80 % of it, with the "
       "longest unsupported length of the stroke.",
       {"critical-speed"}},
      {"Stripping is sudden: the thread shears along its whole engagement at once. Check the softer part on "
       "its own side: a bronze nut strips before a steel screw.",
       {"thread-stripping"}},
      {"A rating life is statistical: shock loads, misalignment and poor lubrication shorten it.",
       {"ball-screw-life"}},
      {"A worm that locks at standstill may not lock when running (friction falls with sliding "
       "speed) or under vibration: a held load needs a brake.",
       {"self-locking"}},
      {"A load above C0a dents the raceways (brinelling): the peak of a crash or an emergency stop "
       "counts, not the mean load.",
       {"ball-screw-static"}},
      {"A brake that holds the static load may not stop a falling one: check the dynamic braking "
       "torque and the stopping distance too.",
       {"brake-dynamic"}},
      {"Size the peak torque for the worst case: the highest load, the shortest ramp, and friction "
       "at its high value.",
       {"peak-torque"}},
      {"The RMS torque judges heating over a cycle much shorter than the motor's thermal time "
       "constant; a long peak heats the winding on its own.",
       {"rms-torque"}},
  };
  std::vector<const Caution*> out;
  for (const Mapping& m : map) {
    if (text != m.text) continue;
    for (const char* id : m.ids)
      if (const Caution* c = findCaution(id)) out.push_back(c);
  }
  return out;
}

}  // namespace calctrail
