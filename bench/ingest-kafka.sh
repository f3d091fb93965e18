#!/usr/bin/env bash
# Kafka ingest benchmark: a real broker (.ci/kafka.sh, port 19092), the daemon with --kafka
# draining a topic of MESSAGES snapshots (11 quotes each) with the journal on, next to a bare
# Kafka consumer reading the same topic in the same run; then p50/p99 from a record's time to
# its journalled row at a steady rate below capacity.
#   [BENCH_POLICY=FILE] bench/ingest-kafka.sh [MESSAGES]
#   BENCH_JOURNAL_URL=jdbc:postgresql://HOST:PORT/DB BENCH_JOURNAL_USER=U BENCH_JOURNAL_PASSWORD=P bench/ingest-kafka.sh [MESSAGES]
#     the journal in that (fresh) PostgreSQL database instead of an H2 file
set -euo pipefail
cd "$(dirname "$0")/.."
messages=${1:-100000}
mkdir -p bench/out
./mvnw -B -q -DskipTests package
./mvnw -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=bench/out/test-classpath.txt
export SLOPEWATCH_KAFKA_PORT=19092 SLOPEWATCH_KAFKA_CONTROLLER_PORT=19093
.ci/kafka.sh start > /dev/null
trap '.ci/kafka.sh stop' EXIT
java -cp "target/test-classes:target/classes:$(cat bench/out/test-classpath.txt)" org.slopewatch.bench.KafkaIngestBench \
     127.0.0.1:19092 "$messages" target/quarkus-app/quarkus-run.jar "$PWD" "${BENCH_PORT:-18081}" | tee -a bench/out/ingest-results.txt
