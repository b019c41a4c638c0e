package dev.reweigh.core;

import dev.reweigh.families.Family;
import dev.reweigh.families.Link;

import java.util.ArrayList;
import java.util.List;

/**
 * What a scorer needs from a model, whether fitted in this process or read from an artifact:
 * family, link, resolved terms, coefficients, unscaled covariance, dispersion and offset columns.
 */
final class ScoringModel {
    final Family family;
    final Link link;
    final boolean intercept;
    final List<ScoringTerm> terms;
    final List<String> columnNames;
    final double[] beta;           // NaN for aliased columns
    final double[][] covariance;   // unscaled; NaN rows and columns for aliased columns
    final double dispersion;       // NaN when not available
    final String offset;
    final String logOffset;

    ScoringModel(Family family, Link link, boolean intercept, List<ScoringTerm> terms, List<String> columnNames,
            double[] beta, double[][] covariance, double dispersion, String offset, String logOffset) {
        this.family = family;
        this.link = link;
        this.intercept = intercept;
        this.terms = List.copyOf(terms);
        this.columnNames = List.copyOf(columnNames);
        this.beta = beta;
        this.covariance = covariance;
        this.dispersion = dispersion;
        this.offset = offset;
        this.logOffset = logOffset;
    }

    static ScoringModel of(FittedModel fit, double dispersion) {
        return of(fit.spec(), fit.recipe(), fit.columnNames(), fit.coefficients(), fit.unscaledCovariance(),
                dispersion);
    }

    static ScoringModel of(StreamingFit fit, double dispersion) {
        return of(fit.spec(), fit.recipe(), fit.columnNames(), fit.coefficients(), fit.unscaledCovariance(),
                dispersion);
    }

    private static ScoringModel of(ModelSpec spec, DesignRecipe recipe, List<String> columnNames, double[] beta,
            double[][] covariance, double dispersion) {
        List<ScoringTerm> terms = new ArrayList<>();
        for (DesignRecipe.Encoder e : recipe.encoders()) {
            terms.add(ScoringTerm.of(e));
        }
        return new ScoringModel(spec.family(), spec.link(), recipe.hasIntercept(), terms, columnNames, beta,
                covariance, dispersion, spec.offset().orElse(null), spec.logOffset().orElse(null));
    }

    /**
     * The dispersion a fitted model implies when the caller gives none: 1 for families with a
     * fixed dispersion, else the Pearson estimate (sum of w (y - mu)^2 / V(mu) over the residual
     * degrees of freedom), NaN when there are no residual degrees of freedom.
     */
    static double defaultDispersion(FittedModel fit) {
        if (fit.family().isDispersionFixed() || fit.residualDf() <= 0) {
            return fromPearson(fit.family(), 0.0, fit.residualDf());
        }
        double[] y = fit.response();
        double[] mu = fit.fittedValues();
        double[] w = fit.priorWeights();
        double s = 0;
        for (int i = 0; i < y.length; i++) {
            if (w[i] > 0) {
                double r = y[i] - mu[i];
                s += w[i] * r * r / fit.family().variance(mu[i]);
            }
        }
        return fromPearson(fit.family(), s, fit.residualDf());
    }

    /** The same default for a streaming fit, from the Pearson statistic of its last pass. */
    static double defaultDispersion(StreamingFit fit) {
        return fromPearson(fit.spec().family(), fit.pearsonChiSquare(), fit.residualDf());
    }

    private static double fromPearson(Family family, double pearson, long residualDf) {
        if (family.isDispersionFixed()) {
            return 1.0;
        }
        return residualDf <= 0 ? Double.NaN : pearson / residualDf;
    }
}
