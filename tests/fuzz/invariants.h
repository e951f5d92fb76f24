// What every input must satisfy, whatever its bytes. The libFuzzer targets
// (tests/fuzz/*_fuzzer.cc) and the regression test
// (tests/fuzz_regressions_test.cc) share these, so a reproducer kept in
// tests/fuzz/regressions/ is held to exactly the property the fuzzer found
// broken. docs/fuzzing.md lists what each one asserts.
//
// Each returns "" when the property holds, otherwise what broke, in words
// that name the quantity, output format or line concerned.
#pragma once

#include <string>
#include <string_view>

namespace calctrail::fuzz {

// parseUnit on any bytes: a failure has a message and an offset inside the
// text; a success has a finite positive factor and a canonical spelling that
// reads back to the same unit and spells itself again.
std::string unitParserHolds(std::string_view bytes);

// Calculation::fromText, buildTrail and every renderer (text, Markdown,
// HTML, JSON): diagnostics in FILE:LINE:COL form; without errors every
// quantity and check has a finite value, every shown number is well formed
// and close to the value it stands for, no output holds `inf`, `nan` or a
// control byte, every output is UTF-8, and the JSON parses with the
// contract's fields at full precision.
std::string pipelineHolds(const std::string& bytes);

// calctrail fmt: a sheet that parses formats without error; the canonical
// text parses to the same statements, formulas and checks, calculates to the
// same bits, and formatting it again changes nothing.
std::string formatRoundTripHolds(const std::string& bytes);

// calctrail diff: two calculations of the same bytes give the same
// diagnostics and trail, and their diff reports nothing at all.
std::string selfDiffHolds(const std::string& bytes);

// A regression input may state its correct outcome on its first line,
// `# fuzz-expect: clean`, `# fuzz-expect: error [TEXT]` or
// `# fuzz-expect: diagnostic [TEXT]` (an error or a warning), TEXT being
// part of the message. Only the regression test reads this: a fuzzer could
// write the line into any input.
std::string expectationHolds(const std::string& bytes);

}  // namespace calctrail::fuzz
