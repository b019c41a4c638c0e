package dev.reweigh.inference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import java.util.List;
import org.apache.commons.math3.distribution.TDistribution;
import org.junit.jupiter.api.Test;

class PredictionAndSummaryTest {

    @Test
    void newDataPredictionsMatchTheFittedRowsAndUseTheDeltaMethod() {
        Table data = TestData.gammaSeverities(120, 2.0, 151);
        FittedModel fit = Glm.fit(TestData.vehicleAndAge("severity", Families.gamma()).link(Links.log()).build(), data);
        Inference inference = Inference.of(fit);
        List<Prediction> fitted = inference.predictions().predictions();
        List<Prediction> fresh = inference.predict(data).predictions();
        double[][] cov = inference.covariance();
        double[] x = new double[fit.columnCount()];
        double t = new TDistribution(fit.residualDf()).inverseCumulativeProbability(0.975);
        for (int i = 0; i < fitted.size(); i++) {
            Prediction a = fitted.get(i);
            Prediction b = fresh.get(i);
            assertEquals(a.mean(), b.mean(), 1e-9 * a.mean());
            assertEquals(a.linkStandardError(), b.linkStandardError(), 1e-12);
            assertEquals(fit.fittedValues()[i], a.mean(), 1e-9 * a.mean());
            fit.modelMatrixRow(i, x);
            double v = 0;
            for (int j = 0; j < x.length; j++) {
                for (int k = 0; k < x.length; k++) {
                    v += x[j] * cov[j][k] * x[k];
                }
            }
            assertEquals(Math.sqrt(v), a.linkStandardError(), 1e-12);
            // the log-scale interval mapped back through exp
            assertEquals(Math.exp(a.linearPredictor() - t * a.linkStandardError()), a.interval().lower(), 1e-9 * a.mean());
            assertTrue(a.interval().contains(a.mean()));
            assertEquals(a.mean() * Math.sqrt(inference.dispersion().value()), a.responseStandardDeviation(),
                    1e-9 * a.mean());
        }
        assertFalse(inference.predictions().toString().isEmpty());
    }

    @Test
    void poissonResponseStandardDeviationIsTheSquareRootOfTheMean() {
        FittedModel fit = ReferenceDataTest.shipsMainEffects();
        for (Prediction p : Inference.of(fit).predictions().predictions()) {
            assertEquals(Math.sqrt(p.mean()), p.responseStandardDeviation(), 1e-12);
        }
    }

    @Test
    void groupSummaryReproducesObservedMeansOfAFactorInACanonicalModel() {
        // with a canonical link and the factor in the model, the fitted totals per level equal the observed
        // totals (the likelihood equations), so the means agree
        FittedModel fit = ReferenceDataTest.shipsMainEffects();
        GroupSummary summary = Inference.of(fit).groupSummary("type");
        assertEquals(List.of("A", "B", "C", "D", "E"), summary.levels().stream().map(LevelSummary::level).toList());
        int rows = 0;
        for (LevelSummary s : summary.levels()) {
            assertEquals(s.observedMean(), s.fittedMean(), 1e-6 * s.observedMean());
            assertTrue(s.fittedStandardDeviation() > 0);
            rows += s.rows();
        }
        assertEquals(34, rows);
        // the fitted sd of a level: sqrt(mean phi V(mu) + variance of mu), here phi = 1 and V(mu) = mu
        LevelSummary b = summary.levels().get(1);
        double[] mu = fit.fittedValues();
        int[] used = fit.usedRows();
        int[] codes = fit.data().codes("type");
        double sum = 0;
        double sum2 = 0;
        int n = 0;
        for (int i = 0; i < mu.length; i++) {
            if (codes[used[i]] == 1) {
                sum += mu[i];
                sum2 += mu[i] * mu[i];
                n++;
            }
        }
        double mean = sum / n;
        assertEquals(Math.sqrt(mean + sum2 / n - mean * mean), b.fittedStandardDeviation(), 1e-9);
        assertTrue(summary.toString().contains("observed mean"));
    }

    @Test
    void groupSummaryOfACorrectGammaModelMatchesObservedSpread() {
        // Gamma severities with shape 2: per vehicle class (about 400 rows each) the observed standard deviation
        // should agree with the fitted one within sampling error (relative sd of a sample sd here is about 0.08;
        // the tolerance is 30%, fixed seed)
        FittedModel fit = DispersionTest.gammaFit(TestData.gammaSeverities(1200, 2.0, 163));
        for (LevelSummary s : Inference.of(fit).groupSummary("vehicle").levels()) {
            assertEquals(s.fittedStandardDeviation(), s.observedStandardDeviation(), 0.3 * s.fittedStandardDeviation(),
                    s.toString());
            assertEquals(s.fittedMean(), s.observedMean(), 0.1 * s.fittedMean(), s.toString());
        }
    }

    @Test
    void goodnessOfFitSaysWhereTheChiSquareReferenceIsNotMeaningful() {
        GoodnessOfFit grouped = Inference.of(ReferenceDataTest.beetles(Links.logit())).goodnessOfFit();
        assertTrue(grouped.isMeaningful());
        assertEquals(org.apache.commons.math3.special.Gamma.regularizedGammaQ(3.0, grouped.deviance() / 2),
                grouped.devianceP().getAsDouble(), 1e-12);

        // binary responses: one trial per row
        TestData.Portfolio p = new TestData.Portfolio(200, 161);
        double[] lapsed = new double[200];
        for (int i = 0; i < 200; i++) {
            double prob = 1 / (1 + Math.exp(-p.logMean(i, -0.5)));
            lapsed[i] = p.rng.nextDouble() < prob ? 1 : 0;
        }
        FittedModel binary = Glm.fit(TestData.vehicleAndAge("lapsed", Families.binomial()).build(),
                p.table().numeric("lapsed", lapsed).build());
        GoodnessOfFit gof = Inference.of(binary).goodnessOfFit();
        assertFalse(gof.isMeaningful());
        assertTrue(gof.devianceP().isEmpty());
        assertTrue(gof.note().contains("binary"), gof.note());

        GoodnessOfFit gamma = Inference.of(DispersionTest.gammaFit(TestData.gammaSeverities(50, 2.0, 162)))
                .goodnessOfFit();
        assertFalse(gamma.isMeaningful());
        assertTrue(gamma.note().contains("estimated"), gamma.note());
    }

    @Test
    void reportsUseOurOwnPlainWordsAndNoStars() {
        Inference inference = Inference.of(ReferenceDataTest.shipsMainEffects());
        String text = inference + "\n" + inference.withDispersion(DispersionMethod.PEARSON).devianceTable() + "\n"
                + inference.goodnessOfFit() + "\n" + inference.diagnostics() + "\n"
                + inference.groupSummary("year");
        for (String title : List.of("term", "estimate", "std error", "p-value", "lower 95%", "upper 95%", "relativity")) {
            assertTrue(text.contains(title), title);
        }
        // No significance stars, no formula strings: the report speaks in words only.
        for (String mark : List.of("*", "~")) {
            assertFalse(text.contains(mark), mark);
        }
    }
}
