package dev.reweigh.core.internal;

/**
 * The convergence measures shared by the in-memory fit ({@link Irls}) and the streaming fit, so
 * that both stop by one rule: the relative change of the deviance and the largest change of a
 * coefficient, scaled by its column's root mean square, relative to the largest scaled coefficient.
 */
public final class ConvergenceRule {
    private ConvergenceRule() {
    }

    /**
     * Returns |new - old| / (|new| + 0.1); the 0.1 keeps the measure finite near a zero deviance.
     *
     * @param devNew the deviance after the step
     * @param dev the deviance before it
     * @return the relative change
     */
    public static double devianceChange(double devNew, double dev) {
        return Math.abs(devNew - dev) / (Math.abs(devNew) + 0.1);
    }

    /**
     * Returns max_j |new_j - old_j| s_j / max_j |new_j| s_j over the columns not excluded, with
     * s_j the column's root mean square (0 when nothing moved).
     *
     * @param betaNew coefficients after the step
     * @param beta coefficients before it
     * @param columnRms root mean square of each column
     * @param excluded columns left out (aliased or held)
     * @return the scaled relative change
     */
    public static double coefficientChange(double[] betaNew, double[] beta, double[] columnRms, boolean[] excluded) {
        double num = 0;
        double den = 0;
        for (int j = 0; j < betaNew.length; j++) {
            if (!excluded[j]) {
                num = Math.max(num, Math.abs(betaNew[j] - beta[j]) * columnRms[j]);
                den = Math.max(den, Math.abs(betaNew[j]) * columnRms[j]);
            }
        }
        return num == 0 ? 0 : num / Math.max(den, Double.MIN_NORMAL);
    }
}
