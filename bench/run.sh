#!/usr/bin/env bash
# Runs the speed benchmarks and writes docs/benchmarks.md with what this run measured.
#   bench/run.sh                 measure and write the report (a few minutes on two cores)
#   bench/run.sh --report-only   rewrite the report from the last run's raw outputs in bench/out/
# Steps: build (package compiles the tests too, and with them the JMH benchmark list), take the test
# classpath from Maven, generate the replay input if absent, run the monitor benchmark (JMH), the
# replay benchmark (one JVM, warm-up rounds, then measured rounds), the real launcher three times
# under /usr/bin/time -v, and the replay end to end against parse-only and pandas
# (bench/replay-peers.sh: 50 curves x 40 years x 8 tenors, BENCH_PEER_ROUNDS rounds, default 5),
# then write the report. Raw outputs stay in bench/out/ (git-ignored).
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$root"
out=bench/out
file="$out/wide-daily-500000.csv"
report=docs/benchmarks.md
mkdir -p "$out" docs

say() { echo "bench: $*" >&2; }
load() { cut -d' ' -f1-3 /proc/loadavg; }
note() { echo "$1=$2" >> "$out/run.txt.part"; }

case "${1:-}" in
  "") measure=true ;;
  --report-only) measure=false ;;
  *) say "usage: bench/run.sh [--report-only]"; exit 2 ;;
esac

if $measure; then
  say "building (./mvnw -B -q -DskipTests package; this compiles the tests and the JMH benchmark list too)"
  ./mvnw -B -q -DskipTests package   # the package phase includes test-compile
  grep -q 'org.slopewatch.bench.MonitorBench' target/test-classes/META-INF/BenchmarkList \
    || { say "target/test-classes/META-INF/BenchmarkList has no MonitorBench: did the JMH annotation processor run?"; exit 1; }
  ./mvnw -B -q dependency:build-classpath -Dmdep.includeScope=test -Dmdep.outputFile="$out/classpath.txt"
  cp="target/test-classes:target/classes:$(cat "$out/classpath.txt")"

  if [ ! -f "$file" ]; then
    say "generating $file"
    java -cp "$cp" org.slopewatch.bench.HistoryFileGenerator "$file"
  fi

  # the machine and the run, recorded before anything is measured
  rm -f "$out/run.txt.part" "$out/launcher.txt.part"
  note cpu_model "$(grep -m1 'model name' /proc/cpuinfo | cut -d: -f2- | sed 's/^ *//')"
  note cores "$(nproc)"
  note jdk "$(java -version 2>&1 | sed -n '1p;3p' | paste -sd ';' - | sed 's/;/; /')"
  note mem_gib "$(awk '/MemTotal/ {printf "%.1f", $2 / 1048576}' /proc/meminfo)"
  note kernel "$(uname -sr)"
  note when "$(date -u '+%Y-%m-%d %H:%M UTC')"
  note commit "$(git rev-parse --short HEAD)$(git diff --quiet HEAD -- src pom.xml bench || echo ' (with uncommitted changes)')"
  note load_before "$(load)"

  say "monitor benchmark (JMH, 2 forks, each 5 warm-up and 5 measured iterations of 2 s per benchmark)"
  java -cp "$cp" org.slopewatch.bench.MonitorBench "$out/monitor.txt" -rf json -rff "$out/monitor-jmh.json" ${BENCH_JMH_ARGS:-} \
    | tee "$out/monitor-jmh.log"
  note load_after_monitor "$(load)"

  say "monitor in thread CPU time (context for the JMH figure: 30 warm-up and 20 measured passes)"
  # the same fixed, pre-touched heap as the JMH fork (see MonitorBench)
  java -Xms2g -Xmx2g -XX:+AlwaysPreTouch -cp "$cp" org.slopewatch.bench.MonitorCpuTime "$out/monitor-cpu.txt" 30 20
  note load_after_cpu "$(load)"

  say "replay benchmark (one JVM: 5 warm-up rounds, 10 measured rounds, parse-only and replay alternating)"
  java -cp "$cp" org.slopewatch.bench.ReplayBench "$file" "$out/replay.txt" 5 10 | tee "$out/replay.log"
  note load_after_replay "$(load)"

  say "the real launcher, three times: ./slopewatch replay $file --spread 10Y-3M --json > /dev/null"
  for i in 1 2 3; do
    /usr/bin/time -v ./slopewatch replay "$file" --spread 10Y-3M --json > /dev/null 2> "$out/launcher-$i.time"
    elapsed="$(sed -n 's/.*Elapsed (wall clock) time (h:mm:ss or m:ss): //p' "$out/launcher-$i.time" \
      | awk -F: '{ s = 0; for (k = 1; k <= NF; k++) s = s * 60 + $k; printf "%.2f", s }')"
    rss_kb="$(sed -n 's/.*Maximum resident set size (kbytes): //p' "$out/launcher-$i.time")"
    user="$(sed -n 's/.*User time (seconds): //p' "$out/launcher-$i.time")"
    sys="$(sed -n 's/.*System time (seconds): //p' "$out/launcher-$i.time")"
    share="$(sed -n 's/.*Percent of CPU this job got: //p' "$out/launcher-$i.time")"
    echo "$i $elapsed $rss_kb $user $sys $share" >> "$out/launcher.txt.part"
    say "run $i: ${elapsed} s, max RSS ${rss_kb} kB"
  done
  mv "$out/launcher.txt.part" "$out/launcher.txt"
  note load_after_launcher "$(load)"

  say "replay end to end against parse-only and pandas (bench/replay-peers.sh, ${BENCH_PEER_ROUNDS:-5} rounds)"
  bench/replay-peers.sh "$cp" "${BENCH_PEER_ROUNDS:-5}"
  note load_after_peers "$(load)"
  mv "$out/run.txt.part" "$out/run.txt"
