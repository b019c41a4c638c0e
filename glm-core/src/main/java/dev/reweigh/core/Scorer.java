package dev.reweigh.core;

import dev.reweigh.core.internal.NumberText;
import dev.reweigh.families.Experimental;
import dev.reweigh.families.Family;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.Link;
import dev.reweigh.families.ReweighException;
import dev.reweigh.families.UnknownNameException;
import org.apache.commons.math3.distribution.NormalDistribution;

import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * Scores rows with a fitted or loaded model, for services and pipelines. Built once, then
 * immutable and safe to share between threads. Factor levels are resolved through a hash map
 * compiled at build time; the array methods write into caller-supplied arrays and allocate
 * nothing per row. Scores are bit-identical to {@link FittedModel#predictLink(Table)} and
 * {@link FittedModel#predictMean(Table)} of the model, whether it was fitted in this process or
 * read from a {@link ModelArtifact}.
 *
 * <pre>{@code
 * Scorer scorer = ModelArtifact.read(path).scorerBuilder()
 *         .unseenLevelsAtReference(true)
 *         .intervalLevel(0.95)
 *         .build();
 * double mu = scorer.mean(Map.of("region", "North", "age", 42.0, "exposure", 0.5));
 * }</pre>
 *
 * <p>Rows come as a {@link Table}, as column arrays by name ({@code double[]} for numeric
 * columns, {@code String[]} for factors), or as one row's values by name (numbers, or text for
 * factors). The model's offset and log-offset (exposure) columns are read from the rows too.
 * A missing or non-finite value gives an {@link InvalidDataException} naming column, row and
 * value; an unseen factor level gives an {@link UnseenLevelException}, unless the scorer was
 * built to score such rows at the reference level, in which case the row is flagged.
 *
 * @since 0.1
 */
public final class Scorer {
    private final ScoringModel model;
    private final CompiledDesign design;
    private final boolean fallback;
    private final double level;
    private final double z;
    private final double dispersion;
    private final double[] scaledCovariance; // dispersion * C, row-major, 0 for aliased; null without intervals

    private Scorer(Builder b) {
        this.model = b.model;
        this.design = new CompiledDesign(model.intercept, model.terms, model.beta, model.offset, model.logOffset);
        this.fallback = b.fallback;
        this.level = b.level;
        this.dispersion = b.dispersion;
        if (Double.isNaN(level)) {
            this.z = Double.NaN;
            this.scaledCovariance = null;
        } else {
            this.z = new NormalDistribution(0.0, 1.0).inverseCumulativeProbability(0.5 + level / 2.0);
            int p = design.columns;
            double[] c = new double[p * p];
            for (int i = 0; i < p; i++) {
                for (int j = 0; j < p; j++) {
                    double v = model.covariance[i][j];
                    c[i * p + j] = Double.isNaN(v) ? 0.0 : dispersion * v;
                }
            }
            this.scaledCovariance = c;
        }
    }

    /**
     * Starts a scorer for a model fitted in this process (the same as
     * {@link FittedModel#scorerBuilder()}).
     *
     * @param fit the fitted model
     * @return a builder; its dispersion defaults to 1 for families with a fixed dispersion and
     *     the Pearson estimate otherwise
     * @since 0.1
     */
    public static Builder builder(FittedModel fit) {
        Objects.requireNonNull(fit, "fit");
        return new Builder(ScoringModel.of(fit, ScoringModel.defaultDispersion(fit)));
    }

    /**
     * Starts a scorer for a model artifact (the same as {@link ModelArtifact#scorerBuilder()}).
     *
     * @param artifact the artifact
     * @return a builder; its dispersion defaults to the artifact's
     * @since 0.1
     */
    public static Builder builder(ModelArtifact artifact) {
        Objects.requireNonNull(artifact, "artifact");
        return new Builder(artifact.scoringModel());
    }

    /**
     * Returns the columns the scorer reads from each row: the terms' columns, then the offset and
     * log-offset columns, without repeats.
     *
     * @return an immutable list
     * @since 0.1
     */
    public List<String> inputColumns() {
        return design.inputNames;
    }

    /**
     * Tells whether the scorer reads a column as a factor (text levels) rather than as a number,
     * so that callers reading rows from text (CSV files, requests) can type each column.
     *
     * @param column one of {@link #inputColumns()}
     * @return true for a factor column
     * @throws dev.reweigh.families.UnknownNameException when the scorer does not read the column
     * @since 0.1
     */
    public boolean isFactor(String column) {
        return design.inputIsFactor[inputIndex(column)];
    }

    /**
     * Returns the levels the model knows for a factor column, in the fit's level order.
     *
     * @param column a factor column of {@link #inputColumns()}
     * @return an immutable list
     * @throws dev.reweigh.families.UnknownNameException when the scorer does not read the column
     *     as a factor
     * @since 0.1
     */
    public List<String> levels(String column) {
        int i = inputIndex(column);
        if (!design.inputIsFactor[i]) {
            throw new UnknownNameException("factor column", column, factorColumns());
        }
        return design.inputLevels.get(i);
    }

    private int inputIndex(String column) {
        int i = design.inputNames.indexOf(column);
        if (i < 0) {
            throw new UnknownNameException("input column", column, design.inputNames);
        }
        return i;
    }

    private List<String> factorColumns() {
        List<String> out = new java.util.ArrayList<>();
        for (int i = 0; i < design.inputIsFactor.length; i++) {
            if (design.inputIsFactor[i]) {
                out.add(design.inputNames.get(i));
            }
        }
        return out;
    }

    /**
     * Returns the family.
     *
     * @return the family
     * @since 0.1
     */
    public Family family() {
        return model.family;
    }

    /**
     * Returns the link.
     *
     * @return the link
     * @since 0.1
     */
    public Link link() {
        return model.link;
    }

    /**
     * Returns the interval level, if the scorer computes intervals.
     *
     * @return the level, e.g. 0.95, or empty
     * @since 0.1
     */
    @Experimental
    public OptionalDouble intervalLevel() {
        return Double.isNaN(level) ? OptionalDouble.empty() : OptionalDouble.of(level);
    }

    /**
     * Returns the dispersion used for intervals.
     *
     * @return the dispersion, NaN when not available
     * @since 0.1
     */
    public double dispersion() {
        return dispersion;
    }

    /**
     * Tells whether unseen factor levels are scored at the reference level (else they are an
     * error).
     *
     * @return true when unseen levels fall back to the reference level
     * @since 0.1
     */
    public boolean scoresUnseenLevelsAtReference() {
        return fallback;
    }

    // ------------------------------------------------------------------ arrays into caller's arrays

    /**
     * Writes the linear predictor of each row of a table into {@code out}.
     *
     * @param rows the rows, with the columns of {@link #inputColumns()}
     * @param out receives one value per row; at least as long as the table
     * @throws InvalidDataException when a value is missing or invalid (naming column, row, value)
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @throws ModelSpecException when a column is of the wrong kind
     * @since 0.1
     */
    public void scoreLink(Table rows, double[] out) {
        run(new ScoringInputs.TableBinding(design, fallback, rows), rows.rowCount(), out, null, null, null);
    }

    /**
     * Writes the mean of each row of a table into {@code out}.
     *
     * @param rows the rows, with the columns of {@link #inputColumns()}
     * @param out receives one value per row; at least as long as the table
     * @throws InvalidDataException when a value is missing or invalid, or a linear predictor is
     *     outside the link's domain
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @throws ModelSpecException when a column is of the wrong kind
     * @since 0.1
     */
    public void scoreMean(Table rows, double[] out) {
        run(new ScoringInputs.TableBinding(design, fallback, rows), rows.rowCount(), null, out, null, null);
    }

    /**
     * Writes the mean of each row of a table into {@code out}, and whether the row had an unseen
     * level scored at the reference level into {@code usedReference}.
     *
     * @param rows the rows, with the columns of {@link #inputColumns()}
     * @param out receives one value per row; at least as long as the table
     * @param usedReference receives one flag per row; at least as long as the table
     * @throws InvalidDataException when a value is missing or invalid, or a linear predictor is
     *     outside the link's domain
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @throws ModelSpecException when a column is of the wrong kind
     * @since 0.1
     */
    public void scoreMean(Table rows, double[] out, boolean[] usedReference) {
        run(new ScoringInputs.TableBinding(design, fallback, rows), rows.rowCount(), null, out, null,
                Objects.requireNonNull(usedReference, "usedReference"));
    }

    /**
     * Writes the linear predictor of each row into {@code out}; rows given as column arrays.
     *
     * @param columns by column name: {@code double[]} for numeric columns, {@code String[]} for
     *     factors, all of one length
     * @param out receives one value per row
     * @throws InvalidDataException when a value is missing or invalid, or an array has the wrong
     *     type or length
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @since 0.1
     */
    public void scoreLink(Map<String, ?> columns, double[] out) {
        ScoringInputs.ArrayBinding b = new ScoringInputs.ArrayBinding(design, fallback, columns, out.length);
        run(b, b.rows, out, null, null, null);
    }

    /**
     * Writes the mean of each row into {@code out}; rows given as column arrays.
     *
     * @param columns by column name: {@code double[]} for numeric columns, {@code String[]} for
     *     factors, all of one length
     * @param out receives one value per row
     * @throws InvalidDataException when a value is missing or invalid, an array has the wrong type
     *     or length, or a linear predictor is outside the link's domain
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @since 0.1
     */
    public void scoreMean(Map<String, ?> columns, double[] out) {
        ScoringInputs.ArrayBinding b = new ScoringInputs.ArrayBinding(design, fallback, columns, out.length);
        run(b, b.rows, null, out, null, null);
    }

    /**
     * Writes the mean of each row into {@code out} and the fallback flags into
     * {@code usedReference}; rows given as column arrays.
     *
     * @param columns by column name: {@code double[]} for numeric columns, {@code String[]} for
     *     factors, all of one length
     * @param out receives one value per row
     * @param usedReference receives, per row, whether an unseen level was scored at the reference
     * @throws InvalidDataException when a value is missing or invalid, an array has the wrong type
     *     or length, or a linear predictor is outside the link's domain
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @since 0.1
     */
    public void scoreMean(Map<String, ?> columns, double[] out, boolean[] usedReference) {
        ScoringInputs.ArrayBinding b = new ScoringInputs.ArrayBinding(design, fallback, columns, out.length);
        run(b, b.rows, null, out, null, Objects.requireNonNull(usedReference, "usedReference"));
    }

    // ------------------------------------------------------------------ results as objects

    /**
     * Scores the rows of a table.
     *
     * @param rows the rows, with the columns of {@link #inputColumns()}
     * @return link, mean, intervals (when configured) and fallback flags
     * @throws InvalidDataException when a value is missing or invalid, or a linear predictor is
     *     outside the link's domain
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @throws ModelSpecException when a column is of the wrong kind
     * @since 0.1
     */
    public Scores score(Table rows) {
        return scores(new ScoringInputs.TableBinding(design, fallback, rows), rows.rowCount());
    }

    /**
     * Scores rows given as column arrays.
     *
     * @param columns by column name: {@code double[]} for numeric columns, {@code String[]} for
     *     factors, all of one length
     * @return link, mean, intervals (when configured) and fallback flags
     * @throws InvalidDataException when a value is missing or invalid, an array has the wrong type
     *     or length, or a linear predictor is outside the link's domain
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @since 0.1
     */
    public Scores score(Map<String, ?> columns) {
        ScoringInputs.ArrayBinding b = new ScoringInputs.ArrayBinding(design, fallback, columns, 1);
        return scores(b, b.rows);
    }

    /**
     * Scores one row given as values by column name: a {@code Number} (or numeric text) for a
     * numeric column, text (or a whole number) naming the level for a factor.
     *
     * @param row the row's values; other keys are ignored
     * @return the scores of one row
     * @throws InvalidDataException when a value is missing or invalid (row 0), or the linear
     *     predictor is outside the link's domain
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @since 0.1
     */
    public Scores scoreRow(Map<String, ?> row) {
        return scores(new ScoringInputs.RowBinding(design, fallback, row), 1);
    }

    /**
     * Returns the linear predictor of one row (see {@link #scoreRow(Map)} for the values).
     *
     * @param row the row's values
     * @return the linear predictor, offset included
     * @throws InvalidDataException when a value is missing or invalid
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @since 0.1
     */
    public double link(Map<String, ?> row) {
        ScoringInputs.RowBinding b = new ScoringInputs.RowBinding(design, fallback, row);
        return design.eta(b, 0, design.newScratch());
    }

    /**
     * Returns the mean of one row (see {@link #scoreRow(Map)} for the values).
     *
     * @param row the row's values
     * @return the mean
     * @throws InvalidDataException when a value is missing or invalid, or the linear predictor is
     *     outside the link's domain
     * @throws UnseenLevelException when a level is unseen and the scorer does not fall back
     * @throws dev.reweigh.families.UnknownNameException when a column is missing
     * @since 0.1
     */
    public double mean(Map<String, ?> row) {
        return mean(link(row), 0);
    }

    // ------------------------------------------------------------------ the loop

    private Scores scores(ScoringInputs.Binding b, int n) {
        double[] link = new double[n];
        double[] mean = new double[n];
        boolean[] flags = new boolean[n];
        Intervals iv = scaledCovariance == null ? null : new Intervals(n);
        run(b, n, link, mean, iv, flags);
        return iv == null ? new Scores(link, mean, null, null, null, null, flags)
                : new Scores(link, mean, iv.linkSe, iv.meanSe, iv.lower, iv.upper, flags);
    }

    /** Per-row interval outputs. */
    private static final class Intervals {
        final double[] linkSe;
        final double[] meanSe;
        final double[] lower;
        final double[] upper;

        Intervals(int n) {
            linkSe = new double[n];
            meanSe = new double[n];
            lower = new double[n];
            upper = new double[n];
        }
    }

    private void run(ScoringInputs.Binding in, int n, double[] link, double[] mean, Intervals iv, boolean[] flags) {
        checkLength("out", link, n);
        checkLength("out", mean, n);
        checkLength("usedReference", flags, n);
        PlainDesign plain = design.plain();
        if (plain != null && iv == null && in instanceof ScoringInputs.TableBinding) {
            runPlain(plain, (ScoringInputs.TableBinding) in, n, link, mean, flags);
            return;
        }
        CompiledDesign.Scratch s = design.newScratch();
        for (int i = 0; i < n; i++) {
            scoreRow(in, i, s, link, mean, iv, flags);
        }
    }

    /** Table rows of a plain design a block at a time; a block with a bad cell goes row by row. */
    private void runPlain(PlainDesign plain, ScoringInputs.TableBinding in, int n, double[] link, double[] mean,
            boolean[] flags) {
        PlainDesign.Columns cols = plain.bind(in);
        double[] sum = cols.sum;
        double[] err = cols.err;
        CompiledDesign.Scratch s = null;
        for (int from = 0; from < n; from += PlainDesign.BLOCK) {
            int len = Math.min(PlainDesign.BLOCK, n - from);
            plain.eta(cols, from, len);
            int r = 0;
            for (; r < len; r++) {
                double e = sum[r] + err[r];
                if (!(Math.abs(e) <= Double.MAX_VALUE)) {
                    break; // a bad cell or an overflow: the row path checks and reports as always
                }
                int i = from + r;
                if (link != null) {
                    link[i] = e;
                }
                if (flags != null) {
                    flags[i] = false;
                }
                if (mean != null) {
                    mean[i] = mean(e, i);
                }
            }
            for (; r < len; r++) {
                if (s == null) {
                    s = design.newScratch();
                }
                scoreRow(in, from + r, s, link, mean, null, flags);
            }
        }
    }

    private void scoreRow(ScoringInputs.Binding in, int i, CompiledDesign.Scratch s, double[] link, double[] mean,
            Intervals iv, boolean[] flags) {
        in.usedReference = false;
        double eta = design.eta(in, i, s);
        if (link != null) {
            link[i] = eta;
        }
        if (flags != null) {
            flags[i] = in.usedReference;
        }
        if (mean != null) {
            double mu = mean(eta, i);
            mean[i] = mu;
            if (iv != null) {
                // the interval is built on the link scale and mapped through the inverse link, so
                // it stays in the family's range (a decreasing link swaps the ends)
                double seEta = Math.sqrt(Math.max(design.quadraticForm(s, scaledCovariance), 0.0));
                double a = model.link.inverse(eta - z * seEta);
                double b = model.link.inverse(eta + z * seEta);
                iv.linkSe[i] = seEta;
                iv.meanSe[i] = Math.abs(model.link.derivative(eta)) * seEta;
                iv.lower[i] = Math.min(a, b);
                iv.upper[i] = Math.max(a, b);
            }
        }
    }

    private double mean(double eta, int row) {
        if (!model.link.isValidEta(eta)) {
            throw new InvalidDataException("linear predictor", row, NumberText.of(eta), model.link.etaDomain());
        }
        return model.link.inverse(eta);
    }

    private static void checkLength(String name, Object array, int n) {
        if (array == null) {
            return;
        }
        int len = array instanceof double[] ? ((double[]) array).length : ((boolean[]) array).length;
        if (len < n) {
            throw new ReweighException("the output array '" + name + "' has length " + len + " but " + n
                    + " rows are scored; expected length at least " + n);
        }
    }

    /**
     * Returns a short description: family, link, input columns and options.
     *
     * @return a description
     * @since 0.1
     */
    @Override
    public String toString() {
        return "Scorer (" + model.family.name() + " family, " + model.link.name() + " link) reading "
                + design.inputNames + (fallback ? "; unseen levels at the reference level" : "")
                + (Double.isNaN(level) ? "" : "; intervals at level " + level);
    }

    /**
     * Options of a {@link Scorer}: what to do with unseen factor levels, whether to compute
     * intervals, and the dispersion they use.
     *
     * @since 0.1
     */
    public static final class Builder {
        private final ScoringModel model;
        private boolean fallback;
        private double level = Double.NaN;
        private double dispersion;

        Builder(ScoringModel model) {
            this.model = model;
            this.dispersion = model.dispersion;
        }

        /**
         * Chooses how to score a row whose factor level was not seen in the fit: false (the
         * default) throws {@link UnseenLevelException}; true scores it at the factor's reference
         * level (its columns all zero; for a factor with a column for every level, as in a model
         * without intercept, that means no level effect) and flags the row.
         *
         * @param on true to fall back to the reference level
         * @return this builder
         * @since 0.1
         */
        public Builder unseenLevelsAtReference(boolean on) {
            this.fallback = on;
            return this;
        }

        /**
         * Computes an interval on each mean at this level: on the link scale, eta plus or minus
         * z sqrt(dispersion x' C x) (z the normal quantile, C the unscaled covariance), mapped
         * through the inverse link so that it stays in the family's range; also the delta-method
         * standard error of the mean, |dmu/deta| times that of eta. Experimental: outside the
         * compatibility promise while the scoring intervals settle.
         *
         * @param level the coverage, strictly between 0 and 1, e.g. 0.95
         * @return this builder
         * @throws IllegalArgumentException when the level is not strictly between 0 and 1
         * @since 0.1
         */
        @Experimental
        public Builder intervalLevel(double level) {
            if (!(level > 0 && level < 1)) {
                throw new IllegalArgumentException("the interval level must be strictly between 0 and 1, got "
                        + level);
            }
            this.level = level;
            return this;
        }

        /**
         * Sets the dispersion used for intervals, replacing the model's.
         *
         * @param dispersion a positive finite number
         * @return this builder
         * @throws IllegalArgumentException when the dispersion is not positive and finite
         * @since 0.1
         */
        public Builder dispersion(double dispersion) {
            if (!(dispersion > 0) || Double.isInfinite(dispersion)) {
                throw new IllegalArgumentException("the dispersion must be positive and finite, got " + dispersion);
            }
            this.dispersion = dispersion;
            return this;
        }

        /**
         * Compiles the scorer.
         *
         * @return the scorer
         * @throws ReweighException when intervals are asked for but no dispersion is available
         *     (give one with {@link #dispersion(double)})
         * @since 0.1
         */
        public Scorer build() {
            if (!Double.isNaN(level) && !(dispersion > 0 && dispersion < Double.POSITIVE_INFINITY)) {
                throw new ReweighException("intervals need a dispersion, and the model has none (value " + dispersion
                        + "); give a positive dispersion with Scorer.Builder.dispersion");
            }
            return new Scorer(this);
        }
    }
}
