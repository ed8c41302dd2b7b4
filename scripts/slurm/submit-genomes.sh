#!/usr/bin/env bash
# Scans many genomes on a SLURM cluster: for each genome one job array of shards and one merge job, as
# submit-genome.sh does for a single genome.
#
#   submit-genomes.sh LIST --out DIR --work DIR (--shards N | --shard-bases B) [--formats bed,tsv]
#                     [--sbatch ARGS] [--clean] [-- scan options]
#
#   LIST           one genome a line: NAME FASTA [FASTA...]  (blank lines and lines from # on are skipped)
#   --out DIR      results: DIR/NAME.bed.gz (BGZF + tabix index) and/or DIR/NAME.tsv.gz
#   --work DIR     shard results and logs go to DIR/NAME/
#   --shards N     the same number of shards for every genome, or
#   --shard-bases B  about B bases a shard: N = ceil(genome size / B), from `stria partition`
#   --formats F    bed, tsv or bed,tsv (default: bed)
#   --sbatch ARGS, --clean   as for submit-genome.sh; options after -- go to every scan
#
# Why one array per genome rather than one array over genome x shard: each merge then depends only on
# its own genome's shards, so one failed shard holds back one genome, and a genome's results appear as
# soon as its own shards are done. The price is one array job per genome, which is nothing for a
# scheduler at the scale of assemblies.
set -euo pipefail

here=$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)
export STRIA=${STRIA:-$(cd "$here/.." && pwd)/stria}

usage() { sed -n '5,15p' "${BASH_SOURCE[0]}" | sed 's/^# \{0,1\}//' >&2; exit "${1:-2}"; }
die() { echo "submit-genomes: $*" >&2; exit 2; }

[ $# -gt 0 ] || usage
case "$1" in -h|--help) usage 0 ;; esac
list=$1
shift
out= work= shards= shard_bases= formats=bed pass=()
while [ $# -gt 0 ]; do
    case "$1" in
        --out) out=${2:-}; shift 2 ;;
        --work) work=${2:-}; shift 2 ;;
        --shards) shards=${2:-}; shift 2 ;;
        --shard-bases) shard_bases=${2:-}; shift 2 ;;
        --formats) formats=${2:-}; shift 2 ;;
        --sbatch) pass+=(--sbatch "${2:-}"); shift 2 ;;
        --clean) pass+=(--clean); shift ;;
        --) shift; break ;;
        -h|--help) usage 0 ;;
        *) die "unknown option $1" ;;
    esac
done
[ -r "$list" ] || die "cannot read genome list $list"
[ -n "$out" ] && [ -n "$work" ] || die "--out DIR and --work DIR are required"
[ -n "$shards$shard_bases" ] || die "give --shards N or --shard-bases B"
[[ "${shards:-1}" =~ ^[1-9][0-9]*$ ]] || die "--shards needs a positive number"
[[ "${shard_bases:-1}" =~ ^[1-9][0-9]*$ ]] || die "--shard-bases needs a positive number"
mkdir -p "$out" "$work"

outputs=()
case ",$formats," in *,bed,*) outputs+=(bed) ;; esac
case ",$formats," in *,tsv,*) outputs+=(tsv) ;; esac
[ ${#outputs[@]} -gt 0 ] || die "--formats must be bed, tsv or bed,tsv"

submitted=0
while read -r name files; do
    name=${name%%#*}
    [ -n "$name" ] || continue
    files=${files%%#*}
    read -r -a fasta <<<"$files"
    [ ${#fasta[@]} -gt 0 ] || die "genome $name has no FASTA files in $list"
    n=$shards
    if [ -n "$shard_bases" ]; then
        # the partition's single shard holds the whole genome, so its bases column is the genome size
        bases=$("$STRIA" partition --shards 1 "${fasta[@]}" | awk -F'\t' '$1 == 1 { print $3 }')
        n=$(( (bases + shard_bases - 1) / shard_bases ))
        [ "$n" -ge 1 ] || n=1
    fi
    targets=()
    for f in "${outputs[@]}"; do targets+=("--$f" "$out/$name.$f.gz"); done
    echo "== $name"
    "$here/submit-genome.sh" --shards "$n" --work "$work/$name" "${targets[@]}" "${pass[@]}" \
        -- "$@" "${fasta[@]}"
    submitted=$((submitted + 1))
done < <(sed 's/\r$//' "$list")
echo "submitted $submitted genomes"
