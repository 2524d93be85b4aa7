#!/usr/bin/env bash
# CPU time per classifier fit (org.viewgain.classify.FitSpeedBench), optionally for an older build side by side:
#   bench/fit-speed.sh [OLD_JAR] [-- ROWS FEATURES ROUNDS]
# With OLD_JAR (e.g. a copy of target/viewgain.jar from an earlier commit), runs the bench on that build first and
# then on the working tree, in one sitting, and prints the load average before each; with SIDE_BY_SIDE=1 it runs
# the two at the same time instead (one core each) and prints their lines in pairs.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$here"
old=""
if [ $# -gt 0 ] && [ "$1" != "--" ]; then old="$1"; shift; fi
[ "${1:-}" = "--" ] && shift
cpfile="$(mktemp)"; log="$(mktemp)"
trap 'rm -f "$cpfile" "$log"' EXIT
if ! mvn -q -o -B test-compile dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile="$cpfile" \
    >"$log" 2>&1; then
  cat "$log" >&2; echo "[bench] build failed" >&2; exit 1
fi
deps="$(cat "$cpfile")"
tree="working tree $(git rev-parse --short HEAD)$(git diff --quiet HEAD -- src || echo +)"
if [ -n "$old" ] && [ -n "${SIDE_BY_SIDE:-}" ]; then
  # both builds at the same time, one core each: the machine's changing load then disturbs both alike (2026-12-04,
  # 64 x 1,190, forest 0.1: alternating, one build's medians ranged 17-28 ms within minutes; side by side 17.2-17.9)
  echo "== $old beside the $tree (load $(cut -d' ' -f1-3 /proc/loadavg))"
  java -Xmx2g -cp "$old:target/test-classes:$deps" org.viewgain.classify.FitSpeedBench "$@" > "$log.old" &
  java -Xmx2g -cp "target/classes:target/test-classes:$deps" org.viewgain.classify.FitSpeedBench "$@" > "$log.new"
  wait
  paste -d '\n' <(sed 's/^/old  /' "$log.old") <(sed 's/^/new  /' "$log.new")
  rm -f "$log.old" "$log.new"
  exit 0
fi
if [ -n "$old" ]; then
  echo "== $old (load $(cut -d' ' -f1-3 /proc/loadavg))"
  java -Xmx2g -cp "$old:target/test-classes:$deps" org.viewgain.classify.FitSpeedBench "$@"
fi
echo "== $tree (load $(cut -d' ' -f1-3 /proc/loadavg))"
java -Xmx2g -cp "target/classes:target/test-classes:$deps" org.viewgain.classify.FitSpeedBench "$@"
