package dev.reweigh.inference.internal;

import dev.reweigh.core.FittedModel;
import dev.reweigh.families.Family;
import dev.reweigh.families.Link;
import java.util.function.IntToDoubleFunction;

/**
 * The per-row arrays of a fitted model, read once, with the per-row quantities and sums inference
 * needs. Rows with zero prior weight carry no information and are skipped by every sum.
 */
public final class ModelData {
    private final FittedModel fit;
    private final double[] y;
    private final double[] mu;
    private final double[] eta;
    private final double[] priorWeights;
    private final int informativeRows;

    private ModelData(FittedModel fit) {
        this.fit = fit;
        this.y = fit.response();
        this.mu = fit.fittedValues();
        this.eta = fit.linearPredictor();
        this.priorWeights = fit.priorWeights();
        int count = 0;
        for (double w : priorWeights) {
            if (w > 0) {
                count++;
            }
        }
        this.informativeRows = count;
    }

    /**
     * Reads the arrays of a fitted model.
     *
     * @param fit the fitted model
     * @return its data
     */
    public static ModelData of(FittedModel fit) {
        return new ModelData(fit);
    }

    /** @return the fitted model */
    public FittedModel fit() {
        return fit;
    }

    /** @return the family */
    public Family family() {
        return fit.family();
    }

    /** @return the link */
    public Link link() {
        return fit.link();
    }

    /** @return the number of rows used in the fit */
    public int rows() {
        return y.length;
    }

    /** @return the number of rows with a positive prior weight */
    public int informativeRows() {
        return informativeRows;
    }

    /**
     * @param i row
     * @return the response of row i
     */
    public double y(int i) {
        return y[i];
    }

    /**
     * @param i row
     * @return the fitted mean of row i
     */
    public double mu(int i) {
        return mu[i];
    }

    /**
     * @param i row
     * @return the linear predictor of row i
     */
    public double eta(int i) {
        return eta[i];
    }

    /**
     * @param i row
     * @return the prior weight of row i
     */
    public double priorWeight(int i) {
        return priorWeights[i];
    }

    /** @return a copy of the responses */
    public double[] responses() {
        return y.clone();
    }

    /** @return a copy of the fitted means */
    public double[] means() {
        return mu.clone();
    }

    /** @return a copy of the prior weights */
    public double[] priorWeights() {
        return priorWeights.clone();
    }

    /**
     * Evaluates a per-row quantity in the informative rows; rows with zero prior weight get 0
     * without being evaluated (their means may lie where the family's functions are undefined).
     *
     * @param value the quantity of row i
     * @return one value per row
     */
    public double[] perInformativeRow(IntToDoubleFunction value) {
        double[] values = new double[y.length];
        for (int i = 0; i < values.length; i++) {
            if (priorWeights[i] > 0) {
                values[i] = value.applyAsDouble(i);
            }
        }
        return values;
    }

    /**
     * Returns the log-likelihood at the fitted means for a given dispersion.
     *
     * @param family the family whose density is summed (usually the model's)
     * @param dispersion phi
     * @return the sum of the prior-weighted log-densities
     */
    public double logLikelihood(Family family, double dispersion) {
        return sumOverInformativeRows(i -> family.logDensity(y[i], mu[i], dispersion, priorWeights[i]));
    }

    /**
     * Sums a per-row quantity over the informative rows, in row order.
     *
     * @param value the quantity of row i
     * @return the sum
     */
    public double sumOverInformativeRows(IntToDoubleFunction value) {
        double sum = 0;
        for (int i = 0; i < y.length; i++) {
            if (priorWeights[i] > 0) {
                sum += value.applyAsDouble(i);
            }
        }
        return sum;
    }
}
