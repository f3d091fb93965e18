package org.slopewatch.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.slopewatch.curve.CurveSnapshot;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.curve.YieldUnit;

/**
 * Every way a history file can fail to be CSV text is reported as {@code file:line:column: what}
 * (both from 1), never as an exception of the CSV library, and a file in the forms spreadsheets and
 * other systems write (byte-order mark, CR LF, CR) is read. The grammar is RFC 4180, section 2
 * (rules 5 to 7 on quoting; its TEXTDATA holds no control character); the text is UTF-8 as RFC 3629
 * defines it (section 3's table of well-formed sequences; section 6 on the byte-order mark EF BB BF).
 * Every expected column is counted by hand in the comment beside it.
 */
class HistoryCsvReaderFormatTest {

    private static final HistoryCsvReader.Options OPTIONS = new HistoryCsvReader.Options("GOVT-A", YieldUnit.PERCENT, YieldBounds.DEFAULT);

    /** The file as the replay reads one: UTF-8 unless a byte-order mark says otherwise. */
    static List<CurveSnapshot> read(byte[] bytes) throws IOException, HistoryFormatException {
        List<CurveSnapshot> out = new ArrayList<>();
        HistoryCsvReader.read("test.csv", new ByteArrayInputStream(bytes), OPTIONS, out::add, () -> { });
        return out;
    }

    private static List<CurveSnapshot> read(String text) throws IOException, HistoryFormatException {
        return read(text.getBytes(StandardCharsets.UTF_8));
    }

    static String refusal(byte[] bytes) {
        try {
            read(bytes);
        } catch (HistoryFormatException e) {
            assertThat(e.getMessage()).as("the message is source:line:column: problem").matches("(?s)test\\.csv:\\d+:\\d+: .+");
            return e.getMessage();
        } catch (IOException e) {
            throw new AssertionError("an I/O failure for a byte array: " + e, e);
        }
        throw new AssertionError("read without complaint");
    }

