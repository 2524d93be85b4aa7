#!/usr/bin/env bash
# Benchmark: seconds of the near-duplicate scan on random rows. Usage: bench/duplicates.sh [SUBJECTS [FEATURES [ROUNDS]]]
# (default 2000 x 35778, 1 round). Prints CSV (subjects, features, seconds, pairs_found); depends on machine and load.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$here"
log="$(mktemp)"
cpfile="$(mktemp)"
trap 'rm -f "$log" "$cpfile"' EXIT
if ! mvn -q -o -B test-compile dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile="$cpfile" \
    >"$log" 2>&1; then
  cat "$log" >&2
  echo "[bench] build failed" >&2
  exit 1
fi
exec java -Xmx4g ${JAVA_OPTS:-} -cp "target/test-classes:target/classes:$(cat "$cpfile")" \
  org.viewgain.engine.DuplicatesBenchmark "$@"
