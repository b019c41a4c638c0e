package dev.reweigh.bench;

import dev.reweigh.core.internal.wls.BlockedGramAccumulator;
import dev.reweigh.core.internal.wls.GramLayout;
import dev.reweigh.core.internal.wls.GramPartial;
import dev.reweigh.core.internal.wls.GramRows;
import java.util.SplittableRandom;
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
 * The X'WX accumulation kernel against the reference measured in the same run: EJML's
 * multithreaded X'X ({@code CommonOps_MT_DDRM.multTransA(X, X, out)}) on the same n x p matrix.
 *
 * <p>Flop counts for GFLOP/s: the reference computes the full p x p product, 2 n p^2 flops; the
 * accumulation computes the upper triangle and X'Wz, n p (p + 1) + 2 n p flops (plus n p
 * multiplications for the weights, not counted).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = {"-Xms6g", "-Xmx6g"})
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
public class GramKernelBenchmark {

    /** Rows. */
    @Param({"100000", "1000000"})
    public int n;

    /** Columns. */
    @Param({"50"})
    public int p;

    private DMatrixRMaj x;
    private DMatrixRMaj out;
    private double[] w;
    private double[] z;
    private GramRows rows;
    private GramPartial total;
    private BlockedGramAccumulator oneThread;
    private BlockedGramAccumulator twoThreads;

    /** Builds the matrix once per trial. */
    @Setup(Level.Trial)
    public void setUp() {
        SplittableRandom r = new SplittableRandom(20261202L);
        double[] data = new double[n * p];
        for (int i = 0; i < data.length; i++) {
            data[i] = r.nextDouble() * 2 - 1;
        }
        x = DMatrixRMaj.wrap(n, p, data);
        out = new DMatrixRMaj(p, p);
        w = new double[n];
        z = new double[n];
        for (int i = 0; i < n; i++) {
            w[i] = 0.5 + r.nextDouble();
            z[i] = r.nextDouble();
        }
        GramLayout layout = GramLayout.dense(p);
        rows = GramRows.of(layout, n, data, new int[0][], new double[0][]);
        total = new GramPartial(layout);
        oneThread = BlockedGramAccumulator.of(layout, 1, null);
        twoThreads = BlockedGramAccumulator.of(layout, 2, null);
    }

    /**
     * Reference: EJML's multithreaded X'X (its own process-wide pool, all cores).
     *
     * @return the product
     */
    @Benchmark
    public DMatrixRMaj ejmlMultTransAMultithreaded() {
        CommonOps_MT_DDRM.multTransA(x, x, out);
        return out;
    }

    /**
     * Our X'WX upper triangle and X'Wz, one thread.
     *
     * @return the sums
     */
    @Benchmark
    public GramPartial gramOneThread() {
        total.reset();
        oneThread.accumulate(rows, w, z, total);
        return total;
    }

    /**
     * Our X'WX upper triangle and X'Wz, two threads (bit-identical to one).
     *
     * @return the sums
     */
    @Benchmark
    public GramPartial gramTwoThreads() {
        total.reset();
        twoThreads.accumulate(rows, w, z, total);
        return total;
    }
}
