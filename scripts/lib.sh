# Shared by start.sh and test.sh: pnpm at the pinned version, then the packages.
ensure_pnpm() {
  local want
  want=$(node -p "require('./package.json').packageManager.split('@')[1]")
  if [ "$(pnpm -v 2>/dev/null)" != "$want" ]; then
    echo "installing pnpm@$want"
    npm i -g "pnpm@$want" >/dev/null 2>&1 || { echo "could not install pnpm@$want with npm"; return 1; }
  fi
}

install_packages() {
  # native addons (better-sqlite3) build against the machine's own Node headers: nothing to download
  [ -d /usr/include/node ] && export npm_config_nodedir=/usr
  pnpm install --frozen-lockfile
}
