#!/usr/bin/env bash
# Satellite arrays against planted truth: an invented genome of plain and higher-order arrays
# (stria.sim.SatelliteArrays: units of 150-250 bp, blocks of 1-16 units, some arrays interrupted by
# 3-6 kb of unrelated sequence), scanned with the default settings and with --max-period 10000; each scan
# is timed (wall, CPU = user + system, peak RSS) and scored (stria.sim.SatelliteScorer).
#   bench/satellites.sh [MAX_LENGTH [SEED [ARRAYS]]]    (default 3000000, 1 and 40)
# Array lengths run from 40 kb to MAX_LENGTH; a smaller MAX_LENGTH scales the genome down (300000: arrays
# of 40-300 kb, about 10 Mb in all with the background, against about 26 Mb at full size). The loci found
# over each array go to detail-*.tsv beside the genome. JVM options pass through, e.g.
# STRIA_JAVA_OPTS=-Xmx8g for a larger heap.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
# where stria.sim (generator and scorer) lives; if it moves to the test classes, e.g.
# SIM_CP="target/test-classes:target/stria.jar"
SIM_CP="${SIM_CP:-target/stria.jar:target/stria-tools.jar}"
source bench/lib.sh

max="${1:-3000000}"
seed="${2:-1}"
arrays="${3:-40}"
min=40000
((max < min)) && min="$max"
bench_setup
out="$WORK/satellites-$max-$seed-$arrays"
mkdir -p "$out"
java -cp "$SIM_CP" stria.sim.SatelliteArrays --seed "$seed" --arrays "$arrays" --lengths "$min-$max" \
  --out "$out/genome.fa.gz" --truth "$out/truth.tsv"
bases=$(zcat "$out/genome.fa.gz" | grep -v '^>' | tr -d '\n' | wc -c)
echo "genome: $bases bases, $arrays arrays of $min-$max bp, $(($(wc -l < "$out/truth.tsv") - 1)) expected loci, seed $seed"
machine

for mode in default max-period-10000; do
  opts=()
  [[ "$mode" == max-period-10000 ]] && opts=(--max-period 10000)
  echo
  echo "== scan, $mode"
  # a failing scan (e.g. out of memory) is reported and the next one still runs
  timed "$out/time-$mode.txt" scripts/stria scan -q "${opts[@]}" --tsv "$out/calls-$mode.tsv" \
    "$out/genome.fa.gz" > /dev/null 2> "$out/err-$mode.txt" || true
  status=$(awk -F': ' '/Exit status/{print $2}' "$out/time-$mode.txt")
  echo "time: wall $WALL s, cpu $CPU s, peak RSS $RSS MB"
  if [[ "$status" != 0 ]]; then
    echo "scan failed with exit status $status:"
    tail -5 "$out/err-$mode.txt"
    continue
  fi
  java -cp "$SIM_CP" stria.sim.SatelliteScorer --truth "$out/truth.tsv" --calls "$out/calls-$mode.tsv" --detail \
    | awk -v detail="$out/detail-$mode.tsv" '/^array\tpiece\t/ {d = 1} { if (d) print > detail; else print }'
  echo "per array: $out/detail-$mode.tsv"
done
