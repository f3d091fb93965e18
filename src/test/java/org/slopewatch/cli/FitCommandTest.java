package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.slopewatch.probability.LiveProbability;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.rules.SpreadProbabilityModel;

/**
 * {@code slopewatch fit} on real data, against R.
 *
 * <p>Data: monthly U.S. Treasury constant-maturity yields 1953-04 to 1999-09 (Federal Reserve H.15
 * via R package tseries, data set {@code tcm}) and NBER business-cycle reference dates (from
 * memory); provenance in src/test/resources/reference/README.md. Expected values: R 4.2.2
 * {@code glm(binomial(link = "probit"))} and {@code sandwich::NeweyWest(lag = 12, prewhite = FALSE,
 * adjust = FALSE)} stored in src/test/resources/reference/probit-10y1y-h12.csv by
 * src/test/reference/probit/probit_reference.R.
 */
class FitCommandTest {

    private static final String R_OUTPUT = "reference/probit-10y1y-h12.csv";

    private static Path history;
    private static Path recessions;
    private static Map<String, Double> r;

    @TempDir
    Path dir;

    @BeforeAll
    static void reference() throws Exception {
        history = ReferenceReplayTest.resource("reference/us-cmt-monthly-1953-1999.csv");
        recessions = ReferenceReplayTest.resource("reference/us-business-cycle-dates.csv");
        r = new LinkedHashMap<>();
        for (String line : Files.readAllLines(ReferenceReplayTest.resource(R_OUTPUT))) {
            if (!line.startsWith("#") && !line.isBlank() && !line.equals("quantity,value")) {
                String[] c = line.split(",");
                r.put(c[0], Double.parseDouble(c[1]));
            }
        }
    }

    private static CliRun fit(Path file, String... extra) {
        List<String> args = new ArrayList<>(List.of("fit", file.toString(), "--spread", "10Y-1Y", "--recessions",
                recessions.toString(), "--horizon-months", "12"));
        args.addAll(List.of(extra));
        return CliRun.of(args.toArray(String[]::new));
    }

    /** Agreement to four significant digits with the stored R output: |ours − R| ≤ ½·10⁻³·|R|. */
    private static void fourDigits(double ours, String quantity) {
        double expected = r.get(quantity);
        assertThat(Math.abs(ours - expected))
                .as("%s: printed %s, R (probit-10y1y-h12.csv) %s", quantity, ours, expected)
                .isLessThanOrEqualTo(0.5e-3 * Math.abs(expected));
    }

    /** The three numbers of a coefficient row of the text table: estimate, model-based s.e., Newey-West s.e. */
    private static double[] row(String out, String name) {
        for (String line : out.split("\n")) {
            String[] cells = line.strip().split("\\s+");
            if (cells.length == 4 && cells[0].equals(name)) {
                return new double[] {Double.parseDouble(cells[1]), Double.parseDouble(cells[2]), Double.parseDouble(cells[3])};
            }
        }
        throw new AssertionError("no row '" + name + "' in\n" + out);
    }

    /** What the command prints last: the fit as a policy's 'probability' section, from its first comment line to the end. */
    private static String policyBlock(String out) {
        int from = out.indexOf("# The fit as a policy's 'probability' section");
        assertThat(from).as("a policy block in\n%s", out).isNotNegative();
        return out.substring(from);
    }

    /** Pasted as printed, below the 'watch' part of a policy that watches 10Y-1Y. */
    private static SpreadProbabilityModel pasted(String block) throws PolicyException {
        Policy policy = PolicyParser.parse("pasted.yaml", "watch:\n  - spread: 10Y-1Y\n    confirm: [quarter-average]\n" + block);
        return policy.probability().forSpread("10Y-1Y").orElseThrow();
    }

    /** The printed value is the fitted one to the printed precision, six significant digits. */
    private static void sixDigits(double printed, double fitted, String what) {
        double halfUnit = 0.5 * Math.pow(10, Math.floor(Math.log10(Math.abs(fitted))) - 5);
        assertThat(Math.abs(printed - fitted)).as("%s: printed %s, fitted %s", what, printed, fitted).isLessThanOrEqualTo(halfUnit * (1 + 1e-9));
    }

