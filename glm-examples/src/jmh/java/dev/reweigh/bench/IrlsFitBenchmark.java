package dev.reweigh.bench;

import dev.reweigh.core.FitOptions;
import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.Solver;
import java.util.concurrent.TimeUnit;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_MT_DDRM;
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
 * Dense Poisson log fit, n x p (default 1,000,000 x 50), through the public API, against the
 * reference measured in the same run: EJML's multithreaded X'X on the same model matrix.
 *
 * <p>One IRLS iteration is measured as the marginal cost: (fit with 4 iterations - fit with 2
 * iterations) / 2, both with a tolerance too small to stop early, so setup and the final
 * covariance cancel. (The fit converges in about 7 iterations, so iterations 3 and 4 are full
 * steps; past convergence, a tolerance of 1e-300 would add step-halvings.) The whole fit runs
 * with default options except threads = 2.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = {"-Xms8g", "-Xmx8g"})
@Warmup(iterations = 2)
@Measurement(iterations = 4)
public class IrlsFitBenchmark {

    /** Rows. */
    @Param({"1000000"})
    public int n;

    /** Columns including the intercept. */
    @Param({"50"})
    public int p;

    private BenchData.Dense data;
    private DMatrixRMaj x;
    private DMatrixRMaj out;

    /** Builds the data once. */
    @Setup(Level.Trial)
    public void setUp() {
        data = BenchData.dense(n, p, 77, true);
        x = DMatrixRMaj.wrap(n, p, data.rowMajor);
        out = new DMatrixRMaj(p, p);
    }

    /**
     * Reference kernel: EJML multithreaded X'X.
     *
     * @return the product
     */
    @Benchmark
    public DMatrixRMaj referenceEjmlMultTransA() {
        CommonOps_MT_DDRM.multTransA(x, x, out);
        return out;
    }

    /**
     * Whole fit, default options, 2 threads.
     *
     * @return the fit
     */
    @Benchmark
    public FittedModel wholeFit() {
        return Glm.fit(data.spec, data.table, FitOptions.builder().threads(2).build());
    }

    /**
     * Exactly 2 iterations (Cholesky route, 2 threads).
     *
     * @return the fit
     */
    @Benchmark
    public FittedModel fitTwoIterations() {
        return Glm.fit(data.spec, data.table, fixedIterations(2));
    }

    /**
     * Exactly 4 iterations (Cholesky route, 2 threads).
     *
     * @return the fit
     */
    @Benchmark
    public FittedModel fitFourIterations() {
        return Glm.fit(data.spec, data.table, fixedIterations(4));
    }

    private static FitOptions fixedIterations(int k) {
        return FitOptions.builder().threads(2).solver(Solver.CHOLESKY).maxIterations(k).tolerance(1e-300).build();
    }
}
