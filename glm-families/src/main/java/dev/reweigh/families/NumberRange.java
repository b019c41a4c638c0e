package dev.reweigh.families;

/**
 * The ranges of numbers the families accept for a response or a mean, each with the words an
 * error message names it by, so that a validity check and its description cannot drift apart.
 */
enum NumberRange {
    FINITE("a finite number") {
        @Override
        boolean contains(double x) {
            return Double.isFinite(x);
        }
    },
    POSITIVE("a positive finite number") {
        @Override
        boolean contains(double x) {
            return x > 0.0 && x < Double.POSITIVE_INFINITY;
        }
    },
    NON_NEGATIVE("a non-negative finite number") {
        @Override
        boolean contains(double x) {
            return x >= 0.0 && x < Double.POSITIVE_INFINITY;
        }
    };

    private final String description;

    NumberRange(String description) {
        this.description = description;
    }

    /** Whether x lies in the range (NaN never does). */
    abstract boolean contains(double x);

    /** The range in words, as {@link Family#responseDomain()} and {@link Family#meanDomain()} give it. */
    String description() {
        return description;
    }
}
