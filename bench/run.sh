#!/usr/bin/env bash
# Benchmarks viewgain (not a test): builds the jar, writes invented cohorts with org.viewgain.demo.ScaleCohort and
# times `viewgain run` with /usr/bin/time -v (wall, user+sys CPU, peak RSS). Writes bench/results.md.
#   bench/run.sh            demo + 400 x 100
#   bench/run.sh --large    also 1,000 x 268 (35,778 edges per view; needs ~1 GB of disk under bench/work/)
# JAVA_OPTS defaults to -Xmx2g (the issue-2 aim), LARGE_JAVA_OPTS to -Xmx8g (the issue-7 aim); THREADS to all
# cores; each run is stopped after TIMEOUT seconds (default 3600; exit 124 in the table).
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
root="$(dirname "$here")"
work="$here/work"
jar="$root/target/viewgain.jar"
large=0
[ "${1:-}" = "--large" ] && large=1
export JAVA_OPTS="${JAVA_OPTS:--Xmx2g}"
threads="${THREADS:-$(nproc)}"
limit="${TIMEOUT:-3600}"
mkdir -p "$work"

echo "[bench] building the jar" >&2
(cd "$root" && mvn -q -o -B -Dmaven.test.skip=true package)

results="$here/results.md"
{
  echo "# viewgain benchmark results"
  echo
  echo "- date: $(date -u +%Y-%m-%dT%H:%M:%SZ), commit $(cd "$root" && git rev-parse --short HEAD)"
  echo "- nproc: $(nproc); memory: $(free -g | awk '/^Mem:/ {print $2}') GB; cpu: $(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2 | sed 's/^ //')"
  echo "- java: $(java -version 2>&1 | head -1)"
  echo "- JAVA_OPTS: $JAVA_OPTS (large case: ${LARGE_JAVA_OPTS:--Xmx8g}); --threads $threads; timeout ${limit}s"
  echo
  echo "| case | subjects x regions | edges/view | wall s | user+sys CPU s | CPU/wall | peak RSS MB | load avg before | exit |"
  echo "|---|---|---|---|---|---|---|---|---|"
} > "$results"

# time_run NAME SIZE EDGES SPEC: one timed `viewgain run`, one row in the table
time_run() {
  local name="$1" size="$2" edges="$3" spec="$4" log="$work/$1.time" out="$work/$1.out"
  local load; load="$(cut -d' ' -f1-3 /proc/loadavg)"
  echo "[bench] $name: running (load average $load)" >&2
  local code=0
  /usr/bin/time -v -o "$log" timeout "$limit" java $JAVA_OPTS -jar "$jar" run "$spec" --out "$work/results" --quiet \
    --threads "$threads" >"$out" 2>&1 || code=$?
  local wall user sys rss
  wall="$(awk -F': ' '/Elapsed \(wall clock\)/ {n=split($2,a,":"); s=0; for(i=1;i<=n;i++) s=s*60+a[i]; print s}' "$log")"
  user="$(awk -F': ' '/User time/ {print $2}' "$log")"
  sys="$(awk -F': ' '/System time/ {print $2}' "$log")"
  rss="$(awk -F': ' '/Maximum resident set size/ {printf "%.0f", $2/1024}' "$log")"
  local cpu ratio
  cpu="$(awk -v u="$user" -v s="$sys" 'BEGIN {printf "%.1f", u+s}')"
  ratio="$(awk -v c="$cpu" -v w="$wall" 'BEGIN {printf "%.2f", (w > 0 ? c/w : 0)}')"
  echo "| $name | $size | $edges | $wall | $cpu | $ratio | $rss | $load | $code |" >> "$results"
  echo "[bench] $name: wall ${wall}s, cpu ${cpu}s, peak RSS ${rss} MB, exit $code" >&2
}

# generate NAME SUBJECTS REGIONS: writes bench/work/NAME unless already there
generate() {
  local dir="$work/$1"
  if [ ! -f "$dir/subjects.csv" ]; then
    echo "[bench] writing cohort $1 ($2 subjects x $3 regions)" >&2
    local t0; t0="$(date +%s.%N)"
    java -cp "$jar" org.viewgain.demo.ScaleCohort "$dir" "$2" "$3" 1
    echo "[bench] cohort $1 written in $(awk -v a="$t0" -v b="$(date +%s.%N)" 'BEGIN {printf "%.1f", b-a}') s" >&2
  fi
}

time_run demo "120 x 24" 276 "$root/experiment-specs/demo.yaml"
generate c400x100 400 100
time_run scale-400x100 "400 x 100" 4950 "$here/specs/scale-400x100.yaml"
if [ "$large" = 1 ]; then
  generate c1000x268 1000 268
  JAVA_OPTS="${LARGE_JAVA_OPTS:--Xmx8g}" time_run scale-1000x268 "1000 x 268" 35778 "$here/specs/scale-1000x268.yaml"
fi
{
  echo
  echo "Peak RSS is the whole JVM (heap, metaspace, threads) as reported by /usr/bin/time -v; the load average is"
  echo "/proc/loadavg (1, 5, 15 min) just before the run (the machine may be shared)."
} >> "$results"
cat "$results"
