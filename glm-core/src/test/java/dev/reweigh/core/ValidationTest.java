package dev.reweigh.core;

import dev.reweigh.families.Families;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.UnknownNameException;
import org.junit.jupiter.api.Test;

import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Bad input gives the library's own exceptions, with messages naming column, row and value. */
class ValidationTest {

    private static Table table(double[] y, double[] x) {
        return Table.builder().numeric("y", y).numeric("x", x)
                .categorical("region", "North", "South", "North", "South").build();
    }

    private static final double[] X = {1, 2, 3, 4};

    private static void assertMentions(Exception e, String... parts) {
        for (String p : parts) {
            assertTrue(e.getMessage().contains(p), "message '" + e.getMessage() + "' should mention " + p);
        }
    }

    @Test
    void responseOutsideTheFamilyDomain() {
        InvalidDataException e = assertThrows(InvalidDataException.class, () -> Glm.fit(
                ModelSpec.builder("y").family(Families.poisson()).numeric("x").build(), table(new double[] {1, 2, -1, 0}, X)));
        assertEquals("y", e.column());
        assertEquals(2, e.row());
        assertMentions(e, "'y'", "row 2", "value -1 ", "poisson");
        InvalidDataException g = assertThrows(InvalidDataException.class, () -> Glm.fit(
                ModelSpec.builder("y").family(Families.gamma()).numeric("x").build(), table(new double[] {1, 0, 2, 3}, X)));
        assertMentions(g, "'y'", "row 1", "value 0 ");
    }

