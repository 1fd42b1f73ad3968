#!/usr/bin/env bash
# npm run demo: everything the product needs on one machine, with the demo data, at http://localhost:3000.
# Ctrl-C stops everything this script started (the database too, unless it was already running).
# BENCHPLATE_SKIP_BUILD=1 reuses the last `next build`.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
_run_tag="demo"
# shellcheck source=scripts/run-lib.sh
source "$ROOT/scripts/run-lib.sh"

db_was_running=false
db_started=false
cleanup() {
  local status=$?
  trap - INT TERM EXIT
  echo
  stop_services
  # Only a database this run started is stopped: one already running may serve a test run or another session.
  if [[ "$db_started" == true && "$db_was_running" == false ]]; then bash "$ROOT/scripts/db.sh" stop || true; fi
  exit "$status"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

ensure_node_modules
# shellcheck source=scripts/env.sh
source "$ROOT/scripts/env.sh"
# Turns on the admin page that lists what the mail fake received.
export MAIL_FAKE_INBOX_URL="${MAIL_FAKE_INBOX_URL:-http://127.0.0.1:$MAIL_FAKE_INBOX_PORT}"

require_free_ports "$PORT" "$S3_PORT" "$SMTP_PORT" "$MAIL_FAKE_INBOX_PORT"

if db_running; then db_was_running=true; fi
db_started=true
bash "$ROOT/scripts/db.sh" start

# The seed uploads demo captures, so object storage must be up before it runs.
fakes_log="$ROOT/.data/logs/fakes.log"
start_service "fakes" "$fakes_log" node_modules/.bin/tsx scripts/fakes.ts
wait_for_log_line "$(last_service_pid)" "$fakes_log" "fakes ready" 30 "the service fakes"
say "$(grep -m1 'fakes ready' "$fakes_log")"

say "migrating and seeding the database"
npm run --silent db:migrate
npm run --silent db:seed

if [[ "${BENCHPLATE_SKIP_BUILD:-}" == 1 && -f "$ROOT/.next/BUILD_ID" ]]; then
  say "reusing the last build (BENCHPLATE_SKIP_BUILD=1)"
else
  say "building the app"
  node_modules/.bin/next build
fi

if [[ -f "$ROOT/scripts/worker.ts" ]]; then
  start_service "worker" - node_modules/.bin/tsx --conditions=react-server scripts/worker.ts
fi

start_service "app" - node_modules/.bin/next start -p "$PORT"
wait_for_http "$(last_service_pid)" "http://localhost:$PORT/" 60 "the app"

cat <<EOF

  Benchplate is running at http://localhost:$PORT
  Demo accounts: see README.
  Mail the app sends: admin menu > Mail (fake inbox at $MAIL_FAKE_INBOX_URL/messages); fakes log: $fakes_log
  Ctrl-C stops everything.

EOF

# Returns when any service stops (or on Ctrl-C), and the EXIT trap then stops the rest.
wait -n "${_started_pids[@]}" || true
say "a service stopped unexpectedly; shutting down the rest"
exit 1
