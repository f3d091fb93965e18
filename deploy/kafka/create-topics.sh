#!/usr/bin/env bash
# Creates slopewatch's Kafka topics (existing ones are left alone and checked):
#
#   slopewatch.quotes              quotes in, keyed by curve: one curve always lands on the same
#                                  partition, so its quotes stay in order and one instance owns it
#   slopewatch.quotes.dead-letter  rejected quote records, reason in the record headers
#   slopewatch.alerts              alerts as CloudEvents (a policy channel of type "stream"),
#                                  keyed by spread
#
# Usage: deploy/kafka/create-topics.sh [options]
#   -b, --bootstrap-server LIST   brokers                 env KAFKA_BOOTSTRAP_SERVERS       default localhost:9092
#   -p, --partitions N            of slopewatch.quotes    env SLOPEWATCH_QUOTES_PARTITIONS  default 12
#   -r, --replication-factor N    of all three            env SLOPEWATCH_REPLICATION_FACTOR default 3
#       --min-insync-replicas N                           env SLOPEWATCH_MIN_INSYNC_REPLICAS default 2 if the factor is 3 or more, else 1
#       --retention DURATION      of slopewatch.quotes    env SLOPEWATCH_QUOTES_RETENTION   default 7d
#       --dead-letter-retention DURATION                  env SLOPEWATCH_DEAD_LETTER_RETENTION default 30d
#       --alerts-retention DURATION                       env SLOPEWATCH_ALERTS_RETENTION   default 30d
#       --dead-letter-partitions N                        env SLOPEWATCH_DEAD_LETTER_PARTITIONS default 1
#       --alerts-partitions N                             env SLOPEWATCH_ALERTS_PARTITIONS  default 1
#       --command-config FILE     client properties (TLS, SASL) env SLOPEWATCH_KAFKA_CLIENT_CONFIG
#       --dry-run                 print the commands instead of running them
#   DURATION: 30m, 12h, 7d, a number of milliseconds, or -1 (keep forever).
#
# Partitions of slopewatch.quotes: at least the number of instances (an instance without a
# partition idles), at most the number of curves is useful. Choose it once: adding partitions
# later moves curves to other partitions, and quotes in flight during the change can be taken
# out of order. The script never alters an existing topic; it fails if slopewatch.quotes exists
# with another partition count than asked for.
#
# Optional: the daemon creates slopewatch.quotes itself at start when it is missing, with
# slopewatch.kafka.quotes-partitions (default 12) and the broker's default replication factor
# (slopewatch.kafka.quotes-replication-factor), and never alters an existing one. This script is for
# what the daemon does not choose: retention, min.insync.replicas and the two other topics.
#
# The Kafka tool, first found of (nothing is downloaded):
#   1. $KAFKA_HOME/bin/kafka-topics.sh        a Kafka installation
#   2. kafka-topics.sh on PATH
#   3. $KAFKA_LIBS, a folder of Kafka jars (~/.cache/slopewatch/kafka-libs, the default when it
#      exists), with the kafka-tools jar of the same version there or in
#      ~/.cache/slopewatch/kafka-tools/ (the broker's jars alone lack the command-line tools).
set -euo pipefail

CACHE="${XDG_CACHE_HOME:-$HOME/.cache}/slopewatch"

say() { echo "create-topics: $*" >&2; }
die() { say "error: $*"; exit 1; }

bootstrap="${KAFKA_BOOTSTRAP_SERVERS:-localhost:9092}"
partitions="${SLOPEWATCH_QUOTES_PARTITIONS:-12}"
replication="${SLOPEWATCH_REPLICATION_FACTOR:-3}"
min_isr="${SLOPEWATCH_MIN_INSYNC_REPLICAS:-}"
retention="${SLOPEWATCH_QUOTES_RETENTION:-7d}"
dl_retention="${SLOPEWATCH_DEAD_LETTER_RETENTION:-30d}"
alerts_retention="${SLOPEWATCH_ALERTS_RETENTION:-30d}"
dl_partitions="${SLOPEWATCH_DEAD_LETTER_PARTITIONS:-1}"
alerts_partitions="${SLOPEWATCH_ALERTS_PARTITIONS:-1}"
command_config="${SLOPEWATCH_KAFKA_CLIENT_CONFIG:-}"
dry_run=false

usage() { sed -n '2,/^set -euo/p' "${BASH_SOURCE[0]}" | sed '$d' | sed 's/^# \{0,1\}//'; }

need() { [[ $# -ge 2 && -n "$2" ]] || die "$1 needs a value"; }
while [[ $# -gt 0 ]]; do
    case "$1" in
        -b|--bootstrap-server) need "$@"; bootstrap="$2"; shift 2 ;;
        -p|--partitions) need "$@"; partitions="$2"; shift 2 ;;
        -r|--replication-factor) need "$@"; replication="$2"; shift 2 ;;
        --min-insync-replicas) need "$@"; min_isr="$2"; shift 2 ;;
        --retention) need "$@"; retention="$2"; shift 2 ;;
        --dead-letter-retention) need "$@"; dl_retention="$2"; shift 2 ;;
        --alerts-retention) need "$@"; alerts_retention="$2"; shift 2 ;;
        --dead-letter-partitions) need "$@"; dl_partitions="$2"; shift 2 ;;
        --alerts-partitions) need "$@"; alerts_partitions="$2"; shift 2 ;;
        --command-config) need "$@"; command_config="$2"; shift 2 ;;
        --dry-run) dry_run=true; shift ;;
        -h|--help) usage; exit 0 ;;
        *) usage >&2; die "unknown argument: $1" ;;
    esac
