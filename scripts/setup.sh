#!/usr/bin/env bash
# Installs what Busbar needs on a fresh Debian machine that has Node 20: pnpm, the workspace's
# dependencies (better-sqlite3 compiles against Node's own headers) and, with --browser, Debian's
# Chromium for the end-to-end tests.
set -euo pipefail
cd "$(dirname "$0")/.."

as_root() { if [ "$(id -u)" -eq 0 ]; then "$@"; else sudo "$@"; fi; }

if [ "${1:-}" = "--browser" ] && [ ! -x /usr/bin/chromium ]; then
  as_root apt-get update
  as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends chromium
fi
if [ "$(pnpm --version 2>/dev/null || true)" != "12.4.2" ]; then
  as_root npm install -g pnpm@12.4.2
fi
# node-gyp finds Node's headers only through this variable (config files are not read for it).
export npm_config_nodedir="${npm_config_nodedir:-/usr}"
pnpm install --frozen-lockfile
