#!/usr/bin/env bash
# Longer fuzzing of the case reader than CI runs: ./scripts/fuzz.sh [COUNT] [SEED]
# A failure prints the first offending input; save it under
# solver/src/test/resources/casefile-corpus/ so it is replayed by every test run from then on.
set -euo pipefail
cd "$(dirname "$0")/.."
count=${1:-200000}
seed=${2:-$RANDOM}
echo "fuzzing the case reader with $count inputs, seed $seed"
mvn -B -q -pl solver -am test -Dtest=CaseFileFuzzTest -Dsurefire.failIfNoSpecifiedTests=false \
  -Drdstab.fuzz.count="$count" -Drdstab.fuzz.seed="$seed"
echo "no defects"
