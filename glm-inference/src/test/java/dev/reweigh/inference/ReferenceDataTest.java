package dev.reweigh.inference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.families.Families;
import dev.reweigh.families.Link;
import dev.reweigh.families.Links;
import org.junit.jupiter.api.Test;

/** Checks against published worked examples (data and sources in src/test/resources, SOURCES.md). */
class ReferenceDataTest {

    static FittedModel shipsMainEffects() {
        ModelSpec spec = ModelSpec.builder("incidents").family(Families.poisson())
                .factor("type", "A").factor("year", "60").factor("period", "60").logOffset("service").build();
        return Glm.fit(spec, TestData.ships());
    }

    static FittedModel beetles(Link link) {
        ModelSpec spec = ModelSpec.builder("killed").trials("exposed").family(Families.binomial()).link(link)
                .numeric("dose").build();
        return Glm.fit(spec, TestData.beetles());
    }

    @Test
    void shipDamagePearsonStatisticAndDispersionMatchPublishedValues() {
        // McCullagh & Nelder 1989, Generalized Linear Models, Section 6.3.2, Table 6.2 (from memory, as
        // SOURCES.md says): deviance 38.69 on 25 df, Pearson chi-square about 42.3, dispersion about 1.69.
        FittedModel fit = shipsMainEffects();
        assertEquals(34, fit.rowCount());
        assertEquals(25, fit.residualDf());
        assertEquals(38.69, fit.deviance(), 0.006); // printed as 38.69; we get 38.695
        Inference quasi = Inference.of(fit).withDispersion(DispersionMethod.PEARSON);
        GoodnessOfFit gof = quasi.goodnessOfFit();
        assertEquals(42.3, gof.pearsonChiSquare(), 0.05);
        assertEquals(1.69, quasi.dispersion().value(), 0.005);
        assertEquals(gof.pearsonChiSquare() / 25, quasi.dispersion().value(), 1e-12);
        // the quasi-Poisson standard errors are the Poisson ones times sqrt(phi)
        CoefficientTable fixed = Inference.of(fit).coefficients();
        CoefficientTable scaled = quasi.coefficients();
        double ratio = Math.sqrt(quasi.dispersion().value());
        for (CoefficientRow row : fixed.rows()) {
            assertEquals(row.standardError() * ratio, scaled.row(row.name()).standardError(), 1e-12);
        }
        assertEquals(ReferenceDistribution.NORMAL, fixed.reference());
        assertEquals(ReferenceDistribution.T, scaled.reference());
    }

    @Test
    void beetleMortalityLogitMatchesPrintedEstimatesStandardErrorsAndDeviance() {
        // Dobson & Barnett 2008, An Introduction to Generalized Linear Models, 3rd ed., Section 7.3,
        // Table 7.2 (from memory): logit -60.72 (5.18) + 34.27 (2.91) x, deviance 11.23.
        FittedModel fit = beetles(Links.logit());
        CoefficientTable table = Inference.of(fit).coefficients();
        assertEquals(-60.72, table.row("intercept").estimate(), 0.005);
        assertEquals(5.18, table.row("intercept").standardError(), 0.005);
        assertEquals(34.27, table.row("dose").estimate(), 0.005);
        assertEquals(2.91, table.row("dose").standardError(), 0.005);
        assertEquals(11.23, fit.deviance(), 0.005);
        assertEquals(6, fit.residualDf());
        // grouped binomial data: the goodness-of-fit references are meaningful
        assertTrue(Inference.of(fit).goodnessOfFit().isMeaningful());
    }

    @Test
    void beetleMortalityProbitAndComplementaryLogLogDeviancesMatchPrintedDigits() {
        // Dobson & Barnett 2008, Section 7.3, Table 7.2 (from memory): probit deviance 10.12,
        // complementary log-log deviance 3.45.
        assertEquals(10.12, beetles(Links.probit()).deviance(), 0.005);
        assertEquals(3.45, beetles(Links.cloglog()).deviance(), 0.005);
        // all three share response, rows, weights and family, so they can be ranked by AIC; with the same
        // number of parameters the ranking follows the deviance: complementary log-log first
        ModelComparison c = ModelComparison.of(Criterion.AIC, beetles(Links.logit()), beetles(Links.probit()),
                beetles(Links.cloglog()));
        assertEquals("cloglog", c.best().fit().link().name());
        assertFalse(c.toString().isEmpty());
    }
}
