package dev.reweigh.inference;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.core.Term;
import dev.reweigh.families.Family;
import dev.reweigh.families.Link;
import dev.reweigh.families.NoLikelihoodException;
import dev.reweigh.families.ReweighException;
import dev.reweigh.families.UnknownNameException;
import dev.reweigh.inference.internal.Algebra;
import dev.reweigh.inference.internal.Comparability;
import dev.reweigh.inference.internal.DispersionMath;
import dev.reweigh.inference.internal.Distributions;
import dev.reweigh.inference.internal.FamilyKind;
import dev.reweigh.inference.internal.ModelData;
import dev.reweigh.inference.internal.ProfileLikelihood;
import dev.reweigh.inference.internal.TextTable;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Inference on one fitted model: the entry point of this package. An {@code Inference} is an
 * immutable view of a fitted model with a chosen dispersion and confidence level; each method
 * computes a result object (some refit the model, as their Javadoc says).
 *
 * <pre>{@code
 * Inference inf = Inference.of(fit);                      // Pearson dispersion where it is free
 * System.out.println(inf);                                // coefficients, dispersion, fit summary
 * CoefficientTable coefficients = inf.withLevel(0.90).coefficientsWithProfileIntervals();
 * LikelihoodRatioTest lrt = inf.likelihoodRatioTest(smallerFit);
 * double[] leverage = inf.diagnostics().leverage();
 * InformationCriteria ic = inf.informationCriteria();
 * }</pre>
 *
 * @since 0.1
 */
public final class Inference {
    /**
     * The confidence level used unless {@link #withLevel(double)} chooses another.
     *
     * @since 0.1
     */
    public static final double DEFAULT_LEVEL = 0.95;

    private final FittedModel fit;
    private final ModelData data;
    private final DispersionEstimate dispersion;
    private final double level;

    private Inference(FittedModel fit, ModelData data, DispersionEstimate dispersion, double level) {
        this.fit = fit;
        this.data = data;
        this.dispersion = dispersion;
        this.level = level;
    }

    /**
     * Starts inference on a fitted model with the default dispersion (fixed at 1 where the family
     * fixes it, the Pearson estimate otherwise) and a 95% level.
     *
     * @param fit the fitted model
     * @return the inference
     * @throws ReweighException when the dispersion is free and the model has no residual degrees
     *     of freedom (use {@link #of(FittedModel, DispersionEstimate)} with a known value then)
     * @since 0.1
     */
    public static Inference of(FittedModel fit) {
        Objects.requireNonNull(fit, "fit");
        return new Inference(fit, ModelData.of(fit), DispersionEstimate.defaultFor(fit), DEFAULT_LEVEL);
    }

    /**
     * Starts inference on a fitted model with a dispersion chosen beforehand, e.g.
     * {@code DispersionEstimate.known(1.0)} for a model with no residual degrees of freedom.
     *
     * @param fit the fitted model
     * @param dispersion the dispersion to use
     * @return the inference, at the 95% level
     * @since 0.1
     */
    public static Inference of(FittedModel fit, DispersionEstimate dispersion) {
        Objects.requireNonNull(fit, "fit");
        Objects.requireNonNull(dispersion, "dispersion");
        return new Inference(fit, ModelData.of(fit), dispersion, DEFAULT_LEVEL);
    }

    /**
     * Returns an inference that uses another dispersion estimate.
     *
     * @param method how to obtain phi; PEARSON or DEVIANCE on a binomial or Poisson model give a
     *     quasi-likelihood analysis
     * @return the new inference
     * @throws IllegalArgumentException see {@link DispersionEstimate#of(FittedModel, DispersionMethod)}
     * @throws NoLikelihoodException for MAXIMUM_LIKELIHOOD on a quasi-likelihood family
     * @since 0.1
     */
    public Inference withDispersion(DispersionMethod method) {
        return new Inference(fit, data, DispersionEstimate.of(fit, method), level);
    }

    /**
     * Returns an inference that treats phi as known.
     *
     * @param phi the dispersion, positive and finite
     * @return the new inference
     * @throws IllegalArgumentException when phi is not positive and finite
     * @since 0.1
     */
    public Inference withKnownDispersion(double phi) {
        return new Inference(fit, data, DispersionEstimate.known(phi), level);
    }

