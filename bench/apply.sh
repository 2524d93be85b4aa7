#!/usr/bin/env bash
# Issue 15's aim (a benchmark, not a test): `viewgain apply` of a bundle to 1,000 new subjects x 268 regions in
# under 30 s on 2 cores. Writes the invented cohorts with org.viewgain.demo.ScaleCohort under bench/work/ (about
# 1.3 GB: 300 development subjects with both views for 70%, 1,000 later subjects with the source view only), makes
# the bundle once with bench/specs/apply-300x268.yaml (kept in bench/work/apply-run/), then times the apply RUNS
# times (default 3) under /usr/bin/time, with the JVM's GC log for the heap after collections. One markdown row per
# apply: wall, user CPU, peak RSS, largest heap after a collection, load average before.
#   bench/apply.sh          env: RUNS (3), JAVA_OPTS (-Xmx8g), JFR=1 to record a profile of the last apply
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
root="$(dirname "$here")"
work="$here/work"
runs="${RUNS:-3}"
opts="${JAVA_OPTS:--Xmx8g}"
(cd "$root" && mvn -q -o -B -Dmaven.test.skip=true package)
cp="$root/target/viewgain.jar:$root/target/lib/*"
mkdir -p "$work"
[ -f "$work/c300x268/subjects.csv" ] || java -cp "$cp" org.viewgain.demo.ScaleCohort "$work/c300x268" 300 268 11
[ -f "$work/x1000x268/subjects.csv" ] || \
  java -cp "$cp" org.viewgain.demo.ScaleCohort "$work/x1000x268" 1000 268 11 12 x 1.0
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
sed "s#\.\./work#$work#g" "$here/specs/apply-300x268.yaml" > "$tmp/run.yaml"
sed "s#\.\./work#$work#g" "$here/specs/apply-cohort-1000x268.yaml" > "$tmp/cohort.yaml"
bundle() { find "$work/apply-run" -name manifest.json -path '*/bundle/*' 2>/dev/null | head -1 | xargs -r dirname; }
if [ -z "$(bundle)" ]; then
  rm -rf "$work/apply-run"
  echo "[apply] making the bundle (a run on 300 x 268)" >&2
  /usr/bin/time -f "[apply] run: %e s wall, %U s user" java $opts -cp "$cp" org.viewgain.cli.Main run "$tmp/run.yaml" \
    --out "$work/apply-run" --quiet
fi
b="$(bundle)"
echo "| apply | wall s | user CPU s | peak RSS MB | heap after GC max MB | load before | exit |"
echo "|---|---|---|---|---|---|---|"
for i in $(seq 1 "$runs"); do
  rm -rf "$tmp/out"
  jfr=""
  [ "${JFR:-0}" = 1 ] && [ "$i" = "$runs" ] && jfr="-XX:StartFlightRecording=filename=$work/apply.jfr,settings=profile"
  load="$(cut -d' ' -f1-3 /proc/loadavg)"
  code=0
  /usr/bin/time -f "%e %U %M %S" -o "$tmp/time" java $opts $jfr -Xlog:gc:file="$tmp/gc.log" -cp "$cp" \
    org.viewgain.cli.Main apply "$b" "$tmp/cohort.yaml" --out "$tmp/out" >"$tmp/log" 2>&1 || code=$?
  read -r wall user rss sys < <(tail -1 "$tmp/time")
  heap="$(grep -o '[0-9]*M->[0-9]*M' "$tmp/gc.log" | sed 's/.*->//; s/M//' | sort -n | tail -1)"
  echo "| $i | $wall | $user + $sys sys | $((rss / 1024)) | ${heap:-none} | $load | $code |"
  [ "$code" = 0 ] || cat "$tmp/log" >&2
done
