package dev.reweigh.core;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.families.Families;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Without an intercept the first factor main effect has a column for every level (no reference
 * level), so the model spans the same space as the intercept model (common practice, no source);
 * later factors and factors inside interactions keep a reference level.
 */
class NoInterceptCodingTest {
    static final Table MOTOR = withCover(Portfolios.motor(4242, 800), 4243);

    /** Adds a second categorical column "cover" that moves the claim rate a little. */
    static Table withCover(Table t, long seed) {
        Random rnd = new Random(seed);
        String[] cover = new String[t.rowCount()];
        String[] names = {"basic", "plus", "full"};
        for (int i = 0; i < cover.length; i++) {
            cover[i] = names[i < names.length ? i : rnd.nextInt(names.length)];
        }
        return Table.builder().numeric("age", t.numeric("age")).categorical("region", t.levels("region"), levelsOf(t, "region"))
                .numeric("exposure", t.numeric("exposure")).numeric("claims", t.numeric("claims"))
                .categorical("cover", cover).build();
    }

    static String[] levelsOf(Table t, String column) {
        String[] out = new String[t.rowCount()];
        for (int i = 0; i < out.length; i++) {
            out[i] = t.value(column, i);
        }
        return out;
    }

    static ModelSpec.Builder frequency() {
        return ModelSpec.builder("claims").family(Families.poisson()).logOffset("exposure");
    }

    static List<String> allLevels(String column) {
        List<String> out = new ArrayList<>();
        for (String level : MOTOR.levels(column)) {
            out.add(column + "=" + level);
        }
        return out;
    }

    @Test
    void aSingleFactorWithoutInterceptHasAColumnPerLevelAndTheSameMeans() {
        FittedModel without = Glm.fit(frequency().factor("region").intercept(false).build(), MOTOR);
        FittedModel with = Glm.fit(frequency().factor("region").build(), MOTOR);
        assertEquals(allLevels("region"), without.columnNames());
        assertEquals(MOTOR.levels("region").size(), without.rank());
        assertEquals(with.rank(), without.rank());
        assertEquals(with.residualDf(), without.residualDf());
        assertEquals(with.deviance(), without.deviance(), 1e-9 * with.deviance());
        assertClose(with.fittedValues(), without.fittedValues(), 1e-9);
        // one factor alone: each level's rate is its claims over its exposure (the Poisson score
        // equations per level; common practice, no source)
        double[] y = MOTOR.numeric("claims");
        double[] e = MOTOR.numeric("exposure");
        int[] codes = MOTOR.codes("region");
        List<String> levels = MOTOR.levels("region");
        for (int k = 0; k < levels.size(); k++) {
            double sy = 0;
            double se = 0;
            for (int i = 0; i < y.length; i++) {
                if (codes[i] == k) {
                    sy += y[i];
                    se += e[i];
                }
            }
            assertEquals(Math.log(sy / se), without.coefficient("region=" + levels.get(k)), 1e-9,
                    "level " + levels.get(k));
        }
        String report = without.toString();
        assertFalse(report.contains("reference levels"), report);
        for (String c : allLevels("region")) {
            assertTrue(report.contains(c), report);
        }
    }

    @Test
    void theCodingIsAReparametrisationOfTheInterceptModel() {
        FittedModel with = Glm.fit(frequency().numeric("age").factor("region").factor("cover").build(), MOTOR);
        FittedModel without = Glm.fit(frequency().numeric("age").factor("region").factor("cover")
                .intercept(false).build(), MOTOR);
        List<String> expected = new ArrayList<>(List.of("age"));
        expected.addAll(allLevels("region"));
        String coverRef = with.recipe().referenceLevels().stream().filter(s -> s.startsWith("cover=")).findFirst()
                .orElseThrow();
        for (String c : allLevels("cover")) {
            if (!c.equals(coverRef)) {
                expected.add(c);
            }
        }
        assertEquals(expected, without.columnNames());
        assertEquals(List.of(coverRef), without.recipe().referenceLevels());
        assertClose(with.fittedValues(), without.fittedValues(), 1e-9);
        assertEquals(with.deviance(), without.deviance(), 1e-9 * with.deviance());
        // region=L without intercept is intercept + region=L with one (0 at the reference)
        for (String level : MOTOR.levels("region")) {
            String c = "region=" + level;
            double shifted = with.coefficient("intercept") + (with.columnNames().contains(c) ? with.coefficient(c) : 0);
            assertEquals(shifted, without.coefficient(c), 1e-7, c);
        }
        assertEquals(with.coefficient("age"), without.coefficient("age"), 1e-9);
        // predictions for new rows agree too
        Table fresh = withCover(Portfolios.motor(77, 120), 78);
        assertClose(with.predictMean(fresh), without.predictMean(fresh), 1e-9);
    }

    @Test
    void aReferenceNamedForTheFirstFactorIsNotUsedWithoutIntercept() {
        FittedModel named = Glm.fit(frequency().factor("region", "East").numeric("age").intercept(false).build(),
                MOTOR);
        FittedModel column = Glm.fit(frequency().term(Term.column("region")).numeric("age").intercept(false)
                .build(), MOTOR);
        List<String> expected = new ArrayList<>(allLevels("region"));
        expected.add("age");
        assertEquals(expected, named.columnNames());
        assertEquals(expected, column.columnNames());
        assertEquals(named.deviance(), column.deviance(), 1e-12 * named.deviance());
    }

