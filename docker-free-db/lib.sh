# Helpers shared by docker-free-db/*.sh (sourced, not run). The sourcing script sets SCRIPT_NAME
# (for messages) and PROJECT_DIR (the repository root) first.

# show_usage <first line> <last line>: prints that part of the calling script's header comment as
# its usage text, then exits 1.
show_usage() {
  sed -n "$1,$2p" "$0" | sed 's/^# \{0,1\}//' >&2
  exit 1
}

say() { printf '%s: %s\n' "$SCRIPT_NAME" "$*" >&2; }
die() { printf '%s: error: %s\n' "$SCRIPT_NAME" "$*" >&2; exit 1; }

# load_dotenv <key regex>: exports the project's .env entries whose names match the regex, without
# executing the file and without overriding the environment (values already set win).
load_dotenv() {
  local pattern="$1" file="$PROJECT_DIR/.env" line key value
  [[ -f "$file" ]] || return 0
  while IFS= read -r line || [[ -n "$line" ]]; do
    [[ "$line" =~ ^[[:space:]]*(export[[:space:]]+)?([A-Za-z_][A-Za-z0-9_]*)[[:space:]]*=[[:space:]]*(.*)$ ]] || continue
    key="${BASH_REMATCH[2]}"
    value="${BASH_REMATCH[3]}"
    [[ "$key" =~ $pattern ]] || continue
    value="${value%%[[:space:]]#*}"          # trailing comment
    value="${value%"${value##*[![:space:]]}"}" # trailing spaces
    value="${value#\"}"; value="${value%\"}"; value="${value#\'}"; value="${value%\'}"
    if [[ -z "${!key+x}" ]]; then export "$key=$value"; fi
  done <"$file"
}

# pg_bin_dir <program…>: the newest /usr/lib/postgresql/<version>/bin holding every program named
# (the version the clusters run), or nothing.
pg_bin_dir() {
  local dir program
  dir="$(ls -d /usr/lib/postgresql/*/bin 2>/dev/null | sort -V | tail -n 1 || true)"
  [[ -n "$dir" ]] || return 0
  for program in "$@"; do [[ -x "$dir/$program" ]] || return 0; done
  printf '%s' "$dir"
}

# The database URL of the app: DATABASE_URL (environment, then .env), else the dev cluster's
# default database, as the API itself chooses (apps/api/src/config/env.ts).
app_database_url() {
  load_dotenv '^(DATABASE_URL|RINGDOWN_PG_DEV_PORT)$'
  printf '%s' "${DATABASE_URL:-postgres://postgres@127.0.0.1:${RINGDOWN_PG_DEV_PORT:-5433}/ringdown}"
}

# split_database_url <url>: sets URL_BASE (scheme, credentials, host, port), URL_DATABASE (decoded)
# and URL_QUERY ("?…" or empty); fails on anything but a postgres:// URL naming a database.
split_database_url() {
  local url="$1"
  [[ "$url" =~ ^(postgres(ql)?://[^/?#]*)(/([^?#]*))?(\?[^#]*)?$ ]] || return 1
  URL_BASE="${BASH_REMATCH[1]}"
  URL_DATABASE="${BASH_REMATCH[4]}"
  URL_QUERY="${BASH_REMATCH[5]}"
  [[ -n "$URL_DATABASE" ]] || return 1
  URL_DATABASE="$(printf '%b' "${URL_DATABASE//%/\\x}")"
}

# The URL without its password, for messages.
redact_url() { printf '%s' "$1" | sed -E 's#^(postgres(ql)?://[^:/@]*):[^@]*@#\1:***@#'; }
