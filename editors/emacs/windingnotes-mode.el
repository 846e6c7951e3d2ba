;;; windingnotes-mode.el --- WindingNotes calculation files, with the language server through eglot  -*- lexical-binding: t; -*-

;; Version: 0.1.0
;; Package-Requires: ((emacs "28.1"))
;; Keywords: languages
;; SPDX-License-Identifier: MIT

;;; Commentary:

;; A major mode for WindingNotes calculation files (*.wn): colouring of statements, clauses,
;; names, numbers and their units, comments and continued lines, and the `windingnotes lsp'
;; language server through eglot (built into Emacs 29; the eglot package on Emacs 28) for
;; diagnostics, results, hover, completion and navigation.  See README.md beside this file.

;;; Code:

(defgroup windingnotes nil
  "WindingNotes calculation files."
  :group 'languages
  :prefix "windingnotes-")

(defcustom windingnotes-server-command '("windingnotes" "lsp")
  "The language server and its arguments.
A bare program name is looked up on `exec-path' and then in
~/.dotnet/tools, where `dotnet tool install --global' puts it."
  :type '(repeat string))

;; The keyword lists follow src/WindingNotes/Syntax/Grammar.cs; a test in
;; tests/WindingNotes.Tests/Editors keeps them equal to its keyword table.
(defconst windingnotes-statement-keywords
  '("frequency" "temperature" "let" "core" "winding" "tap" "brush" "impedance" "no-load"
    "join" "ground" "supply" "load" "fault" "sweep" "expect" "fail-on" "acknowledge"
    "three-phase-supply" "three-phase-load" "thermal" "load-cycle" "cycle-point"
    "capability" "tap-changer" "find" "fault-study" "bus-fault" "unit-pair")
  "Words that start a statement.")

(defconst windingnotes-clause-keywords
  '("rating" "area" "flux-limit" "on" "turns" "rated" "rated-current" "from" "to"
    "resistance" "at" "conductor" "AWG" "range" "current-limit" "xr" "base" "current" "loss"
    "fault-level" "power" "apparent" "pf" "model" "step" "points" "voltage" "loading" "flux"
    "efficiency" "regulation" "between" "and" "below" "above" "near" "within"
    "construction" "zero-sequence" "wye" "delta" "zigzag" "series" "ends" "neutral"
    "vector-group" "is" "sequence" "hot-spot" "top-oil" "loss-of-life" "cooling" "top-oil-rise"
    "hot-spot-gradient" "hot-spot-factor" "winding-gradient" "loss-ratio" "exponents"
    "time-constants" "k11" "k21" "k22" "paper" "of" "ambient" "method" "duty"
    "sets" "positions" "on-load" "off-circuit" "reversing" "follows" "regulate" "target"
    "bandwidth" "pt-ratio" "compensation" "line-current" "ct" "position" "clear-of-limits"
    "equals" "currents" "voltage-tolerance" "duration" "initial-temperature" "peak-method" "end-temperature" "earth-impedance"
    "nominal" "fault-current" "peak-current" "thermal-current" "earth-fault-factor" "in"
    "positive-sequence" "class" "winding-rise" "equivalent-aging" "peak-withstand" "peak-duty" "minimum-fault-level" "transformer-correction"
    "time-rating" "open-delta" "scott-t" "delta-output" "main-output" "teaser-output" "primary-winding" "secondary-winding"
    "series-bucking" "teaser-tap")
  "Words that start a clause or join its parts.")

(defconst windingnotes-option-keywords
  '("copper" "aluminium" "length" "mean-turn" "lagging" "leading"
    "constant-impedance" "constant-current" "constant-power"
    "loading-high" "flux-high" "overexcited" "brush-current-high" "connection-rating"
    "current-density-high" "caution-no-isolation" "caution-common-terminal"
    "caution-fuse-output" "caution-above-supply" "caution-fault-duty"
    "bank" "three-limb" "five-limb" "shell" "abc" "acb"
    "hot-spot-high" "top-oil-high" "cycle-current-high" "caution-hot-spot"
    "fault-duty-high" "regulator-current-high" "constant-load" "cycle-scale"
    "upgraded" "non-upgraded" "difference-equation" "exponential"
    "normal-cyclic" "long-time-emergency" "short-time-emergency"
    "equivalent-source" "as-loaded" "at-fault" "meshed" "equivalent-frequency" "maximum" "minimum" "maximum-and-minimum" "three-phase"
    "line-to-ground" "line-to-line" "double-line-to-ground")
  "Words chosen from a fixed set inside a clause.")

(defconst windingnotes-value-keywords '("angle" "sqrt")
  "Words with a fixed meaning inside values.")

(defface windingnotes-unit-face '((t :inherit font-lock-type-face))
  "Face for the unit after a number.")

(defface windingnotes-number-face '((t :inherit font-lock-constant-face))
  "Face for numbers and imaginary parts.")

(defconst windingnotes--keyword-set
  (let ((table (make-hash-table :test #'equal)))
    (dolist (word (append windingnotes-statement-keywords windingnotes-clause-keywords
                          windingnotes-option-keywords windingnotes-value-keywords))
      (puthash word t table))
    table))

(defun windingnotes--words (words)
  "A regexp for WORDS as whole words; hyphenated ones stay whole."
  (concat "\\_<" (regexp-opt (sort (copy-sequence words) (lambda (a b) (> (length a) (length b))))) "\\_>"))

(defconst windingnotes--number-regexp
  "\\_<\\(j?\\)\\([0-9][0-9_]*\\(?:\\.[0-9_]*\\)?\\|\\.[0-9][0-9_]*\\)\\(?:[eE][-+]?[0-9]+\\)?"
  "A number, or an imaginary part when it starts with j, as the lexer reads them.")

(defun windingnotes--match-unit (limit)
  "Find the next number before LIMIT and the unit after it.
A unit is any word after a number that is not a keyword, and `turns'
unless a number follows (then it is the clause), as the parser reads
it.  Group 1 is the number, group 2 the unit when there is one."
  (let (found)
    (while (and (not found) (re-search-forward windingnotes--number-regexp limit t))
      (let ((number-start (match-beginning 0))
            (number-end (match-end 0)))
        (save-excursion
          (goto-char number-end)
          (if (and (looking-at "[ \t]*\\(%\\|[[:alpha:]_°µΩ][[:alnum:]_°²³µΩ-]*\\)")
                   (let ((word (match-string 1)))
                     (if (equal word "turns")
                         (save-excursion (goto-char (match-end 1)) (not (looking-at "[ \t]*\\.?[0-9]")))
                       (not (gethash word windingnotes--keyword-set)))))
              (set-match-data (list number-start (match-end 1) number-start number-end
                                    (match-beginning 1) (match-end 1)))
            (set-match-data (list number-start number-end number-start number-end))))
        (goto-char (match-end 0))
        (setq found t)))
    found))

