package org.slopewatch.history;

import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.Charset;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.ArrayDeque;
import java.util.Locale;

/**
 * The text of a history file as the CSV parser reads it: the bytes decoded strictly, every
 * character checked to be text. The charset is UTF-8 unless the sender names another, and a
 * byte-order mark at the start (UTF-8, UTF-16BE, UTF-16LE) overrides both and is dropped, as the
 * WHATWG Encoding Standard's "decode" has it (encoding.spec.whatwg.org/#decode): spreadsheets save
 * UTF-8 with one, and some clients label every text body ISO-8859-1 whatever they send. Bytes that
 * are not text in the charset, a control character other than tab and line breaks, or a line
 * longer than {@link #MAX_LINE} characters end the text
 * there: the parser gets everything before, then a {@link Fault} with the line and column. A
 * decoder that replaced such bytes would let a Latin-1 curve name or a NUL in a yield cell
 * through as something else (Java reads {@code "4.2\0"} as 4.2).
 *
 * <p>It keeps the text from the start of the record the reader is at ({@link #keepFrom}), so that
 * what the parser reports only per record, or the reader per field, can be placed on its line and
 * column ({@link CsvRecordScanner}). What is kept is bounded by the parser's own limit on a record.
 */
final class CsvText extends Reader {

    /** The longest line read, in characters: history lines are tens to hundreds long; this bounds what a line holds in memory. */
    static final int MAX_LINE = 65_536;

    private static final int CHUNK = 16_384;

    /** Where the text stops being text, and why. An {@link IOException}, since that is what a {@link Reader} may throw. */
    static final class Fault extends IOException {
        private final TextPosition position;
        private final String problem;

        Fault(TextPosition position, String problem) {
            super(position + ": " + problem);
            this.position = position;
            this.problem = problem;
        }

        TextPosition position() {
            return position;
        }

        String problem() {
            return problem;
        }
    }

    /** A line start the check has passed: its offset from the start of the text, and its line. */
    private record LineMark(long offset, long line) {
    }

    private final InputStream in;
    private CharsetDecoder decoder;
    private Charset charset;
    private final ByteBuffer bytes = ByteBuffer.allocate(CHUNK).flip();
    private char[] text = new char[4 * CHUNK];
    /** The offset from the start of the text of {@code text[0]}. */
    private long base;
    /** The first character kept, at column 1 of {@link #startLine}. */
    private int start;
    private long startLine = 1;
    /** Characters handed to the parser. */
    private int delivered;
    /** Characters decoded and found to be text. */
    private int checked;
    private int decoded;
    /** Where the line being checked began, for {@link #MAX_LINE}, and its number. */
    private int lineStart;
    private long checkedLine = 1;
    private char lastChecked;
    /** Line starts passed since {@link #start}, one per chunk, to drop what the parser is done with without counting lines again. */
    private final ArrayDeque<LineMark> marks = new ArrayDeque<>();
    /** The parser is done with the lines before this one. */
    private long keepLine = 1;
    private boolean inputDone;
    private boolean ended;
    /** The byte-order mark has been looked for. */
    private boolean begun;
    private char firstVisible;
    private Fault fault;

    CsvText(InputStream in, Charset charset) {
        this.in = in;
        decodeAs(charset);
    }

