package dev.reweigh.inference;

import dev.reweigh.core.FittedModel;
import dev.reweigh.families.Family;
import dev.reweigh.inference.internal.DispersionMath;
import dev.reweigh.inference.internal.Distributions;
import dev.reweigh.inference.internal.ModelData;
import dev.reweigh.inference.internal.TextTable;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The dispersion phi of a fitted model, how it was obtained and how precise it is.
 *
 * <pre>{@code
 * DispersionEstimate pearson = DispersionEstimate.of(fit, DispersionMethod.PEARSON);
 * DispersionEstimate ml = DispersionEstimate.of(fit, DispersionMethod.MAXIMUM_LIKELIHOOD);
 * Optional<Interval> range = ml.likelihoodInterval(0.95);
 * }</pre>
 *
 * @since 0.1
 */
public final class DispersionEstimate {
    private final DispersionMethod method;
    private final double value;
    private final double standardError;
    private final ModelData data;
    private final int residualDf;

    private DispersionEstimate(DispersionMethod method, double value, double standardError, ModelData data,
                               int residualDf) {
        this.method = method;
        this.value = value;
        this.standardError = standardError;
        this.data = data;
        this.residualDf = residualDf;
    }

    /**
     * Estimates the dispersion of a fitted model by the given method.
     *
     * @param fit the fitted model
     * @param method how to estimate; {@link DispersionMethod#KNOWN} is not accepted here (use
     *     {@link #known(double)})
     * @return the estimate
     * @throws IllegalArgumentException for {@code FAMILY_FIXED} on a family whose dispersion is free,
     *     for {@code KNOWN}, or for {@code MAXIMUM_LIKELIHOOD} on a family whose dispersion is fixed
     * @throws dev.reweigh.families.NoLikelihoodException for {@code MAXIMUM_LIKELIHOOD} on a
     *     quasi-likelihood family
     * @throws dev.reweigh.families.ReweighException when the model has no residual degrees of
     *     freedom or reproduces every response exactly
     * @since 0.1
     */
    public static DispersionEstimate of(FittedModel fit, DispersionMethod method) {
        Objects.requireNonNull(fit, "fit");
        Objects.requireNonNull(method, "method");
        ModelData d = ModelData.of(fit);
        Family family = fit.family();
        switch (method) {
            case FAMILY_FIXED:
                if (!family.isDispersionFixed()) {
                    throw new IllegalArgumentException("family '" + family.name() + "' has a free dispersion;"
                            + " choose PEARSON, DEVIANCE or MAXIMUM_LIKELIHOOD, or supply a known value");
                }
                return new DispersionEstimate(method, 1.0, Double.NaN, d, fit.residualDf());
            case KNOWN:
                throw new IllegalArgumentException("a known dispersion needs its value: use DispersionEstimate.known(phi)"
                        + " or Inference.withKnownDispersion(phi)");
            case PEARSON: {
                double[] m = DispersionMath.moment(d, DispersionMath.pearsonContributions(d), fit.residualDf(),
                        "Pearson chi-square");
                return new DispersionEstimate(method, m[0], m[1], d, fit.residualDf());
            }
            case DEVIANCE: {
                double[] m = DispersionMath.moment(d, DispersionMath.devianceContributions(d), fit.residualDf(),
                        "deviance");
                return new DispersionEstimate(method, m[0], m[1], d, fit.residualDf());
            }
            case MAXIMUM_LIKELIHOOD: {
                double phi = DispersionMath.maximumLikelihood(d);
                return new DispersionEstimate(method, phi, DispersionMath.maximumLikelihoodStandardError(d, phi), d,
                        fit.residualDf());
            }
            default:
                throw new IllegalArgumentException("unknown dispersion method " + method);
        }
    }

    /**
     * The default estimate: fixed at 1 for families that fix it, Pearson otherwise.
     *
     * @param fit the fitted model
     * @return the estimate
     * @since 0.1
     */
    public static DispersionEstimate defaultFor(FittedModel fit) {
        return of(fit, fit.family().isDispersionFixed() ? DispersionMethod.FAMILY_FIXED : DispersionMethod.PEARSON);
    }

