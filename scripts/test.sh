#!/usr/bin/env bash
# Every test, from a fresh machine: installs what is missing (npm ci, PostgreSQL and Chromium
# from Debian's packages), then one pool of jobs: the production build, then the Playwright
# journeys in Debian's Chromium, vitest's API project (real PostgreSQL) and unit project (no
# database), beside the typecheck, lint, format check and dependency audit. Prints the time of
# every stage (with the machine's busy and idle CPU over it) and of each job of the pool (with
# when it started) at the end.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
# The tools from node_modules/.bin directly: npx spends ~0.3 s of CPU per call resolving them.
export PATH="$ROOT/node_modules/.bin:$PATH"
# The journeys' server starts its processes from the bundles the build job makes
# (scripts/e2e-server.sh), not through tsx.
export CW_PROCESS_BUNDLES=use
. scripts/lib-install.sh
. scripts/lib-stages.sh

stage "install" ensure_node_modules
stage "chromium" ensure_chromium

PG_WAS_RUNNING=no
if [ -z "${DATABASE_URL:-}" ] && [ "$(scripts/pg.sh status 2>/dev/null || true)" = "running" ]; then PG_WAS_RUNNING=yes; fi
# In CI the cluster lives in the throwaway clone and is stopped at the end: no durability needed
# (scripts/pg.sh). Never for a developer's cluster, which npm start keeps using.
if [ "${CI:-}" = "true" ] && [ "$PG_WAS_RUNNING" = no ] && [ -z "${DATABASE_URL:-}" ]; then
  export CW_PG_THROWAWAY=yes
fi
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

# One pool of jobs on the two cores, each started as soon as what it needs is there; each one's
# output is shown when it ends, and the run fails if any of them fails.
# - The build (the WebAssembly kernel, the engine worker bundles, then the client) comes first:
#   the journeys serve the built client and both vitest projects and the journeys' server use the
#   kernel and start engine threads from the bundles (their global setups and
#   scripts/e2e-server.sh then find them built instead of building them at the same time).
# - The journeys (Playwright, one browser, one server with its own migrated and seeded database)
#   are the longest job but mostly wait on the browser and the server, so they start right after
#   the build and the CPU-bound jobs fill their waits; before, they waited for a whole stage.
# - Both vitest projects run in one vitest process: one start, one global setup and one pool of
#   two test workers instead of two of each competing for the same two cores.
# - The audit: production packages may have no high or critical advisory (scripts/audit.sh).
# - The typecheck is the native compiler (tsgo, @typescript/native-preview; the same project and
#   diagnostics as tsc at a fifth of its CPU), single-threaded since the pool keeps both cores busy.
# - Typecheck, lint and format run at a lower priority (nice): they are off the critical path
#   (build, then the tests), so they take the CPU the build and the tests leave.
# - The format check is the same Prettier through its newer command line, which checks the same
#   files (.gitignore and .prettierignore) with about a quarter less CPU; no cache, one process.
stage "build, checks, unit and API tests, end-to-end journeys" pool \
  build "build (WebAssembly kernel, engine workers, processes, client)" - \
  "tsx scripts/build-wasm.ts && tsx scripts/build-engine-workers.ts && tsx scripts/build-process-bundles.ts && vite build --logLevel warn" \
  e2e "end-to-end journeys (Playwright, Debian chromium)" build "playwright test" \
  vitest "vitest, unit and API projects (PostgreSQL)" build "vitest run" \
  typecheck "typecheck" - "nice -n 10 tsgo --noEmit -p . --singleThreaded" \
  lint "lint" - "nice -n 10 eslint . --max-warnings=0" \
  format "format" - "nice -n 10 prettier --experimental-cli --no-cache --no-parallel --check . --log-level warn" \
  audit "dependency audit" - "bash scripts/audit.sh"
echo "== all tests passed"
