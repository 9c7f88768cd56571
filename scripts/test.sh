#!/usr/bin/env bash
# Installs what the tests need and runs every test there is: typecheck, then
# the unit tests of each package. Ends with one line: "N passed, N failed".
set -uo pipefail
cd "$(dirname "$0")/.."

# pnpm, exactly the version package.json names (nested pnpm calls refuse another)
want=$(node -p "require('./package.json').packageManager.split('@')[1]")
if [ "$(pnpm -v 2>/dev/null)" != "$want" ]; then
  npm i -g "pnpm@$want" >/dev/null 2>&1 || { echo "could not install pnpm@$want"; exit 1; }
fi
# native addons build against the machine's own Node headers (no download)
[ -d /usr/include/node ] && export npm_config_nodedir=/usr
pnpm install --frozen-lockfile || { echo "0 passed, 1 failed"; exit 1; }

status=0
echo "== typecheck"
if ! pnpm -r typecheck; then status=1; fi

echo "== unit tests"
reports=$(mktemp -d)
export REPORT_DIR="$reports"
if ! pnpm -r --workspace-concurrency=1 exec sh -c 'vitest run --reporter=default --reporter=json --outputFile.json="$REPORT_DIR/$(basename "$PWD").json"' 2>&1; then status=1; fi
passed=0; failed=0
for f in "$reports"/*.json; do
  [ -f "$f" ] || continue
  p=$(node -p "JSON.parse(require('fs').readFileSync('$f','utf8')).numPassedTests")
  q=$(node -p "JSON.parse(require('fs').readFileSync('$f','utf8')).numFailedTests")
  passed=$((passed + p)); failed=$((failed + q))
done
rm -rf "$reports"
[ "$status" -ne 0 ] && [ "$failed" -eq 0 ] && failed=1
echo "$passed passed, $failed failed"
exit $status
