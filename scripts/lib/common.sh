# Shared helpers for scripts/*.sh (sourced, not run).

# Repository root, whatever the caller's working directory.
RINGDOWN_ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"

log() { printf '\033[1m▸ %s\033[0m\n' "$*"; }
warn() { printf 'warning: %s\n' "$*" >&2; }
die() { printf 'error: %s\n' "$*" >&2; exit 1; }

# Exports KEY=VALUE lines of the project's .env without executing the file and without
# overriding variables already set in the environment (the environment wins, as in dotenv).
load_dotenv() {
  local file="$RINGDOWN_ROOT/.env" line key value
  [[ -f "$file" ]] || return 0
  while IFS= read -r line || [[ -n "$line" ]]; do
    [[ "$line" =~ ^[[:space:]]*(export[[:space:]]+)?([A-Za-z_][A-Za-z0-9_]*)[[:space:]]*=[[:space:]]*(.*)$ ]] || continue
    key="${BASH_REMATCH[2]}"
    value="${BASH_REMATCH[3]}"
    if [[ "$value" =~ ^\"(.*)\"[[:space:]]*(#.*)?$ ]] || [[ "$value" =~ ^\'(.*)\'[[:space:]]*(#.*)?$ ]]; then
      value="${BASH_REMATCH[1]}"
    else
      value="${value%%[[:space:]]#*}"            # trailing comment
      value="${value%"${value##*[![:space:]]}"}" # trailing spaces
    fi
    if [[ -z "${!key+x}" ]]; then export "$key=$value"; fi
  done <"$file"
}

# Node.js 20.19+ (or 22+) is required; say so plainly instead of failing later.
check_node() {
  command -v node >/dev/null 2>&1 || die "Node.js is not installed. Install Node.js 20.19 or newer (https://nodejs.org), then run this again."
  local version major minor
  version="$(node -p 'process.versions.node')"
  major="${version%%.*}"
  minor="${version#*.}"; minor="${minor%%.*}"
  if ((major < 20 || (major == 20 && minor < 19))); then
    die "Node.js $version is too old; Ringdown needs 20.19 or newer."
  fi
}

# Installs dependencies when node_modules is missing, or reinstalls them exactly from the
# lockfile when package-lock.json is newer than the last install (npm records each install in
# node_modules/.package-lock.json).
ensure_dependencies() {
  local marker="$RINGDOWN_ROOT/node_modules/.package-lock.json"
  if [[ ! -d "$RINGDOWN_ROOT/node_modules" || ! -f "$marker" ]]; then
    log "Installing dependencies (npm ci)"
    (cd "$RINGDOWN_ROOT" && npm ci --no-audit --no-fund)
  elif [[ "$RINGDOWN_ROOT/package-lock.json" -nt "$marker" ]]; then
    log "package-lock.json changed since the last install: reinstalling (npm ci)"
    (cd "$RINGDOWN_ROOT" && npm ci --no-audit --no-fund)
  fi
}

# Makes sure Debian's Chromium is at $RINGDOWN_CHROMIUM (default /usr/bin/chromium), installing
# it with apt-get when running as root, and exports RINGDOWN_CHROMIUM. $1 says what needs it.
ensure_chromium() {
  local purpose="$1" chromium="${RINGDOWN_CHROMIUM:-/usr/bin/chromium}"
  if [[ ! -x "$chromium" ]]; then
    if [[ "$(id -u)" == 0 ]] && command -v apt-get >/dev/null 2>&1; then
      log "Installing Debian's chromium for $purpose"
      DEBIAN_FRONTEND=noninteractive apt-get update -qq
      DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
    else
      die "Chromium is needed for $purpose and is not at $chromium. Install it with: sudo apt-get install -y chromium (or set RINGDOWN_CHROMIUM)"
    fi
  fi
  export RINGDOWN_CHROMIUM="$chromium"
}

# Fails with one clear line when something already listens on the TCP port.
ensure_port_free() {
  local port="$1" status=0
  node -e '
    const server = require("node:net").createServer();
    server.once("error", (e) => process.exit(e.code === "EADDRINUSE" ? 3 : 4));
    server.listen(Number(process.argv[1]), () => server.close(() => process.exit(0)));
  ' "$port" || status=$?
  case "$status" in
    0) ;;
    3) die "port $port is already in use by another program; stop it or choose another port, e.g. PORT=$((port + 1)) npm start" ;;
    *) die "cannot listen on port $port (not a usable port number, or not permitted)" ;;
  esac
}
