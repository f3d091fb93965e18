package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.math.BigDecimal;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.YearMonth;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * One row per business-cycle peak, on real history, against a computation made here from the raw
 * files alone: the monthly yields, split by hand, and the peak, trough and announcement dates.
 *
 * <p>Data: Federal Reserve H.15 monthly constant-maturity yields 1953-04 to 1999-09 (via R package
 * tseries, data set {@code tcm}); NBER business-cycle reference dates and Business Cycle Dating
 * Committee announcement dates (from memory); see src/test/resources/reference/README.md.
 *
 * <p>The rule computed here, peak by peak, as docs/replay.md states it: a confirmation in a
 * recession (after the peak, by the trough) is late for that peak; any other leads the first peak
 * in or after its month when that peak is at most 24 months away. A peak's first such confirmation
 * decides it: ahead by the peak month, late after it; its other confirmations are named, not
 * counted. A peak with none is missed when the data begin at least 24 months before it.
 */
class ReferencePeaksTest {

    private static final int WINDOW = 24;

    private static Path history;
    private static Path recessions;
    /** The file's rows: date, then 10Y − 1Y and 10Y − 3Y in percentage points, exact. */
    private static final List<Row> ROWS = new ArrayList<>();
    private static final List<Dated> DATES = new ArrayList<>();

    record Row(LocalDate date, BigDecimal tenOne, BigDecimal tenThree) {
    }

    record Dated(YearMonth peak, YearMonth trough, LocalDate announced) {
    }

    record Expected(YearMonth peak, String outcome, LocalDate first, Integer months, List<LocalDate> later, String timing,
                    Integer monthsBeforeAnnouncement) {
    }

    @BeforeAll
    static void readTheFiles() throws Exception {
        history = ReferenceReplayTest.resource("reference/us-cmt-monthly-1953-1999.csv");
        recessions = ReferenceReplayTest.resource("reference/us-business-cycle-dates.csv");
        List<String> lines = Files.readAllLines(history);
        assertThat(lines.get(0)).isEqualTo("date,1Y,3Y,5Y,10Y");
        for (String line : lines.subList(1, lines.size())) {
            String[] f = line.split(",");
            BigDecimal ten = new BigDecimal(f[4]);
            ROWS.add(new Row(LocalDate.parse(f[0]), ten.subtract(new BigDecimal(f[1])), ten.subtract(new BigDecimal(f[2]))));
        }
        List<String> dates = Files.readAllLines(recessions);
        assertThat(dates.get(0)).isEqualTo("peak,trough,peak_announced");
        for (String line : dates.subList(1, dates.size())) {
            String[] f = line.split(",", -1);
            DATES.add(new Dated(YearMonth.parse(f[0]), YearMonth.parse(f[1]), f[2].isEmpty() ? null : LocalDate.parse(f[2])));
        }
    }

    @Test
    void theConfirmationsComputedHereAreTheReplays() throws IOException {
        // the check of the computation below: the same confirmations as the replay's per-confirmation list
        for (boolean tenOne : new boolean[] {true, false}) {
            JsonNode spread = replay(tenOne ? "10Y-1Y" : "10Y-3Y", "quarter-average");
            assertThat(dates(spread.get("leads"), "confirmed")).as(tenOne ? "10Y-1Y" : "10Y-3Y")
                    .isEqualTo(quarterAverageConfirmations(tenOne));
            JsonNode days = replay(tenOne ? "10Y-1Y" : "10Y-3Y", "days-inverted:240");
            assertThat(dates(days.get("leads"), "confirmed")).isEqualTo(daysInvertedConfirmations(tenOne, 240));
        }
    }

    @Test
    void eachPeakIsTheOneComputedFromTheFilesDirectly() throws IOException {
        for (boolean tenOne : new boolean[] {true, false}) {
            String name = tenOne ? "10Y-1Y" : "10Y-3Y";
            check(name, replay(name, "quarter-average").get("peaks"), expectedPeaks(quarterAverageConfirmations(tenOne)));
            check(name + " days-inverted:240", replay(name, "days-inverted:240").get("peaks"),
                    expectedPeaks(daysInvertedConfirmations(tenOne, 240)));
        }
    }

