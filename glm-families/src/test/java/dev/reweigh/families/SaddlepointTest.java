package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.special.Beta;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;

/**
 * The saddlepoint distribution functions used for very large parameters, checked where the
 * reference (Commons Math 3.6.1 regularized incomplete gamma and beta functions,
 * org.apache.commons.math3.special.Gamma and Beta) is still accurate: sizes 1e4 and 1e5. The
 * error of the saddlepoint forms decreases with the size, so agreement here bounds it above 1e7,
 * where the families switch to them.
 */
class SaddlepointTest {

    private static void assertTail(double reference, double actual, double relative, String what) {
        double tail = Math.min(reference, 1 - reference);
        assertEquals(reference, actual, relative * tail + 1e-15, what);
    }

    @Test
    void gammaMatchesTheIncompleteGammaFunction() {
        for (double shape : new double[] {1e4, 1e5}) {
            double tolerance = shape == 1e4 ? 1e-7 : 1e-8;
            for (double z = -6; z <= 6; z += 0.25) {
                double y = 2.0 * (1 + z / Math.sqrt(shape));
                assertTail(Gamma.regularizedGammaP(shape, shape * y / 2.0), GammaFamily.saddlepointDistribution(y, 2.0, shape),
                        tolerance, "shape " + shape + " z " + z);
            }
        }
    }

    @Test
    void countsMatchTheIncompleteGammaAndBetaFunctions() {
        for (double size : new double[] {1e4, 1e5}) {
            double tolerance = size == 1e4 ? 1e-6 : 3e-7;
            NegativeBinomialFamily nb = (NegativeBinomialFamily) Families.negativeBinomial(size);
            for (double z = -6; z <= 6; z += 0.25) {
                double k = Math.floor(size + z * Math.sqrt(size));
                assertTail(Gamma.regularizedGammaQ(k + 1, size), PoissonFamily.saddlepointDistribution(k, size),
                        tolerance, "Poisson mean " + size + " z " + z);
                double trials = size / 0.09;
                double kb = Math.floor(0.1 * trials + z * Math.sqrt(size));
                assertTail(Beta.regularizedBeta(0.9, trials - kb, kb + 1), BinomialFamily.saddlepointDistribution(kb, trials, 0.1),
                        tolerance, "binomial variance " + size + " z " + z);
                double kn = Math.floor(size + z * Math.sqrt(2 * size));
                assertTail(Beta.regularizedBeta(0.5, size, kn + 1), nb.saddlepointDistribution(kn, size),
                        tolerance, "negative binomial mean " + size + " z " + z);
            }
        }
    }

    @Test
    void familiesSwitchToTheSaddlepointFormForHugeParameters() {
        // Where Commons Math's evaluation breaks down (a shape-1e12 Gamma: off in the 4th digit; a
        // binomial with 1e15 trials at its mean: 0.53 instead of 0.50000001), the families still give
        // the normal limit with its skewness correction: F(mean) = 1/2 + (skewness/6 + continuity) phi(0).
        double phiAtZero = 1 / Math.sqrt(2 * Math.PI);
        double shape = 1e12;
        assertEquals(0.5 + phiAtZero * (2 / Math.sqrt(shape)) / 6,
                Families.gamma().cumulativeProbability(1.0, 1.0, 1.0 / shape, 1.0), 1e-15);
        double n = 1e15;
        double sd = Math.sqrt(n / 4);
        assertEquals(0.5 + phiAtZero * 0.5 / sd, Families.binomial().cumulativeProbability(0.5, 0.5, 1, n), 1e-14);
        double mu = 1e12;
        assertEquals(0.5 + phiAtZero * (0.5 + 1.0 / 6) / Math.sqrt(mu),
                Families.poisson().cumulativeProbability(mu, mu, 1, 1), 1e-12);
        double previous = 0;
        for (double z = -8; z <= 8; z += 0.5) {
            double value = Families.gamma().cumulativeProbability(1 + z / Math.sqrt(shape), 1.0, 1.0 / shape, 1.0);
            assertTrue(value >= previous && value <= 1);
            previous = value;
        }
    }
}
