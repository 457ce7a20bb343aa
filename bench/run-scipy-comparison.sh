#!/usr/bin/env bash
# Benchmark beside SciPy: the same Matrix Market files, the same run, eigenvalues checked to 1e-8 relative.
# Usage: bench/run-scipy-comparison.sh            (SIZES="128 256 512" TWOFIELD=256 STARTS=21 by default)
# Writes bench/RESULTS.md (the table and the command that produced it). Not part of 'mvn verify'.
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$here"
SIZES="${SIZES:-128 256 512}"
TWOFIELD="${TWOFIELD:-256}"
STARTS="${STARTS:-21}"
py=/usr/bin/python3
scipy_eigs="$here/../shared/bench/scipy_eigs.py"
if ! $py -c "import scipy.sparse.linalg" 2>/dev/null; then
  apt-get update && apt-get install -y python3-scipy
fi
# native ARPACK for dev.ludovic.netlib (optional: without it the pure-Java ARPACK runs, with the same answers)
if ! ldconfig -p | grep -q 'libarpack.so.2 '; then
  (apt-get update && apt-get install -y libarpack2) || echo "note: libarpack2 not installed; pure-Java ARPACK used" >&2
fi
./rdstab --version >/dev/null                      # builds the jar when sources changed (and records the class-data archive)
jar_stamp="$(stat -c %Y cli/target/rdstab.jar)"     # a source edited during the run makes the launcher rebuild mid-run
mvn -B -o -q -pl cli -am test-compile >/dev/null   # the model-problem writer lives in cli's test classes (-am: solver and mesh from the reactor, not ~/.m2)
cp="cli/target/test-classes:cli/target/rdstab.jar"
work="$(mktemp -d)"
trap 'rm -rf "$work"' EXIT
rows=()

# run LABEL RDSTABFLAGS DIR SYMMETRIC : SciPy's eigs (and, for a symmetric matrix, eigsh) and rdstab on DIR/J.mtx
run() {
  local label="$1" rflags="$2" dir="$3" sym="$4"
  /usr/bin/time -f "%M %e" -o "$dir/scipy.time" $py "$scipy_eigs" "$dir/J.mtx" --k 6 --sigma 0 --repeat 1 >"$dir/scipy.json"
  if [[ $sym == 1 ]]; then
    $py "$scipy_eigs" "$dir/J.mtx" --k 6 --sigma 0 --repeat 1 --symmetric >"$dir/scipy-sym.json"
  else
    echo '{}' >"$dir/scipy-sym.json"
  fi
  /usr/bin/time -f "%M %e" -o "$dir/rdstab.time" ./rdstab spectrum "$dir/J.mtx" --modes 6 --shift 0 $rflags --json >"$dir/rdstab.json"
  rows+=("$($py - "$label" "$dir" <<'PY'
import json, sys
label, d = sys.argv[1], sys.argv[2]
s = json.load(open(d + "/scipy.json")); r = json.load(open(d + "/rdstab.json")); h = json.load(open(d + "/scipy-sym.json"))
srss, swall = open(d + "/scipy.time").read().split()[-2:]
rrss, rwall = open(d + "/rdstab.time").read().split()[-2:]
se = sorted((complex(a, b) for a, b in s["eigenvalues"]), key=lambda z: (z.real, z.imag))
re = sorted((complex(e["re"], e["im"]) for e in r["leading"]), key=lambda z: (z.real, z.imag))
err = max(abs(a - b) / abs(a) for a, b in zip(se, re)) if len(se) == len(re) else float("inf")
sec = r["seconds"]; ours = sec["ordering"] + sec["factorization"] + sec["iteration"]
ok = "yes" if err <= 1e-8 else "NO"
open(d + "/ours.txt", "w").write(f"{ours} {s['seconds_median']}")
sym = f"{h['seconds_median']:.2f} ({ours / h['seconds_median']:.2f})" if "seconds_median" in h else "—"
print(f"| {label} | {s['n']} | {s['seconds_median']:.2f} | {sym} | {ours:.2f} (ord {sec['ordering']:.2f}, fact {sec['factorization']:.2f}, iter {sec['iteration']:.2f}; {r['operator_applications']} solves) "
      f"| **{ours / s['seconds_median']:.2f}** | {float(swall):.1f} / {float(rwall):.1f} | {int(srss)//1024} / {int(rrss)//1024} | {err:.1e} {ok} | {r['factor_nonzeros']} |")
PY
)")
  echo "${rows[-1]}" >&2
}

for n in $SIZES; do
  mkdir -p "$work/l$n"
  java -cp "$cp" rdstab.bench.ModelProblems laplace "$n" "$work/l$n"
  run "Laplacian $n² (rdstab: Lanczos)" "--symmetric" "$work/l$n" 1
done
first="${SIZES%% *}"; last="${SIZES##* }"
growth=""
if [[ "$first" != "$last" ]]; then
  growth="$(awk -v a="$(cat "$work/l$first/ours.txt")" -v b="$(cat "$work/l$last/ours.txt")" -v f="$first" -v l="$last" 'BEGIN {
    split(a, x, " "); split(b, y, " "); r = log((l * l) / (f * f));
    printf "Growth from %d² to %d² unknowns: rdstab time ∝ n^%.2f, SciPy eigs ∝ n^%.2f (n = number of unknowns).", f, l,
      log(y[1] / x[1]) / r, log(y[2] / x[2]) / r }')"
