package dev.reweigh.inference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import dev.reweigh.families.NoLikelihoodException;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.random.Well19937c;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;

class DispersionTest {

    static FittedModel gammaFit(Table t) {
        return Glm.fit(TestData.vehicleAndAge("severity", Families.gamma()).link(Links.log()).build(), t);
    }

    @Test
    void gammaMaximumLikelihoodSolvesTheShapeEquationWithUnitWeights() {
        // McCullagh & Nelder 1989, Generalized Linear Models, chapter 8 (from memory): with unit weights the
        // ML shape nu = 1/phi solves n [log nu - digamma(nu)] = D / 2.
        FittedModel fit = gammaFit(TestData.gammaSeverities(300, 3.0, 21));
        double phi = DispersionEstimate.of(fit, DispersionMethod.MAXIMUM_LIKELIHOOD).value();
        double nu = 1 / phi;
        int n = fit.rowCount();
        assertEquals(fit.deviance() / 2, n * (Math.log(nu) - Gamma.digamma(nu)), 1e-8 * fit.deviance());
    }

    @Test
    void gammaMaximumLikelihoodSolvesTheShapeEquationWithPriorWeights() {
        // McCullagh & Nelder 1989, chapter 8 (from memory): each row's shape is w_i nu, and
        // sum_i w_i [log(w_i nu) - digamma(w_i nu)] = D / 2.
        Table t = TestData.weightedGammaSeverities(300, 2.0, 22);
        FittedModel fit = Glm.fit(TestData.vehicleAndAge("severity", Families.gamma()).link(Links.log())
                .weights("claims").build(), t);
        double nu = 1 / DispersionEstimate.of(fit, DispersionMethod.MAXIMUM_LIKELIHOOD).value();
        double[] w = fit.priorWeights();
        double lhs = 0;
        for (double wi : w) {
            lhs += wi * (Math.log(wi * nu) - Gamma.digamma(wi * nu));
        }
        assertEquals(fit.deviance() / 2, lhs, 1e-8 * fit.deviance());
        // the weights were built with shape w_i x 2, so 1/nu estimates 1/2
        DispersionEstimate ml = DispersionEstimate.of(fit, DispersionMethod.MAXIMUM_LIKELIHOOD);
        assertEquals(0.5, ml.value(), 4 * ml.standardError().getAsDouble());
    }

    @Test
    void maximumLikelihoodAndPearsonEstimatesApproachOneOverTheShape() {
        // Simulated claim severities with shape k = 4 (true phi = 0.25). The test allows 4 standard errors,
        // so a correct estimator fails it with probability about 6e-5 per estimate; the seed is fixed.
        double k = 4.0;
        FittedModel fit = gammaFit(TestData.gammaSeverities(2000, k, 23));
        DispersionEstimate ml = DispersionEstimate.of(fit, DispersionMethod.MAXIMUM_LIKELIHOOD);
        DispersionEstimate pearson = DispersionEstimate.of(fit, DispersionMethod.PEARSON);
        // the ML standard error agrees with the expected information of the shape, n [trigamma(nu) - 1/nu],
        // mapped to phi = 1/nu by the delta method (common practice, no source)
        double nu = 1 / ml.value();
        double expectedSe = 1 / (nu * nu * Math.sqrt(2000 * (Gamma.trigamma(nu) - 1 / nu)));
        assertEquals(expectedSe, ml.standardError().getAsDouble(), 0.01 * expectedSe);
        assertEquals(1 / k, ml.value(), 4 * ml.standardError().getAsDouble());
        // Pearson: var(r^2) = (2k + 6) / k^3 for Gamma(k) data (from the Gamma's fourth moment)
        double pearsonSe = Math.sqrt((2 * k + 6) / (k * k * k) / 2000);
        assertEquals(1 / k, pearson.value(), 4 * pearsonSe);
        assertEquals(pearsonSe, pearson.standardError().getAsDouble(), 0.3 * pearsonSe);
        // the likelihood interval contains the ML estimate and the true value here
        Interval interval = ml.likelihoodInterval(0.95).orElseThrow();
        assertTrue(interval.contains(ml.value()));
        assertTrue(interval.contains(1 / k));
    }

    @Test
    void scaledChiSquareResponseIsGammaWithDispersionTwoOverK() {
        // A response mu X / k with X ~ chi-square(k) is Gamma with dispersion 2/k and variance mu^2 2/k
        // (common practice, no source). Simulate, fit a Gamma log-linear model, and compare.
        int k = 5;
        int n = 3000;
        Well19937c rng = new Well19937c(31);
        ChiSquaredDistribution chi = new ChiSquaredDistribution(rng, k);
        TestData.Portfolio p = new TestData.Portfolio(n, 32);
        double[] y = new double[n];
        double sumSquaredRelative = 0;
        for (int i = 0; i < n; i++) {
            double mu = Math.exp(p.logMean(i, 5.0));
            y[i] = mu * chi.sample() / k;
            double rel = (y[i] - mu) / mu;
            sumSquaredRelative += rel * rel;
        }
        // variance mu^2 2/k: the mean squared relative deviation estimates 2/k; its sd is sqrt(var(r^2)/n)
        double phi = 2.0 / k;
        double shape = k / 2.0;
        double se = Math.sqrt((2 * shape + 6) / (shape * shape * shape) / n);
        assertEquals(phi, sumSquaredRelative / n, 4 * se);
        FittedModel fit = gammaFit(p.table().numeric("severity", y).build());
        DispersionEstimate ml = DispersionEstimate.of(fit, DispersionMethod.MAXIMUM_LIKELIHOOD);
        assertEquals(phi, ml.value(), 4 * ml.standardError().getAsDouble());
        assertEquals(phi, Inference.of(fit).dispersion().value(), 4 * se);
        // the response's standard deviation per row is mu sqrt(phi) for the Gamma family
        Prediction first = Inference.of(fit).predictions().predictions().get(0);
        assertEquals(first.mean() * Math.sqrt(Inference.of(fit).dispersion().value()),
                first.responseStandardDeviation(), 1e-12);
    }

