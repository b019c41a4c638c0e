package dev.reweigh.inference;

/**
 * One row's prediction: the linear predictor with its delta-method standard error, the mean with
 * an interval obtained by mapping the link-scale interval through the inverse link, and the
 * standard deviation of a response, sqrt(phi V(mu) / w).
 *
 * @since 0.1
 */
public final class Prediction {
    private final int row;
    private final double linearPredictor;
    private final double linkStandardError;
    private final double mean;
    private final Interval interval;
    private final double responseStandardDeviation;

    Prediction(int row, double linearPredictor, double linkStandardError, double mean, Interval interval,
               double responseStandardDeviation) {
        this.row = row;
        this.linearPredictor = linearPredictor;
        this.linkStandardError = linkStandardError;
        this.mean = mean;
        this.interval = interval;
        this.responseStandardDeviation = responseStandardDeviation;
    }

    /**
     * Returns the row index in the table predicted (for fitted rows, the index into the fitted rows).
     *
     * @return the row
     * @since 0.1
     */
    public int row() {
        return row;
    }

    /**
     * Returns eta, offset included.
     *
     * @return the linear predictor
     * @since 0.1
     */
    public double linearPredictor() {
        return linearPredictor;
    }

    /**
     * Returns sqrt(phi x' (X'WX)^-1 x), the standard error of eta.
     *
     * @return the link-scale standard error
     * @since 0.1
     */
    public double linkStandardError() {
        return linkStandardError;
    }

    /**
     * Returns the predicted mean g^-1(eta).
     *
     * @return the mean
     * @since 0.1
     */
    public double mean() {
        return mean;
    }

    /**
     * Returns the interval of the mean: the link-scale interval mapped through the inverse link.
     *
     * @return the interval
     * @since 0.1
     */
    public Interval interval() {
        return interval;
    }

    /**
     * Returns the standard deviation of one response at this mean, sqrt(phi V(mu) / w) (for the
     * Gamma family mu sqrt(phi / w)).
     *
     * @return the standard deviation (positive infinity for a row with zero prior weight)
     * @since 0.1
     */
    public double responseStandardDeviation() {
        return responseStandardDeviation;
    }

    /**
     * Describes the prediction in one line.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return "row " + row + ": mean " + mean + " (" + interval + "), eta " + linearPredictor + " +- "
                + linkStandardError + ", response sd " + responseStandardDeviation;
    }
}
