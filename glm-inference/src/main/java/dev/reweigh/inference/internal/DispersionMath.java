package dev.reweigh.inference.internal;

import dev.reweigh.families.Family;
import dev.reweigh.families.NoLikelihoodException;
import dev.reweigh.families.ReweighException;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.special.Gamma;

/**
 * Estimates of the dispersion phi from a fitted model's rows: moment estimates (Pearson,
 * deviance), maximum likelihood (closed form or solved), its standard error and its
 * likelihood interval. For a family with a fixed variance power the fitted means do not depend on
 * phi, so the likelihood at the fitted means is the profile likelihood of phi.
 */
public final class DispersionMath {
    private static final double SMALLEST = 1e-12;
    private static final double LARGEST = 1e12;

    private DispersionMath() {
    }

    /**
     * The row contributions w (y - mu)^2 / V(mu) of the Pearson statistic (zero for zero weights).
     *
     * @param d the model data
     * @return one value per row
     */
    public static double[] pearsonContributions(ModelData d) {
        Family family = d.family();
        return d.perInformativeRow(i -> {
            double r = d.y(i) - d.mu(i);
            return d.priorWeight(i) * r * r / family.variance(d.mu(i));
        });
    }

    /**
     * The row contributions w d(y, mu) of the deviance.
     *
     * @param d the model data
     * @return one value per row
     */
    public static double[] devianceContributions(ModelData d) {
        Family family = d.family();
        return d.perInformativeRow(i -> d.priorWeight(i) * family.unitDeviance(d.y(i), d.mu(i)));
    }

    /**
     * A moment estimate: the sum of the contributions over the residual degrees of freedom.
     *
     * @param d the model data (for which rows are informative)
     * @param contributions row contributions
     * @param residualDf residual degrees of freedom
     * @param what the statistic's name for messages
     * @return {estimate, empirical standard error}
     */
    public static double[] moment(ModelData d, double[] contributions, int residualDf, String what) {
        if (residualDf <= 0) {
            throw new ReweighException("the dispersion cannot be estimated from the " + what
                    + ": the model has " + residualDf + " residual degrees of freedom; it needs at least 1");
        }
        // rows with zero prior weight contribute exactly 0 and are not observations
        double sum = 0;
        int n = 0;
        for (int i = 0; i < contributions.length; i++) {
            if (d.priorWeight(i) > 0) {
                sum += contributions[i];
                n++;
            }
        }
        double mean = n > 0 ? sum / n : 0;
        double ss = 0;
        for (int i = 0; i < contributions.length; i++) {
            if (d.priorWeight(i) > 0) {
                ss += (contributions[i] - mean) * (contributions[i] - mean);
            }
        }
        double variance = n > 1 ? ss / (n - 1) : 0;
        return new double[] {sum / residualDf, Math.sqrt(n * variance) / residualDf};
    }

    /**
     * The maximum-likelihood dispersion at the fitted means.
     *
     * @param d the model data
     * @return phi-hat
     * @throws NoLikelihoodException for a family without a density
     * @throws IllegalArgumentException for a family whose dispersion is fixed
     */
    public static double maximumLikelihood(ModelData d) {
        Family family = d.family();
        FamilyKind kind = FamilyKind.of(family);
        switch (kind) {
            case QUASI:
                throw new NoLikelihoodException(family.name(), "maximum-likelihood dispersion");
            case NEGATIVE_BINOMIAL:
                throw new IllegalArgumentException("family '" + family.name() + "' fixes the dispersion at 1; its"
                        + " free parameter is theta: estimate it with NegativeBinomialTheta.estimate(fit)");
            case BINOMIAL:
            case POISSON:
                throw new IllegalArgumentException("family '" + family.name() + "' fixes the dispersion at 1, so it"
                        + " has no maximum-likelihood dispersion; use PEARSON or DEVIANCE for a quasi-likelihood estimate");
            case GAUSSIAN:
                return positive(sumOf(pearsonContributions(d)) / d.informativeRows(), family);
            case INVERSE_GAUSSIAN:
                return positive(sumOf(devianceContributions(d)) / d.informativeRows(), family);
            case GAMMA:
                return 1 / gammaShape(d);
            default:
                if (family.isDispersionFixed()) {
                    throw new IllegalArgumentException("family '" + family.name()
                            + "' fixes the dispersion at 1, so it has no maximum-likelihood dispersion");
                }
                return numericMaximum(d);
        }
    }

