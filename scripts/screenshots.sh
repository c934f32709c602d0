#!/usr/bin/env bash
# npm run screenshots [-- URL] — takes the README's pictures (docs/images/*.png) from the demo shop.
#
# With a URL (or SCREENSHOTS_URL) it photographs that running Ringdown, which must have the demo
# shop loaded. Without one it runs a server of its own: it builds the app, starts the local
# PostgreSQL dev cluster, recreates the database `ringdown_screenshots` (so every run shows the
# same freshly seeded demo), serves the built app with the demo seed on port $SCREENSHOTS_PORT
# (default 3300) beside the payment-provider fake on $SCREENSHOTS_PAYMENTS_PORT (default 12113),
# and stops both when done. SCREENSHOTS_DATABASE_URL picks another database (it is dropped and
# recreated). Not part of `npm test`.
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
cd "$RINGDOWN_ROOT"

load_dotenv
check_node
ensure_dependencies
ensure_chromium "the screenshots"

url="${1:-${SCREENSHOTS_URL:-}}"
PIDS=()
stop_started() {
  local pid
  for pid in "${PIDS[@]}"; do kill "$pid" 2>/dev/null || true; done
}
trap stop_started EXIT

if [[ -z "$url" ]]; then
  port="${SCREENSHOTS_PORT:-3300}"
  payments_port="${SCREENSHOTS_PAYMENTS_PORT:-12113}"
  ensure_port_free "$port"
  ensure_port_free "$payments_port"

  database_url="${SCREENSHOTS_DATABASE_URL:-}"
  if [[ -z "$database_url" ]]; then
    log "Starting the local PostgreSQL dev cluster"
    bash docker-free-db/pg.sh start dev
    database_url="$(bash docker-free-db/pg.sh url dev)/ringdown_screenshots"
  fi
  database_name="${database_url##*/}"
  [[ "$database_name" =~ ^[A-Za-z_][A-Za-z0-9_]*$ ]] || die "SCREENSHOTS_DATABASE_URL must end in a plain database name, not '$database_name'"
  log "Recreating the database $database_name (a fresh demo shop)"
  PGOPTIONS="-c client_min_messages=warning" psql "${database_url%/*}/postgres" -v ON_ERROR_STOP=1 -q -c "DROP DATABASE IF EXISTS \"$database_name\" WITH (FORCE)"

  log "Building the API and the web app"
  npm run --silent build -w @ringdown/api
  npm run --silent build -w @ringdown/web

  mkdir -p "$RINGDOWN_ROOT/.data"
  storage="$RINGDOWN_ROOT/.data/screenshots-storage"
  rm -rf "$storage"
  node apps/api/dist/dev-services/payment-provider-fake/main.js --port "$payments_port" \
    --webhook-url "http://127.0.0.1:$port/api/billing/webhook" >/dev/null &
  PIDS+=($!)
  url="http://localhost:$port"
  log "Serving the demo on $url (server log in .data/screenshots-server.log)"
  PORT="$port" DATABASE_URL="$database_url" SEED_DEMO=true WEB_DIST="$RINGDOWN_ROOT/apps/web/dist" \
    APP_URL="$url" STORAGE_DIR="$storage" STRIPE_API_URL="http://127.0.0.1:$payments_port" \
    node apps/api/dist/server.js >"$RINGDOWN_ROOT/.data/screenshots-server.log" 2>&1 &
  server_pid=$!
  PIDS+=("$server_pid")
  # Migrations and the demo seed (recipes computed by the engine) take a while on a busy machine.
  for _ in $(seq 1 180); do
    if curl -fsS "$url/api/health" >/dev/null 2>&1; then break; fi
    kill -0 "$server_pid" 2>/dev/null || die "the server stopped; see .data/screenshots-server.log"
    sleep 1
  done
  curl -fsS "$url/api/health" >/dev/null || die "the server did not answer on $url within 3 minutes"
fi

log "Taking the screenshots from $url"
SCREENSHOTS_URL="$url" npx tsx tests/screenshots/take-screenshots.ts
