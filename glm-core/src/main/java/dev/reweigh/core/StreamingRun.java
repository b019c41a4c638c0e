package dev.reweigh.core;

import dev.reweigh.core.internal.ConvergenceRule;
import dev.reweigh.core.internal.DesignMatrix;
import dev.reweigh.core.internal.wls.BlockedGramAccumulator;
import dev.reweigh.core.internal.wls.DesignGramAccumulator;
import dev.reweigh.core.internal.wls.GramLayout;
import dev.reweigh.core.internal.wls.GramPartial;
import dev.reweigh.core.internal.wls.NormalEquations;
import dev.reweigh.families.Family;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.Link;
import dev.reweigh.families.ReweighException;
import java.lang.System.Logger.Level;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * One streaming fit: a survey pass, then IRLS with one pass per evaluated step. Each pass
 * evaluates a point (the starting means, a coefficient vector, or a halved first step), its
 * deviance and validity, and gathers X'WX and X'Wz at that point, which is what the next step
 * solves; so an accepted step costs exactly one pass.
 */
final class StreamingRun {
    private static final System.Logger LOG = System.getLogger(StreamingRun.class.getName());

    private final ModelSpec spec;
    private final ChunkSource source;
    private final FitOptions options;
    private final Family family;
    private final Link link;
    private final boolean identity;
    private final Map<String, List<String>> declared;
    // a family that fixes the dispersion has its log-likelihood at dispersion 1: gathered in every pass
    // (the accepted one is known only afterwards), so an artifact can record it without another pass
    private final boolean trackLogLikelihood;

    // survey results
    private long usedRows;
    private long droppedRows;
    private long positiveRows;
    private double sumW;
    private double sumWy;
    private boolean anyOffset;
    private final RunningSum nullDev = new RunningSum();
    private boolean nullValid = true;
    private final Map<String, double[]> levelWeights = new HashMap<>();
    private Table firstChunk;
    private FitData firstData;

    // model structure
    private ModelSpec resolved;
    private DesignRecipe recipe;
    private GramLayout layout;
    private int p;
    private BlockedGramAccumulator blocked;
    private double nullMean;
    private double[] columnSumSq;
    private int passes;

    // per-chunk buffers, grown as needed
    private double[] eta = new double[0];
    private double[] etaTarget = new double[0];
    private double[] mu = new double[0];
    private double[] w = new double[0];
    private double[] z = new double[0];

    StreamingRun(ModelSpec spec, ChunkSource source, FitOptions options) {
        this.spec = spec;
        this.source = source;
        this.options = options;
        this.family = spec.family();
        this.link = spec.link();
        this.identity = "identity".equals(link.name());
        this.declared = Map.copyOf(source.levels());
        this.trackLogLikelihood = family.isDispersionFixed() && family.hasDensity();
    }

    /** Where a pass evaluates the model. */
    private static final class Point {
        final double[] beta;      // null: the starting means
        final double fraction;    // with beta and no earlier coefficients: etaStart + fraction (X beta - etaStart)

        Point(double[] beta, double fraction) {
            this.beta = beta;
            this.fraction = fraction;
        }

        boolean isStart() {
            return beta == null;
        }

        boolean isBlend() {
            return beta != null && fraction < 1.0;
        }
    }

    /** The outcome of one pass. */
    private static final class Pass {
        boolean valid = true;
        final RunningSum dev = new RunningSum();
        final RunningSum nullDev = new RunningSum();
        final RunningSum pearson = new RunningSum();
        final RunningSum logLik = new RunningSum();
        boolean logLikValid = true;

        double deviance() {
            return dev.value();
        }

        /** The log-likelihood at dispersion 1, or NaN when the family has none or it is not tracked. */
        double logLikelihood() {
            return logLikValid ? logLik.value() : Double.NaN;
        }
    }

    /** A sum over many rows with its rounding errors carried alongside (Neumaier's compensation). */
    private static final class RunningSum {
        private double sum;
        private double compensation;

        void add(double term) {
            double t = sum + term;
            compensation += Math.abs(sum) >= Math.abs(term) ? (sum - t) + term : (term - t) + sum;
            sum = t;
        }

        double value() {
            return sum + compensation;
        }
    }

