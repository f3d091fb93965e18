package org.slopewatch.cli;

import java.io.PrintWriter;
import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.file.Path;
import java.util.Locale;
import org.slopewatch.probability.Covariance;
import org.slopewatch.probability.CovarianceKind;
import org.slopewatch.replay.FitReport;

/**
 * The fit report as text for people: the sample, a coefficient table with both standard errors
 * side by side, goodness of fit, the band table, the caution, and last the fit as a policy's
 * {@code probability:} section, ready to paste.
 */
final class FitText {

    /** Six significant digits: more than any published table, enough to compare with R to four. */
    private static final MathContext DIGITS = new MathContext(6);

    private final PrintWriter out;

    FitText(PrintWriter out) {
        this.out = out;
    }

    void print(FitReport r) {
        FitReport.Sample s = r.sample();
        out.printf(Locale.ROOT, "slopewatch fit of %s on curve %s (%s)%n", r.spread(), r.curve(), r.source());
        out.printf(Locale.ROOT, "  model      %s%n", r.model());
        out.printf(Locale.ROOT, "  target     %s; recession dates from %s%n", r.target(), r.recessions());
        out.printf(Locale.ROOT, "  sample     %s to %s: %d months, %d with y = 1 (data %s to %s: %d months, %d observations)%n",
                s.firstMonth(), s.lastMonth(), s.months(), s.recessionAheadMonths(), s.dataFirstMonth(), s.dataLastMonth(),
                s.dataMonths(), s.observations());
        for (String note : r.notes()) {
            out.printf(Locale.ROOT, "  note       %s%n", note);
        }
        out.println();
        out.printf(Locale.ROOT, "  %-12s  %12s  %18s  %18s%n", "coefficient", "estimate", "s.e. model-based", "s.e. Newey-West");
        for (FitReport.Coefficient c : r.coefficients()) {
            out.printf(Locale.ROOT, "  %-12s  %12s  %18s  %18s%n", c.name(), sig(c.estimate()), sig(c.seModelBased()),
                    sig(c.seNeweyWest()));
        }
        out.printf(Locale.ROOT, "  s.e. model-based: %s%n", r.standardErrors().modelBased());
        out.printf(Locale.ROOT, "  s.e. Newey-West:  %s%n", r.standardErrors().neweyWest());
        out.println();
        out.printf(Locale.ROOT, "  %-22s  %s  (intercept only: %s)%n", "log-likelihood", sig(r.logLikelihood()), sig(r.nullLogLikelihood()));
        out.printf(Locale.ROOT, "  %-22s  %s%n", "McFadden pseudo-R2", sig(r.mcfaddenR2()));
        out.printf(Locale.ROOT, "  %-22s  %s%n", "Estrella (1998) R2", sig(r.estrellaR2()));
        out.printf(Locale.ROOT, "  %-22s  %s pp%n", "P = 50% at spread", sig(r.spreadAtEvenOddsPct()));
        out.printf(Locale.ROOT, "  %-22s  %d%n", "Fisher-scoring steps", r.iterations());
        out.println();
        FitReport.Bands b = r.bands();
        out.printf(Locale.ROOT, "  P(recession in month m+%d) with a %.0f%% band, %s covariance (%s)%n", r.horizonMonths(),
                100 * b.level(), b.covariance(), b.method());
        out.printf(Locale.ROOT, "    %9s  %7s  %7s  %7s%n", "spread pp", "P", "lower", "upper");
        for (FitReport.Band row : b.rows()) {
            out.printf(Locale.ROOT, "    %9.2f  %6.1f%%  %6.1f%%  %6.1f%%%n", row.spreadPct(), 100 * row.probability(),
                    100 * row.lower(), 100 * row.upper());
        }
        out.println();
        out.println(r.caution());
        out.println();
        out.print(policyBlock(r));
    }

    /**
     * The fit as a {@code probability:} section of a policy, in the shape {@code rules.ProbabilitySectionParser}
     * reads, starting at column 0 so that it pastes into a policy file as it is: coefficients to six
     * significant digits, the provenance, and the covariance the bands above rest on, so that the daemon
     * shows the same band next to its live probability.
     */
    static String policyBlock(FitReport r) {
        boolean neweyWest = r.bands().covariance().equals(CovarianceKind.NEWEY_WEST.label());
        Covariance c = neweyWest ? r.standardErrors().covarianceNeweyWest() : r.standardErrors().covarianceModelBased();
        String kind = r.bands().covariance() + (neweyWest ? ", lag " + r.standardErrors().neweyWestLagMonths() : "");
        String nl = System.lineSeparator();
        return "# The fit as a policy's 'probability' section (alert-rules/README.md): paste it into a policy that watches "
                + r.spread() + "," + nl
                + "# or put the " + r.spread() + " entry under the 'probability:' the policy already has." + nl
                + "probability:" + nl
                + "  " + r.spread() + ":" + nl
                + "    alpha: " + sig(r.coefficients().get(0).estimate()) + nl
                + "    beta: " + sig(r.coefficients().get(1).estimate()) + nl
                + "    horizon-months: " + r.horizonMonths() + nl
                + "    average: monthly" + nl
                + "    source: \"" + yamlText(provenance(r)) + "\"" + nl
                + "    # covariance of (alpha, beta), " + kind + ": the daemon's 90 % band rests on it" + nl
                + "    covariance: { var-alpha: " + sig(c.varAlpha()) + ", cov-alpha-beta: " + sig(c.covAlphaBeta()) + ", var-beta: "
                + sig(c.varBeta()) + " }" + nl;
    }

    /** A provenance note for the policy: what was fitted on which data. */
    static String provenance(FitReport r) {
        return String.format(Locale.ROOT, "slopewatch fit on %s (curve %s), %s to %s, %d months, recession %d months ahead per %s",
                fileName(r.source()), r.curve(), r.sample().firstMonth(), r.sample().lastMonth(), r.sample().months(),
                r.horizonMonths(), fileName(r.recessions()));
    }

    static String sig(double v) {
        if (!Double.isFinite(v)) {
            return Double.toString(v);
        }
        return new BigDecimal(v).round(DIGITS).stripTrailingZeros().toPlainString();
    }

    private static String fileName(String path) {
        Path p = Path.of(path).getFileName();
        return p == null ? path : p.toString();
    }

    private static String yamlText(String text) {
        return text.replace("\\", "\\\\").replace("\"", "\\\"");
    }
}
