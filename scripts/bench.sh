#!/usr/bin/env bash
# npm run bench — runs the benchmarks and prints their figures. Benchmarks are kept out of
# `npm test`: timings vary from machine to machine and are never asserted on.
#
# Each part also runs alone:
#   npm run bench -w @ringdown/machining      engine
#   npm run bench -w @ringdown/tests          spectrum chart in Chromium
#   npm run bench -w @ringdown/web            first-page weight of the production build
#   npm run bench -w @ringdown/api            recipe search at scale, then the mixed workload
#                                             (bench:search / bench:mixed for one of them)
# The API benchmarks need PostgreSQL: this script starts the TEST cluster when it is not running
# (and stops it again afterwards), builds the benchmark database ringdown_bench on it and drops it
# at the end. RINGDOWN_BENCH_SECONDS shortens every load phase (e.g. 5 while developing).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
cd "$RINGDOWN_ROOT"

check_node
ensure_dependencies
ensure_chromium "the chart benchmark"

STARTED_TEST_CLUSTER=0
BENCH_DB=ringdown_bench
cleanup() {
  local status=$?
  if bash docker-free-db/pg.sh status test >/dev/null 2>&1; then
    bash docker-free-db/pg.sh psql test -q -c "DROP DATABASE IF EXISTS $BENCH_DB WITH (FORCE)" >/dev/null 2>&1 ||
      warn "could not drop the benchmark database $BENCH_DB"
  fi
  if ((STARTED_TEST_CLUSTER)); then
    log "Stopping the test PostgreSQL cluster"
    bash docker-free-db/pg.sh stop test || warn "could not stop the test cluster"
  fi
  exit "$status"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

log "Machining engine benchmarks"
npm run --silent bench -w @ringdown/machining

log "Chart benchmark (spectrum of 100 000 points in Chromium)"
npm run --silent bench -w @ringdown/tests

log "Web first-page weight (production build; JavaScript of a first visit to the sign-in page, gzipped)"
npm run --silent bench -w @ringdown/web

if ! bash docker-free-db/pg.sh status test >/dev/null 2>&1; then
  log "Starting the test PostgreSQL cluster"
  STARTED_TEST_CLUSTER=1
  bash docker-free-db/pg.sh start test
fi
export RINGDOWN_BENCH_DATABASE_URL="$(bash docker-free-db/pg.sh url test)/$BENCH_DB"
export RINGDOWN_BENCH_FRESH=1

log "API load: recipe search at scale (100 000 recipes, 50 connections; API against a bare pg handler), then the mixed workload (100 connections, reads and writes)"
npm run --silent bench -w @ringdown/api
