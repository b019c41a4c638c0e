package dev.reweigh.core.internal;

import dev.reweigh.core.FitInterruptedException;
import dev.reweigh.core.FitOptions;
import dev.reweigh.core.IterationEvent;
import dev.reweigh.core.Solver;
import dev.reweigh.families.Family;
import dev.reweigh.families.InvalidDataException;
import dev.reweigh.families.Link;
import dev.reweigh.families.ReweighException;

import java.lang.System.Logger.Level;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Iteratively reweighted least squares with step-halving.
 *
 * <p>Each iteration forms the working response z = eta - offset + (y - mu) deta/dmu and working
 * weights w = priorWeight / (V(mu) (deta/dmu)^2) and solves the weighted least-squares step. A
 * step whose means or linear predictors leave the family's or link's domain, or whose deviance
 * rises, is halved towards the previous coefficients. (In the first iteration, which starts from
 * means rather than coefficients, it is halved towards the starting linear predictor, and a
 * rising deviance is not a reason, since the starting means need not come from any
 * coefficients.) The fit has converged when the relative change of the deviance and the largest
 * coefficient change, measured in units of its column's root mean square and relative to the
 * largest coefficient so measured, are both below the tolerance.
 */
public final class Irls {
    private static final System.Logger LOG = System.getLogger(Irls.class.getName());
    /** Up to this many entries of the expanded model matrix, AUTO takes the pivoted-QR route. */
    static final long QR_AUTO_LIMIT = 250_000L;
    /** Up to this many entries, AUTO moves from Cholesky to QR when the condition estimate is poor. */
    static final long QR_SWITCH_LIMIT = 2_000_000L;
    /** AUTO leaves the Cholesky route when the condition estimate exceeds this. */
    static final double CHOLESKY_CONDITION_LIMIT = 1e4;

    private final IrlsProblem pr;
    private final FitOptions options;
    private final int n;
    private final int p;
    private final double[] columnRms;
    /** Hands one n-sized array to the covariance without a local of {@link #run} keeping it alive. */
    private double[] spare;

    private Irls(IrlsProblem problem, FitOptions options) {
        this.pr = problem;
        this.options = options;
        this.n = problem.x.rows();
        this.p = problem.x.columns();
        this.columnRms = columnRms(problem.x);
    }

    /**
     * Runs the fit.
     *
     * @param problem the validated inputs
     * @param options the fit options
     * @return the result
     * @throws FitInterruptedException when the thread is interrupted
     */
    public static IrlsResult fit(IrlsProblem problem, FitOptions options) {
        return new Irls(problem, options).run();
    }

    private WlsRoute newRoute(boolean accurate) {
        if (accurate) {
            return new QrRoute(pr.x, options.rankTolerance());
        }
        return new CholeskyRoute(pr.x, CrossProducts.accumulator(options.threads()), options.rankTolerance());
    }

    private boolean qrPreferred() {
        return (long) n * p <= QR_AUTO_LIMIT;
    }

    private boolean qrAffordable() {
        return (long) n * p <= QR_SWITCH_LIMIT;
    }

