#!/usr/bin/env bash
# A real Apache Kafka broker for the tests, as a separate process on loopback (no Docker).
#
#   .ci/kafka.sh start    fetch the broker's jars (cached), format a fresh log dir, start it in
#                         KRaft combined mode, wait until it is ready; prints the broker's pid
#   .ci/kafka.sh stop     stop the broker started from the same state directory
#
# Settings (environment):
#   SLOPEWATCH_KAFKA_PORT             client port                 (default 9092)
#   SLOPEWATCH_KAFKA_CONTROLLER_PORT  KRaft controller port       (default 9093)
#   SLOPEWATCH_KAFKA_DIR              state: config, data, log, pid (default ${TMPDIR:-/tmp}/slopewatch-kafka-$PORT)
#   SLOPEWATCH_KAFKA_LIBS             jar cache                   (default ~/.cache/slopewatch/kafka-libs)
# Messages go to stderr; stdout carries only the pid, so that callers can capture it.
set -euo pipefail

KAFKA_VERSION=4.1.2
LOG4J_VERSION=2.25.3
DEPENDENCY_PLUGIN=org.apache.maven.plugins:maven-dependency-plugin:3.8.1

ROOT="$(cd "$(dirname "$0")/.." && pwd)"
PORT="${SLOPEWATCH_KAFKA_PORT:-9092}"
CONTROLLER_PORT="${SLOPEWATCH_KAFKA_CONTROLLER_PORT:-9093}"
DIR="${SLOPEWATCH_KAFKA_DIR:-${TMPDIR:-/tmp}/slopewatch-kafka-$PORT}"
LIBS="${SLOPEWATCH_KAFKA_LIBS:-${XDG_CACHE_HOME:-$HOME/.cache}/slopewatch/kafka-libs}"
PIDFILE="$DIR/broker.pid"
READY_TIMEOUT=90

say() { echo "kafka.sh: $*" >&2; }
die() { say "error: $*"; exit 1; }

# the pid in the pid file, if that process is still our broker (a pid can be reused)
running_pid() {
    [[ -f "$PIDFILE" ]] || return 1
    local pid
    pid="$(cat "$PIDFILE")"
    [[ -n "$pid" ]] && grep -qa "kafka.Kafka" "/proc/$pid/cmdline" 2>/dev/null && echo "$pid"
}

port_in_use() {
    (exec 3<>"/dev/tcp/127.0.0.1/$1") 2>/dev/null
}

fetch_libs() {
    if [[ -f "$LIBS/.complete-$KAFKA_VERSION" ]]; then
        say "reusing the broker jars in $LIBS"
        return
    fi
    say "fetching Kafka $KAFKA_VERSION and its runtime dependencies from Maven Central into $LIBS"
    local work
    work="$(mktemp -d)"
    cat > "$work/pom.xml" <<EOF
<project xmlns="http://maven.apache.org/POM/4.0.0">
  <modelVersion>4.0.0</modelVersion>
  <groupId>org.slopewatch.ci</groupId>
  <artifactId>kafka-broker-libs</artifactId>
  <version>1</version>
  <packaging>pom</packaging>
  <dependencies>
    <dependency>
      <groupId>org.apache.kafka</groupId>
      <artifactId>kafka_2.13</artifactId>
      <version>$KAFKA_VERSION</version>
    </dependency>
    <dependency>
      <!-- the broker logs through SLF4J; without a binding it logs nothing, readiness included -->
      <groupId>org.apache.logging.log4j</groupId>
      <artifactId>log4j-slf4j-impl</artifactId>
      <version>$LOG4J_VERSION</version>
    </dependency>
  </dependencies>
</project>
EOF
    rm -rf "$LIBS"
    mkdir -p "$LIBS"
    if ! "$ROOT/mvnw" -B -q -f "$work/pom.xml" "$DEPENDENCY_PLUGIN:copy-dependencies" \
            -DoutputDirectory="$LIBS" -DincludeScope=runtime >"$work/mvn.log" 2>&1; then
        cat "$work/mvn.log" >&2
        rm -rf "$LIBS" "$work"
        die "could not download the broker jars (see the Maven output above)"
    fi
    rm -rf "$work"
    touch "$LIBS/.complete-$KAFKA_VERSION"
    say "$(find "$LIBS" -name '*.jar' | wc -l) jars in $LIBS"
}

# what 'StorageTool random-uuid' prints (16 random bytes, base64url, unpadded; not starting
# with '-'), without starting a JVM for it
cluster_id() {
    local id
    while :; do
        id="$(head -c 16 /dev/urandom | base64 | tr '+/' '-_' | tr -d '=')"
        [[ "$id" != -* ]] && break
    done
    echo "$id"
}

