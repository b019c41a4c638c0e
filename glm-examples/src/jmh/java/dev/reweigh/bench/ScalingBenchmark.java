package dev.reweigh.bench;

import dev.reweigh.core.FitOptions;
import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.Solver;
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
 * Cost growth of a dense Poisson log fit: time per fit against n (p = 10) and against p
 * (n = 100,000). Each fit runs exactly 3 iterations (tolerance too small to stop; still far from
 * convergence, so no step-halving), so the work per fit is comparable across sizes; slopes of
 * log time on log size are fitted in the results file.
 */
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = {"-Xms8g", "-Xmx8g"})
@Warmup(iterations = 1)
@Measurement(iterations = 2)
public class ScalingBenchmark {

    /** Growth in n at p = 10. */
    @State(Scope.Benchmark)
    public static class ByRows {
        /** Rows. */
        @Param({"10000", "100000", "1000000", "10000000"})
        public int n;
        BenchData.Dense data;

        /** Builds the data. */
        @Setup(Level.Trial)
        public void setUp() {
            data = BenchData.dense(n, 10, 79, false);
        }
    }

    /** Growth in p at n = 100,000. */
    @State(Scope.Benchmark)
    public static class ByColumns {
        /** Columns including the intercept. */
        @Param({"10", "25", "50", "100", "200", "400"})
        public int p;
        BenchData.Dense data;

        /** Builds the data. */
        @Setup(Level.Trial)
        public void setUp() {
            data = BenchData.dense(100_000, p, 80, false);
        }
    }

    private static final FitOptions THREE_ITERATIONS = FitOptions.builder().threads(2).solver(Solver.CHOLESKY)
            .maxIterations(3).tolerance(1e-300).build();

    /**
     * Fit time against n.
     *
     * @param s the data
     * @return the fit
     */
    @Benchmark
    public FittedModel fitByRows(ByRows s) {
        return Glm.fit(s.data.spec, s.data.table, THREE_ITERATIONS);
    }

    /**
     * Fit time against p.
     *
     * @param s the data
     * @return the fit
     */
    @Benchmark
    public FittedModel fitByColumns(ByColumns s) {
        return Glm.fit(s.data.spec, s.data.table, THREE_ITERATIONS);
    }
}
