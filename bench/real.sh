#!/usr/bin/env bash
# Real-genome benchmark: human DNA from Debian example packages (installed when missing and run as root;
# never committed): chromosome 20 of GRCh37 (vt-examples, 63.0 Mb, BGZF with .fai) and the first 70 Mb of
# chromosome X (smalt-examples). Times `stria scan` (default imperfect loci, and --exact) at 1 and 2
# threads: wall, CPU (user + system), MB/s by wall time with JVM start, peak RSS, loci.
#   bench/real.sh [GENOME...]        GENOME: chr20, chrX (default both)
# Extra scan options in STRIA_BENCH_OPTS; STRIA_BENCH_MODES overrides the modes ("default exact").
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source bench/lib.sh
bench_setup

real_genome() {
  case "$1" in
    chr20)
      local f=/usr/share/doc/vt/examples/ref/20.fa.gz
      [[ -s "$f" ]] || install_package vt-examples
      echo "$f" ;;
    chrX)
      local f=/usr/share/doc/smalt/test/data/hs37chrXtrunc.fa.gz
      [[ -s "$f" ]] || install_package smalt-examples
      echo "$f" ;;
    *) echo "unknown genome $1 (chr20, chrX)" >&2; exit 2 ;;
  esac
}

install_package() {
  if [[ $(id -u) -ne 0 ]]; then
    echo "Debian package $1 is missing: apt-get install $1 (as root)" >&2
    exit 1
  fi
  DEBIAN_FRONTEND=noninteractive apt-get install -y -qq --no-install-recommends "$1" >/dev/null
}

genomes=("$@")
[[ ${#genomes[@]} -eq 0 ]] && genomes=(chr20 chrX)
modes=(${STRIA_BENCH_MODES:-default exact})
machine
echo "options: ${STRIA_BENCH_OPTS:-(defaults)}"
printf "| genome | mode | threads | wall s | CPU s | MB/s | peak RSS MB | loci |\n|---|---|---|---|---|---|---|---|\n"
for g in "${genomes[@]}"; do
  fa=$(real_genome "$g")
  bases=$(scripts/stria partition --shards 1 "$fa" | awk -F'\t' '!/^#/ { print $3 }')
  for mode in "${modes[@]}"; do
    flag=""
    [[ "$mode" == exact ]] && flag="--exact"
    for t in 1 2; do
      out="$WORK/real-$g-$mode-t$t.tsv"
      timed "$WORK/time.txt" scripts/stria scan --quiet --threads "$t" $flag ${STRIA_BENCH_OPTS:-} --tsv "$out" "$fa"
      loci=$(grep -v '^#' "$out" | tail -n +2 | wc -l)
      rate=$(awk -v b="$bases" -v w="$WALL" 'BEGIN{printf "%.2f", b / 1e6 / w}')
      printf "| %s | %s | %s | %s | %s | %s | %s | %s |\n" "$g" "$mode" "$t" "$WALL" "$CPU" "$rate" "$RSS" "$loci"
    done
  done
done
