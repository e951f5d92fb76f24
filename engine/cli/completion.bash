# bash completion for calctrail: commands, options, --format values and .calc files.
# Installed as share/bash-completion/completions/calctrail; or source it from your .bashrc.
#
# The commands, options and formats are read from the program's own --help
# (CLI11's layout), so this file never lists them a second time and a new
# command or format completes as soon as the program has it. Only bash
# builtins are used: the bash-completion package is not needed.

# The help of "$1 $2" (or of "$1" alone) in _calctrail_help_text, cached for
# the shell's life: call it in the completion function itself, not in $(...).
declare -gA _calctrail_help_cache 2>/dev/null || declare -A _calctrail_help_cache
_calctrail_load_help() {
  local key="${1}|${2}"
  if [[ -z ${_calctrail_help_cache[$key]+set} ]]; then
    _calctrail_help_cache[$key]=$("$1" ${2:+"$2"} --help 2>/dev/null)
  fi
  _calctrail_help_text=${_calctrail_help_cache[$key]}
}

# The subcommand names: the "  NAME   description" lines under "Subcommands:".
_calctrail_commands() {
  local line in=""
  while IFS= read -r line; do
    if [[ $line == Subcommands:* ]]; then
      in=1
    elif [[ -n $in && $line =~ ^\ \ ([a-z][a-z0-9_-]*) ]]; then
      printf '%s\n' "${BASH_REMATCH[1]}"
    elif [[ -n $in && -z $line ]]; then
      break
    fi
  done <<<"$_calctrail_help_text"
}

# One line per option in the loaded help: "NAMES|TYPE", e.g.
# "-f,--format|TEXT:{text,md}=text", or "--check|" for a flag.
_calctrail_options() {
  local line names type
  while IFS= read -r line; do
    if [[ $line =~ ^\ \ (-[^ ]+)\ *([^ ]*) ]]; then
      names=${BASH_REMATCH[1]} type=${BASH_REMATCH[2]}
      [[ $type == *: ]] && type=""   # "Excludes:", "Needs:": a flag
      printf '%s|%s\n' "$names" "$type"
    fi
  done <<<"$_calctrail_help_text"
}

_calctrail() {
  local prog=$1 cur=${COMP_WORDS[COMP_CWORD]} prev="" cmd="" i
  ((COMP_CWORD > 0)) && prev=${COMP_WORDS[COMP_CWORD - 1]}
  COMPREPLY=()
  local commands
  _calctrail_load_help "$prog" ""
  commands=$(_calctrail_commands)
  for ((i = 1; i < COMP_CWORD; i++)); do
    if [[ $'\n'$commands$'\n' == *$'\n'"${COMP_WORDS[i]}"$'\n'* ]]; then
      cmd=${COMP_WORDS[i]}
      break
    fi
  done

  if [[ -z $cmd ]]; then
    if [[ $cur == -* ]]; then
      COMPREPLY=($(compgen -W "--help --version" -- "$cur"))
    else
      COMPREPLY=($(compgen -W "$commands" -- "$cur"))
    fi
    return 0
  fi

  # The value of the option just before the cursor: its {a,b,c} choices, a
  # file for an output, nothing to offer for a number or NAME=VALUE.
  local names type
  _calctrail_load_help "$prog" "$cmd"
  if [[ $prev == -* ]]; then
    while IFS='|' read -r names type; do
      [[ ,$names, == *,"$prev",* && -n $type ]] || continue
      if [[ $type =~ \{([^}]*)\} ]]; then
        COMPREPLY=($(compgen -W "${BASH_REMATCH[1]//,/ }" -- "$cur"))
      elif [[ $prev == -o || $prev == --output ]]; then
        compopt -o filenames 2>/dev/null
        COMPREPLY=($(compgen -f -- "$cur"))
      fi
      return 0
    done < <(_calctrail_options)
  fi

  if [[ $cur == -* ]]; then
    local all=""
    while IFS='|' read -r names type; do
      all+=" ${names//,/ }"
    done < <(_calctrail_options)
    COMPREPLY=($(compgen -W "$all" -- "$cur"))
    return 0
  fi

  case $cmd in
    functions)
      # Function names: the "  name(args)" lines of the listing.
      local fns
      fns=$("$prog" functions 2>/dev/null | sed -n 's/^  \([a-z_][a-z0-9_]*\)(.*/\1/p')
      COMPREPLY=($(compgen -W "$fns" -- "$cur"))
      ;;
    units) ;;
    *)
      # Worksheets, and folders to reach them.
      compopt -o filenames 2>/dev/null
      local IFS=$'\n'
      COMPREPLY=($(compgen -d -- "$cur") $(compgen -f -X '!*.calc' -- "$cur"))
      ;;
  esac
  return 0
}

complete -F _calctrail calctrail