    private static double positive(double phi, Family family) {
        if (!(phi > 0)) {
            throw new ReweighException("the model reproduces every response exactly, so the " + family.name()
                    + " dispersion has no maximum-likelihood estimate (it would be 0)");
        }
        return phi;
    }

    /**
     * Solves sum_i w_i [log(w_i nu) - digamma(w_i nu)] = D / 2 for the Gamma shape nu = 1 / phi.
     *
     * @param d the model data of a Gamma fit
     * @return nu
     */
    public static double gammaShape(ModelData d) {
        double halfDeviance = sumOf(devianceContributions(d)) / 2;
        positive(halfDeviance, d.family());
        double[] w = d.priorWeights();
        DoubleUnaryOperator score = t -> {
            double nu = Math.exp(t);
            double s = 0;
            for (double wi : w) {
                if (wi > 0) {
                    double a = wi * nu;
                    s += wi * (Math.log(a) - Gamma.digamma(a));
                }
            }
            return s - halfDeviance;
        };
        double start = Math.log(Math.max(d.informativeRows() / (2 * halfDeviance), SMALLEST));
        double f0 = score.applyAsDouble(start);
        // the left side falls as nu grows: a positive score means nu must grow
        double root = Roots.crossing(score, start, f0 > 0 ? 1 : -1, 80, 1e-13);
        if (Double.isNaN(root)) {
            throw new ReweighException("the Gamma shape equation has no solution for deviance " + 2 * halfDeviance);
        }
        return Math.exp(root);
    }

    private static double numericMaximum(ModelData d) {
        Family family = d.family();
        double start = sumOf(pearsonContributions(d)) / d.informativeRows();
        if (!(start > 0)) {
            start = 1;
        }
        double[] best = Roots.maximisePositive(phi -> d.logLikelihood(family, phi), start, SMALLEST, LARGEST);
        return best[0];
    }

    /**
     * The standard error of the maximum-likelihood phi from the observed information, computed by
     * a central second difference of the log-likelihood in log phi.
     *
     * @param d the model data
     * @param phi the maximum-likelihood estimate
     * @return the standard error, or NaN when the curvature is not negative
     */
    public static double maximumLikelihoodStandardError(ModelData d, double phi) {
        Family family = d.family();
        double h = 1e-3;
        double t = Math.log(phi);
        double lm = d.logLikelihood(family, Math.exp(t - h));
        double l0 = d.logLikelihood(family, phi);
        double lp = d.logLikelihood(family, Math.exp(t + h));
        double curvature = (lp - 2 * l0 + lm) / (h * h);
        if (!(curvature < 0)) {
            return Double.NaN;
        }
        return phi * Math.sqrt(-1 / curvature);
    }

    /**
     * The profile-likelihood interval of phi: where twice the drop of the log-likelihood from its
     * maximum equals the chi-square(1) quantile.
     *
     * @param d the model data
     * @param phiHat the maximum-likelihood estimate
     * @param level the confidence level
     * @return {lower, upper}
     */
    public static double[] likelihoodInterval(ModelData d, double phiHat, double level) {
        Family family = d.family();
        double lMax = d.logLikelihood(family, phiHat);
        double cut = Distributions.chiSquareQuantile(level, 1) / 2;
        DoubleUnaryOperator f = t -> lMax - d.logLikelihood(family, Math.exp(t)) - cut;
        double t0 = Math.log(phiHat);
        double lo = Roots.crossing(f, t0, -0.05, 60, 1e-10);
        double hi = Roots.crossing(f, t0, 0.05, 60, 1e-10);
        return new double[] {Double.isNaN(lo) ? 0 : Math.exp(lo), Double.isNaN(hi) ? Double.POSITIVE_INFINITY : Math.exp(hi)};
    }

    /**
     * The sum of an array.
     *
     * @param values the values
     * @return their sum
     */
    public static double sumOf(double[] values) {
        double s = 0;
        for (double v : values) {
            s += v;
        }
        return s;
    }
}
