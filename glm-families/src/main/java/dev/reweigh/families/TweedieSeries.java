package dev.reweigh.families;

import org.apache.commons.math3.special.Gamma;

/**
 * Density and distribution function of the Tweedie compound Poisson-Gamma distribution,
 * 1 &lt; p &lt; 2: N ~ Poisson(lambda) with lambda = mu^(2-p) / (phi (2-p)), and Y the sum of N
 * Gamma variables of shape alpha = (2-p)/(p-1) and scale phi (p-1) mu^(p-1).
 *
 * <p>The density for y &gt; 0 follows the series method of P. K. Dunn and G. K. Smyth (2005),
 * "Series evaluation of Tweedie exponential dispersion model densities", Statistics and Computing
 * 15, 267-280: f(y) = W(y, phi, p) exp(...) / y with W the sum over j &gt;= 1 of
 * W_j = z^j / (j! Gamma(j alpha)), log z = alpha log(y / (phi (p-1))) - log(phi (2-p)), summed in
 * log space outward from its largest term j* = y^(2-p) / (phi (2-p)) until the terms fall below
 * e^-45 of the largest. Here every log W_j is written with Stirling's formula as
 * (1+alpha) j* - (1+alpha) bd0(j, j*) + log(alpha)/2 - log(2 pi) - s(j) - s(j alpha), with s the
 * Stirling remainder and bd0(j, j*) = j log(j/j*) + j* - j: the large term (1+alpha) j* cancels
 * exactly against the exponent of the density, so no digits are lost to cancellation even when j*
 * is in the millions, and
 * log f(y; mu, phi) = -log y + log(alpha)/2 - log(2 pi) + log(sum of exp(r_j)) - d(y, mu) / (2 phi),
 * r_j = -(1+alpha) bd0(j, j*) - s(j) - s(j alpha).
 *
 * <p>When the terms spread over many j (standard deviation s of the index above 8), the sum runs
 * over every h-th index, h = floor(s/4), and multiplies by h: for a smooth term sequence this
 * lattice sum equals the full sum up to a relative error of order exp(-2 pi^2 (s/h)^2), far below
 * double precision (Poisson summation formula), and keeps the cost bounded for tiny dispersions:
 * about 80 terms whatever j* is. (Compared with the full sum on 2000 random cases with j* up to
 * 1e6, the largest difference in log f was 4.5e-13 at log f = -2238, i.e. rounding.)
 */
final class TweedieSeries {
    /** Terms below exp(-45) ~ 3e-20 of the largest term are dropped. */
    private static final double LOG_CUTOFF = 45.0;
    /** Above this Poisson rate the distribution function uses the saddlepoint approximation. */
    static final double SADDLEPOINT_RATE = 1e6;
    /** Bound on the terms summed on each side of the largest; about 40 are ever needed. */
    private static final int MAX_TERMS = 1_000_000;
    /** Terms below exp(-745) of the largest Poisson term underflow in any case. */
    private static final double UNDERFLOW = 745.0;

    private TweedieSeries() {
    }

    /** Log-density at y &gt; 0; phi is the row's dispersion (already divided by the prior weight). */
    static double logDensityPositive(double y, double mu, double phi, double p) {
        double alpha = (2.0 - p) / (p - 1.0);
        double onePlusAlpha = 1.0 / (p - 1.0);
        double jStar = Math.exp((2.0 - p) * Math.log(y) - Math.log(phi) - Math.log(2.0 - p));
        double spread = Math.sqrt(jStar * (p - 1.0));
        double step = spread > 8.0 ? Math.floor(spread / 4.0) : 1.0;
        double start = Math.max(1.0, Math.rint(jStar));
        // Indices are start + k step. For j* beyond 2^53 the sum of the two is rounded, so the
        // offset k step (exact) is passed separately to bd0: the lattice stays evenly spaced.
        double startOffset = start - jStar;
        double reference = logTerm(start, startOffset, jStar, alpha, onePlusAlpha);
        double sum = 1.0;
        for (int k = 1; k < MAX_TERMS; k++) {
            double offset = k * step;
            double r = logTerm(start + offset, startOffset + offset, jStar, alpha, onePlusAlpha) - reference;
            sum += Math.exp(r);
            if (!(r >= -LOG_CUTOFF)) {
                break;
            }
        }
        for (int k = 1; k < MAX_TERMS && start - k * step >= 1.0; k++) {
            double offset = k * step;
            double r = logTerm(start - offset, startOffset - offset, jStar, alpha, onePlusAlpha) - reference;
            sum += Math.exp(r);
            if (!(r >= -LOG_CUTOFF)) {
                break;
            }
        }
        double logSeries = reference + Math.log(sum * step);
        double deviance = PowerVariance.unitDeviance(y, mu, p);
        return -Math.log(y) + 0.5 * Math.log(alpha) - ProbabilityMath.LOG_2PI + logSeries - deviance / (2.0 * phi);
    }

