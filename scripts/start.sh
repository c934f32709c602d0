#!/usr/bin/env bash
# npm start — runs Ringdown locally on http://localhost:$PORT (default 3000):
# installs dependencies if needed, starts the local PostgreSQL dev cluster, builds the shared
# packages, the API and the web app, then runs the server (it migrates the database and seeds
# the demo shop on start). Ctrl-C stops the server; the database keeps running
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

log "Serving Ringdown on http://localhost:$PORT (Ctrl-C to stop)"
# exec: the server itself receives Ctrl-C (SIGINT) and shuts down gracefully.
exec npm run --silent serve -w @ringdown/api
