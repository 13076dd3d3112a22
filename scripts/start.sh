#!/usr/bin/env bash
# Installs what is missing, starts PostgreSQL and the fake mail server, builds the client,
# migrates and seeds the demo data, then serves Choicewright on 127.0.0.1 until Ctrl-C
# (or `npm run stop`), which also stops the mail server and PostgreSQL. A web process that
# dies is restarted within two seconds (logged in .data/supervisor.log); that never stops
# PostgreSQL or the mail server.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
. scripts/lib-install.sh
. scripts/lib-daemon.sh

PORT="${PORT:-5180}"
export NODE_ENV=production HOST="${HOST:-127.0.0.1}" PORT
export APP_URL="${APP_URL:-http://$HOST:$PORT}"
export SMTP_HOST="${SMTP_HOST:-127.0.0.1}" SMTP_PORT="${SMTP_PORT:-1025}"

ensure_node_modules
# Production mode refuses to start without JWT_SECRET; locally we keep a random one in .data/.
if [ -z "${JWT_SECRET:-}" ]; then
  SECRET_FILE="${DATA_DIR:-$ROOT/.data}/jwt-secret"
  mkdir -p "$(dirname "$SECRET_FILE")"
  if [ ! -s "$SECRET_FILE" ]; then
    (umask 077 && node -e "process.stdout.write(require('node:crypto').randomBytes(48).toString('base64url'))" >"$SECRET_FILE")
  fi
  export JWT_SECRET="$(cat "$SECRET_FILE")"
fi
# Remember whether the database is someone else's: then it is neither started nor stopped here.
OWN_DATABASE=yes
[ -n "${DATABASE_URL:-}" ] && OWN_DATABASE=no
echo "== database"
scripts/pg.sh start
if [ -z "${DATABASE_URL:-}" ]; then export DATABASE_URL="$(scripts/pg.sh url)"; fi
echo "== fake mail server"
scripts/mail.sh start 1025 1080
echo "== building the WebAssembly kernel and the engine worker bundles (when their sources changed) and the client"
npx tsx scripts/build-wasm.ts --if-stale
npx tsx scripts/build-engine-workers.ts --if-stale
npx vite build --logLevel warn
echo "== migrating and seeding the demo data"
npx tsx server/seed.ts

STOPPING=no
stop_all() {
  trap - INT TERM EXIT
  STOPPING=yes
  echo
  echo "== stopping"
  [ -n "${SERVER_PID:-}" ] && kill "$SERVER_PID" 2>/dev/null && wait "$SERVER_PID" 2>/dev/null || true
  rm -f "$ROOT/.data/server.pid" "$ROOT/.data/start.pid"
  scripts/mail.sh stop 1025 || true
  if [ "$OWN_DATABASE" = yes ]; then env -u DATABASE_URL scripts/pg.sh stop || true; fi
}
# Ctrl-C or `npm run stop` (SIGTERM to this script) ends everything; the server dying does not.
trap 'STOPPING=yes; exit 0' INT TERM
trap stop_all EXIT
echo $$ > "$ROOT/.data/start.pid"

start_server() {
  node --import tsx server/main.ts &
  SERVER_PID=$!
  echo "$SERVER_PID" > "$ROOT/.data/server.pid"
}

start_server
for _ in $(seq 1 100); do curl -fsS -m 2 "http://$HOST:$PORT/api/health" >/dev/null 2>&1 && break; sleep 0.3; done
npx tsx scripts/demo-runs.ts || true
cat <<MSG

  Choicewright is running at $APP_URL
  Sent e-mail (fake mail server): http://127.0.0.1:1080
  Demo sign-ins are listed above (DEMO CREDENTIALS). Press Ctrl-C to stop everything.

MSG

# Supervise the web process: if it dies (a crash, an out-of-memory kill), start it again
# after a second, and log that. PostgreSQL and the mail server keep running meanwhile.
while [ "$STOPPING" = no ]; do
  set +e
  wait "$SERVER_PID"
  code=$?
  set -e
  [ "$STOPPING" = yes ] && break
  # `wait` also returns when this script receives a signal; only a dead server is restarted.
  if kill -0 "$SERVER_PID" 2>/dev/null; then continue; fi
  echo "[supervisor] $(date -u +%FT%TZ) web process $SERVER_PID exited (code $code); restarting in 1 s" \
    | tee -a "$ROOT/.data/supervisor.log" >&2
  sleep 1
  start_server
  echo "[supervisor] $(date -u +%FT%TZ) web process restarted as $SERVER_PID" \
    | tee -a "$ROOT/.data/supervisor.log" >&2
done
