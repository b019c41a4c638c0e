package dev.reweigh.inference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import org.apache.commons.math3.distribution.ChiSquaredDistribution;
import org.apache.commons.math3.distribution.FDistribution;
import org.junit.jupiter.api.Test;

/** Likelihood-ratio tests, the analysis of deviance and profile-likelihood intervals. */
class ModelTestsTest {

    @Test
    void likelihoodRatioStatisticIsTheDevianceDifferenceOverTheDispersion() {
        FittedModel full = ReferenceDataTest.shipsMainEffects();
        FittedModel smaller = full.refit(full.spec().withoutTerm("year"));
        LikelihoodRatioTest chi = Inference.of(full).likelihoodRatioTest(smaller);
        assertEquals(smaller.deviance() - full.deviance(), chi.statistic(), 1e-12);
        assertEquals(3, chi.dfDifference());
        assertEquals(ReferenceDistribution.CHI_SQUARED, chi.reference());
        assertEquals(1 - new ChiSquaredDistribution(3).cumulativeProbability(chi.statistic()), chi.pValue(), 1e-12);

        Inference quasi = Inference.of(full).withDispersion(DispersionMethod.PEARSON);
        LikelihoodRatioTest f = quasi.likelihoodRatioTest(smaller);
        double phi = quasi.dispersion().value();
        assertEquals((smaller.deviance() - full.deviance()) / (3 * phi), f.statistic(), 1e-12);
        assertEquals(ReferenceDistribution.F, f.reference());
        assertEquals(1 - new FDistribution(3, 25).cumulativeProbability(f.statistic()), f.pValue(), 1e-12);

        LikelihoodRatioTest known = Inference.of(full).withKnownDispersion(2.0).likelihoodRatioTest(smaller);
        assertEquals((smaller.deviance() - full.deviance()) / 2.0, known.statistic(), 1e-12);
    }

    @Test
    void modelsThatDifferAreRefusedWithAMessageSayingWhat() {
        FittedModel full = ReferenceDataTest.shipsMainEffects();
        FittedModel otherFamily = full.refit(full.spec().withFamily(Families.negativeBinomial(5)));
        ModelMismatchException family = assertThrows(ModelMismatchException.class,
                () -> Inference.of(full).likelihoodRatioTest(otherFamily.refit(otherFamily.spec().withoutTerm("year"))));
        assertTrue(family.getMessage().contains("families differ"), family.getMessage());

        Table fewer = TestData.ships().select(new int[] {0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16, 17,
            18, 19, 20, 21, 22, 23, 24, 25, 26, 27, 28, 29});
        FittedModel onFewerRows = Glm.fit(full.spec().withoutTerm("year"), fewer);
        ModelMismatchException rows = assertThrows(ModelMismatchException.class,
                () -> Inference.of(full).likelihoodRatioTest(onFewerRows));
        assertTrue(rows.getMessage().contains("rows"), rows.getMessage());

        assertThrows(IllegalArgumentException.class, () -> Inference.of(full.refit(full.spec().withoutTerm("year")))
                .likelihoodRatioTest(full));
    }

    @Test
    void sequentialDevianceTableAddsTermsInOrderAndEndsAtTheFullModel() {
        FittedModel full = ReferenceDataTest.shipsMainEffects();
        DevianceTable table = Inference.of(full).devianceTable();
        assertEquals(4, table.steps().size());
        assertEquals(full.nullDeviance(), table.steps().get(0).residualDeviance(), 1e-9);
        DevianceStep last = table.steps().get(3);
        assertEquals("period", last.term());
        assertEquals(full.deviance(), last.residualDeviance(), 1e-9);
        double total = 0;
        int df = 0;
        for (DevianceStep s : table.steps().subList(1, 4)) {
            total += s.devianceReduction();
            df += s.df();
            assertEquals(1 - new ChiSquaredDistribution(s.df()).cumulativeProbability(s.statistic()), s.pValue(), 1e-12);
        }
        assertEquals(full.nullDeviance() - full.deviance(), total, 1e-8);
        assertEquals(full.nullDf() - full.residualDf(), df);
        // the last step equals the likelihood-ratio test of dropping the last term
        LikelihoodRatioTest lrt = Inference.of(full).likelihoodRatioTest(full.refit(full.spec().withoutTerm("period")));
        assertEquals(lrt.statistic(), last.statistic(), 1e-8);
    }

    @Test
    void profileIntervalsContainTheEstimateAndApproachTheWaldIntervalAsRowsGrow() {
        double smallGap = relativeGap(80);
        double largeGap = relativeGap(3000);
        // the profile and Wald intervals differ by O(1/sqrt(n)) relative to their width
        assertTrue(largeGap < smallGap / 2, "gap at n=3000 " + largeGap + ", at n=80 " + smallGap);
        assertTrue(largeGap < 0.03, "gap at n=3000 " + largeGap);
    }

    private static double relativeGap(int n) {
        FittedModel fit = Glm.fit(TestData.vehicleAndAge("claims", Families.poisson()).logOffset("exposure").build(),
                TestData.poissonCounts(n, 61));
        CoefficientTable table = Inference.of(fit).coefficientsWithProfileIntervals();
        double worst = 0;
        for (CoefficientRow r : table.rows()) {
            Interval profile = r.profileInterval().orElseThrow();
            Interval wald = r.waldInterval().orElseThrow();
            assertTrue(profile.contains(r.estimate()), r.toString());
            double gap = Math.max(Math.abs(profile.lower() - wald.lower()), Math.abs(profile.upper() - wald.upper()))
                    / wald.width();
            worst = Math.max(worst, gap);
        }
        return worst;
    }

    @Test
    void profileIntervalOfAGaussianLinearModelEqualsTheWaldTInterval() {
        // for a Gaussian identity model the deviance is exactly quadratic in each coefficient, so the F/t-based
        // profile criterion reproduces the t interval (common practice, no source)
        FittedModel fit = Glm.fit(TestData.vehicleAndAge("severity", Families.gaussian()).build(),
                TestData.gaussianSeverities(50, 200, 71));
        Inference inference = Inference.of(fit);
        for (CoefficientRow r : inference.coefficientsWithProfileIntervals().rows()) {
            Interval p = r.profileInterval().orElseThrow();
            Interval w = r.waldInterval().orElseThrow();
            assertEquals(w.lower(), p.lower(), 1e-5 * w.width());
            assertEquals(w.upper(), p.upper(), 1e-5 * w.width());
        }
        assertEquals(inference.coefficientsWithProfileIntervals().row("age").profileInterval().orElseThrow(),
                inference.withLevel(0.95).profileInterval("age"));
    }

    @Test
    void relativityIntervalsOfALogLinkAreExponentiatedCoefficientIntervals() {
        FittedModel fit = Glm.fit(TestData.vehicleAndAge("severity", Families.gamma()).link(Links.log()).build(),
                TestData.gammaSeverities(150, 2.0, 72));
        for (CoefficientRow r : Inference.of(fit).coefficients().rows()) {
            Interval rel = r.relativityInterval().orElseThrow();
            assertEquals(Math.exp(r.waldInterval().orElseThrow().lower()), rel.lower(), 1e-12);
            assertTrue(rel.contains(r.relativity().getAsDouble()));
        }
        FittedModel identity = fit.refit(fit.spec().withLink(Links.identity()));
        assertTrue(Inference.of(identity).coefficients().row("age").relativity().isEmpty());
    }
}
