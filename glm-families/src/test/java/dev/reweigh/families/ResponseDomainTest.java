package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Which responses and means each family accepts, and how bad arguments are reported. */
class ResponseDomainTest {

    @Test
    void binomialNeedsAWholeNumberOfSuccessesWhenTheTrialsAreWhole() {
        Family b = Families.binomial();
        assertTrue(b.isValidResponse(0.5, 2));
        assertFalse(b.isValidResponse(0.5, 3));             // 1.5 successes
        assertTrue(b.isValidResponse(1.0 / 3, 3));          // 0.9999999999999999 * ... rounds within 1e-7
        assertTrue(b.isValidResponse(0.3, 2.5));            // fractional weights: any proportion
        assertTrue(b.isValidResponse(0.0, 7) && b.isValidResponse(1.0, 7));
        assertFalse(b.isValidResponse(1.2, 1) || b.isValidResponse(-0.1, 1) || b.isValidResponse(Double.NaN, 1));
        assertTrue(b.responseDomain().contains("[0, 1]"));
    }

    @Test
    void countsMustBeNonNegativeWholeNumbers() {
        for (Family f : new Family[] {Families.poisson(), Families.negativeBinomial(2)}) {
            assertTrue(f.isValidResponse(0, 1) && f.isValidResponse(3, 1) && f.isValidResponse(3 + 1e-9, 1));
            assertFalse(f.isValidResponse(2.5, 1) || f.isValidResponse(-1, 1) || f.isValidResponse(Double.POSITIVE_INFINITY, 1));
            assertEquals("a non-negative whole number", f.responseDomain());
        }
    }

    @Test
    void positiveAndNonNegativeResponses() {
        for (Family f : new Family[] {Families.gamma(), Families.inverseGaussian(), Families.quasi("mu^2")}) {
            assertFalse(f.isValidResponse(0, 1) || f.isValidResponse(-1, 1) || f.isValidResponse(Double.NaN, 1));
            assertTrue(f.isValidResponse(1e-300, 1));
        }
        Family t = Families.tweedie(1.5);
        assertTrue(t.isValidResponse(0, 1) && t.isValidResponse(2.7, 1));
        assertFalse(t.isValidResponse(-1e-9, 1) || t.isValidResponse(Double.POSITIVE_INFINITY, 1));
        assertTrue(Families.gaussian().isValidResponse(-5, 1));
        assertFalse(Families.gaussian().isValidResponse(Double.NaN, 1));
    }

    @Test
    void meanDomains() {
        assertTrue(Families.gaussian().isValidMean(-3));
        assertFalse(Families.poisson().isValidMean(0) || Families.poisson().isValidMean(Double.POSITIVE_INFINITY));
        assertFalse(Families.binomial().isValidMean(0) || Families.binomial().isValidMean(1));
        assertTrue(Families.binomial().isValidMean(1e-300));
    }

    @Test
    void startingMeansFollowTheStatedRules() {
        // Common practice, no source: binomial (w y + 1/2) / (w + 1), Poisson y + 0.1.
        assertEquals((4 * 0.0 + 0.5) / 5, Families.binomial().startingMean(0.0, 4), 0.0);
        assertEquals((4 * 1.0 + 0.5) / 5, Families.binomial().startingMean(1.0, 4), 0.0);
        assertEquals(0.1, Families.poisson().startingMean(0, 1), 0.0);
        assertEquals(3.5, Families.gamma().startingMean(3.5, 1), 0.0);
    }

    @Test
    void badDensityArgumentsAreReportedNotReturnedAsNaN() {
        Family g = Families.gamma();
        ReweighException mean = assertThrows(ReweighException.class, () -> g.logDensity(1, -2, 1, 1));
        assertTrue(mean.getMessage().contains("-2.0") && mean.getMessage().contains("positive"), mean.getMessage());
        ReweighException phi = assertThrows(ReweighException.class, () -> g.logDensity(1, 2, 0, 1));
        assertTrue(phi.getMessage().contains("dispersion"), phi.getMessage());
        assertThrows(ReweighException.class, () -> g.cumulativeProbability(1, 2, 1, Double.NaN));
        assertThrows(ReweighException.class, () -> Families.binomial().logDensity(0.5, 1.0, 1, 2));
        // A response outside the support has density 0.
        assertEquals(Double.NEGATIVE_INFINITY, Families.poisson().logDensity(2.5, 1, 1, 1));
        assertEquals(Double.NEGATIVE_INFINITY, g.logDensity(-1, 2, 1, 1));
        assertEquals(Double.NEGATIVE_INFINITY, Families.binomial().logDensity(0.5, 0.4, 1, 3));   // 1.5 successes
        assertTrue(Double.isFinite(Families.binomial().logDensity(0.5, 0.4, 1, 2.5)));            // fractional trials
        assertEquals(0.0, Families.poisson().cumulativeProbability(-1, 1, 1, 1));
    }

    @Test
    void frequencyWeightsMultiplyTheCountLogDensity() {
        assertEquals(3 * Families.poisson().logDensity(4, 2.2, 1, 1), Families.poisson().logDensity(4, 2.2, 1, 3), 1e-13);
        Family nb = Families.negativeBinomial(1.7);
        assertEquals(2.5 * nb.logDensity(4, 2.2, 1, 1), nb.logDensity(4, 2.2, 1, 2.5), 1e-13);
        // Fixed dispersion: the dispersion argument is ignored.
        assertEquals(nb.logDensity(4, 2.2, 1, 1), nb.logDensity(4, 2.2, 5, 1), 0.0);
    }

    @Test
    void binomialDevianceAtTheBoundaries() {
        Family b = Families.binomial();
        assertEquals(-2 * Math.log1p(-0.3), b.unitDeviance(0, 0.3), 1e-15);
        assertEquals(-2 * Math.log(0.3), b.unitDeviance(1, 0.3), 1e-15);
        // y = 0 and mu = 1e-20: the deviance 2e-20 keeps its digits (log1p form).
        assertEquals(2e-20, b.unitDeviance(0, 1e-20), 1e-35);
        assertEquals(2 * 0.7, Families.poisson().unitDeviance(0, 0.7), 1e-15);
        assertEquals(2 * 3 * Math.log1p(0.7 / 3), Families.negativeBinomial(3).unitDeviance(0, 0.7), 1e-15);
    }
}