    private IrlsResult run() {
        long t0 = System.nanoTime();
        Family family = pr.family;
        Link link = pr.link;
        List<String> warnings = new ArrayList<>();
        double[] eta = new double[n];
        double[] mu = new double[n];
        double[] beta = null;
        startingValues(eta, mu);
        if (options.startCoefficients().isPresent()) {
            beta = options.startCoefficients().get();
            for (int j = 0; j < p; j++) {
                if (!pr.candidates[j] || Double.isNaN(beta[j])) {
                    beta[j] = 0.0;
                }
            }
        }
        double dev = deviance(mu);
        // the trial arrays double as scratch for the anchor, so no n-sized array is allocated twice
        double[] etaNew = new double[n];
        double[] muNew = new double[n];
        double[] anchor = anchor(etaNew, muNew);

        Solver solver = options.solver();
        boolean accurate = solver == Solver.PIVOTED_QR || (solver == Solver.AUTO && qrPreferred());
        WlsRoute route = newRoute(accurate);
        boolean[] excluded = null;
        double[] w = new double[n];
        // the working response is consumed by the solve before the trial linear predictor is formed,
        // so the two share one array
        double[] z = etaNew;
        double[] betaNew = new double[p];
        boolean converged = false;
        boolean identityShortcut = isIdentity(link);
        // Fisher scoring converges only linearly for non-canonical links, very slowly when the data
        // are dispersed; Newton steps with the observed information converge quadratically.
        boolean observedInformation = !isCanonical(family, link);
        // the observed working values are consumed by the Newton solve before the Fisher working
        // values are formed, so they live in the trial arrays too
        double[] wObs = muNew;
        double[] zObs = etaNew;
        CholeskyRoute newtonRoute = null;
        int iter = 0;
        while (iter < options.maxIterations()) {
            if (Thread.interrupted()) {
                Thread.currentThread().interrupt();
                throw new FitInterruptedException("the fit was interrupted at iteration " + (iter + 1));
            }
            iter++;
            boolean newtonStep = false;
            if (observedInformation && beta != null && excluded != null
                    && observedWorkingValues(eta, mu, wObs, zObs)) {
                if (newtonRoute == null) {
                    newtonRoute = new CholeskyRoute(pr.x, CrossProducts.accumulator(options.threads()),
                            options.rankTolerance());
                    newtonRoute.setExcluded(excluded);
                }
                newtonStep = newtonRoute.solve(wObs, zObs, betaNew);
            }
            workingValues(eta, mu, w, z, identityShortcut);
            if (excluded == null) {
                excluded = route.decideExcluded(w, z, pr.candidates);
                if (beta != null) {
                    for (int j = 0; j < p; j++) {
                        if (excluded[j]) {
                            beta[j] = 0.0;
                        }
                    }
                }
            }
            if (newtonStep) {
                // the Newton step is taken; the Fisher weights are kept for the covariance
            } else if (!route.solve(w, z, betaNew)) {
                if (route instanceof CholeskyRoute && (solver == Solver.AUTO) && qrAffordable()) {
                    route = switchToQr(excluded);
                    accurate = true;
                    if (!route.solve(w, z, betaNew)) {
                        throw numericalFailure(iter);
                    }
                } else {
                    throw numericalFailure(iter);
                }
            } else if (solver == Solver.AUTO && !accurate && qrAffordable()
                    && route.conditionEstimate() > CHOLESKY_CONDITION_LIMIT) {
                route = switchToQr(excluded);
                accurate = true;
                if (!route.solve(w, z, betaNew)) {
                    throw numericalFailure(iter);
                }
            }
            // step-halving: towards the previous coefficients; in the first iteration (no previous
            // coefficients) towards the intercept-only anchor if there is one, else in eta towards
            // the starting linear predictor
            int halvings = 0;
            boolean fromBeta = beta != null;
            double[] base = beta;
            double[] etaTarget = null;
            double devNew;
            boolean exhausted = false;
            while (true) {
                if (base != null || halvings == 0) {
                    pr.x.multiply(betaNew, pr.offset, etaNew);
                } else {
                    double t = Math.scalb(1.0, -halvings);
                    for (int i = 0; i < n; i++) {
                        etaNew[i] = eta[i] + t * (etaTarget[i] - eta[i]);
                    }
                }
                boolean valid = means(etaNew, muNew);
                devNew = valid ? deviance(muNew) : Double.NaN;
                if (ConvergenceRule.keepsStep(valid, devNew, dev, fromBeta)) {
                    break;
                }
                if (halvings >= options.maxStepHalvings()) {
                    exhausted = true;
                    break;
                }
                if (halvings == 0 && base == null) {
                    if (anchor != null) {
                        base = anchor;
                    } else {
                        etaTarget = etaNew.clone();
                    }
                }
                halvings++;
                if (base != null) {
                    ConvergenceRule.halveTowards(base, betaNew);
                }
            }
            if (exhausted) {
                String msg = ConvergenceRule.halvingExhausted(iter, halvings, fromBeta);
                warnings.add(msg);
                LOG.log(Level.WARNING, msg);
                if (!fromBeta) {
                    throw new ReweighException("the fit found no valid first step: every step from the starting means"
                            + " left the domain of the " + family.name() + " family or the " + link.name()
                            + " link (means must be " + family.meanDomain() + ", linear predictors " + link.etaDomain()
                            + "); give starting values in the fit options");
                }
                emit(iter, dev, halvings, t0);
                break;
            }
            boolean done = ConvergenceRule.hasConverged(devNew, dev, betaNew, beta, columnRms,
                    excluded, options.tolerance());
            boolean haveCoefficients = base != null || halvings == 0;
            System.arraycopy(etaNew, 0, eta, 0, n);
            System.arraycopy(muNew, 0, mu, 0, n);
            dev = devNew;
            if (haveCoefficients) {
                beta = betaNew.clone();
            }
            emit(iter, dev, halvings, t0);
            if (LOG.isLoggable(Level.DEBUG)) {
                LOG.log(Level.DEBUG, String.format(Locale.ROOT, "iteration %d: deviance %.12g, %d halvings, route %s",
                        iter, dev, halvings, accurate ? "QR" : "Cholesky"));
            }
            if (done) {
                converged = true;
                break;
            }
        }
        if (beta == null) {
            throw new ReweighException("the fit found no coefficients that keep every mean in the domain of the "
                    + family.name() + " family and the " + link.name() + " link (means must be " + family.meanDomain()
                    + ", linear predictors " + link.etaDomain() + "): every full step from the starting means left it"
                    + " within " + iter + " iterations; check the link and the offset, or give starting coefficients"
                    + " in the fit options");
        }
        // final quantities at the accepted coefficients
        double[] beta2 = beta.clone();
        for (int j = 0; j < p; j++) {
            if (excluded[j]) {
                beta2[j] = 0.0;
            }
        }
        // the trial arrays are free now: one holds the low-order part of eta (and then the unused
        // final working response), the other is scratch for the covariance
        double[] etaLow = etaNew;
        newtonRoute = null;
        pr.x.multiply(beta2, pr.offset, eta, etaLow);
        if (!means(eta, mu)) {
            throw new ReweighException("the final coefficients give a mean outside the domain of the " + family.name()
                    + " family or the " + link.name() + " link; give starting coefficients in the fit options");
        }
        dev = identityShortcut && "gaussian".equals(family.name()) ? gaussianDeviance(eta, etaLow) : deviance(mu);
        workingValues(eta, mu, w, z, identityShortcut);
        // no local keeps the trial arrays alive while the p x p inverse is formed
        spare = muNew;
        etaNew = null;
        muNew = null;
        z = null;
        wObs = null;
        zObs = null;
        etaLow = null;
        double[][] cov = route.covariance(w, takeSpare());
        boolean[] aliased = new boolean[p];
        for (int j = 0; j < p; j++) {
            aliased[j] = excluded[j] && pr.candidates[j];
            if (aliased[j]) {
                beta2[j] = Double.NaN;
            }
        }
        if (!converged) {
            String msg = String.format(Locale.ROOT, "the fit did not converge in %d iterations", iter);
            warnings.add(0, msg);
            LOG.log(Level.WARNING, msg);
        }
        boundaryWarnings(mu, warnings);
        if (!accurate && route.conditionEstimate() > 1e6) {
            warnings.add(String.format(Locale.ROOT, "the cross-product (Cholesky) route solved a poorly conditioned"
                    + " problem (condition estimate %.1e): estimates may have lost digits; the PIVOTED_QR solver is"
                    + " more accurate", route.conditionEstimate()));
        }
        return new IrlsResult(beta2, aliased, eta, mu, w, cov, dev, iter, converged, warnings,
                accurate ? "pivoted QR" : "Cholesky");
    }