    StreamingFit run() {
        long t0 = System.nanoTime();
        survey();
        resolveModel();
        List<String> warnings = new ArrayList<>();

        GramPartial accepted = new GramPartial(layout);
        GramPartial candidate = new GramPartial(layout);
        double[] gram = new double[p * p];
        double[] xtwz = new double[p];
        NormalEquations solver = new NormalEquations(p, options.rankTolerance());

        double[] beta = null;
        Point point = new Point(null, 1.0);
        if (options.startCoefficients().isPresent()) {
            beta = options.startCoefficients().get().clone();
            if (beta.length != p) {
                throw new IllegalArgumentException("start coefficients have length " + beta.length + ", the model has "
                        + p + " columns");
            }
            point = new Point(beta, 1.0);
        }
        columnSumSq = new double[p];
        Pass first = pass(point, accepted, true);
        Pass acceptedPass = first;
        if (!first.valid) {
            throw new InvalidDataException("start coefficients", -1, "(vector)",
                    "coefficients giving linear predictors that are " + link.etaDomain() + " and means that are "
                            + family.meanDomain());
        }
        double dev = first.deviance();
        double nullDeviance = nullDeviance(first, warnings);
        double[] rms = new double[p];
        for (int j = 0; j < p; j++) {
            rms[j] = usedRows == 0 ? 0 : Math.sqrt(columnSumSq[j] / usedRows);
        }

        boolean[] excluded = null;
        boolean converged = false;
        int iter = 0;
        double[] betaNew = new double[p];
        while (iter < options.maxIterations()) {
            if (Thread.interrupted()) {
                Thread.currentThread().interrupt();
                throw new FitInterruptedException("the streaming fit was interrupted at iteration " + (iter + 1));
            }
            iter++;
            accepted.writeTo(gram, xtwz, true);
            if (excluded == null) {
                excluded = new boolean[p];
                solver.factor(gram, excluded, true);
            } else if (!solver.factor(gram, excluded, false)) {
                throw new ReweighException("the weighted least-squares step failed at iteration " + iter
                        + ": the cross-product matrix is numerically singular; try a larger rank tolerance");
            }
            solver.solve(xtwz, excluded, betaNew);
            if (beta != null) {
                for (int j = 0; j < p; j++) {
                    if (excluded[j]) {
                        beta[j] = 0.0;
                    }
                }
            }
            boolean fromBeta = beta != null;
            if (!fromBeta && point.isBlend()) {
                throw new ReweighException("the streaming fit's first step had to be shortened and still did not"
                        + " reach coefficients; give start coefficients in the fit options");
            }
            int halvings = 0;
            boolean exhausted = false;
            Pass next;
            Point trial;
            while (true) {
                trial = new Point(betaNew.clone(), fromBeta ? 1.0 : Math.scalb(1.0, -halvings));
                next = pass(trial, candidate, false);
                if (ConvergenceRule.keepsStep(next.valid, next.deviance(), dev, fromBeta)) {
                    break;
                }
                if (halvings >= options.maxStepHalvings()) {
                    exhausted = true;
                    break;
                }
                halvings++;
                if (fromBeta) {
                    ConvergenceRule.halveTowards(beta, betaNew);
                }
            }
            if (exhausted) {
                String msg = ConvergenceRule.halvingExhausted(iter, halvings, fromBeta);
                warnings.add(msg);
                LOG.log(Level.WARNING, msg);
                if (!fromBeta) {
                    throw new ReweighException("the streaming fit found no valid first step: every step from the"
                            + " starting means left the domain of the " + family.name() + " family or the "
                            + link.name() + " link; give start coefficients in the fit options");
                }
                emit(iter, dev, halvings, t0);
                break;
            }
            double devNew = next.deviance();
            boolean done = ConvergenceRule.hasConverged(devNew, dev, betaNew, beta, rms, excluded,
                    options.tolerance());
            GramPartial swap = accepted;
            accepted = candidate;
            candidate = swap;
            acceptedPass = next;
            point = trial;
            dev = devNew;
            if (fromBeta || halvings == 0) {
                beta = betaNew.clone();
            }
            emit(iter, dev, halvings, t0);
            if (done) {
                converged = true;
                break;
            }
        }
        if (beta == null || point.isBlend() || point.isStart()) {
            throw new ReweighException("the streaming fit made no full step from the starting means in "
                    + iter + " iterations; raise the iteration limit or give start coefficients");
        }
        if (excluded == null) {
            excluded = new boolean[p];
        }
        // covariance at the accepted point: its pass gathered X'WX with the final working weights
        accepted.writeTo(gram, xtwz, true);
        double[][] cov;
        if (solver.factor(gram, excluded, false)) {
            cov = solver.inverse(excluded);
        } else {
            cov = new double[p][p];
            for (double[] row : cov) {
                java.util.Arrays.fill(row, Double.NaN);
            }
            warnings.add("the covariance could not be computed: the final cross-product matrix is numerically"
                    + " singular");
        }
        double[] coef = beta.clone();
        for (int j = 0; j < p; j++) {
            if (excluded[j]) {
                coef[j] = Double.NaN;
            }
        }
        if (!converged) {
            String msg = String.format(Locale.ROOT, "the fit did not converge in %d iterations", iter);
            warnings.add(0, msg);
            LOG.log(Level.WARNING, msg);
        }
        return new StreamingFit(resolved, options, recipe, coef, excluded, cov, dev, nullDeviance,
                acceptedPass.pearson.value(), acceptedPass.logLikelihood(), usedRows, droppedRows, positiveRows, iter, passes,
                converged, warnings);
    }

