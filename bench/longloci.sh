#!/usr/bin/env bash
# Long-locus benchmark: one contig that is a single repeat, a homopolymer and a dinucleotide array of
# SIZE_MB megabases (default 20), scanned with default settings and with --exact: wall, CPU, peak RSS.
# Memory must not grow with the length of a locus.
#   bench/longloci.sh [SIZE_MB...]
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source bench/lib.sh
bench_setup
sizes=("$@")
[[ ${#sizes[@]} -eq 0 ]] && sizes=(20)
machine
printf "| locus | Mb | mode | wall s | CPU s | peak RSS MB | loci |\n|---|---|---|---|---|---|---|\n"
for mb in "${sizes[@]}"; do
  for kind in homopolymer dinucleotide; do
    fa="$WORK/long-$kind-${mb}M.fa"
    if [[ ! -s "$fa" ]]; then
      unit=A
      [[ $kind == dinucleotide ]] && unit=AC
      # awk, not yes | head: under pipefail the producer's SIGPIPE would end the script
      awk -v name="$kind" -v unit="$unit" -v n="$((mb * 1000000))" 'BEGIN {
        print ">" name; line = ""; while (length(line) < 60) line = line unit
        for (i = 0; i + 60 <= n; i += 60) print line
        if (i < n) print substr(line, 1, n - i) }' > "$fa.tmp"
      mv "$fa.tmp" "$fa"
    fi
    for mode in default exact; do
      flag=""
      [[ "$mode" == exact ]] && flag="--exact"
      out="$WORK/long-$kind-$mb-$mode.tsv"
      timed "$WORK/time.txt" scripts/stria scan --quiet $flag --tsv "$out" "$fa"
      loci=$(grep -v '^#' "$out" | tail -n +2 | wc -l)
      printf "| %s | %s | %s | %s | %s | %s | %s |\n" "$kind" "$mb" "$mode" "$WALL" "$CPU" "$RSS" "$loci"
    done
  done
done
