package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.families.FamilyCase.Point;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/** Invariants every family must keep, over generated responses and means. */
class FamilyPropertiesTest {

    @Provide
    Arbitrary<Point> points() {
        return FamilyCase.points(FamilyCase.ALL);
    }

    @Provide
    Arbitrary<Point> densityPoints() {
        return FamilyCase.points(FamilyCase.WITH_DENSITY);
    }

    /** A mean and a relative perturbation r with 1e-10 &lt;= |r| &lt;= 1e-4, either sign. */
    @Provide
    Arbitrary<double[]> nearbyPoints() {
        Arbitrary<Double> r = Combinators.combine(FamilyCase.logUniform(-10, -4), Arbitraries.of(-1.0, 1.0))
                .as((m, s) -> m * s);
        return Combinators.combine(Arbitraries.integers().between(0, FamilyCase.ALL.size() - 1), r,
                FamilyCase.unit()).as((i, rel, u) -> new double[] {i, rel, u});
    }

    @Property(tries = 3000)
    void unitDevianceIsNonNegativeAndFinite(@ForAll("points") Point p) {
        if (!p.family().isValidResponse(p.y(), p.weight())) {
            throw new AssertionError("generator produced an invalid response: " + p);
        }
        double d = p.family().unitDeviance(p.y(), p.mu());
        assertTrue(d >= 0 && Double.isFinite(d), () -> p + " deviance " + d);
    }

    /** The unit deviance as a function of a real y (whole or not) vanishes at y = mu, exactly. */
    @Property(tries = 2000)
    void unitDevianceIsZeroAtTheMean(@ForAll("points") Point p) {
        assertEquals(0.0, p.family().unitDeviance(p.mu(), p.mu()), 0.0, p::toString);
    }

    /**
     * Near y = mu every unit deviance is (y - mu)^2 / V(mu) up to a relative O(|y - mu| / mu); a
     * form that cancels would instead lose all digits at |y - mu| = 1e-10 mu. The tolerance
     * 5 |r| + 1e-9 allows the first-order correction (coefficient below 2 for these families).
     */
    @Property(tries = 3000)
    void unitDevianceIsAccurateCloseToTheMean(@ForAll("nearbyPoints") double[] draw) {
        Family family = FamilyCase.ALL.get((int) draw[0]);
        double r = draw[1];
        double mu = meanFor(family, draw[2]);
        double scale = family.name().equals("binomial") || family.name().equals("quasi:mu(1-mu)")
                ? Math.min(mu, 1 - mu) : family.isValidMean(-1.0) ? 1.0 : mu;
        double y = mu + r * scale;
        double leading = (y - mu) * (y - mu) / family.variance(mu);
        double ratio = family.unitDeviance(y, mu) / leading;
        assertEquals(1.0, ratio, 5 * Math.abs(r) + 1e-9, () -> family.name() + " y=" + y + " mu=" + mu);
        double anscombe = family.anscombeResidual(y, mu) / ((y - mu) / Math.sqrt(family.variance(mu)));
        assertEquals(1.0, anscombe, 5 * Math.abs(r) + 1e-6, () -> family.name() + " Anscombe y=" + y + " mu=" + mu);
    }

    private static double meanFor(Family family, double u) {
        if (family.isValidMean(-1.0)) {
            return -1e3 + 2e3 * u;
        }
        if (family.isValidMean(2.0)) {
            return Math.pow(10, -3 + 6 * u);
        }
        return 1e-6 + u * (1 - 2e-6);
    }

    @Property(tries = 2000)
    void varianceIsPositiveOnTheMeanDomain(@ForAll("points") Point p) {
        assertTrue(p.family().isValidMean(p.mu()), p::toString);
        double v = p.family().variance(p.mu());
        assertTrue(v > 0 && Double.isFinite(v), () -> p + " variance " + v);
    }

    @Property(tries = 2000)
    void startingMeanIsAlwaysValid(@ForAll("points") Point p) {
        double start = p.family().startingMean(p.y(), p.weight());
        assertTrue(p.family().isValidMean(start), () -> p + " start " + start);
    }

    @Property(tries = 2000)
    void anscombeResidualHasTheSignOfTheResponseResidual(@ForAll("points") Point p) {
        double a = p.family().anscombeResidual(p.y(), p.mu());
        assertTrue(Double.isFinite(a), () -> p + " Anscombe " + a);
        assertTrue(Math.signum(a) == Math.signum(p.y() - p.mu()) || Math.abs(a) < 1e-12, () -> p + " Anscombe " + a);
    }

    /**
     * For an exponential dispersion model log f(y; mu, phi) = log a(y, phi) - d(y, mu) / (2 phi),
     * so d(y, mu) = 2 [log f(y; y, 1, 1) - log f(y; mu, 1, 1)]. It holds for every family with a
     * density at unit weight; for the binomial family only when the single trial's outcome y is 0
     * or 1 (the identity needs y itself to be a valid mean, so y = 0 and y = 1 use the limit, and
     * for the count families y = 0 is skipped).
     */
    @Property(tries = 2000)
    void devianceIsTwiceTheLogDensityDrop(@ForAll("densityPoints") Point p) {
        Family f = p.family();
        double y = p.y();
        double mu = p.mu();
        double deviance = f.unitDeviance(y, mu);
        double saturated;
        if (f.name().equals("binomial")) {
            y = p.y() >= 0.5 ? 1.0 : 0.0;
            deviance = f.unitDeviance(y, mu);
            saturated = 0.0;   // log P(Y = y) at mu = y is log 1
        } else if (!f.isValidMean(y)) {
            return;
        } else {
            saturated = f.logDensity(y, y, 1.0, 1.0);
        }
        double fitted = f.logDensity(y, mu, 1.0, 1.0);
        double drop = 2 * (saturated - fitted);
        double tolerance = 1e-9 * (1 + deviance + Math.abs(saturated) + Math.abs(fitted));
        assertEquals(deviance, drop, tolerance, p::toString);
    }

    @Property(tries = 500)
    void distributionFunctionIsAProbabilityAndNonDecreasing(@ForAll("densityPoints") Point p) {
        Family f = p.family();
        double phi = f.isDispersionFixed() ? 1.0 : 0.7;
        double at = f.cumulativeProbability(p.y(), p.mu(), phi, p.weight());
        double above = f.cumulativeProbability(p.y() + 0.5 * Math.abs(p.y()) + 1, p.mu(), phi, p.weight());
        assertTrue(at >= 0 && at <= 1, () -> p + " F=" + at);
        assertTrue(above >= at - 1e-15, () -> p + " F(y)=" + at + " F(larger)=" + above);
    }

    @Property(tries = 200)
    void quasiFamiliesHaveNoDensity(@ForAll("points") Point p) {
        if (p.family().hasDensity()) {
            return;
        }
        assertThrows(NoLikelihoodException.class, () -> p.family().logDensity(p.y(), p.mu(), 1.0, 1.0));
        assertThrows(NoLikelihoodException.class, () -> p.family().cumulativeProbability(p.y(), p.mu(), 1.0, 1.0));
        assertTrue(!p.family().isDispersionFixed());
    }

    @Property(tries = 500)
    void namesRoundTripThroughByName(@ForAll("points") Point p) {
        Family again = Families.byName(p.family().name());
        assertEquals(p.family(), again);
        assertEquals(p.family().name(), again.name());
        assertEquals(p.family().hashCode(), again.hashCode());
    }
}
