#!/usr/bin/env bash
# Kill a sweep with SIGKILL at random instants, resume it each time, and check that the final
# files equal those of an uninterrupted run, byte for byte.
# Usage: scripts/kill-resume.sh [KILLS] [SEED]      (default 20 kills, seed 1)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
kills=${1:-20}
RANDOM=${2:-1}
jar="$here/cli/target/rdstab.jar"
[[ -f $jar ]] || (cd "$here" && mvn -B -q package -DskipTests)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
run() { java -XX:+UseSerialGC -Xss8m -jar "$jar" sweep "$here/cases/slab-self-heating.yaml" --cells 400 \
  --vary delta=0.3:1.0:24 --vary Bi=2:20:3 --chain-length 4 --threads 2 --quiet "$@" >/dev/null; }
run --out "$work/ref.csv"
for ((k = 0; k < kills; k++)); do
  run --out "$work/run.csv" --resume &
  pid=$!
  sleep "0.$((RANDOM % 9 + 1))$((RANDOM % 10))"
  sleep "$((RANDOM % 2))"
  if kill -9 "$pid" 2>/dev/null; then
    wait "$pid" 2>/dev/null || true
    rows=$(($(wc -l < "$work/run.csv" 2>/dev/null || echo 2) - 2))
    echo "kill $k: $rows complete CSV rows"
  else
    wait "$pid" || true
    echo "kill $k: the run had already finished"
  fi
done
run --out "$work/run.csv" --resume
cmp "$work/ref.csv" "$work/run.csv" && cmp "$work/ref.jsonl" "$work/run.jsonl"
echo "OK: after $kills kills and resumes the files equal the uninterrupted run"
