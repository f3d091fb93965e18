#!/usr/bin/python3
"""Checks that the replay and its pandas peer found the same, and fails on any difference.

Usage: python3 bench/compare_replay.py REPLAY_JSON PANDAS_JSON [SUMMARY_FILE]
  REPLAY_JSON  the output of `./slopewatch replay FILE --spread 10Y-3M --json`
  PANDAS_JSON  the output of `bench/replay_pandas.py FILE`
  SUMMARY_FILE key=value lines about the comparison (written only when the two agree)

Per curve, these must be equal: the number of spread values, the last date, the last value in bp,
the reported quarters with their observation counts, and the first quarter of each negative run (a
run of consecutive reported quarters averaging below 0 bp), which is derived here from the replay's
quarters by the same definition the pandas script uses. Quarter averages must agree to within
1e-9 bp: both sides compute each spread value with the same floating-point operations, but the
sums behind an average are taken in a different order (pandas' grouped mean also compensates its
rounding), so the last bits can differ. Each quarter's sign (below 0 bp or not) must be the same on
both sides; a quarter whose average lies within the tolerance of 0 bp (a sum of exactly 0 in whole
basis points, which floating point leaves a few 1e-15 bp off) is counted and reported, because there
the agreement on its sign rests on how both sides round.
Standard library only, so any python3 runs it.
"""
import json
import sys

TOLERANCE_BP = 1e-9


def from_replay(report):
    curves = {}
    for s in report["spreads"]:
        if s["spread"] != "10Y-3M":
            continue
        quarters = [[q["quarter"], q["average_bp"], q["observations"]] for q in s["quarters"]]
        curves[s["curve"]] = {"observations": s["observations"], "last_date": s["last_date"],
                              "last_value_bp": s["last_value_bp"], "quarters": quarters,
                              "negative_run_starts": negative_run_starts(quarters)}
    return curves


def negative_run_starts(quarters):
    starts = []
    previous_negative = False
    for quarter, average, _ in quarters:
        negative = average < 0
        if negative and not previous_negative:
            starts.append(quarter)
        previous_negative = negative
    return starts


def compare(engine, peer):
    problems = []
    stats = {"curves": len(engine), "quarters": 0, "negative_runs": 0, "spread_values": 0,
             "max_average_difference_bp": 0.0, "quarters_within_tolerance_of_zero": 0}
    if sorted(engine) != sorted(peer):
        problems.append(f"curves differ: replay has {sorted(engine)}, pandas has {sorted(peer)}")
    for curve in sorted(set(engine) & set(peer)):
        e, p = engine[curve], peer[curve]
        for key in ("observations", "last_date", "last_value_bp", "negative_run_starts"):
            if e[key] != p[key]:
                problems.append(f"{curve}: {key} differs: replay {e[key]!r}, pandas {p[key]!r}")
        eq, pq = e["quarters"], p["quarters"]
        if [(q, n) for q, _, n in eq] != [(q, n) for q, _, n in pq]:
            problems.append(f"{curve}: reported quarters or their counts differ: replay {len(eq)}, pandas {len(pq)} quarters")
            continue
        for (quarter, ea, _), (_, pa, _) in zip(eq, pq):
            difference = abs(ea - pa)
            stats["max_average_difference_bp"] = max(stats["max_average_difference_bp"], difference)
            if difference > TOLERANCE_BP:
                problems.append(f"{curve} {quarter}: average differs: replay {ea!r}, pandas {pa!r}")
            if (ea < 0) != (pa < 0):
                problems.append(f"{curve} {quarter}: one side finds the average below 0 bp, the other not: replay {ea!r}, pandas {pa!r}")
            if abs(ea) <= TOLERANCE_BP:
                stats["quarters_within_tolerance_of_zero"] += 1
                sys.stderr.write(f"compare: note: {curve} {quarter} averages {ea!r} bp (replay) and {pa!r} bp (pandas), "
                                 "within rounding of 0 bp; both count it as not below 0 bp\n" if ea >= 0 and pa >= 0 else
                                 f"compare: note: {curve} {quarter} averages {ea!r} bp (replay) and {pa!r} bp (pandas), within rounding of 0 bp\n")
        stats["quarters"] += len(eq)
        stats["negative_runs"] += len(e["negative_run_starts"])
        stats["spread_values"] += e["observations"]
    return problems, stats


def main(args):
    if len(args) not in (2, 3):
        sys.stderr.write("usage: compare_replay.py REPLAY_JSON PANDAS_JSON [SUMMARY_FILE]\n")
        return 2
    with open(args[0]) as f:
        engine = from_replay(json.load(f))
    with open(args[1]) as f:
        peer = json.load(f)["curves"]
    problems, stats = compare(engine, peer)
    if problems:
        for p in problems[:20]:
            sys.stderr.write("compare: " + p + "\n")
        sys.stderr.write(f"compare: {len(problems)} difference(s) between the replay and pandas\n")
        return 1
    lines = [f"agree.{k}={v}" for k, v in stats.items()]
    if len(args) == 3:
        with open(args[2], "w") as f:
            f.write("\n".join(lines) + "\n")
    sys.stderr.write("compare: the replay and pandas agree (" + ", ".join(lines) + ")\n")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
