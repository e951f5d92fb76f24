// What the browser tests share: finding the outside programs they use, and
// printing an HTML file to PDF with headless Chromium as a user would.
#pragma once

#include <string>

namespace calctrail::test {

// The program is on PATH (chromium, pdftotext, pdftoppm, pdfinfo).
bool have(const std::string& program);

std::string replaceAll(std::string s, const std::string& from, const std::string& to);

// Prints `html` to `pdf` with headless Chromium: a fresh profile in `dir`, no
// network, no first-run or background work, and no page headers of
// Chromium's own (they come from the document's @page rules). Its output goes
// to DIR/chromium.log. Returns the exit status (0 when printed).
int printToPdf(const std::string& html, const std::string& pdf, const std::string& dir);

}  // namespace calctrail::test
