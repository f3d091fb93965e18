#!/usr/bin/env bash
# The long form of the bad-input checks (docs/reliability.md, "Bad input"): the corpus under
# bench/faults/corpus against a daemon that is already running, with its answers, timings and
# a health check after every file; then vet-policy on the policy corpus.
#   bench/faults/hostile-input.sh [URL [TOKEN]] [--policy-file FILE]
#     URL    the daemon (default http://localhost:8080); TOKEN a write token (default $SLOPEWATCH_TOKEN)
#     --policy-file FILE  the daemon's policy file: also try hostile policies through the live
#                         reload (the file is put back afterwards)
# For example, with the demo (it prints its write token; its policy is alert-rules/default.yaml):
#   ./slopewatch demo --port 18080 &       # wait for "write token: ..."
#   bench/faults/hostile-input.sh http://localhost:18080 <token>
# Exit code 1 when an answer differs from bench/faults/corpus/expected-*.tsv.
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
exec python3 "$root/bench/faults/hostile_input.py" "$@"
