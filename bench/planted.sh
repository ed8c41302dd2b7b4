#!/usr/bin/env bash
# Planted-truth benchmark of the imperfect-repeat scan: simulate a genome with known repeats (fixed
# seed), scan it with the real command, and score the calls against the truth table.
#   bench/planted.sh [SIZE_BASES] [SEED]        (default 16000000 and 11)
# Prints recall, precision, boundary and purity errors (stria.sim.TruthScorer), the per-kind recall and
# the CPU and wall time of the imperfect scan next to an exact-only scan of the same genome.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
size="${1:-16000000}"
seed="${2:-11}"
source bench/lib.sh
bench_setup
out="$WORK/planted"
mkdir -p "$out"
java -cp target/stria.jar:target/stria-tools.jar stria.sim.GenomeSimulator --seed "$seed" --size "$size" --contigs 4 --satellites 3 \
  --gaps 12 --lower 40 --out "$out/genome.fa.gz" --truth "$out/truth.tsv"
echo "genome: $size bases, seed $seed, $(($(wc -l < "$out/truth.tsv") - 1)) planted loci, $(nproc) cores"
# CPU seconds (user + system) as well as wall time: on a shared machine only the former is steady
TIMEFORMAT="%U %S %R"
exact=$( { time scripts/stria scan -q --exact --tsv "$out/exact.tsv" "$out/genome.fa.gz" >/dev/null; } 2>&1 | tail -1)
imperfect=$( { time scripts/stria scan -q --tsv "$out/calls.tsv" "$out/genome.fa.gz" >/dev/null; } 2>&1 | tail -1)
awk -v a="$exact" -v b="$imperfect" 'BEGIN {
  split(a, x, " "); split(b, y, " ")
  printf "time: exact-only %.2f s cpu (%.2f s wall), imperfect %.2f s cpu (%.2f s wall), cpu ratio %.2f\n",
    x[1] + x[2], x[3], y[1] + y[2], y[3], (y[1] + y[2]) / (x[1] + x[2]) }'
java -cp target/stria.jar:target/stria-tools.jar stria.sim.TruthScorer --truth "$out/truth.tsv" --calls "$out/calls.tsv"
