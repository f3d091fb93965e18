#!/usr/bin/python3
"""The replay benchmark's peer: what `./slopewatch replay FILE --spread 10Y-3M --json` finds, written with pandas.

Usage: /usr/bin/python3 bench/replay_pandas.py FILE > result.json
  (Debian's python3-pandas is importable only from /usr/bin/python3.)

Reads a long CSV `date,curve,tenor,yield` (yields in percent) and writes, per curve, as JSON:
  - the 10Y-3M spread in basis points on each date both legs are quoted (its count, last date and last value),
  - the calendar-quarter averages of that spread, with the engine's rules for which quarters count:
    a quarter is complete when the first observation after it arrives (so each curve's last quarter is
    not reported), and a series that starts after a quarter's first month does not report that quarter,
  - the first quarter of each negative run (a run of consecutive reported quarters whose average is below 0 bp).
Units as in the engine: each yield is converted to basis points (percent × 100) before the difference.
bench/compare_replay.py derives the same from the replay's JSON and checks that the two agree.
"""
import json
import sys

import pandas as pd


def spreads_bp(path):
    quotes = pd.read_csv(path, usecols=["date", "curve", "tenor", "yield"],
                         dtype={"date": str, "curve": "category", "tenor": "category", "yield": "float64"})
    legs = quotes[quotes["tenor"].isin(["10Y", "3M"])]
    wide = legs.pivot(index=["curve", "date"], columns="tenor", values="yield")
    spread = (wide["10Y"] * 100.0 - wide["3M"] * 100.0).dropna().rename("bp").reset_index()
    spread["curve"] = spread["curve"].astype(str)
    spread["date"] = pd.to_datetime(spread["date"], format="%Y-%m-%d")
    return spread.sort_values(["curve", "date"], kind="stable")


def quarter_averages(spread):
    spread = spread.assign(quarter=spread["date"].dt.to_period("Q"))
    quarters = spread.groupby(["curve", "quarter"], sort=True, observed=True)["bp"].agg(["mean", "count"]).reset_index()
    per_curve = spread.groupby("curve", sort=True).agg(first=("date", "first"), last=("date", "last"),
                                                       last_bp=("bp", "last"), observations=("bp", "size"))
    # which quarters the engine reports: not a curve's last (no observation after it yet), and not its
    # first when the curve starts after the quarter's first month
    first_q = per_curve["first"].dt.to_period("Q")
    starts_late = (per_curve["first"].dt.month - 1) % 3 != 0
    quarters = quarters.join(pd.DataFrame({"first_q": first_q, "starts_late": starts_late,
                                           "last_q": per_curve["last"].dt.to_period("Q")}), on="curve")
    reported = (quarters["quarter"] != quarters["last_q"]) & ~((quarters["quarter"] == quarters["first_q"]) & quarters["starts_late"])
    return quarters[reported].reset_index(drop=True), per_curve


def negative_run_starts(quarters):
    negative = quarters["mean"] < 0
    previous_negative = negative.groupby(quarters["curve"]).shift(1, fill_value=False)
    return quarters[negative & ~previous_negative]


def main(path):
    spread = spreads_bp(path)
    quarters, per_curve = quarter_averages(spread)
    runs = negative_run_starts(quarters)
    result = {}
    for curve, row in per_curve.iterrows():
        result[curve] = {"observations": int(row["observations"]), "last_date": row["last"].strftime("%Y-%m-%d"),
                         "last_value_bp": float(row["last_bp"]), "quarters": [], "negative_run_starts": []}
    for curve, quarter, mean, count in zip(quarters["curve"], quarters["quarter"], quarters["mean"], quarters["count"]):
        result[curve]["quarters"].append([str(quarter), float(mean), int(count)])
    for curve, quarter in zip(runs["curve"], runs["quarter"]):
        result[curve]["negative_run_starts"].append(str(quarter))
    json.dump({"spread": "10Y-3M", "curves": result}, sys.stdout, indent=1)
    sys.stdout.write("\n")


if __name__ == "__main__":
    if len(sys.argv) != 2:
        sys.stderr.write("usage: /usr/bin/python3 bench/replay_pandas.py FILE > result.json\n")
        sys.exit(2)
    main(sys.argv[1])
