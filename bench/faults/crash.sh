#!/usr/bin/env bash
# The long form of the crash test: CrashIT (a packaged daemon on Kafka and PostgreSQL killed with
# SIGKILL at random moments while quotes stream in, restarted each time, then compared row for row
# with an uninterrupted daemon) with 10 kills, or as many as the first argument says.
#   bench/faults/crash.sh [KILLS]          SEED=N bench/faults/crash.sh repeats a run's kill moments
# Uses the broker and database named by SLOPEWATCH_TEST_KAFKA / SLOPEWATCH_TEST_POSTGRES_URL (as
# .ci/run sets them); without them the test starts its own through .ci/kafka.sh and .ci/postgres.sh.
# The figures are printed at the end and kept in target/faults/crash.txt.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/../.."
kills="${1:-10}"
./mvnw -B verify -Dtest=NoSuchTest -Dsurefire.failIfNoSpecifiedTests=false -Dit.test=CrashIT \
  -Dslopewatch.faults.kills="$kills" ${SEED:+-Dslopewatch.faults.seed="$SEED"}
echo "crash test: $(cat target/faults/crash.txt)"
