#!/usr/bin/env bash
# What the near-term forward spread's curve fit costs a replay: the same history file replayed with
# the default policy (10Y-3M, 10Y-2Y and the near-term forward spread) and with the term spreads
# alone (bench/term-spreads.yaml), alternating, each a whole process under the launcher's JVM
# options for offline commands, timed by /usr/bin/time.
# Usage: bench/forward-cost.sh [FILE [ROUNDS [JAR]]]
#   FILE defaults to bench/out/curves-10x40y.csv (generate it with CurvesHistoryGenerator FILE 10),
#   ROUNDS to 3, JAR to target/quarkus-app/quarkus-run.jar (give another build's to compare).
# Prints one line per run and the medians of user CPU and wall time, and their ratios.
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$root"
. bench/lib/measure.sh
file="${1:-bench/out/curves-10x40y.csv}"
rounds="${2:-3}"
jar="${3:-target/quarkus-app/quarkus-run.jar}"
out=bench/out/forward-cost
mkdir -p "$out"
[ -f "$file" ] || { echo "no $file" >&2; exit 1; }
jvm_opts="$(sed -n 's/^  replay|fit|[a-z|-]*) batch_opts="\(.*\)" ;;$/\1/p' slopewatch)"
echo "load before: $(cut -d' ' -f1-3 /proc/loadavg)"
run_one() { # policy-name policy-file round
  local t="$out/$1-$3.time"
  /usr/bin/time -f '%e %U %S' -o "$t" java $jvm_opts -Dslopewatch.progress=false -jar "$jar" replay "$file" \
    --policy "$2" --json > "$out/$1-$3.json"
  echo "round $3 $1: $(awk '{ printf "%s s wall, %s s user, %s s system", $1, $2, $3 }' "$t")"
}
for ((round = 1; round <= rounds; round++)); do
  if ((round % 2)); then
    run_one default alert-rules/default.yaml "$round"; run_one term bench/term-spreads.yaml "$round"
  else
    run_one term bench/term-spreads.yaml "$round"; run_one default alert-rules/default.yaml "$round"
  fi
done
echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
col() { for ((round = 1; round <= rounds; round++)); do awk -v k="$2" '{ print $k }' "$out/$1-$round.time"; done | median; }
du="$(col default 2)"; tu="$(col term 2)"; dw="$(col default 1)"; tw="$(col term 1)"
echo "median user CPU: default $du s, term $tu s, ratio $(awk -v a="$du" -v b="$tu" 'BEGIN { printf "%.2f", a / b }')"
echo "median wall:     default $dw s, term $tw s, ratio $(awk -v a="$dw" -v b="$tw" 'BEGIN { printf "%.2f", a / b }')"
