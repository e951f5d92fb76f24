// Errors and warnings with source positions, in the form editors and CI
// parse: FILE:LINE:COL: error: MESSAGE, then the source line and a caret.
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "engine/sheet/source_file.h"

namespace calctrail {

enum class Severity { Error, Warning };

// The step a problem belongs to, for the trail to flag it there: a
// position alone cannot say, since every instance of a template shares its lines.
struct DiagnosticSite {
  /// The quantity (into Sheet::quantities), or -1.
  int quantity = -1;
  /// The check (into Sheet::checks), or -1.
  int check = -1;
};

struct Diagnostic {
  Severity severity = Severity::Error;
  std::string path;
  int line = 0;     // 0 when the problem has no place in a file
  int column = 0;
  std::string message;
  std::string source_line;  // the line as written, for the caret display
  int caret_column = 0;     // 1-based code-point column of the caret
  int caret_width = 1;      // code points underlined
  DiagnosticSite site;      // the quantity or check it was found in, when known

  // "FILE:LINE:COL: error: MESSAGE" (no source line).
  std::string headline() const;
  // The headline, then the source line and a caret, each line ending in '\n'.
  std::string render() const;
};

class Diagnostics {
 public:
  // A problem at bytes [begin, end) of `file`.
  void error(const SourceFile& file, uint32_t begin, uint32_t end, const std::string& message);
  void warning(const SourceFile& file, uint32_t begin, uint32_t end, const std::string& message,
               DiagnosticSite site = {});
  // A problem with no source position (an unreadable file, a bad option).
  void error(const std::string& path, const std::string& message);
  // Messages and source lines are stored without control characters (each
  // becomes `?`), so that no diagnostic can drive the terminal it is shown on.
  void add(Diagnostic d);

  const std::vector<Diagnostic>& list() const { return list_; }
  bool hasErrors() const;
  int errorCount() const;
  int warningCount() const;
  // Sorted by file, line and column (stable for one position), so the output
  // reads top to bottom whatever order the stages found the problems in.
  void sort();

 private:
  void addAt(Severity s, const SourceFile& file, uint32_t begin, uint32_t end,
             const std::string& message, DiagnosticSite site = {});
  std::vector<Diagnostic> list_;
};

}  // namespace calctrail
