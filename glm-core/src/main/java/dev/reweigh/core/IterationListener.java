package dev.reweigh.core;

/**
 * Receives one event per IRLS iteration, on the fitting thread. Keep it quick; an exception it
 * throws ends the fit.
 *
 * @since 0.1
 */
@FunctionalInterface
public interface IterationListener {
    /**
     * Called after each completed iteration.
     *
     * @param event the iteration's deviance, step-halvings and elapsed time
     * @since 0.1
     */
    void onIteration(IterationEvent event);
}
