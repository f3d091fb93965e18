package org.slopewatch.probability;

/**
 * The probit log-likelihood of a sample, its score and its expected information, evaluated in a
 * way that stays finite when a fitted probability is within rounding of 0 or 1.
 *
 * <p>For month i with index η = α + β·s_i the score is u_i·(1, s_i) with u_i = λ(η) when y = 1
 * and −λ(−η) when y = 0, λ = φ/Φ; the expected-information weight is w_i = φ(η)²/(Φ(η)Φ(−η))
 * = λ(η)·λ(−η). Written through λ, neither needs Φ(η)(1 − Φ(η)), which underflows to 0.
 */
final class ProbitLikelihood {

    private final double[] spread;
    private final boolean[] recessionAhead;

    ProbitLikelihood(double[] spread, boolean[] recessionAhead) {
        if (spread.length != recessionAhead.length) {
            throw new IllegalArgumentException("spread and target lengths differ");
        }
        this.spread = spread.clone();
        this.recessionAhead = recessionAhead.clone();
    }

    int size() {
        return spread.length;
    }

    double spread(int i) {
        return spread[i];
    }

    Evaluation at(double alpha, double beta) {
        int n = spread.length;
        double logLik = 0.0;
        double g0 = 0.0;
        double g1 = 0.0;
        double i00 = 0.0;
        double i01 = 0.0;
        double i11 = 0.0;
        double[] scoreFactor = new double[n];
        for (int i = 0; i < n; i++) {
            double s = spread[i];
            double eta = alpha + beta * s;
            double lambdaPos = Gaussian.inverseMillsRatio(eta);   // φ(η)/Φ(η)
            double lambdaNeg = Gaussian.inverseMillsRatio(-eta);  // φ(η)/Φ(−η)
            double u;
            if (recessionAhead[i]) {
                logLik += Gaussian.logCdf(eta);
                u = lambdaPos;
            } else {
                logLik += Gaussian.logCdf(-eta);
                u = -lambdaNeg;
            }
            scoreFactor[i] = u;
            g0 += u;
            g1 += u * s;
            double w = lambdaPos * lambdaNeg;
            i00 += w;
            i01 += w * s;
            i11 += w * s * s;
        }
        return new Evaluation(logLik, g0, g1, i00, i01, i11, scoreFactor);
    }

    /**
     * The likelihood and its derivatives at one (α, β).
     *
     * <p>A plain class rather than a record because it carries an array; it never leaves the
     * package.
     */
    static final class Evaluation {
        final double logLikelihood;
        final double gradAlpha;
        final double gradBeta;
        final double infoAA;
        final double infoAB;
        final double infoBB;
        /** u_i per row, in sample order: row i's score is u_i·(1, s_i). */
        final double[] scoreFactor;

        Evaluation(double logLikelihood, double gradAlpha, double gradBeta,
                   double infoAA, double infoAB, double infoBB, double[] scoreFactor) {
            this.logLikelihood = logLikelihood;
            this.gradAlpha = gradAlpha;
            this.gradBeta = gradBeta;
            this.infoAA = infoAA;
            this.infoAB = infoAB;
            this.infoBB = infoBB;
            this.scoreFactor = scoreFactor;
        }

        double infoDeterminant() {
            return infoAA * infoBB - infoAB * infoAB;
        }

        /** The inverse of the expected information, the model-based covariance. */
        Covariance inverseInformation() {
            double det = infoDeterminant();
            return new Covariance(infoBB / det, -infoAB / det, infoAA / det);
        }
    }
}