    /**
     * A dispersion the caller knows, treated as fixed (z and chi-square references).
     *
     * @param phi the dispersion, positive and finite
     * @return the estimate
     * @throws IllegalArgumentException when phi is not positive and finite
     * @since 0.1
     */
    public static DispersionEstimate known(double phi) {
        if (!(phi > 0 && phi < Double.POSITIVE_INFINITY)) {
            throw new IllegalArgumentException("a known dispersion must be positive and finite, got " + phi);
        }
        return new DispersionEstimate(DispersionMethod.KNOWN, phi, Double.NaN, null, 0);
    }

    /**
     * Returns how the value was obtained.
     *
     * @return the method
     * @since 0.1
     */
    public DispersionMethod method() {
        return method;
    }

    /**
     * Returns phi.
     *
     * @return the dispersion, positive
     * @since 0.1
     */
    public double value() {
        return value;
    }

    /**
     * Tells whether phi was estimated from the data (so that tests use t and F references).
     *
     * @return false for a family's fixed value and for a known value
     * @since 0.1
     */
    public boolean isEstimated() {
        return method != DispersionMethod.FAMILY_FIXED && method != DispersionMethod.KNOWN;
    }

    /**
     * Returns the standard error of the estimate: from the observed information for the
     * maximum-likelihood estimate, and from the spread of the row contributions (an empirical
     * value that does not assume the family is right) for the Pearson and deviance estimates.
     *
     * @return the standard error, empty when phi is not estimated or the curvature is degenerate
     * @since 0.1
     */
    public OptionalDouble standardError() {
        return isEstimated() && standardError >= 0 ? OptionalDouble.of(standardError) : OptionalDouble.empty();
    }

    /**
     * Returns the profile-likelihood interval of phi: the values whose log-likelihood at the fitted
     * means is within half the chi-square(1) quantile of the maximum. It does not depend on which
     * method gave {@link #value()}.
     *
     * @param level the confidence level, e.g. 0.95
     * @return the interval, empty when phi is not estimated or the family has no density or fixes
     *     its dispersion
     * @throws IllegalArgumentException when the level is not in (0, 1)
     * @since 0.1
     */
    public Optional<Interval> likelihoodInterval(double level) {
        Interval.checkLevel(level);
        if (!isEstimated() || !data.family().hasDensity() || data.family().isDispersionFixed()) {
            return Optional.empty();
        }
        double phiHat = method == DispersionMethod.MAXIMUM_LIKELIHOOD ? value : DispersionMath.maximumLikelihood(data);
        double[] ends = DispersionMath.likelihoodInterval(data, phiHat, level);
        return Optional.of(Interval.of(ends[0], ends[1], level));
    }

    /**
     * Returns the interval that treats the Pearson statistic (or the deviance) as phi times a
     * chi-square with the residual degrees of freedom; exact for Gaussian linear models.
     *
     * @param level the confidence level
     * @return the interval, empty unless the method is PEARSON or DEVIANCE
     * @throws IllegalArgumentException when the level is not in (0, 1)
     * @since 0.1
     */
    public Optional<Interval> chiSquareInterval(double level) {
        Interval.checkLevel(level);
        if (method != DispersionMethod.PEARSON && method != DispersionMethod.DEVIANCE) {
            return Optional.empty();
        }
        double statistic = value * residualDf;
        double upperQ = Distributions.chiSquareQuantile((1 + level) / 2, residualDf);
        double lowerQ = Distributions.chiSquareQuantile((1 - level) / 2, residualDf);
        return Optional.of(Interval.of(statistic / upperQ, statistic / lowerQ, level));
    }

    /**
     * Describes the estimate in one line.
     *
     * @return e.g. "dispersion 1.6910 (Pearson chi-square / residual df, std error 0.41)"
     * @since 0.1
     */
    @Override
    public String toString() {
        String how;
        switch (method) {
            case FAMILY_FIXED:
                how = "fixed by the family";
                break;
            case KNOWN:
                how = "known, supplied by the caller";
                break;
            case PEARSON:
                how = "Pearson chi-square / " + residualDf + " residual df";
                break;
            case DEVIANCE:
                how = "deviance / " + residualDf + " residual df";
                break;
            default:
                how = "maximum likelihood";
                break;
        }
        StringBuilder sb = new StringBuilder("dispersion ").append(TextTable.number(value)).append(" (").append(how);
        if (standardError().isPresent()) {
            sb.append(", std error ").append(TextTable.number(standardError));
        }
        return sb.append(')').toString();
    }
}
