package org.slopewatch.rules;

import org.snakeyaml.engine.v2.events.Event;
import org.snakeyaml.engine.v2.parser.Parser;

/**
 * The YAML parser's events, refused past a depth of nested lists and mappings. The parser itself
 * keeps no stack of calls, but the composer that builds nodes from its events recurses once per
 * level, so ten thousand {@code [} overflowed the thread's stack; counting the events it takes
 * stops it first.
 */
final class NestingLimit extends CheckedEvents {

    private final int maxDepth;
    private int depth;

    NestingLimit(Parser events, int maxDepth) {
        super(events);
        this.maxDepth = maxDepth;
    }

    @Override
    void check(Event e) {
        Event.ID id = e.getEventId();
        if (id == Event.ID.SequenceStart || id == Event.ID.MappingStart) {
            if (++depth > maxDepth) {
                throw new ComposeLimit(e.getStartMark(), "nested more than " + maxDepth + " levels deep");
            }
        } else if (id == Event.ID.SequenceEnd || id == Event.ID.MappingEnd) {
            depth--;
        }
    }
}
