package dev.reweigh.core;

import java.util.Objects;
import java.util.Optional;

/**
 * Settings of the IRLS fit. Immutable; build with {@link #builder()}.
 *
 * <pre>{@code
 * FitOptions o = FitOptions.builder()
 *         .maxIterations(100)
 *         .solver(Solver.PIVOTED_QR)
 *         .listener(e -> System.out.println(e))
 *         .build();
 * }</pre>
 *
 * @since 0.1
 */
public final class FitOptions {

    /**
     * Default iteration limit.
     *
     * @since 0.1
     */
    public static final int DEFAULT_MAX_ITERATIONS = 50;
    /**
     * Default convergence tolerance on the relative change of deviance and coefficients.
     *
     * @since 0.1
     */
    public static final double DEFAULT_TOLERANCE = 1e-10;
    /**
     * Default rank tolerance: a column whose part not explained by the earlier columns has less
     * than this length, on unit-length weighted columns, is aliased. Exact dependencies leave
     * remainders near 1e-15; a degree-10 polynomial on [-9, -3] leaves about 6e-8 and is kept
     * (the QR route solves it accurately). The Cholesky route cannot resolve remainders below
     * 1e-7 and uses the larger of this tolerance and 1e-7.
     *
     * @since 0.1
     */
    public static final double DEFAULT_RANK_TOLERANCE = 1e-9;
    /**
     * Default limit on step-halvings within one iteration.
     *
     * @since 0.1
     */
    public static final int DEFAULT_MAX_STEP_HALVINGS = 30;

    private static final IterationListener NO_LISTENER = e -> { };
    private static final FitOptions DEFAULTS = new Builder().build();

    private final int maxIterations;
    private final double tolerance;
    private final Solver solver;
    private final double rankTolerance;
    private final double[] startCoefficients;
    private final double[] startMeans;
    private final int threads;
    private final int maxStepHalvings;
    private final IterationListener listener;

    private FitOptions(Builder b) {
        this.maxIterations = b.maxIterations;
        this.tolerance = b.tolerance;
        this.solver = b.solver;
        this.rankTolerance = b.rankTolerance;
        this.startCoefficients = b.startCoefficients == null ? null : b.startCoefficients.clone();
        this.startMeans = b.startMeans == null ? null : b.startMeans.clone();
        this.threads = b.threads;
        this.maxStepHalvings = b.maxStepHalvings;
        this.listener = b.listener;
    }

    /**
     * Returns the default options.
     *
     * @return the defaults (50 iterations, tolerance 1e-10, AUTO solver, rank tolerance 1e-9)
     * @since 0.1
     */
    public static FitOptions defaults() {
        return DEFAULTS;
    }

    /**
     * Starts from the defaults.
     *
     * @return a new builder
     * @since 0.1
     */
    public static Builder builder() {
        return new Builder();
    }