fi
# like for like: the largest Laplacian again, rdstab's Lanczos stopped at the unit round-off as SciPy's ARPACK is
n="${SIZES##* }"
run "Laplacian $n², rdstab at SciPy's tolerance (--tolerance 1.1e-16)" "--symmetric --tolerance 1.1102230246251565e-16" "$work/l$n" 1
for n in $TWOFIELD; do
  mkdir -p "$work/t$n"
  java -cp "$cp" rdstab.bench.ModelProblems twofield "$n" "$work/t$n"
  run "two-field $n² per field (rdstab: Arnoldi + LU)" "" "$work/t$n" 0
done

# start-up: whole process, median of $STARTS runs each
median() { sort -n | awk '{a[NR]=$1} END {print a[int((NR+1)/2)]}'; }
t_check=$(for i in $(seq "$STARTS"); do /usr/bin/time -f "%e" ./rdstab check cases/slab-self-heating.yaml --cells 400 2>&1 >/dev/null | tail -1; done | median)
t_c1=$(for i in $(seq "$STARTS"); do RDSTAB_JAVA_OPTS=-XX:TieredStopAtLevel=1 /usr/bin/time -f "%e" ./rdstab check cases/slab-self-heating.yaml --cells 400 2>&1 >/dev/null | tail -1; done | median)
t_cds=$(for i in $(seq "$STARTS"); do RDSTAB_CDS=0 /usr/bin/time -f "%e" ./rdstab check cases/slab-self-heating.yaml --cells 400 2>&1 >/dev/null | tail -1; done | median)
t_py=$(for i in $(seq "$STARTS"); do /usr/bin/time -f "%e" $py -c "import scipy.sparse.linalg" 2>&1 | tail -1; done | median)

{
  echo "# rdstab beside SciPy"
  echo
  echo "Produced by \`bench/run-scipy-comparison.sh\` (SIZES=\"$SIZES\" TWOFIELD=$TWOFIELD STARTS=$STARTS) on $(date -u +%Y-%m-%d) on $(nproc) cores,"
  echo "load average at the end: $(cut -d' ' -f1-3 /proc/loadavg). SciPy $($py -c 'import scipy; print(scipy.__version__)'),"
  echo "ARPACK in the JVM: $(ldconfig -p | grep -q 'libarpack.so.2 ' && echo 'native libarpack2 (JNI)' || echo 'pure Java (f2j)'), $(java -version 2>&1 | head -1)."
  echo
  echo "Model problems (bench's ModelProblems, invented operators): 2D five-point Laplacian on the unit square, Dirichlet,"
  echo "N² unknowns, plus 10·I; and two coupled fields (non-symmetric, real spectrum). k = 6 eigenvalues nearest σ = 0"
  echo "(the rightmost here). SciPy time: ../shared/bench/scipy_eigs.py's own timer (factorization + ARPACK, file reading excluded,"
  echo "one run, default tolerance 0), for \`eigs(sigma=0)\` (the issue's yardstick) and, on the symmetric Laplacian, also"
  echo "\`eigsh\` (SciPy's Lanczos; ratio in brackets). rdstab time: ordering + symbolic + numeric factorization + iteration"
  echo "from 'spectrum --json' (file reading excluded, JIT warm-up included), default settings (Lanczos: residual tolerance"
  echo "1e-10, which gives the eigenvalues to round-off; Arnoldi: ARPACK at round-off). Wall and RSS: the whole process"
  echo "(/usr/bin/time), interpreter/JVM start and file reading included. The eigenvalues of every row are compared with"
  echo "SciPy's eigs to 1e-8 relative."
  echo
  echo "| problem | n | SciPy eigs s | SciPy eigsh s (ratio) | rdstab s | ratio to eigs | wall s SciPy eigs / rdstab | max RSS MB SciPy eigs / rdstab | max rel. diff of eigenvalues | nnz of factor |"
  echo "| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |"
  printf '%s\n' "${rows[@]}"
  echo
  echo "$growth"
  echo
  echo "Start-up (whole process, median of $STARTS): \`./rdstab check cases/slab-self-heating.yaml --cells 400\` ${t_check} s"
  echo "(default launcher, class-data archive on; ${t_cds} s without it, RDSTAB_CDS=0; ${t_c1} s with RDSTAB_JAVA_OPTS=-XX:TieredStopAtLevel=1),"
  echo "\`/usr/bin/python3 -c \"import scipy.sparse.linalg\"\` ${t_py} s: ratio $(awk -v a="$t_check" -v b="$t_py" 'BEGIN{printf "%.2f", a/b}')."
} > bench/RESULTS.md
cat bench/RESULTS.md
if [[ "$(stat -c %Y cli/target/rdstab.jar)" != "$jar_stamp" ]]; then
  echo "WARNING: the jar was rebuilt during this run (a source changed): the rows after that point timed the build" \
       "too and mixed two versions; run the benchmark again without editing." | tee -a bench/RESULTS.md >&2
  exit 1
fi
