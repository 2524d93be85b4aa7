#!/usr/bin/env bash
# Benchmark: fit + impute seconds of each built-in imputer on random data of 400 subjects (320 training, 80 new)
# x 4,950 source and 4,950 target features (100-region networks). Usage: bench/imputers.sh [ROUNDS]
# Prints CSV (method, fit_seconds, impute_seconds, total_seconds, rounds); figures depend on the machine and its load.
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
exec java -Xmx3g ${JAVA_OPTS:-} -cp "target/test-classes:target/classes:$(cat "$cpfile")" \
  org.viewgain.imputation.ImputerBenchmark "$@"