    /*
     * Counting confirmations made 10Y-1Y, confirmed twice before the 1969-12 peak, read "hits 7" over 6 peaks, and 10Y-3Y
     * "hits 11" over 7. Computed here: the confirmations before a peak and the distinct peaks they lead.
     */
    @Test
    void aSecondConfirmationBeforeTheSamePeakIsNotASecondHit() throws IOException {
        for (boolean tenOne : new boolean[] {true, false}) {
            String name = tenOne ? "10Y-1Y" : "10Y-3Y";
            List<LocalDate> confirmations = quarterAverageConfirmations(tenOne);
            Map<YearMonth, Expected> expected = expectedPeaks(confirmations);
            long aheadPeaks = expected.values().stream().filter(e -> e.outcome().equals("AHEAD")).count();
            long late = expected.values().stream().filter(e -> e.outcome().equals("LATE")).count();
            long missed = expected.values().stream().filter(e -> e.outcome().equals("MISSED")).count();
            long confirmationsAhead = confirmations.stream().filter(c -> leads(c) != null).count();
            assertThat(confirmationsAhead).as("%s: more confirmations ahead of a peak than peaks", name).isGreaterThan(aheadPeaks);

            CliRun text = CliRun.of("replay", history.toString(), "--spread", name, "--persistence", "quarter-average",
                    "--recessions", recessions.toString());
            assertThat(text.exitCode()).as(text.err()).isZero();
            assertThat(text.out()).as("%s: peaks counted once each", name).doesNotContain("hits " + confirmationsAhead)
                    .contains(String.format("peaks %d assessed: %d signalled ahead, %d late, %d missed", expected.size(), aheadPeaks,
                            late, missed));

            JsonNode spread = replay(name, "quarter-average");
            assertThat(spread.get("leads")).as("the per-confirmation list keeps every confirmation").hasSize(confirmations.size());
            JsonNode peaks = spread.get("peaks");
            assertThat(peaks).as("%s: the JSON report lists peaks", name).isNotNull();
            assertThat(count(peaks, "AHEAD")).as("%s: peaks signalled ahead", name).isEqualTo(aheadPeaks);
        }
        // 10Y-1Y, hand-checked from the file: quarters 1968Q2 and 1968Q4 averaged below zero, confirmed 1968-07-01 and
        // 1969-01-01; both lead the 1969-12 peak (17 and 11 months), which is one peak signalled, 17 months ahead
        JsonNode peak = null;
        for (JsonNode p : replay("10Y-1Y", "quarter-average").get("peaks")) {
            if (p.get("peak").asText().equals("1969-12")) {
                assertThat(peak).as("one entry for the 1969-12 peak").isNull();
                peak = p;
            }
        }
        assertThat(peak.get("first_confirmed").asText()).isEqualTo("1968-07-01");
        assertThat(peak.get("months").asInt()).isEqualTo(17);
        assertThat(peak.get("later_confirmations").get(0).get("confirmed").asText()).isEqualTo("1969-01-01");
    }

    @Test
    void theJsonPeaksListHasOneEntryPerAssessedPeakWithItsFields() throws IOException {
        JsonNode spread = replay("10Y-1Y", "quarter-average");
        Set<String> keys = Set.of("peak", "outcome", "first_confirmed", "months", "later_confirmations", "announced", "timing",
                "months_before_announcement");
        List<String> listed = new ArrayList<>();
        for (JsonNode p : spread.get("peaks")) {
            List<String> names = new ArrayList<>();
            p.fieldNames().forEachRemaining(names::add);
            assertThat(names).as("fields of %s", p).containsExactlyInAnyOrderElementsOf(keys);
            assertThat(p.get("outcome").asText()).isIn("AHEAD", "LATE", "MISSED");
            for (JsonNode later : p.get("later_confirmations")) {
                List<String> laterNames = new ArrayList<>();
                later.fieldNames().forEachRemaining(laterNames::add);
                assertThat(laterNames).containsExactlyInAnyOrder("confirmed", "months");
            }
            listed.add(p.get("peak").asText());
        }
        // every peak of the dates file inside the data is listed once, except those the data begin too late to assess
        YearMonth first = YearMonth.from(ROWS.get(0).date());
        YearMonth last = YearMonth.from(ROWS.get(ROWS.size() - 1).date());
        List<String> inside = new ArrayList<>();
        List<String> notAssessed = new ArrayList<>();
        for (Dated d : DATES) {
            if (!d.peak().isBefore(first) && !d.peak().isAfter(last)) {
                (d.peak().minusMonths(WINDOW).isBefore(first) ? notAssessed : inside).add(d.peak().toString());
            }
        }
        assertThat(listed).containsExactlyElementsOf(inside);
        assertThat(dates(spread.get("unassessed_peaks"))).containsExactlyElementsOf(notAssessed);
        // NBER peaks 1953-1999 (from memory): 1953-07 lies three months after the data begin
        assertThat(notAssessed).containsExactly("1953-07");
    }

