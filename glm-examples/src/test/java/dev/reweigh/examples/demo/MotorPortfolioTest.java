package dev.reweigh.examples.demo;

import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.apache.commons.math3.stat.inference.ChiSquareTest;
import org.apache.commons.math3.stat.inference.KolmogorovSmirnovTest;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** The demo's samplers against Commons Math distributions, and the portfolio's reproducibility. */
class MotorPortfolioTest {
    @ParameterizedTest
    @ValueSource(doubles = {0.4, 1.0, 1.6, 4.8})
    void gammaSamplerFollowsTheGammaDistribution(double shape) {
        SplittableRandom random = new SplittableRandom(42);
        double[] draws = new double[20_000];
        for (int i = 0; i < draws.length; i++) {
            draws[i] = MotorPortfolio.gamma(random, shape);
        }
        // Reference: Commons Math GammaDistribution (shape, scale 1) and its Kolmogorov-Smirnov test.
        double p = new KolmogorovSmirnovTest().kolmogorovSmirnovTest(new GammaDistribution(shape, 1), draws);
        assertTrue(p > 1e-3, "KS p-value " + p + " for shape " + shape);
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.02, 0.3, 2.5})
    void poissonSamplerFollowsThePoissonDistribution(double mean) {
        SplittableRandom random = new SplittableRandom(7);
        int n = 50_000;
        int cells = 6;
        long[] observed = new long[cells];
        for (int i = 0; i < n; i++) {
            observed[Math.min(cells - 1, MotorPortfolio.poisson(random, mean))]++;
        }
        // Reference: Commons Math PoissonDistribution probabilities; the last cell takes the upper tail.
        PoissonDistribution reference = new PoissonDistribution(mean);
        double[] expected = new double[cells];
        for (int k = 0; k < cells - 1; k++) {
            expected[k] = n * reference.probability(k);
        }
        expected[cells - 1] = n * (1 - reference.cumulativeProbability(cells - 2));
        int used = 0;
        while (used < cells && expected[used] >= 5) {
            used++;
        }
        double[] e = java.util.Arrays.copyOf(expected, used);
        long[] o = java.util.Arrays.copyOf(observed, used);
        double restExpected = 0;
        long restObserved = 0;
        for (int k = used; k < cells; k++) {
            restExpected += expected[k];
            restObserved += observed[k];
        }
        if (restExpected > 0) {
            e[used - 1] += restExpected;
            o[used - 1] += restObserved;
        }
        double p = used >= 2 ? new ChiSquareTest().chiSquareTest(e, o) : 1;
        assertTrue(p > 1e-3, "chi-square p-value " + p + " for mean " + mean);
    }

    @Test
    void sameSeedSamePortfolioOtherSeedOtherPortfolio() {
        TrueModel truth = TrueModel.standard();
        MotorPortfolio a = MotorPortfolio.simulate(truth, 2_000, 1L);
        MotorPortfolio b = MotorPortfolio.simulate(truth, 2_000, 1L);
        MotorPortfolio c = MotorPortfolio.simulate(truth, 2_000, 2L);
        assertEquals(java.util.Arrays.toString(a.policies().numeric(TrueModel.CLAIM_TOTAL)),
                java.util.Arrays.toString(b.policies().numeric(TrueModel.CLAIM_TOTAL)));
        assertNotEquals(java.util.Arrays.toString(a.policies().numeric(TrueModel.CLAIM_TOTAL)),
                java.util.Arrays.toString(c.policies().numeric(TrueModel.CLAIM_TOTAL)));
    }

    @Test
    void policiesWithClaimsAreExactlyThoseWithPositiveCounts() {
        MotorPortfolio p = MotorPortfolio.simulate(TrueModel.standard(), 5_000, 3L);
        long positive = java.util.Arrays.stream(p.policies().numeric(TrueModel.CLAIMS)).filter(c -> c > 0).count();
        assertEquals(positive, p.policiesWithClaims().rowCount());
        for (double average : p.policiesWithClaims().numeric(TrueModel.AVERAGE_CLAIM)) {
            assertTrue(average > 0);
        }
    }

    @Test
    void trueCoefficientsAreLogsOfTheRelativities() {
        TrueModel t = TrueModel.standard();
        assertEquals(Math.log(1.85), t.frequencyCoefficient("driver_age=18-24").getAsDouble(), 1e-15);
        assertEquals(Math.log(1.45), t.severityCoefficient("vehicle_power=G5").getAsDouble(), 1e-15);
        assertEquals(0.0, t.severityCoefficient("driver_age=65+").getAsDouble());
        assertTrue(t.frequencyCoefficient("no such column").isEmpty());
        for (String factor : t.factors()) {
            assertEquals(1.0, t.frequencyRelativity(factor, t.baseLevel(factor)));
            assertEquals(1.0, t.severityRelativity(factor, t.baseLevel(factor)));
            assertEquals(1.0, t.mix(factor).values().stream().mapToDouble(Double::doubleValue).sum(), 1e-12);
        }
    }
}