    /*
     * The block printed after the report, pasted into a policy as it is (no re-indenting), parses with the
     * policy parser and gives back the fitted coefficients and covariance to the printed precision (checked
     * against the same fit's JSON), which are R's to four digits (probit-10y1y-h12.csv).
     */
    @Test
    void thePrintedBlockPastedIntoAPolicyGivesTheFittedCoefficientsBack() throws Exception {
        CliRun text = fit(history);
        assertThat(text.exitCode()).as(text.err()).isZero();
        String block = policyBlock(text.out());
        assertThat(text.out().indexOf("not investment advice")).as("the block comes after the report and its caution")
                .isLessThan(text.out().indexOf(block));
        SpreadProbabilityModel m = pasted(block);

        JsonNode j = new ObjectMapper().readTree(fit(history, "--json").out());
        sixDigits(m.model().alpha(), j.get("coefficients").get(0).get("estimate").asDouble(), "alpha");
        sixDigits(m.model().beta(), j.get("coefficients").get(1).get("estimate").asDouble(), "beta");
        JsonNode nw = j.get("standard_errors").get("covariance_newey_west");
        sixDigits(m.covariance().varAlpha(), nw.get("var_alpha").asDouble(), "var-alpha");
        sixDigits(m.covariance().covAlphaBeta(), nw.get("cov_alpha_beta").asDouble(), "cov-alpha-beta");
        sixDigits(m.covariance().varBeta(), nw.get("var_beta").asDouble(), "var-beta");
        fourDigits(m.model().alpha(), "alpha");
        fourDigits(m.model().beta(), "beta");
        fourDigits(Math.sqrt(m.covariance().varAlpha()), "se_alpha_newey_west");
        fourDigits(Math.sqrt(m.covariance().varBeta()), "se_beta_newey_west");
        assertThat(m.horizonMonths()).isEqualTo(12);
        assertThat(m.model().provenance()).as("what it was fitted on").isEqualTo("slopewatch fit on us-cmt-monthly-1953-1999.csv (curve "
                + "us-cmt-monthly-1953-1999), 1953-04 to 1998-09, 546 months, recession 12 months ahead per us-business-cycle-dates.csv");

        // with --covariance model, the block carries the model-based covariance the bands then rest on
        SpreadProbabilityModel modelBased = pasted(policyBlock(fit(history, "--covariance", "model").out()));
        fourDigits(Math.sqrt(modelBased.covariance().varAlpha()), "se_alpha_model");
        fourDigits(Math.sqrt(modelBased.covariance().varBeta()), "se_beta_model");
    }

    /*
     * The pasted block makes the daemon show R's 90 % Newey-West band at a spread of -1 pp
     * (probit-10y1y-h12.csv, band90_newey_west_*_at_m1).
     */
    @Test
    void thePrintedBlockGivesTheDaemonRsBand() throws Exception {
        SpreadProbabilityModel m = pasted(policyBlock(fit(history).out()));
        LiveProbability live = LiveProbability.of(m.model(), m.covariance(), m.horizonMonths(), YearMonth.of(2026, 1), -100.0, 21, true);
        fourDigits(live.probability(), "p_at_m1");
        fourDigits(live.band().lower(), "band90_newey_west_lower_at_m1");
        fourDigits(live.band().upper(), "band90_newey_west_upper_at_m1");
    }

