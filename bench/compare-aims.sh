#!/usr/bin/env bash
# Issue 12's cases for an older build and this one, alternating in one sitting, each run as its own launcher ran
# it (the old one with the JVM's default collector unless OLD_OPTS says otherwise, and OLD_ENV as its environment;
# this one with the serial collector, as ./viewgain does on up to 4 processors, the C library settings ./viewgain
# exports and its transparent huge pages where the kernel gives them on request). One markdown row per run.
#   bench/compare-aims.sh OLD_ROOT [CASES]      CASES default: "demo demo chance nested apply"
# chance is demo-chance.yaml with 49 permutations and no early stop; nested is bench/specs/nested-160x35.yaml;
# apply needs the bundle and cohort of bench/apply.sh under bench/work/. HEAP_OPTS (e.g. -Xmx64m) is given to both
# builds: with a small heap, full collections happen and their after-figure is the live heap.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)"
root="$(dirname "$here")"
old="$(cd "$1" && pwd)"
cases="${2:-demo demo chance nested apply}"
tmp="$(mktemp -d)"
trap 'rm -rf "$tmp"' EXIT
(cd "$root" && mvn -q -o -B -Dmaven.test.skip=true package)
# the malloc settings this build's launcher exports (GLIBC_TUNABLES, see ./viewgain)
tunables="$(sed -n 's/^export GLIBC_TUNABLES="\${GLIBC_TUNABLES:-\(.*\)}"$/\1/p' "$root/viewgain")"
# and the huge pages it asks for where the kernel gives them on request (see ./viewgain)
thp=""
grep -q '\[madvise\]' /sys/kernel/mm/transparent_hugepage/enabled 2>/dev/null && thp="-XX:+UseTransparentHugePages"
sed -e "s#\.\./demo-data#$root/demo-data#g" "$root/experiment-specs/demo.yaml" > "$tmp/demo.yaml"
sed -e "s#\.\./demo-data#$root/demo-data#g" -e "s/permutations: [0-9]*/permutations: 49/" \
  -e "s/early-stop: [0-9]*/early-stop: 0/" "$root/experiment-specs/demo-chance.yaml" > "$tmp/chance.yaml"
[ -f "$here/work/c160x35/subjects.csv" ] || \
  java -cp "$root/target/viewgain.jar:$root/target/lib/*" org.viewgain.demo.ScaleCohort "$here/work/c160x35" 160 35 1
sed "s#\.\./work#$here/work#g" "$here/specs/nested-160x35.yaml" > "$tmp/nested.yaml"
sed "s#\.\./work#$here/work#g" "$here/specs/apply-cohort-1000x268.yaml" > "$tmp/cohort.yaml"
bundle="$(find "$here/work/apply-run" -name manifest.json -path '*/bundle/*' 2>/dev/null | head -1 | xargs -r dirname)"
echo "| case | build | wall s | user s | sys s | peak RSS MB | heap after GC, max MB | after full GC, max MB | load before |"
echo "|---|---|---|---|---|---|---|---|---|"
for c in $cases; do
  for which in old new; do
    if [ "$which" = old ]; then cp="$old/target/viewgain.jar:$old/target/lib/*"; opts="${OLD_OPTS:-}"
      environment=(env ${OLD_ENV:-})
    else cp="$root/target/viewgain.jar:$root/target/lib/*"; opts="-XX:+UseSerialGC $thp"
      environment=(env ${tunables:+GLIBC_TUNABLES=$tunables}); fi
    case "$c" in
      apply) args=(apply "$bundle" "$tmp/cohort.yaml" --out "$tmp/out") ;;
      *) args=(run "$tmp/$c.yaml" --out "$tmp/out" --quiet) ;;
    esac
    rm -rf "$tmp/out"
    load="$(cut -d' ' -f1 /proc/loadavg)"
    "${environment[@]}" /usr/bin/time -f "%e %U %S %M" -o "$tmp/time" java $opts ${HEAP_OPTS:-} -Xlog:gc:file="$tmp/gc.log" -cp "$cp" \
      org.viewgain.cli.Main "${args[@]}" \
      > "$tmp/log" 2>&1 || { cat "$tmp/log" >&2; exit 1; }
    heap="$(grep -o '[0-9]*M->[0-9]*M' "$tmp/gc.log" | sed 's/.*->//; s/M//' | sort -n | tail -1 || true)"
    # after a full collection the heap holds live data only (a young collection's figure includes old garbage)
    live="$(grep 'Pause Full' "$tmp/gc.log" | grep -o '[0-9]*M->[0-9]*M' | sed 's/.*->//; s/M//' | sort -n | tail -1 || true)"
    echo "| $c | $which | $(awk '{printf "%s | %s | %s | %d", $1, $2, $3, $4 / 1024}' "$tmp/time") | ${heap:-none} | ${live:-no full GC} | $load |"
  done
done
