package dev.reweigh.families;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/** Name lookup, canonical names, parameters and defaults of families and links. */
class NamesTest {

    private static final List<String> FAMILY_NAMES = List.of("gaussian", "binomial", "poisson", "gamma",
            "inverse-gaussian", "tweedie:1.5", "tweedie:1.05", "negative-binomial:2.0", "negative-binomial:0.37",
            "quasi:constant", "quasi:mu", "quasi:mu^2", "quasi:mu^3", "quasi:mu(1-mu)", "quasi:mu^1.5", "quasi:mu^-0.5");

    private static final List<String> LINK_NAMES = List.of("identity", "log", "logit", "probit", "cloglog", "loglog",
            "cauchit", "inverse", "inverse-squared", "sqrt", "power:0.25", "power:-0.5", "power:1.0E-5");

    @Test
    void everyFamilyNameRoundTrips() {
        for (String name : FAMILY_NAMES) {
            Family f = Families.byName(name);
            assertEquals(name, f.name());
            assertEquals(f, Families.byName(f.name()));
            assertTrue(f.toString().contains(name), f.toString());
        }
    }

    @Test
    void everyLinkNameRoundTrips() {
        for (String name : LINK_NAMES) {
            Link link = Links.byName(name);
            assertEquals(name, link.name());
            assertEquals(link, Links.byName(link.name()));
            assertTrue(link.toString().contains(name), link.toString());
        }
    }

    @Test
    void namesAreCanonical() {
        assertEquals("tweedie:1.5", Families.tweedie(1.5).name());
        assertEquals("tweedie:1.5", Families.byName("  Tweedie:1.50 ").name());
        assertEquals("poisson", Families.byName("tweedie:1").name());
        assertEquals("gamma", Families.byName("tweedie:2.0").name());
        assertEquals("negative-binomial:2.0", Families.negativeBinomial(2).name());
        assertEquals("quasi:mu^2", Families.byName("quasi:mu^2.0").name());
        assertEquals("quasi:constant", Families.quasiPower(0).name());
        assertEquals("quasi:mu(1-mu)", Families.byName("quasi: mu (1 - mu)").name());
        assertEquals("log", Links.byName("power:0").name());
        assertEquals("inverse", Links.byName("POWER:-1").name());
        assertEquals("power:0.3333333333333333", Links.power(1.0 / 3).name());
    }

    @Test
    void toStringIsReadable() {
        assertEquals("Family[tweedie:1.5, variance mu^1.5, default link power:-0.5, dispersion estimated]",
                Families.tweedie(1.5).toString());
        assertEquals("Family[quasi:mu, variance mu, default link log, dispersion estimated, no density]",
                Families.quasi("mu").toString());
        assertEquals("Link[logit, eta domain: any finite number]", Links.logit().toString());
    }

    @Provide
    Arbitrary<Double> anyFinite() {
        return Arbitraries.longs().map(Double::longBitsToDouble).filter(Double::isFinite);
    }

    @Property(tries = 500)
    void parametricFamilyNamesRoundTrip(@ForAll("anyFinite") double x) {
        double p = 1 + Math.abs(x % 1.0);
        if (p > 1 && p < 2) {
            Family t = Families.tweedie(p);
            assertEquals(t, Families.byName(t.name()));
            assertEquals(p, Families.variancePower(Families.byName(t.name())).getAsDouble(), 0.0);
        }
        double theta = Math.abs(x);
        if (theta > 0) {
            Family nb = Families.negativeBinomial(theta);
            assertEquals(theta, Families.negativeBinomialTheta(Families.byName(nb.name())).getAsDouble(), 0.0);
        }
        Family quasi = Families.quasiPower(x);
        assertEquals(quasi, Families.byName(quasi.name()));
        assertEquals(x, Families.variancePower(Families.byName(quasi.name())).getAsDouble(), 0.0);
        Link power = Links.power(x);
        assertEquals(power, Links.byName(power.name()));
    }

    @Test
    void unknownNamesListTheValidOnes() {
        UnknownNameException family = assertThrows(UnknownNameException.class, () -> Families.byName("gausian"));
        assertEquals(Families.names(), family.validNames());
        assertEquals("family", family.kind());
        assertTrue(family.getMessage().contains("gausian") && family.getMessage().contains("tweedie:P")
                && family.getMessage().contains("quasi:mu(1-mu)"), family.getMessage());
        UnknownNameException quasi = assertThrows(UnknownNameException.class, () -> Families.byName("quasi:sigma"));
        assertTrue(quasi.getMessage().contains("quasi:mu^P"), quasi.getMessage());
        UnknownNameException link = assertThrows(UnknownNameException.class, () -> Links.byName("logistic"));
        assertEquals(Links.names(), link.validNames());
        assertTrue(link.getMessage().contains("cloglog") && link.getMessage().contains("power:LAMBDA"), link.getMessage());
        assertThrows(UnknownNameException.class, () -> Families.quasi("sigma^2"));
    }

