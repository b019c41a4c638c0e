package dev.reweigh.core;

import dev.reweigh.families.Families;
import net.jqwik.api.Assume;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;
import net.jqwik.api.constraints.Scale;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** Invariances a correct fit must have, on random synthetic portfolios. */
class InvariancePropertyTest {
    private static final double TOL = 1e-8;

    private static ModelSpec frequency() {
        return ModelSpec.builder("claims").family(Families.poisson()).factor("region").numeric("age")
                .logOffset("exposure").build();
    }

    private static ModelSpec severity() {
        return ModelSpec.builder("severity").family(Families.gamma()).link(dev.reweigh.families.Links.log())
                .factor("region").numeric("age").build();
    }

    private static void assertClose(double expected, double actual, String what) {
        assertEquals(expected, actual, TOL * Math.max(1.0, Math.abs(expected)), what);
    }

    @Property(tries = 40)
    void permutingRowsChangesNothing(@ForAll @LongRange(min = 0, max = 100_000) long seed) {
        Table t = Portfolios.motor(seed, 60);
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < t.rowCount(); i++) {
            order.add(i);
        }
        Collections.shuffle(order, new Random(seed + 1));
        Table shuffled = t.select(order.stream().mapToInt(Integer::intValue).toArray());
        for (ModelSpec spec : List.of(frequency(), severity())) {
            FittedModel a = Glm.fit(spec, t);
            assumeFinite(a);
            FittedModel b = Glm.fit(spec, shuffled);
            for (int j = 0; j < a.columnCount(); j++) {
                assertClose(a.coefficients()[j], b.coefficients()[j], a.columnNames().get(j));
            }
            assertClose(a.deviance(), b.deviance(), "deviance");
        }
    }

    @Property(tries = 40)
    void duplicatingRowsEqualsDoublingTheirWeights(@ForAll @LongRange(min = 0, max = 100_000) long seed) {
        Table t = Portfolios.motor(seed, 50);
        Random rnd = new Random(seed);
        boolean[] dup = new boolean[t.rowCount()];
        List<Integer> rows = new ArrayList<>();
        double[] w = new double[t.rowCount()];
        for (int i = 0; i < t.rowCount(); i++) {
            rows.add(i);
            dup[i] = rnd.nextBoolean();
            w[i] = dup[i] ? 2 : 1;
            if (dup[i]) {
                rows.add(i);
            }
        }
        Table doubled = t.select(rows.stream().mapToInt(Integer::intValue).toArray());
        Table.Builder wb = Table.builder();
        for (String c : t.columnNames()) {
            if (t.isNumeric(c)) {
                wb.numeric(c, t.numeric(c));
            } else {
                String[] v = new String[t.rowCount()];
                for (int i = 0; i < v.length; i++) {
                    v[i] = t.value(c, i);
                }
                wb.categorical(c, t.levels(c), v);
            }
        }
        Table weighted = wb.numeric("w", w).build();
        ModelSpec spec = frequency();
        FittedModel a = Glm.fit(spec, doubled);
        assumeFinite(a);
        FittedModel b = Glm.fit(spec.toBuilder().weights("w").build(), weighted);
        for (int j = 0; j < a.columnCount(); j++) {
            assertClose(a.coefficients()[j], b.coefficients()[j], a.columnNames().get(j));
        }
        assertClose(a.deviance(), b.deviance(), "deviance");
    }

    @Property(tries = 40)
    void rescalingAColumnRescalesItsCoefficient(@ForAll @LongRange(min = 0, max = 100_000) long seed,
            @ForAll @DoubleRange(min = 0.001, max = 1000) @Scale(4) double c) {
        Table t = Portfolios.motor(seed, 60);
        double[] age = t.numeric("age");
        for (int i = 0; i < age.length; i++) {
            age[i] *= c;
        }
        Table scaled = Table.builder().numeric("age", age).categorical("region", t.levels("region"), texts(t, "region"))
                .numeric("exposure", t.numeric("exposure")).numeric("claims", t.numeric("claims")).build();
        FittedModel a = Glm.fit(frequency(), t);
        assumeFinite(a);
        FittedModel b = Glm.fit(frequency(), scaled);
        assertClose(a.coefficient("age"), b.coefficient("age") * c, "age");
        assertClose(a.coefficient("intercept"), b.coefficient("intercept"), "intercept");
        assertClose(a.deviance(), b.deviance(), "deviance");
    }

    @Property(tries = 40)
    void changingTheReferenceLevelKeepsTheFittedMeans(@ForAll @LongRange(min = 0, max = 100_000) long seed,
            @ForAll @IntRange(min = 0, max = 3) int reference) {
        Table t = Portfolios.motor(seed, 60);
        FittedModel a = Glm.fit(frequency(), t);
        assumeFinite(a);
        ModelSpec other = ModelSpec.builder("claims").family(Families.poisson())
                .factor("region", Portfolios.REGIONS[reference]).numeric("age").logOffset("exposure").build();
        FittedModel b = Glm.fit(other, t);
        double[] ma = a.fittedValues();
        double[] mb = b.fittedValues();
        for (int i = 0; i < ma.length; i++) {
            assertClose(ma[i], mb[i], "mean of row " + i);
        }
        assertClose(a.deviance(), b.deviance(), "deviance");
    }

    @Property(tries = 40)
    void aConstantOffsetOnlyMovesTheIntercept(@ForAll @LongRange(min = 0, max = 100_000) long seed,
            @ForAll @DoubleRange(min = -5, max = 5) double shift) {
        Table t = Portfolios.motor(seed, 60);
        double[] off = new double[t.rowCount()];
        java.util.Arrays.fill(off, shift);
        Table shifted = Table.builder().numeric("age", t.numeric("age"))
                .categorical("region", t.levels("region"), texts(t, "region"))
                .numeric("exposure", t.numeric("exposure")).numeric("claims", t.numeric("claims"))
                .numeric("shift", off).build();
        FittedModel a = Glm.fit(frequency(), t);
        assumeFinite(a);
        FittedModel b = Glm.fit(frequency().toBuilder().offset("shift").build(), shifted);
        assertClose(a.coefficient("intercept") - shift, b.coefficient("intercept"), "intercept");
        for (int j = 1; j < a.columnCount(); j++) {
            assertClose(a.coefficients()[j], b.coefficients()[j], a.columnNames().get(j));
        }
        assertClose(a.deviance(), b.deviance(), "deviance");
    }

    @Property(tries = 40)
    void scalingAGammaResponseOnlyMovesTheLogIntercept(@ForAll @LongRange(min = 0, max = 100_000) long seed,
            @ForAll @DoubleRange(min = 0.001, max = 1000) @Scale(4) double c) {
        Table t = Portfolios.motor(seed, 60);
        double[] s = t.numeric("severity");
        for (int i = 0; i < s.length; i++) {
            s[i] *= c;
        }
        Table scaled = Table.builder().numeric("age", t.numeric("age"))
                .categorical("region", t.levels("region"), texts(t, "region")).numeric("severity", s).build();
        FittedModel a = Glm.fit(severity(), t);
        assumeFinite(a);
        FittedModel b = Glm.fit(severity(), scaled);
        assertClose(a.coefficient("intercept") + Math.log(c), b.coefficient("intercept"), "intercept");
        for (int j = 1; j < a.columnCount(); j++) {
            assertClose(a.coefficients()[j], b.coefficients()[j], a.columnNames().get(j));
        }
        // the Gamma deviance is scale-free
        assertClose(a.deviance(), b.deviance(), "deviance");
    }

    /**
     * A region without claims has no finite estimate (the fit stops with a warning); the
     * invariances are about fits whose maximum exists.
     */
    private static void assumeFinite(FittedModel fit) {
        Assume.that(fit.converged() && fit.warnings().isEmpty());
        // A column whose rows all have a zero count (a region without claims) pushes its estimate
        // towards minus infinity; IRLS may then stop on the flat deviance without a warning, at a
        // point that depends on the path. The invariances hold only where the maximum exists.
        double[] y = fit.response();
        double[] x = new double[fit.columnCount()];
        double[] sumWhereNonZero = new double[fit.columnCount()];
        for (int i = 0; i < fit.rowCount(); i++) {
            fit.modelMatrixRow(i, x);
            for (int j = 0; j < x.length; j++) {
                if (x[j] != 0) {
                    sumWhereNonZero[j] += y[i];
                }
            }
        }
        for (double s : sumWhereNonZero) {
            Assume.that(s > 0);
        }
    }

    static String[] texts(Table t, String column) {
        String[] v = new String[t.rowCount()];
        for (int i = 0; i < v.length; i++) {
            v[i] = t.value(column, i);
        }
        return v;
    }
}
