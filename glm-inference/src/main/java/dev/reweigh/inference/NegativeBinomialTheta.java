package dev.reweigh.inference;

import dev.reweigh.core.FittedModel;
import dev.reweigh.families.Families;
import dev.reweigh.families.Family;
import dev.reweigh.families.ReweighException;
import dev.reweigh.inference.internal.Distributions;
import dev.reweigh.inference.internal.FamilyKind;
import dev.reweigh.inference.internal.ModelData;
import dev.reweigh.inference.internal.Roots;
import dev.reweigh.inference.internal.TextTable;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.special.Gamma;

/**
 * The maximum-likelihood theta of a negative binomial model (variance mu + mu^2 / theta), found
 * by alternating two steps until theta settles: theta maximising the likelihood at the current
 * means, then the regression refitted with that theta. Its standard error comes from the observed
 * information in theta (theta and the coefficients are orthogonal, so the coefficients' estimation
 * does not inflate it to first order).
 *
 * <pre>{@code
 * FittedModel poissonFit = Glm.fit(spec, table);              // or a negative binomial start
 * NegativeBinomialTheta nb = NegativeBinomialTheta.estimate(poissonFit);
 * double theta = nb.theta();
 * Inference inference = Inference.of(nb.fit());
 * }</pre>
 *
 * @since 0.1
 */
public final class NegativeBinomialTheta {
    private static final int MAX_ROUNDS = 50;
    private static final double TOLERANCE = 1e-6;
    private static final double THETA_MIN = 1e-6;
    private static final double THETA_MAX = 1e8;

    private final double theta;
    private final double standardError;
    private final FittedModel fit;
    private final int rounds;
    private final boolean converged;
    private final List<String> warnings;

    private NegativeBinomialTheta(double theta, double standardError, FittedModel fit, int rounds, boolean converged,
                                  List<String> warnings) {
        this.theta = theta;
        this.standardError = standardError;
        this.fit = fit;
        this.rounds = rounds;
        this.converged = converged;
        this.warnings = List.copyOf(warnings);
    }

    /**
     * Estimates theta, starting from a Poisson or negative binomial fit (whose specification,
     * link and data are kept).
     *
     * @param start a fitted Poisson or negative binomial model
     * @return the estimate with the final negative binomial fit
     * @throws IllegalArgumentException when the start model is of another family
     * @since 0.1
     */
    public static NegativeBinomialTheta estimate(FittedModel start) {
        Objects.requireNonNull(start, "start");
        FamilyKind kind = FamilyKind.of(start.family());
        if (kind != FamilyKind.POISSON && kind != FamilyKind.NEGATIVE_BINOMIAL) {
            throw new IllegalArgumentException("theta is estimated from a poisson or negative-binomial fit; got family '"
                    + start.family().name() + "'");
        }
        List<String> warnings = new ArrayList<>();
        FittedModel current = start;
        double theta = kind == FamilyKind.NEGATIVE_BINOMIAL
                ? Families.negativeBinomialTheta(start.family()).orElse(1.0) : Double.NaN;
        boolean converged = false;
        int round = 0;
        while (round < MAX_ROUNDS) {
            round++;
            ModelData d = ModelData.of(current);
            double next = maximise(d, Double.isNaN(theta) ? momentStart(d) : theta);
            boolean settled = !Double.isNaN(theta) && Math.abs(next - theta) <= TOLERANCE * next
                    && kind == FamilyKind.NEGATIVE_BINOMIAL
                    && Families.negativeBinomialTheta(current.family()).orElse(Double.NaN) == theta;
            theta = next;
            if (settled) {
                converged = true;
                break;
            }
            current = current.refit(current.spec().withFamily(Families.negativeBinomial(theta)));
            kind = FamilyKind.NEGATIVE_BINOMIAL;
            if (!current.converged()) {
                warnings.add("the regression refit with theta " + theta + " did not converge");
            }
        }
        if (!converged) {
            warnings.add("theta did not settle within " + MAX_ROUNDS + " rounds of alternating with the regression");
        }
        if (theta >= THETA_MAX / 10) {
            warnings.add("theta ran to the upper boundary (" + theta + "): the counts show no overdispersion beyond"
                    + " Poisson; a Poisson model is adequate");
        } else if (theta <= THETA_MIN * 10) {
            warnings.add("theta ran to the lower boundary (" + theta + ")");
        }
        double se = standardErrorOf(ModelData.of(current), theta);
        return new NegativeBinomialTheta(theta, se, current, round, converged, warnings);
    }

    private static double momentStart(ModelData d) {
        double sum = d.sumOverInformativeRows(i -> {
            double mu = d.mu(i);
            double r = d.y(i) - mu;
            return d.priorWeight(i) * (r * r - mu) / (mu * mu);
        });
        double count = d.sumOverInformativeRows(d::priorWeight);
        double inverse = sum / count;
        return inverse > 0 ? 1 / inverse : 10;
    }

