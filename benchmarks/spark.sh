#!/usr/bin/env bash
# Spark benchmark: the same fleet through `tufa analyze` (local engine, --threads 2) and through the Spark job on
# local[2], each timed once, with the peak resident memory of the process; checks that fleet.csv, findings.csv,
# fleet_findings.csv and ranking.csv are the same bytes, and prints one table row per engine.
#
#   benchmarks/spark.sh WORKDIR MODEL TRENDS [analyze options...]
#   e.g. benchmarks/spark.sh /tmp/sb /work/eval/demo/model.ttl /work/eval/demo/trends-summer/trends.csv \
#            --timezone America/Toronto
#
# Uses spark-submit from PATH (or $SPARK_HOME/bin) when there is one; otherwise Spark 3.5.8's own jars from Maven
# (benchmarks/spark-classpath.xml) with the launcher class spark-submit runs, so Spark's libraries come first on
# the class path as on a cluster. Needs the built jars: mvn -q -B -DskipTests package. SPARK_MEMORY sets the
# driver memory (in local mode the driver is also the executor; default 4g).
set -euo pipefail
here=$(cd "$(dirname "$0")/.." && pwd)
[ $# -ge 3 ] || { echo "usage: benchmarks/spark.sh WORKDIR MODEL TRENDS [analyze options...]" >&2; exit 2; }
work=$1 model=$2 trends=$3; shift 3
jar="$here/analysis/target/tufa.jar"
sparkjar="$here/spark/target/tufa-spark.jar"
for j in "$jar" "$sparkjar"; do
  [ -f "$j" ] || { echo "build first: mvn -q -B -DskipTests package ($j is missing)" >&2; exit 1; }
done
mem=${SPARK_MEMORY:-4g}
mkdir -p "$work"
rm -rf "$work/local" "$work/spark"

submit=()
if command -v spark-submit >/dev/null 2>&1; then
  submit=(spark-submit)
elif [ -n "${SPARK_HOME:-}" ] && [ -x "$SPARK_HOME/bin/spark-submit" ]; then
  submit=("$SPARK_HOME/bin/spark-submit")
else
  cp_file="$work/spark-classpath.txt"
  [ -s "$cp_file" ] || mvn -q -B -f "$here/benchmarks/spark-classpath.xml" dependency:build-classpath \
      -Dmdep.outputFile="$cp_file" >/dev/null
  # The module options spark-submit passes to Java 17 (Spark's launcher, JavaModuleOptions).
  opens=()
  for p in java.lang java.lang.invoke java.lang.reflect java.io java.net java.nio java.util java.util.concurrent \
      java.util.concurrent.atomic jdk.internal.ref sun.nio.ch sun.nio.cs sun.security.action sun.util.calendar; do
    opens+=("--add-opens=java.base/$p=ALL-UNNAMED")
  done
  submit=(java "-Xmx$mem" "${opens[@]}" -Djdk.reflect.useDirectMethodHandle=false -cp "$(cat "$cp_file")"
    org.apache.spark.deploy.SparkSubmit)
fi

run() { # name command...
  local name=$1; shift
  /usr/bin/time -f "%e %M" -o "$work/$name.time" nice "$@" >"$work/$name.log" 2>&1 \
    || { echo "$name failed; see $work/$name.log" >&2; tail -3 "$work/$name.log" >&2; exit 1; }
}

run local java "-Xmx$mem" -jar "$jar" analyze --model "$model" --trends "$trends" --out "$work/local" --threads 2 "$@"
run spark "${submit[@]}" --master 'local[2]' --driver-memory "$mem" --class org.tufa.spark.SparkAnalyze \
  "$sparkjar" --model "$model" --trends "$trends" --out "$work/spark" "$@"

same=yes
for f in fleet.csv findings.csv fleet_findings.csv ranking.csv; do
  cmp -s "$work/local/$f" "$work/spark/$f" || { same=no; echo "differs: $f" >&2; }
done
# Per-unit files: the same data; parquet-java may list a column's encodings in another order in a Parquet footer
# from one JVM to the next (it keeps them in a hash set), so those are counted, not required equal.
unit_files=0 unit_differ=0
while IFS= read -r f; do
  unit_files=$((unit_files + 1))
  cmp -s "$work/local/$f" "$work/spark/$f" || unit_differ=$((unit_differ + 1))
done < <(cd "$work/local" && find units -type f | sort)
units=$(($(wc -l < "$work/local/fleet.csv") - 1))
findings=$(($(wc -l < "$work/local/findings.csv") - 1))
printf '%-6s %6s %9s %10s %12s  %s\n' engine units findings "wall_s" "peak_rss_MB" "heap (tufa's own line)"
for name in local spark; do
  read -r wall rss < "$work/$name.time"
  heap=$(grep -o 'peak heap.*' "$work/$name.log" | head -1)
  printf '%-6s %6d %9d %10.1f %12d  %s\n' "$name" "$units" "$findings" "$wall" $((rss / 1024)) "$heap"
done
echo "fleet files identical: $same; per-unit files: $unit_differ of $unit_files differ in bytes"
echo "load average at the end: $(cut -d' ' -f1-3 /proc/loadavg)"
[ "$same" = yes ]
