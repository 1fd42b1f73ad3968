# shellcheck shell=bash
# Helpers shared by demo.sh and test-all.sh: installing what is missing, starting services in the background, and
# stopping exactly those services again.

BENCHPLATE_ROOT="${BENCHPLATE_ROOT:-$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)}"
_run_tag="${_run_tag:-run}"
_started_pids=()
_started_names=()

say() { printf '%s: %s\n' "$_run_tag" "$*"; }
fail() {
  printf '%s: error: %s\n' "$_run_tag" "$*" >&2
  exit 1
}

is_root() { [[ "$(id -u)" == 0 ]]; }

apt_install() {
  command -v apt-get >/dev/null || fail "apt-get is not available: install $* by hand"
  local sudo=()
  if ! is_root; then
    command -v sudo >/dev/null || fail "installing $* needs root: run 'apt-get install -y $*' as root"
    sudo=(sudo -n)
  fi
  export DEBIAN_FRONTEND=noninteractive
  "${sudo[@]}" apt-get update -qq || fail "apt-get update failed"
  "${sudo[@]}" apt-get install -y -qq "$@" >/dev/null || fail "apt-get install $* failed"
}

# npm writes node_modules/.package-lock.json on every install, so it dates the last install better than the folder.
ensure_node_modules() {
  local marker="$BENCHPLATE_ROOT/node_modules/.package-lock.json"
  if [[ ! -f "$marker" || "$BENCHPLATE_ROOT/package-lock.json" -nt "$marker" ]]; then
    say "installing npm packages (npm ci)"
    (cd "$BENCHPLATE_ROOT" && npm ci --no-audit --no-fund) || fail "npm ci failed"
  fi
}

ensure_chromium() {
  if [[ ! -x /usr/bin/chromium ]]; then
    say "installing Debian's chromium for the browser tests"
    apt_install chromium
    [[ -x /usr/bin/chromium ]] || fail "chromium installed but /usr/bin/chromium is missing"
  fi
}

port_taken() {
  (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}

require_free_ports() {
  local port
  for port in "$@"; do
    if port_taken "$port"; then
      fail "port $port on 127.0.0.1 is already in use (a previous run, or another checkout on this machine?); stop it, or move the ports (BENCHPLATE_TEST_PORT_OFFSET for tests, PORT/S3_PORT/SMTP_PORT/MAIL_FAKE_INBOX_PORT for the demo)"
    fi
  done
}

# Each service gets its own process group (setsid), so stopping it also stops what npx/tsx/next spawned beneath it,
# and a Ctrl-C reaches only this script, which then stops the services in order.
start_service() {
  local name="$1" log="$2"
  shift 2
  if [[ "$log" == "-" ]]; then
    setsid "$@" &
  else
    mkdir -p "$(dirname "$log")"
    setsid "$@" >"$log" 2>&1 &
  fi
  _started_pids+=("$!")
  _started_names+=("$name")
}

service_alive() {
  local pid="$1"
  kill -0 "$pid" 2>/dev/null
}

last_service_pid() {
  printf '%s\n' "${_started_pids[${#_started_pids[@]} - 1]}"
}

stop_services() {
  local i pid name waited
  for ((i = ${#_started_pids[@]} - 1; i >= 0; i--)); do
    pid="${_started_pids[$i]}"
    name="${_started_names[$i]}"
    if service_alive "$pid"; then
      kill -TERM -- "-$pid" 2>/dev/null || kill -TERM "$pid" 2>/dev/null || true
      waited=0
      while service_alive "$pid" && ((waited < 100)); do
        sleep 0.1
        waited=$((waited + 1))
      done
      if service_alive "$pid"; then
        kill -KILL -- "-$pid" 2>/dev/null || kill -KILL "$pid" 2>/dev/null || true
      fi
      say "stopped $name"
    fi
    wait "$pid" 2>/dev/null || true
  done
  _started_pids=()
  _started_names=()
}

# Waits for a line in a service's log; fails early, with the log, if the service dies first.
wait_for_log_line() {
  local pid="$1" log="$2" pattern="$3" timeout="$4" name="$5" waited=0
  while ! grep -q -- "$pattern" "$log" 2>/dev/null; do
    if ! service_alive "$pid"; then
      tail -n 40 "$log" >&2 || true
      fail "$name exited before it was ready (log above: $log)"
    fi
    if ((waited >= timeout * 10)); then
      tail -n 40 "$log" >&2 || true
      fail "$name was not ready after ${timeout}s (log above: $log)"
    fi
    sleep 0.1
    waited=$((waited + 1))
  done
}

# Any HTTP answer counts: a 500 on the first page is for the tests to report, not a reason to wait longer.
wait_for_http() {
  local pid="$1" url="$2" timeout="$3" name="$4" log="${5:-}" waited=0
  until curl -s -o /dev/null --max-time 5 "$url"; do
    if ! service_alive "$pid"; then
      [[ -n "$log" ]] && { tail -n 40 "$log" >&2 || true; }
      fail "$name exited before answering at $url"
    fi
    if ((waited >= timeout * 4)); then
      [[ -n "$log" ]] && { tail -n 40 "$log" >&2 || true; }
      fail "$name did not answer at $url within ${timeout}s"
    fi
    sleep 0.25
    waited=$((waited + 1))
  done
}

db_running() {
  bash "$BENCHPLATE_ROOT/scripts/db.sh" status >/dev/null 2>&1
}
