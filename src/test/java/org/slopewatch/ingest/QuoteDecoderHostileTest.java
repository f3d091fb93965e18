package org.slopewatch.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Clock;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.Reject;
import org.slopewatch.pipeline.RejectReason;

/**
 * Inputs the decoder used to take in a way that lost or corrupted data, each kept as the example
 * that showed it (docs/reliability.md, "what failed and was fixed"): the fuzzers
 * ({@link QuoteDecoderFuzzTest}) or the bad-input corpus ({@code bench/faults/corpus}) found them.
 */
class QuoteDecoderHostileTest {

    private static final LocalDate TODAY = LocalDate.of(2026, 6, 15);
    private final QuoteDecoder decoder = new QuoteDecoder(new IngestRules(Set.of("GOVT-A", "GOVT-B"), YieldBounds.DEFAULT, 3,
            Clock.fixed(TODAY.atStartOfDay().toInstant(ZoneOffset.UTC), ZoneOffset.UTC)));

    private Reject onlyReject(String body) {
        QuoteBatch batch = decoder.decode("test", body);
        assertThat(batch.messages()).as("nothing of %s is accepted", body).isEmpty();
        assertThat(batch.rejects()).hasSize(1);
        return batch.rejects().get(0);
    }

    @Test
    void anEmptyArrayIsAnsweredWithAReason() {
        // found by the fuzzer: "[]" came back with no item at all, so the HTTP answer was a 400 without a reason
        Reject r = onlyReject("[]");
        assertThat(r.reason()).isEqualTo(RejectReason.MALFORMED);
        assertThat(r.detail()).isEqualTo("an empty array carries no quote");
    }

    @Test
    void aFieldGivenTwiceIsMalformedRatherThanTheLastOneWinning() {
        // was: 4.3 taken silently; a reader that keeps the first value would have seen 4.2
        Reject r = onlyReject("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2,\"yield\":4.3}");
        assertThat(r.reason()).isEqualTo(RejectReason.MALFORMED);
        assertThat(r.detail()).startsWith("not valid JSON").contains("Duplicate field 'yield'");
    }

    @Test
    void aTenorGivenTwiceInASnapshotIsMalformed() {
        // was: 3M and 3m (or 12M and 1Y) are one tenor, and the second value replaced the first unseen
        assertThat(onlyReject("{\"curve\":\"GOVT-A\",\"date\":\"2026-03-02\",\"yields\":{\"3M\":5.0,\"3m\":6.0}}").detail())
                .isEqualTo("tenor 3M appears twice in 'yields' (as '3M' and '3m')");
        assertThat(onlyReject("{\"curve\":\"GOVT-A\",\"date\":\"2026-03-02\",\"yields\":{\"12M\":4.0,\"1Y\":4.1}}").detail())
                .isEqualTo("tenor 1Y appears twice in 'yields' (as '12M' and '1Y')");
    }

    @Test
    void contentAfterTheJsonValueIsMalformedRatherThanDropped() {
        // was: the first quote accepted and the second, sent as JSON lines, silently dropped
        Reject r = onlyReject("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2}\n"
                + "{\"curve\":\"GOVT-A\",\"tenor\":\"2Y\",\"date\":\"2026-03-02\",\"yield\":4.5}");
        assertThat(r.reason()).isEqualTo(RejectReason.MALFORMED);
        assertThat(r.detail()).startsWith("not valid JSON").containsIgnoringCase("trailing token");
    }

    @Test
    void marketDatesTheJournalCannotHoldAreRejected() {
        // was: accepted, then stored shifted through java.sql.Date: 1000-01-03 as 1000-01-08, -999999999-01-03 as
        // 169087565-03-17 (H2), and refused by PostgreSQL, failing the whole step
        for (String date : List.of("1582-10-14", "1000-01-03", "0000-01-01", "-9999-01-03", "-999999999-01-03")) {
            Reject r = onlyReject("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"" + date + "\",\"yield\":4.2}");
            assertThat(r.reason()).as(date).isEqualTo(RejectReason.BAD_DATE);
            assertThat(r.detail()).contains("is before 1583-01-01, the earliest the journal keeps");
        }
        assertThat(decoder.decode("test", "{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"1583-01-01\",\"yield\":4.2}").messages())
                .as("the first day accepted").hasSize(1);
        // the CSV path checks the same rule
        Reject csv = decoder.check(QuoteMessage.of("GOVT-A", LocalDate.of(1000, 1, 3), Map.of(Tenor.years(10), 420.0)), 0);
        assertThat(csv.reason()).isEqualTo(RejectReason.BAD_DATE);
    }

