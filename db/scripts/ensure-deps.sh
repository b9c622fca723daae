#!/usr/bin/env bash
# Installs the npm dependencies when node_modules is missing or older than the lock file.
set -euo pipefail
cd "$(dirname "$0")/../.."
if [[ ! -f node_modules/.package-lock.json || package-lock.json -nt node_modules/.package-lock.json ]]; then
  echo "[setup] npm ci…"
  npm ci --no-audit --no-fund
fi
