#!/usr/bin/env bash
# Runs Ringdown's local PostgreSQL clusters from Debian's packages, on 127.0.0.1 only.
#
#   bash docker-free-db/pg.sh <start|stop|status|reset|url|psql> <dev|test> [psql args…]
#
# Two clusters, each with its own data, socket and log inside the project (.data/, ignored by git):
#   dev   port $RINGDOWN_PG_DEV_PORT  (default 5433)  .data/pg-dev/
#   test  port $RINGDOWN_PG_TEST_PORT (default 5434)  .data/pg-test/  (fsync, synchronous_commit and
#         full_page_writes off: fast, and its data may be lost on a crash — it is throwaway)
# Variables may also come from the project's .env file (values already in the environment win).
# RINGDOWN_PG_DATA_ROOT moves every cluster somewhere else (e.g. when the project path cannot be
# traversed by the postgres user).
#
# Exit codes: 0 ok; 1 error; 3 `status` of a cluster that is not running.
set -euo pipefail

SCRIPT_DIR="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
PROJECT_DIR="$(cd "$SCRIPT_DIR/.." && pwd)"
SCRIPT_NAME="pg.sh"
source "$SCRIPT_DIR/lib.sh"

usage() {
  cat >&2 <<'EOF'
usage: bash docker-free-db/pg.sh <command> <dev|test>
  start   create the cluster if needed and start it (no-op when it is already running)
  stop    stop the cluster (no-op when it is not running)
  status  print whether the cluster is running (exit 0 running, 3 stopped)
  reset   stop the cluster and delete all of its data (the next start creates it empty)
  url     print the server URL without a database name, e.g. postgres://postgres@127.0.0.1:5433
  psql    open psql on the cluster (extra arguments are passed to psql)
EOF
  exit 1
}

# --- settings ---------------------------------------------------------------------------------

[[ $# -ge 2 ]] || usage
COMMAND="$1"
CLUSTER="$2"
shift 2

load_dotenv '^RINGDOWN_PG_[A-Z_]+$'

case "$CLUSTER" in
  dev) PORT="${RINGDOWN_PG_DEV_PORT:-5433}" ;;
  test) PORT="${RINGDOWN_PG_TEST_PORT:-5434}" ;;
  *) usage ;;
esac
[[ "$PORT" =~ ^[0-9]+$ ]] && ((PORT > 0 && PORT < 65536)) || die "port '$PORT' for the $CLUSTER cluster is not a valid TCP port"

DATA_ROOT="${RINGDOWN_PG_DATA_ROOT:-$PROJECT_DIR/.data}"
CLUSTER_DIR="$DATA_ROOT/pg-$CLUSTER"
PGDATA_DIR="$CLUSTER_DIR/data"
LOG_FILE="$CLUSTER_DIR/server.log"
SERVER_URL="postgres://postgres@127.0.0.1:$PORT"

IS_ROOT=0
[[ "$(id -u)" == 0 ]] && IS_ROOT=1

