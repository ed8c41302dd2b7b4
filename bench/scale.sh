#!/usr/bin/env bash
# Genome-scale benchmark: generates genomes of 16, 64 and 256 Mb (one contig holding 3/4 of the total,
# with a satellite array of a few hundred kb inside) and times `stria scan` with default settings at 1 and
# 2 threads: wall time, MB/s (JVM start included) and peak RSS from /usr/bin/time -v.
#   bench/scale.sh [SIZES_MB...]        e.g. bench/scale.sh 16 64
# Extra scan options can be given in STRIA_BENCH_OPTS (e.g. --exact).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source bench/lib.sh
bench_setup
sizes=("$@")
[[ ${#sizes[@]} -eq 0 ]] && sizes=(16 64 256)
machine
echo "options: ${STRIA_BENCH_OPTS:-(defaults)}"
printf "| genome | threads | wall s | MB/s | peak RSS MB | loci |\n|---|---|---|---|---|---|\n"
for mb in "${sizes[@]}"; do
  fa=$(scale_genome "$WORK" "$mb")
  for t in 1 2; do
    out="$WORK/scale-${mb}M-t$t.bed"
    timed "$WORK/time.txt" scripts/stria scan --quiet --threads "$t" ${STRIA_BENCH_OPTS:-} --bed "$out" "$fa"
    loci=$(grep -vc '^#' "$out" || true)
    rate=$(awk -v m="$mb" -v w="$WALL" 'BEGIN{printf "%.2f", m / w}')
    printf "| %s Mb | %s | %s | %s | %s | %s |\n" "$mb" "$t" "$WALL" "$rate" "$RSS" "$loci"
  done
done