fi

for f in run.txt monitor.txt monitor-cpu.txt replay.txt launcher.txt peers.txt; do
  [ -f "$out/$f" ] || { say "no $out/$f: run bench/run.sh without --report-only first"; exit 1; }
done

# ---- the report ---------------------------------------------------------------------------------
kv() { sed -n "s/^$2=//p" "$1"; }
run() { kv "$out/run.txt" "$1"; }
m() { kv "$out/monitor.txt" "$1"; }
c() { kv "$out/monitor-cpu.txt" "$1"; }
r() { kv "$out/replay.txt" "$1"; }
# whole numbers with thousands separators, as measured (no rounding beyond the integer part)
n() { awk -v x="$1" 'BEGIN { s = sprintf("%.0f", x); neg = s ~ /^-/; if (neg) s = substr(s, 2);
  o = ""; while (length(s) > 3) { o = "," substr(s, length(s) - 2) o; s = substr(s, 1, length(s) - 3) } ; printf "%s%s%s", neg ? "-" : "", s, o }'; }
div() { awk -v a="$1" -v b="$2" 'BEGIN { printf "%.3f", a / b }'; }
ge() { awk -v a="$1" -v b="$2" 'BEGIN { exit !(a >= b) }'; }
gt() { awk -v a="$1" -v b="$2" 'BEGIN { exit !(a > b) }'; }

mon="$(m observe.score)"; mon_err="$(m observe.error)"
base="$(m quarterAveragesPlainLoop.score)"; base_err="$(m quarterAveragesPlainLoop.error)"
mon_min="$(m observe.min)"
if gt "$mon" 10000000; then
  if gt "$mon_min" 10000000; then mon_target="**met** (the slowest measured iteration, $(n "$mon_min") observations/s, is above it too)"
  else mon_target="**met** by the mean, but not by every iteration (the slowest measured one: $(n "$mon_min") observations/s)"; fi
else
  mon_target="**not met** in this run (see *Reading the figures*)"
fi
mon_ratio="$(div "$mon" "$base")"
cpu_ratio="$(div "$(c cpu.observe.median)" "$(c cpu.quarterAveragesPlainLoop.median)")"
# judged by JMH; when the thread-CPU-time ratio of the same run says otherwise, the report says so
if ge "$mon_ratio" 0.5; then
  if ge "$cpu_ratio" 0.5; then mon_ratio_target="**met** ($mon_ratio of the plain loop; $cpu_ratio in thread CPU time)"
  else mon_ratio_target="**met** by the JMH means ($mon_ratio), but not in thread CPU time ($cpu_ratio): under this run's load the two measures disagree, so this run does not settle the target (see *Reading the figures*)"; fi
