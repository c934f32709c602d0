#!/usr/bin/env bash
# npm run bench — runs the benchmarks and prints their figures. Benchmarks are kept out of
# `npm test`: timings vary from machine to machine and are never asserted on.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
cd "$RINGDOWN_ROOT"

check_node
ensure_dependencies

log "Machining engine benchmarks"
npm run --silent bench -w @ringdown/machining

log "Chart benchmark (spectrum of 100 000 points in Chromium)"
npm run --silent bench -w @ringdown/tests
