#!/usr/bin/env bash
# Cross-check against a general reference library: for each case, `rdstab export` writes J and M at the
# base state as Matrix Market files; SciPy's shift-invert ARPACK (../shared/bench/scipy_eigs.py, Debian's
# python3-scipy) solves J x = lambda M x for the eigenvalues nearest rdstab's own shift; the rightmost
# three must agree with `rdstab check --json` to 1e-8 relative. Exits non-zero on any disagreement.
# Usage: scripts/scipy-crosscheck.sh [CASE...]      (default: four demo cases, 1D and 2D, one and two fields)
set -euo pipefail
here="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
bench="$here/../shared/bench/scipy_eigs.py"
[[ -f $bench ]] || { echo "scipy-crosscheck: $bench not found (the shared folder beside the checkout)"; exit 4; }
if ! /usr/bin/python3 -c "import scipy" 2>/dev/null; then
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -q >/dev/null && apt-get install -y -q python3-scipy >/dev/null
fi
cases=("$@")
[[ ${#cases[@]} -gt 0 ]] || cases=(cases/slab-self-heating.yaml cases/brusselator-turing.yaml \
  cases/tubular-reactor-cooled.yaml cases/plate-with-hole.yaml)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
status=0
for c in "${cases[@]}"; do
  name=$(basename "$c" .yaml)
  "$here/rdstab" check "$here/$c" --json --modes 6 > "$work/$name.json"
  "$here/rdstab" export "$here/$c" --out "$work/$name" > /dev/null
  shift_=$(/usr/bin/python3 -c "import json,sys; print(json.load(open(sys.argv[1]))['shift'])" "$work/$name.json")
  /usr/bin/python3 "$bench" "$work/$name/J.mtx" "$work/$name/M.mtx" --k 6 --sigma "$shift_" --repeat 1 > "$work/$name.scipy.json"
  if ! /usr/bin/python3 - "$work/$name.json" "$work/$name.scipy.json" "$name" <<'PY'
import json, sys
ours = json.load(open(sys.argv[1]))["leading"]
ref = json.load(open(sys.argv[2]))["eigenvalues"]
ref = sorted(ref, key=lambda z: (-z[0], -z[1]))
worst = 0.0
for a, b in zip(ours[:3], ref[:3]):
    d = abs(complex(a["re"], a["im"]) - complex(b[0], b[1])) / max(1.0, abs(complex(b[0], b[1])))
    worst = max(worst, d)
ok = worst <= 1e-8
print(f"{sys.argv[3]:32s} rdstab {ours[0]['re']:+.10f}{ours[0]['im']:+.6f}i  SciPy {ref[0][0]:+.10f}{ref[0][1]:+.6f}i"
      f"  max rel diff (3 rightmost) {worst:.1e}  {'agree' if ok else 'DISAGREE'}")
sys.exit(0 if ok else 1)
PY
  then status=1; fi
done
exit $status
