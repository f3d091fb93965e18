package org.slopewatch.curve;

import java.util.Arrays;

/**
 * Test copy of {@link DecaySearch} as {@link BaselineNssFitter} used it, kept so that the
 * baseline stays the same whatever the fit's own classes become. Not used by the daemon.
 *
 * <p>The fine half of the fit: Levenberg–Marquardt over the one or two log decay parameters of a
 * {@link BaselineNssProfile}, from a starting point the {@link DecayGrid} found.
 *
 * <p>Written out rather than taken from a library because the problem is tiny (two parameters,
 * about a dozen points) and runs on every snapshot: a general optimizer's matrix objects and
 * decompositions cost more than the arithmetic itself. Marquardt's scaling (damping
 * proportional to the diagonal of JᵀJ) keeps the step sensible when one decay parameter barely
 * matters, as when the second hump is near zero.
 */
final class BaselineDecaySearch {

    static final int MAX_ITERATIONS = 100;
    // Relative decrease of the sum of squares below which the search has converged: far below any
    // difference a spread in basis points could show.
    private static final double COST_TOLERANCE = 2e-8;
    // A step this small in ln τ changes no fitted yield measurably.
    private static final double STEP_TOLERANCE = 1e-8;
    private static final double INITIAL_DAMPING = 1e-3;
    private static final double MAX_DAMPING = 1e12;

    /** A converged point and its sum of squares in bp². */
    record Minimum(double[] logTaus, double cost) {
    }

    private BaselineDecaySearch() {
    }

    /**
     * Searches from {@code start}; null when the search does not converge within
     * {@code maxEvaluations} evaluations of the sum of squares or {@link #MAX_ITERATIONS} steps,
     * or meets a non-finite value.
     */
    static Minimum minimise(BaselineNssProfile profile, double[] start, int maxEvaluations) {
        int d = profile.parameterCount();
        double[] point = start.clone();
        profile.clamp(point);
        double cost = profile.cost(point);
        int evaluations = 1;
        if (!Double.isFinite(cost)) {
            return null;
        }
        double[][] jacobian = new double[profile.points()][d];
        double[] gradient = new double[d];
        double[][] normal = new double[d][d];
        double[] trial = new double[d];
        double[] delta = new double[d];
        double damping = Double.NaN;
        double growth = 2.0;
        for (int iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
            // the profile's scratch state is at `point`: it was the last accepted evaluation
            profile.jacobian(jacobian);
            normalEquations(jacobian, profile.residuals(), normal, gradient);
            if (Double.isNaN(damping)) {
                damping = INITIAL_DAMPING * maxDiagonal(normal);
                if (damping == 0.0) {
                    return new Minimum(point, cost); // J = 0: nothing moves the fit
                }
            }
            while (true) {
                if (damping > MAX_DAMPING * maxDiagonal(normal)) {
                    return new Minimum(point, cost);
                }
                if (!step(normal, gradient, damping, delta)) {
                    damping *= growth;
                    growth *= 2;
                    continue;
                }
                if (d == 2) {
                    holdAtBounds(profile, point, normal, gradient, damping, delta);
                }
                double moved = 0.0;
                for (int k = 0; k < d; k++) {
                    trial[k] = point[k] + delta[k];
                }
                profile.clamp(trial);
                for (int k = 0; k < d; k++) {
                    delta[k] = trial[k] - point[k];
                    moved = Math.max(moved, Math.abs(delta[k]));
                }
                if (moved < STEP_TOLERANCE) {
                    return new Minimum(point, cost);
                }
                if (evaluations >= maxEvaluations) {
                    return null;
                }
                double trialCost = profile.cost(trial);
                evaluations++;
                if (!Double.isFinite(trialCost)) {
                    return null;
                }
                if (trialCost < cost) {
                    double gain = (cost - trialCost) / predictedDecrease(normal, gradient, delta);
                    boolean converged = cost - trialCost <= COST_TOLERANCE * cost;
                    System.arraycopy(trial, 0, point, 0, d);
                    cost = trialCost;
                    if (converged) {
                        return new Minimum(point, cost);
                    }
                    // Nielsen's update: a step the quadratic model predicted well earns less damping
                    damping *= Math.max(1.0 / 3.0, 1.0 - Math.pow(2.0 * gain - 1.0, 3));
                    growth = 2.0;
                    break;
                }
                damping *= growth;
                growth *= 2;
            }
        }
        return null;
    }

