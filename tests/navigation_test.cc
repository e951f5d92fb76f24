// engine/lsp/navigation: the names a rename accepts are the names the
// worksheet's own lexer reads (engine/sheet/name_lexer.h, docs/format.md).
#include "engine/lsp/navigation.h"

#include <catch2/catch.hpp>

using namespace calctrail;

TEST_CASE("navigation: a new name is a name exactly when the name lexer reads all of it", "[lsp][names]") {
  for (const char* name : {"d", "T_raise2", "x_0", "\xCE\xB7_worm", "\xCE\xB1", "F\xCE\xB1"}) {  // eta, alpha
    INFO(name);
    CHECK(lsp::isValidName(name));
  }
  for (const char* name : {"", "2x", "_x", "a b", "a-b", "left.T_raise",  // a dotted name is an instance's
                           "\xC2\xB5m",                                    // the micro sign is not mu
                           "\xCE",                                         // a cut-short Greek letter
                           "\xCE\x31",                                     // a lead byte before an ASCII digit
                           "a\xED\xA0\x80", "x\xFF"}) {                    // a surrogate, a byte never in UTF-8
    INFO(name);
    CHECK_FALSE(lsp::isValidName(name));
  }
}
