#!/usr/bin/env bash
# Quote-to-alert latency: the packaged daemon (embedded transport, H2 journal in a fresh directory,
# bench/latency-policy.yaml) sends each notice to a chat receiver in the benchmark's JVM; next to it,
# in the same run and interleaved, the benchmark posts a body of the same size to that receiver.
# Prints key=value figures (p50, p99, max of both, their ratios, load averages) and keeps them in
# bench/out/alert-latency.txt; docs/benchmarks.md records them with this command.
#   bench/alert-latency.sh [ROUNDS] [WARM_UP_ROUNDS] [PAUSE_MS]
set -euo pipefail
cd "$(dirname "$0")/.."
rounds=${1:-500}; warmups=${2:-150}; pause=${3:-20}
mkdir -p bench/out
./mvnw -B -q -DskipTests package
./mvnw -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=bench/out/test-classpath.txt
echo "alert-latency $(date -u '+%Y-%m-%d %H:%M UTC') commit $(git rev-parse --short HEAD) on $(nproc) cores, $(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2- | sed 's/^ *//')"
java -cp "target/test-classes:target/classes:$(cat bench/out/test-classpath.txt)" org.slopewatch.bench.AlertLatencyBench \
     "$rounds" "$warmups" "$pause" bench/out/alert-latency.txt
