#!/usr/bin/env bash
# Runs the whole e2e suite N times in a row, each run on a fresh production stack (as the test command runs it),
# optionally beside B busy loops (`node -e 'for(;;);'`) that keep B cores at 100 %, and stops at the first run
# that fails. One line per run, then "N of N runs passed". Apps are built once, first.
#
#   bash scripts/e2e-repeat.sh [runs=10] [busy-loops=2]
#   STACK_PORT_OFFSET=500 bash scripts/e2e-repeat.sh 10 2     # beside another stack
#
# Each run's Playwright output is kept in $E2E_REPEAT_LOGS (default /tmp/e2e-repeat).
set -uo pipefail
cd "$(dirname "$0")/.."
runs=${1:-10}
busy=${2:-2}
logs=${E2E_REPEAT_LOGS:-/tmp/e2e-repeat}
mkdir -p "$logs"
data="data/e2e-repeat-${STACK_PORT_OFFSET:-0}"

loops=()
stack_pid=
cleanup() {
  [ -n "$stack_pid" ] && kill -TERM -- "-$stack_pid" 2>/dev/null && wait "$stack_pid" 2>/dev/null
  for p in "${loops[@]}"; do kill "$p" 2>/dev/null; done
}
trap cleanup EXIT

pnpm --dir apps/customer exec vite build --logLevel warn && pnpm --dir apps/shop exec vite build --logLevel warn || {
  echo "the apps did not build"
  exit 1
}
for _ in $(seq 1 "$busy"); do
  node -e 'for(;;);' &
  loops+=($!)
done
echo "$(date -u +%FT%TZ) $runs runs beside $busy busy loops, commit $(git rev-parse --short HEAD), load $(cut -d' ' -f1-3 /proc/loadavg)"

passed=0
for run in $(seq 1 "$runs"); do
  stack_log="$logs/stack-$run.log"
  STACK_DATA="$data" setsid pnpm exec tsx scripts/stack.ts --fresh --prod >"$stack_log" 2>&1 &
  stack_pid=$!
  for _ in $(seq 1 600); do
    grep -q '^READY' "$stack_log" && break
    kill -0 "$stack_pid" 2>/dev/null || break
    sleep 1
  done
  start=$(date +%s)
  if grep -q '^READY' "$stack_log" &&
    PW_JSON="$logs/e2e-$run.json" pnpm exec playwright test -c e2e/playwright.config.ts >"$logs/e2e-$run.log" 2>&1; then
    result=passed
    passed=$((passed + 1))
  else
    result=FAILED
  fi
  kill -TERM -- "-$stack_pid" 2>/dev/null
  wait "$stack_pid" 2>/dev/null
  stack_pid=
  summary=$(grep -E '^\s+[0-9]+ (passed|failed|flaky)' "$logs/e2e-$run.log" 2>/dev/null | tr -s ' ' | tr '\n' ' ')
  echo "run $run: $result in $(($(date +%s) - start)) s, load $(cut -d' ' -f1-3 /proc/loadavg); $summary"
  [ "$result" = passed ] || break
done
echo "$passed of $runs runs passed"
[ "$passed" -eq "$runs" ]
