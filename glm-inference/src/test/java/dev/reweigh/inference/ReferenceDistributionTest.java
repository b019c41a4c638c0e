package dev.reweigh.inference;

import static org.junit.jupiter.api.Assertions.assertEquals;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import dev.reweigh.inference.internal.Distributions;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.FDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.TDistribution;
import org.junit.jupiter.api.Test;

/** p-values and quantiles checked against Commons Math's distributions (reference library). */
class ReferenceDistributionTest {

    @Test
    void tailProbabilitiesAgreeWithCommonsMath() {
        NormalDistribution normal = new NormalDistribution();
        for (double z : new double[] {0, 0.3, 1.0, 1.96, 2.5, 4.0}) {
            assertEquals(2 * (1 - normal.cumulativeProbability(Math.abs(z))), Distributions.normalTwoSided(z), 1e-14);
        }
        for (int df : new int[] {1, 3, 10, 25, 200}) {
            TDistribution t = new TDistribution(df);
            ChiSquaredDistribution chi = new ChiSquaredDistribution(df);
            for (double x : new double[] {0.1, 0.8, 2.0, 3.5}) {
                assertEquals(2 * (1 - t.cumulativeProbability(x)), Distributions.tTwoSided(-x, df), 1e-12);
                assertEquals(1 - chi.cumulativeProbability(x * df), Distributions.chiSquareUpper(x * df, df), 1e-12);
            }
            for (int df1 : new int[] {1, 2, 5}) {
                FDistribution f = new FDistribution(df1, df);
                for (double x : new double[] {0.2, 1.0, 3.0, 8.0}) {
                    assertEquals(1 - f.cumulativeProbability(x), Distributions.fUpper(x, df1, df), 1e-12);
                }
            }
        }
    }

    @Test
    void quantilesAgreeWithCommonsMath() {
        for (double p : new double[] {0.9, 0.95, 0.975, 0.995}) {
            assertEquals(new NormalDistribution().inverseCumulativeProbability(p), Distributions.normalQuantile(p), 1e-9);
            assertEquals(new TDistribution(7).inverseCumulativeProbability(p), Distributions.tQuantile(p, 7), 1e-8);
            assertEquals(new ChiSquaredDistribution(4).inverseCumulativeProbability(p),
                    Distributions.chiSquareQuantile(p, 4), 1e-8);
            assertEquals(new FDistribution(3, 20).inverseCumulativeProbability(p), Distributions.fQuantile(p, 3, 20), 1e-8);
        }
    }

    @Test
    void coefficientTableUsesNormalReferenceWhenDispersionIsFixedAndTWhenEstimated() {
        FittedModel poisson = Glm.fit(TestData.vehicleAndAge("claims", Families.poisson())
                .logOffset("exposure").build(), TestData.poissonCounts(400, 11));
        NormalDistribution normal = new NormalDistribution();
        CoefficientTable z = Inference.of(poisson).withLevel(0.9).coefficients();
        double zq = normal.inverseCumulativeProbability(0.95);
        for (CoefficientRow r : z.rows()) {
            assertEquals(2 * normal.cumulativeProbability(-Math.abs(r.statistic())), r.pValue(), 1e-14);
            assertEquals(r.estimate() - zq * r.standardError(), r.waldInterval().orElseThrow().lower(), 1e-9);
            assertEquals(Math.exp(r.estimate()), r.relativity().getAsDouble(), 1e-12);
        }
        FittedModel gamma = Glm.fit(TestData.vehicleAndAge("severity", Families.gamma()).link(Links.log()).build(),
                TestData.gammaSeverities(60, 2.0, 12));
        CoefficientTable t = Inference.of(gamma).coefficients();
        TDistribution dist = new TDistribution(gamma.residualDf());
        double tq = dist.inverseCumulativeProbability(0.975);
        assertEquals(ReferenceDistribution.T, t.reference());
        assertEquals(gamma.residualDf(), t.degreesOfFreedom());
        for (CoefficientRow r : t.rows()) {
            assertEquals(2 * dist.cumulativeProbability(-Math.abs(r.statistic())), r.pValue(), 1e-12);
            assertEquals(r.estimate() + tq * r.standardError(), r.waldInterval().orElseThrow().upper(), 1e-8);
        }
    }

    @Test
    void singleColumnWaldTestIsTheSquareOfTheWaldStatistic() {
        FittedModel gamma = Glm.fit(TestData.vehicleAndAge("severity", Families.gamma()).link(Links.log()).build(),
                TestData.gammaSeverities(80, 2.0, 13));
        Inference estimated = Inference.of(gamma);
        CoefficientRow age = estimated.coefficients().row("age");
        WaldTest f = estimated.waldTest("age");
        assertEquals(ReferenceDistribution.F, f.reference());
        assertEquals(age.statistic() * age.statistic(), f.statistic(), 1e-9);
        assertEquals(age.pValue(), f.pValue(), 1e-10);
        assertEquals(1 - new FDistribution(1, gamma.residualDf()).cumulativeProbability(f.statistic()), f.pValue(), 1e-10);

        Inference known = estimated.withKnownDispersion(0.5);
        WaldTest chi = known.waldTest("vehicle=saloon", "vehicle=van");
        assertEquals(ReferenceDistribution.CHI_SQUARED, chi.reference());
        assertEquals(1 - new ChiSquaredDistribution(2).cumulativeProbability(chi.statistic()), chi.pValue(), 1e-12);
        // the same hypothesis written as a matrix
        int p = gamma.columnCount();
        double[][] l = new double[2][p];
        l[0][gamma.columnNames().indexOf("vehicle=saloon")] = 1;
        l[1][gamma.columnNames().indexOf("vehicle=van")] = 1;
        assertEquals(chi.statistic(), known.waldTest(l, new double[2]).statistic(), 1e-12);
    }
}
