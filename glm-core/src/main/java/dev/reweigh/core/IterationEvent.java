package dev.reweigh.core;

/**
 * What happened in one IRLS iteration.
 *
 * @since 0.1
 */
public final class IterationEvent {
    private final int iteration;
    private final double deviance;
    private final int stepHalvings;
    private final long elapsedNanos;

    private IterationEvent(int iteration, double deviance, int stepHalvings, long elapsedNanos) {
        this.iteration = iteration;
        this.deviance = deviance;
        this.stepHalvings = stepHalvings;
        this.elapsedNanos = elapsedNanos;
    }

    /**
     * Creates an event.
     *
     * @param iteration the iteration number, from 1
     * @param deviance the deviance after the iteration
     * @param stepHalvings how many times the step was halved in this iteration
     * @param elapsedNanos nanoseconds since the fit started
     * @return the event
     * @since 0.1
     */
    public static IterationEvent of(int iteration, double deviance, int stepHalvings, long elapsedNanos) {
        return new IterationEvent(iteration, deviance, stepHalvings, elapsedNanos);
    }

    /**
     * Returns the iteration number, from 1.
     *
     * @return the iteration
     * @since 0.1
     */
    public int iteration() {
        return iteration;
    }

    /**
     * Returns the deviance after the iteration.
     *
     * @return the deviance
     * @since 0.1
     */
    public double deviance() {
        return deviance;
    }

    /**
     * Returns how many times the step was halved in this iteration.
     *
     * @return the count, 0 for a full step
     * @since 0.1
     */
    public int stepHalvings() {
        return stepHalvings;
    }

    /**
     * Returns the time since the fit started.
     *
     * @return nanoseconds
     * @since 0.1
     */
    public long elapsedNanos() {
        return elapsedNanos;
    }

    /**
     * Describes the event in one line.
     *
     * @return e.g. "iteration 3: deviance 38.695, 0 step-halvings, 1.2 ms"
     * @since 0.1
     */
    @Override
    public String toString() {
        return "iteration " + iteration + ": deviance " + deviance + ", " + stepHalvings + " step-halvings, "
                + String.format(java.util.Locale.ROOT, "%.3f ms", elapsedNanos / 1e6);
    }
}
