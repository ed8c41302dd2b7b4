#!/usr/bin/env bash
# Stops the SLURM and munge daemons that .ci/slurm-up.sh started, and only those (it records them by
# process id). Daemons that were running before slurm-up.sh are left alone. Safe to run twice.
set -uo pipefail

STATE=${STRIA_SLURM_STATE:-/run/stria-slurm}
LIST=$STATE/started

say() { echo "slurm-down: $*"; }

if [ ! -s "$LIST" ]; then
    say "nothing to stop"
    exit 0
fi

# daemons in reverse start order: compute node, controller, then the authentication they use
tac "$LIST" | while read -r name pid; do
    [ -n "${pid:-}" ] || continue
    # a recycled id must not be mistaken for the daemon
    if ! kill -0 "$pid" 2>/dev/null || [ "$(cat /proc/"$pid"/comm 2>/dev/null)" != "$name" ]; then
        say "$name ($pid) already gone"
        continue
    fi
    kill -TERM "$pid" 2>/dev/null
    for _ in $(seq 1 50); do
        kill -0 "$pid" 2>/dev/null || break
        sleep 0.2
    done
    if kill -0 "$pid" 2>/dev/null; then
        kill -KILL "$pid" 2>/dev/null
        say "$name ($pid) killed"
    else
        say "$name ($pid) stopped"
    fi
done
: >"$LIST"
exit 0
