#!/usr/bin/env bash
# Issue 17's aim (a benchmark, not a test): on the demo, what a four-level availability curve
# (bench/specs/demo-availability.yaml: fractions 0.1, 0.25, 0.5, 1.0) costs against the imputer and source+imputed work
# of a plain run. Three cases, each run REPS times (default 3) in turn, under /usr/bin/time:
#   plain    the demo as it is (experiment-specs/demo.yaml's settings)
#   curve    the demo with the curve
#   imputed  the demo's imputers and source+imputed pipelines alone (feature-sets: [source+imputed], no curve): the
#            work the curve re-does at each level
# Prints one markdown row per run (wall, user+sys CPU, load average before) and then the medians and the ratio
# (curve - plain) / imputed, for CPU and wall (whole runs: start-up, loading, tables and report included); then the
# same aim measured on the work units alone in one JVM (org.viewgain.engine.AvailabilityBench). Usage: bench/availability.sh [JAR]   (default target/viewgain.jar)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
root="$(dirname "$here")"
jar="${1:-$root/target/viewgain.jar}"
[ $# -ge 1 ] || (cd "$root" && mvn -q -o -B -Dmaven.test.skip=true package)
reps="${REPS:-3}"
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
src="$here/specs/demo-availability.yaml"
sed "s#\.\./\.\./demo-data#$root/demo-data#g" "$src" > "$tmp/curve.yaml"
sed -e '/^availability-curve:/,$d' "$tmp/curve.yaml" > "$tmp/plain.yaml"
sed -e 's/^feature-sets: .*/feature-sets: [source+imputed]/' -e 's/^  compare: .*/  compare: []/' \
  "$tmp/plain.yaml" > "$tmp/imputed.yaml"
java -cp "$jar:$root/target/lib/*" org.viewgain.cli.Main check "$tmp/curve.yaml" | grep -E "model fits|availability"
java -cp "$jar:$root/target/lib/*" org.viewgain.cli.Main check "$tmp/imputed.yaml" | grep -E "model fits in"
echo "| case | run | wall s | CPU s (user+sys) | load before | exit |"
echo "|---|---|---|---|---|---|"
for r in $(seq 1 "$reps"); do
  for c in plain curve imputed; do
    load="$(cut -d' ' -f1-3 /proc/loadavg)"
    code=0
    /usr/bin/time -f "%e %U %S" -o "$tmp/time" java -cp "$jar:$root/target/lib/*" org.viewgain.cli.Main run \
      "$tmp/$c.yaml" --out "$tmp/out" --quiet >"$tmp/log" 2>&1 || code=$?
    read -r wall user sys < <(tail -1 "$tmp/time")
    cpu="$(echo "$user + $sys" | bc)"
    echo "| $c | $r | $wall | $cpu | $load | $code |"
    echo "$c $wall $cpu" >> "$tmp/all"
  done
done
python3 - "$tmp/all" <<'PY'
import sys, statistics
rows = [l.split() for l in open(sys.argv[1])]
med = {c: (statistics.median(float(r[1]) for r in rows if r[0] == c),
           statistics.median(float(r[2]) for r in rows if r[0] == c)) for c in ("plain", "curve", "imputed")}
for c, (w, u) in med.items():
    print(f"median {c}: wall {w:.1f} s, CPU {u:.1f} s")
for i, what in ((0, "wall"), (1, "CPU")):
    extra = med["curve"][i] - med["plain"][i]
    print(f"{what}: the curve adds {extra:.1f} s = {extra / med['imputed'][i]:.2f} x the imputer and source+imputed "
          f"work of a plain run ({med['imputed'][i]:.1f} s)")
PY
# in one JVM, the work units alone (no start-up, loading, tables or report), on 1 thread: see AvailabilityBench
cd "$root" && bench/test-main.sh 2g org.viewgain.engine.AvailabilityBench "$src" "${ROUNDS:-3}" 1
