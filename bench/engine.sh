#!/usr/bin/env bash
# Engine benchmark: MB/s of suffix array, LCP, the shallow index of imperfect mode, run enumeration and
# the whole run finder on one core, over a generated 16 Mb genome cut into windows.   bench/engine.sh [WINDOW_BYTES]
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
mvn -q -B -DskipTests package >&2
echo "machine: $(nproc) cores, $(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2 | xargs)"
exec java -XX:+UseParallelGC -Xmx4g -cp target/stria.jar:target/stria-tools.jar stria.bench.EngineBench "$@"
