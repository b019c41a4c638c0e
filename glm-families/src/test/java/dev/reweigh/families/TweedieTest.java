package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Assume;
import net.jqwik.api.Combinators;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;

/**
 * The Tweedie family with 1 &lt; p &lt; 2 as the compound Poisson-Gamma distribution: N ~ Poisson with
 * lambda = mu^(2-p) / (phi (2-p)) and N Gamma summands of shape (2-p)/(p-1) and scale
 * phi (p-1) mu^(p-1) (the representation used by P. K. Dunn and G. K. Smyth, 2005, "Series
 * evaluation of Tweedie exponential dispersion model densities", Statistics and Computing 15,
 * 267-280, section 2). The reference densities are Commons Math's PoissonDistribution and
 * GammaDistribution, summed term by term.
 */
class TweedieTest {

    /**
     * The mixture density at y &gt; 0 summed directly from Commons Math distributions. The terms use
     * their logDensity and logProbability methods: Commons Math 3.6.1's GammaDistribution.density
     * returns 0 for some shapes (observed at shape 152, scale 0.0089, y = 0.86, where the log-density
     * is -11.8), which would silently drop terms.
     */
    static double mixtureDensity(double y, double mu, double phi, double p) {
        double lambda = Math.pow(mu, 2 - p) / (phi * (2 - p));
        double shape = (2 - p) / (p - 1);
        double scale = phi * (p - 1) * Math.pow(mu, p - 1);
        // No random generator: only densities are needed, and seeding one per distribution is costly.
        PoissonDistribution count = new PoissonDistribution(null, lambda,
                PoissonDistribution.DEFAULT_EPSILON, PoissonDistribution.DEFAULT_MAX_ITERATIONS);
        double jStar = Math.pow(y, 2 - p) / (phi * (2 - p));
        double sum = 0;
        double largest = 0;
        for (int j = 1; j < 200_000; j++) {
            double term = Math.exp(count.logProbability(j) + new GammaDistribution(null, shape * j, scale).logDensity(y));
            sum += term;
            largest = Math.max(largest, term);
            if (j > Math.max(lambda, jStar) + 20 && term < 1e-20 * largest) {
                break;
            }
        }
        return sum;
    }

    @Provide
    Arbitrary<double[]> cases() {
        return Combinators.combine(FamilyCase.uniform(1.05, 1.95), FamilyCase.logUniform(-1, 1),
                FamilyCase.logUniform(-0.7, 0.7), FamilyCase.logUniform(-2, 1.3))
                .as((p, mu, phi, y) -> new double[] {p, mu, phi, y});
    }

    @Property(tries = 200)
    void densityEqualsThePoissonGammaMixture(@ForAll("cases") double[] c) {
        double p = c[0];
        double mu = c[1];
        double phi = c[2];
        double y = c[3];
        double reference = mixtureDensity(y, mu, phi, p);
        // Far in the tail the reference underflows to 0; there is nothing to compare against.
        Assume.that(reference > 1e-280);
        double ours = Families.tweedie(p).logDensity(y, mu, phi, 1.0);
        // Compared on the log scale: 1e-10 absolute in log f is 1e-10 relative in f. Deep in the tail
        // (log f = -150) each reference term exp(-150 + ...) carries a rounding error of about
        // 1e-16 |log f| relative, so the tolerance grows with |log f|.
        assertEquals(Math.log(reference), ours, 1e-10 * Math.max(1.0, Math.abs(ours)),
                () -> "p=" + p + " mu=" + mu + " phi=" + phi + " y=" + y);
    }

    @Test
    void smallDispersionWithManySeriesTermsStillMatchesTheMixture() {
        // j* = y^(2-p) / (phi (2-p)) is about 4500 here, so the series is summed on a lattice.
        for (double y : new double[] {4.0, 5.0, 6.2}) {
            double reference = mixtureDensity(y, 5.0, 1e-3, 1.5);
            assertEquals(Math.log(reference), Families.tweedie(1.5).logDensity(y, 5.0, 1e-3, 1.0), 1e-9, "y=" + y);
        }
    }

    /**
     * P(Y &lt;= y) summed over every count j from 1 to far above the Poisson mode, from Commons Math's
     * PoissonDistribution.logProbability and the regularized incomplete gamma function
     * (org.apache.commons.math3.special.Gamma.regularizedGammaP).
     */
    static double mixtureDistributionFunction(double y, double mu, double phi, double p) {
        double lambda = Math.pow(mu, 2 - p) / (phi * (2 - p));
        double shape = (2 - p) / (p - 1);
        double scale = phi * (p - 1) * Math.pow(mu, p - 1);
        PoissonDistribution count = new PoissonDistribution(null, lambda, 1e-14, 10_000_000);
        double sum = Math.exp(-lambda);
        double last = lambda + 15 * Math.sqrt(lambda) + 50;
        for (int j = 1; j <= last; j++) {
            sum += Math.exp(count.logProbability(j)) * Gamma.regularizedGammaP(shape * j, y / scale);
        }
        return sum;
    }

