#!/usr/bin/env bash
# Runs a sweep as a 4-task Slurm job array on a single-node cluster brought up on loopback, merges
# the shards and compares them with a single-process run, byte for byte. Exits non-zero on any
# mismatch or failure. Needs root on Debian 12 (installs slurm-wlm and munge with apt-get).
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
export DEBIAN_FRONTEND=noninteractive
jar="$here/cli/target/rdstab.jar"
[[ -f $jar ]] || (cd "$here" && mvn -B -q package -DskipTests)

started=()
stop() {
  for f in "${started[@]}"; do
    [[ -f $f ]] && kill "$(cat "$f")" 2>/dev/null || true
  done
}
trap stop EXIT

if ! command -v slurmctld >/dev/null || ! command -v munged >/dev/null; then
  apt-get update -q && apt-get install -y -q slurm-wlm munge
fi
if ! scontrol ping 2>/dev/null | grep -q UP; then
  hn=$(hostname -s)
  cat > /etc/slurm/slurm.conf <<CONF
ClusterName=rdstabci
SlurmctldHost=${hn}(127.0.0.1)
AuthType=auth/munge
SlurmUser=slurm
SlurmdUser=root
SlurmctldPort=6817
SlurmdPort=6818
StateSaveLocation=/var/spool/slurmctld
SlurmdSpoolDir=/var/spool/slurmd
SlurmctldPidFile=/run/slurmctld.pid
SlurmdPidFile=/run/slurmd.pid
SlurmctldLogFile=/var/log/slurm/slurmctld.log
SlurmdLogFile=/var/log/slurm/slurmd.log
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
SelectType=select/cons_tres
SelectTypeParameters=CR_Core
SchedulerType=sched/backfill
AccountingStorageType=accounting_storage/none
JobAcctGatherType=jobacct_gather/none
JobCompType=jobcomp/none
MpiDefault=none
ReturnToService=2
SlurmctldTimeout=30
SlurmdTimeout=30
NodeName=${hn} NodeAddr=127.0.0.1 CPUs=$(nproc) State=UNKNOWN
PartitionName=debug Nodes=${hn} Default=YES MaxTime=INFINITE State=UP
CONF
  mkdir -p /run/munge /var/spool/slurmctld /var/spool/slurmd /var/log/slurm
  chown munge:munge /run/munge && chmod 755 /run/munge
  chown slurm:slurm /var/spool/slurmctld /var/log/slurm
  if ! (munge -n | unmunge) >/dev/null 2>&1; then
    su -s /bin/sh munge -c /usr/sbin/munged
    for _ in $(seq 50); do (munge -n | unmunge) >/dev/null 2>&1 && break; sleep 0.1; done
    cp /run/munge/munged.pid /tmp/rdstab-ci-munged.pid && started+=(/tmp/rdstab-ci-munged.pid)
  fi
  nohup /usr/sbin/slurmctld -D -i >/tmp/rdstab-ci-slurmctld.out 2>&1 & echo $! > /tmp/rdstab-ci-ctld.pid
  started=(/tmp/rdstab-ci-ctld.pid "${started[@]}")
  for _ in $(seq 100); do scontrol ping 2>/dev/null | grep -q UP && break; sleep 0.1; done
  nohup /usr/sbin/slurmd -D >/tmp/rdstab-ci-slurmd.out 2>&1 & echo $! > /tmp/rdstab-ci-slurmd.pid
  started=(/tmp/rdstab-ci-slurmd.pid "${started[@]}")
  for _ in $(seq 100); do sinfo -h -o %t 2>/dev/null | grep -qx idle && break; sleep 0.1; done
fi
scontrol ping | grep -q UP || { echo "slurm-sweep-test: slurmctld is not up" >&2; exit 1; }
sinfo

work=$(mktemp -d /tmp/rdstab-slurm-XXXXXX)
sweep=(--vary delta=0.3:1.0:16 --vary Bi=2:20:3 --cells 100 --chain-length 4)
java -XX:+UseSerialGC -Xss8m -jar "$jar" sweep "$here/cases/slab-self-heating.yaml" "${sweep[@]}" \
  --out "$work/single.csv" --threads 2 --quiet > "$work/single.out"

cd "$work"
jid=$(RDSTAB_JAR="$jar" sbatch --parsable --array=0-3 "$here/scripts/sweep-array.sbatch" \
  "$here/cases/slab-self-heating.yaml" "$work/array.csv" "${sweep[@]}")
echo "submitted job array $jid"
for _ in $(seq 600); do
  scontrol ping 2>/dev/null | grep -q UP || { echo "slurm-sweep-test: slurmctld went down" >&2; exit 1; }
  [[ -n "$(squeue -h -j "$jid" 2>/dev/null)" ]] || break
  sleep 0.5
done
if [[ -n "$(squeue -h -j "$jid" 2>/dev/null)" ]]; then
  echo "slurm-sweep-test: job array $jid did not finish in 300 s" >&2; exit 1
fi
scontrol show job "$jid" 2>/dev/null | grep -E 'ArrayTaskId|JobState|ExitCode' || true
if scontrol show job "$jid" 2>/dev/null | grep -E 'ExitCode=' | grep -vq 'ExitCode=0:0'; then
  echo "slurm-sweep-test: a task failed" >&2; cat "$work"/slurm-*.out >&2 || true; exit 1
fi
ls -l "$work"
java -jar "$jar" merge "$work"/array.shard{0,1,2,3}of4.csv --out "$work/merged.csv"
if cmp "$work/single.csv" "$work/merged.csv" && cmp "$work/single.jsonl" "$work/merged.jsonl"; then
  echo "slurm-sweep-test: OK — 4-task job array merged equals the single-process sweep ($(($(wc -l < "$work/merged.csv") - 2)) points)"
  rm -rf "$work"
else
  echo "slurm-sweep-test: MISMATCH between $work/merged.* and $work/single.*" >&2
  exit 1
fi
