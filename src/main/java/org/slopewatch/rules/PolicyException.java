package org.slopewatch.rules;

import java.util.ArrayList;
import java.util.List;

/**
 * A policy that cannot be used, with the problems found (one per line in the message): at most
 * {@link Problems#MAX_LISTED}, and how many more there were.
 */
public final class PolicyException extends Exception {

    private final transient List<PolicyProblem> problems;
    private final transient List<String> lines;
    private final int omitted;

    public PolicyException(List<PolicyProblem> problems) {
        this(problems, 0);
    }

    PolicyException(List<PolicyProblem> problems, int omitted) {
        this(lines(problems, omitted), problems, omitted);
    }

    private PolicyException(List<String> lines, List<PolicyProblem> problems, int omitted) {
        super(String.join(System.lineSeparator(), lines));
        this.problems = List.copyOf(problems);
        this.lines = lines;
        this.omitted = omitted;
    }

    private static List<String> lines(List<PolicyProblem> problems, int omitted) {
        List<String> lines = new ArrayList<>();
        problems.forEach(p -> lines.add(p.toString()));
        if (omitted > 0) {
            lines.add(problems.get(0).file() + ": " + omitted + " more problem" + (omitted == 1 ? "" : "s") + " not listed");
        }
        return List.copyOf(lines);
    }

    /** The problems listed, in file order; {@link #omitted()} more were found. */
    public List<PolicyProblem> problems() {
        return problems;
    }

    /** How many problems were found beyond those listed. */
    public int omitted() {
        return omitted;
    }

    /** The problems as lines, the last saying how many more there were: what an answer or a log lists. */
    public List<String> lines() {
        return lines;
    }
}
