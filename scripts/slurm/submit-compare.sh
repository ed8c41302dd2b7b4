#!/usr/bin/env bash
# Compares two genomes on a SLURM cluster: scans A and B as job arrays (unless their results are given),
# then compares in a job array of N parts of A's loci, then merges the parts.
#
#   submit-compare.sh --shards N --work DIR --tsv OUT [--a-bed OUT] [--b-bed OUT] [--summary OUT]
#                     [--a-result TSV --b-result TSV] [--scan-shards M] [--sbatch ARGS] [--clean] [--wait]
#                     -- [scan options] A.fa B.fa
#
#   --shards N       parts of the comparison (compare --shard K/N)
#   --work DIR       part results, scan results and logs (DIR/logs/...)
#   --tsv OUT        the comparison; --a-bed, --b-bed, --summary as for stria compare
#   --a-result/--b-result  whole-genome scan TSVs of A and B with the same settings: no scans are run
#   --scan-shards M  shards of each scan when they are run (default: N)
#   --sbatch ARGS    extra sbatch options for every job, one word each
#   --clean          delete part results once the merge has succeeded
#   --wait           return only when the merge job has ended, with its exit status
#
# Everything after -- goes to every scan and to every compare task: the scan options, then A and B.
# Each job depends on the ones before it with afterok (--kill-on-invalid-dep, so a failure cancels the
# rest instead of leaving them pending). The launcher: $STRIA if set, else scripts/stria.
set -euo pipefail

here=$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)
export STRIA=${STRIA:-$(cd "$here/.." && pwd)/stria}

usage() { sed -n '5,19p' "${BASH_SOURCE[0]}" | sed 's/^# \{0,1\}//' >&2; exit "${1:-2}"; }
die() { echo "submit-compare: $*" >&2; exit 2; }

shards= work= tsv= a_bed= b_bed= summary= a_result= b_result= scan_shards= extra= clean=0 wait=0
while [ $# -gt 0 ]; do
    case "$1" in
        --shards) shards=${2:-}; shift 2 ;;
        --work) work=${2:-}; shift 2 ;;
        --tsv) tsv=${2:-}; shift 2 ;;
        --a-bed) a_bed=${2:-}; shift 2 ;;
        --b-bed) b_bed=${2:-}; shift 2 ;;
        --summary) summary=${2:-}; shift 2 ;;
        --a-result) a_result=${2:-}; shift 2 ;;
        --b-result) b_result=${2:-}; shift 2 ;;
        --scan-shards) scan_shards=${2:-}; shift 2 ;;
        --sbatch) extra=${2:-}; shift 2 ;;
        --clean) clean=1; shift ;;
        --wait) wait=1; shift ;;
        --) shift; break ;;
        -h|--help) usage 0 ;;
        *) die "unknown option $1 (scan options and the genomes go after --)" ;;
    esac
done
[[ "$shards" =~ ^[1-9][0-9]*$ ]] || die "--shards needs a positive number"
scan_shards=${scan_shards:-$shards}
[[ "$scan_shards" =~ ^[1-9][0-9]*$ ]] || die "--scan-shards needs a positive number"
[ -n "$work" ] || die "--work DIR is required"
[ -n "$tsv" ] || die "--tsv OUT is required"
[ $# -ge 2 ] || die "give the scan options and A.fa B.fa after --"
if { [ -n "$a_result" ] && [ -z "$b_result" ]; } || { [ -z "$a_result" ] && [ -n "$b_result" ]; }; then
    die "give both --a-result and --b-result, or neither"
fi
args=("$@")
fa_b=${args[$((${#args[@]} - 1))]}
fa_a=${args[$((${#args[@]} - 2))]}
scan_opts=("${args[@]:0:$((${#args[@]} - 2))}")

mkdir -p "$work/logs"
work=$(cd "$work" && pwd)
abs() { case "$1" in /*) echo "$1" ;; *) echo "$PWD/$1" ;; esac; }
read -r -a extra_args <<<"$extra"
common=(--parsable "${extra_args[@]}" --kill-on-invalid-dep=yes --export=ALL,STRIA="$STRIA")

after=()
if [ -z "$a_result" ]; then
    a_result="$work/a.tsv" b_result="$work/b.tsv"
    deps=
    for side in a b; do
        fa=$fa_a; [ "$side" = b ] && fa=$fa_b
        mkdir -p "$work/scan-$side/logs"
        arr=$(sbatch "${common[@]}" --array="1-$scan_shards" --output="$work/scan-$side/logs/shard-%a.out" \
            "$here/scan-array.sbatch" "$work/scan-$side" "$scan_shards" tsv "${scan_opts[@]}" "$(abs "$fa")")
        arr=${arr%%;*}
        mrg=$(sbatch "${common[@]}" --dependency="afterok:$arr" --output="$work/scan-$side/logs/merge.out" \
            "$here/merge.sbatch" "$work/scan-$side" "$scan_shards" --tsv "$work/$side.tsv")
        mrg=${mrg%%;*}
        echo "scan of $side: array job $arr, merge job $mrg"
        deps=${deps:+$deps:}$mrg
    done
    after=(--dependency="afterok:$deps")
fi

array=$(sbatch "${common[@]}" "${after[@]}" --array="1-$shards" --output="$work/logs/part-%a.out" \
    "$here/compare-array.sbatch" "$work" "$shards" "$(abs "$a_result")" "$(abs "$b_result")" "${scan_opts[@]}" \
    "$(abs "$fa_a")" "$(abs "$fa_b")")
array=${array%%;*}
echo "array job $array: $shards parts of the comparison"

outs=(--tsv "$(abs "$tsv")")
[ -n "$a_bed" ] && outs+=(--a-bed "$(abs "$a_bed")")
[ -n "$b_bed" ] && outs+=(--b-bed "$(abs "$b_bed")")
[ -n "$summary" ] && outs+=(--summary "$(abs "$summary")")
merge_opts=("${common[@]}" --dependency="afterok:$array" --output="$work/logs/merge.out"
    --export=ALL,STRIA="$STRIA",STRIA_CLEAN="$clean")
if [ "$wait" = 1 ]; then
    set +e
    merge=$(sbatch "${merge_opts[@]}" --wait "$here/compare-merge.sbatch" "$work" "$shards" "${outs[@]}")
    status=$?
    set -e
    merge=${merge%%;*}
    state=$(scontrol show job -o "$merge" 2>/dev/null | grep -o 'JobState=[A-Z_]*' | head -1 || true)
    if [ "$status" = 0 ] && [ "$state" = JobState=COMPLETED ]; then
        echo "merge job $merge: done"
        exit 0
    fi
    echo "merge job $merge: ${state:-ended} (exit status $status); logs in $work/logs" >&2
    [ "$status" != 0 ] && exit "$status"
    exit 1
fi
merge=$(sbatch "${merge_opts[@]}" "$here/compare-merge.sbatch" "$work" "$shards" "${outs[@]}")
echo "merge job ${merge%%;*}: runs after every part of $array succeeded"
