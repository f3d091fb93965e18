package org.slopewatch.rules;

import java.util.Optional;
import org.snakeyaml.engine.v2.exceptions.Mark;

/**
 * A limit on what the YAML composer may build, passed ({@link NestingLimit}, {@link ExpansionLimit}):
 * thrown from the event stream, which may not throw a checked exception, and turned by the parser
 * into one problem at the event's position.
 */
final class ComposeLimit extends RuntimeException {

    final transient Optional<Mark> mark;

    ComposeLimit(Optional<Mark> mark, String problem) {
        super(problem, null, false, false);
        this.mark = mark;
    }
}
