#!/usr/bin/env bash
# Every test, from a fresh machine: installs what is missing (npm ci, PostgreSQL and Chromium
# from Debian's packages), then typecheck, lint, unit + API tests against a real PostgreSQL,
# a production build, and the Playwright journeys in Debian's Chromium.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
. scripts/lib-install.sh
started=$(date +%s)

ensure_node_modules
ensure_chromium

PG_WAS_RUNNING=no
if [ -z "${DATABASE_URL:-}" ] && [ "$(scripts/pg.sh status 2>/dev/null || true)" = "running" ]; then PG_WAS_RUNNING=yes; fi
cleanup() {
  # Leave a server we found running alone (a developer's); stop what this run started.
  if [ "$PG_WAS_RUNNING" = no ] && [ -z "${DATABASE_URL:-}" ]; then scripts/pg.sh stop >/dev/null 2>&1 || true; fi
  if [ "${CI:-}" = "true" ]; then scripts/mail.sh stop 1125 >/dev/null 2>&1 || true; fi
}
trap cleanup EXIT
echo "== database"
scripts/pg.sh start
echo "== fake mail server for the tests"
scripts/mail.sh start 1125 1180

echo "== dependency audit (production packages: no high or critical advisories)"
bash scripts/audit.sh
echo "== typecheck"
npx tsc --noEmit -p .
echo "== lint"
npx eslint . --max-warnings=0
npx prettier --check . --log-level warn
echo "== unit, numerical and API tests (vitest)"
npx vitest run
echo "== production build"
npx vite build --logLevel warn
echo "== end-to-end journeys (Playwright, Debian chromium)"
npx playwright test
echo "== all tests passed in $(( $(date +%s) - started )) s"
