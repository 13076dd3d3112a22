#!/usr/bin/env bash
# Development: API with reload (tsx watch) behind Vite's dev server and its proxy.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
. scripts/lib-install.sh
ensure_node_modules
scripts/pg.sh start
scripts/mail.sh start 1025 1080
export DATABASE_URL="${DATABASE_URL:-$(scripts/pg.sh url)}" PORT="${API_PORT:-5180}" APP_URL="http://127.0.0.1:5173"
npx tsx scripts/build-wasm.ts --if-stale
npx tsx scripts/build-engine-workers.ts --if-stale
npx tsx server/seed.ts
npx tsx watch server/main.ts &
API_PID=$!
trap 'kill $API_PID 2>/dev/null || true' INT TERM EXIT
npx vite
