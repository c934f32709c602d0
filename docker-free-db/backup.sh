#!/usr/bin/env bash
# Backs up Ringdown's database and, beside it, the uploaded files (cut-log photos, recordings).
#
#   bash docker-free-db/backup.sh [--database-url URL] [--out FILE] [--storage-dir DIR | --no-files]
#
# Writes FILE (default .data/backups/ringdown-<database>-<UTC date>T<time>Z.dump), a pg_dump
# custom-format archive of the whole database (every schema, including the job queue's), taken as
# one consistent snapshot while the app keeps running. Then, unless --no-files, writes
# <FILE without .dump>.files.tar.gz, a gzip tar of the uploads directory, taken after the dump so
# that every file the dump refers to is in it. Restore both with docker-free-db/restore.sh.
#
#   --database-url URL  database to back up (default: DATABASE_URL from the environment or .env,
#                       else the dev cluster's database, as the API chooses)
#   --out FILE          archive to write; its folder is created if needed; never overwritten
#   --storage-dir DIR   uploads directory (default: STORAGE_DIR from the environment or .env, else
#                       .data/storage; relative paths from the repository root). When the default
#                       directory does not exist yet the backup holds the database only.
#   --no-files          database only
#
# Uses pg_dump from the newest /usr/lib/postgresql/<version>/bin, the version pg.sh runs. Prints
# each file written on stdout, one a line; messages go to stderr. Exit codes: 0 ok; 1 error.
set -euo pipefail

SCRIPT_DIR="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
PROJECT_DIR="$(cd "$SCRIPT_DIR/.." && pwd)"
SCRIPT_NAME="backup.sh"
source "$SCRIPT_DIR/lib.sh"

usage() { show_usage 4 21; }

DATABASE_URL_ARG=""
OUT=""
STORAGE_ARG=""
WITH_FILES=1
while [[ $# -gt 0 ]]; do
  case "$1" in
    --database-url) [[ $# -ge 2 ]] || usage; DATABASE_URL_ARG="$2"; shift 2 ;;
    --out) [[ $# -ge 2 ]] || usage; OUT="$2"; shift 2 ;;
    --storage-dir) [[ $# -ge 2 ]] || usage; STORAGE_ARG="$2"; shift 2 ;;
    --no-files) WITH_FILES=0; shift ;;
    -h | --help) usage ;;
    *) say "unknown argument '$1'"; usage ;;
  esac
done
[[ -z "$STORAGE_ARG" || "$WITH_FILES" == 1 ]] || die "--storage-dir and --no-files exclude each other"

URL="${DATABASE_URL_ARG:-$(app_database_url)}"
split_database_url "$URL" || die "'$(redact_url "$URL")' is not a postgres:// URL naming a database"
DATABASE="$URL_DATABASE"

BIN_DIR="$(pg_bin_dir pg_dump)"
[[ -n "$BIN_DIR" ]] || die "pg_dump was not found under /usr/lib/postgresql/<version>/bin; install it: sudo apt-get install -y postgresql-client"

# --- where to write -----------------------------------------------------------------------------

if [[ -z "$OUT" ]]; then
  OUT="$PROJECT_DIR/.data/backups/ringdown-${DATABASE//[^A-Za-z0-9_-]/_}-$(date -u +%Y%m%dT%H%M%SZ).dump"
fi
[[ "$OUT" == *.dump ]] || die "the archive name must end in .dump (got '$OUT')"
FILES_OUT="${OUT%.dump}.files.tar.gz"
[[ ! -e "$OUT" ]] || die "$OUT already exists; choose another --out (backups are never overwritten)"
mkdir -p "$(dirname "$OUT")" || die "cannot create the folder $(dirname "$OUT")"

STORAGE_DIR_PATH=""
if ((WITH_FILES)); then
  [[ ! -e "$FILES_OUT" ]] || die "$FILES_OUT already exists; choose another --out (backups are never overwritten)"
  if [[ -n "$STORAGE_ARG" ]]; then
    STORAGE_DIR_PATH="$STORAGE_ARG"
    [[ -d "$STORAGE_DIR_PATH" ]] || die "the uploads directory $STORAGE_DIR_PATH does not exist"
  else
    load_dotenv '^STORAGE_DIR$'
    STORAGE_DIR_PATH="${STORAGE_DIR:-.data/storage}"
    [[ "$STORAGE_DIR_PATH" == /* ]] || STORAGE_DIR_PATH="$PROJECT_DIR/$STORAGE_DIR_PATH"
    if [[ ! -d "$STORAGE_DIR_PATH" ]]; then
      say "no uploads directory at $STORAGE_DIR_PATH yet: backing up the database only"
      STORAGE_DIR_PATH=""
    fi
  fi
fi

# --- the database -------------------------------------------------------------------------------

ERR="$(mktemp "${TMPDIR:-/tmp}/ringdown-backup.XXXXXX")"
cleanup() { rm -f -- "$ERR" "$OUT.partial" "$FILES_OUT.partial"; }
trap cleanup EXIT

# Written under a temporary name and renamed when complete: a .dump file is always a whole one.
if ! "$BIN_DIR/pg_dump" --format=custom --file="$OUT.partial" --dbname="$URL" 2>"$ERR"; then
  die "pg_dump could not back up $(redact_url "$URL"): $(grep -m1 -v '^$' "$ERR" | sed 's/^pg_dump: error: //')"
fi
mv -- "$OUT.partial" "$OUT"
say "database $DATABASE written to $OUT ($(du -h "$OUT" | cut -f1))"
echo "$OUT"

# --- the uploaded files -------------------------------------------------------------------------

if [[ -n "$STORAGE_DIR_PATH" ]]; then
  if ! tar -C "$STORAGE_DIR_PATH" --exclude="*.part" -czf "$FILES_OUT.partial" . 2>"$ERR"; then
    die "could not archive $STORAGE_DIR_PATH: $(grep -m1 -v '^$' "$ERR")"
  fi
  mv -- "$FILES_OUT.partial" "$FILES_OUT"
  say "uploaded files from $STORAGE_DIR_PATH written to $FILES_OUT ($(du -h "$FILES_OUT" | cut -f1))"
  echo "$FILES_OUT"
fi
