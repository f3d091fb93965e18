#!/usr/bin/env bash
# Takeover after a crash: two daemons with --kafka on one consumer group and a two-partition quotes
# topic (created by the first daemon), each holding one partition; the first is killed with
# SIGKILL (no leave-group request reaches the broker) and the time from the kill to the survivor's
# log line "quotes partitions assigned" is printed. Repeated RUNS times, the killed one restarted
# between runs. Each daemon has its own H2 journal: only the group's timing is measured here
# (TwoInstancesIT checks a takeover's results on a shared journal).
#   bench/takeover-kafka.sh [RUNS]          the settings of the kafka profile
#   EXTRA="-Dmp.messaging.incoming.quotes.session.timeout.ms=45000" bench/takeover-kafka.sh 1
#                                           any other settings, as system properties
# Access control is off (loopback only). Needs target/quarkus-app (./mvnw -DskipTests package) and starts a broker with .ci/kafka.sh on
# 127.0.0.1:${BENCH_KAFKA_PORT:-19292}.
set -euo pipefail
cd "$(dirname "$0")/.."
runs=${1:-3}
out="$PWD/bench/out/takeover"
rm -rf "$out"; mkdir -p "$out"
export SLOPEWATCH_KAFKA_PORT=${BENCH_KAFKA_PORT:-19292} SLOPEWATCH_KAFKA_CONTROLLER_PORT=${BENCH_KAFKA_CONTROLLER_PORT:-19293}
export SLOPEWATCH_KAFKA_DIR="$out/broker"
.ci/kafka.sh start > /dev/null
pids=()
cleanup() { for p in "${pids[@]}"; do kill "$p" 2>/dev/null || true; done; .ci/kafka.sh stop > /dev/null || true; }
trap cleanup EXIT
bootstrap="127.0.0.1:$SLOPEWATCH_KAFKA_PORT"
topic="slopewatch.quotes.takeover-$$"

# start NAME PORT: a daemon in the background, its log in $out/NAME.log; prints its pid
start() {
    # shellcheck disable=SC2086
    java -Xmx256m -Dslopewatch.home="$PWD" -Dslopewatch.data-dir="$out/$1" -Dquarkus.http.port="$2" -Dslopewatch.security.enabled=false \
         -Dkafka.bootstrap.servers="$bootstrap" -Dslopewatch.kafka.quotes-partitions=2 \
         -Dmp.messaging.incoming.quotes.topic="$topic" -Dmp.messaging.outgoing.quotes-publish.topic="$topic" \
         -Dmp.messaging.outgoing.quotes-dead-letter.topic="$topic.dead-letter" ${EXTRA:-} \
         -jar target/quarkus-app/quarkus-run.jar serve --kafka >> "$out/$1.log" 2>&1 &
    echo $!
}
# assignments NAME: how many "partitions assigned" lines its log has
assignments() { grep -c "quotes partitions assigned" "$out/$1.log" 2>/dev/null || true; }
# await_assignment NAME COUNT: until the log has more than COUNT of them (120 s at most)
await_assignment() {
    for _ in $(seq 1 1200); do
        (( $(assignments "$1") > $2 )) && return 0
        sleep 0.1
    done
    echo "takeover: $1 got no assignment; see $out/$1.log" >&2; exit 1
}
millis_of() { date -u -d "$(sed 's/,/./' <<<"$1")" +%s%3N; }

survivor=$(start survivor 18291); pids+=("$survivor")
await_assignment survivor 0
for run in $(seq 1 "$runs"); do
    seen=$(assignments survivor)
    victim=$(start "victim-$run" 18292); pids+=("$victim")
    await_assignment "victim-$run" 0
    await_assignment survivor "$seen"      # the survivor's share after the victim joined
    sleep 5                                 # a settled group
    seen=$(assignments survivor)
    kill -9 "$victim"
    killed=$(date -u +%s%3N)
    await_assignment survivor "$seen"
    line=$(grep "quotes partitions assigned" "$out/survivor.log" | tail -n 1)
    taken=$(millis_of "$(cut -c1-23 <<<"$line")")
    echo "run $run: victim killed, survivor assigned its partitions $(( taken - killed )) ms later"
done
