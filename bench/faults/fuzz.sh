#!/usr/bin/env bash
# The fuzzers with more tries than CI gives them (docs/reliability.md, "Fuzzing"):
#   bench/faults/fuzz.sh [TRIES]       default 200000 tries per property (CI: 10000)
# Runs QuoteDecoderFuzzTest, PolicyParserFuzzTest and HistoryCsvReaderFuzzTest with
# -Dfuzz.tries=TRIES (read by org.slopewatch.testsupport.PropertyCheck, and by the CSV test itself) and
# prints each property's tries and time from the surefire reports. A failure prints the sample and
# the seed that repeats it; keep it as an example test.
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
cd "$root"
tries="${1:-200000}"
status=0
./mvnw -B -q test -Dtest='QuoteDecoderFuzzTest,PolicyParserFuzzTest,HistoryCsvReaderFuzzTest' -Dfuzz.tries="$tries" \
  -Dsurefire.failIfNoSpecifiedTests=false \
  > target/fuzz.log 2>&1 || status=$?
for report in target/surefire-reports/TEST-org.slopewatch.ingest.QuoteDecoderFuzzTest.xml \
              target/surefire-reports/TEST-org.slopewatch.rules.PolicyParserFuzzTest.xml \
              target/surefire-reports/TEST-org.slopewatch.history.HistoryCsvReaderFuzzTest.xml; do
  grep -o '<testcase name="[^"]*" classname="[^"]*" time="[^"]*"' "$report" \
    | sed -E 's/<testcase name="([^"]*)" classname="[^"]*\.([^".]*)" time="([^"]*)"/\2.\1: '"$tries"' tries in \3 s/'
done
grep -a -A12 'property failed on try\|seed [0-9-]*, try' target/fuzz.log || true
[ "$status" -eq 0 ] && echo "fuzz: no property failed" || echo "fuzz: a property failed; the full log is target/fuzz.log"
exit "$status"