    @Provide
    Arbitrary<double[]> distributionCases() {
        // lambda (the expected number of Gamma summands) up to 1e4, where p near 1 makes the
        // Gamma factor switch from 1 to 0 within a few counts.
        return Combinators.combine(FamilyCase.uniform(1.01, 1.99), FamilyCase.logUniform(-1, 1),
                FamilyCase.logUniform(-1, 4), FamilyCase.uniform(-3, 3))
                .as((p, mu, lambda, z) -> {
                    double phi = Math.pow(mu, 2 - p) / (lambda * (2 - p));
                    double y = Math.max(0.0, mu + z * Math.sqrt(phi * Math.pow(mu, p)));
                    return new double[] {p, mu, phi, y};
                });
    }

    @Property(tries = 60)
    void distributionFunctionEqualsThePoissonGammaMixture(@ForAll("distributionCases") double[] c) {
        double reference = mixtureDistributionFunction(c[3], c[1], c[2], c[0]);
        double ours = Families.tweedie(c[0]).cumulativeProbability(c[3], c[1], c[2], 1.0);
        assertEquals(reference, ours, 1e-13 + 1e-11 * reference,
                () -> "p=" + c[0] + " mu=" + c[1] + " phi=" + c[2] + " y=" + c[3]);
    }

    @Test
    void distributionFunctionNearPowerOneWithManySummands() {
        // p = 1.02, lambda = 5000: the Gamma factor switches from 1 to 0 within about 10 counts while
        // the Poisson factor spreads over 70; a lattice sized by the Poisson spread alone erred by 1e-5 here.
        double p = 1.02;
        double mu = 10.0;
        double phi = Math.pow(mu, 2 - p) / (5000 * (2 - p));
        for (double y : new double[] {9.8, 10.0, 10.2}) {
            double reference = mixtureDistributionFunction(y, mu, phi, p);
            assertEquals(reference, Families.tweedie(p).cumulativeProbability(y, mu, phi, 1.0), 1e-13, "y=" + y);
        }
    }

    @Test
    void saddlepointDistributionFunctionAgreesWithTheSeriesWhereBothApply() {
        // Above lambda = 1e6 the distribution function switches to the Lugannani-Rice approximation
        // (Lugannani and Rice, 1980, Advances in Applied Probability 12, 475-490); at lambda = 1e5 the
        // two must already agree to about 1/lambda^2 in the centre and keep relative accuracy in the lower tail.
        for (double p : new double[] {1.05, 1.5, 1.9}) {
            double mu = 3.0;
            double phi = Math.pow(mu, 2 - p) / (1e5 * (2 - p));
            double sd = Math.sqrt(phi * Math.pow(mu, p));
            for (double z = -6; z <= 6; z += 0.37) {
                double y = mu + z * sd;
                double series = TweedieSeries.cumulativeProbability(y, mu, phi, p);
                double saddlepoint = TweedieSeries.saddlepointCumulativeProbability(y, mu, phi, p);
                assertEquals(series, saddlepoint, 2e-9 + 1e-7 * Math.min(series, 1 - series), "p=" + p + " z=" + z);
            }
        }
    }

    @Test
    void distributionFunctionForTinyDispersionsIsMonotoneAndCentred() {
        Family f = Families.tweedie(1.5);
        for (double phi : new double[] {1e-8, 1e-14, 1e-20}) {
            double mu = 2.0;
            double sd = Math.sqrt(phi * Math.pow(mu, 1.5));
            double previous = 0;
            for (double z = -8; z <= 8; z += 0.5) {
                double value = f.cumulativeProbability(mu + z * sd, mu, phi, 1.0);
                assertTrue(value >= previous && value <= 1, "phi=" + phi + " z=" + z);
                previous = value;
            }
            // Normal limit with the skewness correction: F(mu) = 1/2 + gamma / (6 sqrt(2 pi)), gamma = p sqrt(phi) mu^(p/2-1).
            double skewness = 1.5 * Math.sqrt(phi) * Math.pow(mu, 1.5 / 2 - 1);
            assertEquals(0.5 + skewness / (6 * Math.sqrt(2 * Math.PI)), f.cumulativeProbability(mu, mu, phi, 1.0), 1e-12);
            // Phi(-1) = 0.158655 (from memory), up to the skewness correction of order sqrt(phi).
            assertEquals(0.15865525393145707, f.cumulativeProbability(mu - sd, mu, phi, 1.0), 1e-3);
            // The density is as finite and accurate as ever: compare with the saddlepoint density.
            double y = mu + sd;
            double saddle = -0.5 * Math.log(2 * Math.PI * phi * Math.pow(y, 1.5)) - f.unitDeviance(y, mu) / (2 * phi);
            assertEquals(saddle, f.logDensity(y, mu, phi, 1.0), 1e-6);
        }
    }