    private void emit(int iter, double dev, int halvings, long t0) {
        options.listener().onIteration(IterationEvent.of(iter, dev, halvings, System.nanoTime() - t0));
    }

    private double nullDeviance(Pass first, List<String> warnings) {
        if (!spec.hasIntercept()) {
            if (!nullValid) {
                warnings.add("the intercept-free null model (mean = inverse link of the offset) is outside the"
                        + " family's domain; the null deviance is not available");
                return Double.NaN;
            }
            return nullDev.value();
        }
        if (anyOffset) {
            warnings.add("the intercept-only deviance is not computed by a streaming fit when the model has an"
                    + " offset (it needs a fit of its own)");
            return Double.NaN;
        }
        if (!Double.isFinite(nullMean)) {
            warnings.add("the intercept-only mean is outside the family's domain; the null deviance is not available");
            return Double.NaN;
        }
        return first.nullDev.value();
    }

    // ---------------------------------------------------------------- survey pass

    private void survey() {
        List<String> defaultReference = new ArrayList<>();
        for (Term t : spec.terms()) {
            collectDefaultReferences(t, defaultReference);
        }
        long[] start = {0};
        passes++;
        source.forEachChunk(chunk -> {
            long chunkStart = start[0];
            start[0] += chunk.rowCount();
            FitData fd = prepare(chunk, chunkStart);
            if (fd == null) {
                return;
            }
            usedRows += fd.rows.length;
            droppedRows += fd.dropped;
            positiveRows += fd.positiveWeightRows;
            for (String c : defaultReference) {
                if (!chunk.isCategorical(c)) {
                    continue; // DesignRecipe reports the type mismatch with its own message
                }
                int[] codes = chunk.categorical(c).codes;
                double[] lw = levelWeights.computeIfAbsent(c, k -> new double[chunk.levels(c).size()]);
                for (int i = 0; i < fd.rows.length; i++) {
                    int code = codes[fd.rows[i]];
                    if (code >= 0) {
                        lw[code] += fd.priorWeights[i];
                    }
                }
            }
            for (int i = 0; i < fd.rows.length; i++) {
                double pw = fd.priorWeights[i];
                sumW += pw;
                sumWy += pw * fd.y[i];
                anyOffset |= fd.offset[i] != 0.0;
                if (!spec.hasIntercept() && pw > 0) {
                    double m = link.inverse(fd.offset[i]);
                    if (!link.isValidEta(fd.offset[i]) || !family.isValidMean(m)) {
                        nullValid = false;
                    } else {
                        double term = pw * family.unitDeviance(fd.y[i], m);
                        nullDev.add(term);
                    }
                }
            }
            if (firstChunk == null && fd.rows.length > 0) {
                firstChunk = chunk;
                firstData = fd;
            }
        });
        if (firstChunk == null) {
            throw new ModelSpecException("the source handed out no rows to fit");
        }
        if (positiveRows == 0) {
            String col = spec.weights().orElse(spec.trials().orElse(spec.response()));
            throw new InvalidDataException(col, -1, "all zero", "at least one row with a positive prior weight");
        }
    }

    private static void collectDefaultReferences(Term t, List<String> out) {
        switch (t.kind()) {
            case FACTOR:
            case COLUMN:
                if (t.referenceLevel().isEmpty() && !out.contains(t.column())) {
                    out.add(t.column());
                }
                break;
            case INTERACTION:
                collectDefaultReferences(t.left(), out);
                collectDefaultReferences(t.right(), out);
                break;
            default:
                break;
        }
    }

