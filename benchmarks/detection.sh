#!/usr/bin/env bash
# Detection benchmark: runs tufa analyze and tufa evaluate on the demo and on fleets made by the independent
# simulators in ../shared/fleets, and prints one table (episodes found, fault hours flagged, healthy hours flagged,
# healthy units with any finding, fleet-wide findings, wall time).
#
#   benchmarks/detection.sh WORKDIR [--dev] [--only NAME...]
#
# WORKDIR keeps the generated fleets between runs (several GB with the 500-unit year). Needs the built jar
# (mvn -q -B -DskipTests package) and Debian's python3-numpy and python3-scipy for the simulators.
#
# Two sets of fleets, kept apart on purpose (a setting that only helps the fleets it was chosen on is tuning):
#   report set (default): demo summer and year; fleetgen seeds 1, 2 and 3 (defaults); seed 4 at 5-minute samples;
#                         seed 1 healthy only; the healthy 500-unit year of benchwide.py.
#   --dev:                the fleets the detection's settings were chosen on: fleetgen seeds 101 (summer),
#                         102 (winter), 103 (healthy, late winter), 104, 105 (healthy), 106 (late summer to
#                         winter), and the demo summer.
set -euo pipefail
here=$(cd "$(dirname "$0")/.." && pwd)
jar="$here/analysis/target/tufa.jar"
shared="${TUFA_SHARED:-$here/../shared}"
[ $# -ge 1 ] || { echo "usage: benchmarks/detection.sh WORKDIR [--dev] [--only NAME...]" >&2; exit 2; }
work=$1; shift
dev=false
only=()
while [ $# -gt 0 ]; do
  case "$1" in
    --dev) dev=true ;;
    --only) shift; while [ $# -gt 0 ] && [[ "$1" != --* ]]; do only+=("$1"); shift; done; continue ;;
    *) echo "unknown option $1" >&2; exit 2 ;;
  esac
  shift
done
[ -f "$jar" ] || { echo "build first: mvn -q -B -DskipTests package" >&2; exit 1; }
[ -f "$shared/fleets/fleetgen.py" ] || { echo "needs $shared/fleets (set TUFA_SHARED)" >&2; exit 1; }
py=/usr/bin/python3
mkdir -p "$work"

fleetgen() { # name args...
  local name=$1; shift
  [ -f "$work/$name/trends.csv" ] || "$py" "$shared/fleets/fleetgen.py" "$work/$name" "$@" >/dev/null
}
demo() { # name args...
  local name=$1; shift
  if [ ! -f "$work/$name/model.ttl" ]; then
    java -jar "$jar" demo --out "$work/$name" "$@" >/dev/null
  fi
}

if $dev; then
  sets=(demo dev101 dev102 dev103h dev104 dev105h dev106)
else
  sets=(demo demoyear s1 s2 s3 i5 h1 bw500)
fi
[ ${#only[@]} -eq 0 ] || sets=("${only[@]}")

printf '%-9s %-9s %8s %8s %14s %9s %6s %7s\n' fleet episodes fault_h healthy_h healthy_units findings fleet wall_s
for s in "${sets[@]}"; do
  extra=()
  case "$s" in
    demo)     demo demo; model=$work/demo/model.ttl; trends=$work/demo/trends-summer/trends.csv
              truth=$work/demo/trends-summer/truth.csv; extra=(--timezone America/Toronto) ;;
    demoyear) demo demoyear --full-year; model=$work/demoyear/model.ttl; trends=$work/demoyear/trends-year/trends.csv
              truth=$work/demoyear/trends-year/truth.csv; extra=(--timezone America/Toronto) ;;
    s1|s2|s3) fleetgen "$s" --seed "${s#s}"; model=$work/$s/model.ttl; trends=$work/$s/trends.csv; truth=$work/$s/truth.csv ;;
    i5)       fleetgen i5 --seed 4 --interval 5; model=$work/i5/model.ttl; trends=$work/i5/trends.csv
              truth=$work/i5/truth.csv; extra=(--interval PT5M) ;;
    h1)       fleetgen h1 --seed 1 --healthy-only; model=$work/h1/model.ttl; trends=$work/h1/trends.csv; truth=$work/h1/truth.csv ;;
    dev101)   fleetgen "$s" --seed 101 ;;
    dev102)   fleetgen "$s" --seed 102 --start 2031-11-01 ;;
    dev103h)  fleetgen "$s" --seed 103 --healthy-only --start 2031-02-01 --days 90 ;;
    dev104)   fleetgen "$s" --seed 104 ;;
    dev105h)  fleetgen "$s" --seed 105 --healthy-only ;;
    dev106)   fleetgen "$s" --seed 106 --start 2031-08-15 ;;
    bw500)    if [ ! -f "$work/bw500/model.ttl" ]; then
                mkdir -p "$work/bw500"
                "$py" "$shared/fleets/benchwide.py" "$work/bw500/trends.csv" --units 500 --days 365 >/dev/null
                "$py" "$shared/fleets/benchwide_model.py" "$work/bw500/trends.csv" "$work/bw500/model.ttl" >/dev/null
                printf 'unit,fault,start,end,severity\n' > "$work/bw500/truth.csv"
              fi
              model=$work/bw500/model.ttl; trends=$work/bw500/trends.csv; truth=$work/bw500/truth.csv ;;
    *) echo "unknown fleet $s" >&2; exit 2 ;;
  esac
  case "$s" in dev*) model=$work/$s/model.ttl; trends=$work/$s/trends.csv; truth=$work/$s/truth.csv ;; esac
  out=$work/out-$s
  start=$(date +%s.%N)
  java -Xmx1500m -jar "$jar" analyze --model "$model" --trends "$trends" --out "$out" --no-report "${extra[@]}" \
    >"$out.log" 2>&1 || { echo "$s: analyze failed, see $out.log" >&2; continue; }
  wall=$(echo "$(date +%s.%N) - $start" | bc)
  java -jar "$jar" evaluate --findings "$out" --truth "$truth" >"$out.evaluation.log" 2>&1
  awk -F, -v name="$s" -v wall="$wall" -v findings="$(($(wc -l <"$out/findings.csv") - 1))" \
      -v fleet="$(($(wc -l <"$out/fleet_findings.csv") - 1))" '
    NR > 1 && $1 == "all_faults" { ep = ($3 - $4 - $5 > 0) ? $6 "/" ($3 - $4 - $5) : "-"; fh = ($9 == "") ? "-" : sprintf("%.1f%%", 100 * $9) }
    NR > 1 && $1 == "healthy_units" { hh = ($9 == "") ? "-" : sprintf("%.2f%%", 100 * $9); hu_total = $2 }
    NR > 1 && $1 == "healthy_units_with_findings" { hu = $2 }
    END { if (ep == "") { ep = "-"; fh = "-" }
          printf "%-9s %-9s %8s %8s %14s %9d %6d %7.1f\n", name, ep, fh, hh, hu "/" hu_total, findings, fleet, wall }
  ' "$out/evaluation.csv"
done
