#!/usr/bin/env bash
# Restores a backup written by docker-free-db/backup.sh into a database of your choosing.
#
#   bash docker-free-db/restore.sh FILE.dump (--database NAME | --database-url URL) [--replace]
#                                  [--storage-dir DIR]
#
#   --database NAME     restore into NAME on the server of DATABASE_URL (environment or .env), else
#                       on the dev cluster; letters, digits and underscores only
#   --database-url URL  restore into the database this URL names
#   --replace           the database already holds tables: drop it (closing its connections) and
#                       restore into a fresh one; the uploads directory may already hold files:
#                       unpack over them. Without it, both must be empty (or missing).
#   --storage-dir DIR   also unpack FILE's uploaded files (<FILE without .dump>.files.tar.gz) into
#                       DIR, created if missing. Without it only the database is restored.
#
# A missing database is created. The archive loads in one transaction: when it fails, nothing of
# it stays. Stop the API (and workers) before restoring the database they use. Uses pg_restore and
# psql from the newest /usr/lib/postgresql/<version>/bin, the version pg.sh runs.
# Exit codes: 0 ok; 1 error (one line on stderr saying why).
set -euo pipefail

SCRIPT_DIR="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
PROJECT_DIR="$(cd "$SCRIPT_DIR/.." && pwd)"
SCRIPT_NAME="restore.sh"
source "$SCRIPT_DIR/lib.sh"

usage() { show_usage 4 19; }