    @Test
    void massAtZeroIsThePoissonProbabilityOfNoClaims() {
        for (double p : new double[] {1.1, 1.5, 1.9}) {
            for (double mu : new double[] {0.05, 1.0, 20.0}) {
                double phi = 1.7;
                double expected = Math.exp(-Math.pow(mu, 2 - p) / (phi * (2 - p)));
                Family f = Families.tweedie(p);
                assertEquals(expected, Math.exp(f.logDensity(0.0, mu, phi, 1.0)), 1e-15 * expected);
                assertEquals(expected, f.cumulativeProbability(0.0, mu, phi, 1.0), 1e-15 * expected);
                // Reference: Commons Math PoissonDistribution, P(N = 0).
                double lambda = Math.pow(mu, 2 - p) / (phi * (2 - p));
                assertEquals(new PoissonDistribution(lambda).probability(0), expected, 1e-14 * expected);
            }
        }
    }

    /**
     * Integral of g over (0, upper]. For alpha = (2-p)/(p-1) &lt; 1 (p &gt; 1.5) the density behaves
     * like y^(alpha-1) near zero, unbounded; the substitution y = s^(1/alpha) turns it into a
     * bounded, smooth integrand. For alpha &gt;= 1 the density is bounded and is integrated in y
     * directly (the substitution would make exp(-y/scale) non-smooth at s = 0). The panels are
     * the images of 100 equal panels in y, so that the bulk of the distribution is spread over
     * many panels.
     */
    static double integrate(UnivariateFunction g, double p, double upper) {
        double alpha = (2 - p) / (p - 1);
        double k = alpha < 1 ? alpha : 1.0;
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(8, 1e-12, 1e-16);
        UnivariateFunction onS = s -> {
            double y = Math.pow(s, 1 / k);
            return g.value(y) * y / (k * s);
        };
        int panels = 100;
        double sum = 0;
        for (int i = 0; i < panels; i++) {
            double from = Math.pow(upper * i / panels, k);
            double to = Math.pow(upper * (i + 1) / panels, k);
            sum += integrator.integrate(1_000_000, onS, from, to);
        }
        return sum;
    }

    @Provide
    Arbitrary<double[]> moments() {
        return Combinators.combine(Arbitraries.of(1.1, 1.3, 1.5, 1.7, 1.9), Arbitraries.of(0.5, 2.0, 10.0),
                Arbitraries.of(0.3, 1.0, 3.0)).as((p, mu, phi) -> new double[] {p, mu, phi});
    }

    @Property(tries = 10)
    void densityWithTheAtomIntegratesToOneWithMeanMuAndVariancePhiMuToThePower(@ForAll("moments") double[] c) {
        double p = c[0];
        double mu = c[1];
        double phi = c[2];
        Family f = Families.tweedie(p);
        double sd = Math.sqrt(phi * Math.pow(mu, p));
        double gammaScale = phi * (p - 1) * Math.pow(mu, p - 1);
        double upper = mu + 40 * sd + 80 * gammaScale;
        double atom = Math.exp(f.logDensity(0, mu, phi, 1.0));
        double total = atom + integrate(y -> Math.exp(f.logDensity(y, mu, phi, 1.0)), p, upper);
        double mean = integrate(y -> y * Math.exp(f.logDensity(y, mu, phi, 1.0)), p, upper);
        double second = mu * mu * atom + integrate(y -> (y - mu) * (y - mu) * Math.exp(f.logDensity(y, mu, phi, 1.0)), p, upper);
        assertEquals(1.0, total, 1e-9, "total probability");
        assertEquals(mu, mean, 1e-9 * mu, "mean");
        assertEquals(phi * Math.pow(mu, p), second, 1e-8 * phi * Math.pow(mu, p), "variance");
        for (double q : new double[] {0.5, 1.0, 3.0}) {
            double y = q * mu;
            double cdf = atom + integrate(t -> Math.exp(f.logDensity(t, mu, phi, 1.0)), p, y);
            assertEquals(cdf, f.cumulativeProbability(y, mu, phi, 1.0), 1e-9, "F at " + y);
        }
    }

    @Test
    void priorWeightDividesTheDispersion() {
        Family f = Families.tweedie(1.4);
        assertEquals(f.logDensity(2.5, 1.2, 0.5, 1.0), f.logDensity(2.5, 1.2, 1.5, 3.0), 1e-13);
        assertEquals(f.logDensity(0.0, 1.2, 0.5, 1.0), f.logDensity(0.0, 1.2, 1.5, 3.0), 1e-15);
        assertEquals(f.cumulativeProbability(2.5, 1.2, 0.5, 1.0), f.cumulativeProbability(2.5, 1.2, 1.5, 3.0), 1e-14);
    }

    @Test
    void powersOutsideTheCompoundPoissonRangeAreRejectedOrMapped() {
        assertEquals(Families.gaussian(), Families.tweedie(0));
        assertEquals(Families.poisson(), Families.tweedie(1));
        assertEquals(Families.gamma(), Families.tweedie(2));
        assertEquals(Families.inverseGaussian(), Families.tweedie(3));
        for (double bad : new double[] {0.5, 2.5, -1, 4, Double.NaN, Double.POSITIVE_INFINITY}) {
            ReweighException e = org.junit.jupiter.api.Assertions.assertThrows(ReweighException.class,
                    () -> Families.tweedie(bad));
            org.junit.jupiter.api.Assertions.assertTrue(e.getMessage().contains("strictly between 1 and 2"), e.getMessage());
        }
    }
}
