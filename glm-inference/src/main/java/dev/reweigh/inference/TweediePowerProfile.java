package dev.reweigh.inference;

import dev.reweigh.core.FittedModel;
import dev.reweigh.families.Families;
import dev.reweigh.families.Family;
import dev.reweigh.families.ReweighException;
import dev.reweigh.inference.internal.DispersionMath;
import dev.reweigh.inference.internal.Distributions;
import dev.reweigh.inference.internal.ModelData;
import dev.reweigh.inference.internal.Roots;
import dev.reweigh.inference.internal.TextTable;
import java.util.Objects;
import java.util.function.DoubleUnaryOperator;

/**
 * The Tweedie variance power chosen by profile likelihood: for each power p the regression is
 * refitted with the Tweedie(p) family and the log-likelihood maximised over the dispersion; the
 * powers are first scanned on an even grid, then the best grid point is refined by Brent's
 * method between its neighbours.
 *
 * <pre>{@code
 * TweediePowerProfile profile = TweediePowerProfile.of(fit, 1.1, 1.9, 9);
 * double p = profile.power();
 * Inference inference = Inference.of(profile.fit());
 * }</pre>
 *
 * @since 0.1
 */
public final class TweediePowerProfile {
    /** Powers closer than this are not told apart: each profile point is a refit. */
    private static final double POWER_TOLERANCE = 1e-4;

    private final double[] gridPowers;
    private final double[] gridLogLikelihoods;
    private final double power;
    private final double logLikelihood;
    private final double dispersion;
    private final FittedModel fit;
    private final DoubleUnaryOperator profile;
    private final double lowerPower;
    private final double upperPower;

    private TweediePowerProfile(double[] gridPowers, double[] gridLogLikelihoods, double power, double logLikelihood,
                                double dispersion, FittedModel fit, DoubleUnaryOperator profile,
                                double lowerPower, double upperPower) {
        this.gridPowers = gridPowers;
        this.gridLogLikelihoods = gridLogLikelihoods;
        this.power = power;
        this.logLikelihood = logLikelihood;
        this.dispersion = dispersion;
        this.fit = fit;
        this.profile = profile;
        this.lowerPower = lowerPower;
        this.upperPower = upperPower;
    }

    /**
     * Profiles the power over [lowerPower, upperPower].
     *
     * @param start a fitted model whose specification and data are reused (any family; the
     *     Tweedie family replaces it)
     * @param lowerPower the smallest power, at least 1 (at most 0 is allowed too, but a response
     *     with zeros needs powers in [1, 2))
     * @param upperPower the largest power, above the smallest
     * @param gridPoints the number of grid powers, at least 3
     * @return the profile
     * @throws IllegalArgumentException when the range or grid is invalid
     * @throws ReweighException when no power in the range could be fitted
     * @since 0.1
     */
    public static TweediePowerProfile of(FittedModel start, double lowerPower, double upperPower, int gridPoints) {
        Objects.requireNonNull(start, "start");
        if (!(lowerPower < upperPower) || (lowerPower > 0 && lowerPower < 1) || (upperPower > 0 && upperPower < 1)
                || gridPoints < 3) {
            throw new IllegalArgumentException("the power range must be increasing, outside (0, 1), with at least 3"
                    + " grid points; got [" + lowerPower + ", " + upperPower + "] with " + gridPoints + " points");
        }
        DoubleUnaryOperator profile = p -> {
            try {
                ModelData d = profileAt(start, p);
                return d.logLikelihood(profileFamily(p), DispersionMath.maximumLikelihood(d));
            } catch (ReweighException e) {
                return Double.NaN;
            }
        };
        double[] powers = new double[gridPoints];
        double[] values = new double[gridPoints];
        int best = -1;
        for (int k = 0; k < gridPoints; k++) {
            powers[k] = lowerPower + (upperPower - lowerPower) * k / (gridPoints - 1);
            values[k] = profile.applyAsDouble(powers[k]);
            if (!Double.isNaN(values[k]) && (best < 0 || values[k] > values[best])) {
                best = k;
            }
        }
        if (best < 0) {
            throw new ReweighException("no Tweedie power in [" + lowerPower + ", " + upperPower
                    + "] could be fitted to this response");
        }
        double lo = powers[Math.max(0, best - 1)];
        double hi = powers[Math.min(gridPoints - 1, best + 1)];
        DoubleUnaryOperator safe = p -> {
            double v = profile.applyAsDouble(p);
            return Double.isNaN(v) ? Double.NEGATIVE_INFINITY : v;
        };
        double[] refined = Roots.maximise(safe, lo, hi, powers[best], POWER_TOLERANCE);
        double p = refined[1] >= values[best] ? refined[0] : powers[best];
        ModelData d = profileAt(start, p);
        double phi = DispersionMath.maximumLikelihood(d);
        double l = d.logLikelihood(profileFamily(p), phi);
        return new TweediePowerProfile(powers, values, p, l, phi, d.fit(), profile, lowerPower, upperPower);
    }

