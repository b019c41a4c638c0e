package dev.reweigh.inference;

import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One model-matrix column's line in a {@link CoefficientTable}. An aliased column has no
 * estimate: {@link #isAliased()} is true, the numeric accessors return NaN and the intervals are
 * empty. A column held fixed (a model from {@code FittedModel.refitWithFixed}) reports the held
 * value as its estimate, {@link #isFixed()} is true, and the other numbers are NaN.
 *
 * @since 0.1
 */
public final class CoefficientRow {
    private final String name;
    private final boolean aliased;
    private final double estimate;
    private final double standardError;
    private final double statistic;
    private final double pValue;
    private final Interval waldInterval;
    private final Interval profileInterval;
    private final boolean logLink;
    private final boolean fixed;

    CoefficientRow(String name, boolean aliased, boolean fixed, double estimate, double standardError, double statistic,
                   double pValue, Interval waldInterval, Interval profileInterval, boolean logLink) {
        this.name = name;
        this.aliased = aliased;
        this.estimate = estimate;
        this.standardError = standardError;
        this.statistic = statistic;
        this.pValue = pValue;
        this.waldInterval = waldInterval;
        this.profileInterval = profileInterval;
        this.logLink = logLink;
        this.fixed = fixed;
    }

    /**
     * Returns the column name, e.g. "intercept", "age" or "region=North".
     *
     * @return the name
     * @since 0.1
     */
    public String name() {
        return name;
    }

    /**
     * Tells whether the column is aliased (linearly dependent on earlier ones) and so has no estimate.
     *
     * @return true when aliased
     * @since 0.1
     */
    public boolean isAliased() {
        return aliased;
    }

    /**
     * Tells whether the coefficient was held at a given value rather than estimated.
     *
     * @return true for a column held fixed
     * @since 0.1
     */
    public boolean isFixed() {
        return fixed;
    }

    /**
     * Returns the estimate beta.
     *
     * @return the estimate (the held value for a fixed column), NaN when aliased
     * @since 0.1
     */
    public double estimate() {
        return estimate;
    }

    /**
     * Returns the standard error sqrt(phi [(X'WX)^-1]_jj).
     *
     * @return the standard error, NaN when aliased
     * @since 0.1
     */
    public double standardError() {
        return standardError;
    }

    /**
     * Returns the Wald statistic estimate / standard error (z or t, see the table).
     *
     * @return the statistic, NaN when aliased
     * @since 0.1
     */
    public double statistic() {
        return statistic;
    }

    /**
     * Returns the two-sided p-value of the Wald statistic against the table's reference distribution.
     *
     * @return the p-value, NaN when aliased
     * @since 0.1
     */
    public double pValue() {
        return pValue;
    }

    /**
     * Returns the Wald interval estimate +- quantile x standard error.
     *
     * @return the interval, empty when aliased
     * @since 0.1
     */
    public Optional<Interval> waldInterval() {
        return Optional.ofNullable(waldInterval);
    }

    /**
     * Returns the profile-likelihood interval, when the table was built with them.
     *
     * @return the interval, empty when aliased or not computed
     * @since 0.1
     */
    public Optional<Interval> profileInterval() {
        return Optional.ofNullable(profileInterval);
    }

    /**
     * Returns the relativity exp(beta), the multiplicative effect on the mean under a log link.
     *
     * @return the relativity, empty unless the link is log and the column is estimated
     * @since 0.1
     */
    public OptionalDouble relativity() {
        return logLink && !aliased && !fixed ? OptionalDouble.of(Math.exp(estimate)) : OptionalDouble.empty();
    }

    /**
     * Returns the interval of the relativity: exp of the profile interval when there is one, else
     * exp of the Wald interval.
     *
     * @return the interval, empty unless the link is log and the column is estimated
     * @since 0.1
     */
    public Optional<Interval> relativityInterval() {
        if (!logLink || aliased || fixed) {
            return Optional.empty();
        }
        return Optional.of(profileInterval != null ? profileInterval.exp() : waldInterval.exp());
    }

    /**
     * Describes the row in one line.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        if (aliased) {
            return name + ": aliased, no estimate";
        }
        if (fixed) {
            return name + ": held fixed at " + estimate;
        }
        return name + ": estimate " + estimate + ", std error " + standardError + ", statistic " + statistic
                + ", p-value " + pValue + ", wald " + waldInterval
                + (profileInterval != null ? ", profile " + profileInterval : "");
    }
}
