package dev.reweigh.core;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.optim.InitialGuess;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.PointValuePair;
import org.apache.commons.math3.optim.SimpleBounds;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.nonlinear.scalar.ObjectiveFunction;
import org.apache.commons.math3.optim.nonlinear.scalar.noderiv.BOBYQAOptimizer;

import java.util.function.ToDoubleFunction;

/**
 * Maximises a log-likelihood written by the test from Commons Math distributions, independently
 * of the library: Commons Math's BOBYQA optimizer from a crude start, then a few Newton steps
 * with central finite-difference gradient and Hessian to reach the precision a derivative-free
 * optimizer cannot. Invalid parameter points should return negative infinity.
 */
final class IndependentMaximiser {
    private IndependentMaximiser() {
    }

    static double[] maximise(ToDoubleFunction<double[]> logLik, double[] start, double initialRadius) {
        int p = start.length;
        ToDoubleFunction<double[]> safe = b -> {
            double v = logLik.applyAsDouble(b);
            return Double.isFinite(v) ? v : -1e300;
        };
        BOBYQAOptimizer bobyqa = new BOBYQAOptimizer(2 * p + 1, initialRadius, 1e-10);
        PointValuePair best = bobyqa.optimize(new MaxEval(200_000), new ObjectiveFunction(safe::applyAsDouble),
                GoalType.MAXIMIZE, new InitialGuess(start), SimpleBounds.unbounded(p));
        double[] x = best.getPoint();
        double fx = safe.applyAsDouble(x);
        for (int it = 0; it < 6; it++) {
            double[] h = new double[p];
            for (int j = 0; j < p; j++) {
                h[j] = 1e-5 * Math.max(initialRadius, Math.abs(x[j]));
            }
            double[] g = new double[p];
            double[][] hess = new double[p][p];
            for (int j = 0; j < p; j++) {
                double fp = safe.applyAsDouble(shift(x, j, h[j], -1, 0));
                double fm = safe.applyAsDouble(shift(x, j, -h[j], -1, 0));
                g[j] = (fp - fm) / (2 * h[j]);
                hess[j][j] = (fp - 2 * fx + fm) / (h[j] * h[j]);
                for (int k = 0; k < j; k++) {
                    double fpp = safe.applyAsDouble(shift(x, j, h[j], k, h[k]));
                    double fpm = safe.applyAsDouble(shift(x, j, h[j], k, -h[k]));
                    double fmp = safe.applyAsDouble(shift(x, j, -h[j], k, h[k]));
                    double fmm = safe.applyAsDouble(shift(x, j, -h[j], k, -h[k]));
                    hess[j][k] = (fpp - fpm - fmp + fmm) / (4 * h[j] * h[k]);
                    hess[k][j] = hess[j][k];
                }
            }
            RealVector step = new LUDecomposition(new Array2DRowRealMatrix(hess)).getSolver()
                    .solve(new ArrayRealVector(g));
            double[] next = new double[p];
            for (int j = 0; j < p; j++) {
                next[j] = x[j] - step.getEntry(j);
            }
            double fn = safe.applyAsDouble(next);
            if (!(fn >= fx - 1e-12 * Math.abs(fx))) {
                break;
            }
            x = next;
            fx = fn;
        }
        return x;
    }

    private static double[] shift(double[] x, int j, double dj, int k, double dk) {
        double[] y = x.clone();
        y[j] += dj;
        if (k >= 0) {
            y[k] += dk;
        }
        return y;
    }

    /** Agreement to at least 7 significant digits. */
    static boolean agree7(double ours, double theirs) {
        return Math.abs(ours - theirs) <= 1e-7 * Math.abs(theirs) + 1e-12;
    }
}
