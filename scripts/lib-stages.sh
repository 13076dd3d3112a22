# Stage timing and parallel jobs for scripts/test.sh.
STAGE_NAMES=()
STAGE_SECONDS=()
STAGE_DETAILS=()
# Set by parallel(): each job's time, printed under its stage in the summary.
PARALLEL_DETAIL=""
RUN_STARTED=$(date +%s)

# stage NAME CMD...: run CMD under a heading and record its wall time (a failed stage too, so
# the summary shows where the time went before the failure). CMD runs in a `||` context, where
# errexit is off: commands given here must return their own failure.
stage() {
  local name="$1" t0 rc=0
  shift
  echo "== $name"
  t0=$(date +%s)
  PARALLEL_DETAIL=""
  "$@" || rc=$?
  STAGE_NAMES+=("$name$([ $rc -eq 0 ] || echo " (FAILED)")")
  STAGE_SECONDS+=($(($(date +%s) - t0)))
  STAGE_DETAILS+=("$PARALLEL_DETAIL")
  return $rc
}

# parallel LABEL CMD [LABEL CMD]...: run the commands at once, print each one's output as a
# block when it ends, fail if any failed.
parallel() {
  local dir labels=() pids=() failed=0 i
  dir="$(mktemp -d)"
  while [ $# -gt 0 ]; do
    labels+=("$1")
    (
      t0=$(date +%s)
      set +e
      bash -c "$2" >"$dir/${#labels[@]}.log" 2>&1
      rc=$?
      echo "$rc $(($(date +%s) - t0))" >"$dir/${#labels[@]}.rc"
      exit $rc
    ) &
    pids+=($!)
    shift 2
  done
  for i in "${!pids[@]}"; do
    wait "${pids[$i]}" || failed=1
    read -r rc secs <"$dir/$((i + 1)).rc"
    echo "-- ${labels[$i]}: exit $rc in ${secs} s"
    PARALLEL_DETAIL+="$(printf '    %-50s %5d s%s' "${labels[$i]}" "$secs" "$([ "$rc" -eq 0 ] || echo " (FAILED)")")"$'\n'
    cat "$dir/$((i + 1)).log"
  done
  rm -rf "$dir"
  return $failed
}

print_stage_times() {
  local rc=$? i
  echo
  echo "== time per stage (load average $(cut -d' ' -f1-3 /proc/loadavg))"
  for i in "${!STAGE_NAMES[@]}"; do
    printf '  %-52s %5d s\n' "${STAGE_NAMES[$i]}" "${STAGE_SECONDS[$i]}"
    printf '%s' "${STAGE_DETAILS[$i]:-}"
  done
  printf '  %-52s %5d s\n' "total" $(($(date +%s) - RUN_STARTED))
  return $rc
}