    @Test
    void malformedParametersSayWhatIsValid() {
        for (String bad : List.of("tweedie:abc", "tweedie:", "tweedie:NaN", "tweedie:0x1p0", "tweedie:1.5f",
                "negative-binomial:Infinity", "negative-binomial:two")) {
            ReweighException e = assertThrows(ReweighException.class, () -> Families.byName(bad), bad);
            assertFalse(e instanceof UnknownNameException, bad);
            assertTrue(e.getMessage().contains("expected"), e.getMessage());
        }
        ReweighException outOfRange = assertThrows(ReweighException.class, () -> Families.byName("tweedie:2.5"));
        assertTrue(outOfRange.getMessage().contains("strictly between 1 and 2"), outOfRange.getMessage());
        ReweighException negativeTheta = assertThrows(ReweighException.class, () -> Families.byName("negative-binomial:-1"));
        assertTrue(negativeTheta.getMessage().contains("positive"), negativeTheta.getMessage());
        assertThrows(ReweighException.class, () -> Families.negativeBinomial(0));
        assertThrows(ReweighException.class, () -> Families.byName("quasi:mu^x"));
        assertThrows(ReweighException.class, () -> Families.quasiPower(Double.NaN));
        ReweighException link = assertThrows(ReweighException.class, () -> Links.byName("power:x"));
        assertTrue(link.getMessage().contains("power:LAMBDA"), link.getMessage());
        assertThrows(ReweighException.class, () -> Links.power(Double.POSITIVE_INFINITY));
    }

    @Test
    void defaultLinks() {
        assertEquals(Links.identity(), Families.gaussian().defaultLink());
        assertEquals(Links.logit(), Families.binomial().defaultLink());
        assertEquals(Links.log(), Families.poisson().defaultLink());
        assertEquals(Links.inverse(), Families.gamma().defaultLink());
        assertEquals(Links.inverseSquared(), Families.inverseGaussian().defaultLink());
        assertEquals(Links.power(-0.5), Families.tweedie(1.5).defaultLink());
        assertEquals(Links.log(), Families.negativeBinomial(3).defaultLink());
        assertEquals(Links.identity(), Families.quasi("constant").defaultLink());
        assertEquals(Links.log(), Families.quasi("mu").defaultLink());
        assertEquals(Links.inverse(), Families.quasi("mu^2").defaultLink());
        assertEquals(Links.inverseSquared(), Families.quasi("mu^3").defaultLink());
        assertEquals(Links.logit(), Families.quasi("mu(1-mu)").defaultLink());
        assertEquals(Links.power(-0.7), Families.quasiPower(1.7).defaultLink());
    }

    @Test
    void dispersionAndDiscreteness() {
        for (Family f : FamilyCase.ALL) {
            String n = f.name();
            boolean fixed = n.equals("binomial") || n.equals("poisson") || n.startsWith("negative-binomial:");
            assertEquals(fixed, f.isDispersionFixed(), n);
            assertEquals(fixed, f.isDiscrete(), n);
            assertEquals(!n.startsWith("quasi:"), f.hasDensity(), n);
        }
    }

    @Test
    void parameterAccessors() {
        assertEquals(0.0, Families.variancePower(Families.gaussian()).getAsDouble());
        assertEquals(1.0, Families.variancePower(Families.poisson()).getAsDouble());
        assertEquals(2.0, Families.variancePower(Families.gamma()).getAsDouble());
        assertEquals(3.0, Families.variancePower(Families.inverseGaussian()).getAsDouble());
        assertEquals(1.37, Families.variancePower(Families.tweedie(1.37)).getAsDouble());
        assertEquals(2.0, Families.variancePower(Families.quasi("mu^2")).getAsDouble());
        assertFalse(Families.variancePower(Families.binomial()).isPresent());
        assertFalse(Families.variancePower(Families.negativeBinomial(2)).isPresent());
        assertFalse(Families.variancePower(Families.quasi("mu(1-mu)")).isPresent());
        assertEquals(2.5, Families.negativeBinomialTheta(Families.negativeBinomial(2.5)).getAsDouble());
        assertFalse(Families.negativeBinomialTheta(Families.poisson()).isPresent());
    }

    @Test
    void equalityIsByName() {
        assertEquals(Families.tweedie(1.5), Families.byName("tweedie:1.5"));
        assertEquals(Families.tweedie(1.5).hashCode(), Families.byName("tweedie:1.5").hashCode());
        assertNotEquals(Families.tweedie(1.5), Families.quasiPower(1.5));
        assertNotEquals(Families.negativeBinomial(2), Families.negativeBinomial(2.0000001));
        assertEquals(Links.power(0.25), Links.power(0.25));
        assertNotEquals(Links.power(0.25), Links.power(0.26));
    }
}