    /**
     * Coefficients of the intercept-only model at the weighted mean response, when the design has
     * an all-ones column and those coefficients give valid means everywhere; else null. The two
     * n-sized arrays are scratch.
     */
    private double[] anchor(double[] e, double[] m) {
        int one = -1;
        int d = pr.x.denseWidth();
        double[] dense = pr.x.dense();
        for (int k = 0; k < d && one < 0; k++) {
            int j = pr.x.denseColumns()[k];
            if (!pr.candidates[j]) {
                continue;
            }
            boolean allOnes = true;
            for (int i = 0; i < n && allOnes; i++) {
                allOnes = dense[i * d + k] == 1.0;
            }
            if (allOnes) {
                one = j;
            }
        }
        if (one < 0) {
            return null;
        }
        double sw = 0;
        double swy = 0;
        for (int i = 0; i < n; i++) {
            sw += pr.priorWeights[i];
            swy += pr.priorWeights[i] * pr.y[i];
        }
        double mean = swy / sw;
        if (!pr.family.isValidMean(mean) || !pr.link.isValidEta(pr.link.apply(mean))) {
            return null;
        }
        double[] b = new double[p];
        b[one] = pr.link.apply(mean);
        pr.x.multiply(b, pr.offset, e);
        return means(e, m) ? b : null;
    }

    private double[] takeSpare() {
        double[] s = spare;
        spare = null;
        return s;
    }

    private WlsRoute switchToQr(boolean[] excluded) {
        QrRoute qr = new QrRoute(pr.x, options.rankTolerance());
        qr.setExcluded(excluded);
        return qr;
    }

