#!/usr/bin/env bash
# npm test: the same set-up on the isolated test profile (.data/test), then every suite.
set -euo pipefail
cd "$(dirname "$0")/../.."
export NEXT_TELEMETRY_DISABLED=1
bash db/scripts/ensure-deps.sh
exec node_modules/.bin/tsx db/lifecycle/test.ts "$@"
