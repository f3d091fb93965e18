package org.slopewatch.abuse;

import static io.restassured.RestAssured.given;
import static org.assertj.core.api.Assertions.assertThat;
import static org.hamcrest.Matchers.containsString;
import static org.hamcrest.Matchers.equalTo;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import io.quarkus.test.common.http.TestHTTPResource;
import io.quarkus.test.junit.QuarkusTest;
import io.quarkus.test.junit.QuarkusTestProfile;
import io.quarkus.test.junit.TestProfile;
import io.restassured.RestAssured;
import io.restassured.config.EncoderConfig;
import io.restassured.http.ContentType;
import io.restassured.response.Response;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestMethodOrder;
import org.slopewatch.cli.SlopewatchMain;
import org.slopewatch.delivery.LogCapture;
import org.slopewatch.rules.Policy;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.rules.PolicyProblem;

/**
 * The bad-input corpus ({@code bench/faults/corpus}, expectations in its {@code expected-*.tsv})
 * against a running daemon: every quote file posted over HTTP is answered with the status, the
 * counts and the reasons listed for it, and what the answers say was taken is exactly what the
 * journal took, nothing more; every policy file gets its outcome, with the position and message
 * of its first problem, from the parser, from {@code vet-policy} and, for a few, from the live
 * reload, which rejects them while the policy in force keeps running, and from the what-if API; every
 * quiet period, acknowledgement and lift body gets its answer, and only the accepted ones are kept. Every answer
 * and every log line about bad input stays small and on one line. A policy whose hostile-looking
 * text is plain text is applied, and its alert carries that text as written, evaluated nowhere.
 * After all of it the daemon answers its health check and takes a good quote.
 *
 * <p>This is the short form that CI runs; {@code bench/faults/hostile-input.sh} posts the same
 * corpus to any running daemon (docs/reliability.md).
 */
