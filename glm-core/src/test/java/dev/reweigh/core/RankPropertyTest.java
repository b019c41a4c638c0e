package dev.reweigh.core;

import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;

import java.util.List;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * On random designs, a column built as a combination of earlier columns is the one reported as
 * aliased, whatever its scale, by both solver routes.
 */
class RankPropertyTest {

    @Property(tries = 100)
    void theLaterDependentColumnIsAliased(@ForAll @IntRange(min = 2, max = 6) int k,
            @ForAll @IntRange(min = 0, max = 5) int position, @ForAll @LongRange(min = 0, max = 1_000_000) long seed) {
        Random rnd = new Random(seed);
        int n = 30 + rnd.nextInt(30);
        int at = Math.min(position, k - 1);
        double[][] cols = new double[k + 1][n];
        double[] y = new double[n];
        double[] weight = new double[k];
        for (int j = 0; j < k; j++) {
            double scale = Math.pow(10, rnd.nextInt(9) - 4);
            weight[j] = rnd.nextGaussian();
            for (int i = 0; i < n; i++) {
                cols[j][i] = scale * rnd.nextGaussian();
            }
        }
        // the dependent column: a combination of the first at+1 columns, placed after them
        double dscale = Math.pow(10, rnd.nextInt(9) - 4);
        for (int i = 0; i < n; i++) {
            double v = 0;
            for (int j = 0; j <= at; j++) {
                v += weight[j] * cols[j][i];
            }
            cols[k][i] = dscale * v;
            y[i] = rnd.nextGaussian() + cols[0][i];
        }
        Table.Builder tb = Table.builder().numeric("y", y);
        ModelSpec.Builder sb = ModelSpec.builder("y");
        for (int j = 0; j <= at; j++) {
            tb.numeric("c" + j, cols[j]);
            sb.numeric("c" + j);
        }
        tb.numeric("dep", cols[k]);
        sb.numeric("dep");
        for (int j = at + 1; j < k; j++) {
            tb.numeric("c" + j, cols[j]);
            sb.numeric("c" + j);
        }
        Table t = tb.build();
        for (Solver s : Solver.values()) {
            FittedModel fit = Glm.fit(sb.build(), t, FitOptions.builder().solver(s).build());
            assertEquals(List.of("dep"), fit.aliasedColumns(), s.toString());
            assertEquals(k + 1, fit.rank());
        }
    }
}
