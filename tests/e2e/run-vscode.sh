#!/usr/bin/env bash
# Runs a playwright-core driver against the packaged extension in a real, browser-served VS Code:
# installs the .vsix into an isolated profile, serves the workspace on 127.0.0.1, runs
#   node <driver.js> <base-url> <workspace> <out-dir>
# and stops every process it started, by PID, whatever the outcome.
#
# Usage: bash tests/e2e/run-vscode.sh <extension.vsix> <workspace> <driver.js> <out-dir>
# Needs tests/e2e/setup-vscode.sh to have run (same cache folder).
set -euo pipefail

[ $# -eq 4 ] || { echo "usage: bash run-vscode.sh <extension.vsix> <workspace> <driver.js> <out-dir>" >&2; exit 2; }
VSIX="$(realpath "$1")"; WORKSPACE="$(realpath "$2")"; DRIVER="$(realpath "$3")"
OUT="$(realpath -m "$4")"; mkdir -p "$OUT"
CACHE="${RECTILENS_E2E_CACHE:-${XDG_CACHE_HOME:-$HOME/.cache}/rectilens-e2e}"
EDITOR_BIN="$CACHE/code-server/node_modules/.bin/code-server"
[ -x "$EDITOR_BIN" ] || { echo "no editor in $CACHE: run tests/e2e/setup-vscode.sh first" >&2; exit 2; }

# A short folder: the editor opens a unix socket inside it (paths are limited to 108 bytes).
RUN="$(mktemp -d /tmp/rle2e.XXXXXX)"
started=$(date +%s)
say() { echo "[e2e run +$(( $(date +%s) - started ))s] $*"; }

# Nothing of the user's own editor profile is read or written.
mkdir -p "$RUN"/{profile/User,extensions,xdg-config,xdg-data,xdg-cache}
export XDG_CONFIG_HOME="$RUN/xdg-config" XDG_DATA_HOME="$RUN/xdg-data" XDG_CACHE_HOME="$RUN/xdg-cache"
PORT="$(node -e 'const s = require("net").createServer().listen(0, "127.0.0.1", () => { console.log(s.address().port); s.close(); })')"
cat >"$RUN/config.yaml" <<YAML
bind-addr: 127.0.0.1:$PORT
auth: none
cert: false
disable-telemetry: true
disable-update-check: true
disable-workspace-trust: ${RECTILENS_E2E_NO_TRUST_PROMPT:-true}
disable-getting-started-override: true
YAML
cat >"$RUN/profile/User/settings.json" <<'JSON'
{
  "workbench.startupEditor": "none",
  "workbench.tips.enabled": false,
  "workbench.enableExperiments": false,
  "telemetry.telemetryLevel": "off",
  "extensions.autoCheckUpdates": false,
  "extensions.autoUpdate": false,
  "extensions.ignoreRecommendations": true,
  "update.mode": "none",
  "editor.inlayHints.enabled": "on",
  "editor.hover.delay": 100,
  "editor.minimap.enabled": false,
  "git.enabled": false,
  "window.restoreWindows": "none"
}
JSON
EDITOR_ARGS=(--config "$RUN/config.yaml" --user-data-dir "$RUN/profile" --extensions-dir "$RUN/extensions")

say "installing $(basename "$VSIX") into an isolated profile"
"$EDITOR_BIN" "${EDITOR_ARGS[@]}" --install-extension "$VSIX" --force >"$RUN/install.log" 2>&1 || { cat "$RUN/install.log" >&2; exit 1; }

EDITOR_PID=""
# Every descendant of a process, so that the extension host and language server go too.
descendants() {
  local p
  for p in $(ps -o pid= --ppid "$1" 2>/dev/null); do echo "$p"; descendants "$p"; done
}
stop_editor() {
  [ -n "$EDITOR_PID" ] || return 0
  local all p
  all="$EDITOR_PID $(descendants "$EDITOR_PID" | tr '\n' ' ')"
  kill -TERM "$EDITOR_PID" 2>/dev/null || true
  for _ in $(seq 50); do kill -0 "$EDITOR_PID" 2>/dev/null || break; sleep 0.2; done
  for p in $all; do kill -KILL "$p" 2>/dev/null || true; done
  EDITOR_PID=""
}
trap stop_editor EXIT
trap 'stop_editor; exit 130' INT TERM

say "serving $WORKSPACE on 127.0.0.1:$PORT"
"$EDITOR_BIN" "${EDITOR_ARGS[@]}" "$WORKSPACE" >"$RUN/editor.log" 2>&1 &
EDITOR_PID=$!
healthy() { curl -fsS "http://127.0.0.1:$PORT/healthz" >/dev/null 2>&1; }
for _ in $(seq 240); do
  healthy && break
  kill -0 "$EDITOR_PID" 2>/dev/null || { cat "$RUN/editor.log" >&2; exit 1; }
  sleep 0.5
done
healthy || { echo "the editor did not answer on 127.0.0.1:$PORT" >&2; cat "$RUN/editor.log" >&2; exit 1; }

status=0
node "$DRIVER" "http://127.0.0.1:$PORT" "$WORKSPACE" "$OUT" || status=$?
if [ "$status" != 0 ]; then
  tail -30 "$RUN/editor.log"
  find "$RUN/profile/logs" -name '*exthost*.log' -exec tail -40 {} \; 2>/dev/null || true
fi
stop_editor
if [ "$status" = 0 ]; then rm -rf "$RUN"; else say "editor logs kept in $RUN"; fi
say "driver exited $status"
exit "$status"