else
  if ge "$cpu_ratio" 0.5; then mon_ratio_target="**not met** by the JMH means ($mon_ratio), though met in thread CPU time ($cpu_ratio): under this run's load the two measures disagree (see *Reading the figures*)"
  else mon_ratio_target="**not met** in this run ($mon_ratio of the plain loop; $cpu_ratio in thread CPU time; see *Reading the figures*)"; fi
fi
p() { kv "$out/peers.txt" "$1"; }
peer_replay="$(p replay.wall.median)"; peer_parse="$(p parse.wall.median)"; peer_pandas="$(p pandas.wall.median)"
peer_vs_pandas="$(div "$peer_replay" "$peer_pandas")"; peer_vs_parse="$(div "$peer_replay" "$peer_parse")"
if gt "$peer_pandas" "$peer_replay"; then
  slower_rounds=0
  read -r -a rw <<< "$(p replay.wall.all)"; read -r -a pw <<< "$(p pandas.wall.all)"
  for i in "${!rw[@]}"; do if gt "${rw[$i]}" "${pw[$i]}"; then slower_rounds=$((slower_rounds + 1)); fi; done
  if [ "$slower_rounds" = 0 ]; then peer_target="**met** (the replay took $peer_vs_pandas of pandas' time, median of $(p rounds) rounds, and was faster in every round)"
  else peer_target="**met** by the medians (the replay took $peer_vs_pandas of pandas' time), but pandas was faster in $slower_rounds of $(p rounds) rounds"; fi
else
  peer_target="**not met** in this run (the replay took $peer_vs_pandas of pandas' time; see *Reading the figures*)"
fi
parse_med="$(r parse.median)"; replay_med="$(r replay.median)"; ratio="$(r ratio.median_of_medians)"
if ge "$ratio" 0.5; then replay_target="**met** (replay at $ratio of parse-only)"; else replay_target="**not met** in this run (replay at $ratio of parse-only; see *Reading the figures*)"; fi
cores="$(run cores)"
peak_load="$(for k in load_before load_after_monitor load_after_cpu load_after_replay load_after_launcher load_after_peers; do run "$k" | cut -d' ' -f1; done | sort -g | tail -1)"
if gt "$peak_load" "$cores"; then
  busy="During this run the 1-minute load average, sampled between steps, was as high as $peak_load on $cores cores: other work wanted more
  CPU than the machine has, so each wall-clock figure reflects the share of a core its benchmark got.
  The thread-CPU-time figures of the monitor are less affected by that."
else
  busy="During this run the 1-minute load average, sampled between steps, stayed at or below the $cores cores (highest $peak_load)."
fi
quotes="$(r replay.quotes)"

launcher_table="$(while read -r i elapsed rss user sys share; do
  echo "| $i | $elapsed | $(n "$(awk -v q="$quotes" -v s="$elapsed" 'BEGIN { print q / s }')") | $user | $sys | $share | $(n "$rss") kB ($(awk -v k="$rss" 'BEGIN { printf "%.0f", k / 1024 }') MiB) |"
done < "$out/launcher.txt")"
launcher_median="$(sort -k2,2n "$out/launcher.txt" | sed -n 2p | awk '{ print $2 }')"
launcher_rate="$(n "$(awk -v q="$quotes" -v s="$launcher_median" 'BEGIN { print q / s }')")"

# the daemon's ingest figures (bench/ingest.sh, bench/ingest-kafka.sh) are kept from the file as it was
ingest_section=""
if [[ -f "$report" ]] && grep -q '^<!-- ingest -->' "$report"; then
  ingest_section="$(sed -n '/^<!-- ingest -->/,$p' "$report")"
fi
cat > "$report" <<EOF
# Benchmarks