    /** Checks a chunk and reads its response, weights and offset; null when it has nothing to fit. */
    private FitData prepare(Table chunk, long chunkStart) {
        if (chunk.rowCount() == 0) {
            return null;
        }
        for (Map.Entry<String, List<String>> e : declared.entrySet()) {
            String c = e.getKey();
            if (chunk.hasColumn(c) && chunk.isCategorical(c) && !chunk.levels(c).equals(e.getValue())) {
                throw new ModelSpecException("column '" + c + "' has levels " + chunk.levels(c) + " in the chunk"
                        + " starting at row " + chunkStart + ", but the source declared " + e.getValue()
                        + "; every chunk must use the declared level order");
            }
        }
        try {
            return FitData.prepare(spec, chunk);
        } catch (InvalidDataException e) {
            if (e.row() == -1 && "all zero".equals(e.value())) {
                // every row of this chunk has zero prior weight: nothing to add but its row count
                usedRowsOfZeroWeightChunk(chunk);
                return null;
            }
            throw new InvalidDataException(e.column(), e.row() < 0 ? e.row() : e.row() + chunkStart, e.value(),
                    expected(e));
        } catch (ModelSpecException e) {
            if (spec.dropsIncompleteRows() && e.getMessage().startsWith("no complete rows")) {
                droppedRowsOfChunk(chunk);
                return null;
            }
            throw e;
        }
    }

    private void usedRowsOfZeroWeightChunk(Table chunk) {
        // counted in the survey only (later passes skip the chunk the same way)
        if (passes == 1) {
            usedRows += chunk.rowCount();
        }
    }

    private void droppedRowsOfChunk(Table chunk) {
        if (passes == 1) {
            droppedRows += chunk.rowCount();
        }
    }

    private static String expected(InvalidDataException e) {
        String m = e.getMessage();
        int k = m.indexOf("; expected ");
        return k < 0 ? "a valid value" : m.substring(k + "; expected ".length());
    }

    // ---------------------------------------------------------------- model structure

    private void resolveModel() {
        List<Term> terms = new ArrayList<>();
        for (Term t : spec.terms()) {
            terms.add(withReferences(t));
        }
        resolved = spec.withTerms(terms);
        recipe = DesignRecipe.create(resolved, firstChunk, firstData.rows, firstData.priorWeights);
        DesignMatrix x0 = recipe.build(firstChunk, firstData.rows);
        layout = DesignGramAccumulator.layoutOf(x0);
        p = x0.columns();
        if (p > positiveRows) {
            throw new ModelSpecException(String.format(Locale.ROOT, "the model has %d coefficients but only %d rows"
                    + " with positive weight; it needs at least as many rows as coefficients", p, positiveRows));
        }
        blocked = BlockedGramAccumulator.of(layout, options.threads(), null);
        nullMean = Double.NaN;
        if (spec.hasIntercept() && !anyOffset) {
            double m = sumWy / sumW;
            if (family.isValidMean(m) && link.isValidEta(link.apply(m))) {
                nullMean = m;
            }
        }
        firstChunk = null; // not needed any more: keep memory to one chunk
        firstData = null;
    }

    private Term withReferences(Term t) {
        switch (t.kind()) {
            case POLYNOMIAL:
                if (t.isOrthogonal()) {
                    throw new ModelSpecException("the orthogonal polynomial term '" + t.label() + "' needs the whole"
                            + " column, which a streaming fit does not hold; use raw powers"
                            + " (Term.polynomial(column, degree, false))");
                }
                return t;
            case FACTOR:
            case COLUMN:
                if (t.referenceLevel().isPresent()) {
                    return t;
                }
                double[] lw = levelWeights.get(t.column());
                if (lw == null) {
                    return t; // numeric column (COLUMN kind) or a type error DesignRecipe reports
                }
                List<String> levels = declared.get(t.column());
                if (levels == null) {
                    throw new ModelSpecException("column '" + t.column() + "' is categorical in the chunks but the"
                            + " source declares no levels for it; declared: " + declared.keySet());
                }
                int ref = 0;
                for (int k = 1; k < lw.length; k++) {
                    if (lw[k] > lw[ref]) {
                        ref = k;
                    }
                }
                return Term.factor(t.column(), levels.get(ref));
            case INTERACTION:
                return Term.interaction(withReferences(t.left()), withReferences(t.right()));
            default:
                return t;
        }
    }

    // ---------------------------------------------------------------- IRLS passes

