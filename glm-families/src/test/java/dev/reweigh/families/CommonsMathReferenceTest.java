package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;

import net.jqwik.api.ForAll;
import net.jqwik.api.From;
import net.jqwik.api.Property;
import org.junit.jupiter.api.Test;
import net.jqwik.api.Provide;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.constraints.IntRange;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.PascalDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;

/**
 * Log-densities and distribution functions checked against the reference implementations in
 * Apache Commons Math 3.6.1 (org.apache.commons.math3.distribution: NormalDistribution,
 * PoissonDistribution, BinomialDistribution, GammaDistribution, PascalDistribution) at generated
 * points. Tolerances are relative 1e-10 with an absolute floor, as both sides round differently.
 */
class CommonsMathReferenceTest {

    @Provide
    Arbitrary<Double> means() {
        return FamilyCase.logUniform(-2, 3);
    }

    @Provide
    Arbitrary<Double> dispersions() {
        return FamilyCase.logUniform(-2, 1.5);
    }

    @Provide
    Arbitrary<Double> weights() {
        return FamilyCase.logUniform(-1, 1.5);
    }

    @Provide
    Arbitrary<Double> probabilities() {
        return FamilyCase.uniform(1e-4, 1 - 1e-4);
    }

    @Provide
    Arbitrary<Double> symmetric() {
        return FamilyCase.uniform(-100, 100);
    }

    private static void assertClose(double reference, double actual, String what) {
        assertEquals(reference, actual, 1e-10 * Math.abs(reference) + 1e-12, what);
    }

    @Property(tries = 500)
    void gaussianMatchesNormalDistribution(@ForAll("symmetric") double y, @ForAll("symmetric") double mu,
            @ForAll("dispersions") double phi, @ForAll("weights") double w) {
        // Reference: Commons Math NormalDistribution with standard deviation sqrt(phi / w).
        NormalDistribution reference = new NormalDistribution(mu, Math.sqrt(phi / w));
        assertClose(reference.logDensity(y), Families.gaussian().logDensity(y, mu, phi, w), "log-density");
        assertEquals(reference.cumulativeProbability(y), Families.gaussian().cumulativeProbability(y, mu, phi, w), 1e-14);
    }

    @Property(tries = 500)
    void poissonMatchesPoissonDistribution(@ForAll @IntRange(min = 0, max = 3000) int k,
            @ForAll("means") double mu, @ForAll("weights") double w) {
        // Reference: Commons Math PoissonDistribution; a prior weight is a frequency weight.
        PoissonDistribution reference = new PoissonDistribution(mu);
        assertClose(w * reference.logProbability(k), Families.poisson().logDensity(k, mu, 1.0, w), "log-probability");
        // Commons Math's PoissonDistribution sums its incomplete gamma function to a relative 1e-12 by default.
        assertEquals(reference.cumulativeProbability(k), Families.poisson().cumulativeProbability(k, mu, 1.0, w),
                1e-10 * reference.cumulativeProbability(k) + 1e-15);
    }

    @Property(tries = 500)
    void binomialMatchesBinomialDistribution(@ForAll @IntRange(min = 1, max = 2000) int n,
            @ForAll("probabilities") double u, @ForAll("probabilities") double mu) {
        // Reference: Commons Math BinomialDistribution; the prior weight is the number of trials.
        int k = (int) Math.floor(u * (n + 1));
        double y = (double) k / n;
        BinomialDistribution reference = new BinomialDistribution(n, mu);
        assertClose(reference.logProbability(k), Families.binomial().logDensity(y, mu, 1.0, n), "log-probability");
        double cdf = reference.cumulativeProbability(k);
        assertEquals(cdf, Families.binomial().cumulativeProbability(y, mu, 1.0, n), 1e-11 * cdf + 1e-14);
    }