@QuarkusTest
@TestProfile(HostileInputTest.Hostile.class)
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class HostileInputTest {

    static final Path CORPUS = Path.of("bench", "faults", "corpus");
    private static final ObjectMapper JSON = new ObjectMapper();
    /** A hang guard, not a speed target: the corpus takes a few seconds (docs/reliability.md has the figures). */
    private static final Duration HANG = Duration.ofSeconds(60);
    static Path policyFile;
    /** A reject's detail: what was wrong, with an excerpt of the input (at most 200 characters) and its length. */
    private static final int MAX_DETAIL = 500;
    /** An answer about a bad input: at most a hundred problems of a few hundred characters each. */
    private static final int MAX_ANSWER = 128 * 1024;
    /** A log record as the console writes it. */
    private static final int MAX_LOG_LINE = 2_000;

    @TestHTTPResource("/api/quotes")
    URI quotes;

    /** A journal and a policy file of their own (a copy of the shipped policy), no timed reload: the test reloads by hand. */
    public static final class Hostile implements QuarkusTestProfile {

        @Override
        public Map<String, String> getConfigOverrides() {
            Path dir = Path.of(".", "target", "test-data", "hostile-" + UUID.randomUUID().toString().substring(0, 8));
            try {
                Files.createDirectories(dir);
                policyFile = dir.resolve("policy.yaml");
                Files.copy(Path.of("alert-rules/default.yaml"), policyFile);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            Map<String, String> config = new LinkedHashMap<>();
            config.put("slopewatch.data-dir", dir.toString());
            config.put("slopewatch.ingest.policy", policyFile.toString());
            config.put("slopewatch.alerts.reload-check", "0s");
            return config;
        }
    }

    /** One line of expected-quotes.tsv: the body's file and the content type it is sent with, then the answer it must get. */
    record QuoteCase(String file, String contentType, String category, int status, int accepted, int duplicates, List<String> reasons,
                     String detail) {
        static QuoteCase of(String[] f) {
            return new QuoteCase(f[0], f[1], f[2], Integer.parseInt(f[3]), Integer.parseInt(f[4]), Integer.parseInt(f[5]),
                    f[6].equals("-") ? List.of() : List.of(f[6].split(",")), f[7]);
        }
    }

    /** One line of expected-policies.tsv. */
    record PolicyCase(String file, String category, boolean accepted, String position, String message) {
        static PolicyCase of(String[] f) {
            return new PolicyCase(f[0], f[1], f[2].equals("accepted"), f[3], f[4]);
        }
    }

    /** One line of expected-alerting.tsv. */
    record AlertCase(String file, String category, String request, int status, String error) {
        static AlertCase of(String[] f) {
            return new AlertCase(f[0], f[1], f[2], Integer.parseInt(f[3]), f[4]);
        }
    }

    @Test
    @Order(1)
    void everyQuoteFileIsAnsweredWithItsReasonAndOnlyWhatWasAcceptedIsJournalled() throws IOException {
        List<QuoteCase> cases = table("expected-quotes.tsv").stream().map(QuoteCase::of).toList();
        assertThat(cases).as("the corpus is read").hasSizeGreaterThan(60);
        double acceptedBefore = metric("slopewatch_quotes_accepted_total");
        double rejectedBefore = metric("slopewatch_quotes_rejected_total");
        int rejectRowsBefore = given().get("/api/rejects?limit=10000").then().statusCode(200).extract().jsonPath().getList("$").size();

        List<String> wrong = new ArrayList<>();
        int accepted = 0;
        int journalledRejects = 0;
        for (QuoteCase c : cases) {
            byte[] body = Files.readAllBytes(CORPUS.resolve(c.file()));
            // the content type exactly as the table gives it: REST Assured would otherwise add charset=ISO-8859-1 to a text type
            Response r = assertTimeoutPreemptively(HANG, () -> given().config(RestAssured.config().encoderConfig(EncoderConfig.encoderConfig()
                    .appendDefaultContentCharsetToContentTypeIfUndefined(false))).contentType(c.contentType()).body(body).post("/api/quotes"));
            if (r.statusCode() >= 500) {
                wrong.add(c.file() + ": a server error, HTTP " + r.statusCode() + " " + shorten(r.asString()));
                continue;
            }
            JsonNode answer = JSON.readTree(r.asByteArray());
            List<String> reasons = new ArrayList<>();
            answer.get("errors").forEach(e -> reasons.add(e.get("reason").asText()));
            String first = reasons.isEmpty() ? "-" : answer.get("errors").get(0).get("detail").asText();
            answer.get("errors").forEach(e -> {
                if (e.get("detail").asText().length() > MAX_DETAIL) {
                    wrong.add(c.file() + ": a reject detail of " + e.get("detail").asText().length() + " characters: " + shorten(e.get("detail").asText()));
                }
            });
            if (!answer.get("processed").asBoolean()) {
                // embedded: every answer, a refusal of the whole body included, comes from the pipeline, which journals and counts it
                wrong.add(c.file() + ": answered without going through the pipeline: " + shorten(r.asString()));
            }
            if (r.statusCode() != c.status() || answer.get("accepted").asInt() != c.accepted()
                    || answer.get("duplicates").asInt() != c.duplicates()
                    || !reasons.equals(c.reasons()) || !(c.detail().equals("-") ? first.equals("-") : first.contains(c.detail()))) {
                wrong.add(c.file() + ": expected " + c + "\n    got HTTP " + r.statusCode() + " " + shorten(r.asString()));
            }
            accepted += answer.get("accepted").asInt();
            if (answer.get("processed").asBoolean()) {
                journalledRejects += answer.get("rejected").asInt();
            }
        }
        assertThat(wrong).as("files answered otherwise than expected-quotes.tsv says").isEmpty();

        int expectedAccepted = cases.stream().mapToInt(QuoteCase::accepted).sum();
        assertThat(accepted).isEqualTo(expectedAccepted);
        assertThat(metric("slopewatch_quotes_accepted_total") - acceptedBefore)
                .as("quote messages the journal took: exactly those the answers accepted, none from a hostile file").isEqualTo(expectedAccepted);
        assertThat(metric("slopewatch_quotes_rejected_total") - rejectedBefore).as("rejects counted").isEqualTo(journalledRejects);
        assertThat(given().get("/api/rejects?limit=10000").then().statusCode(200).extract().jsonPath().getList("$").size() - rejectRowsBefore)
                .as("rejects journalled, each with its reason").isEqualTo(journalledRejects);
        // every hostile variant of the plain quote is dated 2026-03-02 and was refused, so that date has no GOVT-A curve
        given().get("/api/curves/GOVT-A/2026-03-02").then().statusCode(404);
        given().get("/api/curves/GOVT-A/2026-03-04").then().statusCode(200).body("yields_bp.'10Y'", equalTo(420.0f));
    }

    @Test
    @Order(2)
    void oversizedRequestsAreRefusedWholeWith413() throws Exception {
        // past quarkus.http.limits.max-body-size (16M): refused on its Content-Length, before the body is sent
        // (a client sending on regardless meets a closed connection, hence Expect: 100-continue)
        long size = 17L << 20;
        HttpRequest.BodyPublisher body = HttpRequest.BodyPublishers.fromPublisher(HttpRequest.BodyPublishers.ofInputStream(
                () -> new java.io.ByteArrayInputStream(new byte[(int) size])), size);
        HttpResponse<String> refused = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).build().send(HttpRequest.newBuilder(quotes)
                .expectContinue(true).header("Content-Type", "application/json").POST(body).build(), HttpResponse.BodyHandlers.ofString());
        assertThat(refused.statusCode()).isEqualTo(413);
        // past slopewatch.ingest.max-batch (20,000): nothing of it is taken
        String many = "[" + String.join(",", java.util.Collections.nCopies(20_001,
                "{\"curve\":\"GOVT-A\",\"tenor\":\"10Y\",\"date\":\"2026-03-05\",\"yield\":4.2}")) + "]";
        given().contentType(ContentType.JSON).body(many).post("/api/quotes").then().statusCode(413)
                .body("errors[0].reason", equalTo("too-large")).body("errors[0].detail", containsString("20001 quote messages"));
        given().get("/api/curves/GOVT-A/2026-03-05").then().statusCode(404);
    }

    @Test
    @Order(3)
    void everyPolicyFileGetsItsOutcomeWithThePositionOfItsFirstProblem() throws IOException {
        // from the parser, and from the what-if API (POST /api/what-if with the file as its policy)
        List<PolicyCase> cases = table("expected-policies.tsv").stream().map(PolicyCase::of).toList();
        List<String> wrong = new ArrayList<>();
        for (PolicyCase c : cases) {
            byte[] bytes = Files.readAllBytes(CORPUS.resolve(c.file()));
            String outcome = assertTimeoutPreemptively(HANG, () -> outcome(c.file(), bytes));
            String expected = c.accepted() ? "accepted" : c.file() + ":" + c.position() + ": ";
            if (!outcome.startsWith(expected) || !c.accepted() && !outcome.contains(c.message())) {
                wrong.add(c.file() + ": expected " + expected + c.message() + "\n    got " + shorten(outcome));
            }
            // the same text as a what-if's policy: the same first problem, named 'policy', in a small answer, never a 5xx
            Response r = assertTimeoutPreemptively(HANG, () -> given().contentType(ContentType.JSON)
                    .body(Map.of("policy", new String(bytes, java.nio.charset.StandardCharsets.UTF_8))).post("/api/what-if"));
            String answer = r.asString();
            JsonNode problems = r.statusCode() == 400 ? JSON.readTree(answer).get("problems") : null;
            String first = problems == null || problems.isEmpty() ? "" : problems.get(0).asText();
            boolean blank = new String(bytes, java.nio.charset.StandardCharsets.UTF_8).isBlank();
            boolean asExpected = c.accepted() ? r.statusCode() == 202 || r.statusCode() == 429
                    // an empty policy is refused before it is parsed
                    : blank ? r.statusCode() == 400 && answer.contains("give the policy to try")
                    : r.statusCode() == 400 && first.startsWith("policy:" + c.position() + ": ") && first.contains(c.message());
            if (!asExpected || answer.length() > MAX_ANSWER) {
                wrong.add(c.file() + " as a what-if: expected " + (c.accepted() ? "202" : "400 policy:" + c.position() + ": " + c.message())
                        + " in at most " + MAX_ANSWER + " characters\n    got HTTP " + r.statusCode() + ", " + answer.length() + " characters: "
                        + shorten(answer));
            }
        }
        assertThat(wrong).as("files answered otherwise than expected-policies.tsv says").isEmpty();

        // larger than any policy anyone reviews: refused before any YAML is read
        String twoMegabytes = "# " + "x".repeat(2 << 20) + "\n" + Files.readString(Path.of("alert-rules/default.yaml"));
        assertThat(assertTimeoutPreemptively(HANG, () -> outcome("huge.yaml", twoMegabytes.getBytes(java.nio.charset.StandardCharsets.UTF_8))))
                .startsWith("huge.yaml:1:1: the policy is ").endsWith(" characters long; at most 1048576");
    }

    @Test
    @Order(4)
    void vetPolicyGivesTheSameAnswersAndExitCode2() throws IOException {
        List<PolicyCase> cases = table("expected-policies.tsv").stream().map(PolicyCase::of).toList();
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        Path dir = CORPUS.resolve("policies");
        int code = assertTimeoutPreemptively(HANG, () -> SlopewatchMain.execute(new PrintWriter(out), new PrintWriter(err), "vet-policy",
                dir.toString()));
        assertThat(code).as("exit code for files with problems").isEqualTo(2);
        for (PolicyCase c : cases) {
            String file = CORPUS.resolve(c.file()).toString();
            if (c.accepted()) {
                assertThat(out.toString()).contains(file + ": policy sound: ");
            } else {
                assertThat(err.toString()).as(c.file()).contains(file + ":" + c.position() + ": ").contains(c.message());
            }
        }
    }

    @Test
    @Order(5)
    void theLiveReloadRejectsHostileFilesWhileThePolicyInForceKeepsRunning() throws IOException {
        String original = Files.readString(policyFile);
        List<LogCapture.Line> lines;
        try (LogCapture logs = LogCapture.everything()) {
            for (String name : List.of("p19-billion-laughs.yaml", "p12-deep-flow-nesting.yaml", "p27-expression-in-message.yaml",
                    "p30-nul-escape-in-message.yaml", "p37-webhook-url-in-policy.yaml", "p39-aliases-of-a-long-text.yaml")) {
                PolicyCase c = table("expected-policies.tsv").stream().map(PolicyCase::of).filter(p -> p.file().endsWith(name)).findFirst()
                        .orElseThrow();
                Files.write(policyFile, Files.readAllBytes(CORPUS.resolve(c.file())));
                String detail = assertTimeoutPreemptively(HANG, () -> given().post("/api/policy/reload").then().statusCode(422)
                        .body("result", equalTo("rejected"))
                        .body("detail", containsString(policyFile + ":" + c.position() + ": "))
                        .body("detail", containsString(c.message())).extract().path("detail"));
                assertThat(detail.length()).as(name + ": the reload's answer").isLessThan(MAX_ANSWER);
            }
            lines = logs.lines();
        }
        // the rejections are logged, each record one line of a few hundred characters at most, whatever the file held
        assertThat(lines).anySatisfy(l -> assertThat(l.message()).contains("rejected"));
        assertThat(lines).allSatisfy(l -> assertThat(l.message()).doesNotContain("\n").doesNotContain("\r").hasSizeLessThan(MAX_LOG_LINE));
        Files.writeString(policyFile, original);
        given().post("/api/policy/reload").then().statusCode(200).body("result", equalTo("unchanged"));
    }

    @Test
    @Order(6)
    void textThatLooksLikeCodeIsSentAsWrittenAndEvaluatedNowhere() throws IOException {
        Files.write(policyFile, Files.readAllBytes(CORPUS.resolve("policies/p29-plain-text-that-looks-like-code.yaml")));
        given().post("/api/policy/reload").then().statusCode(200).body("result", equalTo("applied"));
        // GOVT-B's 10Y-3M goes below zero (the corpus left it at +30 to +40 bp in May): the first-inversion rule fires
        given().contentType(ContentType.JSON).body("""
                {"curve":"GOVT-B","date":"2026-05-07","yields":{"3M":4.60,"2Y":4.20,"10Y":4.45}}""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(1));
        String text = given().get("/api/alerts/first-inversion~GOVT-B:10Y-3M~2026-05-07~1").then().statusCode(200)
                .extract().path("alert.text");
        assertThat(text).startsWith("GOVT-B 10Y-3M went below zero (-15.0 bp) on 2026-05-07; see file:/etc/passwd, $HOME, ${HOME, "
                + "%s %n %x, <b>bold</b>, `id`, $(id)");
    }

    @Test
    @Order(7)
    void everyQuietPeriodAcknowledgementAndLiftIsCheckedBeforeAnythingIsKept() throws IOException {
        List<AlertCase> cases = table("expected-alerting.tsv").stream().map(AlertCase::of).toList();
        assertThat(cases).as("the corpus is read").hasSizeGreaterThan(30);
        // the notice of the previous test, and a quiet period of this test's own to lift
        String alert = "/api/alerts/first-inversion~GOVT-B:10Y-3M~2026-05-07~1";
        int acksBefore = given().get(alert).then().statusCode(200).extract().jsonPath().getList("alert.acks").size();
        long period = given().contentType(ContentType.JSON).body(Map.of("rule", "stale-feed", "lasts", "PT1H", "note", "to be lifted",
                "set_by", "ops")).post("/api/quiet-periods").then().statusCode(201).extract().jsonPath().getLong("id");
        int periodsBefore = given().get("/api/quiet-periods").then().statusCode(200).extract().jsonPath().getList("$").size();

        List<String> wrong = new ArrayList<>();
        int accepted = 0;
        for (AlertCase c : cases) {
            byte[] body = Files.readAllBytes(CORPUS.resolve(c.file()));
            Response r = assertTimeoutPreemptively(HANG, () -> switch (c.request()) {
                case "quiet-period" -> given().contentType(ContentType.JSON).body(body).post("/api/quiet-periods");
                case "ack" -> given().contentType(ContentType.JSON).body(body).post(alert + "/ack");
                default -> given().queryParam("lifted_by", JSON.readTree(body).get("lifted_by").asText()).delete("/api/quiet-periods/" + period);
            });
            JsonNode errorNode = r.asString().startsWith("{") ? JSON.readTree(r.asString()).get("detail") : null;
            String error = errorNode == null ? "" : errorNode.asText();
            if (r.statusCode() != c.status() || !c.error().equals("-") && !error.contains(c.error()) || r.asString().length() > MAX_ANSWER) {
                wrong.add(c.file() + ": expected " + c.status() + " " + c.error() + "\n    got HTTP " + r.statusCode() + " " + shorten(r.asString()));
            }
            accepted += c.request().equals("quiet-period") && c.status() == 201 ? 1 : 0;
        }
        // a note of a megabyte: refused by its length, which the answer states without repeating it
        Response huge = given().contentType(ContentType.JSON).body(Map.of("spread", "10Y-3M", "lasts", "PT1H",
                "note", "r".repeat(1 << 20), "set_by", "ops")).post("/api/quiet-periods");
        if (huge.statusCode() != 400 || huge.asString().length() > 200) {
            wrong.add("a note of 1048576 characters: expected a short 400\n    got HTTP " + huge.statusCode() + ", "
                    + huge.asString().length() + " characters: " + shorten(huge.asString()));
        }
        assertThat(wrong).as("quiet period, acknowledgement and lift bodies answered otherwise than expected-alerting.tsv says").isEmpty();

        // only what was accepted was kept, and the quiet period lifted is no longer active
        List<Map<String, Object>> periods = given().get("/api/quiet-periods").then().statusCode(200).extract().jsonPath()
                .getList("$");
        assertThat(periods).hasSize(periodsBefore + accepted);
        assertThat(periods).filteredOn(m -> ((Number) m.get("id")).longValue() == period).singleElement()
                .satisfies(m -> assertThat(m.get("active")).isEqualTo(false));
        assertThat(given().get(alert).then().statusCode(200).extract().jsonPath().getList("alert.acks")).hasSize(acksBefore + 1);
        assertThat(given().get("/api/quiet-periods").then().extract().asString() + given().get(alert).then().extract().asString())
                .doesNotContain("risk-officer").doesNotContain("forged");
    }

    @Test
    @Order(8)
    void afterAllOfItTheDaemonIsHealthyAndTakesAGoodQuote() {
        given().get("/q/health/live").then().statusCode(200);
        given().get("/q/health/ready").then().statusCode(200);
        given().contentType(ContentType.JSON).body("""
                {"curve":"GOVT-A","tenor":"10Y","date":"2026-03-09","yield":4.215,"id":"after-the-corpus"}""")
                .post("/api/quotes").then().statusCode(200).body("accepted", equalTo(1));
        given().get("/api/curves/GOVT-A/2026-03-09").then().statusCode(200).body("yields_bp.'10Y'", equalTo(421.5f));
    }

    /** "accepted", or the problems as the parser words them. */
    private static String outcome(String file, byte[] bytes) {
        try {
            Policy p = PolicyParser.parse(file, bytes);
            return "accepted: " + p.watches().size() + " watches";
        } catch (PolicyException e) {
            assertThat(e.problems()).as(file + ": at least one problem").isNotEmpty();
            PolicyProblem first = e.problems().get(0);
            return first.toString();
        }
    }

    static List<String[]> table(String name) throws IOException {
        return Files.readAllLines(CORPUS.resolve(name)).stream().filter(l -> !l.isBlank() && !l.startsWith("#"))
                .map(l -> l.split("\t", -1)).toList();
    }

    /** The sum of a Prometheus counter over all its tag values. */
    private static double metric(String name) {
        return given().get("/q/metrics").then().statusCode(200).extract().asString().lines()
                .filter(l -> l.startsWith(name + "{") || l.startsWith(name + " "))
                .mapToDouble(l -> Double.parseDouble(l.substring(l.lastIndexOf(' ') + 1))).sum();
    }

    private static String shorten(String s) {
        return s.length() > 400 ? s.substring(0, 400) + "…" : s;
    }
}
