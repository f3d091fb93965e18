#!/usr/bin/env bash
# Backfill benchmark: one history file (CurvesHistoryGenerator, 10 curves × 40 years × 8 tenors) into
# a fresh H2 journal by `backfill`, then the same file posted to a fresh daemon (embedded defaults,
# H2 journal) as CSV bodies of whole dates, one request after another. Same policy for both.
# Prints one result line; docs/benchmarks.md records it with this command.
#   [BENCH_POLICY=FILE] bench/backfill.sh [DATES_PER_REQUEST]
set -euo pipefail
cd "$(dirname "$0")/.."
. bench/lib/http-history.sh
per_request=${1:-500}; port=${BENCH_PORT:-18081}
policy=${BENCH_POLICY:-alert-rules/default.yaml}
mkdir -p bench/out
./mvnw -B -q -DskipTests package
file=bench/out/curves-10x40y.csv
if [ ! -f "$file" ]; then
  ./mvnw -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=bench/out/test-classpath.txt
  java -cp "target/test-classes:target/classes:$(cat bench/out/test-classpath.txt)" org.slopewatch.bench.CurvesHistoryGenerator "$file" 10
fi
work=$(mktemp -d /tmp/slopewatch-backfill-XXXXXX)
daemon=""
trap 'if [ -n "$daemon" ]; then kill $daemon 2>/dev/null || true; wait $daemon 2>/dev/null || true; fi; rm -rf "$work"' EXIT

# 1. backfill, with the launcher's options for offline commands
start=$(date +%s.%N)
java -XX:+UseSerialGC -XX:TieredStopAtLevel=1 -Dslopewatch.home="$PWD" -jar target/quarkus-app/quarkus-run.jar \
     backfill "$file" --policy "$policy" --journal-url "jdbc:h2:file:$work/backfill/journal" | tee "$work/backfill.txt"
backfill_s=$(echo "$(date +%s.%N) - $start" | bc)

# 2. the same file over HTTP: split at date boundaries (the rows of one date are together), header on each body
split_history "$file" "$per_request" "$work/bodies"
curves=$(curves_of "$file")
token="bench-$(od -An -N12 -tx1 /dev/urandom | tr -d ' \n')"
java -Xmx2g -Dslopewatch.security.write-tokens="$token" -Dslopewatch.home="$PWD" -Dslopewatch.data-dir="$work/daemon" \
     -Dslopewatch.ingest.max-days-ahead=36500 -Dslopewatch.ingest.curves="$curves" -Dslopewatch.ingest.policy="$policy" \
     -Dquarkus.http.port="$port" -Dquarkus.log.category.\"org.slopewatch.transitions\".level=WARN \
     -jar target/quarkus-app/quarkus-run.jar serve > bench/out/backfill-daemon.log 2>&1 &
daemon=$!
await_ready "$port"
start=$(date +%s.%N)
accepted=$(post_bodies "$port" "$token" "$work/bodies")
http_s=$(echo "$(date +%s.%N) - $start" | bc)
requests=$(ls "$work"/bodies | wc -l)
echo "backfill-vs-http policy=$policy backfill_s=$backfill_s http_s=$http_s http_requests=$requests http_accepted_snapshots=$accepted" \
     "ratio_http_over_backfill=$(echo "scale=2; $http_s / $backfill_s" | bc)" | tee -a bench/out/backfill-results.txt