    @Property(tries = 500)
    void gammaMatchesGammaDistribution(@ForAll("means") double y, @ForAll("means") double mu,
            @ForAll("dispersions") double phi, @ForAll("weights") double w) {
        // Reference: Commons Math GammaDistribution with shape w/phi and scale mu phi / w.
        double shape = w / phi;
        GammaDistribution reference = new GammaDistribution(shape, mu / shape);
        // The log-density is a sum of terms as large as shape * |log y| and log Gamma(shape) (up to ~1e4 here)
        // that cancel to a small number, so every evaluation carries absolute rounding errors of the largest
        // term: the tolerances add that floor to the relative one (common practice, no source). The tight
        // reference is the closed form -log Gamma(k) - k log(theta) + (k - 1) log y - y / theta with Commons
        // Math's log-gamma function; GammaDistribution.logDensity itself is checked more loosely, because for
        // shapes below 1 its error reaches 1.3e-12 of the largest term (gammaDensityWhereTermsCancel below).
        double theta = mu / shape;
        double logGammaShape = org.apache.commons.math3.special.Gamma.logGamma(shape);
        double closedForm = -logGammaShape - shape * Math.log(theta) + (shape - 1) * Math.log(y) - y / theta;
        double largestTerm = Math.abs(closedForm) + shape * (Math.abs(Math.log(y)) + Math.abs(Math.log(theta)) + 1)
                + Math.abs(logGammaShape) + y / theta;
        double ours = Families.gamma().logDensity(y, mu, phi, w);
        assertEquals(closedForm, ours, 1e-10 * Math.abs(closedForm) + 1e-14 * largestTerm, "log-density (closed form)");
        double logRef = reference.logDensity(y);
        assertEquals(logRef, ours, 1e-10 * Math.abs(logRef) + 1e-11 * largestTerm, "log-density (GammaDistribution)");
        double cdf = reference.cumulativeProbability(y);
        assertEquals(cdf, Families.gamma().cumulativeProbability(y, mu, phi, w), 1e-11 * cdf + 1e-14);
    }

    @Test
    void gammaDensityWhereTermsCancel() {
        // Shapes below 1 where terms of size ~5 cancel to a few 1e-3 or 1e-4. Reference values: the
        // closed-form Gamma log-density evaluated with 40 significant digits in mpmath 1.3.0 (Johansson
        // et al., mpmath: a Python library for arbitrary-precision floating-point arithmetic). Commons
        // Math 3.6.1's GammaDistribution gives -4.112293473337303e-4, -2.35219380273044e-3 and
        // 1.2489993405721211e-2 here (1.2e-13, 8.1e-13 and 6.5e-12 off); ours must be within 2e-15 of the
        // largest term (about 5).
        assertEquals(-4.112293474550169273608e-4,
                Families.gamma().logDensity(0.01, 2.7824625776998158, 0.13509970179566175, 0.1), 1e-14, "shape 0.74");
        assertEquals(-2.352193801917551316262e-3,
                Families.gamma().logDensity(0.01, 10.667065372115445, 0.18436147579385526, 0.10000000000029186),
                1e-14, "shape 0.54");
        assertEquals(1.248999341219635947152e-2,
                Families.gamma().logDensity(0.01, 88.72095990315518, 0.2721113995975071, 0.1), 1e-14, "shape 0.37");
    }

    @Property(tries = 500)
    void negativeBinomialMatchesPascalDistribution(@ForAll @IntRange(min = 0, max = 2000) int k,
            @ForAll("means") double mu, @ForAll @IntRange(min = 1, max = 200) int theta, @ForAll("weights") double w) {
        // Reference: Commons Math PascalDistribution(r = theta, p = theta / (theta + mu)), which counts
        // failures before the r-th success: P(Y = k) = C(k + r - 1, k) p^r (1 - p)^k.
        PascalDistribution reference = new PascalDistribution(theta, theta / (theta + mu));
        Family nb = Families.negativeBinomial(theta);
        assertClose(w * reference.logProbability(k), nb.logDensity(k, mu, 1.0, w), "log-probability");
        double cdf = reference.cumulativeProbability(k);
        assertEquals(cdf, nb.cumulativeProbability(k, mu, 1.0, w), 1e-10 * cdf + 1e-14);
    }

    @Property(tries = 200)
    void negativeBinomialWithLargeThetaApproachesPoisson(@ForAll @IntRange(min = 0, max = 50) int k,
            @ForAll("means") double mu) {
        // As theta grows the negative binomial tends to the Poisson: the log-probabilities differ by O(mu^2/theta).
        if (mu > 50) {
            return;
        }
        double poisson = Families.poisson().logDensity(k, mu, 1.0, 1.0);
        double nb = Families.negativeBinomial(1e12).logDensity(k, mu, 1.0, 1.0);
        assertEquals(poisson, nb, 1e-8 * (1 + Math.abs(poisson)));
    }

    @Property(tries = 300)
    void binomialWithFractionalCountIsBetweenItsNeighbours(@ForAll @IntRange(min = 2, max = 100) int n,
            @ForAll("probabilities") double mu, @ForAll @From("probabilities") double u) {
        // y n whole within 1e-7 relative is rounded to the whole count: common practice, no source.
        int k = (int) Math.floor(u * n);
        double y = (k + 1e-9) / n;
        assertEquals(new BinomialDistribution(n, mu).logProbability(k), Families.binomial().logDensity(y, mu, 1.0, n),
                1e-10 * (1 + Math.abs(new BinomialDistribution(n, mu).logProbability(k))));
    }
}
