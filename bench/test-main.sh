#!/usr/bin/env bash
# Runs a benchmark main class kept with the test sources, on the test classpath (built offline first).
# Usage: bench/test-main.sh HEAP CLASS [ARGS...]   e.g. bench/test-main.sh 3g org.viewgain.imputation.ImputerBenchmark 3
# JAVA_OPTS is passed on to Java.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$here"
heap="$1"
main="$2"
shift 2
log="$(mktemp)"
cpfile="$(mktemp)"
trap 'rm -f "$log" "$cpfile"' EXIT
if ! mvn -q -o -B test-compile dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile="$cpfile" \
    >"$log" 2>&1; then
  cat "$log" >&2
  echo "[bench] build failed" >&2
  exit 1
fi
cp="target/test-classes:target/classes:$(cat "$cpfile")"
rm -f "$log" "$cpfile"
# shellcheck disable=SC2086
exec java "-Xmx$heap" ${JAVA_OPTS:-} -cp "$cp" "$main" "$@"
