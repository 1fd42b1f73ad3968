#!/usr/bin/env bash
# npm test (and CI): the whole suite against its own database, fakes and app server (port 3100), so it can run beside
# a demo. Stages: unit, integration, build, e2e. A failing stage does not stop the later ones (except that e2e needs
# the build); the exit status is non-zero if any stage failed.
set -euo pipefail

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
_run_tag="test"
# shellcheck source=scripts/run-lib.sh
source "$ROOT/scripts/run-lib.sh"

db_was_running=false
db_started=false
cleanup() {
  local status=$?
  trap - INT TERM EXIT
  stop_services
  if [[ "$db_started" == true && "$db_was_running" == false ]]; then bash "$ROOT/scripts/db.sh" stop || true; fi
  exit "$status"
}
trap cleanup EXIT
trap 'exit 130' INT
trap 'exit 143' TERM

ensure_node_modules
ensure_chromium
# shellcheck source=scripts/env.sh
source "$ROOT/scripts/env.sh" test

require_free_ports "$PORT" "$S3_PORT" "$SMTP_PORT" "$MAIL_FAKE_INBOX_PORT"

if db_running; then db_was_running=true; fi
db_started=true
bash "$ROOT/scripts/db.sh" start
bash "$ROOT/scripts/db.sh" reset benchplate_test

logs="$ROOT/.data/test/logs"
rm -rf "$S3_DATA_DIR" "$MAIL_DATA_DIR" "$logs"
mkdir -p "$logs"

# The seed uploads demo captures, so object storage must be up before it runs.
start_service "fakes" "$logs/fakes.log" node_modules/.bin/tsx scripts/fakes.ts
wait_for_log_line "$(last_service_pid)" "$logs/fakes.log" "fakes ready" 30 "the service fakes"

say "migrating and seeding benchplate_test"
npm run --silent db:migrate || fail "migration of the test database failed"
npm run --silent db:seed || fail "seeding the test database failed"

results=()
failed=0
record() {
  results+=("$(printf '%-12s %s' "$1" "$2")")
  if [[ "$2" != ok ]]; then failed=1; fi
}

run_stage() {
  local name="$1"
  shift
  say "── $name ──"
  if "$@"; then record "$name" ok; else record "$name" FAILED; fi
}

# --passWithNoTests: a stage whose folder is still empty is not a failure.
run_stage unit node_modules/.bin/vitest run --project unit --passWithNoTests
run_stage integration node_modules/.bin/vitest run --project integration --passWithNoTests

say "── build ──"
# Its own build folder, so a demo serving .next in this checkout is never swapped out underneath.
export NEXT_DIST_DIR=.next-test
if node_modules/.bin/next build; then
  record build ok
  # The browser tests wait for analyses, which only the worker runs.
  start_service "worker" "$logs/worker.log" node_modules/.bin/tsx --conditions=react-server scripts/worker.ts
  wait_for_log_line "$(last_service_pid)" "$logs/worker.log" "worker ready" 30 "the worker"
  start_service "app" "$logs/app.log" node_modules/.bin/next start -p "$PORT"
  # In a subshell, so an app that never answers fails this stage instead of ending the run before the summary.
  if (wait_for_http "$(last_service_pid)" "$E2E_BASE_URL/" 60 "the app" "$logs/app.log"); then
    run_stage e2e node_modules/.bin/vitest run --project e2e --passWithNoTests
  else
    record e2e "FAILED (app did not start)"
  fi
else
  record build FAILED
  record e2e "FAILED (not run: no build)"
fi

echo
say "summary (logs in $logs)"
printf '  %s\n' "${results[@]}"
exit "$failed"