    private ReweighException numericalFailure(int iter) {
        return new ReweighException("the weighted least-squares step failed at iteration " + iter
                + ": the cross-product matrix is numerically singular; try the PIVOTED_QR solver or a larger rank"
                + " tolerance");
    }

    private void emit(int iter, double dev, int halvings, long t0) {
        options.listener().onIteration(IterationEvent.of(iter, dev, halvings, System.nanoTime() - t0));
    }

    private static boolean isCanonical(Family family, Link link) {
        return family.defaultLink().name().equals(link.name()) && !family.name().startsWith("negative");
    }

    /**
     * Working values of a Newton step with the observed information: weight
     * pw (mu'^2 / V - (y - mu) d/deta(mu' / V)), response eta - offset + score / weight, with
     * mu'' and V' by central differences (they only steer the path; the fixed point is the
     * score equation). Weights may be negative (the step is then solved from the cross products,
     * which must be positive definite). Returns false, leaving w and z undefined, when a weight
     * is not finite or too close to 0 to divide by.
     */
    private boolean observedWorkingValues(double[] eta, double[] mu, double[] w, double[] z) {
        for (int i = 0; i < n; i++) {
            double pw = pr.priorWeights[i];
            if (pw == 0) {
                w[i] = 0;
                z[i] = 0;
                continue;
            }
            double e = eta[i];
            double m = mu[i];
            double d = pr.link.derivative(e);
            double v = pr.family.variance(m);
            double he = 1e-5 * Math.max(1.0, Math.abs(e));
            if (!pr.link.isValidEta(e + he) || !pr.link.isValidEta(e - he)) {
                return false;
            }
            double d2 = (pr.link.derivative(e + he) - pr.link.derivative(e - he)) / (2 * he);
            double hm = 1e-5 * Math.abs(m);
            if (hm == 0 || !pr.family.isValidMean(m + hm) || !pr.family.isValidMean(m - hm)) {
                return false;
            }
            double dv = (pr.family.variance(m + hm) - pr.family.variance(m - hm)) / (2 * hm);
            double r = pr.y[i] - m;
            double fisher = pw * d * d / v;
            double wi = fisher - pw * r * (d2 / v - d * d * dv / (v * v));
            if (!Double.isFinite(wi) || Math.abs(wi) < 1e-8 * fisher) {
                return false;
            }
            w[i] = wi;
            z[i] = e - pr.offset[i] + pw * r * d / v / wi;
        }
        return true;
    }

    private static boolean isIdentity(Link link) {
        return "identity".equals(link.name());
    }

    private void startingValues(double[] eta, double[] mu) {
        if (options.startCoefficients().isPresent()) {
            double[] b = options.startCoefficients().get();
            if (b.length != p) {
                throw new IllegalArgumentException("start coefficients have length " + b.length + ", the model has "
                        + p + " columns");
            }
            for (int j = 0; j < p; j++) {
                if (!pr.candidates[j] || Double.isNaN(b[j])) {
                    b[j] = 0.0; // a held column's contribution is already in the offset
                }
            }
            pr.x.multiply(b, pr.offset, eta);
            for (int i = 0; i < n; i++) {
                if (!pr.link.isValidEta(eta[i]) || !pr.family.isValidMean(pr.link.inverse(eta[i]))) {
                    throw new InvalidDataException("start coefficients", i, NumberText.of(eta[i]),
                            "coefficients giving a linear predictor that is " + pr.link.etaDomain()
                                    + " and a mean that is " + pr.family.meanDomain());
                }
                mu[i] = pr.link.inverse(eta[i]);
            }
        } else if (options.startMeans().isPresent()) {
            double[] m = options.startMeans().get();
            if (m.length != n) {
                throw new IllegalArgumentException("start means have length " + m.length + ", the fit uses " + n
                        + " rows");
            }
            for (int i = 0; i < n; i++) {
                if (!pr.family.isValidMean(m[i]) || !pr.link.isValidEta(pr.link.apply(m[i]))) {
                    throw new InvalidDataException("start means", i, NumberText.of(m[i]), pr.family.meanDomain());
                }
                mu[i] = m[i];
                eta[i] = pr.link.apply(m[i]);
            }
        } else {
            for (int i = 0; i < n; i++) {
                mu[i] = pr.family.startingMean(pr.y[i], pr.priorWeights[i]);
                eta[i] = pr.link.apply(mu[i]);
            }
        }
    }

