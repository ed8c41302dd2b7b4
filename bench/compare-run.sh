#!/usr/bin/env bash
# The compare command end to end against scanning both genomes: wall, CPU and peak RSS of
#   stria scan A, stria scan B, stria compare A A (the same file twice), stria compare A B
# where B is A with 0.1 % substitutions and 0.01 % small indels (stria.bench.MutateFasta, fixed seed).
#   bench/compare-run.sh [A.fa [THREADS]]
# Default A: human chromosome 20 from Debian's vt-examples. Heap: the launcher's default unless
# STRIA_JAVA_OPTS says otherwise.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
source bench/lib.sh
bench_setup
fa="${1:-/usr/share/doc/vt/examples/ref/20.fa.gz}"
threads="${2:-2}"
name=$(basename "$fa" | sed 's/\.fa.*$//')
mut="$WORK/$name.mutated.fa"
[[ -s "$mut" ]] || java -cp target/stria.jar:target/stria-tools.jar stria.bench.MutateFasta "$fa" "$mut"
machine
row() { printf '%-28s wall %7.1f s  CPU %7.1f s  peak RSS %5d MB\n' "$1" "$WALL" "$CPU" "$RSS"; }
timed "$WORK/cr-scan-a.time" scripts/stria scan -q --threads "$threads" --tsv "$WORK/$name.a.tsv" "$fa"; row "scan A" ; sa=$CPU
timed "$WORK/cr-scan-b.time" scripts/stria scan -q --threads "$threads" --tsv "$WORK/$name.b.tsv" "$mut"; row "scan B"; sb=$CPU
timed "$WORK/cr-self.time" scripts/stria compare --threads "$threads" --summary "$WORK/$name.self.sum" \
  --tsv "$WORK/$name.self.tsv" "$fa" "$fa"; row "compare A A"; cs=$CPU
timed "$WORK/cr-mut.time" scripts/stria compare --threads "$threads" --summary "$WORK/$name.mut.sum" \
  --tsv "$WORK/$name.mut.tsv" "$fa" "$mut"; row "compare A B"; cm=$CPU
timed "$WORK/cr-reuse.time" scripts/stria compare --threads "$threads" --a-result "$WORK/$name.a.tsv" \
  --b-result "$WORK/$name.b.tsv" --tsv "$WORK/$name.reuse.tsv" "$fa" "$mut"; row "compare A B, results reused"
awk -v a="$sa" -v b="$sb" -v s="$cs" -v m="$cm" 'BEGIN { printf "CPU of compare over both scans: A A x%.2f, A B x%.2f\n", s / (2 * a), m / (a + b) }'
echo "A A:"; cat "$WORK/$name.self.sum"
echo "A B:"; cat "$WORK/$name.mut.sum"
cmp <(grep -v '^#command' "$WORK/$name.mut.tsv") <(grep -v '^#command' "$WORK/$name.reuse.tsv") && echo "reused results: same bytes"
