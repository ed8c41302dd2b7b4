#!/usr/bin/env bash
# Brings up a one-node SLURM cluster on this machine for the job-array tests: this host is controller and
# only compute node. Installs slurm-wlm and munge when missing, creates a munge key when there is none,
# starts munged (as user munge), slurmctld and slurmd, and waits until the node is idle.
#
# Safe to run twice: daemons that already answer are left alone. Only the daemons started here are
# written to $STATE/started, which .ci/slurm-down.sh reads to stop exactly those.
#
# Needs root. Exit status 0 when `sinfo` shows the node idle, 1 otherwise.
set -euo pipefail

STATE=${STRIA_SLURM_STATE:-/run/stria-slurm}
CONF_DIR=/etc/slurm
CONF=$CONF_DIR/slurm.conf
MARK="# written by stria .ci/slurm-up.sh"
WAIT_SECONDS=${STRIA_SLURM_WAIT:-90}

say() { echo "slurm-up: $*"; }
die() { echo "slurm-up: $*" >&2; exit 1; }

[ "$(id -u)" = 0 ] || die "must run as root"
mkdir -p "$STATE"
touch "$STATE/started"

node_states() { sinfo -h -N -o '%T' 2>/dev/null || true; }
# a pid file left by a machine that was stopped may name a process that is now something else
alive() { [ -s "$1" ] && [ "$(cat /proc/"$(cat "$1")"/comm 2>/dev/null)" = "$2" ]; }

# A cluster configured by someone else that already answers is used as it is: rewriting its
# configuration under running daemons would confuse them.
if [ -e "$CONF" ] && ! grep -qF "$MARK" "$CONF" && command -v sinfo >/dev/null \
        && node_states | grep -qx 'idle'; then
    say "using the running cluster of $CONF: $(sinfo -h -N -o '%N %T %c CPUs %m MB' | head -1)"
    exit 0
fi

if ! command -v slurmctld >/dev/null || ! command -v slurmd >/dev/null || ! command -v munged >/dev/null \
        || ! command -v sbatch >/dev/null; then
    say "installing slurm-wlm and munge"
    export DEBIAN_FRONTEND=noninteractive
    apt-get update -qq
    apt-get install -y -qq --no-install-recommends slurm-wlm munge >/dev/null
fi

# munge: the key authenticates every message between the SLURM daemons and clients
if [ ! -s /etc/munge/munge.key ]; then
    say "creating a munge key"
    mkdir -p /etc/munge
    if command -v mungekey >/dev/null; then
        mungekey --create --keyfile=/etc/munge/munge.key
    else
        dd if=/dev/urandom of=/etc/munge/munge.key bs=1024 count=1 status=none
    fi
fi
chown munge:munge /etc/munge /etc/munge/munge.key
chmod 700 /etc/munge
chmod 400 /etc/munge/munge.key
install -d -o munge -g munge -m 755 /run/munge /var/lib/munge /var/log/munge

if munge -n 2>/dev/null | unmunge >/dev/null 2>&1; then
    say "munged already running"
else
    say "starting munged as user munge"
    runuser -u munge -- /usr/sbin/munged
    for _ in $(seq 1 50); do
        munge -n 2>/dev/null | unmunge >/dev/null 2>&1 && break
        sleep 0.2
    done
    munge -n | unmunge >/dev/null || die "munged does not answer"
    echo "munged $(cat /run/munge/munged.pid)" >>"$STATE/started"
fi

HOST=$(hostname -s)
CPUS=$(nproc)
# a little below the total, since slurmd drains a node that has less memory than configured
MEM_MB=$(awk '/^MemTotal:/ { printf "%d", $2 / 1024 * 0.95 }' /proc/meminfo)
mkdir -p "$CONF_DIR" /var/spool/slurmctld /var/spool/slurmd /var/log/slurm

if [ -e "$CONF" ] && ! grep -qF "$MARK" "$CONF"; then
    mv "$CONF" "$CONF.before-stria"
    say "kept the earlier $CONF as $CONF.before-stria"
fi
# compared before it replaces the old file, so running daemons see no change when there is none
cat >"$CONF.new" <<EOF
$MARK
ClusterName=stria-test
SlurmctldHost=$HOST(127.0.0.1)
SlurmUser=root
SlurmdUser=root
AuthType=auth/munge
CredType=cred/munge
MpiDefault=none
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
SwitchType=switch/none
SelectType=select/cons_tres
# cores are the consumable: memory is not tracked, so array tasks that give no --mem can share the node
SelectTypeParameters=CR_Core
JobAcctGatherType=jobacct_gather/none
AccountingStorageType=accounting_storage/none
ReturnToService=2
SchedulerType=sched/backfill
SchedulerParameters=sched_interval=2
StateSaveLocation=/var/spool/slurmctld
SlurmdSpoolDir=/var/spool/slurmd
SlurmctldPidFile=/run/slurmctld.pid
SlurmdPidFile=/run/slurmd.pid
SlurmctldLogFile=/var/log/slurm/slurmctld.log
SlurmdLogFile=/var/log/slurm/slurmd.log
SlurmctldTimeout=30
SlurmdTimeout=60
MinJobAge=300
MaxArraySize=10001
NodeName=$HOST NodeAddr=127.0.0.1 CPUs=$CPUS RealMemory=$MEM_MB State=UNKNOWN
PartitionName=main Nodes=$HOST Default=YES MaxTime=INFINITE State=UP
EOF
if cmp -s "$CONF.new" "$CONF"; then
    rm -f "$CONF.new"
    say "$CONF is up to date: node $HOST, $CPUS CPUs, $MEM_MB MB"
else
    mv "$CONF.new" "$CONF"
    say "wrote $CONF: node $HOST, $CPUS CPUs, $MEM_MB MB"
fi

if alive /run/slurmctld.pid slurmctld; then
    say "slurmctld already running"
else
    say "starting slurmctld"
    slurmctld
    for _ in $(seq 1 50); do alive /run/slurmctld.pid slurmctld && break; sleep 0.2; done
    alive /run/slurmctld.pid slurmctld || die "slurmctld did not start; see /var/log/slurm/slurmctld.log"
    echo "slurmctld $(cat /run/slurmctld.pid)" >>"$STATE/started"
fi

if alive /run/slurmd.pid slurmd; then
    say "slurmd already running"
else
    say "starting slurmd"
    slurmd
    for _ in $(seq 1 50); do alive /run/slurmd.pid slurmd && break; sleep 0.2; done
    alive /run/slurmd.pid slurmd || die "slurmd did not start; see /var/log/slurm/slurmd.log"
    echo "slurmd $(cat /run/slurmd.pid)" >>"$STATE/started"
fi

deadline=$((SECONDS + WAIT_SECONDS))
while [ $SECONDS -lt $deadline ]; do
    state=$(node_states | head -1)
    case "$state" in
        idle) say "node $HOST is idle after $SECONDS s"; sinfo; exit 0 ;;
        down*|drain*|drained*)
            # a node left down by an earlier run comes back once its daemon answers again
            scontrol update nodename="$HOST" state=resume >/dev/null 2>&1 || true ;;
    esac
    sleep 1
done
sinfo -N -l >&2 || true
die "node $HOST not idle within $WAIT_SECONDS s; see /var/log/slurm/"
