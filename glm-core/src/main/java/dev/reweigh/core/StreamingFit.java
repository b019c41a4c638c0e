package dev.reweigh.core;

import dev.reweigh.families.UnknownNameException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The result of a streaming fit ({@link StreamingGlm}): coefficients, their unscaled covariance,
 * deviance and degrees of freedom, without any per-row values (the rows were never held in
 * memory). Immutable and thread-safe; arrays are copied on the way in and out.
 *
 * @since 0.1
 */
public final class StreamingFit {
    private final ModelSpec spec;
    private final FitOptions options;
    private final List<String> columnNames;
    private final double[] coefficients;
    private final boolean[] aliased;
    private final double[][] covariance;
    private final double deviance;
    private final double nullDeviance;
    private final double pearsonChiSquare;
    private final double logLikelihood;
    private final DesignRecipe recipe;
    private final long rowCount;
    private final long droppedRows;
    private final long positiveWeightRows;
    private final int iterations;
    private final int passes;
    private final boolean converged;
    private final List<String> warnings;

    // package-private: built by StreamingGlm only
    StreamingFit(ModelSpec spec, FitOptions options, DesignRecipe recipe, double[] coefficients,
            boolean[] aliased, double[][] covariance, double deviance, double nullDeviance, double pearsonChiSquare,
            double logLikelihood, long rowCount, long droppedRows, long positiveWeightRows, int iterations, int passes,
            boolean converged, List<String> warnings) {
        this.spec = spec;
        this.options = options;
        this.recipe = recipe;
        this.columnNames = recipe.columnNames();
        this.pearsonChiSquare = pearsonChiSquare;
        this.logLikelihood = logLikelihood;
        this.coefficients = coefficients.clone();
        this.aliased = aliased.clone();
        this.covariance = new double[covariance.length][];
        for (int i = 0; i < covariance.length; i++) {
            this.covariance[i] = covariance[i].clone();
        }
        this.deviance = deviance;
        this.nullDeviance = nullDeviance;
        this.rowCount = rowCount;
        this.droppedRows = droppedRows;
        this.positiveWeightRows = positiveWeightRows;
        this.iterations = iterations;
        this.passes = passes;
        this.converged = converged;
        this.warnings = List.copyOf(warnings);
    }

    /**
     * Returns the model specification that was fitted.
     *
     * @return the specification
     * @since 0.1
     */
    public ModelSpec spec() {
        return spec;
    }

    /**
     * Returns the fit options used.
     *
     * @return the options
     * @since 0.1
     */
    public FitOptions options() {
        return options;
    }

    /**
     * Returns the model-matrix column names in model order, aliased ones included (same naming
     * as {@link FittedModel#columnNames()}).
     *
     * @return the names
     * @since 0.1
     */
    public List<String> columnNames() {
        return columnNames;
    }

    /**
     * Returns the number of model-matrix columns, aliased ones included.
     *
     * @return p
     * @since 0.1
     */
    public int columnCount() {
        return columnNames.size();
    }

    /**
     * Returns the coefficients in model order; NaN for aliased columns.
     *
     * @return a copy of the coefficients
     * @since 0.1
     */
    public double[] coefficients() {
        return coefficients.clone();
    }

    /**
     * Returns one coefficient by column name.
     *
     * @param columnName a name from {@link #columnNames()}
     * @return the coefficient, NaN if aliased
     * @throws UnknownNameException if there is no such column
     * @since 0.1
     */
    public double coefficient(String columnName) {
        int j = columnNames.indexOf(columnName);
        if (j < 0) {
            throw new UnknownNameException("model column", columnName, columnNames);
        }
        return coefficients[j];
    }

    /**
     * Returns the names of the aliased columns (left out as linearly dependent on earlier ones).
     *
     * @return the names, in model order
     * @since 0.1
     */
    public List<String> aliasedColumns() {
        List<String> out = new ArrayList<>();
        for (int j = 0; j < aliased.length; j++) {
            if (aliased[j]) {
                out.add(columnNames.get(j));
            }
        }
        return List.copyOf(out);
    }

    /**
     * Tells whether a column is aliased.
     *
     * @param column the column index, 0 to {@code columnCount() - 1}
     * @return true if aliased
     * @throws IndexOutOfBoundsException if the index is out of range
     * @since 0.1
     */
    public boolean isAliased(int column) {
        return aliased[column];
    }

