package dev.reweigh.core;

/**
 * The error-free addition both scoring paths build their linear predictors from: for t = s + q
 * rounded, {@link #error} is the exact rounding error s + q - t (Knuth's two-sum, no branch on
 * the magnitudes). Both paths take every step through here, which is what keeps their results
 * bit-identical.
 */
final class CompensatedSum {
    private CompensatedSum() {
    }

    /** The exact rounding error of {@code t = s + q}. */
    static double error(double s, double q, double t) {
        double bb = t - s;
        return (s - (t - bb)) + (q - bb);
    }
}