    private Pass pass(Point point, GramPartial into, boolean firstPass) {
        passes++;
        Pass out = new Pass();
        into.reset();
        long[] start = {0};
        source.forEachChunk(chunk -> {
            long chunkStart = start[0];
            start[0] += chunk.rowCount();
            if (!out.valid) {
                return; // the point is rejected; read on without work to finish the pass
            }
            FitData fd = prepare(chunk, chunkStart);
            if (fd == null) {
                return;
            }
            DesignMatrix x = recipe.build(chunk, fd.rows);
            if (!DesignGramAccumulator.matches(layout, x)) {
                throw new ModelSpecException("the chunk starting at row " + chunkStart + " gives a model matrix of"
                        + " another shape than the first chunk; check that every chunk has the same columns and"
                        + " declared levels");
            }
            int n = fd.rows.length;
            ensureCapacity(n);
            evaluate(point, x, fd, n, out);
            if (!out.valid) {
                return;
            }
            for (int i = 0; i < n; i++) {
                double pw = fd.priorWeights[i];
                if (pw == 0) {
                    continue;
                }
                double term = pw * family.unitDeviance(fd.y[i], mu[i]);
                out.dev.add(term);
                double r = fd.y[i] - mu[i];
                out.pearson.add(pw * r * r / family.variance(mu[i]));
                if (trackLogLikelihood && out.logLikValid) {
                    addLogDensity(out, fd.y[i], mu[i], pw);
                }
                if (firstPass && Double.isFinite(nullMean)) {
                    double nt = pw * family.unitDeviance(fd.y[i], nullMean);
                    out.nullDev.add(nt);
                }
            }
            workingValues(fd, n);
            blocked.accumulate(DesignGramAccumulator.rowsOf(layout, x), w, z, into);
            if (firstPass) {
                addColumnSquares(x);
            }
        });
        return out;
    }

    private void addLogDensity(Pass out, double y, double m, double pw) {
        double lt;
        try {
            lt = family.logDensity(y, m, 1.0, pw);
        } catch (ReweighException | IllegalArgumentException e) {
            out.logLikValid = false;
            return;
        }
        out.logLik.add(lt);
    }

    private void evaluate(Point point, DesignMatrix x, FitData fd, int n, Pass out) {
        if (point.isStart() || point.isBlend()) {
            for (int i = 0; i < n; i++) {
                mu[i] = family.startingMean(fd.y[i], fd.priorWeights[i]);
                eta[i] = link.apply(mu[i]);
            }
            if (point.isStart()) {
                return;
            }
            x.multiply(point.beta, fd.offset, etaTarget);
            for (int i = 0; i < n; i++) {
                eta[i] = eta[i] + point.fraction * (etaTarget[i] - eta[i]);
            }
        } else {
            x.multiply(point.beta, fd.offset, eta);
        }
        for (int i = 0; i < n; i++) {
            double e = eta[i];
            if (!link.isValidEta(e)) {
                out.valid = false;
                return;
            }
            double m = link.inverse(e);
            mu[i] = m;
            if (!family.isValidMean(m)) {
                out.valid = false;
                return;
            }
        }
    }

    private void workingValues(FitData fd, int n) {
        for (int i = 0; i < n; i++) {
            double pw = fd.priorWeights[i];
            if (pw == 0) {
                w[i] = 0;
                z[i] = 0;
                continue;
            }
            double d = link.derivative(eta[i]);
            double v = family.variance(mu[i]);
            double wi = pw * d * d / v;
            if (!(wi > 0) || !Double.isFinite(wi) || d == 0) {
                w[i] = 0;
                z[i] = 0;
                continue;
            }
            w[i] = wi;
            z[i] = identity ? fd.y[i] - fd.offset[i] : eta[i] - fd.offset[i] + (fd.y[i] - mu[i]) / d;
        }
    }

    private void addColumnSquares(DesignMatrix x) {
        int d = x.denseWidth();
        double[] dense = x.dense();
        int[] dc = x.denseColumns();
        int n = x.rows();
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < d; k++) {
                double v = dense[i * d + k];
                columnSumSq[dc[k]] += v * v;
            }
        }
        for (DesignMatrix.FactorBlock f : x.factors()) {
            int[] codes = f.codes();
            double[] m = f.multipliers();
            for (int i = 0; i < n; i++) {
                int c = codes[i];
                if (c >= 0) {
                    double v = m == null ? 1.0 : m[i];
                    columnSumSq[f.firstColumn() + c] += v * v;
                }
            }
        }
    }

    private void ensureCapacity(int n) {
        if (eta.length < n) {
            eta = new double[n];
            etaTarget = new double[n];
            mu = new double[n];
            w = new double[n];
            z = new double[n];
        }
    }
}
