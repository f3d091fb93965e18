package org.slopewatch.ingest.demo;

import java.util.Objects;
import org.slopewatch.ingest.demo.PolicyPath.Knot;
import org.slopewatch.ingest.demo.TwoFactorModel.Factor;

/**
 * One invented curve of the demo: its name, its short-rate model, its scripted policy stance and
 * the size of the day-to-day quote noise laid on top of the model's yields.
 *
 * @param quoteNoiseBp standard deviation of independent per-tenor noise, in basis points
 */
public record DemoCurve(String name, TwoFactorModel model, PolicyPath policy, double quoteNoiseBp) {

    public DemoCurve {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(model, "model");
        Objects.requireNonNull(policy, "policy");
        if (!(quoteNoiseBp >= 0) || !Double.isFinite(quoteNoiseBp)) {
            throw new IllegalArgumentException("quote noise must be non-negative and finite, got " + quoteNoiseBp);
        }
    }

    /**
     * {@code GOVT-A}, a curve through a tightening cycle. The policy rate starts 100 bp below its
     * long-run level of 2.50%, is raised by 400 bp between months 1 and 10, held until month 16,
     * cut to 50 bp below the long-run level by month 25 and drifts back to it by month 36. Without
     * noise, 10Y−3M inverts once the policy gap passes about 115 bp and 10Y−2Y about 120 bp; at
     * the peak they sit near −140 bp and −80 bp; with the gap closed the curve is normal, about
     * +85 bp and +55 bp.
     */
    public static DemoCurve tightening() {
        TwoFactorModel model = new TwoFactorModel(0.025,
                new Factor(0.9, 0.0020, 0.005),
                new Factor(0.08, 0.0015, 0.015),
                -0.3, 0.5);
        PolicyPath policy = PolicyPath.of(new Knot(0, -100), new Knot(1, -100), new Knot(10, 300), new Knot(16, 300),
                new Knot(25, -50), new Knot(36, 0));
        return new DemoCurve("GOVT-A", model, policy, 0.8);
    }

    /**
     * {@code GOVT-B}, a curve that never inverts: a steeper term premium around a long-run level
     * of 3.00%, and a mild policy move (from 50 bp below to 60 bp above the long-run level and
     * back). Without noise, 10Y−3M and 10Y−2Y are about +140 bp and +90 bp at rest and still
     * about +95 bp and +60 bp at the policy peak.
     */
    public static DemoCurve steady() {
        TwoFactorModel model = new TwoFactorModel(0.030,
                new Factor(0.9, 0.0015, 0.008),
                new Factor(0.08, 0.0012, 0.025),
                -0.3, 0.5);
        PolicyPath policy = PolicyPath.of(new Knot(0, -50), new Knot(3, -50), new Knot(12, 60), new Knot(24, 60),
                new Knot(30, 0));
        return new DemoCurve("GOVT-B", model, policy, 0.8);
    }
}