    /**
     * Returns the number of estimated (non-aliased) coefficients.
     *
     * @return the rank
     * @since 0.1
     */
    public int rank() {
        int r = 0;
        for (boolean a : aliased) {
            r += a ? 0 : 1;
        }
        return r;
    }

    /**
     * Returns (X'WX)^-1 at the final working weights, p x p, with NaN rows and columns for aliased
     * columns. Multiply by the dispersion for the covariance of the coefficients.
     *
     * @return a copy
     * @since 0.1
     */
    public double[][] unscaledCovariance() {
        double[][] out = new double[covariance.length][];
        for (int i = 0; i < out.length; i++) {
            out[i] = covariance[i].clone();
        }
        return out;
    }

    /**
     * Returns the deviance at the final coefficients.
     *
     * @return the deviance
     * @since 0.1
     */
    public double deviance() {
        return deviance;
    }

    /**
     * Returns the deviance of the intercept-only model (or of the offset alone without an
     * intercept). It is NaN, with a warning, when the model has both an intercept and an offset:
     * that null model needs a fit of its own, which a streaming fit does not make.
     *
     * @return the null deviance, or NaN
     * @since 0.1
     */
    public double nullDeviance() {
        return nullDeviance;
    }

    /**
     * Returns the Pearson statistic at the final coefficients: the sum over the rows of
     * w (y - mu)^2 / V(mu), gathered in the same pass as the deviance. Divided by
     * {@link #residualDf()} it is the Pearson estimate of the dispersion, which is what
     * {@link ModelArtifact#of(StreamingFit)} records for families with a free dispersion.
     *
     * @return the Pearson statistic
     * @since 0.1
     */
    public double pearsonChiSquare() {
        return pearsonChiSquare;
    }

    /** The log-likelihood at dispersion 1 for families that fix it, else NaN. */
    double logLikelihoodAtUnitDispersion() {
        return logLikelihood;
    }

    DesignRecipe recipe() {
        return recipe;
    }

    /**
     * Returns the number of rows used (after dropping incomplete rows).
     *
     * @return the row count
     * @since 0.1
     */
    public long rowCount() {
        return rowCount;
    }

    /**
     * Returns the number of incomplete rows dropped (only when the specification allows it).
     *
     * @return the count
     * @since 0.1
     */
    public long droppedRows() {
        return droppedRows;
    }

    /**
     * Returns the residual degrees of freedom: rows with positive weight minus the rank.
     *
     * @return the residual df
     * @since 0.1
     */
    public long residualDf() {
        return positiveWeightRows - rank();
    }

    /**
     * Returns the number of IRLS iterations made.
     *
     * @return the iterations
     * @since 0.1
     */
    public int iterations() {
        return iterations;
    }

    /**
     * Returns the number of passes made over the source (one to survey it, then one per
     * evaluated step, including halved steps).
     *
     * @return the passes
     * @since 0.1
     */
    public int passes() {
        return passes;
    }

    /**
     * Tells whether the fit converged within the iteration limit.
     *
     * @return true if converged
     * @since 0.1
     */
    public boolean converged() {
        return converged;
    }

    /**
     * Returns the warnings (non-convergence, exhausted step-halving, values not computed).
     *
     * @return the warnings, possibly empty
     * @since 0.1
     */
    public List<String> warnings() {
        return warnings;
    }

    /**
     * Returns a short report: the coefficients and the fit's summary figures.
     *
     * @return the report
     * @since 0.1
     */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        sb.append(String.format(Locale.ROOT, "Streaming fit: %s family, %s link, %d rows in %d passes%n",
                spec.family().name(), spec.link().name(), rowCount, passes));
        int width = 8;
        for (String c : columnNames) {
            width = Math.max(width, c.length());
        }
        for (int j = 0; j < coefficients.length; j++) {
            String v = aliased[j] ? "(aliased)" : String.format(Locale.ROOT, "%14.6g", coefficients[j]);
            String se = aliased[j] ? "" : String.format(Locale.ROOT, "  unscaled s.e. %.4g", Math.sqrt(covariance[j][j]));
            sb.append(String.format(Locale.ROOT, "  %-" + width + "s %s%s%n", columnNames.get(j), v, se));
        }
        sb.append(String.format(Locale.ROOT, "deviance %.6g on %d df; intercept-only deviance %.6g%n", deviance,
                residualDf(), nullDeviance));
        sb.append(converged ? "converged after " + iterations + " iterations"
                : "NOT converged after " + iterations + " iterations");
        for (String w : warnings) {
            sb.append(System.lineSeparator()).append("warning: ").append(w);
        }
        return sb.toString();
    }
}
