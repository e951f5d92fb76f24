// The rows of the library's tables as its declarations quote them: a formula
// lists a series, a limit the sizes held. The declarations hold each of these
// texts as a constant, so that no table is formatted at start-up; the
// functions here build the same text from the table itself, and
// tests/functions_table_texts_test.cc checks that each constant is that text,
// so that a table and its quote cannot drift apart.
#pragma once

#include <string>

namespace calctrail::fn {

// functions/threads.cc
std::string acmeSeriesText();       // "1/4 (16), 5/16 (14), ...": acme_tpi's formula
std::string trapSeriesText();       // "Tr 8x1.5, Tr 9x2, ...": trap_pitch's formula
std::string trap7eHeldText();       // "d over 5.6 up to 11.2 mm with p = 1.5, 2 and 3 mm, ...": the 7e limits
std::string trap7eDeviationText();  // "-67 um for p = 1.5 mm, ...": trap_max_pitch_dia's formula
std::string trap7eToleranceText();  // "170, 190, 212 um for p = 1.5, 2, 3 mm (...); ...": trap_min_pitch_dia's
// functions/motors.cc
std::string ratedMotorText();  // "0.06, 0.09, ..., 1000 kW": standard_motor_power's formula

}  // namespace calctrail::fn
