package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;

/** Accuracy of the links far in their tails, where naive formulas overflow or cancel. */
class LinkTailTest {

    private static void assertRelative(double expected, double actual, double relative, String what) {
        assertTrue(Double.isFinite(actual), what + " is not finite: " + actual);
        assertEquals(expected, actual, relative * Math.abs(expected), what);
    }

    @Test
    void inverseLogitAtPlusMinus700IsFiniteAndAccurate() {
        Link logit = Links.logit();
        // Stable reference: for eta = -700, e = exp(eta) ~ 1e-304, so e / (1 + e) = e (1 - e + ...) = e
        // to the last bit; for eta = +700, 1 / (1 + exp(-700)) = 1 - 1e-304 = 1 in double precision.
        double e = Math.exp(-700.0);
        assertRelative(e, logit.inverse(-700.0), 1e-14, "inverse logit at -700");
        assertRelative(1.0, logit.inverse(700.0), 1e-14, "inverse logit at +700");
        // dmu/deta = e / (1 + e)^2 = e to the last bit at both ends (symmetry of the logistic density).
        assertRelative(e, logit.derivative(-700.0), 1e-14, "logit derivative at -700");
        assertRelative(e, logit.derivative(700.0), 1e-14, "logit derivative at +700");
        assertEquals(0.25, logit.derivative(0.0), 0.0);
        // Beyond the range of exp the mean underflows to 0 without NaN; the derivative too.
        assertEquals(0.0, logit.inverse(-800.0));
        assertEquals(1.0, logit.inverse(800.0));
        assertFalse(Double.isNaN(logit.derivative(-800.0)));
    }

    @Test
    void logitOfTinyMeanUsesItsLogarithm() {
        // log(mu / (1 - mu)) = log(mu) - log1p(-mu) = log(1e-300) to the last bit.
        assertRelative(Math.log(1e-300), Links.logit().apply(1e-300), 1e-15, "logit at 1e-300");
    }

    @Test
    void inverseProbitMatchesCommonsMathNormalInTheLowerTail() {
        // Reference: Apache Commons Math 3.6.1 NormalDistribution.cumulativeProbability.
        NormalDistribution standard = new NormalDistribution(0.0, 1.0);
        for (double eta : new double[] {-37.0, -30.0, -20.0, -8.0, -1.0, 0.0, 1.5, 5.0}) {
            assertRelative(standard.cumulativeProbability(eta), Links.probit().inverse(eta), 1e-15, "inverse probit at " + eta);
            assertRelative(standard.density(eta), Links.probit().derivative(eta), 1e-13, "probit derivative at " + eta);
        }
    }

    @Test
    void probitQuantileIsAccurateForMeansNearZeroAndOne() {
        Link probit = Links.probit();
        // 1.959963984540054 is the two-sided 5% point of the standard normal: common practice, no source.
        assertEquals(1.959963984540054, probit.apply(0.975), 1e-15);
        assertEquals(-1.959963984540054, probit.apply(0.025), 1e-15);
        // Agreement with Commons Math's inverse where its erfInv-based quantile is accurate (moderate p).
        NormalDistribution standard = new NormalDistribution(0.0, 1.0);
        for (double p : new double[] {1e-6, 0.01, 0.3, 0.5, 0.8, 0.999}) {
            assertEquals(standard.inverseCumulativeProbability(p), probit.apply(p), 1e-9, "quantile at " + p);
        }
        // At mu = 1e-300 the quantile must reproduce mu through the CDF (Commons Math's erfc form).
        double q = probit.apply(1e-300);
        assertTrue(q < -37.0 && q > -37.1, "quantile at 1e-300: " + q);
        assertRelative(1e-300, standard.cumulativeProbability(q), 1e-12, "Phi(Phi^-1(1e-300))");
        // Upper tail by symmetry: 1 - 2^-40 is exact in double precision.
        double upper = 1.0 - Math.scalb(1.0, -40);
        assertRelative(-probit.apply(Math.scalb(1.0, -40)), probit.apply(upper), 1e-15, "quantile near 1");
        assertTrue(Double.isFinite(probit.apply(Double.MIN_VALUE)));
    }

