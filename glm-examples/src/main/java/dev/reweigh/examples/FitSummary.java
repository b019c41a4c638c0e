package dev.reweigh.examples;

import dev.reweigh.core.FittedModel;
import dev.reweigh.families.Family;
import dev.reweigh.families.ReweighException;
import dev.reweigh.inference.CoefficientTable;
import dev.reweigh.inference.DispersionEstimate;
import dev.reweigh.inference.DispersionMethod;
import dev.reweigh.inference.Inference;
import dev.reweigh.inference.InformationCriteria;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;

/**
 * Everything the {@code fit} command reports about one fitted model, computed once and shared by
 * the text report and the JSON output. Quantities that do not exist for the model (say a
 * maximum-likelihood dispersion for a family that fixes it) are NaN here and null in JSON.
 *
 * @since 0.1
 */
public final class FitSummary {
    private final FittedModel fit;
    private final Inference inference;
    private final CoefficientTable coefficients;
    private final double pearsonChiSquare;
    private final double pearsonDispersion;
    private final double devianceDispersion;
    private final double mlDispersion;
    private final double logLikelihood;
    private final double aic;
    private final double bic;
    private final int parameters;
    private final List<String> notes;

    private FitSummary(FittedModel fit) {
        this.fit = fit;
        this.inference = Inference.of(fit);
        this.coefficients = inference.coefficients();
        List<String> n = new ArrayList<>();
        this.pearsonChiSquare = inference.goodnessOfFit().pearsonChiSquare();
        this.pearsonDispersion = dispersion(fit, DispersionMethod.PEARSON, n);
        this.devianceDispersion = dispersion(fit, DispersionMethod.DEVIANCE, n);
        Family family = fit.family();
        this.mlDispersion = !family.isDispersionFixed() && family.hasDensity()
                ? dispersion(fit, DispersionMethod.MAXIMUM_LIKELIHOOD, n) : Double.NaN;
        double l = Double.NaN;
        double a = Double.NaN;
        double b = Double.NaN;
        int k = 0;
        if (family.hasDensity()) {
            try {
                InformationCriteria ic = inference.informationCriteria();
                l = ic.logLikelihood();
                a = ic.aic();
                b = ic.bic();
                k = ic.parameters();
            } catch (ReweighException e) {
                n.add("no log-likelihood: " + e.getMessage());
            }
        } else {
            n.add("family " + family.name() + " has no density, so there is no log-likelihood, AIC or BIC");
        }
        this.logLikelihood = l;
        this.aic = a;
        this.bic = b;
        this.parameters = k;
        this.notes = Collections.unmodifiableList(n);
    }

    /**
     * Computes the summary of a fitted model.
     *
     * @param fit the fitted model
     * @return the summary
     * @throws ReweighException when the family's dispersion is free and the model has no residual
     *     degrees of freedom (no standard errors exist)
     * @since 0.1
     */
    public static FitSummary of(FittedModel fit) {
        return new FitSummary(Objects.requireNonNull(fit, "fit"));
    }

    private static double dispersion(FittedModel fit, DispersionMethod method, List<String> notes) {
        try {
            return DispersionEstimate.of(fit, method).value();
        } catch (ReweighException | IllegalArgumentException e) {
            notes.add("no " + method.name().toLowerCase(java.util.Locale.ROOT).replace('_', ' ')
                    + " dispersion: " + e.getMessage());
            return Double.NaN;
        }
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
     * Returns the inference used for the coefficient table (dispersion fixed by the family, or
     * the Pearson estimate).
     *
     * @return the inference
     * @since 0.1
     */
    public Inference inference() {
        return inference;
    }

    /**
     * Returns the coefficient table with Wald statistics and 95% intervals.
     *
     * @return the table
     * @since 0.1
     */
    public CoefficientTable coefficients() {
        return coefficients;
    }

    /**
     * Returns the Pearson chi-square statistic (sum of squared Pearson residuals, weighted).
     *
     * @return the statistic
     * @since 0.1
     */
    public double pearsonChiSquare() {
        return pearsonChiSquare;
    }

    /**
     * Returns the Pearson dispersion estimate, NaN when it does not exist.
     *
     * @return the estimate
     * @since 0.1
     */
    public double pearsonDispersion() {
        return pearsonDispersion;
    }

    /**
     * Returns the deviance dispersion estimate, NaN when it does not exist.
     *
     * @return the estimate
     * @since 0.1
     */
    public double devianceDispersion() {
        return devianceDispersion;
    }

    /**
     * Returns the maximum-likelihood dispersion, NaN when the family fixes the dispersion or has
     * no density.
     *
     * @return the estimate
     * @since 0.1
     */
    public double mlDispersion() {
        return mlDispersion;
    }

    /**
     * Returns the dispersion used for standard errors.
     *
     * @return phi
     * @since 0.1
     */
    public double dispersionUsed() {
        return inference.dispersion().value();
    }

    /**
     * Returns the exact log-likelihood (at the maximum-likelihood dispersion), NaN without one.
     *
     * @return the log-likelihood
     * @since 0.1
     */
    public double logLikelihood() {
        return logLikelihood;
    }

    /**
     * Returns the AIC, NaN without a log-likelihood.
     *
     * @return the AIC
     * @since 0.1
     */
    public double aic() {
        return aic;
    }

    /**
     * Returns the BIC, NaN without a log-likelihood.
     *
     * @return the BIC
     * @since 0.1
     */
    public double bic() {
        return bic;
    }

    /**
     * Returns the number of parameters counted by AIC and BIC (0 without a log-likelihood).
     *
     * @return the parameter count
     * @since 0.1
     */
    public int parameters() {
        return parameters;
    }

    /**
     * Returns the fit's warnings followed by notes on quantities that could not be computed.
     *
     * @return an immutable list of one-line texts
     * @since 0.1
     */
    public List<String> warnings() {
        List<String> all = new ArrayList<>(fit.warnings());
        all.addAll(notes);
        return Collections.unmodifiableList(all);
    }
}
