package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

/** Anscombe residuals, distribution functions without a Commons Math counterpart, extreme arguments. */
class ResidualAndTailTest {

    @Test
    void anscombeResidualsOfThePowerFamiliesHaveTheirClosedForms() {
        // Closed forms from A'(mu) = V(mu)^(-1/3), written here from memory:
        // Poisson 3/2 (y^(2/3) - mu^(2/3)) / mu^(1/6); Gamma 3 (y^(1/3) - mu^(1/3)) / mu^(1/3);
        // inverse Gaussian log(y/mu) / sqrt(mu).
        double y = 7.0;
        double mu = 3.2;
        assertEquals(1.5 * (Math.pow(y, 2.0 / 3) - Math.pow(mu, 2.0 / 3)) / Math.pow(mu, 1.0 / 6),
                Families.poisson().anscombeResidual(y, mu), 1e-14);
        assertEquals(3 * (Math.cbrt(y) - Math.cbrt(mu)) / Math.cbrt(mu), Families.gamma().anscombeResidual(y, mu), 1e-14);
        assertEquals(Math.log(y / mu) / Math.sqrt(mu), Families.inverseGaussian().anscombeResidual(y, mu), 1e-14);
        assertEquals(y - mu, Families.gaussian().anscombeResidual(y, mu), 0.0);
        assertEquals(1.5 * (0 - Math.pow(mu, 2.0 / 3)) / Math.pow(mu, 1.0 / 6), Families.poisson().anscombeResidual(0, mu), 1e-14);
    }

    @Provide
    Arbitrary<double[]> proportionPairs() {
        return Combinators.combine(FamilyCase.uniform(0, 1), FamilyCase.uniform(1e-4, 1 - 1e-4)).as((y, mu) -> new double[] {y, mu});
    }

    @Property(tries = 300)
    void binomialAnscombeIsTheIntegralOfTheVarianceToTheMinusOneThird(@ForAll("proportionPairs") double[] c) {
        double y = c[0];
        double mu = c[1];
        // Reference: Commons Math IterativeLegendreGaussIntegrator on t = s^3 (removes the s^(-1/3) end singularities
        // at 0; the one at 1 is handled by integrating 1 - t the same way).
        double integral = integrateProportion(y) - integrateProportion(mu);
        double expected = integral / Math.pow(mu * (1 - mu), 1.0 / 6);
        assertEquals(expected, Families.binomial().anscombeResidual(y, mu), 1e-9 * (1 + Math.abs(expected)));
        assertEquals(Families.binomial().anscombeResidual(y, mu), Families.quasi("mu(1-mu)").anscombeResidual(y, mu), 0.0);
        assertEquals(Families.binomial().unitDeviance(y, mu), Families.quasi("mu(1-mu)").unitDeviance(y, mu), 0.0);
    }

    /** Integral of (t(1-t))^(-1/3) over [0, x], split at 1/2 and substituted t = s^3 and 1 - t = s^3. */
    private static double integrateProportion(double x) {
        if (x == 0) {
            return 0;
        }
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(8, 1e-13, 1e-15);
        double lowerPart = integrator.integrate(1_000_000, s -> 3 * s * Math.pow(1 - s * s * s, -1.0 / 3), 0,
                Math.cbrt(Math.min(x, 0.5)));
        if (x <= 0.5) {
            return lowerPart;
        }
        return lowerPart + integrator.integrate(1_000_000, s -> 3 * s * Math.pow(1 - s * s * s, -1.0 / 3),
                Math.cbrt(1 - x), Math.cbrt(0.5));
    }

    @Property(tries = 200)
    void negativeBinomialAnscombeTendsToPoissonForLargeTheta(@ForAll @IntRange(min = 0, max = 200) int y,
            @ForAll("means") double mu) {
        double poisson = Families.poisson().anscombeResidual(y, mu);
        double nb = Families.negativeBinomial(1e9).anscombeResidual(y, mu);
        assertEquals(poisson, nb, 1e-6 * (1 + Math.abs(poisson)));
    }

    @Provide
    Arbitrary<Double> means() {
        return FamilyCase.logUniform(-2, 2.5);
    }

    @Property(tries = 300)
    void negativeBinomialDistributionFunctionSumsItsProbabilities(@ForAll @IntRange(min = 0, max = 300) int k,
            @ForAll("means") double mu, @ForAll("thetas") double theta) {
        // Non-integer theta has no Commons Math counterpart: the regularized beta form must equal the running sum.
        Family nb = Families.negativeBinomial(theta);
        double sum = 0;
        for (int j = 0; j <= k; j++) {
            sum += Math.exp(nb.logDensity(j, mu, 1, 1));
        }
        assertEquals(sum, nb.cumulativeProbability(k, mu, 1, 1), 1e-11);
    }

    @Provide
    Arbitrary<Double> thetas() {
        return FamilyCase.logUniform(-1.5, 3);
    }

    @Property(tries = 200)
    void binomialProbabilitiesOverAllProportionsSumToOne(@ForAll @IntRange(min = 1, max = 400) int n,
            @ForAll("probabilities") double mu) {
        double sum = 0;
        for (int k = 0; k <= n; k++) {
            sum += Math.exp(Families.binomial().logDensity((double) k / n, mu, 1, n));
        }
        assertEquals(1.0, sum, 1e-12);
    }

    @Provide
    Arbitrary<Double> probabilities() {
        return FamilyCase.uniform(1e-3, 1 - 1e-3);
    }

    @Provide
    Arbitrary<double[]> extremeTweedie() {
        return Combinators.combine(FamilyCase.uniform(1.001, 1.999), FamilyCase.logUniform(-10, 10),
                FamilyCase.logUniform(-6, 6), FamilyCase.logUniform(-6, 4), Arbitraries.of(0.5, 1.0, 40.0))
                .as((p, y, mu, phi, w) -> new double[] {p, y, mu, phi, w});
    }

    @Property(tries = 300)
    void tweedieStaysFiniteOverExtremeArguments(@ForAll("extremeTweedie") double[] c) {
        Family f = Families.tweedie(c[0]);
        double logDensity = f.logDensity(c[1], c[2], c[3], c[4]);
        double cdf = f.cumulativeProbability(c[1], c[2], c[3], c[4]);
        assertTrue(!Double.isNaN(logDensity) && logDensity < Double.POSITIVE_INFINITY, () -> "log f = " + logDensity);
        assertTrue(cdf >= 0 && cdf <= 1, () -> "F = " + cdf);
        double atom = f.cumulativeProbability(0, c[2], c[3], c[4]);
        assertTrue(cdf >= atom, () -> "F(y) = " + cdf + " below the atom " + atom);
    }
}
