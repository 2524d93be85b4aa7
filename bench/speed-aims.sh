#!/usr/bin/env bash
# Issue 12's speed aims, side by side for two builds in one sitting (a benchmark, not a test). For each case runs the
# older jar, then the newer one, under /usr/bin/time, and prints one markdown row per run: wall, user CPU, peak RSS,
# and the load average just before. Cases (pick with CASES="demo chance nested s400 s1000"):
#   demo    experiment-specs/demo.yaml, the plain run
#   chance  demo-chance.yaml with PERMS permutations (default 49) and early-stop 0: seconds per permutation
#   nested  bench/specs/nested-160x35.yaml (cohort written by org.viewgain.demo.ScaleCohort if missing)
#   s400    bench/specs/scale-400x100.yaml (bench/work/c400x100, from bench/run.sh or written here)
#   s1000   bench/specs/scale-1000x268-default-forest.yaml (bench/work/c1000x268; about 1 GB of disk)
# Usage: bench/speed-aims.sh OLD_JAR [NEW_JAR]   (NEW_JAR defaults to target/viewgain.jar, built first)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
root="$(dirname "$here")"
old="$1"
new="${2:-$root/target/viewgain.jar}"
[ $# -ge 2 ] || (cd "$root" && mvn -q -o -B -Dmaven.test.skip=true package)
cases="${CASES:-demo chance nested s400}"
perms="${PERMS:-49}"
work="$here/work"; tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
mkdir -p "$work"
cohort() { # cohort NAME SUBJECTS REGIONS
  [ -f "$work/$1/subjects.csv" ] || java -cp "$new" org.viewgain.demo.ScaleCohort "$work/$1" "$2" "$3" 1 >&2
}
spec_for() { # spec_for CASE -> path of a spec with absolute data paths
  case "$1" in
    demo) sed "s#\.\./demo-data#$root/demo-data#g" "$root/experiment-specs/demo.yaml" ;;
    chance) sed -e "s#\.\./demo-data#$root/demo-data#g" -e "s/permutations: [0-9]*/permutations: $perms/" \
              -e "s/early-stop: [0-9]*/early-stop: 0/" "$root/experiment-specs/demo-chance.yaml" ;;
    nested) cohort c160x35 160 35; sed "s#\.\./work#$work#g" "$here/specs/nested-160x35.yaml" ;;
    s400) cohort c400x100 400 100; sed "s#\.\./work#$work#g" "$here/specs/scale-400x100.yaml" ;;
    s1000) cohort c1000x268 1000 268; sed "s#\.\./work#$work#g" "$here/specs/scale-1000x268-default-forest.yaml" ;;
  esac > "$tmp/$1.yaml"
  echo "$tmp/$1.yaml"
}
echo "| case | build | wall s | user CPU s | peak RSS MB | load before | exit |"
echo "|---|---|---|---|---|---|---|"
for c in $cases; do
  spec="$(spec_for "$c")"
  for jar in "$old" "$new"; do
    load="$(cut -d' ' -f1-3 /proc/loadavg)"
    code=0
    /usr/bin/time -f "%e %U %M" -o "$tmp/time" java -Xmx8g -cp "$jar:$root/target/lib/*" org.viewgain.cli.Main run \
      "$spec" --out "$tmp/out" --quiet >"$tmp/log" 2>&1 || code=$?
    read -r wall user rss < <(tail -1 "$tmp/time")
    echo "| $c | $(basename "$jar") | $wall | $user | $((rss / 1024)) | $load | $code |"
  done
done
