#!/usr/bin/env bash
# HTTP ingest against a bare batched JDBC writer, both into the same kind of journal in the same run.
# One history file (CurvesHistoryGenerator, 10 curves × 40 years × 8 tenors) is written twice per
# round into an empty journal: by BareJournalWriter (a quote row and one value row per watched
# spread for each snapshot, batched INSERTs, durable commits of 5,000 snapshots, nothing decided),
# and posted to a fresh daemon (`serve` on its embedded defaults, the same policy) as CSV bodies of
# whole dates, one request after another, timed from the first request to the last answer (the
# daemon's start not counted). The two alternate in order round by round. Both run with the JVM's
# defaults, as the daemon does. The ratio bare ÷ HTTP is the daemon's ingest rate as a share of the
# bare writer's (1 = as fast).
# Usage: bench/ingest-vs-jdbc.sh [FILE [ROUNDS [DATES_PER_REQUEST]]]
#   FILE defaults to bench/out/curves-10x40y.csv, ROUNDS to 3, DATES_PER_REQUEST to 500 (5,000
#   snapshots of 10 curves). BENCH_POLICY=FILE (default alert-rules/default.yaml).
#   BENCH_JOURNAL=postgres writes into a fresh database of the PostgreSQL server that .ci/postgres.sh
#   runs on SLOPEWATCH_POSTGRES_PORT (default 55432) instead of a fresh H2 file.
#   Needs target/quarkus-app and the test classes (./mvnw -DskipTests package).
set -euo pipefail
cd "$(dirname "$0")/.."
. bench/lib/http-history.sh
. bench/lib/measure.sh
file="${1:-bench/out/curves-10x40y.csv}"
rounds="${2:-3}"
per_request="${3:-500}"
policy="${BENCH_POLICY:-alert-rules/default.yaml}"
journal="${BENCH_JOURNAL:-h2}"
port="${BENCH_PORT:-18082}"
out=bench/out/ingest-vs-jdbc
mkdir -p "$out"
rm -f "$out"/*.s
[ -f "$file" ] || { echo "no $file" >&2; exit 1; }
[ -f bench/out/test-classpath.txt ] || ./mvnw -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile=bench/out/test-classpath.txt
cp="target/test-classes:target/classes:$(cat bench/out/test-classpath.txt)"
work=$(mktemp -d /tmp/slopewatch-ingest-vs-jdbc-XXXXXX)
daemon=""
trap 'if [ -n "$daemon" ]; then kill $daemon 2>/dev/null || true; wait $daemon 2>/dev/null || true; fi; rm -rf "$work"' EXIT
split_history "$file" "$per_request" "$work/bodies"
curves=$(curves_of "$file")
echo "load before: $(cut -d' ' -f1-3 /proc/loadavg); journal: $journal; policy: $policy; $(ls "$work/bodies" | wc -l) requests"

run_bare() { # round
  local url
  url="$(fresh_journal "$journal" ingest_bench "$work")"
  java -cp "$cp" org.slopewatch.bench.BareJournalWriter "$file" "$policy" "$url" sw sw 2>/dev/null | tee "$out/bare-$1.txt" \
    | sed -E 's/.* ([0-9.]+) s, .*/\1/' > "$out/bare-$1.s"
  echo "round $1 bare JDBC: $(cat "$out/bare-$1.s") s ($(cat "$out/bare-$1.txt"))"
}

run_http() { # round
  local url token start accepted
  url="$(fresh_journal "$journal" ingest_bench "$work")"
  token="bench-$(od -An -N12 -tx1 /dev/urandom | tr -d ' \n')"
  SLOPEWATCH_JOURNAL_URL="$url" SLOPEWATCH_JOURNAL_USERNAME=sw SLOPEWATCH_JOURNAL_PASSWORD=sw \
  java -Xmx2g -Dslopewatch.security.write-tokens="$token" -Dslopewatch.home="$PWD" -Dslopewatch.data-dir="$work/daemon-$1" \
       -Dslopewatch.ingest.max-days-ahead=36500 -Dslopewatch.ingest.curves="$curves" -Dslopewatch.ingest.policy="$policy" \
       -Dquarkus.http.port="$port" -Dquarkus.log.category.\"org.slopewatch.transitions\".level=WARN \
       -jar target/quarkus-app/quarkus-run.jar serve > "$out/daemon-$1.log" 2>&1 &
  daemon=$!
  await_ready "$port"
  start=$(date +%s.%N)
  accepted=$(post_bodies "$port" "$token" "$work/bodies")
  echo "$(date +%s.%N) - $start" | bc > "$out/http-$1.s"
  kill "$daemon"; wait "$daemon" 2>/dev/null || true; daemon=""
  echo "round $1 HTTP: $(cat "$out/http-$1.s") s, $accepted snapshots accepted"
}

for ((round = 1; round <= rounds; round++)); do
  if ((round % 2)); then run_bare "$round"; run_http "$round"; else run_http "$round"; run_bare "$round"; fi
done
bare=$(cat "$out"/bare-*.s | median)
http=$(cat "$out"/http-*.s | median)
echo "medians: bare JDBC $bare s, HTTP $http s; HTTP ingest rate ÷ bare writer's: $(awk -v a="$bare" -v b="$http" 'BEGIN { printf "%.2f", a / b }');" \
  "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
