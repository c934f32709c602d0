#!/usr/bin/env bash
# npm test — everything CI checks, on a throwaway database:
#   typecheck · unit tests (machining, contracts, web) · API integration tests (real PostgreSQL)
#   · build · end-to-end tests (Playwright driving Debian's Chromium)
# Installs what is missing (npm dependencies; Debian's chromium when run as root), starts the
# TEST PostgreSQL cluster (never the dev one) and stops it again if it started it. Every step
# runs even if an earlier one failed (except end-to-end after a failed build), so one run shows
# every problem. Exits non-zero on any failure. The last line is "tests: N passed, M failed".
set -uo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
cd "$RINGDOWN_ROOT"

set -e
check_node
ensure_dependencies

ensure_chromium "the end-to-end tests"

# --- the test database ----------------------------------------------------------------------
STARTED_TEST_CLUSTER=0
REPORTS="$(mktemp -d "${TMPDIR:-/tmp}/ringdown-test.XXXXXX")"
cleanup() {
  local status=$?
  if ((STARTED_TEST_CLUSTER)); then
    log "Stopping the test PostgreSQL cluster"
    bash docker-free-db/pg.sh stop test || warn "could not stop the test cluster"
  fi
  rm -rf "$REPORTS"
  exit "$status"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

if ! bash docker-free-db/pg.sh status test >/dev/null 2>&1; then
  log "Starting the test PostgreSQL cluster"
  STARTED_TEST_CLUSTER=1
  bash docker-free-db/pg.sh start test
fi
TEST_PG_URL="$(bash docker-free-db/pg.sh url test)"
# The end-to-end database starts empty on every run (the server migrates and seeds it).
bash docker-free-db/pg.sh psql test -q -v ON_ERROR_STOP=1 -c "DROP DATABASE IF EXISTS ringdown_e2e WITH (FORCE)" >/dev/null
set +e

# --- steps --------------------------------------------------------------------------------
STEP_NAMES=()
STEP_RESULTS=()
REPORT_FILES=()
FAILED_WITHOUT_REPORT=0

# run_step <name> <report-file or -> <command…>
run_step() {
  local name="$1" report="$2" start status
  shift 2
  printf '\n\033[1m━━ %s\033[0m\n' "$name"
  start=$SECONDS
  "$@"
  status=$?
  STEP_NAMES+=("$name")
  if ((status == 0)); then
    STEP_RESULTS+=("ok ($((SECONDS - start)) s)")
  else
    STEP_RESULTS+=("FAILED, exit $status ($((SECONDS - start)) s)")
  fi
  if [[ "$report" != "-" && -s "$report" ]]; then
    REPORT_FILES+=("$report")
  elif ((status != 0)); then
    FAILED_WITHOUT_REPORT=$((FAILED_WITHOUT_REPORT + 1))
  fi
  return "$status"
}

# has_script <workspace dir> <script>: does the workspace's package.json define it?
has_script() {
  node -e 'const p = require(process.argv[1]); process.exit(p.scripts && p.scripts[process.argv[2]] ? 0 : 1)' \
    "$RINGDOWN_ROOT/$1/package.json" "$2"
}

# script_contains <workspace dir> <script> <text>
script_contains() {
  node -e 'const p = require(process.argv[1]); process.exit((p.scripts?.[process.argv[2]] ?? "").includes(process.argv[3]) ? 0 : 1)' \
    "$RINGDOWN_ROOT/$1/package.json" "$2" "$3"
}

# vitest_step <name> <workspace dir> [VAR=value…]: the workspace's own `test` script with JSON output.
vitest_step() {
  local name="$1" dir="$2" report
  shift 2
  if ! has_script "$dir" test; then
    printf '\n━━ %s: no tests yet (skipped)\n' "$name"
    return 0
  fi
  report="$REPORTS/$(echo "$name" | tr -c 'a-z0-9' '-').json"
  local extra=()
  # A workspace without test files yet must not fail the run (vitest refuses a repeated flag).
  script_contains "$dir" test "--passWithNoTests" || extra+=(--passWithNoTests)
  run_step "$name" "$report" env "$@" npm run --silent test -w "$dir" -- \
    "${extra[@]}" --reporter=default --reporter=json --outputFile="$report"
}

typecheck_all() {
  local dir status=0
  for dir in $(node -p 'require("./package.json").workspaces.join(" ")'); do
    has_script "$dir" typecheck || continue
    echo "typecheck $dir"
    npm run --silent typecheck -w "$dir" || status=1
  done
  return "$status"
}

build_all() {
  npm run --silent build -w @ringdown/api && npm run --silent build -w @ringdown/web
}

run_step "typecheck" - typecheck_all
vitest_step "unit: machining" packages/machining
vitest_step "unit: contracts" packages/contracts
vitest_step "unit: web" apps/web
vitest_step "api integration" apps/api "DATABASE_URL=$TEST_PG_URL/ringdown_test"
if run_step "build" - build_all; then
  E2E_REPORT="$REPORTS/playwright.json"
  run_step "end-to-end (Chromium)" "$E2E_REPORT" env CI="${CI:-1}" \
    E2E_DATABASE_URL="$TEST_PG_URL/ringdown_e2e" PLAYWRIGHT_JSON_OUTPUT_NAME="$E2E_REPORT" \
    npx --no-install playwright test -c tests/playwright.config.ts --reporter=list,json
else
  STEP_NAMES+=("end-to-end (Chromium)")
  STEP_RESULTS+=("not run: the build failed")
fi

# --- summary ------------------------------------------------------------------------------
printf '\n\033[1m━━ summary\033[0m\n'
OVERALL=0
for i in "${!STEP_NAMES[@]}"; do
  printf '  %-24s %s\n' "${STEP_NAMES[$i]}" "${STEP_RESULTS[$i]}"
  [[ "${STEP_RESULTS[$i]}" == ok* ]] || OVERALL=1
done

PASSED=0
FAILED=0
if ((${#REPORT_FILES[@]} > 0)); then
  if read -r PASSED FAILED FLAKY < <(node scripts/lib/summarize-tests.mjs "${REPORT_FILES[@]}"); then
    ((FLAKY > 0)) && printf '  (%d end-to-end test(s) passed only on retry)\n' "$FLAKY"
  else
    warn "could not read the test reports"
    OVERALL=1
  fi
fi
# A step that failed without a test report (typecheck, build, a runner that crashed) counts as one failure.
FAILED=$((FAILED + FAILED_WITHOUT_REPORT))
((FAILED > 0)) && OVERALL=1
# A runner can fail outside any test (an unhandled error in its setup) while its report counts no
# failed test: the closing line must still never say "0 failed" for a failing run.
((OVERALL == 1 && FAILED == 0)) && FAILED=1

echo
echo "tests: $PASSED passed, $FAILED failed"
exit "$OVERALL"
