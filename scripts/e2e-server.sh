#!/usr/bin/env bash
# The app as the end-to-end tests see it: the built client served by Express in production
# mode, a fresh database of its own (never the demo database), seeded with the demo data,
# mail to the tests' fake mail server.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
PORT="${1:-5190}"
DB="choicewright_e2e"
if [ -z "${DATABASE_URL:-}" ]; then
  scripts/pg.sh start >&2
  ADMIN_URL="$(scripts/pg.sh url postgres)"
  psql "$ADMIN_URL" -qtA -c "drop database if exists $DB with (force)" -c "create database $DB" >&2
  export DATABASE_URL="$(scripts/pg.sh url $DB)"
fi
scripts/mail.sh start 1125 1180 >&2
[ -f dist/client/index.html ] || npx vite build >&2
npx tsx scripts/build-wasm.ts --if-stale >&2
export NODE_ENV=production HOST=127.0.0.1 PORT="$PORT" APP_URL="http://127.0.0.1:$PORT" \
  SMTP_HOST=127.0.0.1 SMTP_PORT=1125 LOG_LEVEL=warn AUTH_RATE_LIMIT=10000 \
  JWT_SECRET="$(node -e "process.stdout.write(require('node:crypto').randomBytes(48).toString('base64url'))")" \
  CW_DEMO_CREDENTIALS_FILE="$ROOT/.data/e2e-demo-credentials.json"
npx tsx server/seed.ts >&2
exec node --import tsx server/main.ts
