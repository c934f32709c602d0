#!/usr/bin/env bash
# npm start — runs Ringdown locally on http://localhost:$PORT (default 3000):
# installs dependencies if needed, starts the local PostgreSQL dev cluster, builds the shared
# packages, the API and the web app, then runs the server (it migrates the database and seeds
# the demo shop on start), with local stand-ins for e-mail and payments. Ctrl-C stops the server
# and the stand-ins; the database keeps running
# (stop it with `bash docker-free-db/pg.sh stop dev`).
set -euo pipefail
source "$(dirname "${BASH_SOURCE[0]}")/lib/common.sh"
cd "$RINGDOWN_ROOT"

load_dotenv
check_node
ensure_dependencies

log "Starting the local PostgreSQL dev cluster"
bash docker-free-db/pg.sh start dev
if [[ -z "${DATABASE_URL:-}" ]]; then
  DATABASE_URL="$(bash docker-free-db/pg.sh url dev)/ringdown"
fi
export DATABASE_URL
export PORT="${PORT:-3000}"
# Say it now rather than after the build.
ensure_port_free "$PORT"
export SEED_DEMO="${SEED_DEMO:-true}"
export WEB_DIST="${WEB_DIST:-$RINGDOWN_ROOT/apps/web/dist}"

log "Building the API and shared packages"
npm run --silent build -w @ringdown/api
log "Building the web app"
npm run --silent build -w @ringdown/web

# Local stand-ins for the hosted services, on loopback, unless .env points elsewhere:
# an SMTP server that stores mail (read it at http://localhost:$PORT/dev/mail) and the
# payment-provider fake (docs/billing.md). Both stop when the server stops.
STAND_IN_PIDS=()
stop_stand_ins() {
  local pid
  for pid in "${STAND_IN_PIDS[@]}"; do kill "$pid" 2>/dev/null || true; done
}
trap stop_stand_ins EXIT
if [[ -z "${SMTP_HOST:-}" || "${SMTP_HOST}" == "127.0.0.1" || "${SMTP_HOST}" == "localhost" ]] && [[ -z "${SMTP_PORT:-}" ]]; then
  SMTP_CAPTURE_PORT="${RINGDOWN_SMTP_DEV_PORT:-2525}"
  ensure_port_free "$SMTP_CAPTURE_PORT"
  log "Starting the local mail capture server on 127.0.0.1:$SMTP_CAPTURE_PORT"
  node apps/api/dist/dev-services/mail-capture/main.js --port "$SMTP_CAPTURE_PORT" \
    --dir "${MAIL_CAPTURE_DIR:-$RINGDOWN_ROOT/.data/mail-capture/dev}" &
  STAND_IN_PIDS+=($!)
fi
if [[ -z "${STRIPE_API_URL:-}" && -z "${STRIPE_SECRET_KEY:-}" ]]; then
  PAYMENTS_PORT="${RINGDOWN_PAYMENTS_DEV_PORT:-12111}"
  ensure_port_free "$PAYMENTS_PORT"
  log "Starting the payment-provider fake on 127.0.0.1:$PAYMENTS_PORT"
  node apps/api/dist/dev-services/payment-provider-fake/main.js --port "$PAYMENTS_PORT" \
    --webhook-url "http://127.0.0.1:$PORT/api/billing/webhook" --state-file "$RINGDOWN_ROOT/.data/payment-fake/dev.json" &
  STAND_IN_PIDS+=($!)
fi

log "Serving Ringdown on http://localhost:$PORT (Ctrl-C to stop)"
# Not exec'd, so the stand-ins are stopped when the server exits; Ctrl-C reaches the server
# (the foreground process) and it shuts down gracefully.
npm run --silent serve -w @ringdown/api
