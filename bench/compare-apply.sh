#!/usr/bin/env bash
# The apply benchmark of two builds interleaved in one sitting (speed claims compare builds side by side):
#   bench/compare-apply.sh OLD_ROOT [ROUNDS]
# OLD_ROOT is a checkout with its jar built (e.g. `git worktree add /tmp/old COMMIT` and `mvn -q -o -B
# -Dmaven.test.skip=true package` there); this checkout is the new build. Needs the bundle and cohort that
# bench/apply.sh makes under bench/work/. One line per run: wall, user and sys CPU, peak RSS, largest heap after a
# collection (-Xlog:gc), load before; the outputs of the two builds are compared with diff -r at the end.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
new="$(dirname "$here")"
old="$(cd "$1" && pwd)"
rounds="${2:-2}"
work="$here/work"
b="$(find "$work/apply-run" -name manifest.json -path '*/bundle/*' | head -1 | xargs dirname)"
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
sed "s#\.\./work#$work#g" "$here/specs/apply-cohort-1000x268.yaml" > "$tmp/cohort.yaml"
for round in $(seq 1 "$rounds"); do
  for which in old new; do
    root="$old"
    [ "$which" = new ] && root="$new"
    load="$(cut -d' ' -f1-3 /proc/loadavg)"
    /usr/bin/time -f "%e %U %S %M" -o "$tmp/time" java ${JAVA_OPTS:--Xmx8g} -Xlog:gc:file="$tmp/gc.log" \
      -cp "$root/target/viewgain.jar:$root/target/lib/*" org.viewgain.cli.Main apply "$b" "$tmp/cohort.yaml" \
      --out "$tmp/out-$which-$round" > "$tmp/log" 2>&1 || { cat "$tmp/log" >&2; exit 1; }
    read -r wall user sys rss < "$tmp/time"
    heap="$(grep -o '[0-9]*M->[0-9]*M' "$tmp/gc.log" | sed 's/.*->//; s/M//' | sort -n | tail -1)"
    echo "$which round $round: wall $wall s, user $user s, sys $sys s, peak RSS $((rss / 1024)) MB, heap after GC max ${heap:-none} MB, load $load"
  done
done
diff -r "$tmp/out-old-1" "$tmp/out-new-1" > /dev/null && echo "outputs: identical" || echo "outputs: DIFFER"
