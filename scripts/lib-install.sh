# Shared by start.sh and test.sh: install npm packages from the lock file when needed
# (--prefer-offline: tarballs already in npm's cache are not revalidated against the registry).
ensure_node_modules() {
  if [ "${CI:-}" = "true" ] || [ ! -d node_modules ] || [ ! -f node_modules/.package-lock.json ] \
    || [ package-lock.json -nt node_modules/.package-lock.json ]; then
    echo "== installing npm packages (npm ci)"
    npm ci --prefer-offline --no-audit --no-fund --include=dev
  fi
}

# Debian's Chromium for the browser tests (never a downloaded browser).
ensure_chromium() {
  if [ -x /usr/bin/chromium ]; then return 0; fi
  echo "== installing Debian's chromium (apt-get)"
  if [ "$(id -u)" -ne 0 ]; then echo "need root to apt-get install chromium" >&2; return 1; fi
  DEBIAN_FRONTEND=noninteractive apt-get update -qq
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null
}