    private void workingValues(double[] eta, double[] mu, double[] w, double[] z, boolean identity) {
        for (int i = 0; i < n; i++) {
            double pw = pr.priorWeights[i];
            if (pw == 0) {
                w[i] = 0;
                z[i] = 0;
                continue;
            }
            double d = pr.link.derivative(eta[i]);
            double v = pr.family.variance(mu[i]);
            double wi = pw * d * d / v;
            if (!(wi > 0) || !Double.isFinite(wi) || d == 0) {
                w[i] = 0;
                z[i] = 0;
                continue;
            }
            w[i] = wi;
            z[i] = identity ? pr.y[i] - pr.offset[i] : eta[i] - pr.offset[i] + (pr.y[i] - mu[i]) / d;
        }
    }

    private boolean means(double[] eta, double[] mu) {
        boolean ok = true;
        for (int i = 0; i < n; i++) {
            double e = eta[i];
            if (!pr.link.isValidEta(e)) {
                ok = false;
                mu[i] = Double.NaN;
                continue;
            }
            double m = pr.link.inverse(e);
            mu[i] = m;
            if (!pr.family.isValidMean(m)) {
                ok = false;
            }
        }
        return ok;
    }

    private double deviance(double[] mu) {
        double s = 0;
        double c = 0;
        for (int i = 0; i < n; i++) {
            double pw = pr.priorWeights[i];
            if (pw == 0) {
                continue;
            }
            double term = pw * pr.family.unitDeviance(pr.y[i], mu[i]);
            double t = s + term;
            c += Math.abs(s) >= Math.abs(term) ? (s - t) + term : (term - t) + s;
            s = t;
        }
        return s + c;
    }

    /** Residual sum of squares with residuals y - eta formed from the double-double eta. */
    private double gaussianDeviance(double[] eta, double[] etaLow) {
        double s = 0;
        double c = 0;
        for (int i = 0; i < n; i++) {
            double pw = pr.priorWeights[i];
            if (pw == 0) {
                continue;
            }
            double r = (pr.y[i] - eta[i]) - etaLow[i];
            double term = pw * r * r;
            double t = s + term;
            c += (s - t) + term;
            s = t;
        }
        return s + c;
    }

    private void boundaryWarnings(double[] mu, List<String> warnings) {
        String fam = pr.family.name().toLowerCase(Locale.ROOT);
        boolean binomial = fam.contains("binomial") && !fam.contains("negative");
        double eps = 10 * Math.ulp(1.0);
        int atBoundary = 0;
        int zeroMeans = 0;
        double meanResponse = 0;
        for (int i = 0; i < n; i++) {
            meanResponse += Math.abs(pr.y[i]) / n;
        }
        for (int i = 0; i < n; i++) {
            if (pr.priorWeights[i] == 0) {
                continue;
            }
            if (binomial && (mu[i] < eps || mu[i] > 1 - eps)) {
                atBoundary++;
            }
            if (!binomial && Math.abs(mu[i]) < eps * meanResponse && pr.family.variance(mu[i]) < eps) {
                zeroMeans++;
            }
        }
        if (atBoundary > 0) {
            warnings.add(String.format(Locale.ROOT, "fitted probabilities numerically 0 or 1 in %d rows: the data may be"
                    + " (quasi-)separated, and some estimates may be infinite in truth", atBoundary));
        }
        if (zeroMeans > 0) {
            warnings.add(String.format(Locale.ROOT, "fitted means numerically on the boundary of the %s family's domain"
                    + " (0) in %d rows", pr.family.name(), zeroMeans));
        }
    }

    /** Root mean square of each column, from the compact design (no per-row expansion). */
    private static double[] columnRms(DesignMatrix x) {
        int p = x.columns();
        int n = x.rows();
        int d = x.denseWidth();
        double[] s = new double[p];
        double[] dense = x.dense();
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < d; k++) {
                double v = dense[i * d + k];
                s[x.denseColumns()[k]] += v * v;
            }
        }
        for (DesignMatrix.FactorBlock f : x.factors()) {
            for (int i = 0; i < n; i++) {
                int c = f.codes()[i];
                if (c >= 0) {
                    double v = f.multipliers() == null ? 1.0 : f.multipliers()[i];
                    s[f.firstColumn() + c] += v * v;
                }
            }
        }
        for (int j = 0; j < p; j++) {
            s[j] = n == 0 ? 0 : Math.sqrt(s[j] / n);
        }
        return s;
    }
}
