package org.slopewatch.rules;

import java.util.Optional;
import org.snakeyaml.engine.v2.events.Event;
import org.snakeyaml.engine.v2.exceptions.Mark;
import org.snakeyaml.engine.v2.parser.Parser;

/**
 * The YAML parser's events, refused past a depth of nested lists and mappings. The parser itself
 * keeps no stack of calls, but the composer that builds nodes from its events recurses once per
 * level, so ten thousand {@code [} overflowed the thread's stack; counting the events it takes
 * stops it first.
 */
final class NestingLimit implements Parser {

    /** Thrown from {@link #next()}, which may not throw a checked exception; the parser turns it into a problem. */
    static final class TooDeep extends RuntimeException {
        final transient Optional<Mark> mark;

        TooDeep(Optional<Mark> mark) {
            super(null, null, false, false);
            this.mark = mark;
        }
    }

    private final Parser events;
    private final int maxDepth;
    private int depth;

    NestingLimit(Parser events, int maxDepth) {
        this.events = events;
        this.maxDepth = maxDepth;
    }

    @Override
    public Event next() {
        Event e = events.next();
        Event.ID id = e.getEventId();
        if (id == Event.ID.SequenceStart || id == Event.ID.MappingStart) {
            if (++depth > maxDepth) {
                throw new TooDeep(e.getStartMark());
            }
        } else if (id == Event.ID.SequenceEnd || id == Event.ID.MappingEnd) {
            depth--;
        }
        return e;
    }

    @Override
    public boolean checkEvent(Event.ID choice) {
        return events.checkEvent(choice);
    }

    @Override
    public Event peekEvent() {
        return events.peekEvent();
    }

    @Override
    public boolean hasNext() {
        return events.hasNext();
    }
}
