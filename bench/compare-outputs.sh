#!/usr/bin/env bash
# Whether a change kept every output table byte-identical (issue 13's check for refactors): runs the given specs
# with an older build and with this checkout, one after the other, and compares every CSV table (and the bundle,
# when there is one) with cmp. Prints one line per spec and exits 1 when anything differs.
#   bench/compare-outputs.sh OLD_ROOT SPEC...
# OLD_ROOT is a checkout with its jar built (e.g. `git worktree add /tmp/old COMMIT` and `mvn -q -o -B
# -Dmaven.test.skip=true package` there). Specs must name their data by absolute paths (or paths valid from here).
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
new="$(dirname "$here")"
old="$(cd "$1" && pwd)"
shift
(cd "$new" && mvn -q -o -B -Dmaven.test.skip=true package)
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
status=0
for spec in "$@"; do
  for which in old new; do
    root="$old"
    [ "$which" = new ] && root="$new"
    java -XX:+UseSerialGC -cp "$root/target/viewgain.jar:$root/target/lib/*" org.viewgain.cli.Main run "$spec" \
      --out "$tmp/$which" --quiet > "$tmp/$which.log" 2>&1 || { echo "$spec: the $which build failed"; cat "$tmp/$which.log"; exit 1; }
  done
  a="$(find "$tmp/old" -name run.json -exec dirname {} \;)"
  b="$(find "$tmp/new" -name run.json -exec dirname {} \;)"
  n=0; d=0
  for f in $(cd "$a" && ls *.csv); do
    n=$((n + 1))
    cmp -s "$a/$f" "$b/$f" || { d=$((d + 1)); echo "  differs: $f"; }
  done
  if [ -d "$a/bundle" ]; then
    diff -r "$a/bundle" "$b/bundle" > /dev/null || { d=$((d + 1)); echo "  differs: bundle/"; }
  fi
  echo "$spec: $n tables$([ -d "$a/bundle" ] && echo " and the bundle"), $d differ"
  [ "$d" = 0 ] || status=1
  rm -rf "$tmp/old" "$tmp/new"
done
exit $status
