#!/usr/bin/env bash
# Backfill against replay: the same history file through `replay` (monitors in memory, nothing
# written) and through `backfill` (the daemon's step into a fresh H2 journal, checkpoints at the
# end), same policy, alternating, each a whole process under the launcher's JVM options for
# offline commands, timed by /usr/bin/time. The ratio replay ÷ backfill is the backfill's speed as
# a share of the replay's (1 = as fast).
# Usage: bench/backfill-replay.sh [FILE [ROUNDS [POLICY]]]
#   FILE defaults to bench/out/curves-10x40y.csv (generate it with CurvesHistoryGenerator FILE 10),
#   ROUNDS to 3, POLICY to alert-rules/default.yaml. Needs target/quarkus-app (./mvnw -DskipTests package).
#   BACKFILL_JOURNAL=postgres backfills into a fresh database of the PostgreSQL server that
#   .ci/postgres.sh runs on SLOPEWATCH_POSTGRES_PORT (default 55432) instead of a fresh H2 file.
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$root"
. bench/lib/measure.sh
file="${1:-bench/out/curves-10x40y.csv}"
rounds="${2:-3}"
policy="${3:-alert-rules/default.yaml}"
jar=target/quarkus-app/quarkus-run.jar
out=bench/out/backfill-replay
mkdir -p "$out"
rm -f "$out"/*.time
[ -f "$file" ] || { echo "no $file" >&2; exit 1; }
# each command under the launcher's own options for it
replay_opts="$(sed -n 's/^  replay|fit|[a-z|-]*) batch_opts="\(.*\)" ;;$/\1/p' slopewatch)"
backfill_opts="$(sed -n 's/^  backfill) batch_opts="\(.*\)" ;;$/\1/p' slopewatch)"
[ -n "$replay_opts" ] && [ -n "$backfill_opts" ] || { echo "cannot read the launcher's options" >&2; exit 1; }
echo "load before: $(cut -d' ' -f1-3 /proc/loadavg); journal: ${BACKFILL_JOURNAL:-h2}; replay: $replay_opts; backfill: $backfill_opts"
work=$(mktemp -d /tmp/slopewatch-backfill-replay-XXXXXX)
trap 'rm -rf "$work"' EXIT
journal="${BACKFILL_JOURNAL:-h2}"
echo sw > "$work/password"
run_one() { # kind round
  local t="$out/$1-$2.time"
  if [ "$1" = replay ]; then
    /usr/bin/time -f '%e %U %S' -o "$t" java $replay_opts -Dslopewatch.progress=false -jar "$jar" replay "$file" \
      --policy "$policy" --json > "$out/replay-$2.json"
  else
    local url
    url="$(fresh_journal "$journal" backfill_bench "$work")"
    /usr/bin/time -f '%e %U %S' -o "$t" java $backfill_opts -Dslopewatch.progress=false -jar "$jar" backfill "$file" \
      --policy "$policy" --journal-url "$url" --journal-user sw --journal-password-file "$work/password" > "$out/backfill-$2.txt"
  fi
  echo "round $2 $1: $(awk '{ printf "%s s wall, %s s user, %s s system", $1, $2, $3 }' "$t")"
}
for ((round = 1; round <= rounds; round++)); do
  if ((round % 2)); then run_one replay "$round"; run_one backfill "$round"; else run_one backfill "$round"; run_one replay "$round"; fi
done
for kind in replay backfill; do
  eval "${kind}_wall=$(cat "$out"/$kind-*.time | awk '{ print $1 }' | median)"
  eval "${kind}_cpu=$(cat "$out"/$kind-*.time | awk '{ print $2 + $3 }' | median)"
done
echo "medians: replay ${replay_wall} s wall, ${replay_cpu} s CPU; backfill ${backfill_wall} s wall, ${backfill_cpu} s CPU;" \
  "backfill speed ÷ replay speed: $(awk -v a="$replay_wall" -v b="$backfill_wall" 'BEGIN { printf "%.2f", a / b }') wall," \
  "$(awk -v a="$replay_cpu" -v b="$backfill_cpu" 'BEGIN { printf "%.2f", a / b }') CPU;" \
  "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
