package dev.reweigh.inference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import org.junit.jupiter.api.Test;

/** Negative binomial theta by maximum likelihood and the Tweedie power by profile likelihood. */
class FamilyParameterTest {

    @Test
    void negativeBinomialThetaIsRecoveredWithinItsStandardError() {
        // claim counts from a Gamma-Poisson mixture with theta = 1.5; 4 standard errors of tolerance
        // (a correct estimator fails with probability about 6e-5; fixed seed)
        double theta = 1.5;
        FittedModel poisson = Glm.fit(TestData.vehicleAndAge("claims", Families.poisson())
                .logOffset("exposure").build(), TestData.negativeBinomialCounts(2000, theta, 171));
        NegativeBinomialTheta nb = NegativeBinomialTheta.estimate(poisson);
        assertTrue(nb.converged(), nb.toString());
        assertTrue(nb.warnings().isEmpty(), nb.toString());
        assertEquals(theta, nb.theta(), 4 * nb.standardError());
        assertEquals(nb.theta(), Families.negativeBinomialTheta(nb.fit().family()).getAsDouble(), 1e-6 * nb.theta());
        // starting again from the negative binomial fit changes nothing
        NegativeBinomialTheta again = NegativeBinomialTheta.estimate(nb.fit());
        assertEquals(nb.theta(), again.theta(), 1e-6 * nb.theta());
        // the profile interval contains the estimate and is about as wide as +-1.96 standard errors
        Interval interval = nb.profileInterval(0.95);
        assertTrue(interval.contains(nb.theta()));
        assertEquals(2 * 1.96 * nb.standardError(), interval.width(), 0.25 * interval.width());
        // theta counts as a parameter: one more than the negative binomial fit with theta given
        assertEquals(Inference.of(nb.fit()).informationCriteria().parameters() + 1,
                nb.informationCriteria().parameters());
        assertEquals(Inference.of(nb.fit()).logLikelihood(), nb.informationCriteria().logLikelihood(), 1e-9);
    }

    @Test
    void poissonCountsDriveThetaToTheBoundaryWithAWarning() {
        FittedModel poisson = Glm.fit(TestData.vehicleAndAge("claims", Families.poisson())
                .logOffset("exposure").build(), TestData.poissonCounts(300, 172));
        NegativeBinomialTheta nb = NegativeBinomialTheta.estimate(poisson);
        if (nb.theta() > 1e6) {
            assertTrue(nb.warnings().stream().anyMatch(w -> w.contains("no overdispersion")), nb.toString());
        } else {
            // a finite estimate from Poisson data must be large and compatible with infinity
            assertTrue(nb.profileInterval(0.95).upper() > 50, nb.toString());
        }
    }

    @Test
    void tweediePowerIsChosenByProfileLikelihood() {
        // pure premiums simulated as compound Poisson-Gamma sums with power 1.5 and dispersion 2 (fixed seed);
        // 500 rows, about a quarter of them zero
        FittedModel start = Glm.fit(TestData.vehicleAndAge("premium", Families.tweedie(1.5)).link(Links.log()).build(),
                TestData.compoundPoissonPremiums(500, 1.5, 2.0, 181));
        TweediePowerProfile profile = TweediePowerProfile.of(start, 1.1, 1.9, 5);
        assertEquals(5, profile.gridPowers().length);
        Interval interval = profile.profileInterval(0.95);
        assertTrue(interval.contains(profile.power()), profile + " " + interval);
        assertTrue(interval.contains(1.5), profile + " " + interval);
        // the refined power is at least as likely as every grid power
        for (double l : profile.gridLogLikelihoods()) {
            assertTrue(profile.logLikelihood() >= l - 1e-6, profile.toString());
        }
        assertEquals(2.0, profile.dispersion(), 0.5);
        assertEquals(profile.power(), Families.variancePower(profile.fit().family()).getAsDouble(), 1e-12);
    }
}
