package org.slopewatch.history;

/**
 * Walks the text {@link CsvText} keeps by the quoting rules the CSV parser applies (RFC 4180,
 * section 2: fields separated by commas; a field that starts with a double quote runs to the
 * closing quote, {@code ""} inside it being one quote, and may hold commas and line breaks;
 * records end at CR, LF or CR LF outside quotes), to place on a line and column what the parser
 * reports only per record and what the reader finds wrong in a field. It runs only once something
 * is wrong, over one or two records, so it favours plainness over speed.
 */
final class CsvRecordScanner {

    /** What a walk over a record found. */
    enum Kind {
        /** The record keeps the quoting rules; the position is its start. */
        NOTHING,
        /** Text after the closing quote of a field, at that character. */
        TEXT_AFTER_QUOTE,
        /** A quote that opens a field and is not closed before the text ends, at that quote. */
        QUOTE_NOT_CLOSED
    }

    /** A finding and where it is; {@code character} is the offending one for {@link Kind#TEXT_AFTER_QUOTE}. */
    record Finding(Kind kind, TextPosition at, char character) {
    }

    private enum State { FIELD_START, UNQUOTED, QUOTED, AFTER_QUOTE }

    private final CsvText text;
    private final int end;
    private final PositionCounter at;
    private int i;

    CsvRecordScanner(CsvText text) {
        this.text = text;
        this.i = text.keptStart();
        this.end = text.seen();
        this.at = new PositionCounter(text.keptStartLine());
    }

    /** Where field {@code field} (from 0) of the record starting on {@code line} begins; where the record ends if it has fewer. */
    TextPosition fieldStart(long line, int field) {
        toLine(line);
        return walk(field).at();
    }

    /**
     * Where the record after the one starting on {@code line} breaks the quoting rules, {@code line}
     * 0 meaning the first record: the record the parser refused after handing out the one on
     * {@code line}. Empty lines between are skipped, as the parser skips them.
     */
    Finding recordAfter(long line) {
        if (line > 0) {
            toLine(line);
            walk(-1);
        }
        while (i < end && (text.charAt(i) == '\r' || text.charAt(i) == '\n')) {
            next();
        }
        TextPosition recordStart = at.position();
        Finding found = walk(-1);
        return found.kind() == Kind.NOTHING ? new Finding(Kind.NOTHING, recordStart, ' ') : found;
    }

    private void toLine(long line) {
        while (i < end && at.line() < line) {
            next();
        }
        if (i < end && i > 0 && text.charAt(i) == '\n' && text.charAt(i - 1) == '\r') {
            next();
        }
    }

    private char next() {
        char c = text.charAt(i++);
        at.advance(c);
        return c;
    }

    /**
     * Walks one record from here to its end (past its line break), stopping early where field
     * {@code stopAtField} begins or where a rule is broken. Finding NOTHING carries the position
     * where it stopped.
     */
    private Finding walk(int stopAtField) {
        int field = 0;
        State state = State.FIELD_START;
        TextPosition quoteOpened = null;
        while (true) {
            if (state == State.FIELD_START && field == stopAtField) {
                return new Finding(Kind.NOTHING, at.position(), ' ');
            }
            if (i == end) {
                return state == State.QUOTED ? new Finding(Kind.QUOTE_NOT_CLOSED, quoteOpened, '"')
                        : new Finding(Kind.NOTHING, at.position(), ' ');
            }
            TextPosition here = at.position();
            char c = next();
            if (state != State.QUOTED && (c == '\r' || c == '\n')) {
                if (c == '\r' && i < end && text.charAt(i) == '\n') {
                    next();
                }
                return new Finding(Kind.NOTHING, here, ' ');
            }
            switch (state) {
                case FIELD_START -> {
                    if (c == '"') {
                        state = State.QUOTED;
                        quoteOpened = here;
                    } else if (c == ',') {
                        field++;
                    } else {
                        state = State.UNQUOTED;
                    }
                }
                case UNQUOTED -> {
                    if (c == ',') {
                        field++;
                        state = State.FIELD_START;
                    }
                }
                case QUOTED -> {
                    if (c == '"') {
                        state = State.AFTER_QUOTE;
                    }
                }
                case AFTER_QUOTE -> {
                    if (c == '"') {
                        state = State.QUOTED; // "" inside a quoted field is one quote
                    } else if (c == ',') {
                        field++;
                        state = State.FIELD_START;
                    } else {
                        return new Finding(Kind.TEXT_AFTER_QUOTE, here, c);
                    }
                }
                default -> throw new IllegalStateException(state.name());
            }
        }
    }
}
