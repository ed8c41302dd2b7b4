#!/usr/bin/env bash
# Window-length sweep behind the default of --window: scans one scale genome (see scale.sh) with 2
# threads at several window lengths, ROUNDS rounds with the lengths alternated, and prints the median
# wall time, CPU time and peak RSS of each. The outputs must be identical; the script checks it.
#   bench/window.sh [SIZE_MB [ROUNDS [WINDOW...]]]     default: 64 3 64K 256K 1M 4M 16M
# Extra scan options can be given in STRIA_BENCH_OPTS (e.g. --max-period 10000).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source bench/lib.sh
bench_setup
mb="${1:-64}"
rounds="${2:-3}"
shift $(($# > 2 ? 2 : $#))
windows=("$@")
[[ ${#windows[@]} -eq 0 ]] && windows=(64K 256K 1M 4M 16M)
fa=$(scale_genome "$WORK" "$mb")
machine
echo "genome: $mb Mb, 2 threads, $rounds rounds, medians; options: ${STRIA_BENCH_OPTS:-(defaults)}"
declare -A walls cpus rsss
for ((r = 0; r < rounds; r++)); do
  for w in "${windows[@]}"; do
    timed "$WORK/time.txt" scripts/stria scan --quiet --threads 2 ${STRIA_BENCH_OPTS:-} --window "$w" --bed "$WORK/window-$w.bed" "$fa"
    walls[$w]+="$WALL "
    cpus[$w]+="$CPU "
    rsss[$w]+="$RSS "
  done
done
median() { tr ' ' '\n' | grep . | sort -g | awk '{v[NR] = $1} END{print v[int((NR + 1) / 2)]}'; }
printf "| window | wall s | CPU s | peak RSS MB |\n|---|---|---|---|\n"
for w in "${windows[@]}"; do
  printf "| %s | %s | %s | %s |\n" "$w" "$(median <<< "${walls[$w]}")" "$(median <<< "${cpus[$w]}")" \
    "$(median <<< "${rsss[$w]}")"
  if ! cmp -s <(grep -v '^#' "$WORK/window-${windows[0]}.bed") <(grep -v '^#' "$WORK/window-$w.bed"); then
    echo "window $w: output differs from window ${windows[0]}" >&2
    exit 1
  fi
done
