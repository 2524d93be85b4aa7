#!/usr/bin/env bash
# Times viewgain and the scikit-learn script on the same experiment (bench/specs/nested-160x35.yaml), one after the
# other, and prints a markdown table; WARMUP=0 skips the warm-up. Builds nothing itself: the first viewgain run is an untimed warm-up (it also
# builds the jar when sources changed). Usage: bench/python/side-by-side.sh [OUT_DIR]   (default /tmp/sbs-out)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
main="$(cd "$here/../.." && pwd)"
spec="$main/bench/specs/nested-160x35.yaml"
out="${1:-/tmp/sbs-out}"
logs="$(mktemp -d /tmp/sbs-logs.XXXXXX)"

if [ "${WARMUP:-1}" != 0 ]; then  # WARMUP=0 skips it (only when viewgain was just run on the current sources)
  echo "warm-up: viewgain run (untimed) ..." >&2
  rm -rf "$out.warm"
  "$main/viewgain" run "$spec" --out "$out.warm" --quiet >"$logs/warm.log" 2>&1
fi

# run NAME CMD...: records load before, then "%e %U %S" of the command
run() {
  local name="$1"; shift
  cut -d' ' -f1-3 /proc/loadavg >"$logs/$name.load"
  /usr/bin/time -o "$logs/$name.time" -f "%e %U %S" "$@" >"$logs/$name.out" 2>"$logs/$name.err"
  if grep -q "building" "$logs/$name.err"; then echo "note: $name rebuilt its jar during the timed run" >&2; fi
}

rm -rf "$out"
run viewgain "$main/viewgain" run "$spec" --out "$out" --quiet
run sklearn python3 "$here/nested_160x35.py" --n-jobs 2

echo "date: $(date -u '+%Y-%m-%d %H:%M UTC'), $(nproc) cores, logs in $logs"
echo
echo "| tool | wall s | user+sys s | load before (1/5/15 min) |"
echo "|---|---|---|---|"
for name in viewgain sklearn; do
  read -r e u s <"$logs/$name.time"
  printf '| %s | %s | %.2f | %s |\n' "$name" "$e" "$(echo "$u + $s" | bc -l)" "$(cat "$logs/$name.load")"
done
echo
echo "scikit-learn script output:"
cat "$logs/sklearn.out"