    private static double logTerm(double j, double jMinusJStar, double jStar, double alpha, double onePlusAlpha) {
        return -onePlusAlpha * ProbabilityMath.bd0(j, jStar, jMinusJStar)
                - ProbabilityMath.stirlingRemainder(j) - ProbabilityMath.stirlingRemainder(j * alpha);
    }

    /** Poisson rate of the number of Gamma summands. */
    static double poissonRate(double mu, double phi, double p) {
        return Math.pow(mu, 2.0 - p) / (phi * (2.0 - p));
    }

    /**
     * P(Y &lt;= y) = exp(-lambda) + sum over j &gt;= 1 of P(N = j) P(Gamma(j alpha, scale) &lt;= y),
     * summed outward from the Poisson mode: upward until the Poisson terms fall below e^-45 of the
     * largest, downward also until the terms no longer count relative to the sum (for small y the
     * low counts carry all of a tiny probability, which keeps its relative accuracy).
     * The summand has two features: the Poisson bump, of width sqrt(lambda) in j, and the step of
     * the Gamma distribution function from 1 to 0 around j0 = y / (alpha scale), of width
     * sqrt(j0 / alpha). The lattice shortcut of the density applies only when both are wide
     * (narrowest above 16 indices, step an eighth of it: the step of the Gamma factor is not
     * Gaussian, and a quarter was measured to leave errors near 1e-12); otherwise every index is summed.
     */
    static double cumulativeProbability(double y, double mu, double phi, double p) {
        double lambda = poissonRate(mu, phi, p);
        double atZero = Math.exp(-lambda);
        if (y <= 0.0) {
            return y < 0.0 ? 0.0 : atZero;
        }
        if (lambda > SADDLEPOINT_RATE || lambda * (2.0 - p) / (p - 1.0) > Saddlepoint.LARGE) {
            return saddlepointCumulativeProbability(y, mu, phi, p);
        }
        double alpha = (2.0 - p) / (p - 1.0);
        double scale = phi * (p - 1.0) * Math.pow(mu, p - 1.0);
        double x = y / scale;
        double stepCentre = Math.max(1.0, x / alpha);
        double narrowest = Math.min(Math.sqrt(lambda), Math.sqrt(stepCentre / alpha));
        double step = narrowest > 16.0 ? Math.floor(narrowest / 8.0) : 1.0;
        double start = Math.max(1.0, Math.floor(lambda));
        double reference = ProbabilityMath.logPoisson(start, lambda);
        double sum = 0.0;
        for (double j = start; j + step > j; j += step) {
            double r = ProbabilityMath.logPoisson(j, lambda);
            sum += Math.exp(r) * Gamma.regularizedGammaP(j * alpha, x);
            if (!(r - reference >= -LOG_CUTOFF)) {
                break;
            }
        }
        // Below the mode the Gamma factor grows while the Poisson factor shrinks: for a small y the
        // small j carry the whole (tiny) probability, so keep going while the terms still count
        // relative to the sum, until the Poisson factor itself underflows.
        for (double j = start - step; j >= 1.0; j -= step) {
            double r = ProbabilityMath.logPoisson(j, lambda);
            double term = Math.exp(r) * Gamma.regularizedGammaP(j * alpha, x);
            sum += term;
            boolean negligible = !(r - reference >= -LOG_CUTOFF) && term <= 1e-17 * sum;
            if (negligible || !(r - reference >= -UNDERFLOW)) {
                break;
            }
        }
        // Rounding can lift the sum a few ulps above 1 far in the upper tail.
        return Math.min(1.0, atZero + step * sum);
    }

    /**
     * Lugannani-Rice saddlepoint approximation ({@link Saddlepoint}) with
     * u = (theta(y) - theta(mu)) sqrt(V(y) / phi), theta(m) = m^(1-p)/(1-p). Used only when the
     * Poisson rate lambda exceeds 1e6 or lambda alpha exceeds 1e7: its error shrinks like
     * 1/lambda (measured against the series at lambda = 1e5 for 1.05 &lt;= p &lt;= 1.9: below 3e-10
     * absolute), while the series would need incomplete gamma functions of huge shape, whose own
     * rounding grows like 1e-16 shape log(shape). The atom exp(-lambda) is negligible there. The
     * skewness at the mean is p sqrt(phi) mu^(p/2 - 1).
     */
    static double saddlepointCumulativeProbability(double y, double mu, double phi, double p) {
        double w = Saddlepoint.devianceResidual(y, mu, PowerVariance.unitDeviance(y, mu, p), phi);
        double thetaDifference = Math.pow(mu, 1.0 - p) * Math.expm1((1.0 - p) * PowerVariance.logRatio(y, mu)) / (1.0 - p);
        double u = thetaDifference * Math.sqrt(Math.pow(y, p) / phi);
        double skewness = p * Math.sqrt(phi) * Math.pow(mu, p / 2.0 - 1.0);
        return Saddlepoint.distributionFunction(w, u, skewness);
    }
}
