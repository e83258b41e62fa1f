#!/bin/sh
# A real cluster run on this machine: a one-node Slurm (slurmctld, slurmd and
# munged, all on localhost, configured in a private directory) runs the
# README's array jobs, then `elbowroom merge` puts the pieces back together and
# the result is compared with the single run.
#
#   scripts/cluster-check.sh [path/to/elbowroom]
#
# Jobs: the default Hessenberg table of n = 12 as a two-stage job (one task
# writes the class file with --save-class, then an array of 4 pieces, held
# until it succeeds, each reads it with --class), and the survey of n = 6 in 4
# pieces. The Hessenberg merge must equal the single run byte for byte; the
# survey merge must equal it in every field but "shard" and "merged_from",
# which say that it was merged.
#
# Needs the Debian packages slurm-wlm and munge: installed with apt-get when
# run as root, otherwise the script says it is skipped and exits 0 (set
# ELBOWROOM_REQUIRE_SLURM=1 to make that a failure). Only the daemons it starts
# are stopped at the end, by their process ids.
set -eu

BIN=${1:-./target/release/elbowroom}
case "$BIN" in /*) ;; *) BIN="$(pwd)/$BIN" ;; esac

skip() {
    echo "cluster check skipped: $1"
    if [ "${ELBOWROOM_REQUIRE_SLURM:-0}" = 1 ]; then exit 1; fi
    exit 0
}

[ -x "$BIN" ] || { echo "no elbowroom binary at $BIN (build it with cargo build --release)"; exit 1; }
if ! command -v slurmctld >/dev/null 2>&1 || ! command -v munged >/dev/null 2>&1; then
    if [ "$(id -u)" = 0 ] && command -v apt-get >/dev/null 2>&1; then
        (export DEBIAN_FRONTEND=noninteractive
         timeout 900 apt-get update -qq \
            && timeout 900 apt-get install -y -qq --no-install-recommends slurm-wlm munge >/dev/null) \
            || skip "slurm-wlm and munge could not be installed"
    else
        skip "slurm-wlm and munge are not installed (installing them needs root with apt-get)"
    fi
fi
[ "$(id -u)" = 0 ] || skip "the one-node cluster is started as root"

DIR=$(mktemp -d "${TMPDIR:-/tmp}/elbowroom-cluster.XXXXXX")
OUT="$DIR/out"
mkdir -p "$OUT" "$DIR/state" "$DIR/spool" "$DIR/munge"
NODE=$(hostname -s)
CPUS=$(nproc)
MEM_MB=$(awk '/MemTotal/ {print int($2 / 1024 * 0.8)}' /proc/meminfo)

stop() {
    for f in "$DIR/slurmd.pid" "$DIR/slurmctld.pid" "$DIR/munge/munged.pid"; do
        if [ -s "$f" ]; then kill "$(cat "$f")" 2>/dev/null || true; fi
    done
}
trap stop EXIT

# munge: a fresh key and a private socket
dd if=/dev/urandom of="$DIR/munge/munge.key" bs=1024 count=1 2>/dev/null
chmod 400 "$DIR/munge/munge.key"
munged --force --key-file="$DIR/munge/munge.key" --socket="$DIR/munge/socket" \
    --pid-file="$DIR/munge/munged.pid" --log-file="$DIR/munge/munged.log" \
    --seed-file="$DIR/munge/seed"

cat > "$DIR/slurm.conf" <<EOF
ClusterName=elbowroom
SlurmctldHost=$NODE(127.0.0.1)
SlurmUser=root
SlurmdUser=root
AuthType=auth/munge
AuthInfo=socket=$DIR/munge/socket
CredType=cred/munge
StateSaveLocation=$DIR/state
SlurmdSpoolDir=$DIR/spool
SlurmctldPidFile=$DIR/slurmctld.pid
SlurmdPidFile=$DIR/slurmd.pid
SlurmctldLogFile=$DIR/slurmctld.log
SlurmdLogFile=$DIR/slurmd.log
SlurmctldPort=16817
SlurmdPort=16818
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
JobAcctGatherType=jobacct_gather/none
MpiDefault=none
SwitchType=switch/none
SchedulerType=sched/backfill
SelectType=select/cons_tres
SelectTypeParameters=CR_CPU_Memory
ReturnToService=2
NodeName=$NODE NodeAddr=127.0.0.1 CPUs=$CPUS RealMemory=$MEM_MB State=UNKNOWN
PartitionName=local Nodes=$NODE Default=YES MaxTime=INFINITE State=UP
EOF
export SLURM_CONF="$DIR/slurm.conf"
slurmctld -f "$SLURM_CONF"
slurmd -f "$SLURM_CONF"

# wait until the node takes jobs (at most a minute)
i=0
until sinfo -h -o %t 2>/dev/null | grep -Eq '^(idle|mix|alloc)'; do
    i=$((i + 1))
    if [ "$i" -gt 60 ]; then
        echo "the one-node cluster did not come up; logs in $DIR"
        sinfo 2>&1 || true
        exit 1
    fi
    sleep 1
done
echo "one-node Slurm up: $(sinfo -h -o '%P %D %t %c CPUs %m MB')"

TIME=""
if [ -x /usr/bin/time ]; then TIME="/usr/bin/time -f %e_s_%M_KB"; fi

# the cluster recipe (docs/cluster.md): a preparation task writes the class
# once; the array of pieces starts when it has succeeded, each piece reading
# the class file instead of expanding the class again
PREP=$(sbatch --parsable --mem=500M --time=10 --job-name=hessenberg-class \
    --output="$OUT/class.out" --error="$OUT/class.err" \
    --wrap "$TIME $BIN hessenberg --n 12 --save-class $OUT/class-n12.bin")
sbatch --quiet --wait --dependency="afterok:$PREP" --kill-on-invalid-dep=yes \
    --array=1-4 --mem=500M --time=10 --job-name=hessenberg \
    --output="$OUT/hessenberg-%a.out" --error="$OUT/hessenberg-%a.err" \
    --wrap "$TIME $BIN hessenberg --n 12 --shard \$SLURM_ARRAY_TASK_ID/4 --class $OUT/class-n12.bin --json --out $OUT/hessenberg-\$SLURM_ARRAY_TASK_ID.json"
echo "preparation: $(cat "$OUT/class.out") ($(cat "$OUT/class.err"))"
sbatch --quiet --wait --array=1-4 --mem=500M --time=10 --job-name=survey \
    --output="$OUT/survey-%a.out" --error="$OUT/survey-%a.err" \
    --wrap "$TIME $BIN survey --n 6 --shard \$SLURM_ARRAY_TASK_ID/4 --json --out $OUT/survey-\$SLURM_ARRAY_TASK_ID.json"
for k in 1 2 3 4; do
    echo "piece $k/4: hessenberg $(cat "$OUT/hessenberg-$k.err"), survey $(cat "$OUT/survey-$k.err")"
done

"$BIN" merge "$OUT"/hessenberg-1.json "$OUT"/hessenberg-2.json "$OUT"/hessenberg-3.json \
    "$OUT"/hessenberg-4.json > "$OUT/hessenberg-merged.json"
"$BIN" hessenberg --n 12 --json > "$OUT/hessenberg-single.json"
cmp "$OUT/hessenberg-merged.json" "$OUT/hessenberg-single.json"
echo "hessenberg --n 12: the merge of 4 Slurm pieces equals the single run byte for byte ($(wc -c < "$OUT/hessenberg-single.json") bytes)"

"$BIN" merge "$OUT"/survey-1.json "$OUT"/survey-2.json "$OUT"/survey-3.json \
    "$OUT"/survey-4.json > "$OUT/survey-merged.json"
"$BIN" survey --n 6 --json > "$OUT/survey-single.json"
python3 - "$OUT/survey-merged.json" "$OUT/survey-single.json" <<'EOF'
import json, sys
merged, single = (json.load(open(p)) for p in sys.argv[1:3])
for label in ("shard", "merged_from"):
    merged.pop(label, None)
    single.pop(label, None)
if merged != single:
    keys = sorted(k for k in set(merged) | set(single) if merged.get(k) != single.get(k))
    sys.exit("survey --n 6: the merge differs from the single run in " + ", ".join(keys))
EOF
echo "survey --n 6: the merge of 4 Slurm pieces equals the single run in every field"

# a failed task: merge names the missing piece
if "$BIN" merge "$OUT"/hessenberg-1.json "$OUT"/hessenberg-2.json "$OUT"/hessenberg-4.json \
    > /dev/null 2> "$OUT/missing.err"; then
    echo "merge accepted three pieces of four"
    exit 1
fi
echo "with piece 3 left out: $(cat "$OUT/missing.err")"
stop
trap - EXIT
sleep 1
rm -rf "$DIR"
