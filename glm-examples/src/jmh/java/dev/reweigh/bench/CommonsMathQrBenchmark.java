package dev.reweigh.bench;

import dev.reweigh.core.FitOptions;
import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import java.util.concurrent.TimeUnit;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealVector;
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
 * Baseline: a straightforward hand-written Poisson-log IRLS whose weighted least-squares step is
 * Commons Math's {@link QRDecomposition} of sqrt(W) X, against our whole fit on the same data in
 * the same run. Same convergence rule for both (relative deviance change below 1e-10).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = {"-Xms10g", "-Xmx10g"})
@Warmup(iterations = 1)
@Measurement(iterations = 2)
public class CommonsMathQrBenchmark {

    /** Rows. */
    @Param({"1000000"})
    public int n;

    /** Columns including the intercept. */
    @Param({"50"})
    public int p;

    private BenchData.Dense data;

    /** Builds the data once. */
    @Setup(Level.Trial)
    public void setUp() {
        data = BenchData.dense(n, p, 78, true);
    }

    /**
     * Our whole fit (default options, 2 threads).
     *
     * @return the fit
     */
    @Benchmark
    public FittedModel reweighFit() {
        return Glm.fit(data.spec, data.table, FitOptions.builder().threads(2).build());
    }

    /**
     * The hand-written IRLS on Commons Math QR.
     *
     * @return the coefficients
     */
    @Benchmark
    public double[] commonsMathQrIrls() {
        return irls(data.rowMajor, data.claims, n, p);
    }

    static double[] irls(double[] x, double[] y, int n, int p) {
        double[] mu = new double[n];
        double[] eta = new double[n];
        for (int i = 0; i < n; i++) {
            mu[i] = y[i] + 0.1;
            eta[i] = Math.log(mu[i]);
        }
        double dev = deviance(y, mu);
        double[] beta = new double[p];
        for (int iter = 0; iter < 50; iter++) {
            double[][] a = new double[n][p];
            double[] b = new double[n];
            for (int i = 0; i < n; i++) {
                double w = mu[i];                       // Poisson log: w = mu
                double z = eta[i] + (y[i] - mu[i]) / mu[i];
                double s = Math.sqrt(w);
                for (int j = 0; j < p; j++) {
                    a[i][j] = s * x[i * p + j];
                }
                b[i] = s * z;
            }
            QRDecomposition qr = new QRDecomposition(new Array2DRowRealMatrix(a, false));
            RealVector sol = qr.getSolver().solve(new ArrayRealVector(b, false));
            beta = sol.toArray();
            for (int i = 0; i < n; i++) {
                double e = 0;
                for (int j = 0; j < p; j++) {
                    e += x[i * p + j] * beta[j];
                }
                eta[i] = e;
                mu[i] = Math.exp(e);
            }
            double devNew = deviance(y, mu);
            boolean done = Math.abs(devNew - dev) / (Math.abs(devNew) + 0.1) < 1e-10;
            dev = devNew;
            if (done) {
                break;
            }
        }
        return beta;
    }

    private static double deviance(double[] y, double[] mu) {
        double d = 0;
        for (int i = 0; i < y.length; i++) {
            d += 2 * ((y[i] > 0 ? y[i] * Math.log(y[i] / mu[i]) : 0) - (y[i] - mu[i]));
        }
        return d;
    }
}
