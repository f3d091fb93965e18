package org.slopewatch.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.slopewatch.curve.YieldBounds;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.Reject;
import org.slopewatch.testsupport.Gen;
import org.slopewatch.testsupport.PropertyCheck;

/**
 * The quote decoder answers anything it is sent: arbitrary text, arbitrary bytes read as UTF-8
 * (as the HTTP and Kafka edges read them) and valid quote messages mutated structurally (values
 * replaced by other JSON types and hostile values, fields removed, renamed, added or duplicated,
 * text cut or spliced). No exception escapes; every item comes back accepted or rejected with a
 * reason and a detail; and whatever is accepted is something the journal can keep as it is:
 * a market date from {@link QuoteDecoder#EARLIEST_DATE} to three days ahead, finite yields,
 * texts within the journal's column widths, free of NUL and of halves of surrogate pairs, and a
 * {@code time} within the years a timestamp column holds.
 *
 * <p>Each property runs 10,000 tries in the suite; {@code -Dfuzz.tries=N} runs more (see
 * docs/reliability.md). A failure prints the seed that makes its sample again ({@link PropertyCheck}).
 */
class QuoteDecoderFuzzTest {

    private static final LocalDate TODAY = LocalDate.of(2026, 6, 15);
    private static final int MAX_DAYS_AHEAD = 3;
    private static final ObjectMapper JSON = new ObjectMapper();
    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;
    private static final QuoteDecoder DECODER = new QuoteDecoder(new IngestRules(Set.of("GOVT-A", "GOVT-B"), YieldBounds.DEFAULT,
            MAX_DAYS_AHEAD, Clock.fixed(TODAY.atStartOfDay().toInstant(ZoneOffset.UTC), ZoneOffset.UTC)));

    private static final int TRIES = PropertyCheck.fuzzTries(10_000);

    @Test
    void arbitraryTextIsAnsweredItemByItem() {
        PropertyCheck.forAll(TRIES, texts(), QuoteDecoderFuzzTest::check);
    }

    @Test
    void arbitraryBytesAreAnsweredItemByItem() {
        PropertyCheck.forAll(TRIES, Gen.bytes(400), body -> check(new String(body, StandardCharsets.UTF_8)));
    }

    /** A valid message and what is done to it. */
    record Mutated(JsonNode valid, List<Mutation> mutations) {
    }

    @Test
    void mutatedQuoteMessagesAreAnsweredItemByItem() {
        Gen<JsonNode> messages = messages();
        Gen<List<Mutation>> mutations = mutations();
        PropertyCheck.forAll(TRIES, r -> new Mutated(messages.next(r), mutations.next(r)), m -> checkMutated(m.valid(), m.mutations()));
    }

    private static void checkMutated(JsonNode valid, List<Mutation> mutations) {
        JsonNode tree = valid.deepCopy();
        String body = null;
        for (Mutation m : mutations) {
            if (body == null && m.kind().structural) {
                tree = m.applyTo(tree);
            } else {
                body = m.applyTo(body == null ? tree.toString() : body);
            }
        }
        check(body == null ? tree.toString() : body);
    }

    /** The invariants, for any body. */
    private static void check(String body) {
        QuoteBatch batch = DECODER.decode("fuzz", body);
        assertThat(batch.size()).as("every body is answered: at least one item accepted or rejected").isPositive();
        for (Reject r : batch.rejects()) {
            assertThat(r.reason()).as("a reject has a reason").isNotNull();
            assertThat(r.detail()).as("a reject says what is wrong").isNotBlank();
            assertThat(r.item()).as("item position").isBetween(-1, batch.size() - 1);
        }
        for (QuoteMessage m : batch.messages()) {
            assertThat(Set.of("GOVT-A", "GOVT-B")).as("accepted curve").contains(m.curve());
            assertThat(m.date()).as("accepted market date of " + m)
                    .isAfterOrEqualTo(QuoteDecoder.EARLIEST_DATE).isBeforeOrEqualTo(TODAY.plusDays(MAX_DAYS_AHEAD));
            assertThat(m.yieldsBp()).as("accepted yields of " + m).isNotEmpty();
            for (double bp : m.yieldsBp().values()) {
                assertThat(Double.isFinite(bp)).as("finite yield in " + m).isTrue();
            }
            journalText(m.id(), 200, "id");
            journalText(m.source(), 200, "source");
            if (m.time() != null) {
                assertThat(m.time()).as("time within a timestamp column's years")
                        .isBetween(QuoteDecoder.EARLIEST_DATE.atStartOfDay().toInstant(ZoneOffset.UTC), Instant.parse("9999-12-31T23:59:59.999999999Z"));
            }
        }
    }

