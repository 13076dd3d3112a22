#!/usr/bin/env bash
# Every test, from a fresh machine: installs what is missing (npm ci, PostgreSQL and Chromium
# from Debian's packages), then typecheck, lint, format check, the production build and vitest's
# unit project (no database) side by side, then vitest's API project (real PostgreSQL) beside
# the Playwright journeys in Debian's Chromium. Prints the time of every stage (and of each job of a
# parallel stage) at the end.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
. scripts/lib-install.sh
. scripts/lib-stages.sh

stage "install" ensure_node_modules
stage "chromium" ensure_chromium

PG_WAS_RUNNING=no
if [ -z "${DATABASE_URL:-}" ] && [ "$(scripts/pg.sh status 2>/dev/null || true)" = "running" ]; then PG_WAS_RUNNING=yes; fi
cleanup() {
  # Leave a server we found running alone (a developer's); stop what this run started.
  if [ "$PG_WAS_RUNNING" = no ] && [ -z "${DATABASE_URL:-}" ]; then scripts/pg.sh stop >/dev/null 2>&1 || true; fi
  if [ "${CI:-}" = "true" ]; then scripts/mail.sh stop 1125 >/dev/null 2>&1 || true; fi
}
trap 'cleanup; print_stage_times' EXIT

start_services() {
  scripts/pg.sh start && scripts/mail.sh start 1125 1180
}
stage "database and fake mail" start_services

# Jobs that need no database share the cores; each one's output is shown when it ends, and the
# stage fails if any of them fails. The audit: production packages may have no high or critical
# advisory (scripts/audit.sh). The unit project builds the WebAssembly kernel (its global setup)
# before its tests, so the API project finds it built. The typecheck is the native compiler
# (tsgo, @typescript/native-preview; same project, same diagnostics as tsc at a fifth of its
# CPU), single-threaded because the other jobs already keep both cores busy.
stage "audit, typecheck, lint, format, build, unit tests" parallel \
  "dependency audit" "bash scripts/audit.sh" \
  "typecheck" "npx tsgo --noEmit -p . --singleThreaded" \
  "lint" "npx eslint . --max-warnings=0" \
  "format" "npx prettier --check . --log-level warn" \
  "build" "npx vite build --logLevel warn" \
  "vitest unit project (no database)" "npx vitest run --project unit"
# The API project and the journeys need different things (the API project: PostgreSQL and
# Node; the journeys: Chromium and one server of the built app, with databases of their own),
# so each fills the other's waits; one after the other they left a core idle much of the time.
stage "vitest API project, end-to-end journeys" parallel \
  "vitest API project (PostgreSQL)" "npx vitest run --project api" \
  "end-to-end journeys (Playwright, Debian chromium)" "npx playwright test"
echo "== all tests passed"
