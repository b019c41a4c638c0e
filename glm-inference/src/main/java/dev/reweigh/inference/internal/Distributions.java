package dev.reweigh.inference.internal;

import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.FDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.apache.commons.math3.special.Beta;
import org.apache.commons.math3.special.Gamma;

/**
 * Tail probabilities and quantiles of the reference distributions. Upper tails are computed
 * directly from the regularized incomplete gamma and beta functions rather than as 1 - cdf, so
 * tiny p-values keep their relative accuracy.
 */
public final class Distributions {
    private static final double ACCURACY = 1e-12;
    private static final NormalDistribution STANDARD_NORMAL = new NormalDistribution(null, 0, 1, ACCURACY);

    private Distributions() {
    }

    /**
     * @param z a standard normal statistic
     * @return P(|Z| &gt;= |z|)
     */
    public static double normalTwoSided(double z) {
        return 2 * STANDARD_NORMAL.cumulativeProbability(-Math.abs(z));
    }

    /**
     * @param t a t statistic
     * @param df degrees of freedom
     * @return P(|T| &gt;= |t|)
     */
    public static double tTwoSided(double t, double df) {
        double x = df / (df + t * t);
        return Beta.regularizedBeta(x, df / 2, 0.5);
    }

    /**
     * @param x a chi-square statistic
     * @param df degrees of freedom
     * @return P(X &gt;= x)
     */
    public static double chiSquareUpper(double x, double df) {
        if (x <= 0) {
            return 1;
        }
        return Gamma.regularizedGammaQ(df / 2, x / 2);
    }

    /**
     * @param f an F statistic
     * @param df1 numerator degrees of freedom
     * @param df2 denominator degrees of freedom
     * @return P(F &gt;= f)
     */
    public static double fUpper(double f, double df1, double df2) {
        if (f <= 0) {
            return 1;
        }
        return Beta.regularizedBeta(df2 / (df2 + df1 * f), df2 / 2, df1 / 2);
    }

    /**
     * @param p a probability
     * @return the standard normal quantile
     */
    public static double normalQuantile(double p) {
        return STANDARD_NORMAL.inverseCumulativeProbability(p);
    }

    /**
     * @param p a probability
     * @param df degrees of freedom
     * @return the t quantile
     */
    public static double tQuantile(double p, double df) {
        return new TDistribution(null, df, ACCURACY).inverseCumulativeProbability(p);
    }

    /**
     * @param p a probability
     * @param df degrees of freedom
     * @return the chi-square quantile
     */
    public static double chiSquareQuantile(double p, double df) {
        return new ChiSquaredDistribution(null, df, ACCURACY).inverseCumulativeProbability(p);
    }

    /**
     * @param p a probability
     * @param df1 numerator degrees of freedom
     * @param df2 denominator degrees of freedom
     * @return the F quantile
     */
    public static double fQuantile(double p, double df1, double df2) {
        return new FDistribution(null, df1, df2, ACCURACY).inverseCumulativeProbability(p);
    }

    /**
     * @param x a point
     * @return the standard normal distribution function at x
     */
    public static double normalCdf(double x) {
        return STANDARD_NORMAL.cumulativeProbability(x);
    }
}
