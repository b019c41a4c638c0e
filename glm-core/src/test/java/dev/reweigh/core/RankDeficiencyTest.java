package dev.reweigh.core;

import dev.reweigh.families.Families;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Aliased columns are detected, named (the later of collinear columns in model order), reported
 * with NaN estimates, left out of the degrees of freedom, and the other coefficients equal those
 * of the fit without them.
 */
class RankDeficiencyTest {

    private static Table data() {
        Random rnd = new Random(11);
        int n = 40;
        double[] a = new double[n];
        double[] b = new double[n];
        double[] y = new double[n];
        String[] region = new String[n];
        for (int i = 0; i < n; i++) {
            a[i] = rnd.nextGaussian();
            b[i] = 10 * rnd.nextDouble();
            region[i] = Portfolios.REGIONS[i % 3];   // West never occurs
            y[i] = Portfolios.poisson(rnd, Math.exp(0.2 + 0.3 * a[i] + 0.05 * b[i]));
        }
        double[] sum = new double[n];
        for (int i = 0; i < n; i++) {
            sum[i] = a[i] + 2 * b[i];
        }
        return Table.builder().numeric("a", a).numeric("b", b).numeric("a_copy", a.clone()).numeric("a_plus_2b", sum)
                .categorical("region", List.of("North", "South", "East", "West"), region).numeric("y", y).build();
    }

    private static void assertSameFit(FittedModel withAliased, FittedModel without) {
        for (String name : without.columnNames()) {
            assertEquals(without.coefficient(name), withAliased.coefficient(name),
                    1e-9 * Math.max(1, Math.abs(without.coefficient(name))), name);
            int j = withAliased.indexOf(name);
            int k = without.indexOf(name);
            assertEquals(without.unscaledCovariance()[k][k], withAliased.unscaledCovariance()[j][j],
                    1e-8 * without.unscaledCovariance()[k][k], "variance of " + name);
        }
        assertEquals(without.deviance(), withAliased.deviance(), 1e-9 * without.deviance());
        assertEquals(without.residualDf(), withAliased.residualDf());
        assertEquals(without.rank(), withAliased.rank());
    }

    private static FitOptions options(Solver s) {
        return FitOptions.builder().solver(s).build();
    }

    @ParameterizedTest
    @EnumSource(Solver.class)
    void aDuplicatedColumnIsAliasedAndNamed(Solver solver) {
        Table t = data();
        ModelSpec base = ModelSpec.builder("y").family(Families.poisson()).numeric("a").numeric("b").build();
        FittedModel full = Glm.fit(base.toBuilder().numeric("a_copy").build(), t, options(solver));
        assertEquals(List.of("a_copy"), full.aliasedColumns());
        assertTrue(Double.isNaN(full.coefficient("a_copy")));
        assertTrue(full.isAliased(full.indexOf("a_copy")));
        assertTrue(Double.isNaN(full.unscaledCovariance()[3][3]));
        assertEquals(3, full.rank());
        assertEquals(t.rowCount() - 3, full.residualDf());
        assertSameFit(full, Glm.fit(base, t, options(solver)));
    }

    @ParameterizedTest
    @EnumSource(Solver.class)
    void theLaterOfCollinearColumnsInModelOrderIsAliased(Solver solver) {
        Table t = data();
        // a_plus_2b first: then b, the last of the three, is the one that goes
        FittedModel fit = Glm.fit(ModelSpec.builder("y").family(Families.poisson()).numeric("a_plus_2b").numeric("a")
                .numeric("b").build(), t, options(solver));
        assertEquals(List.of("b"), fit.aliasedColumns());
        FittedModel sumLast = Glm.fit(ModelSpec.builder("y").family(Families.poisson()).numeric("a").numeric("b")
                .numeric("a_plus_2b").build(), t, options(solver));
        assertEquals(List.of("a_plus_2b"), sumLast.aliasedColumns());
        assertSameFit(sumLast, Glm.fit(ModelSpec.builder("y").family(Families.poisson()).numeric("a").numeric("b")
                .build(), t, options(solver)));
    }

    @ParameterizedTest
    @EnumSource(Solver.class)
    void aLevelThatNeverOccursIsAliased(Solver solver) {
        Table t = data();
        FittedModel fit = Glm.fit(ModelSpec.builder("y").family(Families.poisson()).factor("region", "North")
                .numeric("a").build(), t, options(solver));
        assertEquals(List.of("region=West"), fit.aliasedColumns());
        assertEquals(List.of("intercept", "region=South", "region=East", "region=West", "a"), fit.columnNames());
        // the same fit on a table whose level list has no West
        String[] region = new String[t.rowCount()];
        for (int i = 0; i < region.length; i++) {
            region[i] = t.value("region", i);
        }
        Table noWest = Table.builder().numeric("a", t.numeric("a")).categorical("region",
                List.of("North", "South", "East"), region).numeric("y", t.numeric("y")).build();
        assertSameFit(fit, Glm.fit(ModelSpec.builder("y").family(Families.poisson()).factor("region", "North")
                .numeric("a").build(), noWest, options(solver)));
        assertTrue(fit.toString().contains("aliased"));
    }
}
