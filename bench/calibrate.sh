#!/usr/bin/env bash
# Fits the evalue table by simulation and writes it where the scanner loads it from:
#   bench/calibrate.sh [MB [THREADS]]        (default 20 Mb per GC class, all cores)
# Every GC class gets MB Mb of random i.i.d. sequence (fixed seed), scanned by the real pipeline with the
# default filters and no score bound; the top of the score distribution of every period class is fitted
# as an exponential tail (stria.bench.Calibrate; DEVELOPERS.md, "The score"). The same arguments give the
# same bytes. Rebuild afterwards (mvn package) so that the jar ships the new table.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
mb="${1:-20}"
threads="${2:-$(nproc)}"
source bench/lib.sh
bench_setup
out="src/main/resources/stria/score/calibration.tsv"
tmp="$out.tmp"
java -cp target/stria.jar:target/stria-tools.jar stria.bench.Calibrate "$tmp" "$mb" "$threads"
mv "$tmp" "$out"
echo "wrote $out"
