#!/usr/bin/env bash
# Stops what scripts/start.sh started: the server, the fake mail server and PostgreSQL.
set -euo pipefail
ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$ROOT"
if [ -f .data/server.pid ]; then kill "$(cat .data/server.pid)" 2>/dev/null || true; rm -f .data/server.pid; fi
scripts/mail.sh stop 1025 || true
scripts/pg.sh stop