    /**
     * The decrease of the sum of squares the linear model predicts for a step δ that solved the
     * damped system (JᵀJ + λ·D)·δ = Jᵀr with D = diag(JᵀJ): 2δᵀJᵀr − δᵀJᵀJδ = δᵀJᵀr + λ·δᵀDδ.
     * Clamping at a bound changes δ, so the general form is used.
     */
    private static double predictedDecrease(double[][] normal, double[] gradient, double[] delta) {
        double linear = 0.0;
        double quadratic = 0.0;
        for (int a = 0; a < delta.length; a++) {
            linear += delta[a] * gradient[a];
            for (int b = 0; b < delta.length; b++) {
                quadratic += delta[a] * normal[a][b] * delta[b];
            }
        }
        double predicted = 2.0 * linear - quadratic;
        return predicted > 0 ? predicted : Double.MIN_NORMAL;
    }

    /** JᵀJ and Jᵀr, where r = y − ŷ, so that the Gauss–Newton step solves JᵀJ·δ = Jᵀr. */
    private static void normalEquations(double[][] jacobian, double[] residual, double[][] normal, double[] gradient) {
        int d = gradient.length;
        for (int a = 0; a < d; a++) {
            gradient[a] = 0.0;
            for (int b = 0; b < d; b++) {
                normal[a][b] = 0.0;
            }
        }
        for (int i = 0; i < residual.length; i++) {
            double[] row = jacobian[i];
            for (int a = 0; a < d; a++) {
                gradient[a] += row[a] * residual[i];
                for (int b = 0; b < d; b++) {
                    normal[a][b] += row[a] * row[b];
                }
            }
        }
    }

    /**
     * A parameter on its bound whose step points outward is held there and the other one takes
     * the step of its own damped equation: clamping the coupled step instead would leave the
     * free parameter with a step computed for a move that cannot happen, and the search crawls
     * along the bound.
     */
    private static void holdAtBounds(BaselineNssProfile profile, double[] point, double[][] normal, double[] gradient, double damping,
                                     double[] delta) {
        for (int k = 0; k < 2; k++) {
            boolean outward = point[k] <= profile.minLogTau() && delta[k] < 0 || point[k] >= profile.maxLogTau() && delta[k] > 0;
            if (outward) {
                int other = 1 - k;
                delta[k] = 0.0;
                delta[other] = gradient[other] / (normal[other][other] + damping);
                return;
            }
        }
    }

    private static double maxDiagonal(double[][] normal) {
        double max = 0.0;
        for (int k = 0; k < normal.length; k++) {
            max = Math.max(max, normal[k][k]);
        }
        return max;
    }

    /** The damped step (JᵀJ + μI)·δ = Jᵀr into {@code out}; false when it is not finite. */
    private static boolean step(double[][] normal, double[] gradient, double damping, double[] out) {
        double a = normal[0][0] + damping;
        if (gradient.length == 1) {
            out[0] = gradient[0] / a;
            return Double.isFinite(out[0]);
        }
        double d = normal[1][1] + damping;
        double b = normal[0][1];
        double det = a * d - b * b;
        if (!(det > 0) || !Double.isFinite(det)) {
            return false;
        }
        out[0] = (d * gradient[0] - b * gradient[1]) / det;
        out[1] = (a * gradient[1] - b * gradient[0]) / det;
        return Double.isFinite(out[0]) && Double.isFinite(out[1]);
    }
}
