package dev.reweigh.core.artifact;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Scorer;
import dev.reweigh.core.Scores;
import dev.reweigh.core.Table;
import dev.reweigh.core.UnseenLevelException;
import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import dev.reweigh.families.ReweighException;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;

import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ScorerTest {

    private static Table withRegions(String... regions) {
        Portfolio p = new Portfolio(regions.length, 5);
        return Table.builder()
                .categorical("region", regions)
                .categorical("vehicle", p.vehicle)
                .numeric("age", p.age)
                .numeric("value", p.value)
                .numeric("exposure", p.exposure)
                .build();
    }

    @Test
    void unseenLevelIsAnErrorNamingColumnRowAndLevel() {
        Table t = withRegions("North", "South", "Atlantis", "East");
        UnseenLevelException e = assertThrows(UnseenLevelException.class, () -> Fixtures.ARTIFACT.scorer().score(t));
        assertEquals("region", e.column());
        assertEquals(2, e.row());
        assertEquals("Atlantis", e.name());
        assertTrue(e.getMessage().contains("'region'") && e.getMessage().contains("row 2")
                && e.getMessage().contains("Atlantis") && e.getMessage().contains("North"), e.getMessage());
    }

    @Test
    void unseenLevelCanBeScoredAtTheReferenceWithAFlag() {
        Scorer s = Fixtures.ARTIFACT.scorerBuilder().unseenLevelsAtReference(true).build();
        String reference = Fixtures.ARTIFACT.spec().terms().get(0).referenceLevel().orElseThrow();
        Table unseen = withRegions("North", "Atlantis", "South", "Lemuria");
        Table atReference = withRegions("North", reference, "South", reference);
        Scores a = s.score(unseen);
        Scores b = s.score(atReference);
        ArtifactRoundTripTest.assertBits(b.link(), a.link(), "unseen levels score as the reference level");
        assertEquals(List.of(false, true, false, true), List.of(a.usedReferenceLevel(0), a.usedReferenceLevel(1),
                a.usedReferenceLevel(2), a.usedReferenceLevel(3)));
        assertEquals(2, a.referenceFallbackCount());
        assertEquals(0, b.referenceFallbackCount());
        boolean[] flags = new boolean[4];
        double[] out = new double[4];
        s.scoreMean(unseen, out, flags);
        assertTrue(flags[1] && flags[3] && !flags[0] && !flags[2]);
        assertTrue(s.scoreRow(rowOf(unseen, 1)).usedReferenceLevel(0));
    }

    private static Map<String, Object> rowOf(Table t, int i) {
        return Map.of("region", t.value("region", i), "vehicle", t.value("vehicle", i),
                "age", t.numeric("age")[i], "value", t.numeric("value")[i], "exposure", t.numeric("exposure")[i]);
    }

    @Test
    void intervalIsBuiltOnTheLinkScaleAndMatchesAnIndependentComputation() {
        FittedModel fit = Fixtures.FIT;
        Scorer s = fit.scorerBuilder().intervalLevel(0.9).build();
        Table t = Fixtures.FRESH_TABLE;
        Scores sc = s.score(t);
        double[][] x = fit.modelMatrix(t);
        double[][] c = fit.unscaledCovariance();
        double[] eta = fit.predictLink(t);
        // two-sided 90%: z = 1.6448536..., Commons Math NormalDistribution as the reference
        double z = new NormalDistribution().inverseCumulativeProbability(0.95);
        for (int i = 0; i < 50; i++) {
            double q = 0;
            for (int a = 0; a < x[i].length; a++) {
                for (int b = 0; b < x[i].length; b++) {
                    q += x[i][a] * c[a][b] * x[i][b];
                }
            }
            double seEta = Math.sqrt(q);      // Poisson: dispersion 1
            double mu = Math.exp(eta[i]);     // log link: dmu/deta = mu
            assertEquals(seEta, sc.linkStandardError()[i], 1e-10 * seEta);
            assertEquals(mu * seEta, sc.standardError()[i], 1e-10 * mu * seEta);
            assertEquals(Math.exp(eta[i] - z * seEta), sc.lower(i), 1e-10 * mu);
            assertEquals(Math.exp(eta[i] + z * seEta), sc.upper(i), 1e-10 * mu);
            assertTrue(sc.lower(i) > 0 && sc.lower(i) < sc.mean(i) && sc.mean(i) < sc.upper(i));
        }
        assertFalse(fit.scorer().score(t).hasIntervals());
        assertThrows(IllegalStateException.class, () -> fit.scorer().score(t).lower());
    }

    @Test
    void intervalEndsAreOrderedForADecreasingLinkAndStayInTheRange() {
        // Gamma with the inverse link: mu = 1/eta decreases in eta, so the ends swap
        Portfolio p = new Portfolio(300, 61);
        FittedModel fit = Glm.fit(ModelSpec.builder("cost").family(Families.gamma()).link(Links.inverse())
                .factor("region").numeric("age").build(), p.table("cost", p.response("gamma", false)));
        Scores sc = fit.scorerBuilder().intervalLevel(0.95).build().score(Fixtures.FRESH_TABLE);
        double z = new NormalDistribution().inverseCumulativeProbability(0.975); // Commons Math as the reference
        for (int i = 0; i < sc.rowCount(); i++) {
            assertTrue(sc.lower(i) < sc.mean(i) && sc.mean(i) < sc.upper(i), "row " + i);
            assertEquals(1 / (sc.link(i) + z * sc.linkStandardError()[i]), sc.lower(i),
                    1e-9 * sc.mean(i), "the lower end comes from the upper end on the link scale");
        }
    }

    @Test
    void intervalsUseTheCallersDispersion() {
        Scores one = Fixtures.ARTIFACT.scorerBuilder().intervalLevel(0.95).build().score(Fixtures.FRESH_TABLE);
        Scores four = Fixtures.ARTIFACT.scorerBuilder().intervalLevel(0.95).dispersion(4).build()
                .score(Fixtures.FRESH_TABLE);
        for (int i = 0; i < 20; i++) {
            assertEquals(2 * one.standardError()[i], four.standardError()[i], 1e-12 * four.standardError()[i]);
            assertEquals(2 * one.linkStandardError()[i], four.linkStandardError()[i],
                    1e-12 * four.linkStandardError()[i]);
        }
    }

    @Test
    void intervalsWithoutADispersionAreRefused() {
        Table t = Table.builder().numeric("y", 1, 2, 4).numeric("x", 1, 2, 3).categorical("g", "a", "b", "c").build();
        FittedModel exact = Glm.fit(ModelSpec.builder("y").factor("g").build(), t);
        assertTrue(Double.isNaN(ModelArtifact.of(exact).dispersion()), "no residual df: no Pearson estimate");
        ReweighException e = assertThrows(ReweighException.class,
                () -> exact.scorerBuilder().intervalLevel(0.95).build());
        assertTrue(e.getMessage().contains("dispersion"), e.getMessage());
        assertEquals(3, exact.scorerBuilder().intervalLevel(0.95).dispersion(1.0).build().score(t).rowCount());
    }

    @Test
    void inputColumnsAreTheTermsThenTheOffsets() {
        assertEquals(List.of("region", "vehicle", "age", "value", "exposure"), Fixtures.ARTIFACT.scorer()
                .inputColumns());
    }

    @Test
    void callersCanTypeEachInputColumn() {
        Scorer s = Fixtures.ARTIFACT.scorer();
        assertTrue(s.isFactor("region"));
        assertFalse(s.isFactor("exposure"));
        assertEquals(Portfolio.REGIONS, s.levels("region"));
        assertEquals(Portfolio.VEHICLES, s.levels("vehicle"));
        assertThrows(dev.reweigh.families.UnknownNameException.class, () -> s.levels("age"));
        assertThrows(dev.reweigh.families.UnknownNameException.class, () -> s.isFactor("colour"));
    }

    /**
     * A factor with a column for every level ("reference": null, the coding of a model without
     * intercept) scores each level with its own coefficient; written by hand and signed.
     */
    @Test
    void aFactorWithAColumnForEveryLevelScoresEachLevelsCoefficient() {
        Map<String, Object> doc = ArtifactText.parse(Fixtures.JSON);
        Map<String, Object> model = ArtifactText.object(doc, "model");
        Map<String, Object> spec = ArtifactText.object(doc, "model", "specification");
        spec.put("intercept", false);
        spec.put("logOffset", null);
        Map<String, Object> factor = new java.util.LinkedHashMap<>();
        factor.put("kind", "factor");
        factor.put("column", "g");
        factor.put("levels", List.of("a", "b", "c"));
        factor.put("reference", null);
        spec.put("terms", List.of(factor, Map.of("kind", "numeric", "column", "x")));
        model.put("family", "gaussian");
        model.put("link", "identity");
        model.put("columns", List.of("g=a", "g=b", "g=c", "x"));
        model.put("coefficients", List.of(1.0, 2.0, 3.0, 0.5));
        model.put("covariance", List.of(List.of(1.0, 0.0, 0.0, 0.0), List.of(0.0, 1.0, 0.0, 0.0),
                List.of(0.0, 0.0, 1.0, 0.0), List.of(0.0, 0.0, 0.0, 1.0)));
        ModelArtifact a = ModelArtifact.fromJson(ArtifactText.signed(doc));
        assertEquals(List.of("g=a", "g=b", "g=c", "x"), a.columnNames());
        Scores sc = a.scorer().score(Table.builder().categorical("g", "a", "b", "c").numeric("x", 2, 2, 4).build());
        assertEquals(List.of(2.0, 3.0, 5.0), List.of(sc.link(0), sc.link(1), sc.link(2)));
        assertTrue(a.toJson().contains("\"reference\" : null"), "written back with no reference level");
        Scores fallback = a.scorerBuilder().unseenLevelsAtReference(true).build()
                .score(Table.builder().categorical("g", "z").numeric("x", 2).build());
        assertEquals(1.0, fallback.link(0), "an unseen level of a fully coded factor adds no level effect");
        assertTrue(fallback.usedReferenceLevel(0));
    }

    @Test
    void logitMeansAreProbabilities() {
        Portfolio p = new Portfolio(400, 44);
        FittedModel fit = Glm.fit(ModelSpec.builder("k").trials("trials").family(Families.binomial())
                .link(Links.logit()).factor("region").numeric("age").build(), p.table("k", p.response("binomial",
                false)));
        double[] mu = new double[Fixtures.FRESH.rows];
        fit.scorer().scoreMean(Fixtures.FRESH.columns(), mu);
        for (double m : mu) {
            assertTrue(m > 0 && m < 1);
        }
    }

    /** Rows scored one by one, in arrays, or as a table agree bit for bit, whatever the batch. */
    @Property(tries = 50)
    void batchBoundariesDoNotMatter(@ForAll @IntRange(min = 0, max = 1999) int from,
            @ForAll @IntRange(min = 1, max = 200) int count) {
        int to = Math.min(2000, from + count);
        int[] rows = new int[to - from];
        for (int i = 0; i < rows.length; i++) {
            rows[i] = from + i;
        }
        Scorer s = Fixtures.ARTIFACT.scorer();
        double[] all = s.score(Fixtures.FRESH_TABLE).mean();
        double[] part = s.score(Fixtures.FRESH_TABLE.select(rows)).mean();
        for (int i = 0; i < rows.length; i++) {
            assertEquals(Double.doubleToRawLongBits(all[from + i]), Double.doubleToRawLongBits(part[i]));
            assertEquals(Double.doubleToRawLongBits(all[from + i]),
                    Double.doubleToRawLongBits(s.mean(Fixtures.FRESH.row(from + i))));
        }
    }
}