    /*
     * What was knowable when, on a case the file holds. 10Y-3Y, hand-computed from the file's rows (10Y - 3Y, pp):
     * 1979-07 +0.01, then 1979-08 -0.11 ... 1980-03 -1.30, 1980-04 -0.55, 1980-05 +0.74. Inverted from 1979-08-01, the
     * spread had been so for 213 days on 1980-03-01 and 244 days on 1980-04-01, so days-inverted:240 confirms on
     * 1980-04-01: three months after the 1980-01 peak, two months before the committee announced it on 1980-06-03
     * (NBER reference and announcement dates, from memory).
     */
    @Test
    void aLateSignalBeforeThePeakWasAnnouncedIsToldApart() throws IOException {
        JsonNode peak = null;
        for (JsonNode p : replay("10Y-3Y", "days-inverted:240").get("peaks")) {
            if (p.get("peak").asText().equals("1980-01")) {
                peak = p;
            }
        }
        assertThat(peak.get("outcome").asText()).isEqualTo("LATE");
        assertThat(peak.get("first_confirmed").asText()).isEqualTo("1980-04-01");
        assertThat(peak.get("months").asInt()).isEqualTo(-3);
        assertThat(peak.get("announced").asText()).isEqualTo("1980-06-03");
        assertThat(peak.get("timing").asText()).isEqualTo("BEFORE_ANNOUNCEMENT");
        assertThat(peak.get("months_before_announcement").asInt()).isEqualTo(2);
        CliRun text = CliRun.of("replay", history.toString(), "--spread", "10Y-3Y", "--persistence", "days-inverted:240",
                "--recessions", recessions.toString());
        assertThat(text.out()).containsPattern("1980-01 +late +1980-04-01 +-3 +1980-06-03 +before the announcement");
    }

    private static void check(String what, JsonNode peaks, Map<YearMonth, Expected> expected) {
        assertThat(peaks).as("%s: the JSON report lists peaks", what).isNotNull();
        List<String> listed = new ArrayList<>();
        peaks.forEach(p -> listed.add(p.get("peak").asText()));
        assertThat(listed).as("%s: one entry per assessed peak", what)
                .containsExactlyElementsOf(expected.keySet().stream().map(YearMonth::toString).toList());
        for (JsonNode p : peaks) {
            Expected e = expected.get(YearMonth.parse(p.get("peak").asText()));
            String where = what + " peak " + e.peak();
            assertThat(p.get("outcome").asText()).as(where).isEqualTo(e.outcome());
            assertThat(orNull(p.get("first_confirmed"))).as(where).isEqualTo(e.first() == null ? null : e.first().toString());
            assertThat(p.get("months").isNull() ? null : p.get("months").asInt()).as(where).isEqualTo(e.months());
            assertThat(dates(p.get("later_confirmations"), "confirmed")).as(where).isEqualTo(e.later());
            for (JsonNode later : p.get("later_confirmations")) {
                assertThat(later.get("months").asLong()).as(where).isEqualTo(ChronoUnit.MONTHS.between(
                        YearMonth.from(LocalDate.parse(later.get("confirmed").asText())), e.peak()));
            }
            assertThat(orNull(p.get("timing"))).as(where).isEqualTo(e.timing());
            assertThat(p.get("months_before_announcement").isNull() ? null : p.get("months_before_announcement").asInt()).as(where)
                    .isEqualTo(e.monthsBeforeAnnouncement());
            Dated d = DATES.stream().filter(x -> x.peak().equals(e.peak())).findFirst().orElseThrow();
            assertThat(orNull(p.get("announced"))).as(where).isEqualTo(d.announced() == null ? null : d.announced().toString());
        }
    }

    /** Peak by peak, from the confirmations and the dates file: see the class comment for the rule. */
    private static Map<YearMonth, Expected> expectedPeaks(List<LocalDate> confirmations) {
        YearMonth first = YearMonth.from(ROWS.get(0).date());
        YearMonth last = YearMonth.from(ROWS.get(ROWS.size() - 1).date());
        Map<YearMonth, Expected> out = new TreeMap<>();
        for (Dated d : DATES) {
            List<LocalDate> mine = new ArrayList<>();
            for (LocalDate c : confirmations) {
                YearMonth m = YearMonth.from(c);
                boolean during = m.isAfter(d.peak()) && !m.isAfter(d.trough());
                if (during || d.peak().equals(leads(c))) {
                    mine.add(c);
                }
            }
            if (mine.isEmpty()) {
                boolean inside = !d.peak().isBefore(first) && !d.peak().isAfter(last);
                if (inside && !d.peak().minusMonths(WINDOW).isBefore(first)) {
                    out.put(d.peak(), new Expected(d.peak(), "MISSED", null, null, List.of(), null, null));
                }
                continue;
            }
            LocalDate c = mine.get(0);
            int months = (int) ChronoUnit.MONTHS.between(YearMonth.from(c), d.peak());
            String outcome = months >= 0 ? "AHEAD" : "LATE";
            String timing = months >= 0 ? "BEFORE_PEAK" : d.announced() == null ? "AFTER_PEAK"
                    : c.isBefore(d.announced()) ? "BEFORE_ANNOUNCEMENT" : "AFTER_BOTH";
            Integer beforeAnnouncement = d.announced() == null ? null
                    : (int) ChronoUnit.MONTHS.between(YearMonth.from(c), YearMonth.from(d.announced()));
            out.put(d.peak(), new Expected(d.peak(), outcome, c, months, mine.subList(1, mine.size()), timing, beforeAnnouncement));
        }
        return out;
    }