# A Unix socket path is limited to 107 bytes; the socket file is "<dir>/.s.PGSQL.<port>".
socket_dir() {
  local dir="$CLUSTER_DIR/sock" file_len
  file_len=$((${#dir} + ${#PORT} + 11))
  if ((file_len > 107)); then
    local hash
    hash="$(printf '%s' "$CLUSTER_DIR" | cksum | cut -d' ' -f1)"
    dir="/tmp/ringdown-pg-$hash"
  fi
  printf '%s' "$dir"
}
SOCKET_DIR="$(socket_dir)"

# --- binaries ---------------------------------------------------------------------------------

find_bin_dir() { pg_bin_dir initdb pg_ctl; }

ensure_binaries() {
  BIN_DIR="$(find_bin_dir)"
  if [[ -z "$BIN_DIR" ]]; then
    if ((IS_ROOT)); then
      say "PostgreSQL server binaries not found; installing Debian's postgresql package with apt…"
      export DEBIAN_FRONTEND=noninteractive
      apt-get update -qq >&2 || die "apt-get update failed"
      apt-get install -y -qq postgresql >&2 || die "apt-get install postgresql failed"
      BIN_DIR="$(find_bin_dir)"
      [[ -n "$BIN_DIR" ]] || die "postgresql was installed but no /usr/lib/postgresql/<version>/bin/initdb was found"
    else
      say "PostgreSQL server binaries were not found under /usr/lib/postgresql/<version>/bin."
      say "Install them, then run this again:  sudo apt-get install -y postgresql"
      exit 1
    fi
  fi
}

# --- running commands as the cluster's owner --------------------------------------------------

# PostgreSQL refuses to run as root, so as root every server command runs as the unprivileged
# "postgres" user, from "/" so that it never depends on the caller's working directory.
as_owner() {
  if ((IS_ROOT)); then
    (cd / && runuser -u postgres -- "$@")
  else
    "$@"
  fi
}

ensure_owner_user() {
  ((IS_ROOT)) || return 0
  if ! id -u postgres >/dev/null 2>&1; then
    say "creating the system user 'postgres' to run the server"
    useradd --system --user-group --home-dir /var/lib/postgresql --shell /bin/bash postgres ||
      die "could not create the system user 'postgres'"
  fi
}

# As root the server runs as "postgres", which must be able to reach the data directory.
check_traversable() {
  ((IS_ROOT)) || return 0
  local dir="$1"
  if ! (cd / && runuser -u postgres -- test -x "$dir") 2>/dev/null; then
    local blocker="$dir" parent
    while [[ "$blocker" != "/" ]]; do
      parent="$(dirname "$blocker")"
      if (cd / && runuser -u postgres -- test -x "$parent") 2>/dev/null; then break; fi
      blocker="$parent"
    done
    say "the 'postgres' user cannot reach $dir (no search permission on $blocker)."
    say "Either allow it:      chmod o+x $blocker"
    say "or keep the data elsewhere:  RINGDOWN_PG_DATA_ROOT=/var/tmp/ringdown-pg bash docker-free-db/pg.sh $COMMAND $CLUSTER"
    exit 1
  fi
}

prepare_dirs() {
  mkdir -p "$DATA_ROOT"
  chmod 755 "$DATA_ROOT" 2>/dev/null || true
  check_traversable "$DATA_ROOT"
  mkdir -p "$CLUSTER_DIR" "$SOCKET_DIR"
  if ((IS_ROOT)); then
    chown postgres:postgres "$CLUSTER_DIR" "$SOCKET_DIR"
  else
    local owner
    owner="$(stat -c %U "$CLUSTER_DIR")"
    [[ "$owner" == "$(id -un)" ]] ||
      die "$CLUSTER_DIR belongs to '$owner' (probably created as root); run as root, or 'reset' it as root first"
  fi
  chmod 700 "$CLUSTER_DIR"
  chmod 755 "$SOCKET_DIR"
}

# --- state --------------------------------------------------------------------------------------

is_initialised() { [[ -f "$PGDATA_DIR/PG_VERSION" ]]; }

# Our server is running when pg_ctl finds a live postmaster for our data directory.
is_running() {
  is_initialised || return 1
  as_owner "$BIN_DIR/pg_ctl" -D "$PGDATA_DIR" status >/dev/null 2>&1
}

# Port recorded by our running postmaster (4th line of postmaster.pid).
running_port() { sed -n 4p "$PGDATA_DIR/postmaster.pid" 2>/dev/null || true; }

# Something (anything) accepts TCP connections on 127.0.0.1:$PORT.
port_in_use() { (exec 3<>"/dev/tcp/127.0.0.1/$PORT") 2>/dev/null; }

ready() { "$BIN_DIR/pg_isready" -q -h 127.0.0.1 -p "$PORT" -U postgres -d postgres -t 2 >/dev/null 2>&1; }

wait_ready() {
  local i
  for ((i = 0; i < 120; i++)); do
    ready && return 0
    sleep 0.5
  done
  return 1
}

# --- commands -----------------------------------------------------------------------------------

write_settings() {
  # Rewritten at every start so that a changed port or socket path takes effect.
  local conf="$PGDATA_DIR/ringdown.conf"
  {
    echo "# Written by docker-free-db/pg.sh at every start; edit the script, not this file."
    echo "listen_addresses = '127.0.0.1'"
    echo "port = $PORT"
    echo "unix_socket_directories = '$SOCKET_DIR'"
    echo "max_connections = 100"
    echo "shared_buffers = 128MB"
    echo "log_line_prefix = '%m [%p] %q%u@%d '"
    if [[ "$CLUSTER" == "test" ]]; then
      echo "# Throwaway test data: trade durability for speed."
      echo "fsync = off"
      echo "synchronous_commit = off"
      echo "full_page_writes = off"
    fi
  } >"$conf.tmp"
  if ((IS_ROOT)); then chown postgres:postgres "$conf.tmp"; fi
  mv "$conf.tmp" "$conf"
  if ! grep -q "^include_if_exists = 'ringdown.conf'" "$PGDATA_DIR/postgresql.conf"; then
    echo "include_if_exists = 'ringdown.conf'" >>"$PGDATA_DIR/postgresql.conf"
  fi
}

cmd_start() {
  ensure_binaries
  ensure_owner_user
  prepare_dirs

  if is_running; then
    local rport
    rport="$(running_port)"
    if [[ -n "$rport" && "$rport" != "$PORT" ]]; then
      die "the $CLUSTER cluster is already running on port $rport, not $PORT; stop it first: bash docker-free-db/pg.sh stop $CLUSTER"
    fi
    # Running: wait until it answers (it may still be recovering), unless it goes away meanwhile
    # (a server killed a moment ago can still look alive).
    local i
    for ((i = 0; i < 120; i++)); do
      if ready; then
        say "$CLUSTER cluster already running on 127.0.0.1:$PORT"
        return 0
      fi
      is_running || break
      sleep 0.5
    done
    if is_running; then
      die "the $CLUSTER cluster's server is running but does not accept connections on 127.0.0.1:$PORT; see $LOG_FILE"
    fi
    say "the $CLUSTER cluster's previous server is gone (crashed?); starting it again"
  fi

  if port_in_use; then
    die "port $PORT on 127.0.0.1 is taken by another server (not this project's $CLUSTER cluster). Stop it, or choose another port with RINGDOWN_PG_$(tr '[:lower:]' '[:upper:]' <<<"$CLUSTER")_PORT."
  fi

  if ! is_initialised; then
    say "creating the $CLUSTER cluster in $PGDATA_DIR"
    as_owner "$BIN_DIR/initdb" -D "$PGDATA_DIR" -U postgres --auth=trust -E UTF8 --locale=C.UTF-8 \
      >"$CLUSTER_DIR/initdb.log" 2>&1 || {
      cat "$CLUSTER_DIR/initdb.log" >&2
      die "initdb failed (log above)"
    }
  fi
  write_settings

  # A crash can leave postmaster.pid behind; the server removes a stale one itself.
  if ! as_owner "$BIN_DIR/pg_ctl" -D "$PGDATA_DIR" -l "$LOG_FILE" -w -t 60 start >/dev/null 2>&1; then
    tail -n 20 "$LOG_FILE" >&2 2>/dev/null || true
    die "the $CLUSTER cluster did not start (last log lines above, full log in $LOG_FILE)"
  fi
  wait_ready || die "the $CLUSTER cluster started but does not accept connections on 127.0.0.1:$PORT; see $LOG_FILE"
  say "$CLUSTER cluster running on 127.0.0.1:$PORT ($SERVER_URL)"
}

cmd_stop() {
  ensure_binaries
  if ! is_running; then
    say "$CLUSTER cluster is not running"
    return 0
  fi
  as_owner "$BIN_DIR/pg_ctl" -D "$PGDATA_DIR" -m fast -w -t 60 stop >/dev/null 2>&1 ||
    die "could not stop the $CLUSTER cluster; see $LOG_FILE"
  say "$CLUSTER cluster stopped"
}

cmd_status() {
  ensure_binaries
  if is_running; then
    echo "$CLUSTER cluster: running on 127.0.0.1:$(running_port) (data in $PGDATA_DIR)"
    return 0
  fi
  if is_initialised; then
    echo "$CLUSTER cluster: stopped (data in $PGDATA_DIR)"
  else
    echo "$CLUSTER cluster: not created yet (would live in $PGDATA_DIR)"
  fi
  exit 3
}

cmd_reset() {
  ensure_binaries
  if is_running; then cmd_stop; fi
  case "$CLUSTER_DIR" in
    */pg-dev | */pg-test) ;;
    *) die "refusing to delete unexpected path $CLUSTER_DIR" ;;
  esac
  rm -rf -- "$CLUSTER_DIR"
  if [[ "$SOCKET_DIR" == /tmp/ringdown-pg-* ]]; then rm -rf -- "$SOCKET_DIR"; fi
  say "$CLUSTER cluster deleted; the next 'start' creates it empty"
}

cmd_psql() {
  ensure_binaries
  is_running || die "the $CLUSTER cluster is not running; start it with: bash docker-free-db/pg.sh start $CLUSTER"
  exec "$BIN_DIR/psql" -h 127.0.0.1 -p "$PORT" -U postgres "$@"
}

case "$COMMAND" in
  start) cmd_start ;;
  stop) cmd_stop ;;
  status) cmd_status ;;
  reset) cmd_reset ;;
  url) echo "$SERVER_URL" ;;
  psql) cmd_psql "$@" ;;
  *) usage ;;
esac
