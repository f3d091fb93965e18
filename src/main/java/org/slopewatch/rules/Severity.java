package org.slopewatch.rules;

/** How loud an alert is. */
public enum Severity {
    INFO, WARNING, CRITICAL
}