    /** The peak a confirmation outside any recession leads: the first in or after its month, at most 24 months on; or null. */
    private static YearMonth leads(LocalDate confirmed) {
        YearMonth m = YearMonth.from(confirmed);
        for (Dated d : DATES) {
            if (m.isAfter(d.peak()) && !m.isAfter(d.trough())) {
                return null; // in a recession: late for it, leading nothing
            }
        }
        for (Dated d : DATES) {
            if (!d.peak().isBefore(m)) {
                return ChronoUnit.MONTHS.between(m, d.peak()) <= WINDOW ? d.peak() : null;
            }
        }
        return null;
    }

    /**
     * Quarter-average confirmations with the replay's defaults (enter below 0, leave at 0 or above after one
     * observation): when the first month of a quarter arrives, a spell inverted and not yet confirmed is confirmed on
     * that date if the quarter just ended averaged below zero; then the month's own value opens or ends the spell.
     */
    private static List<LocalDate> quarterAverageConfirmations(boolean tenOne) {
        List<LocalDate> out = new ArrayList<>();
        boolean open = false;
        boolean confirmed = false;
        BigDecimal quarterSum = BigDecimal.ZERO;
        for (int i = 0; i < ROWS.size(); i++) {
            Row r = ROWS.get(i);
            BigDecimal v = tenOne ? r.tenOne() : r.tenThree();
            if (i > 0 && (r.date().getMonthValue() - 1) % 3 == 0) {
                // the file starts in 1953-04, the first month of a quarter, so every quarter before this one is whole
                if (open && !confirmed && quarterSum.signum() < 0) {
                    out.add(r.date());
                    confirmed = true;
                }
                quarterSum = BigDecimal.ZERO;
            }
            quarterSum = quarterSum.add(v);
            if (v.signum() < 0 && !open) {
                open = true;
                confirmed = false;
            } else if (v.signum() >= 0) {
                open = false;
            }
        }
        return out;
    }

    /** days-inverted:DAYS: confirmed on the first date at least DAYS calendar days after the spell's first inverted date. */
    private static List<LocalDate> daysInvertedConfirmations(boolean tenOne, int days) {
        List<LocalDate> out = new ArrayList<>();
        LocalDate since = null;
        boolean confirmed = false;
        for (Row r : ROWS) {
            BigDecimal v = tenOne ? r.tenOne() : r.tenThree();
            if (v.signum() >= 0) {
                since = null;
            } else if (since == null) {
                since = r.date();
                confirmed = false;
            } else if (!confirmed && ChronoUnit.DAYS.between(since, r.date()) >= days) {
                out.add(r.date());
                confirmed = true;
            }
        }
        return out;
    }

    private static JsonNode replay(String spread, String persistence) throws IOException {
        CliRun run = CliRun.of("replay", history.toString(), "--spread", spread, "--persistence", persistence,
                "--recessions", recessions.toString(), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        return new ObjectMapper().readTree(run.out()).get("spreads").get(0);
    }

    private static long count(JsonNode peaks, String outcome) {
        long n = 0;
        for (JsonNode p : peaks) {
            n += p.get("outcome").asText().equals(outcome) ? 1 : 0;
        }
        return n;
    }

    private static List<LocalDate> dates(JsonNode list, String field) {
        List<LocalDate> out = new ArrayList<>();
        list.forEach(n -> out.add(LocalDate.parse(n.get(field).asText())));
        return out;
    }

    private static List<String> dates(JsonNode list) {
        List<String> out = new ArrayList<>();
        list.forEach(n -> out.add(n.asText()));
        return out;
    }

    private static String orNull(JsonNode n) {
        return n == null || n.isNull() ? null : n.asText();
    }
}