    @Test
    void thePrintedCoefficientsAndBothStandardErrorsAreRs() {
        CliRun run = fit(history);
        assertThat(run.exitCode()).as(run.err()).isZero();
        String out = run.out();
        double[] alpha = row(out, "alpha");
        double[] beta = row(out, "beta");
        fourDigits(alpha[0], "alpha");
        fourDigits(alpha[1], "se_alpha_model");
        fourDigits(alpha[2], "se_alpha_newey_west");
        fourDigits(beta[0], "beta");
        fourDigits(beta[1], "se_beta_model");
        fourDigits(beta[2], "se_beta_newey_west");
        assertThat(out).as("both columns, labelled, with the kernel and lag convention")
                .contains("s.e. model-based").contains("s.e. Newey-West")
                .contains("Bartlett kernel, weights 1 - l/(L+1) for lags l = 0..L, L = 12 calendar months");
        // R script header: "sample: 1953-04 to 1998-09", n = 546, 77 months with a recession 12 months ahead
        assertThat(out).contains("sample     1953-04 to 1998-09: 546 months, 77 with y = 1");
        assertThat(out).contains("McFadden pseudo-R2").contains("Estrella (1998) R2").contains("P = 50% at spread");
        assertThat(out).as("the caution under the report").contains("not investment advice");
    }

