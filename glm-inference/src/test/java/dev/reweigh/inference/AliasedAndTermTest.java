package dev.reweigh.inference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import dev.reweigh.families.UnknownNameException;
import org.junit.jupiter.api.Test;

class AliasedAndTermTest {

    @Test
    void aliasedColumnsAppearWithNoEstimate() {
        TestData.Portfolio p = new TestData.Portfolio(80, 191);
        double[] months = new double[80];
        double[] y = new double[80];
        for (int i = 0; i < 80; i++) {
            months[i] = 120 * p.age[i];  // age in decades, restated in months: the same column scaled
            y[i] = Math.exp(p.logMean(i, 6.0)) * (0.8 + 0.4 * p.rng.nextDouble());
        }
        Table t = p.table().numeric("months", months).numeric("severity", y).build();
        FittedModel fit = Glm.fit(ModelSpec.builder("severity").family(Families.gamma()).link(Links.log())
                .numeric("age").numeric("months").factor("vehicle", "hatchback").build(), t);
        assertEquals(1, fit.aliasedColumns().size(), fit.toString());
        String aliased = fit.aliasedColumns().get(0);
        Inference inference = Inference.of(fit);
        CoefficientRow row = inference.coefficients().row(aliased);
        assertTrue(row.isAliased());
        assertTrue(Double.isNaN(row.estimate()));
        assertTrue(row.waldInterval().isEmpty());
        assertTrue(row.relativity().isEmpty());
        assertTrue(inference.coefficients().toString().contains("aliased"));
        assertThrows(IllegalArgumentException.class, () -> inference.waldTest(aliased));
        assertThrows(IllegalArgumentException.class, () -> inference.profileInterval(aliased));
        // leverages still sum to the rank (the aliased column carries no information)
        assertEquals(fit.rank(), TestData.sum(inference.diagnostics().leverage()), 1e-9);
        // profile intervals skip the aliased row and exist for the others
        for (CoefficientRow r : inference.coefficientsWithProfileIntervals().rows()) {
            assertEquals(!r.isAliased(), r.profileInterval().isPresent(), r.name());
        }
    }

    @Test
    void aColumnHeldFixedIsReportedAsFixedAndLeftOutOfTheEstimates() {
        FittedModel ships = ReferenceDataTest.shipsMainEffects();
        FittedModel held = ships.refitWithFixed("period=75", 0.5);
        Inference inference = Inference.of(held);
        CoefficientRow row = inference.coefficients().row("period=75");
        assertTrue(row.isFixed());
        assertEquals(0.5, row.estimate());
        assertTrue(Double.isNaN(row.standardError()));
        assertTrue(row.relativity().isEmpty());
        assertTrue(inference.coefficients().toString().contains("held fixed"));
        assertEquals(held.rank(), TestData.sum(inference.diagnostics().leverage()), 1e-9);
        assertThrows(IllegalArgumentException.class, () -> inference.waldTest("period=75"));
        // the other coefficients are estimated as usual
        assertFalse(inference.coefficients().row("type=B").isFixed());
        assertTrue(inference.coefficients().row("type=B").standardError() > 0);
    }

    @Test
    void termTestCoversEveryColumnOfTheTerm() {
        FittedModel ships = ReferenceDataTest.shipsMainEffects();
        Inference inference = Inference.of(ships);
        WaldTest term = inference.waldTestOfTerm("type");
        WaldTest columns = inference.waldTest("type=B", "type=C", "type=D", "type=E");
        assertEquals(4, term.numeratorDf());
        assertEquals(columns.statistic(), term.statistic(), 1e-12);
        assertThrows(UnknownNameException.class, () -> inference.waldTestOfTerm("colour"));
        assertThrows(UnknownNameException.class, () -> inference.waldTest("type=Z"));
        // the Wald and likelihood-ratio tests of the same term agree in direction and roughly in size
        LikelihoodRatioTest lrt = inference.likelihoodRatioTest(ships.refit(ships.spec().withoutTerm("type")));
        assertEquals(lrt.statistic(), term.statistic(), 0.25 * lrt.statistic());
        assertFalse(term.toString().isEmpty());
    }

    @Test
    void levelsOutsideTheUnitIntervalAndLinearlyDependentHypothesesAreRefused() {
        Inference inference = Inference.of(ReferenceDataTest.shipsMainEffects());
        assertThrows(IllegalArgumentException.class, () -> inference.withLevel(1.0));
        assertThrows(IllegalArgumentException.class, () -> inference.withLevel(0));
        assertThrows(IllegalArgumentException.class, () -> inference.withKnownDispersion(-1));
        assertThrows(IllegalArgumentException.class, () -> inference.withDispersion(DispersionMethod.KNOWN));
        assertThrows(IllegalArgumentException.class, () -> inference.waldTest("type=B", "type=B"));
        assertThrows(IllegalArgumentException.class, () -> inference.waldTest(new double[][] {{1}}, new double[] {0}));
    }
}
