#!/usr/bin/env bash
# Ingest benchmark: the daemon on embedded defaults (journal on, H2 file in a fresh directory),
# HTTP batches from a Java client, next to a decode-only baseline measured in the same run.
# Prints one result line per run; docs/benchmarks.md records them with this command.
#   [BENCH_POLICY=FILE] bench/ingest.sh [REQUESTS] [MESSAGES_PER_REQUEST] [CLIENTS]
set -euo pipefail
cd "$(dirname "$0")/.."
requests=${1:-200}; per_request=${2:-500}; clients=${3:-2}; port=${BENCH_PORT:-18080}
mkdir -p bench/out
./mvnw -B -q -DskipTests package
./mvnw -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=bench/out/test-classpath.txt
data=$(mktemp -d /tmp/slopewatch-bench-XXXXXX)
policy=${BENCH_POLICY:-alert-rules/default.yaml}
echo "ingest-http policy=$policy"
token="bench-$(od -An -N12 -tx1 /dev/urandom | tr -d ' \n')"
export SLOPEWATCH_BENCH_TOKEN="$token"
java -Xmx2g ${DAEMON_JAVA_OPTS:-} -Dslopewatch.security.write-tokens="$token" -Dslopewatch.home="$PWD" -Dslopewatch.data-dir="$data" -Dslopewatch.ingest.max-days-ahead=36500 \
     -Dslopewatch.ingest.policy="$policy" \
     -Dquarkus.http.port="$port" -Dquarkus.log.category.\"org.slopewatch.transitions\".level=WARN \
     -jar target/quarkus-app/quarkus-run.jar serve > bench/out/ingest-daemon.log 2>&1 &
daemon=$!
trap 'kill $daemon 2>/dev/null; wait $daemon 2>/dev/null; rm -rf "$data"' EXIT
for _ in $(seq 1 120); do
  curl -sf "http://localhost:$port/q/health/ready" > /dev/null 2>&1 && break
  sleep 0.5
done
java -cp "target/test-classes:target/classes:$(cat bench/out/test-classpath.txt)" org.slopewatch.bench.IngestBench \
     "http://localhost:$port" "$requests" "$per_request" "$clients" | tee -a bench/out/ingest-results.txt
