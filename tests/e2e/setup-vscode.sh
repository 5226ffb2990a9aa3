#!/usr/bin/env bash
# Installs the browser-served VS Code that the end-to-end suite drives: code-server 4.100.3
# (VS Code 1.100.3, the last line that runs on Node 20) into a cache folder, with npm only.
# The browser (Debian's Chromium) and the build tools its native modules need come from
# scripts/install-test-prerequisites.sh (apt-get); the driver library (playwright-core) and the
# packager (vsce) are the project's own pinned dev dependencies.
#
# Idempotent: a stamp file marks a finished install and the script then exits in about a second.
# About two minutes on a fresh machine (most of it compiling native modules on two cores).
#
#   cache folder: $RECTILENS_E2E_CACHE, else ${XDG_CACHE_HOME:-~/.cache}/rectilens-e2e
#   the editor:   <cache>/code-server/node_modules/.bin/code-server
set -euo pipefail

CODE_SERVER_VERSION=4.100.3
NODE_GYP_VERSION=12.4.0 # what node-pty's install step calls through npx; pinned so npx never fetches "latest"
CACHE="${RECTILENS_E2E_CACHE:-${XDG_CACHE_HOME:-$HOME/.cache}/rectilens-e2e}"
HOST="$CACHE/code-server"
PACKAGE="$HOST/node_modules/code-server"
VSCODE="$PACKAGE/lib/vscode"
STAMP="$HOST/.installed-$CODE_SERVER_VERSION"
LOGS="$CACHE/logs"

started=$(date +%s)
say() { echo "[e2e setup +$(( $(date +%s) - started ))s] $*"; }
fail() { echo "[e2e setup] $*" >&2; exit 1; }
# Runs a step with its output in a log file; on failure shows the log's tail.
logged() {
  local log="$LOGS/$1.log"; shift
  "$@" >"$log" 2>&1 || { tail -40 "$log" >&2; fail "failed: $* (log: $log)"; }
}

export npm_config_audit=false npm_config_fund=false npm_config_update_notifier=false
# node-pty's install step runs `npx node-gyp`; with `yes=false` in a user's npmrc it would stop.
export npm_config_yes=true

editor_version() {
  XDG_DATA_HOME="$CACHE/xdg/data" XDG_CONFIG_HOME="$CACHE/xdg/config" \
    "$HOST/node_modules/.bin/code-server" --config /dev/null --version 2>/dev/null | head -1
}

if [ -f "$STAMP" ] && [ -x /usr/bin/chromium ] && editor_version >/dev/null; then
  say "code-server $CODE_SERVER_VERSION already installed in $HOST"
  exit 0
fi

for tool in chromium rg make python3; do
  command -v "$tool" >/dev/null || fail "$tool is missing: run scripts/install-test-prerequisites.sh (apt-get) first"
done
node_version="$(node -p process.versions.node)"
[ "${node_version%%.*}" = 20 ] || fail "code-server $CODE_SERVER_VERSION runs on Node 20; this is Node $node_version"
# Native modules compile against the installed headers; node-gyp must not try to download them.
[ -f /usr/include/node/node_version.h ] || fail "no Node headers in /usr/include/node (node-gyp would download them)"
export npm_config_nodedir=/usr

mkdir -p "$HOST" "$LOGS"
rm -f "$HOST"/.installed-*
[ -f "$HOST/package.json" ] || echo '{ "name": "rectilens-e2e-editor", "private": true }' >"$HOST/package.json"

if [ "$(node -p "try { require('$PACKAGE/package.json').version } catch { '' }")" != "$CODE_SERVER_VERSION" ]; then
  say "npm install code-server@$CODE_SERVER_VERSION (scripts off: its own install step downloads)"
  (cd "$HOST" && logged code-server npm install --ignore-scripts --save-exact "code-server@$CODE_SERVER_VERSION")
fi

if ! (cd "$HOST" && node -e "require('argon2')" >/dev/null 2>&1); then
  say "building argon2 from source"
  (cd "$HOST" && logged argon2 npm rebuild argon2 --foreground-scripts)
fi

# The editor's own dependencies, installed the way its install step would, except that the
# ripgrep package's download is replaced by Debian's rg: its install step is skipped when its
# bin/ folder is present.
if [ ! -d "$VSCODE/node_modules/node-pty" ]; then
  say "npm install the editor's dependencies (lib/vscode)"
  (cd "$VSCODE" && logged vscode-deps npm install --omit=dev --ignore-scripts)
fi
mkdir -p "$VSCODE/node_modules/@vscode/ripgrep/bin"
ln -sfn "$(command -v rg)" "$VSCODE/node_modules/@vscode/ripgrep/bin/rg"

native_modules_load() {
  (cd "$VSCODE" && node -e '
    for (const m of ["node-pty", "@vscode/spdlog", "native-watchdog", "kerberos", "@vscode/deviceid", "@parcel/watcher"])
      require("./node_modules/" + m);') >/dev/null 2>&1 \
    && [ -f "$VSCODE/node_modules/node-pty/build/Release/pty.node" ]
}
if ! native_modules_load; then
  GYP_PREFIX="$CACHE/node-gyp"
  if [ "$(node -p "try { require('$GYP_PREFIX/lib/node_modules/node-gyp/package.json').version } catch { '' }")" != "$NODE_GYP_VERSION" ]; then
    say "npm install node-gyp@$NODE_GYP_VERSION into a private prefix"
    logged node-gyp npm install -g --prefix "$GYP_PREFIX" "node-gyp@$NODE_GYP_VERSION"
  fi
  say "compiling the editor's native modules (node-pty, spdlog, kerberos, ...; about 40 s on 2 cores)"
  (cd "$VSCODE" && npm_config_prefix="$GYP_PREFIX" logged vscode-native npm rebuild --foreground-scripts)
  native_modules_load || fail "the editor's native modules do not load after compiling"
fi
# The links the editor's install step would make.
ln -sfn node_modules "$VSCODE/node_modules.asar"
ln -sfn code-linux.sh "$VSCODE/bin/remote-cli/code-server"
ln -sfn browser-linux.sh "$VSCODE/bin/helpers/browser.sh"

if [ ! -f "$VSCODE/extensions/node_modules/typescript/lib/typescript.js" ]; then
  say "npm install the built-in extensions' dependencies"
  (cd "$VSCODE/extensions" && logged vscode-extensions npm install --omit=dev)
fi

version="$(editor_version)" || fail "code-server does not start"
touch "$STAMP"
say "done: code-server $version in $HOST ($(du -sh "$HOST" | cut -f1))"
