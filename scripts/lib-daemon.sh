# Starts a command fully detached: new session, no inherited descriptors beyond stdio, output to a log.
# usage: start_daemon LOGFILE PIDFILE cmd args...
start_daemon() {
  local log="$1" pidfile="$2"; shift 2
  (
    for fd in $(ls /proc/$BASHPID/fd); do
      if [ "$fd" -gt 2 ] 2>/dev/null; then eval "exec $fd>&-" 2>/dev/null || true; fi
    done
    exec setsid "$@" </dev/null >"$log" 2>&1
  ) &
  echo $! >"$pidfile"
}
