#!/usr/bin/env bash
# Scans one genome on a SLURM cluster as a job array of N shards plus one merge job.
#
#   submit-genome.sh --shards N --work DIR [--bed OUT] [--tsv OUT] [--sbatch ARGS] [--clean] [--wait]
#                    -- [scan options] FASTA...
#
#   --shards N     tasks in the array; `stria partition --shards N FASTA...` shows what each would scan
#   --work DIR     directory for shard results and logs (DIR/logs/shard-K.out, DIR/logs/merge.out)
#   --bed/--tsv    final results (at least one), as for stria scan; .gz gives BGZF (+ tabix for BED)
#   --sbatch ARGS  extra sbatch options for both jobs, one word each, e.g. "--partition=long --mem=8G"
#   --clean        delete the shard results once the merge has succeeded
#   --wait         return only when the merge job has ended, with its exit status
#
# Everything after -- goes to `stria scan` unchanged (settings and the genome files). Prints the two job
# ids. Task K is shard K (rerun a failed one with `sbatch --array=K ...`), and the merge job depends on
# the whole array with afterok; if a task fails, SLURM cancels the merge (--kill-on-invalid-dep) instead
# of leaving it pending for ever.
#
# The stria launcher: $STRIA if set, else scripts/stria next to this directory.
set -euo pipefail

here=$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)
export STRIA=${STRIA:-$(cd "$here/.." && pwd)/stria}

usage() { sed -n '4,12p' "${BASH_SOURCE[0]}" | sed 's/^# \{0,1\}//' >&2; exit "${1:-2}"; }
die() { echo "submit-genome: $*" >&2; exit 2; }

shards= work= bed= tsv= extra= clean=0 wait=0
while [ $# -gt 0 ]; do
    case "$1" in
        --shards) shards=${2:-}; shift 2 ;;
        --work) work=${2:-}; shift 2 ;;
        --bed) bed=${2:-}; shift 2 ;;
        --tsv) tsv=${2:-}; shift 2 ;;
        --sbatch) extra=${2:-}; shift 2 ;;
        --clean) clean=1; shift ;;
        --wait) wait=1; shift ;;
        --) shift; break ;;
        -h|--help) usage 0 ;;
        *) die "unknown option $1 (scan options and genome files go after --)" ;;
    esac
done
[[ "$shards" =~ ^[1-9][0-9]*$ ]] || die "--shards needs a positive number"
[ -n "$work" ] || die "--work DIR is required"
[ -n "$bed$tsv" ] || die "give --bed OUT, --tsv OUT or both"
[ $# -gt 0 ] || die "no genome files after --"
[ -x "$STRIA" ] || command -v "$STRIA" >/dev/null || die "stria launcher $STRIA not found; set STRIA"

mkdir -p "$work/logs"
work=$(cd "$work" && pwd)
# jobs start in the submission directory, but absolute paths survive a cd in a wrapper
abs() { case "$1" in /*|-) echo "$1" ;; *) echo "$PWD/$1" ;; esac; }

formats= merge_args=()
if [ -n "$bed" ]; then formats=bed; merge_args+=(--bed "$(abs "$bed")"); fi
if [ -n "$tsv" ]; then formats=${formats:+$formats,}tsv; merge_args+=(--tsv "$(abs "$tsv")"); fi

read -r -a extra_args <<<"$extra"
array=$(sbatch --parsable "${extra_args[@]}" --array="1-$shards" --output="$work/logs/shard-%a.out" \
    --export=ALL,STRIA="$STRIA" "$here/scan-array.sbatch" "$work" "$shards" "$formats" "$@")
array=${array%%;*}
echo "array job $array: $shards shards of $*"

merge_opts=(--parsable "${extra_args[@]}" --dependency="afterok:$array" --kill-on-invalid-dep=yes
    --output="$work/logs/merge.out" --export=ALL,STRIA="$STRIA",STRIA_CLEAN="$clean")
if [ "$wait" = 1 ]; then
    set +e
    merge=$(sbatch "${merge_opts[@]}" --wait "$here/merge.sbatch" "$work" "$shards" "${merge_args[@]}")
    status=$?
    set -e
    merge=${merge%%;*}
    # sbatch --wait reports 0 for a merge that SLURM cancelled because a shard failed; the state tells
    state=$(scontrol show job -o "$merge" 2>/dev/null | grep -o 'JobState=[A-Z_]*' | head -1 || true)
    if [ "$status" = 0 ] && [ "$state" = JobState=COMPLETED ]; then
        echo "merge job $merge: done"
        exit 0
    fi
    failed=$(scontrol show job -o "$array" 2>/dev/null | grep -v 'JobState=COMPLETED' \
        | grep -o 'ArrayTaskId=[0-9]*' | cut -d= -f2 | paste -sd, - || true)
    echo "merge job $merge: ${state:-ended} (exit status $status)${failed:+; failed shards: $failed, logs in $work/logs}" >&2
    [ "$status" != 0 ] && exit "$status"
    exit 1
fi
merge=$(sbatch "${merge_opts[@]}" "$here/merge.sbatch" "$work" "$shards" "${merge_args[@]}")
echo "merge job ${merge%%;*}: runs after every shard of $array succeeded"
