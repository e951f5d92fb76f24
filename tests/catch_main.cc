// The one translation unit that holds Catch2's runner (it is slow to compile).
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>