DUMP=""
NAME_ARG=""
URL_ARG=""
REPLACE=0
STORAGE_TARGET=""
while [[ $# -gt 0 ]]; do
  case "$1" in
    --database) [[ $# -ge 2 ]] || usage; NAME_ARG="$2"; shift 2 ;;
    --database-url) [[ $# -ge 2 ]] || usage; URL_ARG="$2"; shift 2 ;;
    --replace) REPLACE=1; shift ;;
    --storage-dir) [[ $# -ge 2 ]] || usage; STORAGE_TARGET="$2"; shift 2 ;;
    -h | --help) usage ;;
    -*) say "unknown option '$1'"; usage ;;
    *) [[ -z "$DUMP" ]] || usage; DUMP="$1"; shift ;;
  esac
done
[[ -n "$DUMP" ]] || usage
[[ -n "$NAME_ARG" || -n "$URL_ARG" ]] || die "say where to restore: --database NAME or --database-url URL"
[[ -z "$NAME_ARG" || -z "$URL_ARG" ]] || die "--database and --database-url exclude each other"

if [[ -n "$NAME_ARG" ]]; then
  [[ "$NAME_ARG" =~ ^[A-Za-z0-9_]+$ ]] || die "database name '$NAME_ARG' may hold only letters, digits and underscores"
  SERVER_URL="$(app_database_url)"
  split_database_url "$SERVER_URL" || die "DATABASE_URL '$(redact_url "$SERVER_URL")' is not a postgres:// URL naming a database"
  TARGET_URL="$URL_BASE/$NAME_ARG$URL_QUERY"
else
  TARGET_URL="$URL_ARG"
fi
split_database_url "$TARGET_URL" || die "'$(redact_url "$TARGET_URL")' is not a postgres:// URL naming a database"
TARGET="$URL_DATABASE"
MAINTENANCE_URL="$URL_BASE/postgres$URL_QUERY"
WHERE="$(redact_url "$TARGET_URL")"

BIN_DIR="$(pg_bin_dir pg_restore psql)"
[[ -n "$BIN_DIR" ]] || die "pg_restore and psql were not found under /usr/lib/postgresql/<version>/bin; install them: sudo apt-get install -y postgresql-client"

ERR="$(mktemp "${TMPDIR:-/tmp}/ringdown-restore.XXXXXX")"
trap 'rm -f -- "$ERR"' EXIT
first_error() { grep -m1 -v '^$' "$ERR" | sed -E 's/^(pg_restore|psql): (error: )?//'; }

# psql_at <url> [-v name=value…]: runs the SQL on stdin, prints unaligned rows, fails on any error.
psql_at() {
  local url="$1"
  shift
  "$BIN_DIR/psql" -X -q -A -t -v ON_ERROR_STOP=1 --dbname="$url" "$@" 2>"$ERR"
}

# --- check everything before changing anything -----------------------------------------------

[[ -f "$DUMP" && -r "$DUMP" ]] || die "cannot read the backup $DUMP"
"$BIN_DIR/pg_restore" --list "$DUMP" >/dev/null 2>"$ERR" ||
  die "$DUMP is not a database archive written by backup.sh: $(first_error)"

FILES_ARCHIVE="${DUMP%.dump}.files.tar.gz"
if [[ -n "$STORAGE_TARGET" ]]; then
  [[ "$DUMP" == *.dump && -f "$FILES_ARCHIVE" ]] ||
    die "this backup holds no uploaded files ($FILES_ARCHIVE is missing); restore without --storage-dir"
  tar -tzf "$FILES_ARCHIVE" >/dev/null 2>"$ERR" || die "$FILES_ARCHIVE is damaged: $(first_error)"
  if [[ -e "$STORAGE_TARGET" && ! -d "$STORAGE_TARGET" ]]; then die "$STORAGE_TARGET is not a directory"; fi
  if ((!REPLACE)) && [[ -d "$STORAGE_TARGET" ]] && [[ -n "$(ls -A "$STORAGE_TARGET")" ]]; then
    die "the uploads directory $STORAGE_TARGET is not empty; pass --replace to unpack over it"
  fi
fi

EXISTS="$(psql_at "$MAINTENANCE_URL" -v name="$TARGET" <<<"SELECT count(*) FROM pg_database WHERE datname = :'name';")" ||
  die "cannot reach the server of $WHERE: $(first_error)"

if [[ "$EXISTS" == 1 ]]; then
  TABLES="$(psql_at "$TARGET_URL" <<'SQL'
SELECT count(*) FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
WHERE c.relkind IN ('r', 'p', 'v', 'm', 'S', 'f')
  AND n.nspname NOT IN ('pg_catalog', 'information_schema') AND n.nspname NOT LIKE 'pg\_%';
SQL
)" || die "cannot look into $WHERE: $(first_error)"
  if ((TABLES > 0)); then
    ((REPLACE)) || die "database $TARGET already holds $TABLES tables, views or sequences; pass --replace to drop it and restore into a fresh one"
    say "dropping database $TARGET (it held $TABLES tables, views or sequences)"
    psql_at "$MAINTENANCE_URL" -v name="$TARGET" <<<'DROP DATABASE :"name" WITH (FORCE);' >/dev/null ||
      die "cannot drop $TARGET: $(first_error)"
    EXISTS=0
  fi
fi
if [[ "$EXISTS" != 1 ]]; then
  psql_at "$MAINTENANCE_URL" -v name="$TARGET" <<<"CREATE DATABASE :\"name\" ENCODING 'UTF8' TEMPLATE template0;" >/dev/null ||
    die "cannot create database $TARGET: $(first_error)"
fi

# --- the database ---------------------------------------------------------------------------------

# Objects are created as the connecting role: a backup restores on a server with other role names.
if ! "$BIN_DIR/pg_restore" --no-owner --no-privileges --exit-on-error --single-transaction \
  --dbname="$TARGET_URL" "$DUMP" 2>"$ERR"; then
  die "pg_restore could not load $DUMP into $WHERE (nothing of it was kept): $(first_error)"
fi
say "database restored into $WHERE from $DUMP"

# --- the uploaded files ---------------------------------------------------------------------------

if [[ -n "$STORAGE_TARGET" ]]; then
  mkdir -p "$STORAGE_TARGET" || die "cannot create $STORAGE_TARGET"
  tar -C "$STORAGE_TARGET" -xzf "$FILES_ARCHIVE" 2>"$ERR" || die "could not unpack $FILES_ARCHIVE into $STORAGE_TARGET: $(first_error)"
  say "uploaded files restored into $STORAGE_TARGET from $FILES_ARCHIVE"
fi
