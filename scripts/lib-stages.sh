# Stage timing and the job pool of scripts/test.sh.
STAGE_NAMES=()
STAGE_SECONDS=()
STAGE_DETAILS=()
STAGE_CPU=()
# Set by pool(): each job's start and time, printed under its stage in the summary.
POOL_DETAIL=""
RUN_STARTED=$(date +%s)

# The machine's CPU time so far, busy and idle, in seconds over all cores (/proc/stat's first
# line: user nice system idle iowait irq softirq steal; iowait counts as idle), so that the
# summary shows how much of the cores a stage used: every process, PostgreSQL and the browser
# too, and whatever else ran on the machine meanwhile.
machine_cpu() {
  awk -v hz="$(getconf CLK_TCK)" '/^cpu / { printf "%.0f %.0f\n", ($2 + $3 + $4 + $7 + $8 + $9) / hz, ($5 + $6) / hz; exit }' /proc/stat
}

# stage NAME CMD...: run CMD under a heading and record its wall time (a failed stage too, so
# the summary shows where the time went before the failure). CMD runs in a `||` context, where
# errexit is off: commands given here must return their own failure.
stage() {
  local name="$1" t0 rc=0 busy0 idle0 busy1 idle1
  shift
  echo "== $name"
  t0=$(date +%s)
  read -r busy0 idle0 < <(machine_cpu)
  POOL_DETAIL=""
  "$@" || rc=$?
  STAGE_NAMES+=("$name$([ $rc -eq 0 ] || echo " (FAILED)")")
  STAGE_SECONDS+=($(($(date +%s) - t0)))
  read -r busy1 idle1 < <(machine_cpu)
  STAGE_CPU+=("$((busy1 - busy0)) $((idle1 - idle0))")
  STAGE_DETAILS+=("$POOL_DETAIL")
  return $rc
}

# CPU seconds (user + system) of the waited-for children, from the output of `times` on stdin:
# a job's whole process tree, except processes that left it (a daemon such as PostgreSQL).
children_cpu_seconds() {
  sed -n 2p | awk '{ t = 0; for (i = 1; i <= 2; i++) { split($i, a, "m"); sub("s", "", a[2]); t += a[1] * 60 + a[2] } printf "%.0f", t }'
}

# pool KEY LABEL AFTER CMD [KEY LABEL AFTER CMD]...: one pool of jobs, each started as soon as
# the jobs named in AFTER (keys, comma-separated, or "-" for none) have passed, so that a
# latency-bound job (the browser journeys) runs beside the CPU-bound ones instead of after a
# whole stage. Each job's output is printed as a block when it ends; a job whose prerequisite
# failed is skipped; the pool fails if any job failed or was skipped. Records every job's start
# (seconds after the pool began) and time for the summary.
pool() {
  local dir keys=() labels=() afters=() cmds=() state=() starts=() t0 i n failed=0 progress
  dir="$(mktemp -d)"
  while [ $# -gt 0 ]; do
    keys+=("$1") labels+=("$2") afters+=("$3") cmds+=("$4") state+=(waiting) starts+=(0)
    shift 4
  done
  n=${#keys[@]}
  t0=$(date +%s)
  # passed KEY / failed KEY: the state of the job with that key.
  _pool_state_of() {
    local k
    for k in "${!keys[@]}"; do [ "${keys[$k]}" = "$1" ] && echo "${state[$k]}"; done
  }
  while :; do
    progress=0
    for i in $(seq 0 $((n - 1))); do
      [ "${state[$i]}" = waiting ] || continue
      local ready=yes dep st
      if [ "${afters[$i]}" != "-" ]; then
        for dep in ${afters[$i]//,/ }; do
          st="$(_pool_state_of "$dep")"
          case "$st" in
            passed) ;;
            failed | skipped) ready=skip ;;
            *) [ "$ready" = skip ] || ready=no ;;
          esac
        done
      fi
      if [ "$ready" = skip ]; then
        state[$i]=skipped
        progress=1
        echo "-- ${labels[$i]}: skipped (a job it needs failed)"
        POOL_DETAIL+="$(printf '    %-50s %5s   (skipped)' "${labels[$i]}" "-")"$'\n'
        failed=1
      elif [ "$ready" = yes ]; then
        state[$i]=running
        starts[$i]=$(($(date +%s) - t0))
        progress=1
        (
          s0=$(date +%s)
          set +e
          bash -c "${cmds[$i]}" >"$dir/$i.log" 2>&1
          rc=$?
          times >"$dir/$i.times" # in this shell: a command substitution would have no children
          echo "$rc $(($(date +%s) - s0)) $(children_cpu_seconds <"$dir/$i.times")" >"$dir/$i.rc.tmp" && mv "$dir/$i.rc.tmp" "$dir/$i.rc"
        ) &
      fi
    done
    for i in $(seq 0 $((n - 1))); do
      [ "${state[$i]}" = running ] && [ -f "$dir/$i.rc" ] || continue
      local rc secs cpu
      read -r rc secs cpu <"$dir/$i.rc"
      if [ "$rc" -eq 0 ]; then state[$i]=passed; else state[$i]=failed failed=1; fi
      progress=1
      echo "-- ${labels[$i]}: exit $rc in ${secs} s, ${cpu} s of CPU (started at +${starts[$i]} s)"
      POOL_DETAIL+="$(printf '    %-50s %5d s  (from +%d s, CPU %s s)%s' "${labels[$i]}" "$secs" "${starts[$i]}" "$cpu" "$([ "$rc" -eq 0 ] || echo " FAILED")")"$'\n'
      cat "$dir/$i.log"
    done
    local open=0
    for i in $(seq 0 $((n - 1))); do
      case "${state[$i]}" in waiting | running) open=1 ;; esac
    done
    [ $open -eq 1 ] || break
    [ $progress -eq 1 ] || sleep 1
  done
  wait
  rm -rf "$dir"
  return $failed
}

print_stage_times() {
  local rc=$? i
  echo
  echo "== time per stage (load average $(cut -d' ' -f1-3 /proc/loadavg))"
  local busy idle
  for i in "${!STAGE_NAMES[@]}"; do
    read -r busy idle <<<"${STAGE_CPU[$i]:-0 0}"
    printf '  %-52s %5d s   (machine CPU: %d s busy, %d s idle)\n' "${STAGE_NAMES[$i]}" "${STAGE_SECONDS[$i]}" "$busy" "$idle"
    printf '%s' "${STAGE_DETAILS[$i]:-}"
  done
  printf '  %-52s %5d s\n' "total" $(($(date +%s) - RUN_STARTED))
  return $rc
}
