package org.slopewatch.text;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** A kept text fits its column and holds no control character and no half of a surrogate pair; the message names the field only. */
class FieldTextTest {

    @Test
    void aTextThatFitsPasses() {
        assertThat(FieldText.problem("reason", "vendor maintenance 🚧 <b>é</b>", 400)).isNull();
        assertThat(FieldText.problem("reason", "r".repeat(400), 400)).isNull();
        assertThat(FieldText.problem("note", null, 400)).as("absent").isNull();
    }

    @Test
    void tooLongIsRefusedWithTheLengthNotTheText() {
        assertThat(FieldText.problem("reason", "r".repeat(1 << 20), 400)).isEqualTo("'reason' is 1048576 characters long; at most 400");
    }

    @Test
    void controlCharactersAndUnpairedSurrogatesAreRefused() {
        assertThat(FieldText.problem("by", "ops\nrisk", 100)).isEqualTo("'by' contains the control character U+000A");
        assertThat(FieldText.problem("by", "ops\u2028risk", 100)).isEqualTo("'by' contains the line separator U+2028");
        assertThat(FieldText.problem("by", "ops\tlead", 100)).isEqualTo("'by' contains the control character U+0009");
        assertThat(FieldText.problem("reason", "a\uD800b", 400)).isEqualTo("'reason' contains an unpaired surrogate U+D800");
        assertThat(FieldText.problem("reason", "a\uDC00", 400)).isEqualTo("'reason' contains an unpaired surrogate U+DC00");
    }
}
