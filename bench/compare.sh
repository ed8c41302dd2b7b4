#!/usr/bin/env bash
# Comparison engine benchmark on one core: anchor index build, counting A's words, streaming B past the
# index (MB/s by thread CPU time), pairing and measuring, memory per locus.
#   bench/compare.sh [A.fa [A.tsv [ROUNDS]]]
# Default A: human chromosome 20 from Debian's vt-examples, scanned first with the default settings.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source bench/lib.sh
bench_setup
fa="${1:-/usr/share/doc/vt/examples/ref/20.fa.gz}"
tsv="${2:-$WORK/$(basename "$fa" | sed 's/\.fa.*$//').tsv}"
rounds="${3:-3}"
if [[ ! -s "$tsv" ]]; then
  timed "$WORK/compare-scan.time" scripts/stria scan --threads 1 --quiet --tsv "$tsv" "$fa" > /dev/null
  echo "scan of A (1 thread): wall ${WALL} s, CPU ${CPU} s, peak RSS ${RSS} MB"
fi
machine
timed "$WORK/compare.time" java -XX:+UseParallelGC -Xmx4g -cp target/stria.jar:target/stria-tools.jar stria.bench.CompareBench "$fa" "$tsv" "$rounds"
echo "whole benchmark: wall ${WALL} s, CPU ${CPU} s, peak RSS ${RSS} MB"