(defconst windingnotes-font-lock-keywords
  `((,(concat "^[ \t]*\\(" (regexp-opt '("let")) "\\)\\_>[ \t]+\\([A-Za-z_][A-Za-z0-9_]*\\)")
     (2 font-lock-variable-name-face))
    (,(concat "^[ \t]*" (regexp-opt '("core" "winding" "tap" "brush" "supply" "load" "fault" "three-phase-supply" "three-phase-load" "tap-changer" "bus-fault" "unit-pair"))
              "\\_>[ \t]+\\([A-Za-z_][A-Za-z0-9_]*\\)")
     (1 font-lock-function-name-face))
    (windingnotes--match-unit (1 'windingnotes-number-face) (2 'windingnotes-unit-face nil t))
    (,(windingnotes--words (append windingnotes-statement-keywords windingnotes-clause-keywords))
     . font-lock-keyword-face)
    (,(windingnotes--words windingnotes-option-keywords) . font-lock-constant-face)
    (,(windingnotes--words '("angle")) . font-lock-keyword-face)
    (,(windingnotes--words '("sqrt")) . font-lock-builtin-face)
    ("+-\\|±" . font-lock-keyword-face)
    ("\\\\[ \t]*$" . font-lock-preprocessor-face))
  "Colouring for `windingnotes-mode'; the server's diagnostics come on top.")

(defvar windingnotes-mode-syntax-table
  (let ((table (make-syntax-table)))
    (modify-syntax-entry ?# "<" table)
    (modify-syntax-entry ?\n ">" table)
    (modify-syntax-entry ?_ "_" table)
    (modify-syntax-entry ?° "_" table)
    (modify-syntax-entry ?² "_" table)
    (modify-syntax-entry ?³ "_" table)
    (dolist (c '(?+ ?- ?* ?/ ?= ?: ?, ?%)) (modify-syntax-entry c "." table))
    table)
  "Syntax of *.wn files: # starts a comment, - is an operator.
Hyphenated keywords such as flux-limit are matched whole by regexp.")

;;;###autoload
(define-derived-mode windingnotes-mode prog-mode "WindingNotes"
  "Major mode for WindingNotes calculation files (*.wn)."
  (setq-local comment-start "# ")
  (setq-local comment-start-skip "#+[ \t]*")
  (setq-local font-lock-defaults '(windingnotes-font-lock-keywords)))

;;;###autoload
(add-to-list 'auto-mode-alist '("\\.wn\\'" . windingnotes-mode))

(defun windingnotes-server-contact (&optional _interactive _project)
  "The command eglot runs for `windingnotes-mode'.
It is `windingnotes-server-command' with the program found."
  (let* ((program (car windingnotes-server-command))
         (tool (expand-file-name program "~/.dotnet/tools")))
    (cons (cond ((file-name-absolute-p program) program)
                ((executable-find program))
                ((file-executable-p tool) tool)
                (t program))
          (cdr windingnotes-server-command))))

(defvar eglot-server-programs)

;;;###autoload
(with-eval-after-load 'eglot
  (add-to-list 'eglot-server-programs '(windingnotes-mode . windingnotes-server-contact)))

(provide 'windingnotes-mode)

;;; windingnotes-mode.el ends here
