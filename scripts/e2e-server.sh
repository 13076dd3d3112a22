#!/usr/bin/env bash
# The app as the end-to-end tests see it: the built client served by Express in production
# mode, a fresh database of its own (never the demo database), seeded with the demo data,
# mail to the tests' fake mail server.
#
# The demo seed's ~400 simulated respondents take most of its time (about 25 s on a quiet
# two-core machine), and only the journeys on the demo study read them: the server starts as
# soon as the seed has written the demo accounts, and the seed finishes beside the first
# journeys. It leaves $E2E_SEED_MARK.done (or .failed) behind, which those journeys wait for
# (e2e/support/demo-study.ts). Playwright stops the whole process group, the seed included.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
export PATH="$ROOT/node_modules/.bin:$PATH" # tools directly, without npx resolving each
PORT="${1:-5190}"
SEED_MARK="${E2E_SEED_MARK:-$ROOT/.data/e2e-seed-$PORT}"
DB="choicewright_e2e"
if [ -z "${DATABASE_URL:-}" ]; then
  scripts/pg.sh start >&2
  ADMIN_URL="$(scripts/pg.sh url postgres)"
  psql "$ADMIN_URL" -qtA -c "drop database if exists $DB with (force)" -c "create database $DB" >&2
  export DATABASE_URL="$(scripts/pg.sh url $DB)"
fi
scripts/mail.sh start 1125 1180 >&2
export NODE_ENV=production HOST=127.0.0.1 PORT="$PORT" APP_URL="http://127.0.0.1:$PORT" \
  SMTP_HOST=127.0.0.1 SMTP_PORT=1125 LOG_LEVEL=warn AUTH_RATE_LIMIT=10000 \
  JWT_SECRET="$(node -e "process.stdout.write(require('node:crypto').randomBytes(48).toString('base64url'))")" \
  CW_DEMO_CREDENTIALS_FILE="$ROOT/.data/e2e-demo-credentials.json"
# start_of FILE.ts: the command that starts it, from its process bundle
# (scripts/build-process-bundles.ts) when CW_PROCESS_BUNDLES=use, which scripts/test.sh sets once
# its build job has built every bundle (the kernel and engine workers too, not checked again
# here); through tsx otherwise. Relative paths without spaces: word splitting is safe.
start_of() {
  local bundle="dist/processes/$1.mjs"
  if [ "${CW_PROCESS_BUNDLES:-}" = use ] && [ -f "$bundle" ]; then
    echo "node $bundle"
  else
    echo "node --import tsx $1"
  fi
}
mkdir -p "$(dirname "$SEED_MARK")"
rm -f "$SEED_MARK.done" "$SEED_MARK.failed"
(if $(start_of server/seed.ts) >&2; then touch "$SEED_MARK.done"; else touch "$SEED_MARK.failed"; fi) &
[ -f dist/client/index.html ] || vite build >&2
if [ "${CW_PROCESS_BUNDLES:-}" != use ]; then
  tsx scripts/build-wasm.ts --if-stale >&2
  tsx scripts/build-engine-workers.ts --if-stale >&2
fi
$(start_of e2e/support/wait-for-demo-accounts.ts) "$SEED_MARK.failed" >&2
exec $(start_of server/main.ts)