done

positive() { [[ "$2" =~ ^[1-9][0-9]*$ ]] || die "$1 must be a positive whole number, not '$2'"; }
positive "partitions" "$partitions"
positive "replication factor" "$replication"
positive "dead-letter partitions" "$dl_partitions"
positive "alerts partitions" "$alerts_partitions"
if [[ -z "$min_isr" ]]; then
    if (( replication >= 3 )); then min_isr=2; else min_isr=1; fi
fi
positive "min in-sync replicas" "$min_isr"
(( min_isr <= replication )) || die "min in-sync replicas ($min_isr) cannot exceed the replication factor ($replication)"
[[ -z "$command_config" || -r "$command_config" ]] || die "cannot read the client properties $command_config"

# DURATION -> milliseconds
millis() {
    local v="$1"
    case "$v" in
        -1) echo -1 ;;
        *[0-9]d) echo $(( ${v%d} * 86400000 )) ;;
        *[0-9]h) echo $(( ${v%h} * 3600000 )) ;;
        *[0-9]m) echo $(( ${v%m} * 60000 )) ;;
        *) [[ "$v" =~ ^[0-9]+$ ]] && echo "$v" || die "retention '$v' is not 30m, 12h, 7d, milliseconds or -1" ;;
    esac
}
for v in "$retention" "$dl_retention" "$alerts_retention"; do
    [[ "$v" =~ ^(-1|[0-9]+[dhm]?)$ ]] || die "retention '$v' is not 30m, 12h, 7d, milliseconds or -1"
done

# --- the tool ---
topics_cmd=()
if [[ -n "${KAFKA_HOME:-}" ]]; then
    [[ -x "$KAFKA_HOME/bin/kafka-topics.sh" ]] || die "KAFKA_HOME=$KAFKA_HOME has no bin/kafka-topics.sh"
    topics_cmd=("$KAFKA_HOME/bin/kafka-topics.sh")
elif command -v kafka-topics.sh >/dev/null; then
    topics_cmd=(kafka-topics.sh)
else
    libs="${KAFKA_LIBS:-$CACHE/kafka-libs}"
    [[ -d "$libs" ]] || die "no Kafka tool: set KAFKA_HOME to a Kafka installation, put kafka-topics.sh on PATH, or set KAFKA_LIBS to a folder of Kafka jars (.ci/kafka.sh start fills $CACHE/kafka-libs)"
    clients="$(find "$libs" -maxdepth 1 -name 'kafka-clients-*.jar' | head -n 1)"
    [[ -n "$clients" ]] || die "$libs holds no kafka-clients jar"
    version="$(basename "$clients" .jar)"
    version="${version#kafka-clients-}"
    command -v java >/dev/null || die "java is not on PATH"
    tools="$(find "$libs" -maxdepth 1 -name "kafka-tools-$version.jar" | head -n 1)"
    if [[ -z "$tools" ]]; then
        tools="$CACHE/kafka-tools/kafka-tools-$version.jar"
        [[ -f "$tools" ]] || die "$libs has no kafka-tools-$version.jar, nor has $CACHE/kafka-tools: set KAFKA_HOME to a Kafka $version installation or put kafka-topics.sh on PATH (the daemon creates slopewatch.quotes itself without either)"
    fi
    say "using the Kafka $version jars in $libs"
    topics_cmd=(java -Xmx256m -cp "$libs/*:$tools" org.apache.kafka.tools.TopicCommand)
fi

common=(--bootstrap-server "$bootstrap")
[[ -n "$command_config" ]] && common+=(--command-config "$command_config")

run() {
    if $dry_run; then
        printf '%q ' "$@"; echo
    else
        "$@"
    fi
}

create() {
    local topic="$1" parts="$2" keep="$3"
    say "$topic: $parts partition(s), replication factor $replication, min.insync.replicas $min_isr, retention $keep"
    run "${topics_cmd[@]}" "${common[@]}" --create --if-not-exists --topic "$topic" \
        --partitions "$parts" --replication-factor "$replication" \
        --config "retention.ms=$(millis "$keep")" \
        --config "min.insync.replicas=$min_isr" \
        --config cleanup.policy=delete
}

create slopewatch.quotes "$partitions" "$retention"
create slopewatch.quotes.dead-letter "$dl_partitions" "$dl_retention"
create slopewatch.alerts "$alerts_partitions" "$alerts_retention"

$dry_run && exit 0

# --- what is there now (a topic that existed before keeps its own settings) ---
status=0
for topic in slopewatch.quotes slopewatch.quotes.dead-letter slopewatch.alerts; do
    description="$("${topics_cmd[@]}" "${common[@]}" --describe --topic "$topic")" \
        || die "cannot describe $topic"
    summary="$(grep -m1 "PartitionCount" <<<"$description" || true)"
    echo "$summary"
    if [[ "$topic" == slopewatch.quotes ]]; then
        have="$(sed -n 's/.*PartitionCount:[[:space:]]*\([0-9][0-9]*\).*/\1/p' <<<"$summary")"
        if [[ "$have" != "$partitions" ]]; then
            say "slopewatch.quotes exists with $have partition(s), not the $partitions asked for; it was left as it is (see the note on partitions in --help)"
            status=1
        fi
    fi
done
exit "$status"
