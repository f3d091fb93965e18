package org.slopewatch.rules;

import java.util.List;
import java.util.stream.Collectors;

/** A policy that cannot be used, with every problem found (one per line in the message). */
public final class PolicyException extends Exception {

    private final transient List<PolicyProblem> problems;

    public PolicyException(List<PolicyProblem> problems) {
        super(problems.stream().map(PolicyProblem::toString).collect(Collectors.joining(System.lineSeparator())));
        this.problems = List.copyOf(problems);
    }

    public List<PolicyProblem> problems() {
        return problems;
    }
}
