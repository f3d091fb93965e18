package org.slopewatch.rules;

import org.snakeyaml.engine.v2.events.Event;
import org.snakeyaml.engine.v2.parser.Parser;

/**
 * The YAML parser's events passed on one by one to the composer, each seen first by a check that
 * may stop the document ({@link NestingLimit}, {@link ExpansionLimit}); only taking an event is
 * checked, looking ahead is passed through.
 */
abstract class CheckedEvents implements Parser {

    private final Parser events;

    CheckedEvents(Parser events) {
        this.events = events;
    }

    /** Sees each event as the composer takes it; throws {@link ComposeLimit} to stop the document there. */
    abstract void check(Event e);

    @Override
    public final Event next() {
        Event e = events.next();
        check(e);
        return e;
    }

    @Override
    public final boolean checkEvent(Event.ID choice) {
        return events.checkEvent(choice);
    }

    @Override
    public final Event peekEvent() {
        return events.peekEvent();
    }

    @Override
    public final boolean hasNext() {
        return events.hasNext();
    }
}
