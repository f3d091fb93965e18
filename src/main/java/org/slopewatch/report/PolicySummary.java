package org.slopewatch.report;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.slopewatch.monitor.Watch;
import org.slopewatch.rules.PolicyHash;

/**
 * The policy a report was made under: its file, the SHA-256 of the file's bytes (the hash that
 * names a policy in the journal and in alerts) and the monitor rules of each watched spread.
 *
 * @param file   the policy file, or null when the rules came from command-line options
 * @param sha256 lower-case hex, or null without a file
 * @param note   how the policy relates to what the report shows
 */
public record PolicySummary(String file, String sha256, String note, List<SpreadRules> rules) {

    public PolicySummary {
        rules = List.copyOf(rules);
    }

    /** A policy read from a file: hashed over the bytes as they are on disk now. */
    public static PolicySummary ofFile(Path file, List<Watch> watches, String note) throws IOException {
        return new PolicySummary(file.toString(), PolicyHash.of(Files.readAllBytes(file)), note, rules(watches));
    }

    /** Rules given without a policy file. */
    public static PolicySummary ofOptions(List<Watch> watches, String note) {
        return new PolicySummary(null, null, note, rules(watches));
    }

    public static List<SpreadRules> rules(List<Watch> watches) {
        return watches.stream().map(SpreadRules::of).toList();
    }
}