    private static String refusal(String text) {
        return refusal(text.getBytes(StandardCharsets.UTF_8));
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', quoteCharacter = '`', value = {
            // RFC 4180 rule 7: inside a quoted field a quote is doubled; anything else after the closing quote breaks the record.
            // "2026-04-01,GOVT-A,10Y," is 22 characters, "\"4.2\"" columns 23 to 27, x at 28
            "text after closing quote  | date,curve,tenor,yield\\n2026-04-01,GOVT-A,10Y,\"4.2\"x\\n | test.csv:2:28: text after the closing quote of a field: 'x'",
            // the first field {"curve":"GOVT-A" is columns 1 to 17 (a quote inside an unquoted field is data), the comma 18,
            // "tenor" 19 to 25, the colon 26
            "JSON sent as CSV          | {\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-02\",\"yield\":4.215} | test.csv:1:26: text after the closing quote of a field: ':'",
            "pretty JSON sent as CSV   | {\\n  \"curve\": \"GOVT-A\"\\n}\\n | test.csv:1:1: missing column 'date' in header '{'; the text looks like JSON, not CSV",
            // RFC 4180 rule 5/6: a quote opens a field that must be closed; this one, at 3:23, never is
            "quote never closed        | date,curve,tenor,yield\\n2026-04-01,GOVT-A,10Y,4.2\\n2026-04-02,GOVT-A,10Y,\"4.3\\n | test.csv:3:23: this quote opens a field that is never closed",
            // a quoted field spanning lines 2 and 3: the next record starts on line 4; "bad" at 22 + 1
            "line counted in quotes    | date,curve,tenor,yield,note\\n2026-04-01,GOVT-A,10Y,4.2,\"two\\nlines\"\\n2026-04-02,GOVT-A,10Y,bad,x\\n | test.csv:4:23: unparsable number 'bad' for 10Y",
            // "" inside quotes is one quote, so the field closes at the third quote; the value "4""2" is not a number
            "doubled quote is data     | date,10Y\\n2026-04-01,\"4\"\"2\"\\n | test.csv:2:12: unparsable number '4\"2' for 10Y",
            // columns count characters, the euro sign one (3 bytes in UTF-8) and an emoji one (4 bytes, a surrogate pair in Java):
            // "2026-04-02," 1 to 11, the two characters 12 and 13, ",GOVT-A,10Y," 14 to 25, x at 26
            "columns in characters     | date,note,curve,tenor,yield\\n2026-04-01,€😀,GOVT-A,10Y,4.2\\n2026-04-02,€😀,GOVT-A,10Y,x | test.csv:3:26: unparsable number 'x' for 10Y",
            "too many fields           | date,3M,10Y\\n2026-04-01,4.2,4.3,4.4\\n | test.csv:2:20: expected 3 fields as in the header, found 4",
            // placed where the missing field would begin: after "2026-04-01,4.2" (14 characters)
            "too few fields            | date,3M,10Y\\n2026-04-01,4.2\\n | test.csv:2:15: expected 3 fields as in the header, found 2",
            "date column twice         | date,date,3M\\n2026-04-01,2026-04-01,4.2\\n | test.csv:1:6: column 'date' appears twice in the header",
            "yield column twice        | date,curve,tenor,yield,yield\\n2026-04-01,GOVT-A,10Y,4.2,4.3\\n | test.csv:1:24: column 'yield' appears twice in the header",
            "tenor twice in header     | date,3M,10Y,3m\\n2026-04-01,4.2,4.3,4.4\\n | test.csv:1:13: tenor 3M appears twice in the header",
            "unknown tenor in header   | date,3M,10X\\n2026-04-01,4.2,4.3\\n | test.csv:1:9: unknown tenor '10X'",
            "dates out of order        | date,10Y\\n2026-04-02,4.2\\n2026-04-01,4.3\\n | test.csv:3:1: dates out of order: 2026-04-01 after 2026-04-02",
            "empty file                | `` | test.csv:1:1: empty file",
            "only empty lines          | \\n\\n\\n | test.csv:1:1: empty file",
            "a header and nothing else | date,3M,10Y\\n | test.csv:2:1: no quotes: nothing follows the header",
            "every value missing       | date,10Y\\n2026-04-01,NA\\n2026-04-02,\\n | test.csv:4:1: no quotes: every value of the 2 rows is missing",
    })
    void aFileThatIsNotReadableCsvIsRefusedAtItsLineAndColumn(String name, String text, String expected) {
        assertThat(refusal(text.replace("\\n", "\n"))).startsWith(expected);
    }

    @Test
    void aControlCharacterIsRefusedWhereItIsNotReadAsWhiteSpace() {
        // Java's Double.parseDouble drops characters up to U+0020 around a number, so "4.2\0" would read as 4.2
        // "2026-04-01,GOVT-A,10Y,4.2" is 25 characters: the NUL is at 26
        assertThat(refusal("date,curve,tenor,yield\n2026-04-01,GOVT-A,10Y,4.2\0\n")).startsWith("test.csv:2:26: control character U+0000");
        assertThat(refusal("date,10Y\n2026-04-01,4.2\u0007\n")).startsWith("test.csv:2:15: control character U+0007");
        // C1 controls (U+0080 to U+009F) are controls too (Unicode general category Cc)
        assertThat(refusal("date,10Y\n2026-04-01,4.2\u0085\n")).startsWith("test.csv:2:15: control character U+0085");
        // tab is text: a padded cell reads
        assertThat(assertRead("date,10Y\n2026-04-01,\t4.2\t\n")).hasSize(1);
    }

    @Test
    void bytesThatAreNotUtf8AreRefusedAtTheirPlace() {
        // RFC 3629 section 3: C4 starts a two-byte sequence and must be followed by 80..BF, not a comma
        byte[] latin1 = "date,curve,tenor,yield,note\n2026-04-01,GOVT-A,10Y,4.2,caf\u00e9,x\n".getBytes(StandardCharsets.ISO_8859_1);
        // "2026-04-01,GOVT-A,10Y,4.2,caf" is 29 characters: the byte E9 is at 30
        assertThat(refusal(latin1)).startsWith("test.csv:2:30: not UTF-8 text: the byte 0xE9");
        // RFC 3629 section 3: C0 is never part of well-formed UTF-8 (an overlong form)
        assertThat(refusal(new byte[] {'d', 'a', 't', 'e', ',', (byte) 0xC0, (byte) 0xAF})).startsWith("test.csv:1:6: not UTF-8 text: the byte 0xC0");
        // a three-byte sequence (E2 82 AC is the euro sign) cut off by the end of the file
        assertThat(refusal(new byte[] {'d', 'a', 't', 'e', ',', '1', '0', 'Y', '\n', '2', '0', '2', '6', '-', '0', '1', '-', '0', '2', ',',
                (byte) 0xE2, (byte) 0x82})).startsWith("test.csv:2:12: not UTF-8 text: the bytes 0xE2 0x82");
        // a binary file: the PNG signature (89 50 4E 47 0D 0A 1A 0A, ISO/IEC 15948 section 5.2)
        assertThat(refusal(new byte[] {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1A, '\n'})).startsWith("test.csv:1:1: not UTF-8 text: the byte 0x89");
    }

    @Test
    void utf16WithAByteOrderMarkIsReadAndWithoutOneRefused() throws Exception {
        // a UTF-16 byte-order mark (FF FE little-endian, FE FF big-endian) names the charset, as in the WHATWG
        // Encoding Standard's "decode"
        List<CurveSnapshot> plain = read("date,10Y\n2026-04-01,4.2\n");
        assertThat(read("\uFEFFdate,10Y\n2026-04-01,4.2\n".getBytes(StandardCharsets.UTF_16LE))).isEqualTo(plain);
        assertThat(read("\uFEFFdate,10Y\n2026-04-01,4.2\n".getBytes(StandardCharsets.UTF_16BE))).isEqualTo(plain);
        // without a mark, UTF-16 read as UTF-8 has a zero byte after every ASCII character: the first is at 1:2
        byte[] without = "date,10Y\n2026-04-01,4.2\n".getBytes(StandardCharsets.UTF_16LE);
        assertThat(refusal(without)).startsWith("test.csv:1:2: control character U+0000").contains("UTF-16");
    }

    @Test
    void aByteOrderMarkCrLfAndCrAreReadAsSpreadsheetsWriteThem() throws Exception {
        List<CurveSnapshot> plain = assertRead("date,3M,10Y\n2026-04-01,5.0,4.2\n2026-04-02,5.1,4.3\n");
        assertThat(plain).hasSize(2);
        // RFC 3629 section 6: EF BB BF at the start is the byte-order mark, not part of the header's first name
        assertThat(assertRead("\uFEFFdate,3M,10Y\n2026-04-01,5.0,4.2\n2026-04-02,5.1,4.3\n")).isEqualTo(plain);
        // RFC 4180 rule 1: CRLF ends a line
        assertThat(assertRead("date,3M,10Y\r\n2026-04-01,5.0,4.2\r\n2026-04-02,5.1,4.3\r\n")).isEqualTo(plain);
        assertThat(assertRead("\uFEFFdate,3M,10Y\r2026-04-01,5.0,4.2\r2026-04-02,5.1,4.3")).isEqualTo(plain);
        // positions after a mark and CR LF: the mark takes no column, CR LF is one line break
        assertThat(refusal("\uFEFFdate,10Y\r\n2026-04-01,4.2\r\n2026-04-02,y\r\n")).startsWith("test.csv:3:12: unparsable number 'y'");
        // a mark in the middle of a file is no mark: it is part of the date
        assertThat(refusal("date,10Y\n\uFEFF2026-04-01,4.2\n")).startsWith("test.csv:2:1: unparsable date");
    }

    @Test
    void aLineLongerThanTheLimitIsRefusedWhereItPassesIt() {
        int limit = 65_536; // CsvText.MAX_LINE
        String longLine = "2026-04-01," + "1".repeat(limit);
        assertThat(refusal("date,10Y\n" + longLine + "\n")).startsWith("test.csv:2:" + (limit + 1) + ": line longer than 65,536 characters");
        // a line of exactly the limit is read (here it holds an unparsable number, which says it got that far)
        String atLimit = "2026-04-01," + "x".repeat(limit - 11);
        assertThat(refusal("date,10Y\n" + atLimit + "\n")).startsWith("test.csv:2:12: unparsable number 'xxxx");
    }

    @Test
    void aQuotedFieldLongerThanTheParserHoldsIsPlacedAtItsQuote() {
        // a quote opened at 2:23 and never closed over 1,200 lines of 1,000 characters: the parser gives up past 1 MiB
        StringBuilder csv = new StringBuilder("date,curve,tenor,yield\n2026-04-01,GOVT-A,10Y,\"");
        for (int i = 0; i < 1_200; i++) {
            csv.append("x".repeat(1_000)).append('\n');
        }
        assertThat(refusal(csv.toString())).startsWith("test.csv:2:23: this quote opens a field longer than 1,048,576 characters");
    }

    @Test
    void theParsersOwnLimitsArePlacedAtTheRecord() {
        // more fields than the parser keeps, in one record made of two lines joined by a quoted line break
        String manyFields = "date,curve,tenor,yield\n2026-04-01,GOVT-A,10Y,4.2" + ",".repeat(40_000) + "\"\n\"" + ",".repeat(40_000) + "\n";
        assertThat(refusal(manyFields)).startsWith("test.csv:2:1: the CSV parser refused this record: ")
                .contains("surpassed the maximum limit of 65537 fields");
        // a record longer than the parser keeps: two quoted fields of 600,000 characters each, over lines of 1,000
        String field = ("y".repeat(999) + "\n").repeat(600);
        String longRecord = "date,curve,tenor,yield,a,b\n2026-04-01,GOVT-A,10Y,4.2,\"" + field + "\",\"" + field + "\"\n";
        assertThat(refusal(longRecord)).startsWith("test.csv:2:1: the CSV parser refused this record: ").contains("max record size");
    }

    @Test
    void aStreamThatFailsIsAnIoProblemNotABadFile() {
        InputStream failing = new InputStream() {
            @Override
            public int read() throws IOException {
                throw new IOException("disk gone");
            }

            @Override
            public int read(byte[] b, int off, int len) throws IOException {
                throw new IOException("disk gone");
            }
        };
        assertThatThrownBy(() -> HistoryCsvReader.read("test.csv", failing, OPTIONS, s -> { }, () -> { }))
                .isExactlyInstanceOf(IOException.class).hasMessageContaining("disk gone");
        InputStream broken = new InputStream() {
            @Override
            public int read() {
                throw new IllegalStateException("stream closed");
            }

            @Override
            public int read(byte[] b, int off, int len) {
                throw new IllegalStateException("stream closed");
            }
        };
        assertThatThrownBy(() -> HistoryCsvReader.read("test.csv", broken, OPTIONS, s -> { }, () -> { }))
                .isInstanceOf(IOException.class).hasMessageContaining("stream closed");
    }

    @Test
    void anErrorInsideTheParserIsNotPassedOffAsABadFile() {
        // FastCSV wraps whatever it meets while parsing in its CsvParseException; an Error must come out as itself
        InputStream exhausted = new InputStream() {
            @Override
            public int read() {
                throw new OutOfMemoryError("simulated");
            }

            @Override
            public int read(byte[] b, int off, int len) {
                throw new OutOfMemoryError("simulated");
            }
        };
        assertThatThrownBy(() -> HistoryCsvReader.read("test.csv", exhausted, OPTIONS, s -> { }, () -> { }))
                .isInstanceOf(OutOfMemoryError.class).hasMessage("simulated");
    }

    @Test
    void aRefusedFileHandsOnlyWhatCameBeforeItsProblemAndTheCallerDecides() throws Exception {
        // the reader streams; a caller that must take all or nothing (HTTP) collects until the read returns
        StringBuilder csv = new StringBuilder("date,10Y\n");
        for (int day = 0; day < 1_000; day++) {
            csv.append(java.time.LocalDate.of(2020, 1, 1).plusDays(day)).append(day == 499 ? ",4.2\"\n" : ",4.2\n");
        }
        List<CurveSnapshot> handed = new ArrayList<>();
        assertThatThrownBy(() -> HistoryCsvReader.read("test.csv", new ByteArrayInputStream(csv.toString().getBytes(StandardCharsets.UTF_8)),
                OPTIONS, handed::add, () -> { })).isInstanceOf(HistoryFormatException.class)
                .hasMessageStartingWith("test.csv:501:12: unparsable number '4.2\"' for 10Y");
        assertThat(handed).hasSize(499);
    }

    private static List<CurveSnapshot> assertRead(String text) {
        try {
            return read(text);
        } catch (IOException | HistoryFormatException e) {
            throw new AssertionError("refused: " + e.getMessage(), e);
        }
    }
}
