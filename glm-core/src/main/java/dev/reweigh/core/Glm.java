package dev.reweigh.core;

import dev.reweigh.core.internal.DesignMatrix;
import dev.reweigh.core.internal.Irls;
import dev.reweigh.core.internal.IrlsProblem;
import dev.reweigh.core.internal.IrlsResult;
import dev.reweigh.families.Family;
import dev.reweigh.families.Link;
import dev.reweigh.families.ReweighException;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;

/**
 * Fits generalized linear models by iteratively reweighted least squares.
 *
 * <p>How a fit runs: rows with missing values are rejected (or dropped when the specification
 * says so) and every value is checked against its role; the terms are encoded once (factor
 * levels as codes, reference levels resolved); the rank is decided at the first iteration, in
 * model order, so that of collinear columns the later one is aliased; each iteration solves a
 * weighted least-squares step (see {@link Solver}) and halves it when the deviance rises or a
 * mean leaves the family's domain. For links other than the family's canonical one, Newton steps
 * with the observed information are used whenever its cross-product matrix is positive definite,
 * since Fisher scoring converges only linearly there. The fit has converged when the relative
 * changes of the deviance and of the coefficients are below {@link FitOptions#tolerance()}.
 *
 * <pre>{@code
 * FittedModel fit = Glm.fit(spec, table);
 * System.out.println(fit);            // coefficients, deviance, warnings
 * double[] mu = fit.predictMean(newPolicies);
 * }</pre>
 *
 * @since 0.1
 */
public final class Glm {
    private Glm() {
    }

    /**
     * Fits a model with the default options.
     *
     * @param spec what to fit
     * @param data the data
     * @return the fitted model
     * @throws dev.reweigh.families.InvalidDataException when a value is invalid for its role (the
     *     message names column, row and value)
     * @throws dev.reweigh.families.UnknownNameException when a column or level is unknown
     * @throws ModelSpecException when the specification does not suit the data
     * @throws FitInterruptedException when the thread is interrupted
     * @since 0.1
     */
    public static FittedModel fit(ModelSpec spec, Table data) {
        return fit(spec, data, FitOptions.defaults());
    }

    /**
     * Fits a model.
     *
     * @param spec what to fit
     * @param data the data
     * @param options the fit options
     * @return the fitted model; check {@link FittedModel#converged()} and
     *     {@link FittedModel#warnings()}
     * @throws dev.reweigh.families.InvalidDataException when a value is invalid for its role (the
     *     message names column, row and value)
     * @throws dev.reweigh.families.UnknownNameException when a column or level is unknown
     * @throws ModelSpecException when the specification does not suit the data
     * @throws FitInterruptedException when the thread is interrupted
     * @since 0.1
     */
    public static FittedModel fit(ModelSpec spec, Table data, FitOptions options) {
        return fit(spec, data, options, new TreeMap<>());
    }

