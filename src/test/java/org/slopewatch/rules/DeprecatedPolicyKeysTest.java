package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.catchThrowableOfType;

import java.time.Duration;
import org.junit.jupiter.api.Test;

/**
 * The policy keys and stored notice kinds kept for one release under their old names
 * (vocabulary: deprecation path): an old key loads with a warning that names the new one, at the
 * old key's position, and means what the new key means; a stored old kind reads as the new one.
 */
class DeprecatedPolicyKeysTest {

    private static final String RULES = """
            watch:
              - spread: 10Y-3M
                confirm: [quarter-average]
            alerts:
              - name: inversion-confirmed
                when: { enters-state: CONFIRMED }
                severity: critical
                channels: [log]
            """;

    @Test
    void oldKeysLoadWithAWarningNamingTheNewKeyAndMeanTheSame() throws PolicyException {
        Policy old = PolicyParser.parse("old.yaml", RULES + "    repeat-every: 4h\n    resolve-notice: true\n");
        Policy renamed = PolicyParser.parse("new.yaml", RULES + "    standing-every: 4h\n    closing-notice: true\n");

        assertThat(old.alerts()).as("the same rules").isEqualTo(renamed.alerts());
        assertThat(old.alerts().get(0).standingEvery()).isEqualTo(Duration.ofHours(4));
        assertThat(old.alerts().get(0).closingNotice()).isTrue();
        assertThat(old.warnings()).extracting(PolicyProblem::toString).containsExactly(
                "old.yaml:9:5: 'repeat-every' is deprecated, write 'standing-every'",
                "old.yaml:10:5: 'resolve-notice' is deprecated, write 'closing-notice'");
        assertThat(renamed.warnings()).isEmpty();
    }

    @Test
    void anOldKeyWithItsNewNameIsTheSameKeyTwice() {
        PolicyException e = catchThrowableOfType(PolicyException.class,
                () -> PolicyParser.parse("p.yaml", RULES + "    repeat-every: 4h\n    standing-every: 1d\n"));
        assertThat(e.getMessage()).isEqualTo("p.yaml:10:5: key 'standing-every' appears twice in an alert rule");
    }

    @Test
    void aMistakeInAnOldKeysValueIsReportedAtItsPosition() {
        PolicyException e = catchThrowableOfType(PolicyException.class,
                () -> PolicyParser.parse("p.yaml", RULES + "    repeat-every: soon\n"));
        assertThat(e.getMessage()).startsWith("p.yaml:9:19: 'standing-every' must be a duration");
    }

    @Test
    void storedOldKindsReadAsTheNewOnes() {
        assertThat(Alert.Kind.fromStored("FIRING")).isEqualTo(Alert.Kind.OPENING);
        assertThat(Alert.Kind.fromStored("REPEAT")).isEqualTo(Alert.Kind.STANDING);
        assertThat(Alert.Kind.fromStored("RESOLVED")).isEqualTo(Alert.Kind.CLOSING);
        assertThat(Alert.Kind.fromStored("CLOSING")).isEqualTo(Alert.Kind.CLOSING);
        assertThat(Alert.Kind.OPENING.storedNames()).containsExactly("OPENING", "FIRING");
    }
}
