package org.slopewatch.history;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;

/**
 * A charset the sender names (HTTP's {@code Content-Type: text/csv; charset=…}, RFC 9110 section 8.3)
 * is how the bytes are read, unless a byte-order mark says otherwise: the WHATWG Encoding
 * Standard's "decode" lets the mark win, since the producer of the bytes wrote it.
 */
class HistoryCsvReaderCharsetTest {

    private static List<CurveSnapshot> read(byte[] bytes, Charset charset) throws Exception {
        List<CurveSnapshot> out = new ArrayList<>();
        HistoryCsvReader.read("test.csv", new ByteArrayInputStream(bytes), charset,
                new HistoryCsvReader.Options("GOVT-A", YieldUnit.PERCENT, YieldBounds.DEFAULT), out::add, () -> { });
        return out;
    }

    @Test
    void aNamedCharsetIsReadInsteadOfUtf8() throws Exception {
        // é is E9 in ISO-8859-1 (its code table), a byte that cannot stand alone in UTF-8 (RFC 3629 section 3)
        byte[] latin1 = "date,curve,tenor,yield,note\n2026-04-01,GOVT-A,10Y,4.2,caf\u00e9\n".getBytes(StandardCharsets.ISO_8859_1);
        assertThat(read(latin1, StandardCharsets.ISO_8859_1)).extracting(s -> s.asMap().toString()).containsExactly("{10Y=420.0}");
        // "2026-04-01,GOVT-A,10Y,4.2,caf" is 29 characters
        assertThat(HistoryCsvReaderFormatTest.refusal(latin1)).startsWith("test.csv:2:30: not UTF-8 text: the byte 0xE9");
    }

    @Test
    void aByteOrderMarkWinsOverTheNamedCharset() throws Exception {
        List<CurveSnapshot> plain = read("date,10Y\n2026-04-01,4.2\n".getBytes(StandardCharsets.UTF_8), StandardCharsets.UTF_8);
        // UTF-8 with its mark, labelled ISO-8859-1 (as REST Assured labels a text body by default): read as UTF-8
        assertThat(read("\uFEFFdate,10Y\n2026-04-01,4.2\n".getBytes(StandardCharsets.UTF_8), StandardCharsets.ISO_8859_1)).isEqualTo(plain);
        assertThat(read("\uFEFFdate,10Y\n2026-04-01,4.2\n".getBytes(StandardCharsets.UTF_16BE), StandardCharsets.ISO_8859_1)).isEqualTo(plain);
        assertThat(read("\uFEFFdate,10Y\n2026-04-01,4.2\n".getBytes(StandardCharsets.UTF_16LE), StandardCharsets.UTF_8)).isEqualTo(plain);
    }
}
