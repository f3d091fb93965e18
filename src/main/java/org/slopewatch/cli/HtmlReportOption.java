package org.slopewatch.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.slopewatch.monitor.SpreadStatus;
import org.slopewatch.monitor.Watch;
import org.slopewatch.probability.RecessionCalendarCsv;
import org.slopewatch.replay.Replay;
import org.slopewatch.replay.ReplayReport;
import org.slopewatch.report.PolicySummary;
import org.slopewatch.report.RecessionDates;
import org.slopewatch.report.ReplayDocument;
import org.slopewatch.report.ReportFile;
import org.slopewatch.report.ReportHtml;
import org.slopewatch.report.SpreadProbability;
import org.slopewatch.rules.PolicyException;
import org.slopewatch.rules.PolicyParser;
import org.slopewatch.rules.ProbabilityModels;

/** {@code replay --report FILE}: the replay as one self-contained HTML page. */
final class HtmlReportOption {

    private HtmlReportOption() {
    }

    /**
     * Writes the page; on failure says so on {@code err}.
     *
     * @param policy     the policy file the watches came from, or null for command-line rules
     * @param recessions the business-cycle dates file, or null
     * @return 0 when written, 1 when the page could not be written or a file re-read for it failed
     */
    static int write(Path target, ReplayReport report, Replay replay, Path policy, List<Watch> watches, Path recessions,
                     PrintWriter err) {
        try {
            PolicySummary summary = policy == null
                    ? PolicySummary.ofOptions(watches, "no policy file: spreads and tests from --spread/--persistence and the threshold options")
                    : PolicySummary.ofFile(policy, watches, "the policy file as it is on disk; the hash is of its bytes");
            RecessionDates dates = null;
            if (recessions != null) {
                try (Reader r = Files.newBufferedReader(recessions, StandardCharsets.UTF_8)) {
                    dates = new RecessionDates(recessions.toString(), RecessionCalendarCsv.read(r, recessions.toString()).recessions());
                }
            }
            String html = ReportHtml.render(ReplayDocument.of(report, replay.values(), summary, dates, probabilities(policy, replay),
                    Clock.systemUTC().instant()));
            ReportFile.write(target, html);
            return 0;
        } catch (IOException e) {
            err.println("slopewatch replay: cannot write the report " + target + ": " + e);
            return 1;
        } catch (PolicyException e) {
            // read once already for the replay: the file changed in between
            err.println("slopewatch replay: cannot write the report " + target + ": the policy file changed and is no longer valid: "
                    + e.getMessage());
            return 1;
        }
    }

    /** By spread id, the recession probability at the end of the data, from the policy's models (none without a policy file). */
    private static Map<String, SpreadProbability> probabilities(Path policy, Replay replay) throws IOException, PolicyException {
        Map<String, SpreadProbability> out = new HashMap<>();
        if (policy == null) {
            return out;
        }
        ProbabilityModels models = PolicyParser.parse(policy.toString(), Files.readAllBytes(policy)).probability();
        for (SpreadStatus status : replay.statuses()) {
            SpreadProbability p = SpreadProbability.of(models, status);
            if (p != null) {
                out.put(status.id(), p);
            }
        }
        return out;
    }
}