    /**
     * Returns a builder holding these options.
     *
     * @return a new builder
     * @since 0.1
     */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.maxIterations = maxIterations;
        b.tolerance = tolerance;
        b.solver = solver;
        b.rankTolerance = rankTolerance;
        b.startCoefficients = startCoefficients;
        b.startMeans = startMeans;
        b.threads = threads;
        b.maxStepHalvings = maxStepHalvings;
        b.listener = listener;
        return b;
    }

    /**
     * Returns the iteration limit.
     *
     * @return the maximum number of IRLS iterations
     * @since 0.1
     */
    public int maxIterations() {
        return maxIterations;
    }

    /**
     * Returns the convergence tolerance: the fit has converged when the relative change of the
     * deviance and the largest change of a coefficient (in units of its column's root mean square,
     * relative to the largest such coefficient) are both below it.
     *
     * @return the tolerance
     * @since 0.1
     */
    public double tolerance() {
        return tolerance;
    }

    /**
     * Returns the solver route.
     *
     * @return the solver
     * @since 0.1
     */
    public Solver solver() {
        return solver;
    }

    /**
     * Returns the rank tolerance used to decide aliasing.
     *
     * @return the tolerance on unit-length weighted columns
     * @since 0.1
     */
    public double rankTolerance() {
        return rankTolerance;
    }

    /**
     * Returns the caller's starting coefficients, one per model-matrix column, if set.
     *
     * @return a copy, or empty
     * @since 0.1
     */
    public Optional<double[]> startCoefficients() {
        return Optional.ofNullable(startCoefficients).map(double[]::clone);
    }

    /**
     * Returns the caller's starting means, one per row used in the fit, if set.
     *
     * @return a copy, or empty
     * @since 0.1
     */
    public Optional<double[]> startMeans() {
        return Optional.ofNullable(startMeans).map(double[]::clone);
    }

    /**
     * Returns the number of threads the cross-product accumulation may use; results are
     * bit-identical for any value.
     *
     * @return at least 1
     * @since 0.1
     */
    public int threads() {
        return threads;
    }

    /**
     * Returns the limit on step-halvings within one iteration.
     *
     * @return at least 0
     * @since 0.1
     */
    public int maxStepHalvings() {
        return maxStepHalvings;
    }

    /**
     * Returns the iteration listener.
     *
     * @return the listener (a no-op by default)
     * @since 0.1
     */
    public IterationListener listener() {
        return listener;
    }

    /**
     * Describes the options in one line.
     *
     * @return a short description
     * @since 0.1
     */
    @Override
    public String toString() {
        return "FitOptions[maxIterations=" + maxIterations + ", tolerance=" + tolerance + ", solver=" + solver
                + ", rankTolerance=" + rankTolerance + ", threads=" + threads + ", maxStepHalvings="
                + maxStepHalvings + (startCoefficients != null ? ", start coefficients" : "")
                + (startMeans != null ? ", start means" : "") + "]";
    }

    /**
     * Collects settings for {@link FitOptions}.
     *
     * @since 0.1
     */
    public static final class Builder {
        private int maxIterations = DEFAULT_MAX_ITERATIONS;
        private double tolerance = DEFAULT_TOLERANCE;
        private Solver solver = Solver.AUTO;
        private double rankTolerance = DEFAULT_RANK_TOLERANCE;
        private double[] startCoefficients;
        private double[] startMeans;
        private int threads = 1;
        private int maxStepHalvings = DEFAULT_MAX_STEP_HALVINGS;
        private IterationListener listener = NO_LISTENER;

        private Builder() {
        }

        /**
         * Sets the iteration limit.
         *
         * @param n at least 1
         * @return this builder
         * @throws IllegalArgumentException when n is below 1
         * @since 0.1
         */
        public Builder maxIterations(int n) {
            if (n < 1) {
                throw new IllegalArgumentException("maxIterations must be at least 1, got " + n);
            }
            this.maxIterations = n;
            return this;
        }

        /**
         * Sets the convergence tolerance.
         *
         * @param t a positive number below 1
         * @return this builder
         * @throws IllegalArgumentException when t is not in (0, 1)
         * @since 0.1
         */
        public Builder tolerance(double t) {
            if (!(t > 0 && t < 1)) {
                throw new IllegalArgumentException("tolerance must be in (0, 1), got " + t);
            }
            this.tolerance = t;
            return this;
        }

        /**
         * Sets the solver route.
         *
         * @param s the solver
         * @return this builder
         * @since 0.1
         */
        public Builder solver(Solver s) {
            this.solver = Objects.requireNonNull(s, "solver");
            return this;
        }

        /**
         * Sets the rank tolerance.
         *
         * @param t a positive number below 1
         * @return this builder
         * @throws IllegalArgumentException when t is not in (0, 1)
         * @since 0.1
         */
        public Builder rankTolerance(double t) {
            if (!(t > 0 && t < 1)) {
                throw new IllegalArgumentException("rankTolerance must be in (0, 1), got " + t);
            }
            this.rankTolerance = t;
            return this;
        }

        /**
         * Starts from these coefficients (one per model-matrix column, in model order; aliased
         * columns are ignored), instead of the family's starting means.
         *
         * @param beta the starting coefficients, or null to clear
         * @return this builder
         * @since 0.1
         */
        public Builder startCoefficients(double[] beta) {
            this.startCoefficients = beta == null ? null : beta.clone();
            return this;
        }

        /**
         * Starts from these means (one per row used in the fit), instead of the family's
         * starting means.
         *
         * @param mu the starting means, or null to clear
         * @return this builder
         * @since 0.1
         */
        public Builder startMeans(double[] mu) {
            this.startMeans = mu == null ? null : mu.clone();
            return this;
        }

        /**
         * Sets the number of threads for the cross-product accumulation.
         *
         * @param n at least 1
         * @return this builder
         * @throws IllegalArgumentException when n is below 1
         * @since 0.1
         */
        public Builder threads(int n) {
            if (n < 1) {
                throw new IllegalArgumentException("threads must be at least 1, got " + n);
            }
            this.threads = n;
            return this;
        }

        /**
         * Sets the limit on step-halvings within one iteration.
         *
         * @param n at least 0
         * @return this builder
         * @throws IllegalArgumentException when n is negative
         * @since 0.1
         */
        public Builder maxStepHalvings(int n) {
            if (n < 0) {
                throw new IllegalArgumentException("maxStepHalvings must be at least 0, got " + n);
            }
            this.maxStepHalvings = n;
            return this;
        }

        /**
         * Sets the iteration listener.
         *
         * @param l the listener
         * @return this builder
         * @since 0.1
         */
        public Builder listener(IterationListener l) {
            this.listener = Objects.requireNonNull(l, "listener");
            return this;
        }

        /**
         * Builds the options.
         *
         * @return immutable options
         * @since 0.1
         */
        public FitOptions build() {
            return new FitOptions(this);
        }
    }
}
