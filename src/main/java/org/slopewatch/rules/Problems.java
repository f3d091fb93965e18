package org.slopewatch.rules;

import java.util.ArrayList;
import java.util.List;

/**
 * The problems found in one policy file, kept up to {@link #MAX_LISTED}: past that they are only
 * counted. A file of a million bad list items would otherwise answer with a million problems,
 * held in memory and sent whole; the first hundred say what is wrong as well as all of them.
 */
final class Problems {

    static final int MAX_LISTED = 100;

    private final List<PolicyProblem> listed = new ArrayList<>();
    private final List<PolicyProblem> warnings = new ArrayList<>();
    private int omitted;

    /** Something the file may say but should say otherwise (an old key); it does not stop the file from being used. */
    void warn(PolicyProblem warning) {
        if (warnings.size() < MAX_LISTED) {
            warnings.add(warning);
        }
    }

    List<PolicyProblem> warnings() {
        return List.copyOf(warnings);
    }

    void add(PolicyProblem problem) {
        if (listed.size() < MAX_LISTED) {
            listed.add(problem);
        } else {
            omitted++;
        }
    }

    boolean isEmpty() {
        return listed.isEmpty();
    }

    PolicyException exception() {
        return new PolicyException(listed, omitted);
    }
}
