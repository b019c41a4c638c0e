package dev.reweigh.core;

import dev.reweigh.families.Experimental;

import java.util.Objects;

/**
 * The scores of a batch of rows from a {@link Scorer}: linear predictor and mean per row, the
 * interval on the mean (built on the link scale, mapped through the inverse link) and standard
 * errors when the scorer was built with an interval level, and which
 * rows had an unseen factor level scored at the reference level. Immutable; array getters return
 * copies.
 *
 * @since 0.1
 */
public final class Scores {
    private final double[] link;
    private final double[] mean;
    private final double[] linkStandardError;
    private final double[] standardError;
    private final double[] lower;
    private final double[] upper;
    private final boolean[] usedReference;

    Scores(double[] link, double[] mean, double[] linkStandardError, double[] standardError, double[] lower,
            double[] upper, boolean[] usedReference) {
        this.link = link;
        this.mean = mean;
        this.linkStandardError = linkStandardError;
        this.standardError = standardError;
        this.lower = lower;
        this.upper = upper;
        this.usedReference = usedReference;
    }

    /**
     * Returns the number of rows scored.
     *
     * @return the row count
     * @since 0.1
     */
    public int rowCount() {
        return link.length;
    }

    /**
     * Returns the linear predictors (offset included).
     *
     * @return a copy, one value per row
     * @since 0.1
     */
    public double[] link() {
        return link.clone();
    }

    /**
     * Returns one row's linear predictor.
     *
     * @param row the row index
     * @return the linear predictor
     * @throws IndexOutOfBoundsException when the row is out of range
     * @since 0.1
     */
    public double link(int row) {
        return link[Objects.checkIndex(row, link.length)];
    }

    /**
     * Returns the means (for the binomial family with a trials column, the probability).
     *
     * @return a copy, one value per row
     * @since 0.1
     */
    public double[] mean() {
        return mean.clone();
    }

    /**
     * Returns one row's mean.
     *
     * @param row the row index
     * @return the mean
     * @throws IndexOutOfBoundsException when the row is out of range
     * @since 0.1
     */
    public double mean(int row) {
        return mean[Objects.checkIndex(row, mean.length)];
    }

    /**
     * Tells whether intervals were computed (the scorer was built with an interval level).
     *
     * @return true when {@link #lower()}, {@link #upper()}, {@link #linkStandardError()} and
     *     {@link #standardError()} are available
     * @since 0.1
     */
    public boolean hasIntervals() {
        return lower != null;
    }

    /**
     * Returns the standard errors of the linear predictors: sqrt(dispersion x' C x) with C the
     * unscaled covariance and x the row of the model matrix.
     *
     * @return a copy, one value per row
     * @throws IllegalStateException when the scorer computes no intervals
     * @since 0.1
     */
    @Experimental
    public double[] linkStandardError() {
        return requireIntervals(linkStandardError).clone();
    }

    /**
     * Returns the delta-method standard errors of the means: |dmu/deta| times the standard error
     * of the linear predictor, sqrt(dispersion x' C x) with C the unscaled covariance.
     *
     * @return a copy, one value per row
     * @throws IllegalStateException when the scorer computes no intervals
     * @since 0.1
     */
    @Experimental
    public double[] standardError() {
        return requireIntervals(standardError).clone();
    }

    /**
     * Returns the lower ends of the intervals on the means: the link-scale interval eta plus or
     * minus z times the link standard error, mapped through the inverse link (the smaller end).
     *
     * @return a copy, one value per row
     * @throws IllegalStateException when the scorer computes no intervals
     * @since 0.1
     */
    @Experimental
    public double[] lower() {
        return requireIntervals(lower).clone();
    }

    /**
     * Returns the upper ends of the intervals on the means: the larger end of the link-scale
     * interval mapped through the inverse link.
     *
     * @return a copy, one value per row
     * @throws IllegalStateException when the scorer computes no intervals
     * @since 0.1
     */
    @Experimental
    public double[] upper() {
        return requireIntervals(upper).clone();
    }

    /**
     * Returns one row's lower interval end.
     *
     * @param row the row index
     * @return the lower end
     * @throws IllegalStateException when the scorer computes no intervals
     * @throws IndexOutOfBoundsException when the row is out of range
     * @since 0.1
     */
    @Experimental
    public double lower(int row) {
        return requireIntervals(lower)[Objects.checkIndex(row, lower.length)];
    }

    /**
     * Returns one row's upper interval end.
     *
     * @param row the row index
     * @return the upper end
     * @throws IllegalStateException when the scorer computes no intervals
     * @throws IndexOutOfBoundsException when the row is out of range
     * @since 0.1
     */
    @Experimental
    public double upper(int row) {
        return requireIntervals(upper)[Objects.checkIndex(row, upper.length)];
    }

    /**
     * Returns, per row, whether an unseen factor level was scored at the reference level.
     *
     * @return a copy, one flag per row (all false unless the scorer allows unseen levels)
     * @since 0.1
     */
    public boolean[] usedReferenceLevel() {
        return usedReference.clone();
    }

    /**
     * Tells whether one row had an unseen factor level scored at the reference level.
     *
     * @param row the row index
     * @return true when the row used the fallback
     * @throws IndexOutOfBoundsException when the row is out of range
     * @since 0.1
     */
    public boolean usedReferenceLevel(int row) {
        return usedReference[Objects.checkIndex(row, usedReference.length)];
    }

    /**
     * Returns how many rows had an unseen factor level scored at the reference level.
     *
     * @return the count
     * @since 0.1
     */
    public int referenceFallbackCount() {
        int c = 0;
        for (boolean b : usedReference) {
            c += b ? 1 : 0;
        }
        return c;
    }

    private double[] requireIntervals(double[] a) {
        if (a == null) {
            throw new IllegalStateException("these scores have no intervals: build the scorer with an interval"
                    + " level (Scorer.Builder.intervalLevel)");
        }
        return a;
    }

    /**
     * Returns a short description: the number of rows and of fallbacks.
     *
     * @return a description
     * @since 0.1
     */
    @Override
    public String toString() {
        return "Scores of " + rowCount() + " rows" + (hasIntervals() ? " with intervals" : "")
                + (referenceFallbackCount() > 0 ? ", " + referenceFallbackCount()
                + " scored at a reference level for an unseen level" : "");
    }
}
