#!/usr/bin/env bash
# The long form of the outage test: OutageIT with each outage lasting 300 s (the chat receiver down,
# the SMTP server and the database unreachable in the middle of the stream; the database outage is
# capped at 30 s so that the stream is still flowing when it ends), or as many seconds as the first
# argument says. The database is also unreachable when the daemon starts. The figures are printed at
# the end and kept in target/faults/outages.txt.
#   bench/faults/outages.sh [SECONDS]
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/../.."
seconds="${1:-300}"
./mvnw -B verify -Dtest=NoSuchTest -Dsurefire.failIfNoSpecifiedTests=false -Dit.test=OutageIT \
  -Dslopewatch.faults.outage-seconds="$seconds"
echo "outage test: $(cat target/faults/outages.txt)"
