package dev.reweigh.core.internal;

/**
 * The convergence measures shared by the in-memory fit ({@link Irls}) and the streaming fit, so
 * that both stop by one rule: the relative change of the deviance and the largest change of a
 * coefficient, scaled by its column's root mean square, relative to the largest scaled coefficient.
 * Both also keep or halve a step by one rule, {@link #keepsStep}, and say the same when halving
 * runs out.
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

    /**
     * Whether a trial step is kept: its means are valid, its deviance is finite and, when there
     * are earlier coefficients to fall back to, the deviance did not rise beyond rounding.
     *
     * @param valid whether every linear predictor and mean of the step is in the link's and the
     *     family's domain
     * @param devNew the step's deviance
     * @param dev the deviance before the step
     * @param mustNotRise whether a rise of the deviance rejects the step
     * @return true to keep the step, false to halve it
     */
    public static boolean keepsStep(boolean valid, double devNew, double dev, boolean mustNotRise) {
        return valid && Double.isFinite(devNew) && (!mustNotRise || devNew <= dev + 1e-12 * (Math.abs(dev) + 1e-12));
    }

    /**
     * The warning of a fit whose step-halving ran out.
     *
     * @param iteration the iteration
     * @param halvings the halvings tried
     * @param fromCoefficients whether the step started from earlier coefficients (else from the
     *     starting means)
     * @return the message
     */
    public static String halvingExhausted(int iteration, int halvings, boolean fromCoefficients) {
        return String.format(java.util.Locale.ROOT, "step-halving exhausted at iteration %d after %d halvings: no step"
                + " %s; the fit stopped at the previous coefficients", iteration, halvings,
                fromCoefficients ? "lowered the deviance" : "kept the means in the family's domain");
    }

    /**
     * Whether a kept step ends the fit: both the deviance change and the scaled coefficient
     * change are below the tolerance. A step from the starting means (no earlier coefficients)
     * never does.
     *
     * @param devNew the deviance after the step
     * @param dev the deviance before it
     * @param betaNew coefficients after the step
     * @param beta coefficients before it, or null when the step started from the starting means
     * @param columnRms root mean square of each column
     * @param excluded columns left out (aliased or held)
     * @param tolerance the fit's tolerance
     * @return true when the fit has converged
     */
    public static boolean hasConverged(double devNew, double dev, double[] betaNew, double[] beta,
            double[] columnRms, boolean[] excluded, double tolerance) {
        return beta != null && devianceChange(devNew, dev) < tolerance
                && coefficientChange(betaNew, beta, columnRms, excluded) < tolerance;
    }

    /**
     * Halves a rejected step: moves each coefficient half way back towards its value in
     * {@code base}.
     *
     * @param base the coefficients the step started from
     * @param betaNew the step's coefficients, overwritten
     */
    public static void halveTowards(double[] base, double[] betaNew) {
        for (int j = 0; j < betaNew.length; j++) {
            betaNew[j] = 0.5 * (base[j] + betaNew[j]);
        }
    }
}