Speed targets of the engine, measured as benchmarks (never as timed tests: surefire excludes
\`**/bench/**\`). Every figure below was measured by one run of \`bench/run.sh\` on the machine
described here, except in the paragraphs that say they record earlier measurements on the same
machine; nothing is carried over from other machines.

## Reproduce

\`\`\`sh
bench/run.sh
\`\`\`

It builds (\`./mvnw -B -q -DskipTests package\`, which compiles the tests and the JMH benchmark list),
takes the test classpath from \`./mvnw -q dependency:build-classpath -Dmdep.includeScope=test\`,
generates \`$file\` if it is absent, runs both benchmarks and the launcher, runs
\`bench/replay-peers.sh\` (the replay end to end against parse-only and pandas; it needs Debian's
\`python3-pandas\`, which it installs with \`apt-get\` when run as root), and rewrites this
file (\`bench/run.sh --report-only\` rewrites it from the last run's raw outputs without measuring). Raw outputs (JMH log and JSON, per-round figures, \`/usr/bin/time -v\` output) are in
\`bench/out/\`, which git ignores.

## Machine and run

| | |
|---|---|
| date | $(run when) |
| commit | $(run commit) |
| CPU | $(run cpu_model) |
| cores (\`nproc\`) | $(run cores) |
| memory | $(run mem_gib) GiB |
| JDK | $(run jdk) |
| OS | $(run kernel) |
| Python, pandas, NumPy (Debian packages) | $(p python), $(p pandas), $(p numpy) |
| load average (1, 5, 15 min) before / after monitor (JMH) / after monitor (CPU time) / after replay / after launcher / after replay against pandas | $(run load_before) / $(run load_after_monitor) / $(run load_after_cpu) / $(run load_after_replay) / $(run load_after_launcher) / $(run load_after_peers) |

This is a virtual machine with **2 cores** that other work shares, so it **may be noisy**: the load
averages above show how busy it was. Throughput on a quiet machine with more cores would differ;
compare the ratios (each against a baseline measured in the same run) rather than the absolute
figures across machines.

## Results

| benchmark | what | figure | against its baseline | target |
|---|---|---|---|---|
| monitor | \`InversionMonitor.observe\`, one thread | $(n "$mon") ± $(n "$mon_err") observations/s | **$mon_ratio** of the plain loop | ≥ 0.5 of the plain loop (issue 8): $mon_ratio_target; > 10,000,000 observations/s: $mon_target |
| monitor baseline | plain loop, same quarter averages | $(n "$base") ± $(n "$base_err") observations/s | 1 | |
| replay | \`Replay.run\`, 10Y-3M, quarter average | $(n "$replay_med") quotes/s (median of $(r replay.rounds)) | $ratio of parse-only | ≥ 0.5 of parse-only: $replay_target |
| replay baseline | \`HistoryCsvReader.read\`, sink does nothing | $(n "$parse_med") quotes/s (median of $(r replay.rounds)) | 1 | |
| launcher | \`./slopewatch replay … --spread 10Y-3M --json\`, whole process | median of 3: $launcher_median s for $(n "$quotes") quotes ($launcher_rate quotes/s), peak RSS in the table below | | |
| replay end to end | \`./slopewatch replay $(p file) --spread 10Y-3M --json\`, 50 curves × 40 years × 8 tenors, whole process | median of $(p rounds): $(p replay.wall.median) s | **$peer_vs_pandas** of pandas' time; $peer_vs_parse of parse-only's | faster than pandas end to end (issue 8): $peer_target |
| pandas (peer) | \`/usr/bin/python3 bench/replay_pandas.py $(p file)\`, whole process, same results | median of $(p rounds): $(p pandas.wall.median) s | 1 | |
| parse-only (end to end) | \`ParseOnly\`: the same file parsed by \`HistoryCsvReader\`, nothing else, whole process | median of $(p rounds): $(p parse.wall.median) s | | |

### Monitor (JMH)

\`org.slopewatch.bench.MonitorBench\`: JMH 1.37, throughput mode, 2 forks (separate JVMs,
whose JIT may compile the loop differently: one may inline \`observe\` into it and the other not),
each with 5 warm-up and 5 measured iterations of 2 s per benchmark, \`@OperationsPerInvocation\` set
to the series length so that one operation is one observation. The ± is JMH's 99.9 % confidence
half-width over the 10 measured iterations (it assumes a normal distribution; on a shared machine it
is wide); min and max are the slowest and fastest iteration. Each fork runs on a fixed, pre-touched
heap (\`-Xms2g -Xmx2g -XX:+AlwaysPreTouch\`), both benchmarks alike: with the default growing heap the
page faults of each fresh young-generation region fall on the benchmark that allocates (the monitor
allocates its events, the plain loop nothing) and measure the heap's growth rather than the monitor.

| benchmark | observations/s | ± (99.9 %) | min iteration | max iteration | allocated per observation (\`-prof gc\`) |
|---|---|---|---|---|---|
| \`observe\` (the monitor) | $(n "$mon") | $(n "$mon_err") | $(n "$(m observe.min)") | $(n "$(m observe.max)") | $(m observe.alloc) B |
| \`quarterAveragesPlainLoop\` (baseline) | $(n "$base") | $(n "$base_err") | $(n "$(m quarterAveragesPlainLoop.min)") | $(n "$(m quarterAveragesPlainLoop.max)") | $(m quarterAveragesPlainLoop.alloc) B |

Context, in the benchmark thread's CPU time rather than wall time (\`MonitorCpuTime\`: same series,
rules and baseline, one JVM, $(c cpu.warmups) warm-up passes, then $(c cpu.passes) measured passes each, alternating).
A thread waiting for a core loses wall time but not CPU time, so these move less with the
neighbours' load; the target is still judged by the JMH figure above.

| | observations per CPU-second, median | min | max |
|---|---|---|---|
| monitor | $(n "$(c cpu.observe.median)") | $(n "$(c cpu.observe.min)") | $(n "$(c cpu.observe.max)") |
| baseline | $(n "$(c cpu.quarterAveragesPlainLoop.median)") | $(n "$(c cpu.quarterAveragesPlainLoop.min)") | $(n "$(c cpu.quarterAveragesPlainLoop.max)") |

Monitor ÷ baseline in CPU time: $cpu_ratio (medians).

Input: $(n "$(m series.observations)") daily observations (business days $(m series.first) to
$(m series.last): one series that long needs the far future, which no date arithmetic in the monitor
minds), a mean-reverting random walk in bp (\`SpreadWalk\`: mean 120 bp, daily step 5 bp, fixed
seed) that is below 0 bp on $(awk -v s="$(m series.inverted_share)" 'BEGIN { printf "%.2f", 100 * s }') % of the days. Rules: those of the first entry of
\`alert-rules/default.yaml\` (enter below 0 bp, exit at or above 5 bp after 5 observations, hold
365 days, confirm by quarter average below 0 bp or 90 days inverted). One pass over the series,
in date order into a fresh state, is one invocation; it yields $(n "$(m series.quarters)") quarter summaries,
$(n "$(m series.spells)") spells, $(n "$(m series.confirmations)") confirmations and $(n "$(m series.transitions)") transitions, each with its reason text.
The baseline walks the same observations computing the same quarter averages (sum and count per
calendar quarter, no state machine); the benchmark's set-up checks that both give exactly the
same averages. The allocation of \`observe\` is the events it reports (quarter summaries,
transitions with their formatted reasons, spells); a step without news allocates nothing.

How the monitor got there (issue 8; measured on 2026-12-02 on this machine, load average 6–11):
before, \`observe\` worked out the epoch day (\`LocalDate.toEpochDay\`) and the quarter on every
observation, ran the state machine's \`switch\` on every day, and wrote each reason with
\`String.format(Locale.ROOT, …)\`, which sets up locale symbols on every call; the last report before
the change had it at 0.239 of the plain loop (JMH, default heap). Now the epoch day and quarter are
worked out once per month, a \`NORMAL\` day above the entry threshold skips the state machine, and
reasons are built with \`StringBuilder\` and \`DecimalText\` (which writes \`%.1f\` exactly as the
formatter does; \`DecimalTextTest\` checks it against \`String.format\`): 10.6 → 3.3 B allocated per
observation. In thread CPU time on the pre-touched heap, the old code ran at 0.17–0.20 of the plain
loop and the new at 0.47–0.49 (two alternating runs each); every event and reason came out the same
on 442,241 lines of output over four rule sets. (These are earlier measurements, not this run's. So
is this one: a full run of this script at commit 927f505, with one JMH fork and a load average of
5–11, gave 0.410 by JMH and 0.577 in thread CPU time.)

### Replay (one JVM)

\`org.slopewatch.bench.ReplayBench\`: one JVM, $(r replay.warmups) warm-up rounds, then $(r replay.rounds) measured rounds; each round runs
parse-only and the full replay once each, in alternating order, so that a busy neighbour slows
both rather than one. Both read the file through \`Files.newInputStream\` as the launcher does
(after the first round it is in the page cache).

| | median quotes/s | min | max | mean | standard deviation |
|---|---|---|---|---|---|
| replay (\`Replay.run\`) | $(n "$replay_med") | $(n "$(r replay.min)") | $(n "$(r replay.max)") | $(n "$(r replay.mean)") | $(n "$(r replay.sd)") |
| parse-only (\`HistoryCsvReader.read\`) | $(n "$parse_med") | $(n "$(r parse.min)") | $(n "$(r parse.max)") | $(n "$(r parse.mean)") | $(n "$(r parse.sd)") |

Ratio of the medians, replay ÷ parse-only: **$ratio**; per round it ranged from
$(r ratio.per_round_min) to $(r ratio.per_round_max). Per-round figures are in \`bench/out/replay.log\`.$(gt "$(r ratio.per_round_max)" 1 && printf '\n%s\n%s' \
  'A round with a ratio above 1 is noise: the replay does all of the parse-only work and more, so it' \
  'cannot be faster; such rounds show how much a busy neighbour moved single rounds.')

Input: \`$file\`, generated by \`HistoryFileGenerator\` (fixed seed): a wide CSV of one curve,
\`date,1M,3M,6M,1Y,2Y,3Y,5Y,7Y,10Y,30Y\`, one row per business day from $(r replay.first) to $(r replay.last), yields
in percent with two decimals: $(n "$(r replay.rows)") rows, $(n "$quotes") quotes, $(n "$(r replay.bytes)") bytes. The replay watches
10Y-3M with the quarter-average test at 0 bp (the rules \`--spread 10Y-3M\` gives) and finds
$(n "$(r replay.quarters)") complete quarters, $(n "$(r replay.transitions)") transitions and $(n "$(r replay.spells)") spells.

### The real launcher

\`/usr/bin/time -v ./slopewatch replay $file --spread 10Y-3M --json > /dev/null\`, three times
(the application already built). This is the whole process: JVM start, class loading, a cold JIT,
the replay and writing the JSON report.

| run | elapsed (s) | quotes/s over the whole process | user CPU (s) | system CPU (s) | CPU share (\`time -v\`) | peak RSS |
|---|---|---|---|---|---|---|
$launcher_table

### Replay end to end against parse-only and pandas

\`bench/replay-peers.sh\`: $(p rounds) rounds; each runs the three whole processes below once, in an
order that rotates from round to round, each timed by \`/usr/bin/time\` from process start to the
result written.

| | command | wall time, median (s) | each round (s) | user CPU, median (s) | system CPU, median (s) | peak RSS (largest) |
|---|---|---|---|---|---|---|
| replay | \`./slopewatch replay $(p file) --spread 10Y-3M --json > …\` | $(p replay.wall.median) | $(p replay.wall.all) | $(p replay.user.median) | $(p replay.sys.median) | $(awk -v k="$(p replay.rss_kb.max)" 'BEGIN { printf "%.0f", k / 1024 }') MiB |
| parse-only | \`java $(p jvm_opts) -cp … org.slopewatch.bench.ParseOnly $(p file)\` | $(p parse.wall.median) | $(p parse.wall.all) | $(p parse.user.median) | $(p parse.sys.median) | $(awk -v k="$(p parse.rss_kb.max)" 'BEGIN { printf "%.0f", k / 1024 }') MiB |
| pandas | \`/usr/bin/python3 bench/replay_pandas.py $(p file) > …\` | $(p pandas.wall.median) | $(p pandas.wall.all) | $(p pandas.user.median) | $(p pandas.sys.median) | $(awk -v k="$(p pandas.rss_kb.max)" 'BEGIN { printf "%.0f", k / 1024 }') MiB |

Replay ÷ pandas (medians of wall time): **$peer_vs_pandas**; replay ÷ parse-only: $peer_vs_parse (what the
replay adds to reading the file: the engine, the JSON report and the launcher's class loading).
The launcher runs offline commands with \`$(p jvm_opts)\` (see \`./slopewatch\`), and parse-only
runs with the same options so that both JVMs are alike.

Input: \`$(p file)\`, generated by \`CurvesHistoryGenerator\` (fixed seed): a long CSV
\`date,curve,tenor,yield\` of 50 invented curves (\`GOVT-01\` … \`GOVT-50\`), business days from
1986-01-01 to 2025-12-31 (curve k starts 3·k days later, so that some start after a quarter's first
month), 8 tenors (3M, 6M, 1Y, 2Y, 3Y, 5Y, 10Y, 30Y), yields in percent with two decimals:
$(n "$(p quotes)") quotes, $(n "$(p snapshots)") curve snapshots, $(n "$(p bytes)") bytes.

What both compute: per curve, the 10Y-3M spread in bp on each date ($(n "$(p agree.spread_values)") values in all), its
calendar-quarter averages under the engine's rules (a quarter is complete when the first observation
after it arrives; a series that starts after a quarter's first month does not report that quarter):
$(n "$(p agree.quarters)") quarters; and the first quarter of each negative run (consecutive quarters averaging below
0 bp): $(p agree.negative_runs). \`bench/compare_replay.py\` checks that the two agree and fails the run otherwise: counts,
quarters, last dates and values, and run starts equal; quarter averages within 1e-9 bp (the largest
difference was $(p agree.max_average_difference_bp) bp: the sums are taken in a different order, and pandas' grouped
mean compensates its rounding). $(p agree.quarters_within_tolerance_of_zero) quarter average(s) lay within that tolerance of 0 bp (a sum of exactly
0 in whole basis points, left a few 1e-15 bp off by floating point); both sides put them on the same side of 0.

## Reading the figures

- Each target is judged against the figures measured in this run: the monitor's JMH means
  (observations per second, with the slowest measured iteration beside it, and the ratio to the
  plain loop), the ratio of the one-JVM replay's median to parse-only's, and the end-to-end
  replay's median wall time against pandas'.
- The monitor's ratio rests on two JMH benchmarks run one after the other, each over two forks;
  a neighbour's burst during one of them moves the ratio, in either direction. The thread-CPU-time
  figures alternate monitor and baseline pass by pass and lose no time to waiting for a core, but
  still share caches and cores with the neighbours. When the two ratios fall on different sides of
  0.5, the run does not settle the target, and the table says so.
- When JMH's ± is as large as the figure itself, the measured iterations differed a lot; the min and
  max columns say how. The warm-up iterations, in \`bench/out/monitor-jmh.log\`, show how long the
  JIT took to settle.
- On this shared two-core machine the JIT compiler, the garbage collector and other processes
  compete with the benchmark thread; the spread between the min and max columns shows how much.
  $busy
- The replay against pandas is end to end, start-up and a cold JIT included, as a user meets it;
  the warmed-up one-JVM replay figure above shows the engine without them. Python's start-up is
  shorter than the JVM's, pandas' CSV reader is written in C and its group-by in Cython; the
  replay reads the file with a general CSV parser and runs the full state machine on every curve.
- The launcher figure includes start-up and a cold JIT, so it is below the warmed-up replay
  figure. Its user CPU time includes the JIT compiler and GC threads; a CPU share well below
  100 % means the process was waiting for a core that other work held.
EOF
if [[ -n "$ingest_section" ]]; then
  printf '\n%s\n' "$ingest_section" >> "$report"
fi
say "wrote $report"
