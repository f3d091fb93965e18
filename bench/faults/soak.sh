#!/usr/bin/env bash
# The long form of the soak test: SoakIT (the packaged daemon, embedded transport, default policy,
# H2 journal) at a steady 5,000 quotes/s for 600 s, or as many seconds as the first argument says.
# Heap after a full collection (jcmd GC.run) every 5 s, the answers' age, and the checks of the
# short form (40 s in CI). The figures are printed at the end and kept in target/faults/soak.txt.
#   bench/faults/soak.sh [SECONDS]
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/../.."
seconds="${1:-600}"
./mvnw -B verify -Dtest=NoSuchTest -Dsurefire.failIfNoSpecifiedTests=false -Dit.test=SoakIT \
  -Dslopewatch.faults.soak-seconds="$seconds"
echo "soak test ($(date -u '+%Y-%m-%d %H:%M UTC'), commit $(git rev-parse --short HEAD), $(nproc) cores):"
cat target/faults/soak.txt
