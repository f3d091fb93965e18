package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.LocalDate;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Locale;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Attribute;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.jsoup.select.Elements;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code replay --report}: the HTML page written for real history, read back with a real HTML
 * parser (jsoup) and checked against the replay's own JSON for the same input, the files it was
 * made from, and the business-cycle dates.
 *
 * <p>Data: Federal Reserve H.15 monthly constant-maturity yields 1953-04 to 1999-09 and NBER
 * business-cycle reference dates (from memory); see src/test/resources/reference/README.md.
 */
class ReplayHtmlReportTest {

    @TempDir
    static Path dir;

    private static Path history;
    private static Path recessions;
    private static Path policy;
    private static String html;
    private static Document page;
    private static JsonNode json;

    @BeforeAll
    static void replay() throws Exception {
        history = ReferenceReplayTest.resource("reference/us-cmt-monthly-1953-1999.csv");
        recessions = ReferenceReplayTest.resource("reference/us-business-cycle-dates.csv");
        policy = ReferenceReplayTest.resource("policies/reference-report.yaml");
        Path out = dir.resolve("report.html");
        CliRun run = CliRun.of("replay", history.toString(), "--policy", policy.toString(), "--recessions", recessions.toString(),
                "--report", out.toString());
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).as("the text report still goes to standard output").contains("lead to the next business-cycle peak");
        html = Files.readString(out, StandardCharsets.UTF_8);
        page = Jsoup.parse(html);
        CliRun asJson = CliRun.of("replay", history.toString(), "--policy", policy.toString(), "--recessions", recessions.toString(),
                "--json");
        assertThat(asJson.exitCode()).as(asJson.err()).isZero();
        json = new ObjectMapper().readTree(asJson.out());
    }

    @Test
    void eachReplayedSpreadHasASectionWithOneTitledChart() {
        Elements sections = page.select("section.spread");
        assertThat(sections.eachAttr("data-spread")).containsExactlyElementsOf(ids());
        assertThat(ids()).as("the policy watches two spreads the file can compute").hasSize(2);
        for (Element section : sections) {
            Elements charts = section.select("svg.chart");
            assertThat(charts).as("one chart in %s", section.attr("data-spread")).hasSize(1);
            Element svg = charts.first();
            assertThat(svg.attr("role")).isEqualTo("img");
            for (String id : svg.attr("aria-labelledby").split(" ")) {
                assertThat(svg.getElementById(id)).as("aria-labelledby names #%s", id).isNotNull();
            }
            assertThat(svg.selectFirst("> title").text()).contains(section.attr("data-spread")).contains("1953-04-01").contains("1999-09-01");
            assertThat(svg.selectFirst("> desc").text()).contains("inverted spell");
            assertThat(svg.select("g.spread-line path")).as("the spread's line is drawn").isNotEmpty();
            assertThat(svg.select("g.zero-line")).as("a zero line").hasSize(1);
        }
    }

    @Test
    void theShadedSpellsAreTheSpellsTheReplayFound() {
        for (int i = 0; i < ids().size(); i++) {
            JsonNode spells = json.get("spreads").get(i).get("spells");
            Elements bands = chart(i).select("g.spell");
            assertThat(bands).as("shaded spells of %s", ids().get(i)).hasSize(spells.size());
            assertThat(spells.size()).as("the file has inversions in every decade but the 1990s").isGreaterThan(5);
            List<String> starts = new ArrayList<>();
            List<String> ends = new ArrayList<>();
            spells.forEach(s -> {
                starts.add(s.get("start").asText());
                ends.add(s.get("end").isNull() ? "open" : s.get("end").asText());
            });
            assertThat(bands.eachAttr("data-start")).containsExactlyElementsOf(starts);
            assertThat(bands.eachAttr("data-end")).containsExactlyElementsOf(ends);
            assertThat(bands.select("rect")).as("each band is drawn").hasSizeGreaterThanOrEqualTo(spells.size());
        }
    }

    @Test
    void confirmationsAndReSteepeningsAreMarked() {
        for (int i = 0; i < ids().size(); i++) {
            List<String> confirmed = new ArrayList<>();
            List<String> resteepened = new ArrayList<>();
            json.get("spreads").get(i).get("transitions").forEach(t -> {
                if (t.get("to").asText().equals("CONFIRMED")) {
                    confirmed.add(t.get("date").asText());
                } else if (t.get("to").asText().equals("RESTEEPENING")) {
                    resteepened.add(t.get("date").asText());
                }
            });
            assertThat(confirmed).isNotEmpty();
            assertThat(chart(i).select("g.confirmation").eachAttr("data-date")).containsExactlyElementsOf(confirmed);
            assertThat(chart(i).select("g.resteepening").eachAttr("data-date")).containsExactlyElementsOf(resteepened);
        }
    }

    @Test
    void recessionBandsAreTheNberRecessionsInTheDataRange() throws IOException {
        // NBER business-cycle reference dates (from memory): the peaks from 1953 to 1999; each recession
        // runs from the month after its peak through its trough, and the 1953-07 peak's recession (1953-08 to
        // 1954-05) falls inside data that starts in 1953-04.
        List<String> nberPeaks = List.of("1953-07", "1957-08", "1960-04", "1969-12", "1973-11", "1980-01", "1981-07", "1990-07");
        assertThat(peaksInRangeFromTheFiles()).as("the dates file agrees with the chronology").isEqualTo(nberPeaks);
        for (int i = 0; i < ids().size(); i++) {
            Elements bands = chart(i).select("g.recession");
            assertThat(bands.eachAttr("data-peak")).as("recession bands of %s", ids().get(i)).containsExactlyElementsOf(nberPeaks);
            for (Element band : bands) {
                assertThat(band.select("text").text()).as("each recession labelled with its peak month").isEqualTo(band.attr("data-peak"));
            }
        }
    }

    /*
     * Our own mark for a recession: a thin bar along the bottom of the plot in violet, not a band over the
     * whole height in grey. The bar is the group's first rect (the second is the white ground of the label).
     */
    @Test
    void aRecessionIsAThinVioletBarNotAGreyBand() {
        Element chart = chart(0);
        double plotHeight = Double.parseDouble(chart.selectFirst("g.spell rect").attr("height"));
        for (Element band : chart.select("g.recession")) {
            Element bar = band.selectFirst("rect");
            assertThat(Double.parseDouble(bar.attr("height"))).as("bar of %s against a plot %s high", band.attr("data-peak"), plotHeight)
                    .isLessThanOrEqualTo(6.0).isLessThan(plotHeight / 20);
            Matcher rgb = Pattern.compile("fill:\\s*rgb\\((\\d+),(\\d+),(\\d+)\\)").matcher(bar.attr("style"));
            assertThat(rgb.find()).as("a solid fill: %s", bar.attr("style")).isTrue();
            int r = Integer.parseInt(rgb.group(1));
            int g = Integer.parseInt(rgb.group(2));
            int b = Integer.parseInt(rgb.group(3));
            assertThat(Math.max(r, Math.max(g, b)) - Math.min(r, Math.min(g, b))).as("a hue, not a grey: rgb(%d,%d,%d)", r, g, b)
                    .isGreaterThan(60);
        }
    }

    @Test
    void theLeadTimeTableIsTheReplaysLeadTimes() {
        for (int i = 0; i < ids().size(); i++) {
            JsonNode leads = json.get("spreads").get(i).get("leads");
            Elements rows = section(i).select("table.leads tbody tr");
            assertThat(rows).as("lead-time rows of %s", ids().get(i)).hasSize(leads.size());
            for (int r = 0; r < leads.size(); r++) {
                JsonNode l = leads.get(r);
                String outcome = l.get("late").asBoolean() ? "late: recession already under way"
                        : l.get("false_alarm").asBoolean() ? "false alarm" : l.get("pending").asBoolean() ? "pending" : "hit";
                assertThat(rows.get(r).select("td").eachText()).as("row %d of %s", r, ids().get(i)).containsExactly(
                        l.get("confirmed").asText(), orDash(l.get("peak")), orDash(l.get("months")), outcome,
                        l.get("resteepened").isNull() ? "not yet" : l.get("resteepened").asText(), orDash(l.get("months_from_resteepening")));
            }
            long falseAlarms = 0;
            for (JsonNode l : leads) {
                falseAlarms += l.get("false_alarm").asBoolean() ? 1 : 0;
            }
            // peaks are counted once each, as the JSON report's peaks list has them, however many confirmations led them
            long ahead = 0;
            long late = 0;
            for (JsonNode p : json.get("spreads").get(i).get("peaks")) {
                ahead += p.get("outcome").asText().equals("AHEAD") ? 1 : 0;
                late += p.get("outcome").asText().equals("LATE") ? 1 : 0;
            }
            Element summary = section(i).selectFirst("dl.lead-summary");
            assertThat(fact(summary, "Peaks signalled ahead")).isEqualTo(Long.toString(ahead));
            assertThat(fact(summary, "Peaks signalled late")).isEqualTo(Long.toString(late));
            assertThat(fact(summary, "False alarms")).startsWith(falseAlarms + " ");
            List<String> missed = new ArrayList<>();
            json.get("spreads").get(i).get("missed_peaks").forEach(m -> missed.add(m.asText()));
            assertThat(fact(summary, "Missed recessions")).isEqualTo(missed.isEmpty() ? "none" : String.join(", ", missed));
        }
        // the row ReferenceReplayTest checks in the text report, seen in the page
        assertThat(section(0).select("table.leads tbody tr").stream().map(r -> r.select("td").eachText()))
                .contains(List.of("1959-10-01", "1960-04", "6", "hit", "1960-03-01", "1"));
    }

    @Test
    void theTransitionsTableListsEveryTransition() {
        for (int i = 0; i < ids().size(); i++) {
            JsonNode transitions = json.get("spreads").get(i).get("transitions");
            Elements rows = section(i).select("table.transitions tbody tr");
            assertThat(rows).hasSize(transitions.size());
            for (int r = 0; r < transitions.size(); r++) {
                JsonNode t = transitions.get(r);
                assertThat(rows.get(r).select("td").eachText().subList(0, 3))
                        .containsExactly(t.get("date").asText(), t.get("from").asText(), t.get("to").asText());
                assertThat(rows.get(r).select("td").last().text()).isEqualTo(t.get("reason").asText());
            }
        }
    }

    @Test
    void thePolicyIsNamedWithTheSha256OfItsBytesAndItsRules() throws Exception {
        String expected = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(policy)));
        assertThat(page.select(".policy-hash").text()).isEqualTo(expected);
        assertThat(page.select(".policy-file").text()).isEqualTo(policy.toString());
        Elements rules = page.select("table.rules tbody tr");
        assertThat(rules.eachText()).hasSize(2);
        assertThat(rules.get(0).select("th, td").eachText()).containsExactly("10Y-1Y", "all", "0 bp", "0 bp", "1", "365 days",
                "quarter-average < 0 bp");
        assertThat(rules.get(1).select("th, td").eachText()).containsExactly("10Y-3Y", "all", "0 bp", "0 bp", "1", "365 days",
                "quarter-average < 0 bp or days-inverted >= 120 d");
    }

    @Test
    void theCoverageIsStated() {
        Element source = page.selectFirst("dl.source");
        assertThat(fact(source, "History file")).isEqualTo(history.toString());
        assertThat(fact(source, "Dates")).isEqualTo("1953-04-01 to 1999-09-01");
        assertThat(fact(source, "Spreads")).isEqualTo(String.join(", ", ids()));
        assertThat(fact(source, "Recession dates")).isEqualTo(recessions.toString());
        assertThat(page.selectFirst("dl.source time").attr("datetime")).isNotBlank();
    }

    @Test
    void theCautionIsShownUnderTheFindingsAndAtTheFoot() {
        Elements caution = page.select(".caution");
        assertThat(caution).hasSize(2);
        assertThat(caution.first().text()).contains("not investment advice").contains(org.slopewatch.replay.ReplayReport.CAUTION);
        assertThat(page.selectFirst("header + main > section.findings + .caution")).as("right after the findings").isNotNull();
    }

    @Test
    void thePageOpensWithItsFindingsThenTheChartsThenWhatItWasMadeFromAndThePolicy() {
        Elements parts = page.select("main > *");
        assertThat(parts.first().is("section.findings")).as("the first thing under the title: %s", parts.first().tagName()).isTrue();
        int firstChart = parts.indexOf(page.selectFirst("main > section.spread"));
        int source = parts.indexOf(page.getElementById("source").parent());
        int policy = parts.indexOf(page.getElementById("policy").parent());
        assertThat(firstChart).as("charts after the findings").isGreaterThan(0);
        assertThat(source).as("what the report covers after the charts").isGreaterThan(parts.indexOf(page.select("main > section.spread").last()));
        assertThat(policy).as("the policy last").isEqualTo(parts.size() - 1);
    }

    /*
     * Per business-cycle peak, the FIRST confirmation before it. 10Y-1Y of the H.15 file was confirmed
     * twice before the 1969-12 peak (NBER dates, from memory): quarters averaging below zero in 1968Q2 and
     * 1968Q4 (confirmed 1968-07-01 and 1969-01-01, as the replay's lead table lists them). The peak was
     * signalled once, 17 months ahead (1968-07 to 1969-12); the second confirmation is mentioned, not
     * counted again. The 1969-12 peak has no announcement date in the file (the committee announced peaks
     * from 1980 on); the 1990-07 peak was announced on 1991-04-25 (from memory), 24 months after the
     * 1989-04-01 confirmation.
     */
    @Test
    void eachPeakIsSignalledByItsFirstConfirmationAndLaterOnesAreMentioned() {
        Element row = findings(0).selectFirst("table.peaks tr[data-peak=1969-12]");
        assertThat(row.attr("data-outcome")).isEqualTo("ahead");
        assertThat(row.select("td").eachText()).containsExactly("signalled 17 months ahead", "1968-07-01", "17", "not given",
                "before the peak", "1969-01-01 (11 months before)");
        Element ninety = findings(0).selectFirst("table.peaks tr[data-peak=1990-07]");
        assertThat(ninety.attr("data-timing")).isEqualTo("before_peak");
        assertThat(ninety.select("td").eachText()).containsExactly("signalled 15 months ahead", "1989-04-01", "15", "1991-04-25",
                "before the peak, 24 months before its announcement", "none");
        for (int i = 0; i < ids().size(); i++) {
            JsonNode spread = json.get("spreads").get(i);
            // from the replay's JSON: each peak's confirmations in date order; the first not late signals it
            TreeMap<String, List<JsonNode>> byPeak = new TreeMap<>();
            spread.get("leads").forEach(l -> {
                if (!l.get("peak").isNull()) {
                    byPeak.computeIfAbsent(l.get("peak").asText(), p -> new ArrayList<>()).add(l);
                }
            });
            TreeMap<String, String> outcomes = new TreeMap<>();
            byPeak.forEach((peak, leads) -> outcomes.put(peak, leads.stream().anyMatch(l -> !l.get("late").asBoolean()) ? "ahead" : "late"));
            spread.get("missed_peaks").forEach(m -> outcomes.put(m.asText(), "missed"));
            spread.get("unassessed_peaks").forEach(m -> outcomes.put(m.asText(), "not_assessed"));
            Elements rows = findings(i).select("table.peaks tbody tr");
            assertThat(rows.eachAttr("data-peak")).as("one row per peak of %s", ids().get(i)).containsExactlyElementsOf(outcomes.keySet());
            assertThat(rows.eachAttr("data-outcome")).containsExactlyElementsOf(outcomes.values());
            for (Element r : rows) {
                List<JsonNode> leads = byPeak.getOrDefault(r.attr("data-peak"), List.of());
                JsonNode first = leads.stream().filter(l -> !l.get("late").asBoolean()).findFirst().orElse(leads.isEmpty() ? null : leads.get(0));
                List<String> cells = r.select("td").eachText();
                assertThat(cells.get(1)).as("first confirmation of %s", r.attr("data-peak")).isEqualTo(first == null ? "none" : first.get("confirmed").asText());
                assertThat(cells.get(2)).isEqualTo(first == null ? "-" : first.get("months").asText());
                assertThat(cells.get(5).equals("none")).as("other confirmations of %s: %s", r.attr("data-peak"), cells.get(5))
                        .isEqualTo(leads.size() <= 1);
            }
            // the same peaks as the JSON report's list, which is where they are decided
            List<String> fromJson = new ArrayList<>();
            spread.get("peaks").forEach(p -> fromJson.add(p.get("peak").asText() + " " + p.get("outcome").asText().toLowerCase(Locale.ROOT)));
            List<String> fromPage = new ArrayList<>();
            rows.forEach(r -> {
                if (!r.attr("data-outcome").equals("not_assessed")) {
                    fromPage.add(r.attr("data-peak") + " " + r.attr("data-outcome"));
                }
            });
            assertThat(fromPage).containsExactlyElementsOf(fromJson);
            long ahead = outcomes.values().stream().filter("ahead"::equals).count();
            long assessed = outcomes.values().stream().filter(o -> !o.equals("not_assessed")).count();
            assertThat(findings(i).selectFirst("dd.peak-summary").text()).startsWith(ahead + " of " + assessed + " assessed peaks signalled ahead");
            List<String> falseAlarms = new ArrayList<>();
            spread.get("leads").forEach(l -> {
                if (l.get("false_alarm").asBoolean()) {
                    falseAlarms.add(l.get("confirmed").asText());
                }
            });
            String listed = findings(i).selectFirst("dd.false-alarms").text();
            assertThat(listed).startsWith(falseAlarms.isEmpty() ? "none" : falseAlarms.size() + ": ");
            falseAlarms.forEach(d -> assertThat(listed).contains("confirmed " + d));
        }
    }

    @Test
    void theFindingsSayWhereEachSpreadStandsAndSinceWhen() {
        for (int i = 0; i < ids().size(); i++) {
            JsonNode spread = json.get("spreads").get(i);
            JsonNode transitions = spread.get("transitions");
            JsonNode last = transitions.get(transitions.size() - 1);
            assertThat(last.get("to").asText()).isEqualTo(spread.get("final_state").asText());
            assertThat(findings(i).selectFirst("dd.state-now").text()).isEqualTo(String.format(Locale.ROOT, "%s since %s; %+.1f bp on %s",
                    spread.get("final_state").asText(), last.get("date").asText(), spread.get("last_value_bp").asDouble(),
                    spread.get("last_date").asText()));
        }
    }

    /*
     * The policy's probit for 10Y-1Y (R's coefficients, policies/reference-report.yaml) on the file's last
     * months: 1999-08 is complete, 10Y - 1Y = 5.94 - 5.20 = 0.74 pp; 1999-09 is the month so far,
     * 5.92 - 5.25 = 0.67 pp. P = Phi(alpha + beta * s) recomputed with Commons Math's NormalDistribution.
     */
    @Test
    void theProbabilitySaysWhichSpreadHorizonMonthAndModelAndMarksTheMonthToDateProvisional() {
        NormalDistribution phi = new NormalDistribution();
        Element spread = findings(0);
        String complete = spread.selectFirst("dd.probability.final").text();
        assertThat(complete).isEqualTo(String.format(Locale.ROOT, "12-month-ahead recession probability %.0f %% (no band: the model has no "
                + "covariance): P(recession in 2000-08), from the 10Y-1Y average of 1999-08 (complete month, 1 observation); model: "
                + "R glm probit on us-cmt-monthly-1953-1999.csv and us-business-cycle-dates.csv, 10Y-1Y, 1953-04 to 1998-09, 546 months, "
                + "recession 12 months ahead", 100 * phi.cumulativeProbability(-0.809715 - 0.940699 * (5.94 - 5.20))));
        String toDate = spread.selectFirst("dd.probability.provisional").text();
        assertThat(toDate).startsWith(String.format(Locale.ROOT, "12-month-ahead recession probability %.0f %%",
                100 * phi.cumulativeProbability(-0.809715 - 0.940699 * (5.92 - 5.25))))
                .contains("P(recession in 2000-09), from the 10Y-1Y average of 1999-09 so far (provisional: month to date, 1 observation)");
        assertThat(spread.selectFirst("dd.probability.provisional").previousElementSibling().text()).isEqualTo("Month to date (provisional)");
        assertThat(findings(1).select("dd.probability")).as("the policy has no model for 10Y-3Y").isEmpty();
    }

    @Test
    void datesInTablesDoNotWrap() {
        assertThat(page.selectFirst("style").data()).contains(".date, td.date, th.date { white-space: nowrap; }");
        int dates = 0;
        for (Element cell : page.select("table td, table th")) {
            if (cell.text().matches("\\d{4}-\\d{2}(-\\d{2})?")) {
                assertThat(cell.hasClass("date")).as("a date cell of table.%s: %s", cell.closest("table").className(), cell.text()).isTrue();
                dates++;
            }
        }
        assertThat(dates).as("dates in the spells, lead, peak and transition tables").isGreaterThan(100);
    }

    @Test
    void thePageIsSelfContained() {
        assertThat(html).doesNotContain("src=\"http").doesNotContain("<link").doesNotContain("@import");
        assertThat(page.select("link, script, iframe, object, embed, base, img")).isEmpty();
        for (Element e : page.getAllElements()) {
            for (Attribute a : e.attributes()) {
                String key = a.getKey().toLowerCase(Locale.ROOT);
                String value = a.getValue().strip().toLowerCase(Locale.ROOT);
                if (key.equals("src") || key.endsWith("href") || key.equals("action") || key.equals("data")) {
                    assertThat(value).as("%s of <%s>", key, e.tagName()).startsWith("#");
                }
                assertThat(value).as("%s of <%s>", key, e.tagName()).doesNotContain("url(http").doesNotContain("url(//");
            }
        }
        for (Element style : page.select("style")) {
            assertThat(style.data()).doesNotContain("url(");
        }
    }

    @Test
    void thePageIsStructuredForAssistiveTechnology() {
        assertThat(page.selectFirst("html").attr("lang")).isEqualTo("en");
        assertThat(page.select("h1")).hasSize(1);
        assertThat(page.select("h2").eachText()).contains("Findings", "What the report covers", "Policy", "Recession dates");
        Elements tables = page.select("table");
        assertThat(tables).hasSizeGreaterThan(5);
        for (Element table : tables) {
            assertThat(table.select("> caption").text()).as("caption of table.%s", table.className()).isNotBlank();
            assertThat(table.select("> thead th[scope=col]")).as("column headers of table.%s", table.className()).isNotEmpty();
        }
    }

    @Test
    void withoutAPolicyFileOrRecessionDatesThoseAreLeftOut() throws IOException {
        Path out = dir.resolve("bare.html");
        CliRun run = CliRun.of("replay", history.toString(), "--spread", "10Y-1Y", "--report", out.toString(), "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        Document bare = Jsoup.parse(Files.readString(out));
        assertThat(bare.select(".policy-hash")).isEmpty();
        assertThat(bare.select("dl.policy").text()).contains("none: rules from the command line");
        assertThat(bare.select("table.leads, table.peaks, dd.peak-summary")).isEmpty();
        assertThat(bare.selectFirst("section.findings p.scope").text()).isEqualTo("No business-cycle dates were given, so no peak is assessed.");
        assertThat(bare.selectFirst("section.findings dd.state-now").text()).startsWith("NORMAL since ");
        assertThat(bare.select("g.recession")).isEmpty();
        assertThat(bare.select("svg.chart g.spell")).hasSize(new ObjectMapper().readTree(run.out()).get("spreads").get(0).get("spells").size());
    }

    @Test
    void aReportThatCannotBeWrittenFailsWithExitCode1() {
        CliRun run = CliRun.of("replay", history.toString(), "--spread", "10Y-1Y", "--report",
                dir.resolve("no-such-dir").resolve("r.html").toString());
        assertThat(run.exitCode()).isEqualTo(1);
        assertThat(run.err()).contains("cannot write the report").contains("no-such-dir");
        assertThat(run.out()).as("no report printed after a failure").isEmpty();
    }

    @Test
    void theProgressBarStillDrawsWithAReport() throws IOException {
        // the reader reports progress every 16,384 rows: an invented daily history of 20,000 days
        Path longFile = dir.resolve("GOVT-A.csv");
        StringBuilder rows = new StringBuilder("date,1Y,10Y\n");
        LocalDate day = LocalDate.of(1970, 1, 1);
        for (int i = 0; i < 20_000; i++) {
            rows.append(day.plusDays(i)).append(",5.00,").append(String.format(Locale.ROOT, "%.3f", 5 + Math.sin(i / 400.0)))
                    .append('\n');
        }
        Files.writeString(longFile, rows);
        PrintStream stderr = System.err;
        String before = System.getProperty("slopewatch.progress");
        ByteArrayOutputStream captured = new ByteArrayOutputStream();
        try {
            System.setProperty("slopewatch.progress", "true");
            System.setErr(new PrintStream(captured, true, StandardCharsets.UTF_8));
            CliRun run = CliRun.of("replay", longFile.toString(), "--spread", "10Y-1Y", "--report", dir.resolve("p.html").toString());
            assertThat(run.exitCode()).isZero();
        } finally {
            System.setErr(stderr);
            if (before == null) {
                System.clearProperty("slopewatch.progress");
            } else {
                System.setProperty("slopewatch.progress", before);
            }
        }
        assertThat(captured.toString(StandardCharsets.UTF_8)).contains("\rreplay [").contains(" bytes");
        Document report = Jsoup.parse(dir.resolve("p.html").toFile());
        assertThat(report.select("svg.chart g.spell")).as("sin(i/400) dips below zero about every 2,500 days").hasSizeGreaterThan(5);
    }

    /** Peaks of the recessions in the dates file with a month inside the history file's range. */
    private static List<String> peaksInRangeFromTheFiles() throws IOException {
        List<String> rows = Files.readAllLines(history);
        YearMonth first = YearMonth.from(LocalDate.parse(rows.get(1).split(",")[0]));
        YearMonth last = YearMonth.from(LocalDate.parse(rows.get(rows.size() - 1).split(",")[0]));
        List<String> peaks = new ArrayList<>();
        List<String> dates = Files.readAllLines(recessions);
        for (String line : dates.subList(1, dates.size())) {
            String[] f = line.split(",");
            YearMonth start = YearMonth.parse(f[0]).plusMonths(1);
            YearMonth end = YearMonth.parse(f[1]);
            if (!start.isAfter(last) && !end.isBefore(first)) {
                peaks.add(f[0]);
            }
        }
        return peaks;
    }

    private static List<String> ids() {
        List<String> ids = new ArrayList<>();
        json.get("spreads").forEach(s -> ids.add(s.get("id").asText()));
        return ids;
    }

    private static Element section(int i) {
        return page.select("section.spread").get(i);
    }

    private static Element findings(int i) {
        Elements blocks = page.select("section.findings div.spread-findings");
        assertThat(blocks.eachAttr("data-spread")).containsExactlyElementsOf(ids());
        return blocks.get(i);
    }

    private static Element chart(int i) {
        return section(i).selectFirst("svg.chart");
    }

    private static String fact(Element dl, String label) {
        for (Element dt : dl.select("dt")) {
            if (dt.text().equals(label)) {
                return dt.nextElementSibling().text();
            }
        }
        throw new AssertionError("no '" + label + "' in " + dl.text());
    }

    private static String orDash(JsonNode n) {
        return n == null || n.isNull() ? "-" : n.asText();
    }
}
