#!/usr/bin/env bash
# Benchmark (not a test): points per second of a 1D sweep, 2,000 cells, 200 points, at 1 and 2 threads.
# Usage: scripts/bench-sweep.sh [THREADS...]     (default: 1 2)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
jar="$here/cli/target/rdstab.jar"
[[ -f $jar ]] || (cd "$here" && mvn -B -q package -DskipTests)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
for t in "${@:-1 2}"; do
  for n in $t; do
    start=$(date +%s.%N)
    java -XX:+UseSerialGC -Xss8m -jar "$jar" sweep "$here/cases/slab-self-heating.yaml" --cells 2000 \
      --vary delta=0.1:0.69:200 --threads "$n" --quiet --out "$work/t$n.csv" > /dev/null
    end=$(date +%s.%N)
    awk -v s="$start" -v e="$end" -v n="$n" 'BEGIN { printf "threads %d: %.1f s, %.2f points/s (JVM start included)\n", n, e - s, 200 / (e - s) }'
  done
done
cmp "$work/t1.csv" "$work/t2.csv" 2>/dev/null && echo "1 and 2 threads: identical files"
uptime
