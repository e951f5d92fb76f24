// Parses one formula (or one side of a check) from a byte range of a
// worksheet. Hand-written recursive descent with a nesting limit, so no input
// can exhaust the stack. The first problem is reported and parsing stops:
// the worksheet parser then goes on with the next line.
#pragma once

#include <cstdint>
#include <string>
#include <string_view>

#include "engine/sheet/diagnostics.h"
#include "engine/sheet/expr.h"
#include "engine/sheet/sheet.h"
#include "engine/sheet/source_file.h"

namespace calctrail {

class ExprParser {
 public:
  ExprParser(const SourceFile& file, uint32_t begin, uint32_t end, Diagnostics* diags);

  // A whole expression filling the range, its nodes numbered (numberNodes); nullptr
  // after reporting an error.
  ExprPtr parseWhole();
  // A condition `EXPR op EXPR` filling the range, each side numbered from 0; false after
  // reporting an error.
  bool parseCondition(ExprPtr* lhs, Comparison* op, uint32_t* op_begin, ExprPtr* rhs);

  static constexpr int kMaxDepth = 128;
  static constexpr int kMaxOperations = 4096;  // bounds tree depth, so no recursion overflows

 private:
  ExprPtr parseSum();
  ExprPtr parseProduct();
  ExprPtr parseUnary();
  ExprPtr parsePower();
  ExprPtr parsePrimary();
  ExprPtr parseNumber();
  uint32_t scanLiteral(uint32_t at) const;
  uint32_t plainIntegerEnd(uint32_t at) const;
  uint32_t fractionEnd(uint32_t begin, uint32_t whole_end, std::string* text, double* value,
                       bool* mixed) const;
  bool rejectAmbiguousDivision(const Expr& lhs, uint32_t op, const Expr& rhs);
  bool parseUnitAfterNumber(Expr* number);
  bool rejectPowerAfterUnit(const Expr* number, uint32_t begin, std::string_view unit);
  bool rejectCompoundAfterUnit(const Expr* number, uint32_t begin, std::string_view unit);
  bool rejectControlChars();
  ExprPtr parseNameOrCall();

  void skipSpace();
  bool atEnd();
  char peek();
  bool isNameStart(uint32_t at) const;
  uint32_t scanName(uint32_t at) const;
  bool comparisonAhead(Comparison* op, uint32_t* length);
  void fail(uint32_t begin, uint32_t end, const std::string& message);
  void failUnexpected();

  const SourceFile& file_;
  std::string_view src_;
  uint32_t pos_, end_;
  Diagnostics* diags_;
  int depth_ = 0;
  int operations_ = 0;
  bool failed_ = false;
};

ExprPtr makeBinary(ExprKind kind, ExprPtr lhs, ExprPtr rhs);

}  // namespace calctrail
