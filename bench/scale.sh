#!/usr/bin/env bash
# Scale benchmark for issue 7 (not a test): for each size SUBJECTSxREGIONS given (default: 400, 1,000 and 2,000
# subjects with 100 and 268 regions), writes an invented cohort with org.viewgain.demo.ScaleCohort under
# bench/work/, fills bench/specs/scale-template.yaml in, and times `viewgain run` with /usr/bin/time -v and the
# JVM's GC log. One row per size goes to bench/scale-results.md: wall, user+sys CPU, peak RSS (the whole process,
# which includes heap the JVM reserved but did not need), the largest heap occupancy after any collection (an upper
# bound: a young collection leaves old garbage in place) and the largest occupancy after a marking cycle's remark
# (close to what the run really kept alive), with the load average before the run.
#   bench/scale.sh [SIZE...]       env: JAVA_OPTS (-Xmx8g), THREADS (nproc), TIMEOUT per run (5400 s)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
root="$(dirname "$here")"
work="$here/work"
jar="$root/target/viewgain.jar"
sizes=("$@")
[ ${#sizes[@]} -eq 0 ] && sizes=(400x100 1000x100 2000x100 400x268 1000x268 2000x268)
opts="${JAVA_OPTS:--Xmx8g}"
threads="${THREADS:-$(nproc)}"
limit="${TIMEOUT:-5400}"
mkdir -p "$work/specs"

echo "[scale] building the jar" >&2
(cd "$root" && mvn -q -o -B -Dmaven.test.skip=true package)
# the commit the jar was built from (a '+' when the working tree had changes)
commit="$(cd "$root" && git rev-parse --short HEAD)$(cd "$root" && git diff --quiet HEAD -- src pom.xml || echo +)"

results="$here/scale-results.md"
if [ ! -f "$results" ]; then
  {
    echo "# viewgain scale benchmark (bench/scale.sh)"
    echo
    echo "Spec: bench/specs/scale-template.yaml (Weka random forest + linear SVM, ridge imputer, 3 feature sets, 5 x 1"
    echo "folds). Peak RSS is the whole process; 'after GC' is the largest heap occupancy right after any collection"
    echo "(an upper bound on live data); 'after remark' the largest after a marking cycle ('-' when none ran)."
    echo
    echo "| date (UTC) | commit | size | edges/view | wall s | user+sys CPU s | peak RSS MB | after GC MB | after remark MB | JAVA_OPTS | threads | load before | exit |"
    echo "|---|---|---|---|---|---|---|---|---|---|---|---|---|"
  } > "$results"
fi

for size in "${sizes[@]}"; do
  n="${size%x*}"; r="${size#*x}"
  cohort="$work/c$size"
  if [ ! -f "$cohort/subjects.csv" ]; then
    echo "[scale] writing cohort $size" >&2
    java -cp "$jar" org.viewgain.demo.ScaleCohort "$cohort" "$n" "$r" 1
  fi
  spec="$work/specs/scale-$size.yaml"
  sed -e "s#@SUBJECTS@#$n#g" -e "s#@REGIONS@#$r#g" -e "s#@COHORT@#$cohort#g" "$here/specs/scale-template.yaml" > "$spec"
  log="$work/scale-$size.time"; gc="$work/scale-$size.gc"; out="$work/scale-$size.out"
  load="$(cut -d' ' -f1-3 /proc/loadavg)"
  echo "[scale] $size: running (load average $load)" >&2
  code=0
  # shellcheck disable=SC2086
  /usr/bin/time -v -o "$log" timeout "$limit" java $opts "-Xlog:gc:file=$gc" -cp "$jar:$root/target/lib/*" \
    org.viewgain.cli.Main run "$spec" --out "$work/results" --threads "$threads" >"$out" 2>&1 || code=$?
  wall="$(awk -F': ' '/Elapsed \(wall clock\)/ {n=split($2,a,":"); s=0; for(i=1;i<=n;i++) s=s*60+a[i]; print s}' "$log")"
  cpu="$(awk -F': ' '/User time/ {u=$2} /System time/ {s=$2} END {printf "%.0f", u+s}' "$log")"
  rss="$(awk -F': ' '/Maximum resident set size/ {printf "%.0f", $2/1024}' "$log")"
  # "Pause Young (Normal) (G1 Evacuation Pause) 3012M->1480M(8192M)": the largest value after the arrow
  heap="$(grep -o '[0-9]*M->[0-9]*M' "$gc" | sed 's/.*->//; s/M//' | sort -n | tail -1)"
  live="$(grep 'Pause Remark' "$gc" | grep -o '[0-9]*M->[0-9]*M' | sed 's/.*->//; s/M//' | sort -n | tail -1)"
  edges=$(( r * (r - 1) / 2 ))
  echo "| $(date -u +%Y-%m-%dT%H:%M) | $commit | $size | $edges | $wall | $cpu | $rss | ${heap:-?} | ${live:--} | $opts | $threads | $load | $code |" >> "$results"
  echo "[scale] $size: wall ${wall}s, cpu ${cpu}s, peak RSS ${rss} MB, after GC ${heap:-?} MB, after remark ${live:--} MB, exit $code" >&2
done
cat "$results"
