# Shared by the benchmark scripts (sourced, not run).

# bench_setup: builds the jar and sets WORK, the directory for genomes and outputs (STRIA_BENCH_DIR or
# bench/out). Run from the project root.
bench_setup() {
  mvn -q -B -DskipTests package >&2
  WORK="${STRIA_BENCH_DIR:-$PWD/bench/out}"
  mkdir -p "$WORK"
}

# timed OUTFILE CMD...: runs CMD under /usr/bin/time -v and sets WALL (s), CPU (user + system s) and
# RSS (peak resident set, MB).
timed() {
  local report="$1"
  shift
  /usr/bin/time -v -o "$report" "$@"
  WALL=$(awk -F': ' '/Elapsed \(wall clock\)/{print $2}' "$report" \
    | awk -F: '{ if (NF==3) print $1*3600+$2*60+$3; else print $1*60+$2 }')
  CPU=$(awk -F': ' '/User time|System time/{s += $2} END{printf "%.2f", s}' "$report")
  RSS=$(awk -F': ' '/Maximum resident set size/{print int($2/1024)}' "$report")
}

# scale_genome DIR MB: the generated genome of the scale benchmark (made once, then reused).
scale_genome() {
  local fa="$1/scale-$2M.fa"
  if [[ ! -s "$fa" ]]; then
    java -cp target/stria.jar:target/stria-tools.jar stria.sim.GenomeSimulator --seed 11 --size "$(($2 * 1000000))" --contigs 4 \
      --major 0.75 --satellites 1 --satellite-length 400000 --out "$fa" --truth "$1/scale-$2M.truth.tsv" >&2
  fi
  echo "$fa"
}

machine() {
  echo "machine: $(nproc) cores, $(free -g | awk '/Mem:/{print $2}') GiB, $(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2 | xargs)"
}
