package dev.reweigh.inference;

import dev.reweigh.core.FittedModel;
import dev.reweigh.inference.internal.Influence;
import dev.reweigh.inference.internal.TextTable;
import java.util.Arrays;
import java.util.Comparator;
import java.util.stream.IntStream;

/**
 * Leverage and Cook's distance of each fitted row.
 *
 * <p>Leverage is the diagonal of the hat matrix of the final weighted least-squares step,
 * h_i = w_i x_i' (X'WX)^-1 x_i, computed row by row; the leverages sum to the rank. Cook's
 * distance is D_i = r_i^2 h_i / (phi k (1 - h_i)^2) with r_i the Pearson residual and k the rank:
 * exact for Gaussian linear models, the usual one-step approximation otherwise.
 *
 * @since 0.1
 */
public final class Diagnostics {
    private final FittedModel fit;
    private final double[] leverage;
    private final double[] cooks;

    Diagnostics(FittedModel fit, double[] pearson, double dispersion) {
        this.fit = fit;
        this.leverage = Influence.leverage(fit);
        this.cooks = new double[leverage.length];
        int k = fit.rank();
        for (int i = 0; i < cooks.length; i++) {
            double h = leverage[i];
            double r = pearson[i];
            if (r == 0 || h == 0) {
                cooks[i] = 0;
            } else if (h >= 1) {
                cooks[i] = Double.POSITIVE_INFINITY;
            } else {
                cooks[i] = r * r * h / (dispersion * k * (1 - h) * (1 - h));
            }
        }
    }

    /**
     * Returns the leverages.
     *
     * @return one value in [0, 1] per fitted row
     * @since 0.1
     */
    public double[] leverage() {
        return leverage.clone();
    }

    /**
     * Returns Cook's distances.
     *
     * @return one non-negative value per fitted row (infinite where the leverage is 1)
     * @since 0.1
     */
    public double[] cooksDistance() {
        return cooks.clone();
    }

    /**
     * Returns the fitted rows with the largest Cook's distances.
     *
     * @param count how many rows, at most the number of fitted rows
     * @return fitted row indices, largest distance first
     * @since 0.1
     */
    public int[] mostInfluential(int count) {
        return IntStream.range(0, cooks.length).boxed()
                .sorted(Comparator.comparingDouble((Integer i) -> cooks[i]).reversed())
                .limit(Math.max(0, count)).mapToInt(Integer::intValue).toArray();
    }

    /**
     * Lists the five most influential rows.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        int[] usedRows = fit.usedRows();
        TextTable t = TextTable.withTitles("data row", "leverage", "Cook's distance");
        for (int i : mostInfluential(5)) {
            t.row(Integer.toString(usedRows[i]), TextTable.number(leverage[i]), TextTable.number(cooks[i]));
        }
        double mean = Arrays.stream(leverage).sum() / Math.max(1, leverage.length);
        return "mean leverage " + TextTable.number(mean) + "; rows with the largest Cook's distance:\n" + t.render();
    }
}