    @Test
    void theJsonReportParsesAndCarriesRsNumbers() throws IOException {
        CliRun run = fit(history, "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode j = new ObjectMapper().readTree(run.out());
        assertThat(j.get("sample").get("months").asInt()).isEqualTo(r.get("n").intValue());
        assertThat(j.get("sample").get("recession_ahead_months").asInt()).isEqualTo(r.get("recession_ahead_months").intValue());
        assertThat(j.get("sample").get("first_month").asText()).isEqualTo("1953-04");
        assertThat(j.get("sample").get("last_month").asText()).isEqualTo("1998-09");
        JsonNode alpha = j.get("coefficients").get(0);
        JsonNode beta = j.get("coefficients").get(1);
        assertThat(alpha.get("name").asText()).isEqualTo("alpha");
        assertThat(beta.get("name").asText()).isEqualTo("beta");
        fourDigits(alpha.get("estimate").asDouble(), "alpha");
        fourDigits(alpha.get("se_model_based").asDouble(), "se_alpha_model");
        fourDigits(alpha.get("se_newey_west").asDouble(), "se_alpha_newey_west");
        fourDigits(beta.get("estimate").asDouble(), "beta");
        fourDigits(beta.get("se_model_based").asDouble(), "se_beta_model");
        fourDigits(beta.get("se_newey_west").asDouble(), "se_beta_newey_west");
        assertThat(j.get("standard_errors").get("newey_west_lag_months").asInt()).as("lag = horizon by default").isEqualTo(12);
        fourDigits(j.get("log_likelihood").asDouble(), "log_likelihood");
        fourDigits(j.get("null_log_likelihood").asDouble(), "null_log_likelihood");
        // McFadden (1974) and Estrella (1998) definitions applied to R's log-likelihoods
        double ll = r.get("log_likelihood");
        double ll0 = r.get("null_log_likelihood");
        assertThat(j.get("mcfadden_r2").asDouble()).isCloseTo(1 - ll / ll0, within(1e-6));
        assertThat(j.get("estrella_r2").asDouble()).isCloseTo(1 - Math.pow(ll / ll0, -(2.0 / r.get("n")) * ll0), within(1e-6));
        assertThat(j.get("spread_at_even_odds_pct").asDouble()).isCloseTo(-r.get("alpha") / r.get("beta"), within(1e-5));
        assertThat(j.get("caution").asText()).contains("not investment advice");

        // Default bands: Newey-West, 90 %, at -2..3 pp; R gives -1, 0 and 1.
        JsonNode bands = j.get("bands");
        assertThat(bands.get("level").asDouble()).isEqualTo(0.90);
        assertThat(bands.get("covariance").asText()).contains("Newey-West");
        assertThat(bands.get("rows")).extracting(b -> b.get("spread_pct").asDouble()).containsExactly(-2.0, -1.0, 0.0, 1.0, 2.0, 3.0);
        for (JsonNode b : bands.get("rows")) {
            String tag = bandTag(b.get("spread_pct").asDouble());
            if (tag != null) {
                fourDigits(b.get("probability").asDouble(), "p_at_" + tag);
                fourDigits(b.get("lower").asDouble(), "band90_newey_west_lower_at_" + tag);
                fourDigits(b.get("upper").asDouble(), "band90_newey_west_upper_at_" + tag);
            }
        }
    }

    @Test
    void modelBasedBandsAndAChosenGridFollowTheOptions() throws IOException {
        CliRun run = fit(history, "--json", "--covariance", "model", "--grid=-1,0,1");
        assertThat(run.exitCode()).as(run.err()).isZero();
        JsonNode rows = new ObjectMapper().readTree(run.out()).get("bands").get("rows");
        assertThat(rows).hasSize(3);
        for (JsonNode b : rows) {
            String tag = bandTag(b.get("spread_pct").asDouble());
            fourDigits(b.get("lower").asDouble(), "band90_model_lower_at_" + tag);
            fourDigits(b.get("upper").asDouble(), "band90_model_upper_at_" + tag);
        }
    }

    private static String bandTag(double spread) {
        return spread == -1.0 ? "m1" : spread == 0.0 ? "0" : spread == 1.0 ? "1" : null;
    }

    /** Months a to b (YYYY-MM, inclusive) of the reference file, unchanged, as a file of their own. */
    private Path slice(String name, String from, String to) throws IOException {
        List<String> lines = Files.readAllLines(history);
        List<String> out = new ArrayList<>(List.of(lines.get(0)));
        for (String line : lines.subList(1, lines.size())) {
            String month = line.substring(0, 7);
            if (month.compareTo(from) >= 0 && month.compareTo(to) <= 0) {
                out.add(line);
            }
        }
        Path file = dir.resolve(name);
        Files.write(file, out);
        return file;
    }

    @Test
    void aLongFileWithSeveralCurvesNeedsTheCurveNamed() throws IOException {
        // the reference yields in the long layout under the name H15, beside a second curve holding only 1Y
        List<String> lines = Files.readAllLines(history);
        List<String> header = List.of(lines.get(0).split(","));
        List<String> out = new ArrayList<>(List.of("date,curve,tenor,yield"));
        for (String line : lines.subList(1, lines.size())) {
            String[] f = line.split(",");
            for (int i = 1; i < f.length; i++) {
                out.add(f[0] + ",H15," + header.get(i) + "," + f[i]);
            }
            out.add(f[0] + ",OTHER,1Y," + f[1]);
        }
        Path file = dir.resolve("long.csv");
        Files.write(file, out);
        CliRun ambiguous = fit(file);
        assertThat(ambiguous.exitCode()).isEqualTo(2);
        assertThat(ambiguous.err()).contains("the file holds several curves (H15, OTHER); name the one to fit");
        CliRun named = fit(file, "--curve", "H15");
        assertThat(named.exitCode()).as(named.err()).isZero();
        fourDigits(row(named.out(), "alpha")[0], "alpha");
        fourDigits(row(named.out(), "beta")[2], "se_beta_newey_west");
        CliRun unknown = fit(file, "--curve", "GOVT-Z");
        assertThat(unknown.exitCode()).isEqualTo(2);
        assertThat(unknown.err()).contains("no curve 'GOVT-Z' in the file (curves: H15, OTHER)");
    }

    @Test
    void aMissingFileExits1() {
        CliRun run = fit(dir.resolve("nope.csv"));
        assertThat(run.exitCode()).isEqualTo(1);
        assertThat(run.err()).contains("slopewatch fit: no such file: " + dir.resolve("nope.csv"));
        assertThat(run.out()).isEmpty();
    }

    @Test
    void aSpreadThatIsNotASpreadOrNotInTheFileExits2() {
        CliRun banana = CliRun.of("fit", history.toString(), "--spread", "banana", "--recessions", recessions.toString(),
                "--horizon-months", "12");
        assertThat(banana.exitCode()).isEqualTo(2);
        assertThat(banana.err()).contains("slopewatch fit: unknown spread 'banana'");
        // the reference file has 1Y, 3Y, 5Y and 10Y only (its header)
        CliRun noBill = CliRun.of("fit", history.toString(), "--spread", "10Y-3M", "--recessions", recessions.toString(),
                "--horizon-months", "12");
        assertThat(noBill.exitCode()).isEqualTo(2);
        assertThat(noBill.err()).contains("spread 10Y-3M cannot be computed on any of the 558 dates")
                .contains("the file quotes 1Y, 3Y, 5Y, 10Y");
        assertThat(noBill.out()).isEmpty();
    }

    @Test
    void perfectSeparationIsNamedNotFitted() throws IOException {
        // 1989-08..1998-11 of the reference file: the 8 months with a recession 12 months ahead (the
        // 1990-07 peak) all have 10Y-1Y <= 0.36 pp and every other month >= 0.38 pp (computed from the file)
        CliRun run = fit(slice("separated.csv", "1989-08", "1998-11"));
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.err()).contains("cannot fit 10Y-1Y").contains("(separation)").contains("perfect separation")
                .doesNotContain("Exception").doesNotContain("\tat ");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void aSampleWithoutARecessionAheadIsASingleClass() throws IOException {
        // 1962-01..1966-12: targets 1963-01..1966-12, between the 1961-02 trough and the 1969-12 peak
        // (NBER dates, from memory), so no month has a recession 12 months ahead
        CliRun run = fit(slice("expansion.csv", "1962-01", "1966-12"));
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.err()).contains("(single class)").contains("none of the 48 months has a recession 12 months ahead");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void tooFewMonthsIsAnError() throws IOException {
        // 24 months of data leave 12 with a known target; the fit needs max(24, lag 12 + 3)
        CliRun run = fit(slice("short.csv", "1953-04", "1955-03"));
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.err()).contains("(too few months)").contains("only 12 months with a known target");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void aNotANumberYieldStopsAtItsLine() throws IOException {
        Path file = slice("nan.csv", "1970-01", "1979-12");
        List<String> lines = new ArrayList<>(Files.readAllLines(file));
        lines.set(4, lines.get(4).replaceAll(",[^,]*$", ",NaN")); // line 5: 1970-04, the 10Y column
        Files.write(file, lines);
        CliRun run = fit(file);
        assertThat(run.exitCode()).isEqualTo(2);
        int column = lines.get(4).lastIndexOf(',') + 2; // the last field, 10Y, begins after the last comma
        assertThat(run.err()).contains(file + ":5:" + column + ": 10Y: yield is not a finite number: NaN");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void aFileThatIsNotCsvStopsAtItsLineAndColumn() throws IOException {
        Path file = slice("quoted.csv", "1970-01", "1979-12");
        List<String> lines = new ArrayList<>(Files.readAllLines(file));
        int comma = lines.get(2).lastIndexOf(',');
        lines.set(2, lines.get(2).substring(0, comma + 1) + "\"" + lines.get(2).substring(comma + 1) + "\"%"); // line 3: text after a closing quote
        Files.write(file, lines);
        CliRun run = fit(file);
        assertThat(run.exitCode()).as(run.err()).isEqualTo(2);
        // the quoted field begins after the last comma; the % follows its closing quote
        int column = comma + 2 + lines.get(2).substring(comma + 1).length() - 1;
        assertThat(run.err()).contains(file + ":3:" + column + ": text after the closing quote of a field: '%'");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void badOptionsExit2WithTheirReason() {
        CliRun covariance = fit(history, "--covariance", "sandwich");
        assertThat(covariance.exitCode()).isEqualTo(2);
        assertThat(covariance.err()).contains("unknown covariance 'sandwich' (known: model, newey-west)");
        CliRun lag = fit(history, "--lag", "-1");
        assertThat(lag.exitCode()).isEqualTo(2);
        assertThat(lag.err()).contains("Newey-West lag must be 0 or more months");
        CliRun noRecessions = CliRun.of("fit", history.toString(), "--spread", "10Y-1Y", "--horizon-months", "12");
        assertThat(noRecessions.exitCode()).isEqualTo(2);
        assertThat(noRecessions.err()).contains("--recessions");
    }
}
