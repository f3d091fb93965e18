package org.slopewatch.rules;

import java.util.ArrayDeque;
import java.util.Deque;
import java.util.HashMap;
import java.util.Map;
import org.snakeyaml.engine.v2.common.Anchor;
import org.snakeyaml.engine.v2.events.AliasEvent;
import org.snakeyaml.engine.v2.events.CollectionStartEvent;
import org.snakeyaml.engine.v2.events.Event;
import org.snakeyaml.engine.v2.events.ScalarEvent;
import org.snakeyaml.engine.v2.parser.Parser;

/**
 * The YAML parser's events, refused once the document they describe grows past a size when
 * every alias is counted as a copy of what it names. The YAML reader's own limit counts only
 * aliases of lists and mappings, so thousands of aliases of one long text passed: a 35 kB file
 * stood for 35 MB of text, which every reader of the tree (and every message quoting it) paid for.
 *
 * <p>The size is the number of nodes plus the characters (code points) of every scalar, counted as the events
 * arrive: an anchored node's size is recorded when it ends, and an alias adds that size again.
 * Without aliases the size cannot much exceed the file's length, so the limit only bites on
 * expansion.
 */
final class ExpansionLimit extends CheckedEvents {

    private final long maxSize;
    private final Map<String, Long> anchored = new HashMap<>();
    private final Deque<Open> open = new ArrayDeque<>();
    private long size;

    /** A list or mapping begun and not ended yet: its anchor (or "") and the size before it began. */
    private record Open(String anchor, long sizeBefore) {
    }

    ExpansionLimit(Parser events, long maxSize) {
        super(events);
        this.maxSize = maxSize;
    }

    @Override
    void check(Event e) {
        if (e instanceof ScalarEvent s) {
            long own = 1 + s.getValue().codePointCount(0, s.getValue().length());
            size += own;
            s.getAnchor().ifPresent(a -> anchored.put(a.getValue(), own));
        } else if (e instanceof AliasEvent a) {
            // an alias to an anchor still open (a recursive one) or unknown (an error the composer reports) counts as one node
            size += anchored.getOrDefault(a.getAlias().getValue(), 1L);
        } else if (e instanceof CollectionStartEvent c) {
            open.push(new Open(c.getAnchor().map(Anchor::getValue).orElse(""), size));
            size++;
        } else if (e.getEventId() == Event.ID.SequenceEnd || e.getEventId() == Event.ID.MappingEnd) {
            Open started = open.pop();
            if (!started.anchor().isEmpty()) {
                anchored.put(started.anchor(), size - started.sizeBefore());
            }
        }
        if (size > maxSize) {
            throw new ComposeLimit(e.getStartMark(), "with its aliases expanded the policy is larger than the limit of " + maxSize
                    + " characters and nodes");
        }
    }
}
