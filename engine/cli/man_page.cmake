# Writes the manual page calctrail.1.gz from the program's own help, so that
# the page never says anything the program does not: help2man reads
# `calctrail --help` and `--version`, and every subcommand listed under
# "Subcommands:" gets its `calctrail SUB --help` verbatim in COMMANDS.
#
#   cmake -DCALCTRAIL=path/to/calctrail -DHELP2MAN=help2man -DGZIP=gzip
#         -DOUT_DIR=dir -P man_page.cmake
foreach(var CALCTRAIL HELP2MAN GZIP OUT_DIR)
  if(NOT DEFINED ${var})
    message(FATAL_ERROR "man_page.cmake: -D${var}=... is required")
  endif()
endforeach()

# Roff reads a backslash as an escape and a line starting with . or ' as a
# request; a plain - may be set as a hyphen, and options must stay minus signs.
function(roff_escape text out)
  string(REPLACE "\\" "\\e" text "${text}")
  string(REPLACE "-" "\\-" text "${text}")
  string(REGEX REPLACE "(^|\n)([.'])" "\\1\\\\&\\2" text "${text}")
  set(${out} "${text}" PARENT_SCOPE)
endfunction()

execute_process(COMMAND ${CALCTRAIL} --help OUTPUT_VARIABLE main_help RESULT_VARIABLE rc)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "man_page.cmake: `${CALCTRAIL} --help` failed (${rc})")
endif()
# The subcommand block of CLI11's help: "  NAME   description" lines up to a blank line.
string(REGEX MATCH "\nSubcommands:\n([^\n]+\n)+" block "${main_help}")
string(REGEX MATCHALL "\n  [a-z][a-z0-9_-]*" names "${block}")
if(NOT names)
  message(FATAL_ERROR "man_page.cmake: no subcommands found in `calctrail --help`")
endif()

set(include_text "[COMMANDS]\nEach command's own \\fB\\-\\-help\\fR, as the program prints it.\n")
foreach(name ${names})
  string(STRIP "${name}" name)
  execute_process(COMMAND ${CALCTRAIL} ${name} --help OUTPUT_VARIABLE sub_help RESULT_VARIABLE rc)
  if(NOT rc EQUAL 0)
    message(FATAL_ERROR "man_page.cmake: `${CALCTRAIL} ${name} --help` failed (${rc})")
  endif()
  string(STRIP "${sub_help}" sub_help)
  roff_escape("${sub_help}" sub_help)
  string(APPEND include_text ".SS \"calctrail ${name}\"\n.nf\n${sub_help}\n.fi\n")
endforeach()
string(APPEND include_text
  "[FILES]\n"
  "Under the installation prefix (\\fI/usr\\fR for the Debian package):\n"
  ".TP\n.I share/calctrail/worksheets/\n"
  "Demo worksheets (and the template library, where there is one), to copy and adapt.\n"
  ".TP\n.I share/doc/calctrail/docs/\n"
  "The worksheet format (format.md), units, functions, reports, JSON schema, review workflow,\n"
  "and editor syntax files (editors/).\n")

file(WRITE "${OUT_DIR}/calctrail.h2m" "${include_text}")
execute_process(
  COMMAND ${HELP2MAN} --no-info --no-discard-stderr --section=1
          "--name=calculation worksheets for screw-driven machines, with an auditable trail"
          --include=${OUT_DIR}/calctrail.h2m --output=${OUT_DIR}/calctrail.1 ${CALCTRAIL}
  RESULT_VARIABLE rc)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "man_page.cmake: help2man failed (${rc})")
endif()
# Debian installs manual pages compressed; -n keeps the date out of the gzip header.
execute_process(COMMAND ${GZIP} -9nf ${OUT_DIR}/calctrail.1 -c
                OUTPUT_FILE ${OUT_DIR}/calctrail.1.gz RESULT_VARIABLE rc)
if(NOT rc EQUAL 0)
  message(FATAL_ERROR "man_page.cmake: gzip failed (${rc})")
endif()