    /**
     * Returns an inference with another confidence level for its intervals.
     *
     * @param newLevel the level, strictly between 0 and 1
     * @return the new inference
     * @throws IllegalArgumentException when the level is outside (0, 1)
     * @since 0.1
     */
    public Inference withLevel(double newLevel) {
        Interval.checkLevel(newLevel);
        return new Inference(fit, data, dispersion, newLevel);
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
     * Returns the dispersion in use.
     *
     * @return the dispersion estimate
     * @since 0.1
     */
    public DispersionEstimate dispersion() {
        return dispersion;
    }

    /**
     * Returns the confidence level of intervals.
     *
     * @return the level
     * @since 0.1
     */
    public double level() {
        return level;
    }

    /**
     * Returns the covariance matrix of the coefficients, phi (X'WX)^-1.
     *
     * @return a p by p matrix, NaN in the rows and columns of aliased coefficients
     * @since 0.1
     */
    public double[][] covariance() {
        double[][] c = fit.unscaledCovariance();
        double phi = dispersion.value();
        for (double[] row : c) {
            for (int j = 0; j < row.length; j++) {
                row[j] *= phi;
            }
        }
        return c;
    }

    private int residualDfForTests() {
        int df = fit.residualDf();
        if (dispersion.isEstimated() && df <= 0) {
            throw new ReweighException("the dispersion is estimated but the model has " + df
                    + " residual degrees of freedom, so t and F references do not exist");
        }
        return df;
    }

    private double criticalValue() {
        double p = (1 + level) / 2;
        return dispersion.isEstimated() ? Distributions.tQuantile(p, residualDfForTests())
                : Distributions.normalQuantile(p);
    }

    private boolean isLogLink() {
        return fit.link().name().equalsIgnoreCase("log");
    }

    /**
     * Returns the coefficient table with Wald statistics and Wald intervals.
     *
     * @return the table
     * @since 0.1
     */
    public CoefficientTable coefficients() {
        return coefficientTable(false);
    }

    /**
     * Returns the coefficient table with profile-likelihood intervals as well. This refits the
     * model several times for each estimable coefficient.
     *
     * @return the table
     * @since 0.1
     */
    public CoefficientTable coefficientsWithProfileIntervals() {
        return coefficientTable(true);
    }

    private CoefficientTable coefficientTable(boolean withProfile) {
        boolean estimated = dispersion.isEstimated();
        int df = estimated ? residualDfForTests() : 0;
        double q = criticalValue();
        double phi = dispersion.value();
        double[] beta = fit.coefficients();
        double[][] c = fit.unscaledCovariance();
        List<String> names = fit.columnNames();
        List<CoefficientRow> rows = new ArrayList<>();
        for (int j = 0; j < beta.length; j++) {
            if (fit.isAliased(j)) {
                rows.add(new CoefficientRow(names.get(j), true, false, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                        null, null, isLogLink()));
                continue;
            }
            if (!Algebra.isEstimated(fit, j)) {
                rows.add(new CoefficientRow(names.get(j), false, true, beta[j], Double.NaN, Double.NaN, Double.NaN,
                        null, null, isLogLink()));
                continue;
            }
            double se = Math.sqrt(phi * c[j][j]);
            double stat = beta[j] / se;
            double p = estimated ? Distributions.tTwoSided(stat, df) : Distributions.normalTwoSided(stat);
            Interval wald = Interval.of(beta[j] - q * se, beta[j] + q * se, level);
            Interval profile = null;
            if (withProfile) {
                double[] ends = ProfileLikelihood.interval(fit, j, phi, q, se);
                profile = Interval.of(ends[0], ends[1], level);
            }
            rows.add(new CoefficientRow(names.get(j), false, false, beta[j], se, stat, p, wald, profile, isLogLink()));
        }
        return new CoefficientTable(rows, estimated ? ReferenceDistribution.T : ReferenceDistribution.NORMAL, df,
                level, dispersion, isLogLink(), withProfile);
    }

    /**
     * Returns the profile-likelihood interval of one coefficient (refits the model several times).
     *
     * @param columnName the model-matrix column
     * @return the interval; an end is infinite when the profile deviance never reaches the cut-off
     *     on that side
     * @throws UnknownNameException when no column has that name
     * @throws IllegalArgumentException when the column is aliased
     * @since 0.1
     */
    public Interval profileInterval(String columnName) {
        int j = columnIndex(columnName);
        if (!Algebra.isEstimated(fit, j)) {
            throw new IllegalArgumentException("column '" + columnName + "' is aliased or held fixed and has no estimate"
                    + " to profile");
        }
        double se = Math.sqrt(dispersion.value() * fit.unscaledCovariance()[j][j]);
        double[] ends = ProfileLikelihood.interval(fit, j, dispersion.value(), criticalValue(), se);
        return Interval.of(ends[0], ends[1], level);
    }

    private int columnIndex(String columnName) {
        int j = fit.columnNames().indexOf(columnName);
        if (j < 0) {
            throw new UnknownNameException("coefficient", columnName, fit.columnNames());
        }
        return j;
    }

    /**
     * Tests that the named coefficients are all zero, jointly.
     *
     * @param columnNames one or more model-matrix columns
     * @return the Wald test
     * @throws UnknownNameException when a name is not a column
     * @throws IllegalArgumentException when no name is given or a column is aliased
     * @since 0.1
     */
    public WaldTest waldTest(String... columnNames) {
        if (columnNames.length == 0) {
            throw new IllegalArgumentException("name at least one coefficient to test");
        }
        int p = fit.columnCount();
        double[][] l = new double[columnNames.length][p];
        for (int r = 0; r < columnNames.length; r++) {
            l[r][columnIndex(columnNames[r])] = 1;
        }
        return waldTest(l, new double[columnNames.length]);
    }

    /**
     * Tests that all estimable coefficients of one term are zero, jointly (e.g. every level of a
     * factor). The term's columns are found by refitting the model without the term (one refit)
     * and taking the columns that disappear.
     *
     * @param termLabel the term's label as in {@link Term#label()}
     * @return the Wald test
     * @throws UnknownNameException when the model has no such term
     * @throws IllegalArgumentException when every column of the term is aliased
     * @since 0.1
     */
    public WaldTest waldTestOfTerm(String termLabel) {
        List<String> labels = new ArrayList<>();
        fit.spec().terms().forEach(t -> labels.add(t.label()));
        if (!labels.contains(termLabel)) {
            throw new UnknownNameException("term", termLabel, labels);
        }
        List<String> remaining = fit.refit(fit.spec().withoutTerm(termLabel)).columnNames();
        List<String> columns = new ArrayList<>();
        List<String> names = fit.columnNames();
        for (int j = 0; j < names.size(); j++) {
            if (!remaining.contains(names.get(j)) && Algebra.isEstimated(fit, j)) {
                columns.add(names.get(j));
            }
        }
        if (columns.isEmpty()) {
            throw new IllegalArgumentException("term '" + termLabel + "' has no estimable column to test");
        }
        return waldTest(columns.toArray(new String[0]));
    }

    /**
     * Tests the linear hypothesis L beta = c jointly.
     *
     * @param l the q by p hypothesis matrix (p = all model-matrix columns, aliased included; the
     *     entries of aliased and fixed columns must be 0)
     * @param c the q right-hand sides
     * @return the Wald test
     * @throws IllegalArgumentException when the shapes do not match, an aliased column has a
     *     non-zero entry, or the rows of L are linearly dependent
     * @since 0.1
     */
    public WaldTest waldTest(double[][] l, double[] c) {
        int p = fit.columnCount();
        int q = l.length;
        if (q == 0 || c.length != q) {
            throw new IllegalArgumentException("L must have at least one row and c one value per row of L; got "
                    + q + " rows and " + c.length + " values");
        }
        double[] beta = fit.coefficients();
        double[][] v = covariance();
        int[] idx = Algebra.estimableColumns(fit);
        double[] diff = new double[q];
        StringBuilder hypothesis = new StringBuilder();
        for (int r = 0; r < q; r++) {
            if (l[r].length != p) {
                throw new IllegalArgumentException("row " + r + " of L has " + l[r].length + " entries; the model has "
                        + p + " columns " + fit.columnNames());
            }
            for (int j = 0; j < p; j++) {
                if (!Algebra.isEstimated(fit, j) && l[r][j] != 0) {
                    throw new IllegalArgumentException("row " + r + " of L involves column '"
                            + fit.columnNames().get(j) + "', which is aliased or held fixed and so has no estimate");
                }
            }
            double s = -c[r];
            for (int j : idx) {
                s += l[r][j] * beta[j];
            }
            diff[r] = s;
            if (r > 0) {
                hypothesis.append(", ");
            }
            hypothesis.append(describeRow(l[r], c[r]));
        }
        double[][] m = new double[q][q];
        for (int a = 0; a < q; a++) {
            for (int b = 0; b < q; b++) {
                double s = 0;
                for (int i : idx) {
                    if (l[a][i] == 0) {
                        continue;
                    }
                    for (int j : idx) {
                        s += l[a][i] * v[i][j] * l[b][j];
                    }
                }
                m[a][b] = s;
            }
        }
        double[] z = Algebra.solve(m, diff);
        if (z == null) {
            throw new IllegalArgumentException("the rows of L are linearly dependent (on the estimable columns);"
                    + " remove the redundant constraints");
        }
        double w = 0;
        for (int r = 0; r < q; r++) {
            w += diff[r] * z[r];
        }
        if (dispersion.isEstimated()) {
            int df = residualDfForTests();
            double f = w / q;
            return new WaldTest(hypothesis.toString(), f, q, df, ReferenceDistribution.F, Distributions.fUpper(f, q, df));
        }
        return new WaldTest(hypothesis.toString(), w, q, 0, ReferenceDistribution.CHI_SQUARED,
                Distributions.chiSquareUpper(w, q));
    }

    private String describeRow(double[] row, double rhs) {
        StringBuilder sb = new StringBuilder();
        List<String> names = fit.columnNames();
        for (int j = 0; j < row.length; j++) {
            if (row[j] == 0) {
                continue;
            }
            if (sb.length() > 0) {
                sb.append(row[j] < 0 ? " - " : " + ");
            } else if (row[j] < 0) {
                sb.append('-');
            }
            double a = Math.abs(row[j]);
            if (a != 1) {
                sb.append(TextTable.number(a)).append(' ');
            }
            sb.append(names.get(j));
        }
        return sb.append(" = ").append(TextTable.number(rhs)).toString();
    }

    /**
     * Tests a smaller model nested in this one by the likelihood ratio. The dispersion is this
     * inference's (from the larger model): chi-square when it is fixed or known, F when estimated.
     *
     * @param smaller a model with fewer estimable columns, fitted to the same rows with the same
     *     response, prior weights, family and link
     * @return the test
     * @throws ModelMismatchException when the models differ in rows, response, weights, family or link
     * @throws IllegalArgumentException when the other model is not smaller
     * @since 0.1
     */
    public LikelihoodRatioTest likelihoodRatioTest(FittedModel smaller) {
        Objects.requireNonNull(smaller, "smaller");
        Comparability.nested("the smaller model", smaller, "the larger model", fit);
        int dfDiff = smaller.residualDf() - fit.residualDf();
        if (dfDiff <= 0) {
            throw new IllegalArgumentException("the model passed as smaller has " + smaller.residualDf()
                    + " residual df and this model " + fit.residualDf()
                    + "; the smaller model must have more residual df (fewer estimable columns)");
        }
        double phi = dispersion.value();
        double d0 = smaller.deviance();
        double d1 = fit.deviance();
        double difference = d0 - d1;
        if (dispersion.isEstimated()) {
            int df = residualDfForTests();
            double f = difference / (dfDiff * phi);
            return new LikelihoodRatioTest(d0, d1, dfDiff, phi, f, df, ReferenceDistribution.F,
                    Distributions.fUpper(f, dfDiff, df));
        }
        double chi = difference / phi;
        return new LikelihoodRatioTest(d0, d1, dfDiff, phi, chi, 0, ReferenceDistribution.CHI_SQUARED,
                Distributions.chiSquareUpper(chi, dfDiff));
    }

    /**
     * Builds the sequential analysis of deviance, adding the specification's terms in order. This
     * refits the model once per term except the last.
     *
     * @return the table
     * @since 0.1
     */
    public DevianceTable devianceTable() {
        ModelSpec spec = fit.spec();
        List<Term> terms = spec.terms();
        boolean estimated = dispersion.isEstimated();
        int denominatorDf = estimated ? residualDfForTests() : 0;
        double phi = dispersion.value();
        List<DevianceStep> steps = new ArrayList<>();
        String start = spec.hasIntercept() ? "null model (intercept only)" : "null model (no terms)";
        steps.add(new DevianceStep(start, 0, 0, fit.nullDf(), fit.nullDeviance(), Double.NaN, Double.NaN));
        int previousDf = fit.nullDf();
        double previousDeviance = fit.nullDeviance();
        for (int k = 1; k <= terms.size(); k++) {
            FittedModel step = k == terms.size() ? fit : fit.refit(spec.withTerms(terms.subList(0, k)));
            int df = previousDf - step.residualDf();
            double reduction = previousDeviance - step.deviance();
            double statistic = Double.NaN;
            double p = Double.NaN;
            if (df > 0) {
                if (estimated) {
                    statistic = reduction / (df * phi);
                    p = Distributions.fUpper(statistic, df, denominatorDf);
                } else {
                    statistic = reduction / phi;
                    p = Distributions.chiSquareUpper(statistic, df);
                }
            }
            steps.add(new DevianceStep(terms.get(k - 1).label(), df, reduction, step.residualDf(), step.deviance(),
                    statistic, p));
            previousDf = step.residualDf();
            previousDeviance = step.deviance();
        }
        return new DevianceTable(steps, estimated ? ReferenceDistribution.F : ReferenceDistribution.CHI_SQUARED,
                dispersion);
    }

    /**
     * Returns the exact log-likelihood at the maximum-likelihood dispersion (1 for families that
     * fix it), whatever dispersion this inference uses for its tests.
     *
     * @return the sum of the family's log-densities with prior weights
     * @throws NoLikelihoodException when the family has no density
     * @since 0.1
     */
    public double logLikelihood() {
        return informationCriteria().logLikelihood();
    }

    /**
     * Returns the log-likelihood, AIC, AICc and BIC; the dispersion counts as a parameter where
     * the family leaves it free.
     *
     * @return the criteria
     * @throws NoLikelihoodException when the family has no density
     * @since 0.1
     */
    public InformationCriteria informationCriteria() {
        Family family = fit.family();
        if (!family.hasDensity()) {
            throw new NoLikelihoodException(family.name(), "log-likelihood (nor AIC, AICc or BIC)");
        }
        boolean free = !family.isDispersionFixed();
        double phi = free ? DispersionMath.maximumLikelihood(data) : 1.0;
        double l = data.logLikelihood(family, phi);
        return InformationCriteria.of(l, fit.rank() + (free ? 1 : 0), data.informativeRows(), phi);
    }

    /**
     * Returns the residuals, standardized with this inference's dispersion, with the default seed
     * for randomized quantile residuals.
     *
     * @return the residuals
     * @since 0.1
     */
    public Residuals residuals() {
        return new Residuals(data, dispersion, Residuals.DEFAULT_SEED);
    }

    /**
     * Returns leverage and Cook's distance (with this inference's dispersion).
     *
     * @return the diagnostics
     * @since 0.1
     */
    public Diagnostics diagnostics() {
        return new Diagnostics(fit, residuals().pearson(), dispersion.value());
    }

    /**
     * Returns predictions for the fitted rows.
     *
     * @return one prediction per fitted row
     * @since 0.1
     */
    public PredictionTable predictions() {
        int n = fit.rowCount();
        double[] eta = fit.linearPredictor();
        double[] w = fit.priorWeights();
        double[] x = new double[fit.columnCount()];
        List<Prediction> out = new ArrayList<>(n);
        Predictor predictor = new Predictor();
        for (int i = 0; i < n; i++) {
            fit.modelMatrixRow(i, x);
            out.add(predictor.predict(i, x, eta[i], w[i]));
        }
        return new PredictionTable(out, level);
    }

    /**
     * Returns predictions for new rows, which need every column the model uses (offsets included;
     * the weights column, if the model has one and the table too, sets the response standard
     * deviation, otherwise w = 1).
     *
     * @param newData rows to predict
     * @return one prediction per row
     * @throws UnknownNameException when a column or a factor level is unknown
     * @since 0.1
     */
    public PredictionTable predict(Table newData) {
        double[][] xs = fit.modelMatrix(newData);
        double[] eta = fit.predictLink(newData);
        double[] w = new double[xs.length];
        java.util.Arrays.fill(w, 1.0);
        fit.spec().weights().filter(newData::hasColumn).ifPresent(col -> {
            double[] v = newData.numeric(col);
            System.arraycopy(v, 0, w, 0, w.length);
        });
        fit.spec().trials().filter(newData::hasColumn).ifPresent(col -> {
            double[] v = newData.numeric(col);
            for (int i = 0; i < w.length; i++) {
                w[i] *= v[i];
            }
        });
        List<Prediction> out = new ArrayList<>(xs.length);
        Predictor predictor = new Predictor();
        for (int i = 0; i < xs.length; i++) {
            out.add(predictor.predict(i, xs[i], eta[i], w[i]));
        }
        return new PredictionTable(out, level);
    }

    /** The per-row delta-method computation shared by fitted and new rows. */
    private final class Predictor {
        private final double[][] c = fit.unscaledCovariance();
        private final int[] idx = Algebra.estimableColumns(fit);
        private final double q = criticalValue();
        private final double phi = dispersion.value();
        private final Link link = fit.link();
        private final Family family = fit.family();

        Prediction predict(int row, double[] x, double eta, double priorWeight) {
            double se = Math.sqrt(Math.max(0, phi * Algebra.quadraticForm(x, c, idx)));
            double mu = link.inverse(eta);
            double a = link.inverse(eta - q * se);
            double b = link.inverse(eta + q * se);
            double sd = priorWeight > 0 ? Math.sqrt(phi * family.variance(mu) / priorWeight) : Double.POSITIVE_INFINITY;
            return new Prediction(row, eta, se, mu, Interval.of(Math.min(a, b), Math.max(a, b), level), sd);
        }
    }

    /**
     * Summarises observed and fitted mean and standard deviation per level of a factor column of
     * the fitted data (the column need not be in the model).
     *
     * @param factorColumn a categorical column of the model's table
     * @return the summary
     * @throws UnknownNameException when the table has no such column
     * @throws IllegalArgumentException when the column is not categorical
     * @since 0.1
     */
    public GroupSummary groupSummary(String factorColumn) {
        Table table = fit.data();
        if (!table.hasColumn(factorColumn)) {
            throw new UnknownNameException("column", factorColumn, table.columnNames());
        }
        if (!table.isCategorical(factorColumn)) {
            throw new IllegalArgumentException("column '" + factorColumn + "' is numeric; a group summary needs a"
                    + " categorical column");
        }
        List<String> levels = table.levels(factorColumn);
        int[] codes = table.codes(factorColumn);
        int[] used = fit.usedRows();
        int m = levels.size();
        double[] count = new double[m];
        double[] sumY = new double[m];
        double[] sumY2 = new double[m];
        double[] sumMu = new double[m];
        double[] sumMu2 = new double[m];
        double[] sumVar = new double[m];
        double phi = dispersion.value();
        Family family = fit.family();
        for (int i = 0; i < used.length; i++) {
            double w = data.priorWeight(i);
            int code = codes[used[i]];
            if (w <= 0 || code < 0) {
                continue;
            }
            double y = data.y(i);
            double mu = data.mu(i);
            count[code]++;
            sumY[code] += y;
            sumY2[code] += y * y;
            sumMu[code] += mu;
            sumMu2[code] += mu * mu;
            sumVar[code] += phi * family.variance(mu) / w;
        }
        List<LevelSummary> out = new ArrayList<>();
        for (int k = 0; k < m; k++) {
            double n = count[k];
            if (n == 0) {
                out.add(new LevelSummary(levels.get(k), 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN));
                continue;
            }
            double meanY = sumY[k] / n;
            double meanMu = sumMu[k] / n;
            double varY = Math.max(0, sumY2[k] / n - meanY * meanY);
            double varMu = Math.max(0, sumMu2[k] / n - meanMu * meanMu);
            out.add(new LevelSummary(levels.get(k), (int) n, meanY, Math.sqrt(varY), meanMu,
                    Math.sqrt(sumVar[k] / n + varMu)));
        }
        return new GroupSummary(factorColumn, out);
    }

    /**
     * Returns the deviance and Pearson statistics against the residual degrees of freedom, with
     * chi-square p-values where they are meaningful.
     *
     * @return the goodness of fit
     * @since 0.1
     */
    public GoodnessOfFit goodnessOfFit() {
        double deviance = fit.deviance();
        double pearson = DispersionMath.sumOf(DispersionMath.pearsonContributions(data));
        int df = fit.residualDf();
        FamilyKind kind = FamilyKind.of(fit.family());
        boolean meaningful = true;
        String note = "";
        if (df <= 0) {
            meaningful = false;
            note = "no residual degrees of freedom: the model has as many parameters as informative rows";
        } else if (dispersion.isEstimated()) {
            meaningful = false;
            note = "the dispersion is estimated from these same statistics, so they cannot also test the fit;"
                    + " their ratio to the residual df shows the dispersion";
        } else if (kind == FamilyKind.BINOMIAL && allBinary()) {
            meaningful = false;
            note = "binary responses (one trial per row): deviance and Pearson statistics do not follow a"
                    + " chi-square distribution, whatever the fit; group the rows or use residual checks instead";
        } else if (kind == FamilyKind.POISSON || kind == FamilyKind.NEGATIVE_BINOMIAL || kind == FamilyKind.BINOMIAL) {
            int small = 0;
            for (int i = 0; i < data.rows(); i++) {
                double expected = kind == FamilyKind.BINOMIAL
                        ? Math.min(data.mu(i), 1 - data.mu(i)) * data.priorWeight(i) : data.mu(i) * data.priorWeight(i);
                if (data.priorWeight(i) > 0 && expected < 5) {
                    small++;
                }
            }
            if (small > 0.2 * data.informativeRows()) {
                note = small + " of " + data.informativeRows() + " rows have an expected count below 5;"
                        + " the chi-square approximation is doubtful";
            }
        }
        return new GoodnessOfFit(deviance, pearson, df, dispersion.value(), meaningful, note);
    }

    private boolean allBinary() {
        for (int i = 0; i < data.rows(); i++) {
            double w = data.priorWeight(i);
            if (w > 0 && w != 1) {
                return false;
            }
        }
        return true;
    }

    /**
     * Renders a compact report: model, dispersion, coefficient table and fit summary.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        sb.append("model of '").append(fit.spec().response()).append("': family ").append(fit.family().name())
                .append(", link ").append(fit.link().name()).append(", ").append(fit.rowCount())
                .append(" rows used, rank ").append(fit.rank()).append('\n');
        sb.append(coefficients());
        sb.append("deviance ").append(TextTable.number(fit.deviance())).append(" on ").append(fit.residualDf())
                .append(" residual df; ").append(fit.spec().hasIntercept() ? "intercept-only" : "no-term")
                .append(" deviance ").append(TextTable.number(fit.nullDeviance()))
                .append(" on ").append(fit.nullDf()).append(" df\n");
        if (fit.family().hasDensity()) {
            try {
                sb.append(informationCriteria()).append('\n');
            } catch (ReweighException e) {
                sb.append("no information criteria: ").append(e.getMessage()).append('\n');
            }
        }
        for (String warning : fit.warnings()) {
            sb.append("warning: ").append(warning).append('\n');
        }
        return sb.toString();
    }
}
