#!/usr/bin/env bash
# Kill a sweep with SIGKILL at random instants, resume it each time, and check that the final
# files equal those of an uninterrupted run, byte for byte.
# When a resumed run finishes before its kill, its files are compared and the sweep starts again.
# Usage: scripts/kill-resume.sh [KILLS] [SEED]      (default 20 kills, seed 1)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
kills=${1:-20}
RANDOM=${2:-1}
jar="$here/cli/target/rdstab.jar"
[[ -f $jar ]] || (cd "$here" && mvn -B -q package -DskipTests)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
# java is started directly (not inside a function or subshell) so that $! is the JVM itself and
# kill -9 hits it, not a shell that would leave it running.
args=(-XX:+UseSerialGC -Xss8m -jar "$jar" sweep "$here/cases/slab-self-heating.yaml" --cells 400
  --vary delta=0.3:1.0:24 --vary Bi=2:20:3 --chain-length 4 --threads 2 --quiet)
t0=$(date +%s%N)
java "${args[@]}" --out "$work/ref.csv" >/dev/null
ref_ms=$((($(date +%s%N) - t0) / 1000000))
echo "uninterrupted run: $ref_ms ms"
for ((k = 0; k < kills; k++)); do
  java "${args[@]}" --out "$work/run.csv" --resume >/dev/null &
  pid=$!
  # a random instant between 30 % and 90 % of the uninterrupted run's wall time (JVM start included)
  ms=$((ref_ms * (30 + RANDOM % 61) / 100))
  sleep "$((ms / 1000)).$(printf %03d $((ms % 1000)))"
  if kill -9 "$pid" 2>/dev/null; then
    wait "$pid" 2>/dev/null || true
    rows=0
    [[ -f $work/run.csv ]] && rows=$(($(wc -l < "$work/run.csv") - 2))
    echo "kill $k: $rows complete CSV rows"
  else
    wait "$pid"
    cmp -s "$work/ref.csv" "$work/run.csv" && cmp -s "$work/ref.jsonl" "$work/run.jsonl" \
      || { echo "MISMATCH: a resumed run finished with other files than the uninterrupted run" >&2; exit 1; }
    echo "kill $k: the run had finished, equal to the uninterrupted run; starting the sweep again from scratch"
    rm -f "$work"/run.*
  fi
done
java "${args[@]}" --out "$work/run.csv" --resume >/dev/null
if cmp "$work/ref.csv" "$work/run.csv" && cmp "$work/ref.jsonl" "$work/run.jsonl"; then
  echo "OK: after $kills kills and resumes the files equal the uninterrupted run"
else
  echo "MISMATCH after $kills kills and resumes" >&2
  exit 1
fi
