package dev.reweigh.core.artifact;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Scorer;
import dev.reweigh.core.Table;
import dev.reweigh.core.Term;
import dev.reweigh.families.Families;
import dev.reweigh.families.ReweighException;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.Size;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ScoringPropertiesTest {
    private static final Portfolio TRAIN = new Portfolio(500, 99);
    private static final Table DATA = TRAIN.table("claims", TRAIN.response("poisson", true));
    private static final Table FRESH = new Portfolio(200, 100).table("claims", null);

    private static final List<Term> TERMS = List.of(
            Term.factor("region"), Term.factor("vehicle", "small"), Term.numeric("age"), Term.numeric("value"),
            Term.polynomial("age", 2, true), Term.polynomial("value", 3, false),
            Term.interaction(Term.factor("region"), Term.numeric("value")),
            Term.interaction(Term.factor("region"), Term.factor("vehicle")),
            Term.interaction(Term.numeric("age"), Term.numeric("value")),
            Term.interaction(Term.polynomial("age", 2, true), Term.factor("vehicle")),
            Term.interaction(Term.polynomial("value", 2, false), Term.numeric("age")));

    /** Any selection of terms, with or without intercept and offsets, round-trips bit for bit. */
    @Property(tries = 40)
    void randomModelsRoundTripBitForBit(@ForAll @Size(min = 1, max = 4) List<@IntRange(min = 0, max = 10) Integer> pick,
            @ForAll boolean intercept, @ForAll boolean exposure, @ForAll boolean offset) {
        List<Term> terms = new ArrayList<>();
        for (int k : pick) {
            if (!terms.contains(TERMS.get(k))) {
                terms.add(TERMS.get(k));
            }
        }
        ModelSpec.Builder b = ModelSpec.builder("claims").family(Families.poisson()).intercept(intercept);
        terms.forEach(b::term);
        if (exposure) {
            b.logOffset("exposure");
        }
        if (offset) {
            b.offset("adjustment");
        }
        FittedModel fit;
        try {
            fit = Glm.fit(b.build(), DATA);
        } catch (ReweighException e) {
            return; // a selection the data cannot support (e.g. a repeated column); not about scoring
        }
        ModelArtifact read = ModelArtifact.fromJson(ModelArtifact.of(fit).toJson());
        ArtifactRoundTripTest.assertBits(fit.predictLink(FRESH), read.scorer().score(FRESH).link(), "link");
    }

    @Provide
    Arbitrary<Object> anyValue() {
        return Arbitraries.oneOf(
                Arbitraries.of("North", "South", "Atlantis", "", "small", "large", "1e3", "abc"),
                Arbitraries.doubles().between(-1e6, 1e6).map(d -> (Object) d),
                Arbitraries.of(Double.NaN, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, 0.0, -0.0, 1e308),
                Arbitraries.integers().between(-5, 5).map(i -> (Object) i),
                Arbitraries.just(new Object()),
                Arbitraries.just(null));
    }

    /** Whatever a caller puts in a row, the scorer returns a score or a library exception. */
    @Property(tries = 500)
    void anyRowGivesAScoreOrALibraryException(@ForAll("anyValue") Object region, @ForAll("anyValue") Object vehicle,
            @ForAll("anyValue") Object age, @ForAll("anyValue") Object value, @ForAll("anyValue") Object exposure,
            @ForAll boolean fallback, @ForAll boolean dropOne) {
        Map<String, Object> row = new HashMap<>();
        row.put("region", region);
        row.put("vehicle", vehicle);
        row.put("age", age);
        row.put("value", value);
        row.put("exposure", exposure);
        if (dropOne) {
            row.remove("age");
        }
        Scorer s = Fixtures.ARTIFACT.scorerBuilder().unseenLevelsAtReference(fallback).intervalLevel(0.9).build();
        try {
            double mu = s.scoreRow(row).mean(0);
            assertTrue(mu >= 0 && !Double.isNaN(mu), "a Poisson mean: " + mu);
            assertEquals(Double.doubleToRawLongBits(mu), Double.doubleToRawLongBits(s.mean(row)));
        } catch (ReweighException expected) {
            assertTrue(expected.getMessage() != null && !expected.getMessage().isEmpty());
        }
    }

    /**
     * Tables of plain numbers and factors are scored a block at a time with the term loop outside;
     * whatever the cells (signed zeros, reference levels, levels the table lists in another order,
     * unseen levels scored at the reference), every row's linear predictor must equal the row
     * path's bit for bit, and the flags must agree.
     */
    @Property(tries = 60)
    void plainTablesScoreAsTheRowPathDoes(@ForAll @Size(min = 1, max = 600) List<@IntRange(min = 0, max = 999) Integer> cells,
            @ForAll boolean intercept, @ForAll boolean exposure, @ForAll boolean offset, @ForAll boolean noVehicle) {
        ModelSpec.Builder b = ModelSpec.builder("claims").family(Families.poisson()).intercept(intercept)
                .factor("region").factor("vehicle", "small").numeric("age");
        if (exposure) {
            b.logOffset("exposure");
        }
        if (offset) {
            b.offset("adjustment");
        }
        Scorer s = Glm.fit(b.build(), DATA).scorerBuilder().unseenLevelsAtReference(true).build();
        int n = cells.size();
        // the table lists its levels in an order of its own, with one the model never saw
        List<String> regions = List.of("West", "Central", "Atlantis", "South", "North", "East");
        List<String> vehicles = List.of("small", "large", "medium");
        double[] numbers = {0.0, -0.0, 1.0, -1.0, 37.5, 1e-300, 123.456};
        String[] region = new String[n];
        String[] vehicle = new String[n];
        double[] age = new double[n];
        double[] exp = new double[n];
        double[] adj = new double[n];
        for (int i = 0; i < n; i++) {
            int c = cells.get(i);
            region[i] = regions.get(c % regions.size());
            vehicle[i] = noVehicle ? "small" : vehicles.get(c / 7 % vehicles.size());
            age[i] = numbers[c / 21 % numbers.length];
            exp[i] = c % 2 == 0 ? 1.0 : 0.25 + c / 1000.0;
            adj[i] = numbers[c / 3 % 2]; // +0.0 or -0.0
        }
        Table t = Table.builder().categorical("region", regions, region).categorical("vehicle", vehicles, vehicle)
                .numeric("age", age).numeric("exposure", exp).numeric("adjustment", adj).build();
        double[] link = new double[n];
        boolean[] flags = new boolean[n];
        double[] mean = new double[n];
        s.scoreLink(t, link);
        s.scoreMean(t, mean, flags);
        for (int i = 0; i < n; i++) {
            Map<String, Object> row = new HashMap<>();
            row.put("region", region[i]);
            row.put("vehicle", vehicle[i]);
            row.put("age", age[i]);
            row.put("exposure", exp[i]);
            row.put("adjustment", adj[i]);
            dev.reweigh.core.Scores one = s.scoreRow(row);
            assertEquals(Double.doubleToRawLongBits(one.link(0)), Double.doubleToRawLongBits(link[i]),
                    "row " + i + ": " + row);
            assertEquals(Double.doubleToRawLongBits(one.mean(0)), Double.doubleToRawLongBits(mean[i]), "row " + i);
            assertEquals(one.usedReferenceLevel(0), flags[i], "row " + i);
        }
    }
}