    @Test
    void cloglogInverseEqualsExpOfEtaInTheLowerTail() {
        // 1 - exp(-exp(eta)) = exp(eta) - exp(2 eta)/2 + ...; at eta = -40 the correction is 2e-18 relative.
        assertRelative(Math.exp(-40.0), Links.cloglog().inverse(-40.0), 1e-15, "inverse cloglog at -40");
        assertRelative(Math.exp(-700.0), Links.cloglog().inverse(-700.0), 1e-15, "inverse cloglog at -700");
        assertRelative(Math.exp(-40.0), Links.cloglog().derivative(-40.0), 1e-15, "cloglog derivative at -40");
        assertRelative(-40.0, Links.cloglog().apply(Math.exp(-40.0)), 1e-15, "cloglog at exp(-40)");
        assertEquals(1.0, Links.cloglog().inverse(40.0));
        assertEquals(0.0, Links.cloglog().derivative(40.0));
    }

    @Test
    void loglogIsAccurateNearOne() {
        // mu = 1 - 2^-40 exactly; -log(mu) = 2^-40 (1 + 2^-41 + ...), so g(mu) = 40 log 2 - 2^-41 + ...
        double mu = 1.0 - Math.scalb(1.0, -40);
        assertRelative(40 * Math.log(2.0) - Math.scalb(1.0, -41), Links.loglog().apply(mu), 1e-15, "loglog near 1");
        // inverse at eta = 40: mu = exp(-exp(-40)), 1 - mu = 4.2e-18 rounds to 1
        assertEquals(1.0, Links.loglog().inverse(40.0));
        assertRelative(Math.exp(-40.0), Links.loglog().derivative(40.0), 1e-15, "loglog derivative at 40");
    }

    @Test
    void cauchitTailsKeepRelativePrecision() {
        Link cauchit = Links.cauchit();
        // mu = 1/2 + atan(eta)/pi = atan(-1/eta)/pi for eta < 0, = 1/(pi |eta|) (1 - 1/(3 eta^2) + ...).
        assertRelative(1.0 / (Math.PI * 1e10), cauchit.inverse(-1e10), 1e-15, "inverse cauchit at -1e10");
        assertRelative(-1e10, cauchit.apply(1.0 / (Math.PI * 1e10)), 1e-14, "cauchit of a tiny mean");
        assertRelative(1.0 / (Math.PI * 1e20), cauchit.derivative(1e10), 1e-15, "cauchit derivative at 1e10");
        assertEquals(0.0, cauchit.apply(0.5), 0.0);
    }

    @Test
    void logLinkOverflowIsOutsideItsValidEtaDomain() {
        Link log = Links.log();
        assertTrue(log.isValidEta(709.0));
        assertTrue(Double.isFinite(log.inverse(709.0)));
        assertFalse(log.isValidEta(710.0));
        assertFalse(log.isValidEta(Double.NaN));
    }

    @Test
    void powerLinksWithSpecialExponentsAreTheNamedLinks() {
        assertSame(Links.log(), Links.power(0.0));
        assertSame(Links.identity(), Links.power(1.0));
        assertSame(Links.sqrt(), Links.power(0.5));
        assertSame(Links.inverse(), Links.power(-1.0));
        assertSame(Links.inverseSquared(), Links.power(-2.0));
        assertEquals("power:0.25", Links.power(0.25).name());
        assertEquals(Links.power(0.25), Links.byName("power:0.250"));
        assertEquals(0.25, Links.powerExponent(Links.power(0.25)).getAsDouble());
        assertEquals(-1.0, Links.powerExponent(Links.inverse()).getAsDouble());
        assertEquals(0.0, Links.powerExponent(Links.log()).getAsDouble());
        assertFalse(Links.powerExponent(Links.logit()).isPresent());
    }

    @Test
    void domainsOfThePowerLinks() {
        assertFalse(Links.inverse().isValidEta(0.0));
        assertFalse(Links.inverse().isValidEta(-1.0));
        assertTrue(Links.inverse().isValidEta(1e-300));
        assertTrue(Links.sqrt().isValidEta(0.0));
        assertFalse(Links.sqrt().isValidEta(-1e-9));
        assertFalse(Links.power(0.25).isValidEta(-2.0));
        assertFalse(Links.power(0.01).isValidEta(1e10));  // mean 1e1000 overflows
        assertTrue(Links.identity().isValidEta(-1e300));
        assertFalse(Links.identity().isValidEta(Double.POSITIVE_INFINITY));
    }
}
