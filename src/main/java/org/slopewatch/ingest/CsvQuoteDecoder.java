package org.slopewatch.ingest;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.Charset;
import java.nio.charset.IllegalCharsetNameException;
import java.nio.charset.StandardCharsets;
import java.nio.charset.UnsupportedCharsetException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.slopewatch.curve.YieldUnit;
import org.slopewatch.history.HistoryCsvReader;
import org.slopewatch.history.HistoryFormatException;
import org.slopewatch.history.SeriesMap;
import org.slopewatch.pipeline.QuoteBatch;
import org.slopewatch.pipeline.QuoteMessage;
import org.slopewatch.pipeline.Reject;
import org.slopewatch.pipeline.RejectReason;

/**
 * Decodes a CSV body in the replay's layouts ({@link HistoryCsvReader}) into a {@link QuoteBatch},
 * as {@link QuoteDecoder} does for JSON, so that both travel the same way to the pipeline, which
 * journals and counts every reject. A body the reader refuses is one {@code malformed} reject that
 * names line and column, and nothing of it is taken: the reader stops at the first problem, and
 * quotes read before it would be a part passed off as the whole. An unknown unit or charset is one
 * reject likewise. A body that reads becomes one message per snapshot, each checked for its curve
 * and date like a JSON quote and rejected alone.
 */
public final class CsvQuoteDecoder {

    /** How a body is named in the reader's messages: {@code request:3:7: …}. */
    public static final String SOURCE = "request";
    /** The curve of a wide file sent without {@code ?curve=}: no curve is called that, so each row is rejected as unknown. */
    private static final String UNNAMED_CURVE = "?";
    /** How much of a refused body the reject keeps (the journal keeps less). */
    private static final int RAW_BYTES = 4_000;

    private final QuoteDecoder decoder;
    private final IngestRules rules;
    private final SeriesMap series;

    /** A decoder that refuses SDMX-CSV bodies, having no series map. */
    public CsvQuoteDecoder(QuoteDecoder decoder, IngestRules rules) {
        this(decoder, rules, SeriesMap.NONE);
    }

    /** @param series places the series of an SDMX-CSV body on curves and tenors */
    public CsvQuoteDecoder(QuoteDecoder decoder, IngestRules rules, SeriesMap series) {
        this.decoder = decoder;
        this.rules = rules;
        this.series = series;
    }

    /**
     * @param charset the charset the sender names, or null for UTF-8
     * @param curve   the curve of a wide file, or null
     * @param unit    the yield unit ({@code percent}, {@code bp}, {@code decimal}), or null for percent
     */
    public QuoteBatch decode(String origin, byte[] body, String charset, String curve, String unit) {
        return decode(origin, SOURCE, body, charset, curve, unit);
    }

    /**
     * As {@link #decode(String, byte[], String, String, String)}, with the body named {@code where} in the
     * reader's messages ({@code where:3:7: …}): a pulled source by its name.
     */
    public QuoteBatch decode(String origin, String where, byte[] body, String charset, String curve, String unit) {
        YieldUnit yieldUnit;
        try {
            yieldUnit = unit == null ? YieldUnit.PERCENT : YieldUnit.parse(unit);
        } catch (IllegalArgumentException e) {
            return refused(origin, RejectReason.UNKNOWN_UNIT, e.getMessage(), "unit=" + unit);
        }
        if (curve != null && curve.isBlank()) {
            return refused(origin, RejectReason.MALFORMED, "an empty curve name: ?curve= names the curve of a wide file", raw(body));
        }
        Charset encoding;
        try {
            encoding = charset == null ? StandardCharsets.UTF_8 : Charset.forName(charset);
        } catch (IllegalCharsetNameException | UnsupportedCharsetException e) {
            return refused(origin, RejectReason.MALFORMED, "unknown charset '" + charset + "' in the content type; send UTF-8", raw(body));
        }
        List<QuoteMessage> messages = new ArrayList<>();
        List<Reject> rejects = new ArrayList<>();
        try {
            HistoryCsvReader.read(where, new ByteArrayInputStream(body), encoding,
                    new HistoryCsvReader.Options(curve == null ? UNNAMED_CURVE : curve, yieldUnit, rules.bounds(), series), snapshot -> {
                        QuoteMessage m = QuoteMessage.of(snapshot.curve(), snapshot.date(), snapshot.asMap());
                        Reject problem = decoder.check(m, messages.size() + rejects.size());
                        if (problem == null) {
                            messages.add(m);
                        } else {
                            rejects.add(problem);
                        }
                    }, () -> { });
        } catch (HistoryFormatException e) {
            return refused(origin, RejectReason.MALFORMED, e.getMessage(), raw(body));
        } catch (IOException e) {
            throw new UncheckedIOException("reading a body held in memory", e); // a byte array cannot fail to be read
        }
        return new QuoteBatch(origin, messages, rejects);
    }

    private static QuoteBatch refused(String origin, RejectReason reason, String detail, String raw) {
        return new QuoteBatch(origin, List.of(), List.of(new Reject(reason, detail, -1, raw)));
    }

    /** The start of the body as text, for the journal: enough to recognise it, with undecodable bytes replaced. */
    private static String raw(byte[] body) {
        return new String(body.length > RAW_BYTES ? Arrays.copyOf(body, RAW_BYTES) : body, StandardCharsets.UTF_8);
    }
}
