package org.slopewatch.ingest;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.core.json.JsonReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.json.JsonMapper;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.SortedMap;
import java.util.TreeMap;
import org.slopewatch.curve.Tenor;
import org.slopewatch.curve.YieldBasis;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.Reject;
import org.slopewatch.pipeline.RejectReason;
import org.slopewatch.text.Excerpt;
import org.slopewatch.text.FieldText;

/**
 * Decodes and validates quote messages in JSON: a single quote
 * {@code {"curve":"GOVT-A","tenor":"10Y","date":"2026-03-02","yield":4.215}}, a snapshot
 * {@code {"curve":"GOVT-A","date":"…","yields":{"3M":5.10,"10Y":4.20}}}, or an array of either.
 * Optional fields: {@code unit} (percent, bp, decimal), {@code basis} (bond-equivalent,
 * discount), {@code source}, {@code id}, {@code time}.
 *
 * <p>Each item is accepted or rejected whole, with a reason; one bad item never spoils the rest.
 * Unknown fields are rejected rather than ignored, because a misspelt {@code yeild} silently
 * dropped would lose a quote; for the same reason a field or tenor given twice, or anything after
 * the JSON value, makes the input malformed rather than letting one of them win unseen.
 *
 * <p>What is accepted is what the journal keeps as it came: a market date from
 * {@link #EARLIEST_DATE}, texts within the journal's column widths and free of control
 * characters, a {@code time} within the years a timestamp column holds.
 */
public final class QuoteDecoder {

    /**
     * The earliest market date accepted: the first whole year of the Gregorian calendar. The journal
     * stores dates through {@code java.sql.Date}, which counts earlier days in the Julian calendar,
     * so they would come back shifted by days or, for distant years, as other years altogether
     * (-999999999-01-03 was stored as 169087565-03-17 on H2 and refused by PostgreSQL).
     */
    public static final LocalDate EARLIEST_DATE = LocalDate.of(1583, 1, 1);

    /** The bounds of a sender's {@code time}: the years every timestamp column holds faithfully. */
    static final Instant EARLIEST_TIME = EARLIEST_DATE.atStartOfDay(ZoneOffset.UTC).toInstant();
    static final Instant LATEST_TIME = Instant.parse("9999-12-31T23:59:59.999999999Z");

    private static final Set<String> SINGLE_FIELDS = Set.of("curve", "tenor", "date", "yield", "unit", "basis", "source", "id", "time");
    private static final Set<String> SNAPSHOT_FIELDS = Set.of("curve", "date", "yields", "unit", "basis", "source", "id", "time");
    /** Fields kept as text in the journal, with their column widths (db/journal/V1__journal.sql). */
    private static final Map<String, Integer> KEPT_TEXT = Map.of("curve", 100, "id", 200, "source", 200);

