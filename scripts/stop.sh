#!/usr/bin/env bash
# Stops what scripts/start.sh started: the server, the fake mail server and PostgreSQL.
# The start script supervises the server, so it is asked to stop (it then stops the rest);
# whatever is left afterwards is stopped here.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
if [ -f .data/start.pid ]; then
  SUPERVISOR="$(cat .data/start.pid)"
  if kill "$SUPERVISOR" 2>/dev/null; then
    for _ in $(seq 1 100); do kill -0 "$SUPERVISOR" 2>/dev/null || break; sleep 0.2; done
  fi
  rm -f .data/start.pid
fi
if [ -f .data/server.pid ]; then kill "$(cat .data/server.pid)" 2>/dev/null || true; rm -f .data/server.pid; fi
scripts/mail.sh stop 1025 || true
scripts/pg.sh stop
