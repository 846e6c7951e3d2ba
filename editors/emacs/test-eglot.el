;;; test-eglot.el --- The Emacs set-up against the real language server  -*- lexical-binding: t; -*-

;; Run as: emacs -Q --batch -l editors/emacs/test-eglot.el
;; with `windingnotes' on the PATH.  It opens a copy of an example through `auto-mode-alist',
;; lets eglot find the server through `eglot-server-programs' as a user's set-up would, and checks
;; colouring, diagnostics, hover and a live update after an edit.  Prints one line a check and
;; "N passed, N failed"; exits 1 when a check fails.

;;; Code:

(require 'package)
(add-to-list 'package-directory-list "/usr/share/emacs/site-lisp/elpa")
(package-initialize)
(require 'eglot)
(require 'flymake)

(defconst test-eglot--here (file-name-directory (or load-file-name buffer-file-name)))
(load (expand-file-name "windingnotes-mode.el" test-eglot--here) nil t)

(defvar test-eglot--passed 0)
(defvar test-eglot--failed 0)

(defun test-eglot--check (name ok &optional detail)
  "Count check NAME as passed when OK; print DETAIL when it failed."
  (if ok (setq test-eglot--passed (1+ test-eglot--passed))
    (setq test-eglot--failed (1+ test-eglot--failed)))
  (princ (format "%s %s%s\n" (if ok "ok  " "FAIL") name (if (and (not ok) detail) (format ": %S" detail) ""))))

(defun test-eglot--wait (predicate seconds)
  "Let the server's messages in until PREDICATE holds or SECONDS pass; return its value."
  (let ((deadline (+ (float-time) seconds)) value)
    (while (and (not (setq value (funcall predicate))) (< (float-time) deadline))
      (accept-process-output nil 0.1))
    value))

(defun test-eglot--codes ()
  "The diagnostic codes flymake shows, as the server sends them in brackets."
  (mapcar (lambda (d) (and (string-match "\\[\\([a-z-]+\\)\\]" (flymake-diagnostic-text d))
                           (match-string 1 (flymake-diagnostic-text d))))
          (flymake-diagnostics)))

(let* ((folder (make-temp-file "windingnotes-eglot" t))
       (file (expand-file-name "mill.wn" folder)))
  (unwind-protect
      (progn
        (copy-file (expand-file-name "../../examples/alder-creek-boost.wn" test-eglot--here) file)
        (with-temp-buffer
          (insert "\nexpect voltage X1 H2 between 1 V and 2 V\nwinding Q9 on K9 turns 5 from A7 to B7\n")
          (append-to-file (point-min) (point-max) file))
        (find-file file)
        (test-eglot--check "*.wn opens in windingnotes-mode" (eq major-mode 'windingnotes-mode) major-mode)
        (font-lock-ensure)
        (goto-char (point-min))
        (re-search-forward "^core")
        (test-eglot--check "statement keywords are coloured"
                           (eq (get-text-property (match-beginning 0) 'face) 'font-lock-keyword-face))
        (let ((contact (nth 3 (eglot--guess-contact))))
          (test-eglot--check "eglot runs windingnotes lsp from the PATH"
                             (equal contact (list (executable-find "windingnotes") "lsp")) contact)
          (apply #'eglot (eglot--guess-contact)))
        (let ((server (eglot-current-server)))
          (test-eglot--check "the server is windingnotes"
                             (equal (plist-get (and server (eglot--server-info server)) :name) "windingnotes"))
          ;; A file with an error is not solved: its checks neither fail nor pass.
          (let ((codes (test-eglot--wait (lambda () (let ((c (test-eglot--codes))) (and (member "unknown-name" c) c))) 60)))
            (test-eglot--check "diagnostics arrive with their codes"
                               (and (member "unknown-name" codes) (not (member "expect-failed" codes))) codes))
          (goto-char (point-min))
          (search-forward "on K9")
          (replace-match "on K1")
          ;; An idle timer sends the change in an interactive Emacs; batch Emacs has no idle time.
          (eglot--signal-textDocument/didChange)
          (test-eglot--check "an edit updates the diagnostics"
                             (test-eglot--wait (lambda () (let ((c (test-eglot--codes))) (and (not (member "unknown-name" c)) (member "expect-failed" c)))) 60)
                             (test-eglot--codes))
          (goto-char (point-min))
          (search-forward "winding LV")
          (backward-char 1)
          (let* ((hover (jsonrpc-request server :textDocument/hover (eglot--TextDocumentPositionParams)))
                 (text (format "%s" (plist-get (plist-get hover :contents) :value))))
            (test-eglot--check "hover on a winding gives its turns and current" (string-match-p "24 turns" text) text))
          (eglot-shutdown server)))
    (delete-directory folder t)))

(princ (format "%d passed, %d failed\n" test-eglot--passed test-eglot--failed))
(kill-emacs (if (and (> test-eglot--passed 0) (= test-eglot--failed 0)) 0 1))

;;; test-eglot.el ends here
