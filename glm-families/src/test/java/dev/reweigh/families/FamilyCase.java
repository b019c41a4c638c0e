package dev.reweigh.families;

import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;

/**
 * Test generators: for each family, valid responses (with the prior weight they need) and valid
 * means on ranges where the variance function neither underflows nor overflows.
 */
record FamilyCase(Family family, Arbitrary<Observation> observations, Arbitrary<Double> means) {

    /** A response with its prior weight (the number of trials for the binomial family). */
    record Observation(double y, double weight) {
    }

    /** A family with one generated observation and one mean. */
    record Point(Family family, double y, double weight, double mu) {
        @Override
        public String toString() {
            return family.name() + " y=" + y + " w=" + weight + " mu=" + mu;
        }
    }

    static Arbitrary<Double> unit() {
        return Arbitraries.doubles().between(0, 1).ofScale(15);
    }

    /** Log-uniform on [10^lo, 10^hi]. */
    static Arbitrary<Double> logUniform(double lo, double hi) {
        return unit().map(u -> Math.pow(10, lo + u * (hi - lo)));
    }

    static Arbitrary<Double> uniform(double lo, double hi) {
        return unit().map(u -> lo + u * (hi - lo));
    }

    private static Arbitrary<Observation> unitWeight(Arbitrary<Double> ys) {
        return ys.map(y -> new Observation(y, 1.0));
    }

    private static Arbitrary<Double> counts() {
        return Arbitraries.oneOf(Arbitraries.integers().between(0, 30), Arbitraries.integers().between(0, 2000))
                .map(Integer::doubleValue);
    }

    private static Arbitrary<Observation> proportions() {
        return Arbitraries.integers().between(1, 60).flatMap(n -> Arbitraries.integers().between(0, n)
                .map(k -> new Observation((double) k / n, n)));
    }

    private static Arbitrary<Double> nonNegative() {
        // Zero in about one draw out of four: the atom of the Tweedie family and the boundary of the others.
        return Arbitraries.oneOf(Arbitraries.just(0.0), logUniform(-3, 3), logUniform(-3, 3), logUniform(-3, 3));
    }

    private static Arbitrary<Double> probabilities() {
        return Arbitraries.oneOf(uniform(1e-6, 1 - 1e-6), logUniform(-6, -0.3011), logUniform(-6, -0.3011).map(v -> 1 - v));
    }

    static FamilyCase of(Family family) {
        String name = family.name();
        Arbitrary<Double> positive = logUniform(-3, 3);
        if (name.equals("gaussian") || name.equals("quasi:constant")) {
            return new FamilyCase(family, unitWeight(uniform(-1e3, 1e3)), uniform(-1e3, 1e3));
        }
        if (name.equals("binomial") || name.equals("quasi:mu(1-mu)")) {
            return new FamilyCase(family, proportions(), probabilities());
        }
        if (name.equals("poisson") || name.startsWith("negative-binomial:")) {
            return new FamilyCase(family, unitWeight(counts()), positive);
        }
        if (family.isValidResponse(0.0, 1.0)) {
            return new FamilyCase(family, unitWeight(nonNegative()), positive);
        }
        return new FamilyCase(family, unitWeight(positive), positive);
    }

    static final List<Family> ALL = List.of(
            Families.gaussian(), Families.binomial(), Families.poisson(), Families.gamma(), Families.inverseGaussian(),
            Families.tweedie(1.01), Families.tweedie(1.2), Families.tweedie(1.5), Families.tweedie(1.8),
            Families.tweedie(1.99), Families.negativeBinomial(0.5), Families.negativeBinomial(3.0),
            Families.negativeBinomial(50.0), Families.negativeBinomial(1e6),
            Families.quasi("constant"), Families.quasi("mu"), Families.quasi("mu^2"), Families.quasi("mu^3"),
            Families.quasi("mu(1-mu)"), Families.quasiPower(1.5), Families.quasiPower(2.5), Families.quasiPower(0.5),
            Families.quasiPower(-1.0));

    static final List<Family> WITH_DENSITY = ALL.stream().filter(Family::hasDensity).toList();

    static Arbitrary<Point> points(List<Family> families) {
        return Arbitraries.of(families).map(FamilyCase::of).flatMap(c -> Combinators.combine(c.observations(), c.means())
                .as((o, mu) -> new Point(c.family(), o.y(), o.weight(), mu)));
    }
}
