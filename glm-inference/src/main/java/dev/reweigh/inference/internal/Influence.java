package dev.reweigh.inference.internal;

import dev.reweigh.core.FittedModel;

/**
 * Hat-matrix diagonal of the final weighted least-squares step, one row at a time:
 * h_i = w_i x_i' (X'WX)^-1 x_i, without forming the n by n hat matrix.
 */
public final class Influence {
    private Influence() {
    }

    /**
     * Computes the leverages.
     *
     * @param fit the fitted model
     * @return one leverage per fitted row, in [0, 1]
     */
    public static double[] leverage(FittedModel fit) {
        double[][] c = fit.unscaledCovariance();
        int[] idx = Algebra.estimableColumns(fit);
        double[] w = fit.workingWeights();
        double[] x = new double[fit.columnCount()];
        double[] h = new double[fit.rowCount()];
        for (int i = 0; i < h.length; i++) {
            if (w[i] <= 0) {
                continue;
            }
            fit.modelMatrixRow(i, x);
            double v = w[i] * Algebra.quadraticForm(x, c, idx);
            // rounding can push a leverage a hair outside [0, 1]
            h[i] = Math.min(1.0, Math.max(0.0, v));
        }
        return h;
    }
}
