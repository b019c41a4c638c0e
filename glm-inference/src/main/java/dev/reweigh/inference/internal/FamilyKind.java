package dev.reweigh.inference.internal;

import dev.reweigh.families.Family;
import java.util.Locale;

/**
 * Classifies a family by its canonical name, because the maximum-likelihood dispersion, the
 * theta estimate and the Tweedie profile need to know which distribution they deal with.
 */
public enum FamilyKind {
    /** Normal response. */
    GAUSSIAN,
    /** Binomial proportions with trials as prior weights. */
    BINOMIAL,
    /** Poisson counts. */
    POISSON,
    /** Gamma. */
    GAMMA,
    /** Inverse Gaussian. */
    INVERSE_GAUSSIAN,
    /** Tweedie with a power in the name. */
    TWEEDIE,
    /** Negative binomial with theta in the name. */
    NEGATIVE_BINOMIAL,
    /** A quasi-likelihood family or any family without a density. */
    QUASI,
    /** A family with a density that none of the above names match. */
    OTHER;

    /**
     * Classifies a family.
     *
     * @param family the family
     * @return its kind
     */
    public static FamilyKind of(Family family) {
        if (!family.hasDensity()) {
            return QUASI;
        }
        String name = normalised(family.name());
        if (name.startsWith("gaussian") || name.startsWith("normal")) {
            return GAUSSIAN;
        }
        if (name.startsWith("binomial")) {
            return BINOMIAL;
        }
        if (name.startsWith("poisson")) {
            return POISSON;
        }
        if (name.startsWith("gamma")) {
            return GAMMA;
        }
        if (name.startsWith("inversegaussian")) {
            return INVERSE_GAUSSIAN;
        }
        if (name.startsWith("tweedie")) {
            return TWEEDIE;
        }
        if (name.startsWith("negativebinomial") || name.startsWith("negbin")) {
            return NEGATIVE_BINOMIAL;
        }
        return OTHER;
    }

    private static String normalised(String name) {
        return name.toLowerCase(Locale.ROOT).replace("-", "").replace("_", "").replace(" ", "");
    }
}
