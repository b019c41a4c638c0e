package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.apache.commons.math3.analysis.UnivariateFunction;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.junit.jupiter.api.Test;

/**
 * The inverse Gaussian density and distribution function against the closed form of R. S. Chhikara
 * and J. L. Folks (1989), The Inverse Gaussian Distribution (Marcel Dekker), with shape
 * lambda = 1/phi: f(y) = sqrt(lambda / (2 pi y^3)) exp(-lambda (y - mu)^2 / (2 mu^2 y)) (the formula
 * written here from memory), and against numerical integration with Commons Math's
 * IterativeLegendreGaussIntegrator.
 */
class InverseGaussianTest {
    private static final Family IG = Families.inverseGaussian();

    @Provide
    Arbitrary<Double> positive() {
        return FamilyCase.logUniform(-2, 2);
    }

    @Property(tries = 500)
    void densityMatchesTheClosedForm(@ForAll("positive") double y, @ForAll("positive") double mu,
            @ForAll("positive") double phi, @ForAll("positive") double w) {
        double lambda = w / phi;
        double closedForm = Math.sqrt(lambda / (2 * Math.PI * y * y * y))
                * Math.exp(-lambda * (y - mu) * (y - mu) / (2 * mu * mu * y));
        double ours = Math.exp(IG.logDensity(y, mu, phi, w));
        assertEquals(closedForm, ours, 1e-12 * closedForm + 1e-300);
    }

    /**
     * Integral of g over (0, upper] on the scale t = log(y / mu), where the density is smooth and
     * its width is about sqrt(phi mu): panels of width 1/2 from t = -60, each integrated to a
     * relative 1e-13.
     */
    static double integrate(UnivariateFunction density, double mu, double upper) {
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(8, 1e-13, 1e-16);
        UnivariateFunction onLogScale = t -> {
            double y = mu * Math.exp(t);
            return density.value(y) * y;
        };
        double end = Math.log(upper / mu);
        double sum = 0;
        for (double a = -60; a < end; a += 0.5) {
            sum += integrator.integrate(1_000_000, onLogScale, a, Math.min(a + 0.5, end));
        }
        return sum;
    }

    @Provide
    Arbitrary<Double> means() {
        return FamilyCase.logUniform(-1, 1);
    }

    @Provide
    Arbitrary<Double> dispersions() {
        return FamilyCase.logUniform(-2, 0.5);
    }

    @Property(tries = 30)
    void densityIntegratesToOneAndCdfIsItsIntegral(@ForAll("means") double mu, @ForAll("dispersions") double phi) {
        UnivariateFunction f = y -> Math.exp(IG.logDensity(y, mu, phi, 1.0));
        assertEquals(1.0, integrate(f, mu, mu * Math.exp(60)), 1e-10, "total probability");
        for (double q : new double[] {0.3, 1.0, 2.5}) {
            double y = q * mu;
            assertEquals(integrate(f, mu, y), IG.cumulativeProbability(y, mu, phi, 1.0), 1e-10, "F at " + y);
        }
    }

    @Test
    void cdfStaysFiniteWhereTheTextbookFormOverflows() {
        // lambda / mu = 1000: exp(2 lambda / mu) = exp(2000) overflows, the Mills-ratio form does not.
        double mu = 1.0;
        double phi = 1e-3;
        UnivariateFunction f = y -> Math.exp(IG.logDensity(y, mu, phi, 1.0));
        for (double y : new double[] {0.9, 0.97, 1.0, 1.05, 1.2}) {
            double cdf = IG.cumulativeProbability(y, mu, phi, 1.0);
            assertTrue(cdf >= 0 && cdf <= 1, "F at " + y + " = " + cdf);
            assertEquals(integrate(f, mu, y), cdf, 1e-10, "F at " + y);
        }
        // Far in the upper tail the mass that is left is below double precision: F = 1.
        assertEquals(1.0, IG.cumulativeProbability(1e6, mu, phi, 1.0), 0.0);
        assertEquals(0.0, IG.cumulativeProbability(0.0, mu, phi, 1.0), 0.0);
    }

    @Test
    void priorWeightDividesTheDispersion() {
        assertEquals(IG.logDensity(1.3, 2.0, 0.5, 1.0), IG.logDensity(1.3, 2.0, 2.0, 4.0), 1e-14);
        assertEquals(IG.cumulativeProbability(1.3, 2.0, 0.5, 1.0), IG.cumulativeProbability(1.3, 2.0, 2.0, 4.0), 1e-15);
    }
}
