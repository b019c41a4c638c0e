package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;

import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;

/** The numerical building blocks behind the densities and the probit link. */
class ProbabilityMathTest {

    @Provide
    Arbitrary<Double> lowerTail() {
        return FamilyCase.unit().map(u -> Math.pow(10, -300 * u)).filter(p -> p <= 0.5);
    }

    @Property(tries = 1000)
    void normalQuantileInvertsTheDistributionFunction(@ForAll("lowerTail") double p) {
        double x = ProbabilityMath.normalQuantile(p);
        assertEquals(p, ProbabilityMath.normalCdf(x), 1e-12 * p, () -> "p=" + p + " x=" + x);
        double upper = 1 - p;
        double xu = ProbabilityMath.normalQuantile(upper);
        // 1 - p rounds, so compare through the exact complement of the rounded value.
        assertEquals(1 - upper, ProbabilityMath.normalCdf(-xu), 1e-12 * (1 - upper), () -> "upper p=" + upper);
    }

    @Test
    void millsRatioIsContinuousWhereItSwitchesToTheContinuedFraction() {
        double below = ProbabilityMath.millsRatio(Math.nextDown(10.0));
        double at = ProbabilityMath.millsRatio(10.0);
        assertEquals(below, at, 1e-13 * at);
        // Asymptotically R(z) = 1/z - 1/z^3 + 3/z^5 - ...: common practice, no source.
        double z = 1e4;
        assertEquals(1 / z - 1 / (z * z * z), ProbabilityMath.millsRatio(z), 1e-15 / z);
    }

    @Property(tries = 500)
    void stirlingRemainderMatchesLogGamma(@ForAll("positive") double z) {
        double direct = Gamma.logGamma(z + 1) - (z + 0.5) * Math.log(z) + z - 0.5 * Math.log(2 * Math.PI);
        // Both forms agree to their rounding: the direct form's terms reach |(z + 1/2) log z|, and
        // below 15 the shifted form's terms reach (z + n + 1/2) log(z + n) ~ 46, i.e. about 1e-14.
        double tolerance = 2e-14 + 4e-16 * (Math.abs(Gamma.logGamma(z + 1)) + Math.abs((z + 0.5) * Math.log(z)) + z);
        assertEquals(direct, ProbabilityMath.stirlingRemainder(z), tolerance, () -> "z=" + z);
    }

    @Provide
    Arbitrary<Double> positive() {
        return FamilyCase.logUniform(-3, 4);
    }

    @Property(tries = 1000)
    void bd0MatchesItsDirectFormAwayFromTheMean(@ForAll("positive") double x, @ForAll("positive") double m) {
        double direct = x * Math.log(x / m) + m - x;
        if (Math.abs(x - m) > 0.5 * (x + m)) {
            assertEquals(direct, ProbabilityMath.bd0(x, m), 1e-13 * (Math.abs(direct) + x * Math.abs(Math.log(x / m))));
        }
    }

    @Test
    void bd0NearTheMeanIsTheLeadingQuadraticTerm() {
        // x log(x/m) + m - x = (x - m)^2 / (2m) - (x - m)^3 / (6 m^2) + (x - m)^4 / (12 m^3) - ...:
        // Taylor series, common practice, no source.
        double m = 7.0;
        double x = m + 1e-6;
        double d = x - m;   // exact, unlike 1e-6 itself after the rounding of m + 1e-6
        double expected = d * d / (2 * m) - d * d * d / (6 * m * m) + d * d * d * d / (12 * m * m * m);
        assertEquals(expected, ProbabilityMath.bd0(x, m), 1e-15 * expected);
    }
}
