" Vim syntax file
" Language:    calctrail worksheet (*.calc)
" Description: docs/format.md; the same kinds of line and token as calc.tmLanguage.json.
" Setup:       docs/editors/README.md
if exists('b:current_syntax')
  finish
endif
let s:cpo_save = &cpo
set cpo&vim

syntax case match
" A name: a letter (ASCII or Greek), then letters, digits or _; instances add dotted parts.
let s:name = '[A-Za-z\u0391-\u03a9\u03b1-\u03c9][A-Za-z0-9_\u0391-\u03a9\u03b1-\u03c9]*'
let s:dotted = s:name . '\%(\.' . s:name . '\)*'

" Tokens of formulas and conditions. When two items start at one place, the
" one defined later wins, so the line kinds below come after these.
syntax match calcDescription /#.*$/ contains=@Spell
syntax match calcOperator /[-+*\/^<>=,·×²³≤≥]/
syntax match calcBracketUnit /\[[^\]#]*\]/
execute 'syntax match calcVariable /' . s:dotted . '/'
syntax keyword calcPi pi
execute 'syntax match calcFunction /' . s:name . '\ze\s*(/'
syntax match calcBuiltin
      \ /\<\%(sqrt\|sin\|cos\|tan\|asin\|acos\|atan2\|atan\|exp\|ln\|log10\|abs\|min\|max\)\ze\s*(/
" A number, and the one unit name written right after it (`20 kN`, `95 %`, `30 °C`).
syntax match calcNumber /\%(\<\d\+\%(\.\d*\)\=\|\.\d\+\)\%([eE][-+]\=\d\+\)\=/ nextgroup=calcUnit skipwhite
syntax match calcUnit
      \ /%\|[A-Za-z°µ\u0391-\u03a9\u03b1-\u03c9℃℉][A-Za-z0-9°µ\u0391-\u03a9\u03b1-\u03c9℃℉]*/ contained

" Kinds of line, by their first word (docs/format.md, "Lines").
syntax match calcSection /^\s*\zssection\%(\s.*\)\=$/ contains=calcSectionKey
syntax match calcSectionKey /^\s*\zssection/ contained
syntax match calcNote /^\s*\zsnote\%(\s.*\)\=$/ contains=calcNoteKey
syntax match calcNoteKey /^\s*\zsnote/ contained
syntax match calcMeta /^\s*\zs\%(title\|project\|calc\|revision\|prepared\|checked\|date\|units\)\s*:.*$/
      \ contains=calcMetaKey
syntax match calcMetaKey
      \ /^\s*\zs\%(title\|project\|calc\|revision\|prepared\|checked\|date\|units\)\ze\s*:/ contained
execute 'syntax match calcCheckKey /^\s*\zscheck\ze\s\+' . s:name . '\s*:/ nextgroup=calcCheckName skipwhite'
execute 'syntax match calcCheckName /' . s:name . '/ contained'
execute 'syntax match calcCaseKey /^\s*\zscase\ze\s\+' . s:name . '\s*:/ nextgroup=calcCaseName skipwhite'
execute 'syntax match calcCaseName /' . s:name . '/ contained'
" `study NAME: sweep X = ...`, `study NAME: capacity X = ...` and `study NAME: pick X from ...`, with the words of their clauses.
execute 'syntax match calcStudyKey /^\s*\zsstudy\ze\s\+' . s:name . '\s*:/ nextgroup=calcStudyName skipwhite'
execute 'syntax match calcStudyName /' . s:name . '/ contained'
" The count of `8 points`, so that `points` is a word of the line, not a unit.
syntax match calcStudyPoints /\%(^\s*study\s.*\)\@<=\<\d\+\ze\s\+points\>/ nextgroup=calcStudyWord skipwhite
syntax match calcStudyWord /\%(^\s*study\s.*\)\@<=\<\%(sweep\|capacity\|pick\|from\|points\|log-spaced\|show\|largest\|smallest\)\>/
execute 'syntax match calcParamKey /^\s*\zsparam\ze\s\+' . s:name . '/ nextgroup=calcParamName skipwhite'
execute 'syntax match calcParamName /' . s:name . '/ contained'
syntax match calcUseKey /^\s*\zsuse\ze\s/ nextgroup=calcUsePath skipwhite
syntax match calcUsePath /"[^"]*"\|[^ \t#"]\+/ contained nextgroup=calcAsKey skipwhite
syntax match calcAsKey /\<as\>/ contained nextgroup=calcInstance skipwhite
execute 'syntax match calcInstance /' . s:name . '/ contained nextgroup=calcWithKey skipwhite'
syntax match calcWithKey /\<with\>/ contained
" A name followed by `=` or `[` is a definition, whatever the name (even `note`).
execute 'syntax match calcDefinition /^\s*\zs' . s:name . '\ze\s*\%(\[[^\]#]*\]\)\=\s*=/'
syntax match calcComment /^\s*\zs#.*$/ contains=@Spell

highlight default link calcKeyword Keyword
highlight default link calcSectionKey calcKeyword
highlight default link calcNoteKey calcKeyword
highlight default link calcCheckKey calcKeyword
highlight default link calcCaseKey calcKeyword
highlight default link calcParamKey calcKeyword
highlight default link calcStudyKey calcKeyword
highlight default link calcStudyWord calcKeyword
highlight default link calcStudyPoints Number
highlight default link calcUseKey calcKeyword
highlight default link calcAsKey calcKeyword
highlight default link calcWithKey calcKeyword
highlight default link calcSection Title
highlight default link calcNote String
highlight default link calcMeta String
highlight default link calcMetaKey PreProc
highlight default link calcCheckName Label
highlight default link calcCaseName Label
highlight default link calcStudyName Label
highlight default link calcParamName Identifier
highlight default link calcUsePath String
highlight default link calcInstance Identifier
highlight default link calcDefinition Identifier
highlight default link calcVariable Normal
highlight default link calcNumber Number
highlight default link calcUnit Type
highlight default link calcBracketUnit Type
highlight default link calcFunction Function
highlight default link calcBuiltin Function
highlight default link calcPi Constant
highlight default link calcOperator Operator
highlight default link calcDescription Comment
highlight default link calcComment Comment

let b:current_syntax = 'calc'
let &cpo = s:cpo_save
unlet s:cpo_save