    // NaN and Infinity tokens are read so that they can be rejected as non-finite, with that reason;
    // a duplicate field or trailing content is malformed, not a silent last-one-wins or a dropped tail
    private static final ObjectMapper JSON = JsonMapper.builder().enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
            .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION).enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS).build();

    private final IngestRules rules;

    public QuoteDecoder(IngestRules rules) {
        this.rules = rules;
    }

    /** Decodes a request or record body; a body that is not JSON at all is one malformed reject. */
    public QuoteBatch decode(String origin, String body) {
        JsonNode root;
        try {
            root = JSON.readTree(body);
        } catch (JsonProcessingException e) {
            return new QuoteBatch(origin, List.of(), List.of(new Reject(RejectReason.MALFORMED,
                    "not valid JSON: " + Excerpt.of(e.getOriginalMessage()), -1, body)));
        }
        if (root == null || root.isMissingNode()) {
            return new QuoteBatch(origin, List.of(), List.of(new Reject(RejectReason.MALFORMED, "empty body", -1, body)));
        }
        if (root.isArray() && root.isEmpty()) {
            return new QuoteBatch(origin, List.of(), List.of(new Reject(RejectReason.MALFORMED, "an empty array carries no quote", -1, body)));
        }
        List<QuoteMessage> accepted = new ArrayList<>();
        List<Reject> rejects = new ArrayList<>();
        if (root.isArray()) {
            for (int i = 0; i < root.size(); i++) {
                item(root.get(i), i, accepted, rejects);
            }
        } else {
            item(root, -1, accepted, rejects);
        }
        return new QuoteBatch(origin, accepted, rejects);
    }

    /**
     * Checks a message built elsewhere (from CSV, whose reader already checked tenors and yields)
     * against the curve and date rules; null when it passes.
     */
    public Reject check(QuoteMessage m, int item) {
        try {
            curve(m.curve());
            dateInRange(m.date());
            return null;
        } catch (Rejection r) {
            return new Reject(r.reason, r.getMessage(), item, m.curve() + " " + m.date());
        }
    }

    private void item(JsonNode node, int index, List<QuoteMessage> accepted, List<Reject> rejects) {
        try {
            accepted.add(message(node));
        } catch (Rejection r) {
            rejects.add(new Reject(r.reason, r.getMessage(), index, node.toString()));
        }
    }

    /** Validation outcome for one item, thrown to leave it at the first problem. */
    private static final class Rejection extends Exception {
        final RejectReason reason;

        Rejection(RejectReason reason, String message) {
            super(message, null, false, false);
            this.reason = reason;
        }
    }

    private QuoteMessage message(JsonNode node) throws Rejection {
        if (!node.isObject()) {
            throw new Rejection(RejectReason.MALFORMED, "a quote must be a JSON object, got " + node.getNodeType().name().toLowerCase());
        }
        boolean snapshot = node.has("yields");
        Set<String> allowed = snapshot ? SNAPSHOT_FIELDS : SINGLE_FIELDS;
        for (Iterator<String> it = node.fieldNames(); it.hasNext(); ) {
            String f = it.next();
            if (!allowed.contains(f)) {
                throw new Rejection(RejectReason.MALFORMED, "unknown field " + Excerpt.quoted(f) + (snapshot && (f.equals("tenor") || f.equals("yield"))
                        ? " (a snapshot carries its tenors in 'yields')" : ""));
            }
        }
        String curve = curve(text(node, "curve", true));
        LocalDate date = date(text(node, "date", true));
        YieldUnit unit;
        try {
            String u = text(node, "unit", false);
            unit = u == null ? YieldUnit.PERCENT : YieldUnit.parse(u);
        } catch (IllegalArgumentException e) {
            throw new Rejection(RejectReason.UNKNOWN_UNIT, e.getMessage());
        }
        YieldBasis basis = basis(text(node, "basis", false));
        SortedMap<Tenor, Double> yields = new TreeMap<>();
        if (snapshot) {
            JsonNode ys = node.get("yields");
            if (!ys.isObject() || ys.isEmpty()) {
                throw new Rejection(RejectReason.MALFORMED, "'yields' must be an object of tenor to yield, e.g. {\"3M\":5.10}");
            }
            Map<Tenor, String> spelt = new TreeMap<>();
            for (Iterator<Map.Entry<String, JsonNode>> it = ys.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> e = it.next();
                Tenor tenor = tenor(e.getKey());
                String before = spelt.put(tenor, e.getKey());
                if (before != null) {
                    throw new Rejection(RejectReason.MALFORMED, "tenor " + tenor + " appears twice in 'yields' (as " + Excerpt.quoted(before) + " and "
                            + Excerpt.quoted(e.getKey()) + ")");
                }
                yields.put(tenor, yieldBp(e.getValue(), tenor, unit, basis));
            }
        } else {
            Tenor tenor = tenor(text(node, "tenor", true));
            JsonNode y = node.get("yield");
            if (y == null || y.isNull()) {
                throw new Rejection(RejectReason.MISSING_FIELD, "missing field 'yield'");
            }
            yields.put(tenor, yieldBp(y, tenor, unit, basis));
        }
        return new QuoteMessage(keptText("id", text(node, "id", false)), keptText("source", text(node, "source", false)),
                time(text(node, "time", false)), curve, date, yields);
    }

    private static String text(JsonNode node, String field, boolean required) throws Rejection {
        JsonNode v = node.get(field);
        if (v == null || v.isNull()) {
            if (required) {
                throw new Rejection(RejectReason.MISSING_FIELD, "missing field '" + field + "'");
            }
            return null;
        }
        if (!v.isTextual() || v.asText().isBlank()) {
            throw new Rejection(RejectReason.MALFORMED, "'" + field + "' must be a non-empty string, got " + Excerpt.of(v.toString()));
        }
        return v.asText().strip();
    }

    /**
     * A text the journal keeps must fit its column and be stored as sent ({@link FieldText}: no
     * control character, since PostgreSQL text cannot hold NUL and a line break would reach the
     * log, and no half of a surrogate pair); null passes.
     */
    private static String keptText(String field, String text) throws Rejection {
        String problem = FieldText.problem(field, text, KEPT_TEXT.get(field));
        if (problem != null) {
            throw new Rejection(RejectReason.MALFORMED, problem);
        }
        return text;
    }

    private String curve(String curve) throws Rejection {
        if (!rules.knowsCurve(curve)) {
            throw new Rejection(RejectReason.UNKNOWN_CURVE, "unknown curve " + Excerpt.quoted(curve));
        }
        return keptText("curve", curve);
    }

    private LocalDate date(String text) throws Rejection {
        LocalDate date;
        try {
            date = LocalDate.parse(text);
        } catch (DateTimeParseException e) {
            throw new Rejection(RejectReason.BAD_DATE, "unparsable date " + Excerpt.quoted(text) + " (expected YYYY-MM-DD)");
        }
        return dateInRange(date);
    }

    private LocalDate dateInRange(LocalDate date) throws Rejection {
        if (date.isBefore(EARLIEST_DATE)) {
            throw new Rejection(RejectReason.BAD_DATE, "market date " + date + " is before " + EARLIEST_DATE
                    + ", the earliest the journal keeps");
        }
        if (date.isAfter(rules.latestAcceptedDate())) {
            throw new Rejection(RejectReason.FUTURE_DATE, "market date " + date + " is more than " + rules.maxDaysAhead()
                    + " days ahead");
        }
        return date;
    }

    private static Tenor tenor(String text) throws Rejection {
        try {
            return Tenor.parse(text);
        } catch (IllegalArgumentException e) {
            throw new Rejection(RejectReason.UNKNOWN_TENOR, e.getMessage());
        }
    }

    private static YieldBasis basis(String basis) throws Rejection {
        try {
            return YieldBasis.parse(basis);
        } catch (IllegalArgumentException e) {
            throw new Rejection(RejectReason.BAD_BASIS, e.getMessage());
        }
    }

    private double yieldBp(JsonNode value, Tenor tenor, YieldUnit unit, YieldBasis basis) throws Rejection {
        if (!value.isNumber()) {
            throw new Rejection(RejectReason.MALFORMED, "yield for " + tenor + " must be a number, got " + Excerpt.of(value.toString()));
        }
        double raw = value.asDouble();
        if (!Double.isFinite(raw)) {
            throw new Rejection(RejectReason.NOT_FINITE, "yield for " + tenor + " is not a finite number: " + value);
        }
        double bp;
        try {
            bp = rules.bounds().toBasisPoints(raw, unit);
        } catch (IllegalArgumentException e) {
            throw new Rejection(RejectReason.IMPLAUSIBLE, tenor + ": " + e.getMessage());
        }
        try {
            return basis.toBondEquivalentBp(bp, tenor);
        } catch (IllegalArgumentException e) {
            throw new Rejection(RejectReason.BAD_BASIS, e.getMessage());
        }
    }

    private static Instant time(String text) throws Rejection {
        if (text == null) {
            return null;
        }
        Instant time;
        try {
            time = Instant.parse(text);
        } catch (DateTimeParseException e) {
            throw new Rejection(RejectReason.MALFORMED, "unparsable time " + Excerpt.quoted(text) + " (expected e.g. 2026-03-02T16:00:00Z)");
        }
        if (time.isBefore(EARLIEST_TIME) || time.isAfter(LATEST_TIME)) {
            throw new Rejection(RejectReason.MALFORMED, "time " + Excerpt.of(text) + " is outside the years " + EARLIEST_DATE.getYear() + " to 9999");
        }
        return time;
    }
}
