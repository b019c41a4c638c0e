package dev.reweigh.core;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import dev.reweigh.families.Families;
import dev.reweigh.families.Links;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Predictions go through the compiled scorer; on the fitting rows they reproduce the fit's own
 * linear predictor and means (computed by the design matrix) to the bit, so the two ways of
 * summing eta cannot drift apart unnoticed.
 */
class PredictionPathTest {
    static final Table MOTOR = NoInterceptCodingTest.withCover(Portfolios.motor(2024, 500), 2025);

    static ModelSpec.Builder base() {
        return ModelSpec.builder("claims").family(Families.poisson()).logOffset("exposure");
    }

    static Stream<Arguments> specs() {
        return Stream.of(
                Arguments.of("factors and a numeric", base().factor("region").numeric("age")
                        .factor("cover").build()),
                Arguments.of("no intercept (a column for every region)", base().factor("region")
                        .numeric("age").factor("cover").intercept(false).build()),
                Arguments.of("raw and orthogonal powers", base().polynomial("age", 3, false)
                        .factor("region").build()),
                Arguments.of("orthogonal powers", base().polynomial("age", 2, true).factor("cover")
                        .build()),
                Arguments.of("interactions", base().factor("region").numeric("age")
                        .term(Term.interaction(Term.factor("cover"), Term.numeric("age")))
                        .term(Term.interaction(Term.factor("region"), Term.factor("cover"))).build()),
                Arguments.of("Gaussian with identity link", ModelSpec.builder("age").family(Families.gaussian())
                        .link(Links.identity()).factor("region").numeric("exposure").build()),
                Arguments.of("Gamma with log link and offset", ModelSpec.builder("exposure")
                        .family(Families.gamma()).link(Links.log()).factor("cover").numeric("age").offset("claims")
                        .build()));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("specs")
    void predictionsOnTheFittingRowsAreTheFitsOwnValues(String name, ModelSpec spec) {
        FittedModel fit = Glm.fit(spec, MOTOR);
        assertEquals(MOTOR.rowCount(), fit.linearPredictor().length, "every row is used");
        assertBits(fit.linearPredictor(), fit.predictLink(MOTOR), name + ": link");
        assertBits(fit.fittedValues(), fit.predictMean(MOTOR), name + ": mean");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("specs")
    void anUnseenLevelIsNamed(String name, ModelSpec spec) {
        FittedModel fit = Glm.fit(spec, MOTOR);
        Table fresh = NoInterceptCodingTest.withCover(Portfolios.motor(7, 10), 8);
        String[] cover = NoInterceptCodingTest.levelsOf(fresh, "cover");
        cover[4] = "fleet";
        Table unseen = Table.builder().numeric("age", fresh.numeric("age"))
                .categorical("region", NoInterceptCodingTest.levelsOf(fresh, "region"))
                .numeric("exposure", fresh.numeric("exposure")).numeric("claims", fresh.numeric("claims"))
                .categorical("cover", cover).build();
        if (!spec.usedColumns().contains("cover")) {
            assertEquals(10, fit.predictLink(unseen).length);
            return;
        }
        UnseenLevelException e = assertThrows(UnseenLevelException.class, () -> fit.predictMean(unseen));
        assertEquals("cover", e.column());
        assertEquals(4, e.row());
        assertEquals("fleet", e.name());
    }

    static void assertBits(double[] expected, double[] actual, String what) {
        assertEquals(expected.length, actual.length, what);
        for (int i = 0; i < expected.length; i++) {
            assertEquals(Double.doubleToRawLongBits(expected[i]), Double.doubleToRawLongBits(actual[i]),
                    what + ", row " + i + ": " + expected[i] + " vs " + actual[i]);
        }
    }
}