    @Test
    void closedFormMaximumLikelihoodForGaussianAndInverseGaussian() {
        Table t = TestData.gaussianSeverities(200, 150, 41);
        FittedModel gauss = Glm.fit(TestData.vehicleAndAge("severity", Families.gaussian()).build(), t);
        double rss = 0;
        double[] y = gauss.response();
        double[] mu = gauss.fittedValues();
        for (int i = 0; i < y.length; i++) {
            rss += (y[i] - mu[i]) * (y[i] - mu[i]);
        }
        assertEquals(rss / y.length, DispersionEstimate.of(gauss, DispersionMethod.MAXIMUM_LIKELIHOOD).value(),
                1e-9 * rss);
        assertEquals(rss / gauss.residualDf(), DispersionEstimate.of(gauss, DispersionMethod.DEVIANCE).value(),
                1e-9 * rss);
        // the chi-square interval for a Gaussian linear model: RSS / phi ~ chi-square(n - p)
        Interval ci = DispersionEstimate.of(gauss, DispersionMethod.DEVIANCE).chiSquareInterval(0.95).orElseThrow();
        ChiSquaredDistribution chi = new ChiSquaredDistribution(gauss.residualDf());
        assertEquals(rss / chi.inverseCumulativeProbability(0.975), ci.lower(), 1e-6 * ci.lower());

        FittedModel ig = Glm.fit(TestData.vehicleAndAge("severity", Families.inverseGaussian())
                .link(Links.log()).build(), TestData.gammaSeverities(200, 3.0, 42));
        DispersionEstimate igMl = DispersionEstimate.of(ig, DispersionMethod.MAXIMUM_LIKELIHOOD);
        assertEquals(ig.deviance() / ig.rowCount(), igMl.value(), 1e-12 * ig.deviance());
        // the closed form is the likelihood's maximiser: nearby values have a lower log-likelihood
        Interval li = igMl.likelihoodInterval(0.95).orElseThrow();
        assertTrue(li.lower() < igMl.value() && igMl.value() < li.upper());
    }

    @Test
    void numericMaximumLikelihoodDispersionOfATweedieModelAndItsLikelihoodInterval() {
        FittedModel fit = Glm.fit(TestData.vehicleAndAge("premium", Families.tweedie(1.5)).link(Links.log()).build(),
                TestData.compoundPoissonPremiums(300, 1.5, 2.0, 43));
        DispersionEstimate ml = DispersionEstimate.of(fit, DispersionMethod.MAXIMUM_LIKELIHOOD);
        double best = logLikelihood(fit, ml.value());
        assertTrue(best >= logLikelihood(fit, ml.value() * 1.001));
        assertTrue(best >= logLikelihood(fit, ml.value() / 1.001));
        // at the interval's ends twice the drop in log-likelihood is the chi-square(1) 95% quantile, 3.8415
        // (Commons Math's ChiSquaredDistribution gives the quantile)
        double cut = new ChiSquaredDistribution(1).inverseCumulativeProbability(0.95);
        Interval interval = ml.likelihoodInterval(0.95).orElseThrow();
        assertEquals(cut, 2 * (best - logLikelihood(fit, interval.lower())), 1e-6);
        assertEquals(cut, 2 * (best - logLikelihood(fit, interval.upper())), 1e-6);
        // the Pearson estimate has the same likelihood interval (it does not depend on the method)
        assertEquals(interval.lower(), DispersionEstimate.of(fit, DispersionMethod.PEARSON).likelihoodInterval(0.95)
                .orElseThrow().lower(), 1e-9);
    }

    private static double logLikelihood(FittedModel fit, double phi) {
        double[] y = fit.response();
        double[] mu = fit.fittedValues();
        double[] w = fit.priorWeights();
        double l = 0;
        for (int i = 0; i < y.length; i++) {
            l += fit.family().logDensity(y[i], mu[i], phi, w[i]);
        }
        return l;
    }

    @Test
    void fixedDispersionFamiliesRefuseMaximumLikelihoodAndQuasiFamiliesHaveNone() {
        FittedModel poisson = Glm.fit(ModelSpec.builder("claims").family(Families.poisson())
                .factor("vehicle", "hatchback").logOffset("exposure").build(), TestData.poissonCounts(100, 51));
        assertEquals(DispersionMethod.FAMILY_FIXED, Inference.of(poisson).dispersion().method());
        assertEquals(1.0, Inference.of(poisson).dispersion().value());
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> DispersionEstimate.of(poisson, DispersionMethod.MAXIMUM_LIKELIHOOD));
        assertTrue(e.getMessage().contains("PEARSON"), e.getMessage());
        FittedModel quasi = poisson.refit(poisson.spec().withFamily(Families.quasi("mu")));
        assertThrows(NoLikelihoodException.class,
                () -> DispersionEstimate.of(quasi, DispersionMethod.MAXIMUM_LIKELIHOOD));
        assertThrows(NoLikelihoodException.class, () -> Inference.of(quasi).informationCriteria());
        assertEquals(DispersionMethod.PEARSON, Inference.of(quasi).dispersion().method());
    }
}
