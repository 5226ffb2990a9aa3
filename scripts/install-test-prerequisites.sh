#!/usr/bin/env bash
# Installs what the test suites need beyond npm's dev dependencies, once, and says what it does:
# from Debian (apt-get, as root or through sudo) Neovim, and Emacs with eglot (real editor clients
# that run the README's editor snippets, tests/editors), Chromium (screenshots, the HTML report,
# the VS Code run), ripgrep and the compilers for the browser-served VS Code's native modules;
# then that VS Code itself (tests/e2e/setup-vscode.sh, npm only). Idempotent: about a second when
# everything is there.
set -euo pipefail
cd "$(dirname "$0")/.."

export DEBIAN_FRONTEND=noninteractive
APT_PACKAGES=(neovim emacs-nox elpa-eglot chromium fonts-dejavu-core unzip curl ripgrep poppler-utils build-essential python3 libkrb5-dev strace)
missing=()
for p in "${APT_PACKAGES[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ "${#missing[@]}" -gt 0 ]; then
  SUDO=()
  [ "$(id -u)" = 0 ] || SUDO=(sudo)
  echo "[prerequisites] apt-get install ${missing[*]} (first run only; about a minute)"
  log="$(mktemp /tmp/rectilens-apt.XXXXXX.log)"
  { "${SUDO[@]}" apt-get update -qq && "${SUDO[@]}" apt-get install -y -q "${missing[@]}"; } >"$log" 2>&1 \
    || { tail -30 "$log" >&2; echo "[prerequisites] apt-get failed (log: $log)" >&2; exit 1; }
  rm -f "$log"
else
  echo "[prerequisites] Debian packages present"
fi

bash tests/e2e/setup-vscode.sh
