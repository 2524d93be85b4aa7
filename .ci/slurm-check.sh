#!/usr/bin/env bash
# CI: runs a small spec as a 4-task Slurm job array plus a dependent merge job on a single-node Slurm (installed from
# Debian packages when sbatch is missing; needs root), runs the same spec on one machine, and fails unless every
# table is byte-identical. Daemons started here are stopped by their pids at the end.
set -euo pipefail
cd "$(dirname "$0")/.."
root="$(pwd)"
spec="$root/src/test/resources/cluster/slurm-check.yaml"
work="$root/target/slurm-check"
timeout_s="${SLURM_CHECK_TIMEOUT:-900}"
started=()

stop_daemons() {
  for pidfile in "${started[@]}"; do
    if [ -f "$pidfile" ]; then
      pid="$(cat "$pidfile")"
      kill "$pid" 2>/dev/null || true
    fi
  done
}
trap stop_daemons EXIT

alive() { [ -f "$1" ] && kill -0 "$(cat "$1")" 2>/dev/null; }

if ! command -v sbatch >/dev/null 2>&1; then
  echo "[slurm-check] installing slurm-wlm and munge"
  apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq slurm-wlm munge >/dev/null
fi
test -f /etc/munge/munge.key || mungekey --create
mkdir -p /run/munge /var/log/munge /var/lib/munge /etc/slurm /var/spool/slurmctld /var/spool/slurmd /var/log/slurm
chown munge:munge /run/munge /var/log/munge /var/lib/munge /etc/munge/munge.key
if ! alive /run/munge/munged.pid; then
  su -s /bin/sh munge -c munged
  started+=(/run/munge/munged.pid)
fi
if [ ! -f /etc/slurm/slurm.conf ]; then
  H="$(hostname -s)"
  cat > /etc/slurm/slurm.conf <<CONF
ClusterName=local
SlurmctldHost=$H
SlurmUser=root
SlurmdUser=root
AuthType=auth/munge
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
SwitchType=switch/none
MpiDefault=none
ReturnToService=2
SchedulerType=sched/backfill
SelectType=select/cons_tres
SelectTypeParameters=CR_Core
StateSaveLocation=/var/spool/slurmctld
SlurmdSpoolDir=/var/spool/slurmd
SlurmctldPidFile=/run/slurmctld.pid
SlurmdPidFile=/run/slurmd.pid
SlurmctldLogFile=/var/log/slurm/slurmctld.log
SlurmdLogFile=/var/log/slurm/slurmd.log
JobAcctGatherType=jobacct_gather/none
AccountingStorageType=accounting_storage/none
NodeName=$H CPUs=$(nproc) RealMemory=2000 State=UNKNOWN
PartitionName=main Nodes=$H Default=YES MaxTime=INFINITE State=UP
CONF
fi
if ! alive /run/slurmctld.pid; then
  slurmctld
  started+=(/run/slurmctld.pid)
fi
if ! alive /run/slurmd.pid; then
  slurmd
  started+=(/run/slurmd.pid)
fi
for _ in $(seq 1 30); do
  sinfo -h -o '%T' 2>/dev/null | grep -Eq 'idle|mixed|allocated' && break
  sleep 1
done
sinfo

# build once before the tasks start, so they do not all build at the same time
./viewgain --version >/dev/null
rm -rf "$work"
mkdir -p "$work"
./viewgain slurm "$spec" --shards 4 --out "$work/jobs" --cpus 1 --mem 500M --time 00:20:00
"$work/jobs/submit.sh"
read -r _ array_id < <(grep '^array' "$work/jobs/jobs.txt")
read -r _ merge_id < <(grep '^merge' "$work/jobs/jobs.txt")
deadline=$((SECONDS + timeout_s))
while [ -n "$(squeue -h -j "$array_id,$merge_id" 2>/dev/null)" ]; do
  if [ "$SECONDS" -gt "$deadline" ]; then
    echo "[slurm-check] jobs still queued after ${timeout_s}s" >&2
    squeue >&2 || true
    scancel "$array_id" "$merge_id" || true
    exit 1
  fi
  sleep 2
done
merged="$(ls -d "$work"/jobs/results/slurm-check/*/ 2>/dev/null | tail -1)"
if [ -z "$merged" ] || ! grep -q '"status" : "complete"' "$merged/run.json"; then
  echo "[slurm-check] the merge job produced no complete run; logs:" >&2
  tail -n 20 "$work"/jobs/logs/* >&2 || true
  exit 1
fi

./viewgain run "$spec" --out "$work/single" --quiet --threads 2 >/dev/null
single="$(ls -d "$work"/single/slurm-check/*/ | tail -1)"
status=0
diff <(cd "$single" && ls *.csv) <(cd "$merged" && ls *.csv) || status=1
for table in "$single"/*.csv; do
  name="$(basename "$table")"
  if ! cmp -s "$table" "$merged/$name"; then
    echo "[slurm-check] $name differs between the single run and the merged shards" >&2
    status=1
  fi
done
if [ "$status" -ne 0 ]; then
  exit 1
fi
echo "[slurm-check] 4-task Slurm array + merge give the same $(ls "$single"/*.csv | wc -l) tables as one run"