    @Test
    void infiniteOrMissingPredictorsOffsetsAndWeights() {
        double[] y = {1, 2, 3, 4};
        InvalidDataException inf = assertThrows(InvalidDataException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("x").build(), table(y, new double[] {1, Double.POSITIVE_INFINITY, 3, 4})));
        assertMentions(inf, "'x'", "row 1", "Infinity", "finite");
        InvalidDataException nan = assertThrows(InvalidDataException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("x").build(), table(y, new double[] {1, 2, Double.NaN, 4})));
        assertMentions(nan, "'x'", "row 2", "missing");
        Table t = table(y, X);
        Table withCols = Table.builder().numeric("y", y).numeric("x", X)
                .numeric("off", 0, Double.NEGATIVE_INFINITY, 0, 0).numeric("w", 1, 1, -2, 1)
                .numeric("zero", 0, 0, 0, 0).numeric("expo", 1, 0, 1, 1).build();
        assertMentions(assertThrows(InvalidDataException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("x").offset("off").build(), withCols)), "'off'", "row 1");
        assertMentions(assertThrows(InvalidDataException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("x").weights("w").build(), withCols)), "'w'", "row 2", "value -2 ", "non-negative");
        assertMentions(assertThrows(InvalidDataException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("x").weights("zero").build(), withCols)), "'zero'", "positive");
        assertMentions(assertThrows(InvalidDataException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("x").logOffset("expo").build(), withCols)), "'expo'", "row 1", "positive");
        assertTrue(t.rowCount() > 0);
    }

    @Test
    void successesAboveTrials() {
        Table t = Table.builder().numeric("k", 1, 5, 2).numeric("n", 3, 4, 2).numeric("x", 1, 2, 3).build();
        InvalidDataException e = assertThrows(InvalidDataException.class, () -> Glm.fit(
                ModelSpec.builder("k").trials("n").family(Families.binomial()).numeric("x").build(), t));
        assertMentions(e, "'k'", "row 1", "value 5 ", "at most the 4 trials", "'n'");
        assertThrows(ModelSpecException.class, () -> ModelSpec.builder("k").trials("n").family(Families.poisson()).build());
    }

    @Test
    void columnsOfTheWrongKind() {
        Table t = table(new double[] {1, 2, 3, 4}, X);
        assertMentions(assertThrows(ModelSpecException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("x").offset("region").build(), t)), "'region'", "categorical", "offset");
        assertMentions(assertThrows(ModelSpecException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("x").weights("region").build(), t)), "'region'", "weights");
        assertMentions(assertThrows(ModelSpecException.class, () -> Glm.fit(
                ModelSpec.builder("y").factor("x").build(), t)), "'x'", "numeric", "categorical column");
        assertMentions(assertThrows(ModelSpecException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("region").build(), t)), "'region'", "factor");
        assertMentions(assertThrows(ModelSpecException.class, () -> Glm.fit(
                ModelSpec.builder("region").numeric("x").build(), t)), "'region'", "response");
    }

    @Test
    void unknownNamesListTheValidOnes() {
        Table t = table(new double[] {1, 2, 3, 4}, X);
        UnknownNameException e = assertThrows(UnknownNameException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("age").build(), t));
        assertEquals("age", e.name());
        assertEquals(List.of("y", "x", "region"), e.validNames());
        UnknownNameException ref = assertThrows(UnknownNameException.class, () -> Glm.fit(
                ModelSpec.builder("y").factor("region", "West").build(), t));
        assertMentions(ref, "West", "North", "South");
        FittedModel fit = Glm.fit(ModelSpec.builder("y").factor("region").build(), t);
        assertThrows(UnknownNameException.class, () -> fit.coefficient("region=West"));
        Table unseen = Table.builder().categorical("region", "North", "West").build();
        UnknownNameException lvl = assertThrows(UnknownNameException.class, () -> fit.predictMean(unseen));
        assertMentions(lvl, "region", "West");
    }

    @Test
    void moreParametersThanRowsAndEmptyTables() {
        Table t = Table.builder().numeric("y", 1, 2).numeric("a", 1, 2).numeric("b", 3, 1).build();
        assertMentions(assertThrows(ModelSpecException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("a").numeric("b").build(), t)), "3 coefficients", "2 rows");
        Table empty = Table.builder().numeric("y").numeric("x").build();
        assertMentions(assertThrows(ModelSpecException.class, () -> Glm.fit(
                ModelSpec.builder("y").numeric("x").build(), empty)), "no rows");
    }

    @Test
    void missingValuesAreRejectedOrDroppedOnRequest() {
        Table t = Table.builder().numeric("y", 1, 2, Double.NaN, 4, 5).numeric("x", 1, 2, 3, 4, 6)
                .categorical("g", "a", null, "b", "a", "b").build();
        ModelSpec spec = ModelSpec.builder("y").numeric("x").factor("g").build();
        InvalidDataException e = assertThrows(InvalidDataException.class, () -> Glm.fit(spec, t));
        assertMentions(e, "'g'", "row 1", "missing");
        FittedModel fit = Glm.fit(spec.toBuilder().dropIncompleteRows(true).build(), t);
        assertEquals(2, fit.droppedRows());
        assertEquals(3, fit.rowCount());
        assertEquals(List.of(0, 3, 4), java.util.Arrays.stream(fit.usedRows()).boxed().collect(java.util.stream.Collectors.toList()));
        assertTrue(fit.toString().contains("2 incomplete rows dropped"));
    }

    @Test
    void badStartingValuesAndOptions() {
        Table t = table(new double[] {1, 2, 3, 4}, X);
        ModelSpec spec = ModelSpec.builder("y").family(Families.poisson()).numeric("x").build();
        assertThrows(IllegalArgumentException.class, () -> Glm.fit(spec, t,
                FitOptions.builder().startCoefficients(new double[] {1}).build()));
        assertThrows(InvalidDataException.class, () -> Glm.fit(spec, t,
                FitOptions.builder().startMeans(new double[] {1, -1, 1, 1}).build()));
        assertThrows(IllegalArgumentException.class, () -> FitOptions.builder().maxIterations(0));
        assertThrows(IllegalArgumentException.class, () -> FitOptions.builder().tolerance(0));
        assertThrows(IllegalArgumentException.class, () -> FitOptions.builder().rankTolerance(2));
        assertThrows(IllegalArgumentException.class, () -> FitOptions.builder().threads(0));
    }
}
