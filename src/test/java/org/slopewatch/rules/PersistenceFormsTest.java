package org.slopewatch.rules;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.slopewatch.monitor.DaysInverted;
import org.slopewatch.monitor.QuarterAverage;
import org.slopewatch.monitor.RollingAverage;
import org.slopewatch.monitor.ShareInverted;

/**
 * The textual forms of a persistence test ({@code replay --persistence}, and a policy's confirm
 * items), read by {@link PersistenceForms#parse}: what each gives, and how a bad one is refused.
 * Where the two ways of writing a test must agree, see {@code cli.ReplayPersistenceFormsTest}.
 */
class PersistenceFormsTest {

    private static final String FORMS = "(expected quarter-average, days-inverted:DAYS, rolling-average:DAYS or share-inverted:DAYS:SHARE)";

    @Test
    void eachFormGivesItsTestWithTheEntryThresholdWhereItHasNone() {
        // the forms and their meaning as docs/replay.md lists them: quarter-average and rolling-average take the entry threshold
        assertThat(PersistenceForms.parse("quarter-average", -7)).isEqualTo(new QuarterAverage(-7));
        assertThat(PersistenceForms.parse("days-inverted:90", -7)).isEqualTo(new DaysInverted(90));
        assertThat(PersistenceForms.parse("rolling-average:180", -7)).isEqualTo(new RollingAverage(180, -7));
        assertThat(PersistenceForms.parse("share-inverted:120:0.8", -7)).isEqualTo(new ShareInverted(120, 0.8));
        // a share of 1 (every observation of the window below) is the upper bound, allowed (0 < share <= 1)
        assertThat(PersistenceForms.parse("share-inverted:60:1", 0)).isEqualTo(new ShareInverted(60, 1));
        // a shell may leave spaces around an argument
        assertThat(PersistenceForms.parse(" days-inverted:1 ", 0)).isEqualTo(new DaysInverted(1));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '"', value = {
            "weekly-average          | unknown persistence test 'weekly-average' " + FORMS,
            "\"\"                      | unknown persistence test '' " + FORMS,
            "Quarter-Average         | unknown persistence test 'Quarter-Average' " + FORMS,
            "days-inverted           | persistence test 'days-inverted': 'days-inverted' needs 'days' " + FORMS,
            "days-inverted:          | persistence test 'days-inverted:': 'days' must be a whole number, got '' " + FORMS,
            "days-inverted:x         | persistence test 'days-inverted:x': 'days' must be a whole number, got 'x' " + FORMS,
            "days-inverted:90:       | persistence test 'days-inverted:90:': 'days-inverted' is written days-inverted:DAYS " + FORMS,
            "days-inverted:90:1      | persistence test 'days-inverted:90:1': 'days-inverted' is written days-inverted:DAYS " + FORMS,
            "quarter-average:5       | persistence test 'quarter-average:5': 'quarter-average' is written quarter-average " + FORMS,
            "share-inverted:90       | persistence test 'share-inverted:90': 'share-inverted' needs 'share' (a fraction such as 0.8) " + FORMS,
            "share-inverted:90:x     | persistence test 'share-inverted:90:x': 'share' must be a number, got 'x' " + FORMS,
            // bounds: the words a policy's mapping spelling gets at the parameter (PolicyParserTest), after the text
            "days-inverted:0         | persistence test 'days-inverted:0': 'days' must be at least 1, got 0",
            "rolling-average:-3      | persistence test 'rolling-average:-3': 'days' must be at least 1, got -3",
            "share-inverted:90:1.5   | persistence test 'share-inverted:90:1.5': impossible threshold: 'share' must be above 0 and at most 1, got 1.5",
            "share-inverted:0:0      | persistence test 'share-inverted:0:0': 'days' must be at least 1, got 0; "
                    + "impossible threshold: 'share' must be above 0 and at most 1, got 0.0",
    })
    void aBadFormIsRefusedQuotingItAndListingTheForms(String text, String message) {
        assertThatThrownBy(() -> PersistenceForms.parse(text, 0)).isInstanceOf(IllegalArgumentException.class).hasMessage(message);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '"', value = {
            // YAML 1.2.2, 10.2.1.3 and 10.2.1.4, the JSON schema's integer -?(0|[1-9][0-9]*) and float
            // -?(0|[1-9][0-9]*)(\.[0-9]*)?([eE][-+]?[0-9]+)? (from memory): the schema a policy is read with, so a
            // number on the command line is written as a policy writes it
            "days-inverted:+90     | 'days' must be a whole number, got '+90'",
            "days-inverted:090     | 'days' must be a whole number, got '090'",
            "days-inverted:9e1     | 'days' must be a whole number, got '9e1'",
            "days-inverted:3000000000 | 'days' must be a whole number, got '3000000000'",
            "share-inverted:90:.8  | 'share' must be a number, got '.8'",
            "share-inverted:90:NaN | 'share' must be a number, got 'NaN'",
            "share-inverted:90:.nan | 'share' must be a finite number, got '.nan'",
            "share-inverted:90:0.8d | 'share' must be a number, got '0.8d'",
    })
    void numbersAreReadAsThePolicyReadsThem(String text, String problem) {
        assertThatThrownBy(() -> PersistenceForms.parse(text, 0)).hasMessage("persistence test '" + text + "': " + problem + " " + FORMS);
    }

    @Test
    void numbersThePolicyReadsAreAccepted() {
        // the same schema: a float with an exponent, an integer share
        assertThat(PersistenceForms.parse("share-inverted:90:8e-1", 0)).isEqualTo(new ShareInverted(90, 0.8));
        assertThat(PersistenceForms.parse("share-inverted:90:1", 0)).isEqualTo(new ShareInverted(90, 1.0));
    }

    @Test
    void aLongOrHostileTextIsQuotedAsAnExcerpt() {
        assertThatThrownBy(() -> PersistenceForms.parse("q".repeat(300), 0))
                .hasMessage("unknown persistence test '" + "q".repeat(200) + "…' (300 characters) " + FORMS);
        assertThatThrownBy(() -> PersistenceForms.parse("days-inverted:9\n0", 0))
                .hasMessage("persistence test 'days-inverted:9\\n0': 'days' must be a whole number, got '9\\n0' " + FORMS);
    }

    @Test
    void anEntryThresholdThatIsNotANumberIsRefused() {
        assertThatThrownBy(() -> PersistenceForms.parse("quarter-average", Double.NaN))
                .hasMessage("entry threshold must be a finite number, got NaN");
    }
}