    @Test
    void aSenderTimeOutsideTheYearsATimestampHoldsIsRejected() {
        // was: accepted, then stored as -169108099-06-29 (java.sql.Timestamp overflowed) on H2, refused by PostgreSQL
        Reject r = onlyReject("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2,"
                + "\"time\":\"+999999999-12-31T23:59:59Z\"}");
        assertThat(r.reason()).isEqualTo(RejectReason.MALFORMED);
        assertThat(r.detail()).isEqualTo("time +999999999-12-31T23:59:59Z is outside the years 1583 to 9999");
    }

    @Test
    void idsAndSourcesLongerThanTheirJournalColumnsAreRejected() {
        // was: accepted, then the journal write failed ("Value too long for column MESSAGE_ID"), so the whole request
        // was a 503 and, from Kafka, the consumer stopped on the record
        Reject id = onlyReject("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2,\"id\":\"" + "x".repeat(201) + "\"}");
        assertThat(id.detail()).isEqualTo("'id' is 201 characters long; at most 200");
        Reject source = onlyReject("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2,\"source\":\""
                + "s".repeat(5_000) + "\"}");
        assertThat(source.detail()).isEqualTo("'source' is 5000 characters long; at most 200");
        assertThat(decoder.decode("test", "{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2,\"id\":\""
                + "x".repeat(200) + "\"}").messages()).as("200 characters fit").hasSize(1);
    }

    @Test
    void controlCharactersInKeptTextAreRejected() {
        // found by the fuzzer: an id holding NUL was accepted; PostgreSQL refuses NUL in text, failing the whole step
        Reject r = onlyReject("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2,\"id\":\"A\\u0000\"}");
        assertThat(r.reason()).isEqualTo(RejectReason.MALFORMED);
        assertThat(r.detail()).isEqualTo("'id' contains the control character U+0000");
        assertThat(onlyReject("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2,\"source\":\"a\\nb\"}").detail())
                .isEqualTo("'source' contains the control character U+000A");
        // half of a surrogate pair is no character: PostgreSQL stored '?' in its place (found by the corpus)
        assertThat(onlyReject("{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2,\"source\":\"\\ud800\"}").detail())
                .isEqualTo("'source' contains an unpaired surrogate U+D800");
        assertThat(decoder.decode("test", "{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2,"
                + "\"source\":\"desk \\ud83d\\ude00\"}").messages()).as("a whole pair (an emoji) is a character").hasSize(1);
    }

    @Test
    void aLongCurveIsRejectedBeforeTheJournalEvenWhenEveryCurveIsAccepted() {
        // with no curve list every curve is accepted; the journal's column holds 100 characters
        QuoteDecoder any = new QuoteDecoder(new IngestRules(Set.of(), YieldBounds.DEFAULT, 3,
                Clock.fixed(TODAY.atStartOfDay().toInstant(ZoneOffset.UTC), ZoneOffset.UTC)));
        QuoteBatch b = any.decode("test", "{\"curve\":\"" + "C".repeat(101) + "\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.2}");
        assertThat(b.rejects()).extracting(Reject::detail).containsExactly("'curve' is 101 characters long; at most 100");
        Reject csv = any.check(new QuoteMessage(null, null, null, "C".repeat(101), LocalDate.of(2026, 3, 2),
                new TreeMap<>(Map.of(Tenor.years(10), 420.0))), 0);
        assertThat(csv.detail()).isEqualTo("'curve' is 101 characters long; at most 100");
    }
}
