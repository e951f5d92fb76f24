// The text of a double at full precision, for formats that machines read
// back (JSON, CSV): the shortest text that reads back to the same double.
// Human formats round instead (engine/report/number_format.h).
#pragma once

#include <string>

namespace calctrail {

// "0.1", "12000", "-0", "1e-300"; "inf", "-inf" and "nan" for the rest
// (JSON writes those as null before it gets here).
std::string formatExact(double value);

}  // namespace calctrail