    private static void journalText(String text, int width, String field) {
        if (text != null) {
            assertThat(text.length()).as(field + " fits its journal column").isLessThanOrEqualTo(width);
            assertThat(text).as(field + " has no NUL (PostgreSQL text cannot hold one)").doesNotContain("\u0000");
            assertThat(text.codePoints().noneMatch(c -> c >= Character.MIN_SURROGATE && c <= Character.MAX_SURROGATE))
                    .as(field + " has no half of a surrogate pair (it would be stored as '?')").isTrue();
        }
    }

    // --- arbitrary input ---

    private static Gen<String> texts() {
        return Gen.oneOf(Gen.strings(300), Gen.strings("{}[]:,\"\\ -.eE0123456789tfnul\u0000NaIiy", 300));
    }

    // --- valid messages ---

    private static final List<String> TENORS = List.of("4W", "13W", "26W", "52W", "1M", "3M", "6M", "1Y", "2Y", "5Y", "7Y", "10Y", "20Y", "30Y");

    private static Gen<JsonNode> messages() {
        Gen<ObjectNode> item = Gen.oneOf(single(), snapshot());
        return Gen.oneOf(item.map(n -> (JsonNode) n), item.list(1, 4).map(items -> {
            ArrayNode array = NODES.arrayNode();
            items.forEach(array::add);
            return array;
        }));
    }

    private static Gen<ObjectNode> single() {
        Gen<ObjectNode> common = common();
        Gen<String> tenors = Gen.of(TENORS);
        Gen<Double> yields = yields();
        return r -> {
            ObjectNode node = common.next(r);
            node.put("tenor", tenors.next(r));
            node.put("yield", yields.next(r));
            return node;
        };
    }

    private static Gen<ObjectNode> snapshot() {
        Gen<ObjectNode> common = common();
        Gen<List<String>> tenorSets = Gen.subsetOf(TENORS, 1);
        Gen<Double> yields = yields();
        return r -> {
            ObjectNode node = common.next(r);
            ObjectNode values = node.putObject("yields");
            for (String t : tenorSets.next(r)) {
                values.put(t, yields.next(r));
            }
            return node;
        };
    }

    private static Gen<ObjectNode> common() {
        Gen<LocalDate> dates = Gen.ints(0, 9000).map(d -> TODAY.minusDays(d));
        Gen<String> curves = Gen.of("GOVT-A", "GOVT-B");
        Gen<String> units = Gen.of("", "percent", "bp", "decimal");
        Gen<String> bases = Gen.of("", "bond-equivalent");
        Gen<String> ids = Gen.alphanumeric(12);
        Gen<String> sources = Gen.of("", "desk-feed");
        Gen<String> times = Gen.of("", "2026-03-02T16:00:00Z");
        return r -> {
            ObjectNode node = NODES.objectNode();
            node.put("curve", curves.next(r));
            node.put("date", dates.next(r).toString());
            optional(node, "unit", units.next(r));
            optional(node, "basis", bases.next(r));
            optional(node, "id", ids.next(r));
            optional(node, "source", sources.next(r));
            optional(node, "time", times.next(r));
            return node;
        };
    }

    private static void optional(ObjectNode node, String field, String value) {
        if (!value.isEmpty()) {
            node.put(field, value);
        }
    }

    private static Gen<Double> yields() {
        return Gen.doubles(-4.9, 29.9, 3);
    }

    // --- mutations ---

    /** What a mutation does; structural ones work on the tree (before any text mutation), the others on the text. */
    enum Kind {
        REPLACE_VALUE(true), REMOVE_FIELD(true), RENAME_FIELD(true), ADD_FIELD(true), WRAP_IN_ARRAY(true),
        NEST_DEEP(false), TRUNCATE(false), DELETE_CHAR(false), INSERT_TEXT(false), DUPLICATE_FIELD(false), APPEND_TEXT(false);

        final boolean structural;

        Kind(boolean structural) {
            this.structural = structural;
        }
    }

    /**
     * One mutation: {@code where} picks the node or position (modulo what there is), {@code hostile}
     * the value or text put in.
     */
    record Mutation(Kind kind, int where, String hostile) {