    private void decodeAs(Charset charset) {
        this.charset = charset;
        this.decoder = charset.newDecoder().onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT);
    }

    @Override
    public int read(char[] into, int off, int len) throws IOException {
        if (len == 0) {
            return 0;
        }
        while (delivered == checked) {
            if (fault != null) {
                throw fault;
            }
            if (ended) {
                return -1;
            }
            fill();
        }
        int n = Math.min(len, checked - delivered);
        System.arraycopy(text, delivered, into, off, n);
        delivered += n;
        return n;
    }

    @Override
    public void close() throws IOException {
        in.close();
    }

    /** The reader has moved on to the record starting on {@code line}: text before that line need not be kept. */
    void keepFrom(long line) {
        keepLine = Math.max(keepLine, line);
    }

    /** Where the text handed to the parser ends (the end of the file once the parser has read it all). */
    TextPosition end() {
        return positionOf(delivered);
    }

    /** Whether the first character other than white space is {@code {} or {@code [}: a JSON body sent as CSV. */
    boolean looksLikeJson() {
        return firstVisible == '{' || firstVisible == '[';
    }

    /** Whether the parser has been handed the whole text: the input ended, and nothing was refused. */
    boolean allSeen() {
        return ended && fault == null && delivered == checked;
    }

    int keptStart() {
        return start;
    }

    long keptStartLine() {
        return startLine;
    }

    /** The end of what the parser has been handed. */
    int seen() {
        return delivered;
    }

    char charAt(int index) {
        return text[index];
    }

    private void fill() throws IOException {
        if (!begun) {
            sniffByteOrderMark();
        }
        makeRoom();
        CharBuffer out = CharBuffer.wrap(text, decoded, text.length - decoded);
        int from = decoded;
        String notText = null;
        while (true) {
            CoderResult result = decoder.decode(bytes, out, inputDone);
            if (result.isError()) {
                notText = notText(result.length());
                break;
            }
            if (result.isOverflow() || out.position() > from) {
                break;
            }
            if (inputDone) {
                if (decoder.flush(out).isUnderflow()) {
                    ended = true;
                }
                break;
            }
            readBytes();
        }
        decoded = out.position();
        if (firstVisible == 0) {
            noteFirstVisible(from);
        }
        check(checked, decoded);
        if (fault == null && notText != null) {
            fault = new Fault(positionOf(decoded), notText);
            ended = true;
        }
    }

    private void readBytes() throws IOException {
        bytes.compact();
        int n;
        try {
            n = in.read(bytes.array(), bytes.position(), bytes.remaining());
        } catch (RuntimeException e) {
            // the stream failing is a failure to read, not a problem with the text: the parser would report it as one
            throw new IOException("cannot read: " + e, e);
        }
        if (n < 0) {
            inputDone = true;
        } else {
            bytes.position(bytes.position() + n);
        }
        bytes.flip();
    }

    /** A byte-order mark at the start names the charset and is not part of the text ("BOM sniff" in the WHATWG Encoding Standard). */
    private void sniffByteOrderMark() throws IOException {
        begun = true;
        while (bytes.remaining() < 3 && !inputDone) {
            readBytes();
        }
        int n = bytes.remaining();
        int b0 = n > 0 ? bytes.get(0) & 0xFF : -1;
        int b1 = n > 1 ? bytes.get(1) & 0xFF : -1;
        int b2 = n > 2 ? bytes.get(2) & 0xFF : -1;
        if (b0 == 0xEF && b1 == 0xBB && b2 == 0xBF) {
            decodeAs(StandardCharsets.UTF_8);
            bytes.position(3);
        } else if (b0 == 0xFE && b1 == 0xFF) {
            decodeAs(StandardCharsets.UTF_16BE);
            bytes.position(2);
        } else if (b0 == 0xFF && b1 == 0xFE) {
            decodeAs(StandardCharsets.UTF_16LE);
            bytes.position(2);
        }
    }

    /** Notes the first character other than white space, once there is one. */
    private void noteFirstVisible(int from) {
        for (int i = from; i < decoded; i++) {
            if (!Character.isWhitespace(text[i])) {
                firstVisible = text[i];
                return;
            }
        }
    }

    private String notText(int length) {
        int at = bytes.position();
        StringBuilder hex = new StringBuilder();
        for (int i = 0; i < length && i < 4; i++) {
            hex.append(i == 0 ? "" : " ").append(String.format(Locale.ROOT, "0x%02X", bytes.get(at + i) & 0xFF));
        }
        return "not " + charset.name() + " text: " + (length == 1 ? "the byte " : "the bytes ") + hex
                + (charset.equals(StandardCharsets.UTF_8) ? " (save or send the file as UTF-8)" : "");
    }

    /**
     * Checks characters from {@code from} and moves {@link #checked} up to the first that is not
     * text, or to {@code to}, counting lines on the way. Printable ASCII, nearly every character of
     * a history file, costs one comparison.
     */
    private void check(int from, int to) {
        char[] t = text;
        int lineBegin = lineStart;
        long line = checkedLine;
        char previous = lastChecked;
        for (int i = from; ; i++) {
            // a tight loop over printable ASCII, which the compiler unrolls: 2.5 times as fast as one loop for all cases
            while (i < to && (char) (t[i] - 0x20) < 0x5F) {
                i++;
            }
            if (i == to) {
                break;
            }
            char c = t[i];
            if (i - lineBegin > MAX_LINE) {
                break;
            }
            if (c == '\n' || c == '\r') {
                if (c == '\r' || (i > from ? t[i - 1] : previous) != '\r') {
                    line++;
                }
                lineBegin = i + 1;
            } else if (c != '\t' && Character.isISOControl(c)) {
                checked = i;
                fault = new Fault(positionOf(i), String.format(Locale.ROOT, "control character U+%04X", (int) c)
                        + (c == 0 ? " (a file saved as UTF-16 has one in every other byte; CSV is read as UTF-8)" : ""));
                return;
            }
        }
        int tooFar = lineBegin + MAX_LINE;
        if (tooFar < to) {
            checked = tooFar;
            fault = new Fault(positionOf(tooFar), String.format(Locale.ROOT, "line longer than %,d characters", MAX_LINE));
            return;
        }
        checked = to;
        lineStart = lineBegin;
        checkedLine = line;
        if (to > from) {
            lastChecked = t[to - 1];
            // after a CR the next chunk may begin with the LF of the same line break
            if (lastChecked != '\r') {
                marks.addLast(new LineMark(base + lineBegin, line));
            }
        }
    }

    private TextPosition positionOf(int index) {
        PositionCounter p = new PositionCounter(startLine);
        for (int i = start; i < index; i++) {
            p.advance(text[i]);
        }
        return p.position();
    }

    /** Makes room to decode a chunk: drops the lines the parser is done with, then grows if that is not enough. */
    private void makeRoom() {
        if (text.length - decoded >= CHUNK) {
            return;
        }
        dropDoneLines();
        int kept = decoded - start;
        char[] into = kept + CHUNK > text.length ? new char[Math.max(2 * text.length, kept + CHUNK)] : text;
        System.arraycopy(text, start, into, 0, kept);
        text = into;
        base += start;
        delivered -= start;
        checked -= start;
        decoded -= start;
        lineStart -= start;
        start = 0;
    }

    /** Moves {@link #start} to the last line start passed at or before {@link #keepLine} in text the parser has been handed. */
    private void dropDoneLines() {
        LineMark chosen = null;
        while (!marks.isEmpty() && marks.peekFirst().line() <= keepLine && marks.peekFirst().offset() <= base + delivered) {
            chosen = marks.pollFirst();
        }
        if (chosen != null && chosen.offset() - base > start) {
            start = (int) (chosen.offset() - base);
            startLine = chosen.line();
        }
    }
}
