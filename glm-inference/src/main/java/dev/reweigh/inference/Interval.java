package dev.reweigh.inference;

import dev.reweigh.inference.internal.TextTable;
import java.util.Objects;

/**
 * A two-sided interval with its confidence level, e.g. a Wald or profile-likelihood interval.
 *
 * <pre>{@code
 * Interval i = Interval.of(0.8, 1.3, 0.95);
 * boolean inside = i.contains(1.0);      // true
 * }</pre>
 *
 * @since 0.1
 */
public final class Interval {
    private final double lower;
    private final double upper;
    private final double level;

    private Interval(double lower, double upper, double level) {
        this.lower = lower;
        this.upper = upper;
        this.level = level;
    }

    /**
     * Creates an interval.
     *
     * @param lower the lower end (may be negative infinity)
     * @param upper the upper end, not below the lower end (may be positive infinity)
     * @param level the confidence level, strictly between 0 and 1
     * @return the interval
     * @throws IllegalArgumentException when an end is NaN, the ends are reversed or the level is
     *     outside (0, 1)
     * @since 0.1
     */
    public static Interval of(double lower, double upper, double level) {
        if (Double.isNaN(lower) || Double.isNaN(upper) || lower > upper) {
            throw new IllegalArgumentException("interval ends must be ordered numbers, got [" + lower + ", "
                    + upper + "]");
        }
        checkLevel(level);
        return new Interval(lower, upper, level);
    }

    static void checkLevel(double level) {
        if (!(level > 0 && level < 1)) {
            throw new IllegalArgumentException("confidence level must be strictly between 0 and 1, got " + level);
        }
    }

    /**
     * Returns the lower end.
     *
     * @return the lower end
     * @since 0.1
     */
    public double lower() {
        return lower;
    }

    /**
     * Returns the upper end.
     *
     * @return the upper end
     * @since 0.1
     */
    public double upper() {
        return upper;
    }

    /**
     * Returns the confidence level, e.g. 0.95.
     *
     * @return the level
     * @since 0.1
     */
    public double level() {
        return level;
    }

    /**
     * Returns the width, upper minus lower.
     *
     * @return the width
     * @since 0.1
     */
    public double width() {
        return upper - lower;
    }

    /**
     * Tells whether a value lies in the closed interval.
     *
     * @param value the value
     * @return true when lower &lt;= value &lt;= upper
     * @since 0.1
     */
    public boolean contains(double value) {
        return value >= lower && value <= upper;
    }

    /**
     * Maps both ends through exp, e.g. from a coefficient to a relativity.
     *
     * @return the interval of the exponentials
     * @since 0.1
     */
    public Interval exp() {
        return new Interval(Math.exp(lower), Math.exp(upper), level);
    }

    /**
     * Compares ends and level.
     *
     * @param o another object
     * @return true for an interval with the same ends and level
     * @since 0.1
     */
    @Override
    public boolean equals(Object o) {
        if (!(o instanceof Interval)) {
            return false;
        }
        Interval other = (Interval) o;
        return Double.compare(lower, other.lower) == 0 && Double.compare(upper, other.upper) == 0
                && Double.compare(level, other.level) == 0;
    }

    /**
     * Hashes ends and level.
     *
     * @return the hash code
     * @since 0.1
     */
    @Override
    public int hashCode() {
        return Objects.hash(lower, upper, level);
    }

    /**
     * Shows the interval as {@code 95% from 0.8 to 1.3}.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return TextTable.percent(level) + " from " + TextTable.number(lower) + " to " + TextTable.number(upper);
    }
}
