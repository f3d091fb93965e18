package org.slopewatch.cli;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Bad input stops the replay with {@code file:line:column: what is wrong} and exit code 2, and no report. */
class ReplayBadInputTest {

    @TempDir
    Path dir;

    private CliRun replay(String name, String content, String... extra) throws IOException {
        Path file = dir.resolve(name);
        Files.writeString(file, content);
        String[] args = new String[3 + extra.length];
        args[0] = "replay";
        args[1] = file.toString();
        args[2] = "--spread=10Y-2Y";
        System.arraycopy(extra, 0, args, 3, extra.length);
        return CliRun.of(args);
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', value = {
            "missing date column      | 2Y,10Y\\n4.1,4.0\\n                                   | :1:1: missing column 'date'",
            "missing long column      | date,curve,yield\\n2026-01-02,GOVT-A,4.1\\n              | :1:1: missing column 'tenor'",
            "unparsable number        | date,2Y,10Y\\n2026-01-02,4.1,4.0\\n2026-01-05,4.1,4.0x\\n | :3:16: unparsable number '4.0x' for 10Y",
            "too few fields           | date,2Y,10Y\\n2026-01-02,4.1\\n                         | :2:15: expected 3 fields as in the header, found 2",
            "dates out of order       | date,2Y,10Y\\n2026-01-05,4.1,4.0\\n2026-01-02,4.2,4.0\\n | :3:1: dates out of order: 2026-01-02 after 2026-01-05",
            "duplicate date           | date,2Y,10Y\\n2026-01-05,4.1,4.0\\n2026-01-05,4.2,4.0\\n | :3:1: date 2026-01-05 appears twice",
            "unknown tenor in header  | date,2Y,10X\\n2026-01-05,4.1,4.0\\n                     | :1:9: unknown tenor '10X'",
            "unknown tenor in a row   | date,curve,tenor,yield\\n2026-01-05,GOVT-A,2Y,4.1\\n2026-01-05,GOVT-A,11Q,4.0\\n | :3:19: unknown tenor '11Q'",
            "unparsable date          | date,2Y,10Y\\n05/01/2026,4.1,4.0\\n                     | :2:1: unparsable date '05/01/2026'",
            "basis points as percent  | date,2Y,10Y\\n2026-01-05,410,400\\n                      | :2:12: 2Y: implausible yield 410.0 percent",
            "long file out of order   | date,curve,tenor,yield\\n2026-01-05,GOVT-A,2Y,4.1\\n2026-01-02,GOVT-A,10Y,4.0\\n | :3:1: dates out of order",
            "second quote same day    | date,curve,tenor,yield\\n2026-01-05,GOVT-A,2Y,4.1\\n2026-01-05,GOVT-A,2Y,4.2\\n | :3:19: second quote for GOVT-A 2Y on 2026-01-05",
            // sorted by curve and then date: GOVT-B's rows come after GOVT-A's later dates, and its own go back at line 5
            "a curve going back       | date,curve,tenor,yield\\n2026-01-05,GOVT-A,2Y,4.1\\n2026-01-02,GOVT-B,2Y,4.0\\n2026-01-05,GOVT-B,2Y,4.1\\n2026-01-02,GOVT-B,10Y,4.0\\n | :5:1: dates out of order: 2026-01-02 after 2026-01-05",
            "second quote rows apart  | date,curve,tenor,yield\\n2026-01-05,GOVT-A,2Y,4.1\\n2026-01-02,GOVT-B,2Y,4.0\\n2026-01-05,GOVT-A,2y,4.2\\n | :4:19: second quote for GOVT-A 2Y on 2026-01-05",
            // "2026-01-05,GOVT-A,10Y,4.0," is 26 characters: the basis starts at 27
            "discount basis on a note | date,curve,tenor,yield,basis\\n2026-01-05,GOVT-A,10Y,4.0,discount\\n | :2:27: discount basis applies to bills up to 52W, not 10Y",
            "unknown basis in heading | date,2Y,10Y:bey\\n2026-01-05,4.1,4.0\\n                 | :1:9: unknown basis 'bey' (accepted: bond-equivalent, discount)",
            "empty file               | ''                                                    | :1:1: empty file",
            // RFC 4180 section 2: after a closing quote comes a comma or the end of the line ("4.0" quoted at columns 16 to 20)
            "text after closing quote | date,2Y,10Y\\n2026-01-05,4.1,\"4.0\"x\\n                   | :2:21: text after the closing quote of a field: 'x'",
            "quote never closed       | date,2Y,10Y\\n2026-01-05,4.1,4.0\\n2026-01-06,4.1,\"4.0\\n | :3:16: this quote opens a field that is never closed",
            "control character        | date,2Y,10Y\\n2026-01-05,4.1,4.0\u0000\\n                | :2:19: control character U+0000",
            "JSON, not CSV            | {\"curve\":\"GOVT-A\",\"tenor\":\"10Y\"}                    | :1:26: text after the closing quote of a field: ':'",
            "a header and no row      | date,2Y,10Y                                           | :1:12: no quotes: nothing follows the header",
    })
    void badInputStopsWithFileLineAndExitCode2(String name, String content, String message) throws IOException {
        CliRun run = replay("history.csv", content.replace("\\n", "\n").strip());
        assertThat(run.exitCode()).as(run.err()).isEqualTo(2);
        assertThat(run.err()).startsWith(dir.resolve("history.csv") + ":").contains(message.strip());
        assertThat(run.out()).as("no partial report").isEmpty();
    }

    @Test
    void bytesThatAreNotUtf8StopTheReplayAtTheirPlace() throws IOException {
        Path file = dir.resolve("latin1.csv");
        // RFC 3629 section 3: the Latin-1 byte E9 (é) followed by a comma is not well-formed UTF-8
        Files.write(file, "date,curve,tenor,yield,note\n2026-01-05,GOVT-A,2Y,4.1,caf\u00e9\n".getBytes(StandardCharsets.ISO_8859_1));
        CliRun run = CliRun.of("replay", file.toString(), "--spread=10Y-2Y");
        assertThat(run.exitCode()).as(run.err()).isEqualTo(2);
        assertThat(run.err()).startsWith(file + ":2:29: not UTF-8 text: the byte 0xE9");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void aFileAsSpreadsheetsSaveItIsReadLikeAPlainOne() throws IOException {
        String plain = "date,2Y,10Y\n2026-01-02,4.1,4.0\n2026-01-05,4.2,4.0\n2026-01-06,4.3,4.1\n";
        CliRun expected = replay("plain.csv", plain, "--json");
        assertThat(expected.exitCode()).as(expected.err()).isZero();
        // a UTF-8 byte-order mark (RFC 3629 section 6) and CR LF line ends (RFC 4180 section 2, rule 1)
        CliRun saved = replay("plain.csv", "\uFEFF" + plain.replace("\n", "\r\n"), "--json");
        assertThat(saved.exitCode()).as(saved.err()).isZero();
        assertThat(saved.out()).isEqualTo(expected.out());
    }

    @Test
    void aSpreadWhoseLegsAreNotInTheFileIsAnErrorNotAnEmptyReport() throws IOException {
        CliRun run = replay("history.csv", "date,1Y,10Y\n2026-01-02,4.1,4.0\n");
        assertThat(run.exitCode()).isEqualTo(2);
        assertThat(run.err()).contains("none of the watched spreads (10Y-2Y) could be computed");
        assertThat(run.out()).isEmpty();
    }

    @Test
    void unknownSpreadAndPersistenceTestAreUsageErrors() throws IOException {
        CliRun badSpread = CliRun.of("replay", dir.resolve("x.csv").toString(), "--spread", "10Y+2Y");
        assertThat(badSpread.exitCode()).isEqualTo(2);
        assertThat(badSpread.err()).contains("unknown spread '10Y+2Y'");
        CliRun badTest = replay("h.csv", "date,2Y,10Y\n2026-01-02,4.1,4.0\n", "--persistence", "weekly-average");
        assertThat(badTest.exitCode()).isEqualTo(2);
        assertThat(badTest.err()).contains("unknown persistence test 'weekly-average'");
    }

    @Test
    void aMissingFileIsReportedWithExitCode1() {
        CliRun run = CliRun.of("replay", dir.resolve("absent.csv").toString(), "--spread", "10Y-2Y");
        assertThat(run.exitCode()).isEqualTo(1);
        assertThat(run.err()).contains("no such file").contains("absent.csv");
    }

    @Test
    void missingValuesAreSkippedNotErrors() throws IOException {
        CliRun run = replay("h.csv", "date,2Y,10Y\n2026-01-02,4.1,4.0\n2026-01-05,,4.0\n2026-01-06,ND,4.0\n2026-01-07,4.3,4.1\n", "--json");
        assertThat(run.exitCode()).as(run.err()).isZero();
        assertThat(run.out()).contains("\"observations\" : 2");
    }
}
