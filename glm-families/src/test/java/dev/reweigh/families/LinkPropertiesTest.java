package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Invariants of every link on an eta range where its inverse is not saturated in double precision.
 *
 * <p>Why the ranges stop where they do: a mean near 1 is stored with an absolute error of about
 * 1.1e-16, so g(g^-1(eta)) can only recover eta to 1.1e-16 / (dmu/deta). For the round trip to hold
 * to 1e-12 that bounds the upper end: logit and loglog eta &lt;= 10 (dmu/deta ~ e^-eta), probit
 * eta &lt;= 4, cloglog eta &lt;= 2.5 (dmu/deta = e^(eta - e^eta)), cauchit eta &lt;= 1000. The lower
 * ends are where the mean would underflow: logit and cloglog -700 (mu ~ e^eta), probit -37
 * (mu ~ 6e-300), loglog -6 (mu = exp(-e^6) ~ 1e-175). The unbounded links use wide ranges: log
 * [-700, 700], cauchit down to -1e12, inverse and inverse-squared [1e-6, 1e6], sqrt [0, 1e6], other
 * powers [1e-3, 1e3] (whose exponent 1/lambda amplifies relative errors by |log eta|).
 *
 * <p>The round-trip tolerance is 1e-12 relative to max(1, |eta|): near eta = 0 the bounded links
 * map eta to a mean near 1/2 (or near 1 for log), whose rounding limits eta absolutely, so a purely
 * relative check of eta = 1e-300 would test the representation of 1/2, not the link.
 */
class LinkPropertiesTest {

    record Range(Link link, double low, double high) {
    }

    record Point(Link link, double eta) {
    }

    record Pair(Link link, double eta1, double eta2) {
    }

    static final List<Range> RANGES = List.of(
            new Range(Links.identity(), -1e6, 1e6),
            new Range(Links.log(), -700, 700),
            new Range(Links.logit(), -700, 10),
            new Range(Links.probit(), -37, 4),
            new Range(Links.cloglog(), -700, 2.5),
            new Range(Links.loglog(), -6, 10),
            new Range(Links.cauchit(), -1e12, 1e3),
            new Range(Links.inverse(), 1e-6, 1e6),
            new Range(Links.inverseSquared(), 1e-6, 1e6),
            new Range(Links.sqrt(), 0, 1e6),
            new Range(Links.power(1.0 / 3), 1e-3, 1e3),
            new Range(Links.power(2.0), 1e-3, 1e3),
            new Range(Links.power(-0.5), 1e-3, 1e3),
            new Range(Links.power(-3.0), 1e-3, 1e3),
            new Range(Links.power(1.7), 1e-3, 1e3));

    /** Uniform on [0, 1] with 15 decimals (jqwik's default scale of 2 would give a coarse grid). */
    static Arbitrary<Double> unit() {
        return Arbitraries.doubles().between(0, 1).ofScale(15);
    }

    /** Spreads points over the range both uniformly and on a log scale, so that small |eta| is visited. */
    private static Arbitrary<Double> etaIn(Range r) {
        Arbitrary<Double> uniform = unit().map(u -> r.low() + u * (r.high() - r.low()));
        Arbitrary<Double> logScale = unit().map(u -> Math.pow(10, -12 * u))
                .map(f -> r.low() >= 0 ? r.low() + f * (r.high() - r.low()) : f * (r.low() < -1 ? -1 : r.low()));
        return Arbitraries.oneOf(uniform, logScale).filter(eta -> eta >= r.low() && eta <= r.high());
    }

    @Provide
    Arbitrary<Point> points() {
        return Arbitraries.of(RANGES).flatMap(r -> etaIn(r).map(eta -> new Point(r.link(), eta)));
    }

    @Provide
    Arbitrary<Pair> pairs() {
        return Arbitraries.of(RANGES).flatMap(r -> Combinators.combine(etaIn(r), etaIn(r))
                .as((a, b) -> new Pair(r.link(), Math.min(a, b), Math.max(a, b))));
    }

    @Property(tries = 3000)
    void linkOfInverseGivesEtaBack(@ForAll("points") Point p) {
        Link link = p.link();
        assertTrue(link.isValidEta(p.eta()), () -> link + " rejects " + p.eta());
        double back = link.apply(link.inverse(p.eta()));
        assertEquals(p.eta(), back, 1e-12 * Math.max(1.0, Math.abs(p.eta())), () -> link.name() + " at " + p.eta());
    }

    /**
     * Central difference with step h = 1e-6 max(|eta|, 1e-3): truncation error about h^2 f''' / 6,
     * relative 1e-9 or less on these ranges (up to ~3e-7 for probit at eta = -37, where the density
     * bends fastest relative to itself), and rounding error about 2 eps |mu| / h. The tolerance
     * 1e-5 |dmu/deta| + 1e-14 (|mu(eta+h)| + |mu(eta-h)|) / h covers both with a wide margin.
     */
    @Property(tries = 3000)
    void derivativeAgreesWithCentralDifference(@ForAll("points") Point p) {
        Link link = p.link();
        double eta = p.eta();
        double h = 1e-6 * Math.max(Math.abs(eta), 1e-3);
        double up = link.inverse(eta + h);
        double down = link.inverse(eta - h);
        double numeric = (up - down) / (2 * h);
        double analytic = link.derivative(eta);
        double tolerance = 1e-5 * Math.abs(analytic) + 1e-14 * (Math.abs(up) + Math.abs(down)) / h;
        assertEquals(analytic, numeric, tolerance, () -> link.name() + " at " + eta);
    }

    @Property(tries = 2000)
    void inverseIsMonotoneInTheDirectionOfItsDerivative(@ForAll("pairs") Pair p) {
        Link link = p.link();
        double sign = Math.signum(link.derivative(0.5 * (p.eta1() + p.eta2())));
        double low = link.inverse(p.eta1());
        double high = link.inverse(p.eta2());
        assertTrue(sign * (high - low) >= 0, () -> link.name() + " not monotone between " + p.eta1() + " and " + p.eta2());
        assertTrue(sign != 0 || p.eta1() == p.eta2() || link.derivative(p.eta1()) == 0,
                () -> link.name() + " has a zero derivative inside its range");
    }

    @Property(tries = 2000)
    void inverseIsFiniteAndNeverNaN(@ForAll("points") Point p) {
        double mu = p.link().inverse(p.eta());
        double d = p.link().derivative(p.eta());
        assertTrue(Double.isFinite(mu) && Double.isFinite(d), () -> p.link().name() + " at " + p.eta());
    }
}
