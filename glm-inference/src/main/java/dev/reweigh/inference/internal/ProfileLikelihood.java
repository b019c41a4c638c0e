package dev.reweigh.inference.internal;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.families.ReweighException;
import java.util.function.DoubleUnaryOperator;

/**
 * Profile-likelihood interval of one coefficient: refit with the coefficient held at b, take the
 * signed root r(b) = sign(b - b-hat) sqrt((D(b) - D-hat) / phi) and solve r(b) = +-q, where q is
 * the normal quantile when phi is known and the t quantile with the residual df when phi is
 * estimated (the F(1, df) criterion on the deviance difference).
 */
public final class ProfileLikelihood {
    private static final double[] NUDGES = {0, 1e-4, -1e-4, 1e-3, -1e-3};

    private ProfileLikelihood() {
    }

    private static double devianceIncrease(FittedModel fit, String name, double b, double deviance) {
        try {
            FittedModel refit = fit.refitWithFixed(name, b);
            return refit.converged() ? Math.max(0, refit.deviance() - deviance) : Double.NaN;
        } catch (ReweighException e) {
            // the means left their domain at this value: treat as not reachable here
            return Double.NaN;
        }
    }

    /**
     * The same model, refitted from its own fitted means: its fixed-coefficient refits then start
     * from those means, a valid and close start (the route through start coefficients has been
     * seen to stop at its first step).
     */
    private static FittedModel startedFromMeans(FittedModel fit) {
        if (fit.options().startCoefficients().isPresent() || fit.options().startMeans().isPresent()) {
            return fit;
        }
        try {
            return Glm.fit(fit.spec(), fit.data(), fit.options().toBuilder().startMeans(fit.fittedValues()).build());
        } catch (ReweighException e) {
            return fit;
        }
    }

    /**
     * Computes the interval ends.
     *
     * @param fit the fitted model
     * @param column the coefficient's index
     * @param dispersion phi
     * @param quantile q, the positive critical value of the signed root
     * @param standardError the Wald standard error, used as the search scale
     * @return {lower, upper}; an end is infinite when the profile never reaches q on that side
     */
    public static double[] interval(FittedModel fit, int column, double dispersion, double quantile,
                                    double standardError) {
        String name = fit.columnNames().get(column);
        FittedModel base = startedFromMeans(fit);
        double estimate = fit.coefficients()[column];
        double deviance = fit.deviance();
        double scale = standardError > 0 && Double.isFinite(standardError) ? standardError : 1e-3 * (1 + Math.abs(estimate));
        DoubleUnaryOperator signedRoot = b -> {
            if (b == estimate) {
                return 0;
            }
            // a refit that fails to converge at one value is retried at nearby values: the profile is smooth
            for (double nudge : NUDGES) {
                double at = b + nudge * scale;
                double drop = devianceIncrease(base, name, at, deviance);
                if (!Double.isNaN(drop)) {
                    return Math.copySign(Math.sqrt(drop / dispersion), at - estimate);
                }
            }
            return Double.NaN;
        };
        double tol = 1e-7 * scale;
        double upper = Roots.crossing(b -> signedRoot.applyAsDouble(b) - quantile, estimate, scale, 40, tol);
        double lower = Roots.crossing(b -> signedRoot.applyAsDouble(b) + quantile, estimate, -scale, 40, tol);
        return new double[] {
            Double.isNaN(lower) ? Double.NEGATIVE_INFINITY : lower,
            Double.isNaN(upper) ? Double.POSITIVE_INFINITY : upper
        };
    }
}
