// The compact name index of a sheet, the operand list of an expression node
// and the shared name lexer: the containers and helpers that replaced
// std::unordered_map, std::vector and three copies (docs/performance.md).
#include <catch2/catch.hpp>

#include <string>
#include <vector>

#include "engine/sheet/expr.h"
#include "engine/sheet/name_index.h"
#include "engine/sheet/name_lexer.h"

using namespace calctrail;

TEST_CASE("the name index finds every name it holds, through growth, and no other", "[sheet][name_index]") {
  std::vector<std::string> names;
  NameIndex index;
  const auto name_at = [&](int at) -> const std::string& { return names[static_cast<size_t>(at)]; };
  CHECK(index.find("x", name_at) == -1);  // empty: no table yet
  for (int i = 0; i < 20000; ++i) {
    names.push_back("q_" + std::to_string(i));
    REQUIRE(index.find(names.back(), name_at) == -1);
    index.insert(names.back(), i);
  }
  CHECK(index.size() == 20000);
  for (int i = 0; i < 20000; ++i) CHECK(index.find(names[static_cast<size_t>(i)], name_at) == i);
  CHECK(index.find("q_20000", name_at) == -1);
  CHECK(index.find("q_", name_at) == -1);
  CHECK(index.find("", name_at) == -1);

  NameIndex reserved;
  reserved.reserve(3);
  reserved.insert(names[7], 7);
  CHECK(reserved.find("q_7", name_at) == 7);
  CHECK(reserved.find("q_8", name_at) == -1);
}

TEST_CASE("an expression's operand list keeps its nodes in order through growth and moves",
          "[sheet][name_index]") {
  ExprList list;
  CHECK(list.empty());
  for (int i = 0; i < 9; ++i) {
    auto e = std::make_unique<Expr>();
    e->number = i;
    list.push_back(std::move(e));
  }
  REQUIRE(list.size() == 9);
  for (size_t i = 0; i < list.size(); ++i) CHECK(list[i]->number == static_cast<double>(i));
  ExprList moved(std::move(list));
  CHECK(list.empty());  // a moved-from list is empty, by its move constructor
  CHECK(moved.size() == 9);
  CHECK(moved.back()->number == 8.0);
  double sum = 0;
  for (const ExprPtr& e : moved) sum += e->number;
  CHECK(sum == 36.0);
  moved.clear();
  CHECK(moved.empty());
}

TEST_CASE("the name lexer: a letter first, then letters, digits, _ and Greek letters, and dotted instance names",
          "[sheet][name_index]") {
  CHECK(nameEnd("T_raise2 = 1", 0) == 8);
  CHECK(nameEnd("2d", 0) == 0);  // a digit does not start a name
  CHECK(nameEnd("_x", 0) == 0);
  CHECK(nameEnd("\xCE\xB7_worm*2", 0) == 7);  // eta (2 bytes) then _worm
  CHECK(nameEnd("left.T_raise + 1", 0) == 4);
  CHECK(nameEnd("left.T_raise + 1", 0, /*dotted=*/true) == 12);
  CHECK(nameEnd("left.2", 0, true) == 4);  // a dot continues a name only before a name start
  CHECK(isNameStart("\xCE\xB1", 0));
  CHECK_FALSE(isNameStart("9", 0));
  CHECK_FALSE(isNameStart("", 0));
}
