#!/usr/bin/env bash
# Local fake mail server (maildev): accepts SMTP on loopback and shows the mail on a web page
# with an HTTP API. Used by the start command and the tests instead of a real SMTP host.
#   scripts/mail.sh start [smtp-port] [web-port]   (idempotent)
#   scripts/mail.sh stop  [smtp-port]
set -euo pipefail
# shellcheck source=lib-data-dir.sh
. "$(dirname "${BASH_SOURCE[0]}")/lib-data-dir.sh"
SMTP_PORT="${2:-1025}"
WEB_PORT="${3:-1080}"
PIDFILE="$DATA_ROOT/maildev-$SMTP_PORT.pid"
mkdir -p "$DATA_ROOT"
# shellcheck source=lib-daemon.sh
. "$ROOT/scripts/lib-daemon.sh"

up() { curl -fsS -m 2 "http://127.0.0.1:$WEB_PORT/api/email" >/dev/null 2>&1; }

case "${1:-}" in
  start)
    if up; then echo "[mail] fake mail server already running (inbox http://127.0.0.1:$WEB_PORT)" >&2; exit 0; fi
    start_daemon "$DATA_ROOT/maildev-$SMTP_PORT.log" "$PIDFILE" \
      "$ROOT/node_modules/.bin/maildev" --smtp "$SMTP_PORT" --web "$WEB_PORT" --ip 127.0.0.1 --web-ip 127.0.0.1
    # Another test run may win the race for the port: any server answering is fine.
    for _ in $(seq 1 150); do up && break; sleep 0.1; done
    up || { echo "[mail] maildev did not start; see $DATA_ROOT/maildev-$SMTP_PORT.log" >&2; exit 1; }
    echo "[mail] fake mail server: SMTP 127.0.0.1:$SMTP_PORT, inbox http://127.0.0.1:$WEB_PORT" >&2
    ;;
  stop)
    if [ -f "$PIDFILE" ]; then kill "$(cat "$PIDFILE")" 2>/dev/null || true; rm -f "$PIDFILE"; fi
    ;;
  *) echo "usage: $0 start|stop [smtp-port] [web-port]" >&2; exit 2 ;;
esac
