" calctrail worksheets: *.calc files (docs/editors/README.md).
autocmd BufRead,BufNewFile *.calc setfiletype calc