    /** The negative binomial log-likelihood in theta at the current means, without the constant. */
    private static double logLikelihood(ModelData d, double theta) {
        return d.sumOverInformativeRows(i -> {
            double y = d.y(i);
            double mu = d.mu(i);
            return d.priorWeight(i) * (Gamma.logGamma(y + theta) - Gamma.logGamma(theta)
                    + theta * Math.log(theta / (theta + mu)) + (y > 0 ? y * Math.log(mu / (theta + mu)) : 0));
        });
    }

    private static double maximise(ModelData d, double start) {
        return Roots.maximisePositive(t -> logLikelihood(d, t), start, THETA_MIN, THETA_MAX)[0];
    }

    private static double standardErrorOf(ModelData d, double theta) {
        // the observed information is minus the second derivative of the log-likelihood in theta
        double information = -d.sumOverInformativeRows(i -> {
            double y = d.y(i);
            double mu = d.mu(i);
            double second = Gamma.trigamma(y + theta) - Gamma.trigamma(theta) + 1 / theta - 2 / (theta + mu)
                    + (y + theta) / ((theta + mu) * (theta + mu));
            return d.priorWeight(i) * second;
        });
        return information > 0 ? Math.sqrt(1 / information) : Double.POSITIVE_INFINITY;
    }

    /**
     * Returns the estimate of theta.
     *
     * @return theta, positive
     * @since 0.1
     */
    public double theta() {
        return theta;
    }

    /**
     * Returns the standard error of theta from the observed information.
     *
     * @return the standard error (infinite when the information is not positive, e.g. at the boundary)
     * @since 0.1
     */
    public double standardError() {
        return standardError;
    }

    /**
     * Returns the negative binomial fit at the estimated theta.
     *
     * @return the fitted model
     * @since 0.1
     */
    public FittedModel fit() {
        return fit;
    }

    /**
     * Returns how many rounds of alternation ran.
     *
     * @return the number of rounds
     * @since 0.1
     */
    public int rounds() {
        return rounds;
    }

    /**
     * Tells whether theta settled to the tolerance (relative change 1e-6).
     *
     * @return true when converged
     * @since 0.1
     */
    public boolean converged() {
        return converged;
    }

    /**
     * Returns warnings: non-convergence, a boundary estimate.
     *
     * @return an immutable list, empty when all went well
     * @since 0.1
     */
    public List<String> warnings() {
        return warnings;
    }

    /**
     * Returns the log-likelihood and information criteria counting theta as a parameter.
     *
     * @return the criteria, with rank + 1 parameters
     * @since 0.1
     */
    public InformationCriteria informationCriteria() {
        ModelData d = ModelData.of(fit);
        return InformationCriteria.of(d.logLikelihood(fit.family(), 1.0), fit.rank() + 1, d.informativeRows(), 1.0);
    }

    /**
     * Returns the profile-likelihood interval of theta: the values whose log-likelihood, with the
     * regression refitted at each value, is within half the chi-square(1) quantile of the maximum.
     * Refits the model a few dozen times.
     *
     * @param level the confidence level
     * @return the interval; the upper end is infinite when the profile never falls far enough
     *     (data compatible with Poisson)
     * @throws IllegalArgumentException when the level is not in (0, 1)
     * @since 0.1
     */
    public Interval profileInterval(double level) {
        Interval.checkLevel(level);
        double best = ModelData.of(fit).logLikelihood(fit.family(), 1.0);
        double cut = Distributions.chiSquareQuantile(level, 1) / 2;
        DoubleUnaryOperator drop = t -> {
            try {
                Family family = Families.negativeBinomial(Math.exp(t));
                FittedModel refit = fit.refit(fit.spec().withFamily(family));
                return best - ModelData.of(refit).logLikelihood(family, 1.0) - cut;
            } catch (ReweighException e) {
                return Double.NaN;
            }
        };
        double t0 = Math.log(theta);
        double step = Double.isFinite(standardError) ? Math.max(0.01, Math.min(1, standardError / theta)) : 0.5;
        double lo = Roots.crossing(drop, t0, -step, 30, 1e-8);
        double hi = Roots.crossing(drop, t0, step, 30, 1e-8);
        return Interval.of(Double.isNaN(lo) ? 0 : Math.exp(lo), Double.isNaN(hi) ? Double.POSITIVE_INFINITY : Math.exp(hi),
                level);
    }

    /**
     * Describes the estimate in one line.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return "negative binomial theta " + TextTable.number(theta) + " (std error " + TextTable.number(standardError)
                + ") after " + rounds + " rounds" + (converged ? "" : ", not converged")
                + (warnings.isEmpty() ? "" : "; " + String.join("; ", warnings));
    }
}
