package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.slopewatch.rules.SpreadProbabilityModel.Averaging;

/** The {@code probability} part of a policy: models per watched spread, and every mistake at its position. */
class ProbabilitySectionTest {

    /** Lines 1-5; the probability section starts on line 6. */
    private static final String WATCH = """
            watch:
              - spread: 10Y-3M
                confirm: [quarter-average]
              - spread: 10Y-2Y
                confirm: [quarter-average]
            """;

    /** One model in block style: 'probability:' on line 6, the spread on line 7, its keys from line 8 at column 5. */
    private static String model(String spread, String... keys) {
        StringBuilder b = new StringBuilder(WATCH).append("probability:\n  ").append(spread).append(":\n");
        for (String k : keys) {
            b.append("    ").append(k).append('\n');
        }
        return b.toString();
    }

    private static String problems(String yaml) {
        PolicyException e = catchThrowableOfType(PolicyException.class, () -> PolicyParser.parse("p.yaml", yaml));
        assertThat(e).as("expected the policy to be rejected:%n%s", yaml).isNotNull();
        return e.getMessage();
    }

    @Test
    void theShippedPolicyCarriesTheEstrellaTrubinModelFor10Y3M() throws IOException, PolicyException {
        Policy p = PolicyParser.parse("default.yaml", Files.readString(Path.of("alert-rules/default.yaml")));
        assertThat(p.probability().spreads()).containsExactly("10Y-3M");
        SpreadProbabilityModel m = p.probability().forSpread("10Y-3M").orElseThrow();
        // Estrella and Trubin (2006), as given in the shared data README's published values (from memory):
        // alpha = -0.5333, beta = -0.6330, 10-year minus 3-month, twelve months ahead
        assertThat(m.model().alpha()).isEqualTo(-0.5333);
        assertThat(m.model().beta()).isEqualTo(-0.6330);
        assertThat(m.horizonMonths()).isEqualTo(12);
        assertThat(m.average()).isEqualTo(Averaging.MONTHLY);
        assertThat(m.model().provenance()).contains("Estrella and Trubin (2006)").endsWith("(from memory)");
    }

    @Test
    void aValidSectionParsesWithMonthlyAveragingByDefault() throws PolicyException {
        Policy p = PolicyParser.parse("p.yaml", WATCH + """
                probability:
                  10Y-2Y: { alpha: -0.81, beta: -0.94, horizon-months: 6, source: "desk fit 1990-2024" }
                  10Y-3M:
                    alpha: -0.5333
                    beta: -0.633
                    horizon-months: 12
                    average: monthly
                    source: published
                """);
        assertThat(p.probability().spreads()).containsExactly("10Y-2Y", "10Y-3M");
        SpreadProbabilityModel twoYear = p.probability().forSpread("10Y-2Y").orElseThrow();
        assertThat(twoYear.average()).isEqualTo(Averaging.MONTHLY);
        assertThat(twoYear.horizonMonths()).isEqualTo(6);
        assertThat(twoYear.model().provenance()).isEqualTo("desk fit 1990-2024");
        assertThat(PolicyParser.parse("p.yaml", WATCH).probability().size()).as("the section is optional").isZero();
    }

    @Test
    void aCovarianceGivesTheModelABand() throws PolicyException {
        // the Newey-West covariance of the 10Y-1Y fit on the bundled H.15 data, as ./slopewatch fit prints it
        Policy p = PolicyParser.parse("p.yaml", model("10Y-3M", "alpha: -0.8097", "beta: -0.9407", "horizon-months: 12", "source: fit",
                "covariance: { var-alpha: 0.0357, cov-alpha-beta: -0.0301, var-beta: 0.0642 }"));
        SpreadProbabilityModel m = p.probability().forSpread("10Y-3M").orElseThrow();
        assertThat(m.covariance().varAlpha()).isEqualTo(0.0357);
        assertThat(m.covariance().covAlphaBeta()).isEqualTo(-0.0301);
        assertThat(m.covariance().varBeta()).isEqualTo(0.0642);
        assertThat(PolicyParser.parse("p.yaml", model("10Y-3M", "alpha: -0.5", "beta: -0.6", "horizon-months: 12", "source: paper"))
                .probability().forSpread("10Y-3M").orElseThrow().covariance()).as("optional").isNull();
    }

