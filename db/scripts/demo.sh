#!/usr/bin/env bash
# npm run demo: everything from a fresh clone; a second run reuses .data/demo.
set -euo pipefail
cd "$(dirname "$0")/../.."
export NEXT_TELEMETRY_DISABLED=1
bash db/scripts/ensure-deps.sh
exec node_modules/.bin/tsx db/lifecycle/demo.ts "$@"