    static FittedModel fit(ModelSpec spec, Table data, FitOptions options, Map<Integer, Double> fixed) {
        FitData fd = FitData.prepare(spec, data);
        // The null model is fitted first, while no design and no main-fit arrays are held: after the
        // main fit it would add its own n-sized arrays to the design's (the fit's peak heap).
        List<String> nullWarnings = new ArrayList<>();
        double nullDeviance = nullDeviance(spec, fd, options, nullWarnings);
        DesignRecipe recipe = DesignRecipe.create(spec, data, fd.rows, fd.priorWeights);
        DesignMatrix x = recipe.build(data, fd.rows);
        int p = x.columns();
        int free = p - fixed.size();
        if (free > fd.positiveWeightRows) {
            throw new ModelSpecException(String.format(Locale.ROOT,
                    "the model has %d coefficients but only %d rows with positive weight; it needs at least as many"
                            + " rows as coefficients", free, fd.positiveWeightRows));
        }
        boolean[] candidates = new boolean[p];
        Arrays.fill(candidates, true);
        double[] fixedBeta = new double[p];
        for (Map.Entry<Integer, Double> e : fixed.entrySet()) {
            candidates[e.getKey()] = false;
            fixedBeta[e.getKey()] = e.getValue();
        }
        // IRLS only reads the offset, so the data's own array serves unless held columns add to it.
        double[] totalOffset = fd.offset;
        if (!fixed.isEmpty()) {
            totalOffset = new double[fd.offset.length];
            x.multiply(fixedBeta, fd.offset, totalOffset);
        }
        IrlsResult r = Irls.fit(new IrlsProblem(x, fd.y, fd.priorWeights, totalOffset, spec.family(), spec.link(),
                candidates), options);
        if (Thread.currentThread().isInterrupted()) {
            // an interrupt that came during the last iteration still stops the fit (status kept)
            throw new FitInterruptedException("the fit was interrupted after its last iteration");
        }
        double[] beta = r.beta.clone();
        for (Map.Entry<Integer, Double> e : fixed.entrySet()) {
            beta[e.getKey()] = e.getValue();
            for (int j = 0; j < p; j++) {
                r.covariance[e.getKey()][j] = 0.0;
                r.covariance[j][e.getKey()] = 0.0;
            }
        }
        List<String> warnings = new ArrayList<>(r.warnings);
        warnings.addAll(nullWarnings);
        int rank = 0;
        for (int j = 0; j < p; j++) {
            if (candidates[j] && !r.aliased[j]) {
                rank++;
            }
        }
        return new FittedModel(spec, data, options, recipe, x, beta, r.aliased, fixed, r.covariance, fd, r, rank,
                nullDeviance, warnings);
    }

    private static double nullDeviance(ModelSpec spec, FitData fd, FitOptions options, List<String> warnings) {
        Family family = spec.family();
        Link link = spec.link();
        int n = fd.y.length;
        boolean noOffset = true;
        for (double o : fd.offset) {
            noOffset &= o == 0.0;
        }
        double[] mu = new double[n];
        if (!spec.hasIntercept()) {
            for (int i = 0; i < n; i++) {
                mu[i] = link.inverse(fd.offset[i]);
                if (!link.isValidEta(fd.offset[i]) || !family.isValidMean(mu[i])) {
                    warnings.add("the intercept-free null model (mean = inverse link of the offset) is outside the"
                            + " family's domain; the null deviance is not available");
                    return Double.NaN;
                }
            }
            return deviance(family, fd, mu);
        }
        if (noOffset) {
            double sw = 0;
            double swy = 0;
            for (int i = 0; i < n; i++) {
                sw += fd.priorWeights[i];
                swy += fd.priorWeights[i] * fd.y[i];
            }
            double m = swy / sw;
            if (family.isValidMean(m) && link.isValidEta(link.apply(m))) {
                Arrays.fill(mu, m);
                return deviance(family, fd, mu);
            }
        }
        double[] ones = new double[n];
        Arrays.fill(ones, 1.0);
        DesignMatrix one = new DesignMatrix(n, 1, ones, null, new int[] {0}, List.of());
        try {
            FitOptions o = options.toBuilder().startCoefficients(null).startMeans(null)
                    .listener(e -> { }).build();
            IrlsResult r = Irls.fit(new IrlsProblem(one, fd.y, fd.priorWeights, fd.offset, family, link,
                    new boolean[] {true}), o);
            if (!r.converged) {
                warnings.add("the intercept-only fit for the null deviance did not converge");
            }
            return r.deviance;
        } catch (FitInterruptedException e) {
            throw e; // an interrupt stops the whole fit, not just its null model
        } catch (ReweighException e) {
            warnings.add("the intercept-only fit for the null deviance failed: " + e.getMessage());
            return Double.NaN;
        }
    }

    private static double deviance(Family family, FitData fd, double[] mu) {
        double s = 0;
        for (int i = 0; i < mu.length; i++) {
            if (fd.priorWeights[i] > 0) {
                s += fd.priorWeights[i] * family.unitDeviance(fd.y[i], mu[i]);
            }
        }
        return s;
    }
}
