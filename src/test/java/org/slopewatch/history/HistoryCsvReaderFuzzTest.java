package org.slopewatch.history;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.nio.charset.StandardCharsets;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.testsupport.Gen;
import org.slopewatch.testsupport.PropertyCheck;

/**
 * Whatever bytes arrive, the reader either reads them or refuses them with a
 * {@link HistoryFormatException} at {@code line:column}; no other exception escapes (an HTTP 500,
 * a stack trace from replay). Valid files are mutated with what breaks CSV and text (quotes,
 * commas, line breaks, NUL, byte-order marks, bytes that are not UTF-8, cuts and splices), and
 * arbitrary bytes are read too. Seeded: a failure prints its seed and input; {@code -Dfuzz.tries=N}
 * runs more.
 */
class HistoryCsvReaderFuzzTest {

    private static final String[] VALID = {
            "date,3M,2Y,10Y\n2026-04-01,5.0,4.7,4.6\n2026-04-02,5.0,4.7,4.5\n",
            "date,curve,tenor,yield\n2026-04-01,GOVT-A,10Y,4.4\n2026-04-01,GOVT-A,2Y,4.7\n2026-04-02,GOVT-B,3M,\"5.1\"\n",
            "\uFEFFdate,curve,tenor,yield,note\r\n2026-04-01,GOVT-A,10Y,4.4,\"a, \"\"quoted\"\"\r\nnote\"\r\n",
    };
    private static final String[] PIECES = {"\"", "\"\"", ",", "\n", "\r", "\r\n", "\0", "\u0007", "\uFEFF", "é", "😀", "{\"curve\":", "NaN",
            "1e999", "2026-13-01", "7Q", " ", "\t", "date", "yield"};

    @Test
    void noExceptionButAPlacedRefusalEscapesTheReader() {
        int tries = PropertyCheck.fuzzTries(5_000);
        int[] refused = {0};
        Gen<byte[]> inputs = random -> random.nextInt(5) == 0 ? randomBytes(random) : mutated(random);
        PropertyCheck.forAll(tries, inputs, input -> {
            try {
                HistoryCsvReader.read("fuzz.csv", new ByteArrayInputStream(input),
                        new HistoryCsvReader.Options("GOVT-A", YieldUnit.PERCENT, YieldBounds.DEFAULT), s -> { }, () -> { });
            } catch (HistoryFormatException e) {
                refused[0]++;
                assertThat(e.getMessage()).as("input %s", show(input)).matches("(?s)fuzz\\.csv:\\d+:\\d+: .+");
                assertThat(e.line()).isPositive();
            } catch (java.io.IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
        });
        assertThat(refused[0]).as("most mutations break something").isGreaterThan(tries / 2);
    }

    private static byte[] randomBytes(SplittableRandom random) {
        byte[] b = new byte[random.nextInt(200)];
        random.nextBytes(b);
        return b;
    }

    private static byte[] mutated(SplittableRandom random) {
        StringBuilder text = new StringBuilder(VALID[random.nextInt(VALID.length)]);
        int mutations = 1 + random.nextInt(4);
        for (int m = 0; m < mutations; m++) {
            int at = random.nextInt(text.length() + 1);
            switch (random.nextInt(4)) {
                case 0 -> text.insert(at, PIECES[random.nextInt(PIECES.length)]);
                case 1 -> {
                    if (at < text.length()) {
                        text.deleteCharAt(at);
                    }
                }
                case 2 -> text.setLength(at);
                default -> text.insert(at, text.substring(random.nextInt(text.length() + 1 - Math.min(at, text.length())) / 2));
            }
        }
        byte[] utf8 = text.toString().getBytes(StandardCharsets.UTF_8);
        if (random.nextInt(6) != 0) {
            return utf8;
        }
        // a byte that is not UTF-8 somewhere
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        int at = random.nextInt(utf8.length + 1);
        out.write(utf8, 0, at);
        out.write(0x80 + random.nextInt(0x80));
        out.write(utf8, at, utf8.length - at);
        return out.toByteArray();
    }

    private static String show(byte[] input) {
        StringBuilder s = new StringBuilder("[");
        for (byte b : input) {
            s.append(String.format("%02X", b & 0xFF));
        }
        return s.append("] ").append(new String(input, StandardCharsets.UTF_8).replace("\n", "\\n").replace("\r", "\\r")).toString();
    }
}