write_config() {
    cat > "$DIR/server.properties" <<EOF
process.roles=broker,controller
node.id=1
controller.quorum.voters=1@127.0.0.1:$CONTROLLER_PORT
listeners=PLAINTEXT://127.0.0.1:$PORT,CONTROLLER://127.0.0.1:$CONTROLLER_PORT
advertised.listeners=PLAINTEXT://127.0.0.1:$PORT
controller.listener.names=CONTROLLER
inter.broker.listener.name=PLAINTEXT
listener.security.protocol.map=CONTROLLER:PLAINTEXT,PLAINTEXT:PLAINTEXT
log.dirs=$DIR/data
num.partitions=1
offsets.topic.replication.factor=1
transaction.state.log.replication.factor=1
transaction.state.log.min.isr=1
share.coordinator.state.topic.replication.factor=1
share.coordinator.state.topic.min.isr=1
group.initial.rebalance.delay.ms=0
EOF
    cat > "$DIR/log4j2.properties" <<EOF
status = warn
appender.out.type = Console
appender.out.name = out
appender.out.layout.type = PatternLayout
appender.out.layout.pattern = [%d] %p %m (%c)%n
rootLogger.level = warn
rootLogger.appenderRef.out.ref = out
# the readiness line "Kafka Server started" is logged at INFO by the server class
logger.server.name = kafka.server.KafkaRaftServer
logger.server.level = info
EOF
}

start() {
    local pid
    if pid="$(running_pid)"; then
        say "already running (pid $pid) on 127.0.0.1:$PORT"
        echo "$pid"
        return
    fi
    command -v java >/dev/null || die "java is not on PATH (the broker needs a JDK 17 or newer)"
    for p in "$PORT" "$CONTROLLER_PORT"; do
        if port_in_use "$p"; then
            die "port $p on 127.0.0.1 is taken by another process; stop it or set SLOPEWATCH_KAFKA_PORT / SLOPEWATCH_KAFKA_CONTROLLER_PORT"
        fi
    done
    fetch_libs
    mkdir -p "$DIR"
    rm -rf "$DIR/data"
    mkdir "$DIR/data"
    write_config
    local cp="$LIBS/*" cluster
    cluster="$(cluster_id)"
    java -cp "$cp" -Dlog4j2.configurationFile="$DIR/log4j2.properties" kafka.tools.StorageTool format \
        -t "$cluster" -c "$DIR/server.properties" >"$DIR/format.log" 2>&1 \
        || { cat "$DIR/format.log" >&2; die "could not format the storage in $DIR/data"; }
    say "starting the broker on 127.0.0.1:$PORT (state in $DIR)"
    # detached from the caller's terminal and pipes, so that a caller reading our output
    # (a test JVM) is not kept waiting by the broker
    setsid java -Xms256m -Xmx512m -Dlog4j2.configurationFile="$DIR/log4j2.properties" -cp "$cp" \
        kafka.Kafka "$DIR/server.properties" </dev/null >"$DIR/broker.log" 2>&1 &
    pid=$!
    echo "$pid" > "$PIDFILE"
    local waited=0
    until grep -q "Kafka Server started" "$DIR/broker.log" 2>/dev/null; do
        if ! kill -0 "$pid" 2>/dev/null; then
            tail -n 40 "$DIR/broker.log" >&2 || true
            rm -f "$PIDFILE"
            die "the broker exited during start-up (log above, full log in $DIR/broker.log)"
        fi
        if (( waited >= READY_TIMEOUT * 5 )); then
            tail -n 40 "$DIR/broker.log" >&2 || true
            kill "$pid" 2>/dev/null || true
            rm -f "$PIDFILE"
            die "the broker was not ready after ${READY_TIMEOUT}s (full log in $DIR/broker.log)"
        fi
        sleep 0.2
        waited=$((waited + 1))
    done
    say "ready on 127.0.0.1:$PORT (pid $pid)"
    echo "$pid"
}

stop() {
    local pid
    if ! pid="$(running_pid)"; then
        say "not running (no live pid in $PIDFILE)"
        rm -f "$PIDFILE"
        return
    fi
    kill -TERM "$pid" 2>/dev/null || true
    local waited=0
    while kill -0 "$pid" 2>/dev/null; do
        if (( waited >= 150 )); then
            say "the broker did not stop within 30s of SIGTERM; killing pid $pid"
            kill -KILL "$pid" 2>/dev/null || true
            break
        fi
        sleep 0.2
        waited=$((waited + 1))
    done
    rm -f "$PIDFILE"
    say "stopped (pid $pid)"
}

case "${1:-}" in
    start) start ;;
    stop) stop ;;
    *) echo "usage: $0 start|stop" >&2; exit 2 ;;
esac
