#!/usr/bin/env bash
# Regenerates testdata/demo.fa.gz and testdata/demo.truth.tsv byte for byte (fixed seed, default options
# of stria.sim.GenomeSimulator: 3 contigs ctg01..ctg03, 2 Mb, one 200 kb satellite array in ctg01).
# Run from the repository root after `mvn -q package -DskipTests`.
set -euo pipefail
cd "$(dirname "$0")/.."
java -cp target/stria.jar:target/stria-tools.jar stria.sim.GenomeSimulator --seed 1 --size 2000000 --contigs 3 \
  --out testdata/demo.fa.gz --truth testdata/demo.truth.tsv
