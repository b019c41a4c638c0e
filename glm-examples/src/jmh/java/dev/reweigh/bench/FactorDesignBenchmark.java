package dev.reweigh.bench;

import dev.reweigh.core.FitOptions;
import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Solver;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Poisson claim frequency with three factors of 1000, 200 and 50 levels (vehicle model, postcode
 * district, vehicle age band) plus 10 numeric rating variables and an exposure offset: the
 * factor-coded fit against the same model with every factor level as a dense dummy column.
 *
 * <p>The dense expansion has p = 1 + 10 + 999 + 199 + 49 = 1258 columns, 10 GB at n = 1e6, so
 * it is measured at small n (param {@code denseRows}), next to the factor-coded fit of the same
 * rows; its cost is dominated by the n p^2 accumulation and grows linearly in n, which is how it
 * is scaled to 1e6 in the results.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = {"-Xms6g", "-Xmx6g"})
@Warmup(iterations = 1)
@Measurement(iterations = 2)
public class FactorDesignBenchmark {
    static final int[] LEVELS = {1000, 200, 50};
    static final String[] FACTORS = {"model", "district", "vehicleAge"};

    /** Rows of the factor-coded fit. */
    @Param({"1000000"})
    public int rows;

    /** Rows of the dense-expansion fit (and of the factor-coded fit at the same size). */
    @Param({"8000"})
    public int denseRows;

    private Table coded;
    private Table codedSmall;
    private Table expandedSmall;
    private ModelSpec codedSpec;
    private ModelSpec expandedSpec;

    /** Builds the tables once. */
    @Setup(Level.Trial)
    public void setUp() {
        coded = table(rows, 5, false, false);
        codedSmall = table(denseRows, 6, false, true);
        expandedSmall = table(denseRows, 6, true, true);
        ModelSpec.Builder c = ModelSpec.builder("claims").family(Families.poisson()).logOffset("exposure");
        ModelSpec.Builder e = ModelSpec.builder("claims").family(Families.poisson()).logOffset("exposure");
        for (int j = 0; j < 10; j++) {
            c.numeric("x" + j);
            e.numeric("x" + j);
        }
        for (int f = 0; f < FACTORS.length; f++) {
            c.factor(FACTORS[f], FACTORS[f] + 0);
            for (int l = 1; l < LEVELS[f]; l++) {
                e.numeric(FACTORS[f] + "_" + l);
            }
        }
        codedSpec = c.build();
        expandedSpec = e.build();
    }

    /**
     * The portfolio. {@code dense}: even level frequencies, smaller level effects and a higher
     * claim rate, so that every level has claims even at a few rows per level (at small n the
     * skewed realistic mix leaves levels without claims, whose estimates run off to minus
     * infinity and stop the fit).
     */
    static Table table(int n, long seed, boolean expanded, boolean dense) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] claims = new double[n];
        double[] exposure = new double[n];
        double[][] x = new double[10][n];
        int[][] codes = new int[3][n];
        double[][] effects = new double[3][];
        for (int f = 0; f < 3; f++) {
            effects[f] = new double[LEVELS[f]];
            for (int l = 0; l < LEVELS[f]; l++) {
                effects[f][l] = (dense ? 0.1 : 0.3) * r.nextGaussian();
            }
        }
        for (int i = 0; i < n; i++) {
            exposure[i] = 0.2 + 0.8 * r.nextDouble();
            double eta = dense ? 1.5 : -2.0;
            for (int j = 0; j < 10; j++) {
                x[j][i] = r.nextDouble() * 2 - 1;
                eta += 0.05 * (j - 4.5) * x[j][i];
            }
            for (int f = 0; f < 3; f++) {
                // skewed level frequencies, as real portfolios have
                // dense: the largest factor cycles through its levels, the others are drawn uniformly
                int l = dense ? (f == 0 ? i % LEVELS[0] : r.nextInt(LEVELS[f]))
                        : (int) (LEVELS[f] * Math.pow(r.nextDouble(), 1.5));
                codes[f][i] = l;
                eta += effects[f][l];
            }
            claims[i] = BenchData.poisson(r, exposure[i] * Math.exp(eta));
        }
        Table.Builder t = Table.builder().numeric("claims", claims).numeric("exposure", exposure);
        for (int j = 0; j < 10; j++) {
            t.numeric("x" + j, x[j]);
        }
        for (int f = 0; f < 3; f++) {
            String[] labels = BenchData.labels(FACTORS[f], LEVELS[f]);
            if (expanded) {
                for (int l = 1; l < LEVELS[f]; l++) {
                    double[] dummy = new double[n];
                    for (int i = 0; i < n; i++) {
                        dummy[i] = codes[f][i] == l ? 1.0 : 0.0;
                    }
                    t.numeric(FACTORS[f] + "_" + l, dummy);
                }
            } else {
                String[] v = new String[n];
                for (int i = 0; i < n; i++) {
                    v[i] = labels[codes[f][i]];
                }
                t.categorical(FACTORS[f], List.of(labels), v);
            }
        }
        return t.build();
    }

    private static FitOptions options() {
        return FitOptions.builder().threads(2).solver(Solver.CHOLESKY).build();
    }

    /**
     * Factor-coded fit at {@code rows} rows.
     *
     * @return the fit
     */
    @Benchmark
    public FittedModel factorCodedFit() {
        return Glm.fit(codedSpec, coded, options());
    }

    /**
     * Factor-coded fit at {@code denseRows} rows.
     *
     * @return the fit
     */
    @Benchmark
    public FittedModel factorCodedFitSmall() {
        return Glm.fit(codedSpec, codedSmall, options());
    }

    /**
     * The same model with dense dummy columns at {@code denseRows} rows.
     *
     * @return the fit
     */
    @Benchmark
    public FittedModel denseExpansionFitSmall() {
        return Glm.fit(expandedSpec, expandedSmall, options());
    }
}