    private static Family profileFamily(double p) {
        return Families.tweedie(p);
    }

    private static ModelData profileAt(FittedModel start, double p) {
        return ModelData.of(start.refit(start.spec().withFamily(profileFamily(p))));
    }

    /**
     * Returns the chosen power.
     *
     * @return p
     * @since 0.1
     */
    public double power() {
        return power;
    }

    /**
     * Returns the maximum-likelihood dispersion at the chosen power.
     *
     * @return phi
     * @since 0.1
     */
    public double dispersion() {
        return dispersion;
    }

    /**
     * Returns the profile log-likelihood at the chosen power.
     *
     * @return the maximum log-likelihood
     * @since 0.1
     */
    public double logLikelihood() {
        return logLikelihood;
    }

    /**
     * Returns the Tweedie fit at the chosen power.
     *
     * @return the fitted model
     * @since 0.1
     */
    public FittedModel fit() {
        return fit;
    }

    /**
     * Returns the grid powers.
     *
     * @return a copy
     * @since 0.1
     */
    public double[] gridPowers() {
        return gridPowers.clone();
    }

    /**
     * Returns the profile log-likelihood at each grid power (NaN where the fit failed).
     *
     * @return a copy
     * @since 0.1
     */
    public double[] gridLogLikelihoods() {
        return gridLogLikelihoods.clone();
    }

    /**
     * Returns the profile-likelihood interval of the power within the searched range; an end that
     * the profile does not reach inside the range is clipped to the range. Refits the model a few
     * dozen times.
     *
     * @param level the confidence level
     * @return the interval
     * @throws IllegalArgumentException when the level is not in (0, 1)
     * @since 0.1
     */
    public Interval profileInterval(double level) {
        Interval.checkLevel(level);
        double cut = Distributions.chiSquareQuantile(level, 1) / 2;
        DoubleUnaryOperator drop = p -> logLikelihood - profile.applyAsDouble(p) - cut;
        double lo = drop.applyAsDouble(lowerPower) > 0 ? Roots.solve(drop, lowerPower, power, POWER_TOLERANCE) : lowerPower;
        double hi = drop.applyAsDouble(upperPower) > 0 ? Roots.solve(drop, power, upperPower, POWER_TOLERANCE) : upperPower;
        return Interval.of(Double.isNaN(lo) ? lowerPower : lo, Double.isNaN(hi) ? upperPower : hi, level);
    }

    /**
     * Returns the log-likelihood and information criteria counting the power and the dispersion
     * as parameters.
     *
     * @return the criteria, with rank + 2 parameters
     * @since 0.1
     */
    public InformationCriteria informationCriteria() {
        return InformationCriteria.of(logLikelihood, fit.rank() + 2, ModelData.of(fit).informativeRows(), dispersion);
    }

    /**
     * Renders the grid and the chosen power.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        TextTable t = TextTable.withTitles("power", "profile log-likelihood");
        for (int k = 0; k < gridPowers.length; k++) {
            t.row(TextTable.number(gridPowers[k]), TextTable.number(gridLogLikelihoods[k]));
        }
        return t.render() + "chosen power " + TextTable.number(power) + " with dispersion " + TextTable.number(dispersion)
                + ", log-likelihood " + TextTable.number(logLikelihood) + "\n";
    }
}
