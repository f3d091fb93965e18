package org.slopewatch.alerting;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.slopewatch.cli.SlopewatchMain;

/**
 * What notices say history has shown is what slopewatch's own replay of the reference data shows,
 * no more: U.S. monthly Treasury yields 1953–1999 (Federal Reserve H.15, src/test/resources/reference)
 * with the NBER business-cycle dates stored there, 10Y−1Y, a calendar quarter averaging below zero
 * (the settings the replay documentation uses). Each figure the texts of {@link NoticeText} quote
 * is counted here from the replay's report.
 */
class NoticeHistoryTest {

    private static JsonNode leads;

    @BeforeAll
    static void replay() throws Exception {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = SlopewatchMain.execute(new PrintWriter(out), new PrintWriter(err), "replay",
                "src/test/resources/reference/us-cmt-monthly-1953-1999.csv", "--curve", "US", "--spread", "10Y-1Y",
                "--recessions", "src/test/resources/reference/us-business-cycle-dates.csv", "--json");
        assertThat(code).as(err.toString()).isZero();
        leads = new ObjectMapper().readTree(out.toString()).get("spreads").get(0).get("leads");
    }

    @Test
    void theConfirmedInversionTextQuotesTheReplaysCounts() {
        int hits = 0;
        int late = 0;
        int falseAlarms = 0;
        List<Integer> months = new ArrayList<>();
        List<String> falseAlarmYears = new ArrayList<>();
        for (JsonNode l : leads) {
            if (l.get("false_alarm").asBoolean()) {
                falseAlarms++;
                falseAlarmYears.add(l.get("confirmed").asText().substring(0, 4));
            } else if (l.get("late").asBoolean()) {
                late++;
            } else if (!l.get("pending").asBoolean()) {
                hits++;
                months.add(l.get("months").asInt());
            }
        }
        int min = months.stream().mapToInt(Integer::intValue).min().orElseThrow();
        int max = months.stream().mapToInt(Integer::intValue).max().orElseThrow();
        assertThat(NoticeText.CONFIRMED_MEANING)
                .contains(leads.size() + " inversions were confirmed")
                .contains(hits + " came " + min + " to " + max + " months before a business-cycle peak")
                .contains(late + " only once the recession had begun")
                .contains(falseAlarms + " (" + String.join(", ", falseAlarmYears) + ") was a false alarm");
    }

    @Test
    void theResteepeningTextSaysNoMoreThanTheReplayShows() {
        int after = 0;
        List<Integer> before = new ArrayList<>();
        for (JsonNode l : leads) {
            JsonNode m = l.get("months_from_resteepening");
            if (m == null || m.isNull()) {
                continue;
            }
            if (m.asInt() < 0) {
                after++;
            } else {
                before.add(m.asInt());
            }
        }
        int measured = after + before.size();
        assertThat(after).as("most re-steepenings came after the peak").isGreaterThan(before.size());
        assertThat(NoticeText.RESTEEPENING_MEANING)
                .contains("of the " + measured + " confirmed inversions with a business-cycle peak to measure against")
                .contains(after + " re-steepened after the peak")
                .contains(before.size() + " before it (" + before.stream().mapToInt(Integer::intValue).min().orElseThrow() + " to "
                        + before.stream().mapToInt(Integer::intValue).max().orElseThrow() + " months ahead)");
    }
}
