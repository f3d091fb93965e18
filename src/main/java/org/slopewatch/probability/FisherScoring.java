package org.slopewatch.probability;

import org.slopewatch.probability.ProbitFitException.Reason;

/**
 * Maximises the probit log-likelihood by Fisher scoring (the Newton step with the expected
 * information in place of the Hessian, which is what iteratively reweighted least squares
 * computes), with step halving so that no step lowers the likelihood.
 *
 * <p>The expected information is positive definite whenever the spread varies, unlike the
 * observed Hessian far from the optimum, so each step is an ascent direction. It starts from
 * the intercept-only estimate (α = Φ⁻¹(ȳ), β = 0).
 */
final class FisherScoring {

    /** |coefficient| beyond this means the estimate is running off to infinity. */
    static final double RUNAWAY = 1e4;
    /**
     * |η| at which a fitted probability is within a few ulps of 0 or 1 (Φ(−8) ≈ 6e−16); R's glm
     * warns about "fitted probabilities numerically 0 or 1" at about the same point.
     */
    static final double NUMERIC_EDGE = 8.0;
    private static final int MAX_HALVINGS = 40;

    private FisherScoring() {
    }

    /** Where the iterations stopped: the estimate, the evaluation there, the iterations used. */
    static final class Result {
        final double alpha;
        final double beta;
        final ProbitLikelihood.Evaluation evaluation;
        final int iterations;

        Result(double alpha, double beta, ProbitLikelihood.Evaluation evaluation, int iterations) {
            this.alpha = alpha;
            this.beta = beta;
            this.evaluation = evaluation;
            this.iterations = iterations;
        }
    }

    static Result maximize(ProbitLikelihood likelihood, double startAlpha, int maxIterations, double tolerance) {
        double alpha = startAlpha;
        double beta = 0.0;
        ProbitLikelihood.Evaluation ev = likelihood.at(alpha, beta);
        for (int iter = 1; iter <= maxIterations; iter++) {
            double det = ev.infoDeterminant();
            if (!(det > 0.0) || !Double.isFinite(det)) {
                throw failure(likelihood, alpha, beta, "the information matrix became singular at iteration " + iter);
            }
            double stepAlpha = (ev.infoBB * ev.gradAlpha - ev.infoAB * ev.gradBeta) / det;
            double stepBeta = (ev.infoAA * ev.gradBeta - ev.infoAB * ev.gradAlpha) / det;
            boolean lastStep = Math.abs(stepAlpha) <= tolerance * (1.0 + Math.abs(alpha))
                    && Math.abs(stepBeta) <= tolerance * (1.0 + Math.abs(beta));

            double t = 1.0;
            ProbitLikelihood.Evaluation next = null;
            for (int h = 0; h <= MAX_HALVINGS; h++) {
                ProbitLikelihood.Evaluation trial = likelihood.at(alpha + t * stepAlpha, beta + t * stepBeta);
                // A step that is already at rounding level may not raise the likelihood at all.
                if (trial.logLikelihood >= ev.logLikelihood - 1e-12 * Math.abs(ev.logLikelihood)) {
                    next = trial;
                    break;
                }
                t *= 0.5;
            }
            if (next == null) {
                throw failure(likelihood, alpha, beta, "no step raises the likelihood at iteration " + iter);
            }
            alpha += t * stepAlpha;
            beta += t * stepBeta;
            ev = next;
            if (!Double.isFinite(alpha) || !Double.isFinite(beta)
                    || Math.abs(alpha) > RUNAWAY || Math.abs(beta) > RUNAWAY) {
                throw separation(alpha, beta, "the coefficients diverge at iteration " + iter);
            }
            if (lastStep) {
                return new Result(alpha, beta, ev, iter);
            }
        }
        throw failure(likelihood, alpha, beta, "no convergence in " + maxIterations + " iterations");
    }

    /**
     * Names a failed iteration: separation when some fitted probabilities have already reached
     * 0 or 1 numerically (the coefficients are on their way to infinity), else plain
     * non-convergence.
     */
    private static ProbitFitException failure(ProbitLikelihood likelihood, double alpha, double beta, String what) {
        int atEdge = 0;
        for (int i = 0; i < likelihood.size(); i++) {
            if (!(Math.abs(alpha + beta * likelihood.spread(i)) < NUMERIC_EDGE)) {
                atEdge++;
            }
        }
        if (atEdge > 0) {
            return separation(alpha, beta, what + "; fitted probabilities are numerically 0 or 1 in "
                    + atEdge + " of " + likelihood.size() + " months");
        }
        return new ProbitFitException(Reason.NO_CONVERGENCE, what + " (alpha=" + alpha + ", beta=" + beta
                + "); raise the iteration limit or check the data");
    }

    private static ProbitFitException separation(double alpha, double beta, String what) {
        return new ProbitFitException(Reason.SEPARATION, "quasi-perfect separation: " + what + " (alpha="
                + alpha + ", beta=" + beta + "); the spread splits the months with a recession ahead from the"
                + " others almost perfectly, so the likelihood has no finite maximum; use a longer sample"
                + " with misses and false alarms");
    }
}