    @Test
    void interactionsKeepTheirReferenceLevelAndNameTheirColumns() {
        ModelSpec spec = frequency().factor("region", "North").numeric("age")
                .term(Term.interaction(Term.factor("region", "North"), Term.numeric("age")))
                .term(Term.interaction(Term.factor("region", "North"), Term.factor("cover", "basic")))
                .intercept(false).build();
        FittedModel fit = Glm.fit(spec, MOTOR);
        List<String> expected = new ArrayList<>(allLevels("region"));
        expected.add("age");
        List<String> region = MOTOR.levels("region");
        List<String> cover = MOTOR.levels("cover");
        for (String r : region) {
            if (!r.equals("North")) {
                expected.add("region=" + r + " & age");
            }
        }
        for (String r : region) {
            for (String c : cover) {
                if (!r.equals("North") && !c.equals("basic")) {
                    expected.add("region=" + r + " & cover=" + c);
                }
            }
        }
        assertEquals(expected, fit.columnNames());
        assertTrue(fit.aliasedColumns().isEmpty());
        // one row: its region's main-effect column, age, its region's age slope, its pair's column
        int row = 0;
        while (MOTOR.value("region", row).equals("North") || MOTOR.value("cover", row).equals("basic")) {
            row++;
        }
        String r = MOTOR.value("region", row);
        String c = MOTOR.value("cover", row);
        double age = MOTOR.numeric("age")[row];
        double[] x = new double[fit.columnCount()];
        fit.modelMatrixRow(row, x);
        for (int j = 0; j < x.length; j++) {
            String name = fit.columnNames().get(j);
            double want = name.equals("region=" + r) ? 1 : name.equals("age") ? age
                    : name.equals("region=" + r + " & age") ? age
                    : name.equals("region=" + r + " & cover=" + c) ? 1 : 0;
            assertEquals(want, x[j], name);
        }
        // a factor that appears only inside an interaction is not the "first factor term"
        FittedModel inside = Glm.fit(frequency().numeric("age")
                .term(Term.interaction(Term.factor("region", "North"), Term.numeric("age")))
                .factor("cover").intercept(false).build(), MOTOR);
        assertTrue(inside.columnNames().containsAll(allLevels("cover")), inside.columnNames().toString());
        assertFalse(inside.columnNames().contains("region=North & age"), inside.columnNames().toString());
    }

    @Test
    void theArtifactRecordsTheFullCodingAndScoresBitIdentically() {
        FittedModel fit = Glm.fit(frequency().factor("region").numeric("age").factor("cover")
                .term(Term.interaction(Term.factor("cover"), Term.numeric("age"))).intercept(false).build(), MOTOR);
        ModelArtifact written = ModelArtifact.of(fit);
        String json = written.toJson();
        assertTrue(json.replace(" ", "").contains("\"reference\":null"), json);
        ModelArtifact read = ModelArtifact.fromJson(json);
        assertEquals(fit.columnNames(), read.columnNames());
        Table fresh = withCover(Portfolios.motor(991, 300), 992);
        double[] link = fit.predictLink(fresh);
        double[] mean = fit.predictMean(fresh);
        Scores scores = read.scorer().score(fresh);
        Scores inProcess = fit.scorer().score(fresh);
        for (int i = 0; i < link.length; i++) {
            assertEquals(Double.doubleToRawLongBits(link[i]), Double.doubleToRawLongBits(scores.link()[i]), "row " + i);
            assertEquals(Double.doubleToRawLongBits(mean[i]), Double.doubleToRawLongBits(scores.mean()[i]), "row " + i);
            assertEquals(Double.doubleToRawLongBits(link[i]), Double.doubleToRawLongBits(inProcess.link()[i]),
                    "row " + i);
        }
        // the stored specification refits to the same columns
        FittedModel refit = Glm.fit(read.spec(), MOTOR);
        assertEquals(fit.columnNames(), refit.columnNames());
        assertClose(fit.fittedValues(), refit.fittedValues(), 1e-9);
    }

    @Test
    void aStreamingFitCodesTheFirstFactorTheSameWay() {
        ModelSpec spec = frequency().factor("region").numeric("age").factor("cover").intercept(false).build();
        FittedModel inMemory = Glm.fit(spec, MOTOR);
        StreamingFit streamed = StreamingGlm.fit(spec, ChunkSource.of(MOTOR, 150));
        assertEquals(inMemory.columnNames(), streamed.columnNames());
        double[] a = inMemory.coefficients();
        double[] b = streamed.coefficients();
        for (int j = 0; j < a.length; j++) {
            assertEquals(a[j], b[j], 1e-8 * (1 + Math.abs(a[j])), inMemory.columnNames().get(j));
        }
    }

    static void assertClose(double[] expected, double[] actual, double relative) {
        assertEquals(expected.length, actual.length);
        for (int i = 0; i < expected.length; i++) {
            assertEquals(expected[i], actual[i], relative * Math.abs(expected[i]) + 1e-300, "row " + i);
        }
    }
}
