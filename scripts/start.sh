#!/usr/bin/env bash
# The start command: installs what is needed, then runs the whole product with
# demo data (the API applies the migrations and seeds on start). Ctrl-C stops it.
# With --prod: type-checks and builds everything (pnpm build), then serves the built apps
# and runs the API in production mode with secrets generated into data/secrets.json.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
ensure_pnpm
install_packages
for arg in "$@"; do
  if [ "$arg" = "--prod" ]; then pnpm build; fi
done
exec pnpm exec tsx scripts/stack.ts "$@"
