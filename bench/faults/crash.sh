#!/usr/bin/env bash
# The long form of the crash tests, 10 kills or as many as KILLS says:
#   kafka     CrashIT: a packaged daemon on Kafka and PostgreSQL killed with SIGKILL at random
#             moments while quotes stream in, restarted each time, then compared row for row with
#             an uninterrupted daemon. Uses the broker and database named by SLOPEWATCH_TEST_KAFKA /
#             SLOPEWATCH_TEST_POSTGRES_URL (as .ci/run sets them); without them the test starts its
#             own through .ci/kafka.sh and .ci/postgres.sh.
#   embedded  EmbeddedCrashIT: 'serve' on its defaults (HTTP, the H2 journal) killed while a client
#             posts; after each kill the journal must hold every message answered 200 before it.
#
#   bench/faults/crash.sh [kafka|embedded] [KILLS]      (default: kafka 10)
#   SEED=N bench/faults/crash.sh ...                     repeats a run's kill moments
# The figures are printed at the end and kept in target/faults/crash.txt (kafka) or
# target/faults/embedded-crash.txt (embedded).
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/../.."
mode=kafka
case "${1:-}" in
  kafka|embedded) mode="$1"; shift ;;
esac
kills="${1:-10}"
if [ "$mode" = embedded ]; then test=EmbeddedCrashIT; figures=target/faults/embedded-crash.txt
else test=CrashIT; figures=target/faults/crash.txt; fi
./mvnw -B verify -Dtest=NoSuchTest -Dsurefire.failIfNoSpecifiedTests=false -Dit.test="$test" \
  -Dslopewatch.faults.kills="$kills" ${SEED:+-Dslopewatch.faults.seed="$SEED"}
echo "crash test ($mode): $(cat "$figures")"
