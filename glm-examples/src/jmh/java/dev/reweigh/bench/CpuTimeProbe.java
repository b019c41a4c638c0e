package dev.reweigh.bench;

import dev.reweigh.core.FitOptions;
import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.Solver;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import org.ejml.data.DMatrixRMaj;
import org.ejml.dense.row.CommonOps_DDRM;

/**
 * CPU time (not wall time) of the dense fit's parts on one thread, for machines shared with other
 * work, where wall-clock JMH numbers are distorted: waiting for a core does not count here.
 * Compares one IRLS iteration ((fit with 4 iterations - fit with 2) / 2) and the whole fit
 * against EJML's single-threaded X'X on the same n x p matrix. Not a JMH benchmark; run as
 * {@code java -Xmx8g -cp benchmarks.jar dev.reweigh.bench.CpuTimeProbe [n] [p]}.
 */
public final class CpuTimeProbe {
    private CpuTimeProbe() {
    }

    private static final ThreadMXBean MX = ManagementFactory.getThreadMXBean();

    private static double cpu() {
        return MX.getCurrentThreadCpuTime() / 1e9;
    }

    /**
     * Runs the probe.
     *
     * @param args n and p (defaults 1,000,000 and 50)
     */
    public static void main(String[] args) {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 1_000_000;
        int p = args.length > 1 ? Integer.parseInt(args[1]) : 50;
        BenchData.Dense data = BenchData.dense(n, p, 77, true);
        DMatrixRMaj x = DMatrixRMaj.wrap(n, p, data.rowMajor);
        DMatrixRMaj out = new DMatrixRMaj(p, p);
        for (int rep = 1; rep <= 3; rep++) {
            double c0 = cpu();
            CommonOps_DDRM.multTransA(x, x, out);
            double kernel = cpu() - c0;
            c0 = cpu();
            Glm.fit(data.spec, data.table, fixed(2));
            double two = cpu() - c0;
            c0 = cpu();
            Glm.fit(data.spec, data.table, fixed(4));
            double four = cpu() - c0;
            c0 = cpu();
            FittedModel whole = Glm.fit(data.spec, data.table, FitOptions.builder().threads(1).build());
            double all = cpu() - c0;
            double iteration = (four - two) / 2;
            System.out.printf("repetition %d (the first warms up the JIT), CPU seconds: EJML X'X %.3f | one iteration %.3f"
                    + " = %.2f x kernel | whole fit %.3f, %d iterations = %.2f x kernel (bound %.1f)%n", rep, kernel,
                    iteration, iteration / kernel, all, whole.iterations(), all / kernel, (whole.iterations() + 1) * 0.5);
        }
    }

    private static FitOptions fixed(int iterations) {
        return FitOptions.builder().threads(1).solver(Solver.CHOLESKY).maxIterations(iterations).tolerance(1e-300).build();
    }
}
