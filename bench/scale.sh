#!/usr/bin/env bash
# Scale benchmark: memory per spread and start-up with recovery, from 100 to 10,000 spreads
# (10, 100, 1,000 curves × 10 term spreads), each figure next to its baseline in the same run.
#   bench/scale.sh            journals (built once, kept in bench/out/scale/), memory, start-up
#   bench/scale.sh --quick    fewer years and one round: a check that everything runs (minutes)
# Settings (environment): SCALE_ROUNDS (start-up rounds, default 3), SCALE_JOURNALS (which
# journals, as CURVES:YEARS words; e.g. "10:40 100:40" for 40 years of daily history, which the
# shared two-core machine could not build in the time available), SCALE_MEMORY (curve counts for the in-process memory bench),
# SCALE_MEMORY_YEARS (its checkpoints), SCALE_SKIP_BUILD=1 (reuse target/), SCALE_REBUILD=1
# (rebuild the journals), SCALE_DAEMON_JVM (the daemons' JVM options; default the Kubernetes
# manifest's limits: 1 GiB of memory, heap at 70 % of it). Raw results: bench/out/scale-*.txt; docs/benchmarks.md records them.
set -euo pipefail
cd "$(dirname "$0")/.."
out=bench/out
mkdir -p "$out/scale"
rounds=${SCALE_ROUNDS:-3}
journals=${SCALE_JOURNALS:-"10:4 10:10 100:1 1000:0.1"}
memory=${SCALE_MEMORY:-"10 100 1000"}
memory_years=${SCALE_MEMORY_YEARS:-"1 10 40"}
if [ "${1:-}" = "--quick" ]; then
  rounds=1; journals="10:1 100:0.1"; memory="10 100"; memory_years="1 4"
elif [ -n "${1:-}" ]; then
  echo "usage: bench/scale.sh [--quick]" >&2; exit 2
fi
say() { echo "scale: $*" >&2; }
load() { cut -d' ' -f1-3 /proc/loadavg; }

if [ "${SCALE_SKIP_BUILD:-}" != 1 ]; then
  say "building (./mvnw -B -q -DskipTests package)"
  ./mvnw -B -q -DskipTests package
  ./mvnw -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile="$out/test-classpath.txt"
fi
cp="target/test-classes:target/classes:$(cat "$out/test-classpath.txt")"
{
  echo "date=$(date -u '+%Y-%m-%d %H:%M UTC') commit=$(git rev-parse --short HEAD)$(git diff --quiet HEAD -- src || echo '+changes')"
  echo "cpu=$(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2 | xargs) nproc=$(nproc) mem=$(free -g | awk '/Mem:/ {print $2}')G"
  echo "java=$(java -version 2>&1 | head -1)"
} | tee "$out/scale-machine.txt"

# journals: the daemon's own pipeline and journal writer, in-process (ScaleJournalBuilder)
say "journals ($journals) and the empty baseline journal, load $(load)"
java -cp "$cp" org.slopewatch.bench.ScaleJournalBuilder "$out/scale/base" 0 0 > /dev/null
args=()
for j in $journals; do
  curves=${j%%:*}; years=${j##*:}; dir="$out/scale/c$curves-y$years"
  if [ "${SCALE_REBUILD:-}" = 1 ]; then rm -rf "$dir"; fi
  if [ ! -f "$dir/built.txt" ]; then
    rm -rf "$dir"
    java -Xmx8g -cp "$cp" org.slopewatch.bench.ScaleJournalBuilder "$dir" "$curves" "$years" 2000 \
      | sed "s|\$| load=$(load | tr ' ' /)|" | tee -a "$out/scale-journals.txt"
  fi
  args+=("$dir:$curves")
done

# memory per spread in one JVM, baseline first (ScaleMemoryBench)
: > "$out/scale-memory.txt"
for curves in $memory; do
  say "memory: $curves curves, checkpoints $memory_years years, load $(load)"
  java -Xmx12g -cp "$cp" org.slopewatch.bench.ScaleMemoryBench "$curves" $memory_years \
      --histogram "$out/scale-histogram-$curves.txt" | sed "/^scale-memory/s|\$| load=$(load | tr ' ' /)|" | tee -a "$out/scale-memory.txt"
done

# start-up of the packaged daemon on each journal against an empty journal (ScaleStartupBench)
say "start-up: $rounds round(s), load $(load)"
java "-Dscale.daemon.jvm=${SCALE_DAEMON_JVM:--XX:MaxRAM=1g -XX:MaxRAMPercentage=70}" -cp "$cp" org.slopewatch.bench.ScaleStartupBench "$rounds" "$out/scale/base" "${args[@]}" | tee "$out/scale-startup.txt"
# where recovery spends its time: reading the journal alone against the whole recover(), one JVM
: > "$out/scale-recovery.txt"
for a in "${args[@]}"; do
  java -cp "$cp" org.slopewatch.bench.ScaleRecoveryProfile "${a%%:*}" 3 2>/dev/null | tee -a "$out/scale-recovery.txt"
done
say "done, load $(load)"