    static Stream<Arguments> badSections() {
        String[] ok = {"alpha: -0.5", "beta: -0.6", "horizon-months: 12", "source: paper"};
        return Stream.of(
                Arguments.of("unknown key", model("10Y-3M", ok[0], ok[1], ok[2], ok[3], "gamma: 1"),
                        "p.yaml:12:5: unknown key 'gamma' in the probability model for 10Y-3M (known: alpha, beta, horizon-months, average, source, covariance)"),
                Arguments.of("text for a number", model("10Y-3M", "alpha: high", ok[1], ok[2], ok[3]),
                        "p.yaml:8:12: 'alpha' must be a number, got 'high'"),
                Arguments.of("fraction for whole months", model("10Y-3M", ok[0], ok[1], "horizon-months: 12.5", ok[3]),
                        "p.yaml:10:21: 'horizon-months' must be a whole number, got '12.5'"),
                Arguments.of("negative horizon", model("10Y-3M", ok[0], ok[1], "horizon-months: -3", ok[3]),
                        "p.yaml:10:21: 'horizon-months' must be 0 or more, got -3"),
                Arguments.of("list for text", model("10Y-3M", ok[0], ok[1], ok[2], "source: [a, b]"),
                        "p.yaml:11:13: 'source' must be a non-empty text value"),
                Arguments.of("infinite alpha", model("10Y-3M", "alpha: .inf", ok[1], ok[2], ok[3]),
                        "p.yaml:8:12: 'alpha' must be a finite number, got '.inf'"),
                Arguments.of("not-a-number beta", model("10Y-3M", ok[0], "beta: .nan", ok[2], ok[3]),
                        "p.yaml:9:11: 'beta' must be a finite number, got '.nan'"),
                Arguments.of("overflowing beta", model("10Y-3M", ok[0], "beta: -1e999", ok[2], ok[3]),
                        "p.yaml:9:11: 'beta' must be a finite number, got '-1e999'"),
                Arguments.of("missing source", model("10Y-3M", ok[0], ok[1], ok[2]),
                        "p.yaml:8:5: the probability model for 10Y-3M needs 'source'"),
                Arguments.of("empty source", model("10Y-3M", ok[0], ok[1], ok[2], "source: \"\""),
                        "p.yaml:11:13: 'source' must be a non-empty text value"),
                Arguments.of("missing beta", model("10Y-3M", ok[0], ok[2], ok[3]),
                        "p.yaml:8:5: the probability model for 10Y-3M needs 'beta'"),
                Arguments.of("unknown average", model("10Y-3M", ok[0], ok[1], ok[2], ok[3], "average: daily"),
                        "p.yaml:12:14: unknown average 'daily' (known: monthly)"),
                Arguments.of("spread not watched", model("10Y-1Y", ok),
                        "p.yaml:7:3: unknown spread '10Y-1Y' in 'probability': not watched by this policy (watched: 10Y-3M, 10Y-2Y)"),
                Arguments.of("model not a mapping", WATCH + "probability:\n  10Y-3M: -0.5\n",
                        "p.yaml:7:11: the probability model for 10Y-3M must be a mapping of keys to values"),
                Arguments.of("section not a mapping", WATCH + "probability: [10Y-3M]\n",
                        "p.yaml:6:14: 'probability' must be a mapping of keys to values"),
                Arguments.of("covariance with a negative variance",
                        model("10Y-3M", ok[0], ok[1], ok[2], ok[3], "covariance: { var-alpha: -0.01, cov-alpha-beta: 0, var-beta: 0.01 }"),
                        "p.yaml:12:17: 'covariance' is not a covariance matrix"),
                Arguments.of("covariance that is not positive semi-definite",
                        model("10Y-3M", ok[0], ok[1], ok[2], ok[3], "covariance: { var-alpha: 0.01, cov-alpha-beta: 0.02, var-beta: 0.01 }"),
                        "p.yaml:12:17: 'covariance' is not a covariance matrix"),
                Arguments.of("covariance missing a term",
                        model("10Y-3M", ok[0], ok[1], ok[2], ok[3], "covariance: { var-alpha: 0.01, var-beta: 0.01 }"),
                        "p.yaml:12:17: the covariance of 10Y-3M needs 'cov-alpha-beta'"),
                Arguments.of("spread twice", model("10Y-3M", ok) + "  10Y-3M: { alpha: 1, beta: 1, horizon-months: 1, source: x }\n",
                        "p.yaml:12:3: key '10Y-3M' appears twice in 'probability'"));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("badSections")
    void aBadSectionIsReportedAtItsPosition(String name, String yaml, String expected) {
        assertThat(problems(yaml)).contains(expected);
    }

    @Test
    void aProbabilityRuleOnASpreadWithoutAModelIsReportedAtTheSpread() {
        String message = problems(model("10Y-3M", "alpha: -0.5", "beta: -0.6", "horizon-months: 12", "source: paper") + """
                alerts:
                  - name: odds
                    when: { probability-above: 0.5 }
                    spreads: [10Y-3M, 10Y-2Y]
                    severity: warning
                    channels: [log]
                """);
        assertThat(message).contains("p.yaml:15:23: 'probability-above' needs a probability model for spread '10Y-2Y': add one"
                + " under 'probability' (models: 10Y-3M)");
    }

    @Test
    void aProbabilityRuleOnEveryWatchedSpreadNeedsAModelForEach() {
        String message = problems(model("10Y-3M", "alpha: -0.5", "beta: -0.6", "horizon-months: 12", "source: paper") + """
                alerts:
                  - { name: odds, when: { probability-above: 0.5 }, severity: warning, channels: [log] }
                """);
        assertThat(message).contains("p.yaml:13:25: 'probability-above' applies to every watched spread, but 10Y-2Y has no"
                + " probability model: list 'spreads' or add models under 'probability' (models: 10Y-3M)");
        assertThat(problems(WATCH + """
                alerts:
                  - { name: odds, when: { probability-above: 0.5 }, severity: warning, channels: [log] }
                """)).as("no section at all").contains("but 10Y-3M, 10Y-2Y have no probability model").contains("(models: none)");
    }

    @Test
    void aProbabilityRuleOnModelledSpreadsIsAccepted() throws PolicyException {
        Policy p = PolicyParser.parse("p.yaml", model("10Y-3M", "alpha: -0.5", "beta: -0.6", "horizon-months: 12", "source: paper") + """
                alerts:
                  - { name: odds, when: { probability-above: 0.5 }, spreads: [10Y-3M], severity: warning, channels: [log] }
                  - { name: curve-low, when: { spread-below-bp: -50 }, spreads: [10Y-2Y], severity: info, channels: [log] }
                """);
        assertThat(p.alerts()).extracting(AlertRule::name).containsExactly("odds", "curve-low");
        assertThat(p.alerts().get(0).when()).isEqualTo(new AlertTrigger.ProbabilityAbove(0.5));
    }
}
