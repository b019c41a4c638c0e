package dev.reweigh.core;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import dev.reweigh.families.Families;
import dev.reweigh.families.InvalidDataException;
import java.util.Map;
import org.junit.jupiter.api.Test;

/** Values in data errors are printed as given: "-1", not "-1.0"; NaN and Infinity readable. */
class ErrorValueTextTest {
    static final Table MOTOR = Portfolios.motor(515, 200);
    static final ModelSpec FREQUENCY = ModelSpec.builder("claims").family(Families.poisson()).factor("region")
            .numeric("age").logOffset("exposure").build();

    static Table withExposure(double... exposure) {
        int n = exposure.length;
        double[] age = new double[n];
        String[] region = new String[n];
        for (int i = 0; i < n; i++) {
            age[i] = 30 + i;
            region[i] = Portfolios.REGIONS[i % Portfolios.REGIONS.length];
        }
        return Table.builder().numeric("age", age).categorical("region", region).numeric("exposure", exposure)
                .build();
    }

    static void assertValue(InvalidDataException e, String column, long row, String value) {
        assertEquals(column, e.column());
        assertEquals(row, e.row());
        assertEquals(value, e.value());
        assertTrue(e.getMessage().contains("value " + value + " is not valid"), e.getMessage());
    }

    @Test
    void predictionsNameTheBadExposureAsGiven() {
        FittedModel fit = Glm.fit(FREQUENCY, MOTOR);
        assertValue(assertThrows(InvalidDataException.class, () -> fit.predictLink(withExposure(1, -1, 2))),
                "exposure", 1, "-1");
        assertValue(assertThrows(InvalidDataException.class, () -> fit.predictMean(withExposure(0.5, 1, 0))),
                "exposure", 2, "0");
        assertValue(assertThrows(InvalidDataException.class, () -> fit.predictLink(withExposure(-0.25))),
                "exposure", 0, "-0.25");
        assertValue(assertThrows(InvalidDataException.class, () -> fit.scorer().score(withExposure(1, 2, -3))),
                "exposure", 2, "-3");
        assertValue(assertThrows(InvalidDataException.class,
                () -> fit.scorer().mean(Map.of("age", 40.0, "region", "North", "exposure", -2.0))),
                "exposure", 0, "-2");
        assertValue(assertThrows(InvalidDataException.class,
                () -> fit.scorer().mean(Map.of("age", Double.NaN, "region", "North", "exposure", 1.0))),
                "age", 0, "NaN");
    }

    @Test
    void anInfinitePredictorIsReadable() {
        double[] age = MOTOR.numeric("age");
        age[3] = Double.NEGATIVE_INFINITY;
        Table bad = Table.builder().numeric("age", age).categorical("region", levels(MOTOR))
                .numeric("exposure", MOTOR.numeric("exposure")).numeric("claims", MOTOR.numeric("claims")).build();
        assertValue(assertThrows(InvalidDataException.class, () -> Glm.fit(FREQUENCY, bad)), "age", 3, "-Infinity");
    }

    @Test
    void aBadStartingMeanIsReadable() {
        double[] start = new double[MOTOR.rowCount()];
        java.util.Arrays.fill(start, 0.5);
        start[7] = -4;
        FitOptions options = FitOptions.builder().startMeans(start).build();
        assertValue(assertThrows(InvalidDataException.class, () -> Glm.fit(FREQUENCY, MOTOR, options)),
                "start means", 7, "-4");
    }

    static String[] levels(Table t) {
        String[] out = new String[t.rowCount()];
        for (int i = 0; i < out.length; i++) {
            out[i] = t.value("region", i);
        }
        return out;
    }
}
