#!/usr/bin/env bash
# Installs the system packages the tests use, once: Neovim (a real editor client for the protocol
# test) and Chromium (headless screenshots), both from Debian, plus the shared VS Code end-to-end
# kit (code-server, playwright-core, vsce; apt-get and npm only). Idempotent and quick when done.
set -euo pipefail
cd "$(dirname "$0")/.."

export DEBIAN_FRONTEND=noninteractive
APT_PACKAGES=(neovim chromium fonts-dejavu-core unzip)
missing=()
for p in "${APT_PACKAGES[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ "${#missing[@]}" -gt 0 ]; then
  echo "installing ${missing[*]} with apt-get"
  apt-get update -qq
  apt-get install -y -q "${missing[@]}" >/tmp/rectilens-apt.log 2>&1 || { tail -30 /tmp/rectilens-apt.log; exit 1; }
fi

KIT=../shared/vscode-e2e
[ -f "$KIT/setup.sh" ] || { echo "the shared VS Code end-to-end kit is missing: expected $KIT/setup.sh beside this checkout" >&2; exit 1; }
bash "$KIT/setup.sh" >/tmp/rectilens-e2e-setup.log 2>&1 || { tail -30 /tmp/rectilens-e2e-setup.log; exit 1; }
