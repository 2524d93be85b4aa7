#!/usr/bin/env bash
# CPU time per classifier fit (org.viewgain.classify.FitSpeedBench), optionally for an older build side by side:
#   bench/fit-speed.sh [OLD_JAR] [-- ROWS FEATURES ROUNDS]
# With OLD_JAR (e.g. a copy of target/viewgain.jar from an earlier commit), runs the bench on that build first and
# then on the working tree, in one sitting, and prints the load average before each.
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
if [ -n "$old" ]; then
  echo "== $old (load $(cut -d' ' -f1-3 /proc/loadavg))"
  java -Xmx2g -cp "$old:target/test-classes:$deps" org.viewgain.classify.FitSpeedBench "$@"
fi
echo "== working tree $(git rev-parse --short HEAD)$(git diff --quiet HEAD -- src || echo +) (load $(cut -d' ' -f1-3 /proc/loadavg))"
java -Xmx2g -cp "target/classes:target/test-classes:$deps" org.viewgain.classify.FitSpeedBench "$@"
