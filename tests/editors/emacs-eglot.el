;;; emacs-eglot.el --- observes what the README's Emacs snippet did  -*- lexical-binding: t -*-
;;
;; Loaded after the README's snippet and the netlist, in a terminal frame, so that Emacs' command
;; loop runs as for a person: it runs `post-command-hook' once on entry, which is when
;; `eglot-ensure' connects, and the netlist's window lets flymake start.  Nothing here starts
;; eglot.  From a timer it waits for flymake's diagnostics from our server, asks eldoc for the
;; documentation at a word, writes a JSON file and leaves Emacs.  Arguments come from the
;; environment: RECTILENS_OUT (the JSON file), RECTILENS_HOVER_WORD (a word of the netlist).

(require 'json)
(require 'flymake)

(defconst rectilens-test-buffer (current-buffer))
(defconst rectilens-test-deadline (+ (float-time) 15))
(defvar rectilens-test-result nil)
(defvar rectilens-test-hover nil)

(defun rectilens-test-finish (&rest fields)
  (with-temp-file (getenv "RECTILENS_OUT")
    (insert (json-encode (append fields rectilens-test-result))))
  (kill-emacs 0))

(defun rectilens-test-diagnostic (diagnostic)
  "DIAGNOSTIC as flymake holds it: 0-based line and column, type, text, our code."
  (let ((beg (flymake-diagnostic-beg diagnostic))
        (lsp (cdr (assq 'eglot-lsp-diag (flymake-diagnostic-data diagnostic)))))
    (list :line (1- (line-number-at-pos beg))
          :col (save-excursion (goto-char beg) (current-column))
          :type (symbol-name (flymake-diagnostic-type diagnostic))
          :text (flymake-diagnostic-text diagnostic)
          :code (plist-get lsp :code))))

(defun rectilens-test-comment-lines ()
  "For each line, whether its end lies inside a comment by the major mode's syntax."
  (save-excursion
    (goto-char (point-min))
    (let (flags)
      (while (not (eobp))
        (end-of-line)
        (push (if (nth 4 (syntax-ppss)) t :json-false) flags)
        (forward-line 1))
      (vconcat (nreverse flags)))))

(defun rectilens-test-ask-eldoc ()
  "Ask every eldoc documentation function at point, as eldoc does, keeping what they answer."
  (run-hook-wrapped 'eldoc-documentation-functions
                    (lambda (fn)
                      (funcall fn (lambda (doc &rest _)
                                    (when (stringp doc) (push doc rectilens-test-hover))))
                      nil)))

(defun rectilens-test-step ()
  (condition-case err
      (with-current-buffer rectilens-test-buffer
        (cond
         ((> (float-time) rectilens-test-deadline)
          (rectilens-test-finish :error "timed out" :managed (and (bound-and-true-p eglot--managed-mode) t)))
         ((null rectilens-test-result)
          (when (flymake-diagnostics)
            (setq rectilens-test-result
                  (list :mode (symbol-name major-mode)
                        :comments (rectilens-test-comment-lines)
                        :diagnostics (vconcat (mapcar #'rectilens-test-diagnostic (flymake-diagnostics)))))
            (goto-char (point-min))
            (while (and (search-forward (getenv "RECTILENS_HOVER_WORD") nil t)
                        (save-excursion (beginning-of-line) (looking-at-p "[ \t]*\\*"))))
            (backward-char 1)
            (rectilens-test-ask-eldoc))
          (run-with-timer 0.05 nil #'rectilens-test-step))
         (rectilens-test-hover
          (rectilens-test-finish :hover (mapconcat #'substring-no-properties rectilens-test-hover "\n")))
         (t (run-with-timer 0.05 nil #'rectilens-test-step))))
    (error (rectilens-test-finish :error (format "%S" err)))))

(run-with-timer 0.05 nil #'rectilens-test-step)
