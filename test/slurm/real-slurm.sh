#!/usr/bin/env bash
# The job array of `crosswise cluster` on a real Slurm: a single-node Slurm (Debian's
# slurm-wlm and munge) is started in a temporary folder, the script crosswise wrote is
# submitted, and results.csv, comparisons.csv and summary.md must equal, byte for byte,
# those of `crosswise run` of the same config on this machine. Then two cells are deleted,
# `crosswise cluster` must cover exactly those two, and the outputs must be identical again.
# Exit 0 when it passed or was skipped (the packages cannot be installed), 1 when it failed.
set -euo pipefail

ROOT=$(cd "$(dirname "$0")/../.." && pwd)
NODE=$(command -v node)
crosswise() { "$NODE" "$ROOT/bin/crosswise.js" "$@"; }
say() { echo "real-slurm: $*"; }
fail() { say "FAILED: $*"; exit 1; }
skip() { say "SKIPPED: $*"; exit 0; }

# Slurm's MaxArraySize for this cluster: small, so the 12 cells need two arrays (0-9, 10-11).
MAX_ARRAY_SIZE=10
WAIT_SECONDS=600

# --- packages -------------------------------------------------------------------------
missing=()
command -v slurmctld >/dev/null 2>&1 && command -v slurmd >/dev/null 2>&1 && command -v sbatch >/dev/null 2>&1 || missing+=(slurm-wlm)
command -v munged >/dev/null 2>&1 || missing+=(munge)
if [ ${#missing[@]} -gt 0 ]; then
  [ "$(id -u)" -eq 0 ] || skip "${missing[*]} missing and not root, so they cannot be installed"
  say "installing ${missing[*]} (apt-get)"
  { apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${missing[@]}" >/dev/null; } \
    || skip "apt-get could not install ${missing[*]}"
fi
[ "$(id -u)" -eq 0 ] || skip "slurmd must run as root here (SlurmUser=root)"

# --- a single-node Slurm in a temporary folder ------------------------------------------
TMP=$(mktemp -d /tmp/crosswise-slurm.XXXXXX)
PASSED=0
stop_daemons() {
  if [ -S "$TMP/munge.socket" ] && [ -f "$TMP/slurmctld.pid" ]; then
    scancel --full --quiet --user=root >/dev/null 2>&1 || true
  fi
  for daemon in slurmd slurmctld munged; do
    local pidfile="$TMP/$daemon.pid"
    [ -f "$pidfile" ] || continue
    local pid
    pid=$(cat "$pidfile")
    kill "$pid" 2>/dev/null || continue
    for _ in $(seq 50); do kill -0 "$pid" 2>/dev/null || break; sleep 0.2; done
    kill -9 "$pid" 2>/dev/null || true
  done
  if [ "$PASSED" -eq 1 ]; then
    rm -rf "$TMP"
  else
    say "kept $TMP for a look; last lines of the Slurm logs:"
    tail -n 15 "$TMP"/slurmctld.log "$TMP"/slurmd.log 2>/dev/null || true
  fi
}
trap stop_daemons EXIT

free_port() { "$NODE" -e 'const s = require("node:net").createServer().listen(0, "127.0.0.1", () => { console.log(s.address().port); s.close(); });'; }

mkdir -p "$TMP/state" "$TMP/spool"
head -c 1024 /dev/urandom > "$TMP/munge.key"
chmod 400 "$TMP/munge.key"
munged --force --key-file="$TMP/munge.key" --socket="$TMP/munge.socket" --pid-file="$TMP/munged.pid" \
  --log-file="$TMP/munged.log" --seed-file="$TMP/munged.seed" || fail "munged did not start (see $TMP/munged.log)"

HOST=$(hostname -s)
# The node's real CPUs, sockets, cores and memory, as slurmd itself measures them.
HARDWARE=$(slurmd -C | head -n 1 | sed -e 's/^NodeName=[^ ]* //')
export SLURM_CONF="$TMP/slurm.conf"
cat > "$SLURM_CONF" <<EOF
ClusterName=crosswise-test
SlurmctldHost=$HOST(127.0.0.1)
SlurmUser=root
SlurmdUser=root
SlurmctldPort=$(free_port)
SlurmdPort=$(free_port)
AuthType=auth/munge
CredType=cred/munge
AuthInfo=socket=$TMP/munge.socket
StateSaveLocation=$TMP/state
SlurmdSpoolDir=$TMP/spool
SlurmctldPidFile=$TMP/slurmctld.pid
SlurmdPidFile=$TMP/slurmd.pid
SlurmctldLogFile=$TMP/slurmctld.log
SlurmdLogFile=$TMP/slurmd.log
ProctrackType=proctrack/linuxproc
TaskPlugin=task/none
SelectType=select/cons_tres
SelectTypeParameters=CR_Core
ReturnToService=2
MaxArraySize=$MAX_ARRAY_SIZE
MpiDefault=none
JobAcctGatherType=jobacct_gather/none
AccountingStorageType=accounting_storage/none
NodeName=$HOST NodeAddr=127.0.0.1 $HARDWARE State=UNKNOWN
PartitionName=test Nodes=$HOST Default=YES MaxTime=INFINITE State=UP
EOF
slurmctld -i || fail "slurmctld did not start"
slurmd || fail "slurmd did not start"
for _ in $(seq 60); do
  state=$(sinfo -h -n "$HOST" -o %T 2>/dev/null || true)
  [ "$state" = idle ] && break
  sleep 1
done
[ "$state" = idle ] || fail "the node did not become idle within 60 s (state: '${state:-none}')"
say "Slurm $(sinfo --version | cut -d' ' -f2) is up on $HOST: $HARDWARE"

# --- the sweep: 4 seeds × 3 learners = 12 small cells --------------------------------------
WORK="$TMP/it's a sweep"   # a space and a quote in every path the script holds
mkdir -p "$WORK"
cat > "$WORK/config.yaml" <<EOF
name: slurm-check
world: $ROOT/worlds/greenhouse.yaml
seeds: [1, 2, 3, 4]
collect: { steps: 2000, episode_steps: 100 }
learners:
  - { name: sound-from-sight, objective: predict, input: [sight], target: [sound], encoder: { hidden: [16] }, train: { epochs: 2 } }
  - { name: sight-autoencoder, objective: reconstruct, input: [sight], encoder: { hidden: [16] }, train: { epochs: 2 } }
  - { name: untrained, objective: untrained, input: [sight], encoder: { hidden: [16] } }
probe:
  targets: [wall_ahead, heading]
  baseline: sight-autoencoder
noise:
  - { channel: sight, kind: gaussian, severities: [0, 2, 5] }
EOF
LOCAL="$WORK/local"
ARRAY="$WORK/array"
COMPARED=(results.csv comparisons.csv summary.md)

started=$(date +%s%3N)
crosswise run "$WORK/config.yaml" --out "$LOCAL" --jobs "$(nproc)" --plain > "$TMP/local-run.log" || fail "crosswise run failed (see $TMP/local-run.log)"
local_ms=$(( $(date +%s%3N) - started ))

# What one array task costs beyond its cell: the wall time of `crosswise cell` for a small
# cell against the collect, train and probe seconds its cell.json records.
started=$(date +%s%3N)
crosswise cell "$WORK/config.yaml" --index 0 --out "$TMP/one-cell" > /dev/null || fail "crosswise cell failed"
cell_ms=$(( $(date +%s%3N) - started ))
compute_ms=$("$NODE" -e 'const { readdirSync, readFileSync } = require("node:fs");
  const cells = process.argv[1] + "/cells"; const s = JSON.parse(readFileSync(`${cells}/${readdirSync(cells)[0]}/cell.json`, "utf8")).seconds;
  console.log(Math.round((s.collect + s.train + s.probe) * 1000));' "$TMP/one-cell")

# Submits the array script and waits until none of its jobs is left in the queue; prints the wall time.
submit_and_wait() {
  local started submitted ids
  started=$(date +%s%3N)
  submitted=$(bash "$ARRAY/array-job.sh") || fail "submitting the array failed"
  say "$submitted"
  # "submitted N cells as job array(s) A [B ...]; the report (job R) runs ..."
  ids=$(echo "$submitted" | sed -nE 's/.* as job arrays? ([0-9 ]+); the report \(job ([0-9]+)\).*/\1 \2/p' | tr ' ' ,)
  [ -n "$ids" ] || fail "no job ids in: $submitted"
  for _ in $(seq "$WAIT_SECONDS"); do
    [ -z "$(squeue -h -j "$ids" 2>/dev/null)" ] && break
    sleep 1
  done
  [ -z "$(squeue -h -j "$ids" 2>/dev/null)" ] || fail "jobs $ids still queued after $WAIT_SECONDS s"
  echo $(( $(date +%s%3N) - started )) > "$TMP/array-ms"
}

same_outputs() {
  for file in "${COMPARED[@]}"; do
    [ -f "$ARRAY/$file" ] || fail "$1: the report job wrote no $file (log: $(cat "$ARRAY/logs/report.out" 2>/dev/null | tail -n 3))"
    cmp -s "$LOCAL/$file" "$ARRAY/$file" || fail "$1: $file differs from the local run's: $(diff "$LOCAL/$file" "$ARRAY/$file" | head -n 5)"
  done
  say "$1: ${COMPARED[*]} identical to the local run's"
}

crosswise cluster "$WORK/config.yaml" --out "$ARRAY" --max-array-size "$MAX_ARRAY_SIZE" > "$TMP/cluster.log" || fail "crosswise cluster failed"
grep -qF '12 cells to run (0-11) in 2 job arrays' "$TMP/cluster.log" || fail "unexpected plan: $(cat "$TMP/cluster.log")"
submit_and_wait
array_ms=$(cat "$TMP/array-ms")
same_outputs "first submission"
crosswise status "$ARRAY" > /dev/null || fail "crosswise status: not every cell is done after the array ($?)"

# --- lose two cells, resubmit: exactly those two run --------------------------------------
lost=(3 11)
for index in "${lost[@]}"; do
  id=$(awk -F, -v i="$index" 'NR > 1 && $1 == i { print $2 }' "$ARRAY/plan.csv")
  rm -rf "$ARRAY/cells/$id"
done
rm -rf "$ARRAY/logs" "${COMPARED[@]/#/$ARRAY/}"
status_code=0
crosswise status "$ARRAY" > "$TMP/status.log" || status_code=$?
[ "$status_code" -eq 2 ] && grep -qx 'missing  3,11' "$TMP/status.log" || fail "crosswise status after losing cells 3 and 11 (exit $status_code): $(cat "$TMP/status.log")"
crosswise cluster "$WORK/config.yaml" --out "$ARRAY" --max-array-size "$MAX_ARRAY_SIZE" > "$TMP/cluster.log" || fail "crosswise cluster failed"
grep -qF '2 cells to run (3,11) in 2 job arrays' "$TMP/cluster.log" || fail "the second script does not cover exactly cells 3 and 11: $(cat "$TMP/cluster.log")"
submit_and_wait
ran=$(cd "$ARRAY/logs" && ls | sort | paste -sd' ' -)
[ "$ran" = "cell-11.out cell-3.out report.out" ] || fail "expected the tasks of cells 3 and 11 and the report to run, got logs: $ran"
same_outputs "after resubmitting cells 3 and 11"
crosswise status "$ARRAY" > /dev/null || fail "crosswise status: not every cell is done after the resubmission"

PASSED=1
seconds() { echo "$(( $1 / 1000 )).$(( $1 % 1000 / 100 ))"; }
say "one task: crosswise cell $(seconds "$cell_ms") s wall for $(seconds "$compute_ms") s of collect, train and probe: $(seconds $(( cell_ms - compute_ms ))) s overhead (start-up, config, tfjs)"
say "passed. Wall time, submission to finished report: 12-cell array $(seconds "$array_ms") s, 2-cell resubmission $(seconds "$(cat "$TMP/array-ms")") s; crosswise run --jobs $(nproc) on this machine $(seconds "$local_ms") s"
