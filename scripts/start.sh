#!/usr/bin/env bash
# The start command: installs what is needed, then runs the whole product with
# demo data (the API applies the migrations and seeds on start). Ctrl-C stops it.
set -euo pipefail
cd "$(dirname "$0")/.."
. scripts/lib.sh
ensure_pnpm
install_packages
exec pnpm exec tsx scripts/stack.ts "$@"
