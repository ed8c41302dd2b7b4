#!/usr/bin/env bash
# Genome-scale benchmark: generates genomes of 16, 64 and 256 Mb (one contig holding 3/4 of the total,
# with a satellite array of a few hundred kb inside) and times `stria scan` with default settings at 1 and
# 2 threads: wall time, MB/s (JVM start included) and peak RSS from /usr/bin/time -v.
#   bench/scale.sh [SIZES_MB...]        e.g. bench/scale.sh 16 64
# Extra scan options can be given in STRIA_BENCH_OPTS (e.g. --exact).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
mvn -q -B -DskipTests package >&2
work="${STRIA_BENCH_DIR:-$root/bench/out}"
mkdir -p "$work"
sizes=("$@")
[[ ${#sizes[@]} -eq 0 ]] && sizes=(16 64 256)
echo "machine: $(nproc) cores, $(free -g | awk '/Mem:/{print $2}') GiB, $(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2 | xargs)"
echo "options: ${STRIA_BENCH_OPTS:-(defaults)}"
printf "| genome | threads | wall s | MB/s | peak RSS MB | loci |\n|---|---|---|---|---|---|\n"
for mb in "${sizes[@]}"; do
  fa="$work/scale-${mb}M.fa"
  if [[ ! -s "$fa" ]]; then
    java -cp target/stria.jar stria.sim.GenomeSimulator --seed 11 --size "$((mb * 1000000))" --contigs 4 \
      --major 0.75 --satellites 1 --satellite-length 400000 --out "$fa" --truth "$work/scale-${mb}M.truth.tsv" >&2
  fi
  for t in 1 2; do
    out="$work/scale-${mb}M-t$t.bed"
    /usr/bin/time -v -o "$work/time.txt" scripts/stria scan --quiet --threads "$t" ${STRIA_BENCH_OPTS:-} \
      --bed "$out" "$fa"
    wall=$(awk -F': ' '/Elapsed \(wall clock\)/{print $2}' "$work/time.txt" | awk -F: '{ if (NF==3) print $1*3600+$2*60+$3; else print $1*60+$2 }')
    rss=$(awk -F': ' '/Maximum resident set size/{print int($2/1024)}' "$work/time.txt")
    loci=$(grep -vc '^#' "$out" || true)
    rate=$(awk -v m="$mb" -v w="$wall" 'BEGIN{printf "%.2f", m / w}')
    printf "| %s Mb | %s | %s | %s | %s | %s |\n" "$mb" "$t" "$wall" "$rate" "$rss" "$loci"
  done
done
