#!/usr/bin/env bash
# The replay end to end against its baselines, each a whole process from start to result written:
#   replay       ./slopewatch replay FILE --spread 10Y-3M --json > JSON   (the real launcher)
#   parse-only   java … org.slopewatch.bench.ParseOnly FILE               (same JVM options as the launcher's replay)
#   pandas       /usr/bin/python3 bench/replay_pandas.py FILE > JSON      (reading the CSV included)
# Usage: bench/replay-peers.sh CLASSPATH [ROUNDS]   (bench/run.sh calls it; ROUNDS defaults to 5)
# Each round runs all three, in an order that rotates from round to round, so that a busy
# neighbour does not always hit the same one. Wall time, user and system CPU and peak RSS come from
# /usr/bin/time. Afterwards bench/compare_replay.py checks that the replay and pandas found the
# same, and the script fails if they did not. Writes bench/out/peers.txt (key=value).
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$root"
. bench/lib/measure.sh
cp="$1"
rounds="${2:-5}"
out=bench/out
file="$out/curves-50x40y.csv"
say() { echo "bench: $*" >&2; }

if ! /usr/bin/python3 -c 'import pandas' 2>/dev/null; then
  if [ "$(id -u)" = 0 ]; then
    say "installing Debian's python3-pandas (the peer of the replay benchmark)"
    (apt-get install -y python3-pandas || (apt-get update && apt-get install -y python3-pandas)) > "$out/apt-pandas.log" 2>&1
  else
    say "/usr/bin/python3 cannot import pandas: install Debian's python3-pandas (apt-get install python3-pandas)"; exit 1
  fi
fi
if [ ! -f "$file" ]; then
  say "generating $file"
  java -cp "$cp" org.slopewatch.bench.CurvesHistoryGenerator "$file"
fi
# the launcher's options for an offline command (see ./slopewatch), so that both JVMs run alike
jvm_opts="$(sed -n 's/^  replay|fit|[a-z|-]*) batch_opts="\(.*\)" ;;$/\1/p' slopewatch)"
./slopewatch --version > /dev/null 2>&1 || ./slopewatch --help > /dev/null   # builds the application if needed, outside the timings

run_one() { # name round
  local name="$1" round="$2" t="$out/peers-$1-$2.time"
  case "$name" in
    replay) /usr/bin/time -f '%e %U %S %M' -o "$t" ./slopewatch replay "$file" --spread 10Y-3M --json > "$out/peers-replay-$round.json" ;;
    parse)  /usr/bin/time -f '%e %U %S %M' -o "$t" java $jvm_opts -cp "$cp" org.slopewatch.bench.ParseOnly "$file" > "$out/peers-parse-$round.txt" ;;
    pandas) /usr/bin/time -f '%e %U %S %M' -o "$t" /usr/bin/python3 bench/replay_pandas.py "$file" > "$out/peers-pandas-$round.json" ;;
  esac
  say "round $round $name: $(awk '{ printf "%s s wall, %s s user, %s s system, %d MiB peak", $1, $2, $3, $4 / 1024 }' "$t")"
}

rm -f "$out"/peers-*.time "$out"/peers-*.json "$out"/peers-parse-*.txt "$out/peers.txt.part"
orders=("replay parse pandas" "parse pandas replay" "pandas replay parse")
load_before="$(cut -d' ' -f1-3 /proc/loadavg)"
for ((round = 1; round <= rounds; round++)); do
  for name in ${orders[$(((round - 1) % 3))]}; do
    run_one "$name" "$round"
  done
done
load_after="$(cut -d' ' -f1-3 /proc/loadavg)"

# every round must give the same result, and the replay's must agree with pandas'
for ((round = 2; round <= rounds; round++)); do
  cmp -s "$out/peers-replay-1.json" "$out/peers-replay-$round.json" || { say "the replay's output differs between rounds 1 and $round"; exit 1; }
  cmp -s "$out/peers-pandas-1.json" "$out/peers-pandas-$round.json" || { say "pandas' output differs between rounds 1 and $round"; exit 1; }
done
python3 bench/compare_replay.py "$out/peers-replay-1.json" "$out/peers-pandas-1.json" "$out/peers-agree.txt"
quotes="$(sed -n 's/.*quotes=\([0-9]*\).*/\1/p' "$out/peers-parse-1.txt")"
replay_quotes="$(python3 -c 'import json, sys; print(json.load(open(sys.argv[1]))["quotes"])' "$out/peers-replay-1.json")"
[ "$quotes" = "$replay_quotes" ] || { say "parse-only read $quotes quotes, the replay $replay_quotes"; exit 1; }

column() { for ((round = 1; round <= rounds; round++)); do awk -v k="$2" '{ print $k }' "$out/peers-$1-$round.time"; done; }
{
  echo "file=$file"
  echo "bytes=$(stat -c %s "$file")"
  echo "quotes=$quotes"
  echo "snapshots=$(sed -n 's/.*snapshots=\([0-9]*\).*/\1/p' "$out/peers-parse-1.txt")"
  echo "rounds=$rounds"
  echo "jvm_opts=$jvm_opts"
  echo "python=$(/usr/bin/python3 -c 'import platform; print(platform.python_version())')"
  echo "pandas=$(/usr/bin/python3 -c 'import pandas; print(pandas.__version__)')"
  echo "numpy=$(/usr/bin/python3 -c 'import numpy; print(numpy.__version__)')"
  echo "load_before=$load_before"
  echo "load_after=$load_after"
  for name in replay parse pandas; do
    echo "$name.wall.all=$(column "$name" 1 | paste -sd ' ' -)"
    echo "$name.wall.median=$(column "$name" 1 | median)"
    echo "$name.user.median=$(column "$name" 2 | median)"
    echo "$name.sys.median=$(column "$name" 3 | median)"
    echo "$name.rss_kb.max=$(column "$name" 4 | sort -g | tail -1)"
  done
  cat "$out/peers-agree.txt"
} > "$out/peers.txt.part"
mv "$out/peers.txt.part" "$out/peers.txt"
say "wrote $out/peers.txt"