        JsonNode applyTo(JsonNode root) {
            List<ObjectNode> objects = new ArrayList<>();
            collect(root, objects);
            switch (kind) {
                case WRAP_IN_ARRAY -> {
                    ArrayNode a = NODES.arrayNode();
                    a.add(root);
                    return a;
                }
                default -> {
                }
            }
            if (objects.isEmpty()) {
                return root;
            }
            ObjectNode target = objects.get(Math.floorMod(where, objects.size()));
            List<String> fields = new ArrayList<>();
            target.fieldNames().forEachRemaining(fields::add);
            String field = fields.isEmpty() ? "curve" : fields.get(Math.floorMod(where / 7, fields.size()));
            switch (kind) {
                case REPLACE_VALUE -> target.set(field, hostileNode(hostile));
                case REMOVE_FIELD -> target.remove(field);
                case RENAME_FIELD -> {
                    JsonNode v = target.remove(field);
                    target.set(hostile, v == null ? NODES.nullNode() : v);
                }
                default -> target.set(hostile, hostileNode(hostile));
            }
            return root;
        }

        String applyTo(String text) {
            int at = text.isEmpty() ? 0 : Math.floorMod(where, text.length());
            return switch (kind) {
                case TRUNCATE -> text.substring(0, at);
                case DELETE_CHAR -> text.isEmpty() ? text : text.substring(0, at) + text.substring(at + 1);
                case INSERT_TEXT -> text.substring(0, at) + hostile + text.substring(at);
                case DUPLICATE_FIELD -> {
                    // a second "field": value right after an opening brace
                    int brace = text.indexOf('{', at);
                    yield brace < 0 ? text : text.substring(0, brace + 1) + "\"" + fieldName(hostile) + "\":" + hostileJson(hostile) + ","
                            + text.substring(brace + 1);
                }
                case APPEND_TEXT -> text + hostile;
                case NEST_DEEP -> {
                    // as text: past a depth of 1,000 the tree could not even be written out
                    int depth = 1 + Math.floorMod(where, 1_200);
                    yield "[".repeat(depth) + text + "]".repeat(depth);
                }
                default -> text;
            };
        }

        private static void collect(JsonNode n, List<ObjectNode> out) {
            if (n instanceof ObjectNode o) {
                out.add(o);
            }
            n.elements().forEachRemaining(c -> collect(c, out));
        }

        private static String fieldName(String hostile) {
            List<String> fields = List.of("curve", "tenor", "date", "yield", "yields", "unit", "basis", "id", "source", "time");
            return fields.get(Math.floorMod(hostile.hashCode(), fields.size()));
        }
    }

    /** Hostile values: wrong types, extremes, odd dates, tenors and units, long and odd strings. */
    private static final List<String> HOSTILE = List.of("null", "true", "0", "-0.0", "1e308", "-1e308", "4.9e-324", "NaN", "Infinity",
            "-Infinity", "9223372036854775808", "123456789012345678901234567890", "\"\"", "\" \"", "\"\\u0000\"", "\"4.2\"", "[]", "{}",
            "[4.2]", "{\"3M\":4.2}", "{\"3M\":4.2,\"3m\":5.1}", "{\"12M\":4.2,\"1Y\":4.2}", "\"2026-02-30\"", "\"9999-12-31\"",
            "\"+999999999-12-31\"", "\"-999999999-01-01\"", "\"0000-01-01\"", "\"1582-10-10\"", "\"1583-01-01\"", "\"2026-6-1\"",
            "\"10y\"", "\"0M\"", "\"360M\"", "\" 3M \"", "\"1000W\"", "\"PERCENT\"", "\"bp\"", "\"decimal\"", "\"discount\"",
            "\"+999999999-12-31T23:59:59Z\"", "\"-999999999-01-01T00:00:00Z\"", "\"2026-03-02T16:00:00+01:00\"",
            "\"${jndi:ldap://example.invalid/a}\"", "\"\\ud800\"", "\"GOVT-A\\u0000\"", "\"GOVT-C\"", "LONG_STRING", "LONG_ID");

    private static JsonNode hostileNode(String hostile) {
        try {
            return JSON.readTree(hostileJson(hostile));
        } catch (Exception e) {
            return NODES.textNode(hostile); // NaN and Infinity are not JSON to a strict reader: put them in as text
        }
    }

    private static String hostileJson(String hostile) {
        return switch (hostile) {
            case "LONG_STRING" -> "\"" + "x".repeat(100_000) + "\"";
            case "LONG_ID" -> "\"" + "i".repeat(201) + "\"";
            default -> hostile;
        };
    }

    private static Gen<List<Mutation>> mutations() {
        Gen<Kind> kinds = Gen.of(Kind.class);
        Gen<Integer> places = Gen.ints(0, 1 << 20);
        Gen<String> hostile = Gen.oneOf(Gen.of(HOSTILE), Gen.strings(8));
        Gen<Mutation> one = r -> new Mutation(kinds.next(r), places.next(r), hostile.next(r));
        return one.list(1, 4);
    }
}
