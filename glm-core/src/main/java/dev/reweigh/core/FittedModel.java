package dev.reweigh.core;

import dev.reweigh.core.internal.DesignMatrix;
import dev.reweigh.core.internal.IrlsResult;
import dev.reweigh.families.Family;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.Link;
import dev.reweigh.families.UnknownNameException;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * A fitted generalized linear model: coefficients, unscaled covariance, fitted values, deviance,
 * degrees of freedom, the iteration record and warnings. Immutable and thread-safe; it keeps a
 * reference to its table for refits and diagnostics. Every array getter returns a copy.
 *
 * <p>Standard errors in {@link #toString()} use dispersion 1 for families whose dispersion is
 * fixed (binomial, Poisson, negative binomial) and the Pearson estimate (sum of squared Pearson
 * residuals over the residual degrees of freedom) otherwise.
 *
 * @since 0.1
 */
public final class FittedModel {
    private final ModelSpec spec;
    private final Table data;
    private final FitOptions options;
    private final DesignRecipe recipe;
    private final DesignMatrix design;
    private final List<String> columnNames;
    private final double[] beta;
    private final boolean[] aliased;
    private final Map<Integer, Double> fixed;
    private final double[][] covariance;
    private final int[] usedRows;
    private final int dropped;
    private final double[] y;
    private final double[] priorWeights;
    private final double[] offset;
    private final double[] eta;
    private final double[] mu;
    private final double[] workingWeights;
    private final double deviance;
    private final double nullDeviance;
    private final int rank;
    private final int residualDf;
    private final int nullDf;
    private final int iterations;
    private final boolean converged;
    private final List<String> warnings;
    private final String route;
    private volatile Scorer predictor; // compiled on first prediction; immutable, so a race only repeats work

    FittedModel(ModelSpec spec, Table data, FitOptions options, DesignRecipe recipe, DesignMatrix design,
            double[] beta, boolean[] aliased, Map<Integer, Double> fixed, double[][] covariance, FitData fd,
            IrlsResult r, int rank, double nullDeviance, List<String> warnings) {
        this.spec = spec;
        this.data = data;
        this.options = options;
        this.recipe = recipe;
        this.design = design;
        this.columnNames = recipe.columnNames();
        this.beta = beta;
        this.aliased = aliased;
        this.fixed = Collections.unmodifiableMap(new TreeMap<>(fixed));
        this.covariance = covariance;
        this.usedRows = fd.rows;
        this.dropped = fd.dropped;
        this.y = fd.y;
        this.priorWeights = fd.priorWeights;
        this.offset = fd.offset;
        this.eta = r.eta;
        this.mu = r.mu;
        this.workingWeights = r.workingWeights;
        this.deviance = r.deviance;
        this.nullDeviance = nullDeviance;
        this.rank = rank;
        this.residualDf = fd.positiveWeightRows - rank;
        this.nullDf = fd.positiveWeightRows - (spec.hasIntercept() ? 1 : 0);
        this.iterations = r.iterations;
        this.converged = r.converged;
        this.warnings = List.copyOf(warnings);
        this.route = r.route;
    }

    /** The frozen encoding of the terms (package-private, for scoring and artifacts). */
    DesignRecipe recipe() {
        return recipe;
    }

    /**
     * Returns the specification that was fitted.
     *
     * @return the specification
     * @since 0.1
     */
    public ModelSpec spec() {
        return spec;
    }

    /**
     * Returns the table the model was fitted on (all its rows, including dropped ones).
     *
     * @return the table
     * @since 0.1
     */
    public Table data() {
        return data;
    }

    /**
     * Returns the options of the fit.
     *
     * @return the options
     * @since 0.1
     */
    public FitOptions options() {
        return options;
    }

    /**
     * Returns the family.
     *
     * @return the family
     * @since 0.1
     */
    public Family family() {
        return spec.family();
    }

    /**
     * Returns the link.
     *
     * @return the link
     * @since 0.1
     */
    public Link link() {
        return spec.link();
    }

    /**
     * Returns the names of every model-matrix column, aliased ones included, in model order.
     *
     * @return an immutable list, e.g. [intercept, region=North, age]
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
     * Returns the coefficients in model order: NaN for aliased columns, the held value for a
     * column fixed by {@link #refitWithFixed(String, double)}.
     *
     * @return a copy
     * @since 0.1
     */
    public double[] coefficients() {
        return beta.clone();
    }

    /**
     * Returns one coefficient by column name.
     *
     * @param columnName a name from {@link #columnNames()}
     * @return the coefficient, NaN when the column is aliased
     * @throws UnknownNameException when there is no such column (the message lists them)
     * @since 0.1
     */
    public double coefficient(String columnName) {
        return beta[indexOf(columnName)];
    }

    /**
     * Returns the index of a model-matrix column.
     *
     * @param columnName a name from {@link #columnNames()}
     * @return its index
     * @throws UnknownNameException when there is no such column (the message lists them)
     * @since 0.1
     */
    public int indexOf(String columnName) {
        int j = columnNames.indexOf(columnName);
        if (j < 0) {
            throw new UnknownNameException("model column", columnName, columnNames);
        }
        return j;
    }

    /**
     * Returns the names of the aliased columns (linearly dependent on earlier columns, or never
     * non-zero, such as a level that never occurs), in model order.
     *
     * @return an immutable list
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
     * @param column a column index
     * @return true when aliased
     * @throws IndexOutOfBoundsException when the index is out of range
     * @since 0.1
     */
    public boolean isAliased(int column) {
        return aliased[column];
    }

    /**
     * Returns the names of columns whose coefficient was held fixed (see
     * {@link #refitWithFixed(String, double)}).
     *
     * @return an immutable list, usually empty
     * @since 0.1
     */
    public List<String> fixedColumns() {
        List<String> out = new ArrayList<>();
        for (int j : fixed.keySet()) {
            out.add(columnNames.get(j));
        }
        return List.copyOf(out);
    }

    /**
     * Returns the number of estimated coefficients: columns neither aliased nor fixed.
     *
     * @return the rank
     * @since 0.1
     */
    public int rank() {
        return rank;
    }

    /**
     * Returns the unscaled covariance (X'WX)^-1 at the final working weights, p x p in model
     * order; multiply by the dispersion for the covariance of the estimates. Rows and columns of
     * aliased columns are NaN, those of fixed columns 0.
     *
     * @return a new array
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
     * Returns the number of rows used in the fit (after dropping incomplete rows; rows with
     * zero weight included).
     *
     * @return n
     * @since 0.1
     */
    public int rowCount() {
        return usedRows.length;
    }

    /**
     * Returns how many rows were dropped because of missing values.
     *
     * @return 0 unless the specification drops incomplete rows
     * @since 0.1
     */
    public int droppedRows() {
        return dropped;
    }

    /**
     * Returns the indices into {@link #data()} of the rows used, in order.
     *
     * @return a copy
     * @since 0.1
     */
    public int[] usedRows() {
        return usedRows.clone();
    }

    /**
     * Returns the response as the family sees it: for binomial counts, the proportion of
     * successes.
     *
     * @return a copy, one value per used row
     * @since 0.1
     */
    public double[] response() {
        return y.clone();
    }

    /**
     * Returns the prior weights: the weights column (1 if none), times the trials for binomial
     * counts.
     *
     * @return a copy, one value per used row
     * @since 0.1
     */
    public double[] priorWeights() {
        return priorWeights.clone();
    }

    /**
     * Returns the total offset of each used row: the offset column plus the log of the exposure
     * column, zeros if neither is set.
     *
     * @return a copy
     * @since 0.1
     */
    public double[] offset() {
        return offset.clone();
    }

    /**
     * Returns the linear predictor eta = X beta + offset.
     *
     * @return a copy, one value per used row
     * @since 0.1
     */
    public double[] linearPredictor() {
        return eta.clone();
    }

    /**
     * Returns the fitted means mu = g^-1(eta).
     *
     * @return a copy, one value per used row
     * @since 0.1
     */
    public double[] fittedValues() {
        return mu.clone();
    }

    /**
     * Returns the working weights at the final coefficients: priorWeight dmu/deta^2 / V(mu).
     *
     * @return a copy, one value per used row
     * @since 0.1
     */
    public double[] workingWeights() {
        return workingWeights.clone();
    }

    /**
     * Returns the deviance: the sum over rows of priorWeight times the unit deviance.
     *
     * @return the deviance
     * @since 0.1
     */
    public double deviance() {
        return deviance;
    }

    /**
     * Returns the deviance of the null model with the same offset and weights: intercept only
     * (fitted by IRLS when there is an offset), or, without an intercept, mean = g^-1(offset).
     * NaN, with a warning, when that model cannot be fitted.
     *
     * @return the null deviance
     * @since 0.1
     */
    public double nullDeviance() {
        return nullDeviance;
    }

    /**
     * Returns the residual degrees of freedom: rows with positive weight minus the rank.
     *
     * @return the residual degrees of freedom
     * @since 0.1
     */
    public int residualDf() {
        return residualDf;
    }

    /**
     * Returns the null model's degrees of freedom: rows with positive weight, minus 1 with an
     * intercept.
     *
     * @return the null degrees of freedom
     * @since 0.1
     */
    public int nullDf() {
        return nullDf;
    }

    /**
     * Returns the number of IRLS iterations run.
     *
     * @return the iteration count
     * @since 0.1
     */
    public int iterations() {
        return iterations;
    }

    /**
     * Tells whether the convergence test was met.
     *
     * @return true when converged
     * @since 0.1
     */
    public boolean converged() {
        return converged;
    }

    /**
     * Returns the warnings: non-convergence, fitted probabilities numerically 0 or 1
     * (separation), means on the domain boundary, exhausted step-halving.
     *
     * @return an immutable list, empty when all went well
     * @since 0.1
     */
    public List<String> warnings() {
        return warnings;
    }

    /**
     * Returns the solver route used for the final step: "pivoted QR" or "Cholesky".
     *
     * @return the route's name
     * @since 0.1
     */
    public String solverRoute() {
        return route;
    }

    /**
     * Writes one row of the model matrix X.
     *
     * @param row a fitted row index, 0 to {@link #rowCount()} - 1
     * @param out receives p values
     * @throws IndexOutOfBoundsException when the row is out of range
     * @throws IllegalArgumentException when out is shorter than p
     * @since 0.1
     */
    public void modelMatrixRow(int row, double[] out) {
        java.util.Objects.checkIndex(row, usedRows.length);
        if (out.length < columnCount()) {
            throw new IllegalArgumentException("out has length " + out.length + ", need " + columnCount());
        }
        design.row(row, out);
    }

    /**
     * Builds the model matrix for new data, with the fitted encoding (same levels and reference
     * levels, same polynomial recurrences).
     *
     * @param newData a table with the columns the terms use
     * @return n x p values
     * @throws UnknownNameException when a column is missing or a level was not seen in the fit
     *     (naming column and level)
     * @throws InvalidDataException when a value is missing or not finite
     * @since 0.1
     */
    public double[][] modelMatrix(Table newData) {
        DesignMatrix x = newDesign(newData);
        double[][] out = new double[x.rows()][columnCount()];
        for (int i = 0; i < x.rows(); i++) {
            x.row(i, out[i]);
        }
        return out;
    }

    private DesignMatrix newDesign(Table newData) {
        for (Term t : spec.terms()) {
            for (String c : t.columns()) {
                if (!newData.hasColumn(c)) {
                    throw new UnknownNameException("column", c, newData.columnNames());
                }
            }
        }
        int[] rows = new int[newData.rowCount()];
        for (int i = 0; i < rows.length; i++) {
            rows[i] = i;
        }
        return recipe.build(newData, rows);
    }

    /**
     * Predicts the linear predictor for new data, including the offset and log-offset columns
     * when the specification has them (the new table must then have them too). It is computed by
     * the model's compiled scorer, so it is the same to the bit as {@link #scorer()} and a
     * {@link ModelArtifact}'s scorer give.
     *
     * @param newData a table with the columns the model uses
     * @return one value per row of newData
     * @throws UnknownNameException when a column is missing, or a level was not seen in the fit
     *     ({@link UnseenLevelException}, naming column, row and level)
     * @throws InvalidDataException when a value is missing or invalid
     * @throws ModelSpecException when a column is of the wrong kind (numeric for a factor or the
     *     other way round)
     * @since 0.1
     */
    public double[] predictLink(Table newData) {
        double[] out = new double[newData.rowCount()];
        predictor().scoreLink(newData, out);
        return out;
    }

    /**
     * Predicts the mean for new data: the inverse link of {@link #predictLink(Table)}.
     *
     * @param newData a table with the columns the model uses
     * @return one value per row of newData
     * @throws UnknownNameException when a column is missing, or a level was not seen in the fit
     *     ({@link UnseenLevelException}, naming column, row and level)
     * @throws InvalidDataException when a value is missing or the linear predictor leaves the
     *     link's domain
     * @throws ModelSpecException when a column is of the wrong kind
     * @since 0.1
     */
    public double[] predictMean(Table newData) {
        double[] out = new double[newData.rowCount()];
        predictor().scoreMean(newData, out);
        return out;
    }

    // one code path for eta: predictions go through the scorer, which artifacts share
    private Scorer predictor() {
        Scorer s = predictor;
        if (s == null) {
            // no intervals, so no dispersion is needed (and none is computed)
            s = new Scorer.Builder(ScoringModel.of(this, Double.NaN)).build();
            predictor = s;
        }
        return s;
    }

    /**
     * Fits another specification to the same table with the same options.
     *
     * @param newSpec the specification
     * @return the new fit
     * @since 0.1
     */
    public FittedModel refit(ModelSpec newSpec) {
        return Glm.fit(newSpec, data, options);
    }

    /**
     * Refits with one coefficient held at a value: the column's contribution moves into the
     * offset and the other coefficients are re-estimated (for profile-likelihood intervals).
     * Columns already held fixed stay fixed. The fit starts from this model's coefficients.
     *
     * @param columnName a model column
     * @param value the value to hold it at
     * @return the new fit; its rank and degrees of freedom exclude the fixed column
     * @throws UnknownNameException when there is no such column
     * @throws IllegalArgumentException when the value is not finite
     * @since 0.1
     */
    public FittedModel refitWithFixed(String columnName, double value) {
        int j = indexOf(columnName);
        if (!Double.isFinite(value)) {
            throw new IllegalArgumentException("the fixed value must be finite, got " + value);
        }
        Map<Integer, Double> f = new TreeMap<>(fixed);
        f.put(j, value);
        FitOptions o = options;
        if (options.startCoefficients().isEmpty() && options.startMeans().isEmpty()) {
            double[] start = beta.clone();
            for (int k = 0; k < start.length; k++) {
                if (Double.isNaN(start[k])) {
                    start[k] = 0;
                }
            }
            start[j] = value;
            o = options.toBuilder().startCoefficients(start).build();
            try {
                return Glm.fit(spec, data, o, f);
            } catch (InvalidDataException e) {
                o = options; // the start left the domain: fall back to the family's starting means
            }
        }
        return Glm.fit(spec, data, o, f);
    }

    /**
     * Builds a scorer for this model with the default options: unseen factor levels are an
     * error, no intervals. Its scores are bit-identical to {@link #predictLink(Table)} and
     * {@link #predictMean(Table)}, and to those of the model's {@link ModelArtifact} once read
     * back.
     *
     * @return the scorer, thread-safe
     * @since 0.1
     */
    public Scorer scorer() {
        return Scorer.builder(this).build();
    }

    /**
     * Starts a scorer for this model with options (unseen levels, intervals, dispersion).
     *
     * @return a builder; its dispersion defaults to 1 for families with a fixed dispersion and
     *     the Pearson estimate otherwise
     * @since 0.1
     */
    public Scorer.Builder scorerBuilder() {
        return Scorer.builder(this);
    }

    /**
     * Returns a report of our own layout: the model, the fit's size and record, the deviance,
     * coefficients with standard errors (dispersion 1 for fixed-dispersion families, else the
     * Pearson estimate) and any warnings.
     *
     * @return a multi-line report
     * @since 0.1
     */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        sb.append("Fitted model of ").append(spec.response());
        spec.trials().ifPresent(t -> sb.append(" out of ").append(t));
        sb.append(" (").append(family().name()).append(" family, ").append(link().name()).append(" link)\n");
        sb.append(String.format(Locale.ROOT, "  rows used: %d%s; coefficients estimated: %d of %d columns%n",
                usedRows.length, dropped > 0 ? " (" + dropped + " incomplete rows dropped)" : "", rank, columnCount()));
        sb.append(String.format(Locale.ROOT, "  %s after %d iterations%n",
                converged ? "converged" : "NOT converged", iterations));
        sb.append(String.format(Locale.ROOT, "  deviance %s with %d degrees of freedom (null model: %s with %d)%n",
                num(deviance), residualDf, num(nullDeviance), nullDf));
        List<String> references = recipe.referenceLevels();
        if (!references.isEmpty()) {
            sb.append("  reference levels (no column): ").append(String.join(", ", references)).append('\n');
        }
        double phi = dispersionForReport();
        sb.append(String.format(Locale.ROOT, "  dispersion used for standard errors: %s%s%n", num(phi),
                family().isDispersionFixed() ? " (fixed by the family)" : " (Pearson estimate)"));
        int w = "column".length();
        for (String c : columnNames) {
            w = Math.max(w, c.length());
        }
        sb.append(String.format(Locale.ROOT, "  %-" + w + "s  %14s  %14s%n", "column", "estimate", "std error"));
        for (int j = 0; j < columnCount(); j++) {
            String est;
            String se;
            if (aliased[j]) {
                est = "aliased";
                se = "";
            } else if (fixed.containsKey(j)) {
                est = num(beta[j]);
                se = "held fixed";
            } else {
                est = num(beta[j]);
                se = num(Math.sqrt(phi * covariance[j][j]));
            }
            sb.append(String.format(Locale.ROOT, "  %-" + w + "s  %14s  %14s%n", columnNames.get(j), est, se));
        }
        for (String warning : warnings) {
            sb.append("  warning: ").append(warning).append('\n');
        }
        return sb.toString();
    }

    private double dispersionForReport() {
        if (family().isDispersionFixed()) {
            return 1.0;
        }
        if (residualDf <= 0) {
            return Double.NaN;
        }
        double s = 0;
        for (int i = 0; i < y.length; i++) {
            if (priorWeights[i] > 0) {
                double r = y[i] - mu[i];
                s += priorWeights[i] * r * r / family().variance(mu[i]);
            }
        }
        return s / residualDf;
    }

    private static String num(double v) {
        if (Double.isNaN(v)) {
            return "not available";
        }
        return String.format(Locale.ROOT, "%.6g", v);
    }

}
