package dev.reweigh.inference.internal;

import dev.reweigh.core.FittedModel;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealVector;

/**
 * Small dense linear algebra on the coefficient scale (p by p, q by q), never on the rows.
 */
public final class Algebra {
    private Algebra() {
    }

    /**
     * The indices of the estimated columns of a fitted model: neither aliased nor held fixed.
     *
     * @param fit the model
     * @return indices in model order
     */
    public static int[] estimableColumns(FittedModel fit) {
        int p = fit.columnCount();
        int[] idx = new int[p];
        int k = 0;
        for (int j = 0; j < p; j++) {
            if (isEstimated(fit, j)) {
                idx[k++] = j;
            }
        }
        return java.util.Arrays.copyOf(idx, k);
    }

    /**
     * Tells whether a column's coefficient was estimated (not aliased, not held fixed).
     *
     * @param fit the model
     * @param column the column index
     * @return true when estimated
     */
    public static boolean isEstimated(FittedModel fit, int column) {
        return !fit.isAliased(column) && !fit.fixedColumns().contains(fit.columnNames().get(column));
    }

    /**
     * x' C x over the given indices.
     *
     * @param x a model-matrix row (length p)
     * @param c a p by p matrix
     * @param idx the indices to use
     * @return the quadratic form
     */
    public static double quadraticForm(double[] x, double[][] c, int[] idx) {
        double s = 0;
        for (int a : idx) {
            double xa = x[a];
            if (xa == 0) {
                continue;
            }
            double[] row = c[a];
            double inner = 0;
            for (int b : idx) {
                inner += row[b] * x[b];
            }
            s += xa * inner;
        }
        return s;
    }

    /**
     * Solves the symmetric system m z = v.
     *
     * @param m a q by q matrix
     * @param v a q-vector
     * @return z, or null when m is singular
     */
    public static double[] solve(double[][] m, double[] v) {
        DecompositionSolver solver = new LUDecomposition(new Array2DRowRealMatrix(m, true), 1e-13).getSolver();
        if (!solver.isNonSingular()) {
            return null;
        }
        RealVector z = solver.solve(new ArrayRealVector(v, true));
        return z.toArray();
    }
}
