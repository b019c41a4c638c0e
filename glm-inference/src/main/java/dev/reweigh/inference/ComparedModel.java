package dev.reweigh.inference;

import dev.reweigh.core.FittedModel;

/**
 * One model's line in a {@link ModelComparison}.
 *
 * @since 0.1
 */
public final class ComparedModel {
    private final String label;
    private final FittedModel fit;
    private final InformationCriteria criteria;
    private final double difference;
    private final double weight;

    ComparedModel(String label, FittedModel fit, InformationCriteria criteria, double difference, double weight) {
        this.label = label;
        this.fit = fit;
        this.criteria = criteria;
        this.difference = difference;
        this.weight = weight;
    }

    /**
     * Returns the label, by default "family, link".
     *
     * @return the label
     * @since 0.1
     */
    public String label() {
        return label;
    }

    /**
     * Returns the fitted model.
     *
     * @return the model
     * @since 0.1
     */
    public FittedModel fit() {
        return fit;
    }

    /**
     * Returns the model's log-likelihood and criteria.
     *
     * @return the criteria
     * @since 0.1
     */
    public InformationCriteria criteria() {
        return criteria;
    }

    /**
     * Returns this model's criterion minus the best model's (0 for the best).
     *
     * @return the difference, non-negative
     * @since 0.1
     */
    public double difference() {
        return difference;
    }

    /**
     * Returns the model's weight exp(-difference / 2), normalised to sum to 1 over the models
     * compared (Akaike weights for AIC).
     *
     * @return the weight in [0, 1]
     * @since 0.1
     */
    public double weight() {
        return weight;
    }

    /**
     * Describes the line.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return label + ": " + criteria + ", difference " + difference + ", weight " + weight;
    }
}
