#include "engine/study/series.h"

#include <stdexcept>

#include "engine/units/unit_parser.h"
#include "functions/series_tables.h"

namespace calctrail {

namespace {

Unit unitOf(const char* text) {
  Unit u;
  UnitError err;
  if (!parseUnit(text, &u, &err)) throw std::logic_error(std::string("series unit `") + text + "`");
  return u;
}

}  // namespace

const std::vector<StudySeries>& studySeries() {
  static const std::vector<StudySeries> all = {
      {"trapezoidal", "ISO 2904 metric trapezoidal nominal diameters", unitOf("mm"),
       &fn::trapezoidalDiameters()},
      {"acme", "ASME B1.5 general-purpose Acme nominal diameters", unitOf("in"), &fn::acmeDiameters()},
      {"motor_outputs", "rated outputs of IEC induction motors", unitOf("kW"), &fn::ratedMotorOutputs()},
  };
  return all;
}

const StudySeries* findSeries(const std::string& name) {
  for (const StudySeries& s : studySeries())
    if (s.name == name) return &s;
  return nullptr;
}

}  // namespace calctrail
