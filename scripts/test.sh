#!/usr/bin/env bash
# The test command: installs what is needed (Debian's Chromium included) and runs
# every test: typecheck, unit and API tests of each package, then the end-to-end
# specs against the production build as `start.sh --prod` serves it. Ends with one line:
# "N passed, N failed".
set -uo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
ensure_pnpm || { echo "0 passed, 1 failed"; exit 1; }
install_packages || { echo "0 passed, 1 failed"; exit 1; }
if [ ! -x /usr/bin/chromium ] || ! command -v pdftotext >/dev/null; then
  echo "installing Debian's chromium and poppler-utils (pdftotext, for the PDF tests)"
  (apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium poppler-utils >/dev/null) || { echo "could not install chromium"; echo "0 passed, 1 failed"; exit 1; }
fi

status=0
passed=0
failed=0
reports=$(mktemp -d)
export REPORT_DIR="$reports"

# Each step below runs whatever the steps before it did; a step that fails counts, and a package whose
# tests could not run (no report written) counts as one failed test, so the closing line never hides one.
step() { # name, command...: runs a check that has no test count of its own; a failure counts as one
  local name=$1; shift
  echo "== $name"
  if ! "$@"; then status=1; failed=$((failed + 1)); echo "-- $name failed"; fi
}

step "format (prettier --check)" pnpm exec prettier --check --log-level warn .
step "lint (eslint)" pnpm exec eslint .
for pkg in packages/* apps/*; do
  [ -f "$pkg/package.json" ] || continue
  step "typecheck $pkg" pnpm --dir "$pkg" exec tsc --noEmit
done

echo "== unit and API tests"
for pkg in packages/* apps/*; do
  [ -f "$pkg/package.json" ] || continue
  grep -q '"test"' "$pkg/package.json" || continue
  name=$(basename "$pkg")
  echo "-- $pkg"
  if ! (cd "$pkg" && pnpm exec vitest run --reporter=default --reporter=json --outputFile.json="$reports/$name.json"); then
    status=1
  fi
  if [ -f "$reports/$name.json" ]; then
    passed=$((passed + $(node -p "JSON.parse(require('fs').readFileSync('$reports/$name.json','utf8')).numPassedTests")))
    failed=$((failed + $(node -p "const r=JSON.parse(require('fs').readFileSync('$reports/$name.json','utf8')); r.numFailedTests + r.testResults.filter((t) => t.status === 'failed' && t.assertionResults.length === 0).length")))
  else
    echo "-- $pkg: its tests did not run (no report); counted as one failure"
    failed=$((failed + 1))
  fi
done

# The specs run against what a shop deploys: both apps built (the type-check above already ran) and served
# from dist/ as `start.sh --prod` serves them, the API in production mode. Against the built apps a run
# takes about 5 min here; against the Vite dev servers it took about 11.
step "build both apps (vite build)" bash -c 'pnpm --dir apps/customer exec vite build --logLevel warn && pnpm --dir apps/shop exec vite build --logLevel warn'
echo "== end-to-end (Chromium against the running stack, production build)"
stack_log=$(mktemp)
STACK_DATA=data/e2e setsid pnpm exec tsx scripts/stack.ts --fresh --prod >"$stack_log" 2>&1 &
stack_pid=$!
stop_stack() { kill -TERM -- "-$stack_pid" 2>/dev/null; wait "$stack_pid" 2>/dev/null; }
trap stop_stack EXIT
for _ in $(seq 1 240); do
  grep -q '^READY' "$stack_log" && break
  kill -0 "$stack_pid" 2>/dev/null || break
  sleep 1
done
if grep -q '^READY' "$stack_log"; then
  if ! PW_JSON="$reports/e2e.json" pnpm exec playwright test -c e2e/playwright.config.ts; then status=1; fi
  if [ -f "$reports/e2e.json" ]; then
    passed=$((passed + $(node -p "const s=JSON.parse(require('fs').readFileSync('$reports/e2e.json','utf8')).stats; s.expected + s.flaky")))
    failed=$((failed + $(node -p "JSON.parse(require('fs').readFileSync('$reports/e2e.json','utf8')).stats.unexpected")))
  else
    failed=$((failed + 1))
  fi
else
  echo "the stack did not start; its log:"
  tail -n 60 "$stack_log"
  status=1
  failed=$((failed + 1))
fi
stop_stack
trap - EXIT
rm -rf "$reports" "$stack_log"
[ "$status" -ne 0 ] && [ "$failed" -eq 0 ] && failed=1
echo "$passed passed, $failed failed"
exit $status
