package dev.reweigh.inference;

import dev.reweigh.families.Family;
import dev.reweigh.families.Link;
import dev.reweigh.inference.internal.Distributions;
import dev.reweigh.inference.internal.FamilyKind;
import dev.reweigh.inference.internal.Influence;
import dev.reweigh.inference.internal.ModelData;
import java.util.Objects;
import java.util.SplittableRandom;

/**
 * Residuals of a fitted model, one per fitted row (rows with zero prior weight get 0 except for
 * the response and working residuals). Every method returns a fresh array.
 *
 * <p>Randomized quantile residuals (Dunn and Smyth 1996) draw one uniform number per row from a
 * generator seeded with {@link #seed()}, so the same seed gives the same residuals. For a
 * discrete family u is drawn between P(Y &lt; y) and P(Y &lt;= y); for a continuous family with
 * an atom at zero (Tweedie) a zero response draws u between 0 and P(Y = 0). u is kept inside
 * [2^-1022, 1 - 2^-53] so that the residual stays finite (within about +-38.5 and 8.2).
 *
 * <pre>{@code
 * Residuals r = Inference.of(fit).residuals().withSeed(42);
 * double[] q = r.randomizedQuantile();
 * double[] d = r.of(ResidualKind.DEVIANCE);
 * }</pre>
 *
 * @since 0.1
 */
public final class Residuals {
    /**
     * The seed used unless {@link #withSeed(long)} chooses another.
     *
     * @since 0.1
     */
    public static final long DEFAULT_SEED = 20_260_101L;

    private final ModelData data;
    private final DispersionEstimate dispersion;
    private final long seed;

    Residuals(ModelData data, DispersionEstimate dispersion, long seed) {
        this.data = data;
        this.dispersion = dispersion;
        this.seed = seed;
    }

    /**
     * Returns residuals that use another seed for the randomized quantile residuals.
     *
     * @param newSeed the seed
     * @return a new residuals object
     * @since 0.1
     */
    public Residuals withSeed(long newSeed) {
        return new Residuals(data, dispersion, newSeed);
    }

    /**
     * Returns the seed of the randomized quantile residuals.
     *
     * @return the seed
     * @since 0.1
     */
    public long seed() {
        return seed;
    }

    /**
     * Returns the dispersion the standardized residuals are scaled by.
     *
     * @return the dispersion
     * @since 0.1
     */
    public DispersionEstimate dispersion() {
        return dispersion;
    }

    /**
     * Returns residuals of the given kind.
     *
     * @param kind the kind
     * @return one residual per fitted row
     * @throws dev.reweigh.families.NoLikelihoodException for randomized quantile residuals of a
     *     family without a distribution function
     * @since 0.1
     */
    public double[] of(ResidualKind kind) {
        Objects.requireNonNull(kind, "kind");
        switch (kind) {
            case RESPONSE:
                return response();
            case WORKING:
                return working();
            case PEARSON:
                return pearson();
            case DEVIANCE:
                return deviance();
            case ANSCOMBE:
                return anscombe();
            case STANDARDIZED_PEARSON:
                return standardizedPearson();
            case STANDARDIZED_DEVIANCE:
                return standardizedDeviance();
            default:
                return randomizedQuantile();
        }
    }

    /**
     * Returns y - mu.
     *
     * @return the response residuals
     * @since 0.1
     */
    public double[] response() {
        double[] r = new double[data.rows()];
        for (int i = 0; i < r.length; i++) {
            r[i] = data.y(i) - data.mu(i);
        }
        return r;
    }

    /**
     * Returns (y - mu) deta/dmu.
     *
     * @return the working residuals
     * @since 0.1
     */
    public double[] working() {
        Link link = data.link();
        double[] r = new double[data.rows()];
        for (int i = 0; i < r.length; i++) {
            r[i] = (data.y(i) - data.mu(i)) / link.derivative(data.eta(i));
        }
        return r;
    }

    /**
     * Returns sqrt(w) (y - mu) / sqrt(V(mu)); their squares sum to the Pearson statistic.
     *
     * @return the Pearson residuals
     * @since 0.1
     */
    public double[] pearson() {
        Family family = data.family();
        return data.perInformativeRow(i -> Math.sqrt(data.priorWeight(i)) * (data.y(i) - data.mu(i))
                / Math.sqrt(family.variance(data.mu(i))));
    }

    /**
     * Returns sign(y - mu) sqrt(w d(y, mu)); their squares sum to the deviance.
     *
     * @return the deviance residuals
     * @since 0.1
     */
    public double[] deviance() {
        Family family = data.family();
        return data.perInformativeRow(i -> {
            double d = Math.max(0, data.priorWeight(i) * family.unitDeviance(data.y(i), data.mu(i)));
            return Math.copySign(Math.sqrt(d), data.y(i) - data.mu(i));
        });
    }

    /**
     * Returns sqrt(w) times the family's Anscombe residual.
     *
     * @return the Anscombe residuals
     * @since 0.1
     */
    public double[] anscombe() {
        Family family = data.family();
        return data.perInformativeRow(
                i -> Math.sqrt(data.priorWeight(i)) * family.anscombeResidual(data.y(i), data.mu(i)));
    }

    /**
     * Returns the Pearson residuals divided by sqrt(phi (1 - h)).
     *
     * @return the standardized Pearson residuals (infinite where h = 1 and the residual is not 0)
     * @since 0.1
     */
    public double[] standardizedPearson() {
        return standardize(pearson());
    }

    /**
     * Returns the deviance residuals divided by sqrt(phi (1 - h)).
     *
     * @return the standardized deviance residuals (infinite where h = 1 and the residual is not 0)
     * @since 0.1
     */
    public double[] standardizedDeviance() {
        return standardize(deviance());
    }

    private double[] standardize(double[] r) {
        double[] h = Influence.leverage(data.fit());
        double phi = dispersion.value();
        for (int i = 0; i < r.length; i++) {
            if (r[i] != 0) {
                r[i] = r[i] / Math.sqrt(phi * (1 - h[i]));
            }
        }
        return r;
    }

    /**
     * Returns randomized quantile residuals (Dunn and Smyth 1996), seeded by {@link #seed()}. For
     * a correctly specified model they are close to independent standard normal draws.
     *
     * @return the randomized quantile residuals
     * @throws dev.reweigh.families.NoLikelihoodException when the family has no distribution
     *     function (quasi-likelihood families)
     * @since 0.1
     */
    public double[] randomizedQuantile() {
        Family family = data.family();
        boolean binomial = FamilyKind.of(family) == FamilyKind.BINOMIAL;
        double phi = family.isDispersionFixed() ? 1.0 : dispersion.value();
        SplittableRandom random = new SplittableRandom(seed);
        double[] r = new double[data.rows()];
        for (int i = 0; i < r.length; i++) {
            double w = data.priorWeight(i);
            double u01 = random.nextDouble();
            if (!(w > 0)) {
                continue;
            }
            double y = data.y(i);
            double mu = data.mu(i);
            double upper = family.cumulativeProbability(y, mu, phi, w);
            double u;
            if (family.isDiscrete()) {
                // a point a quarter step below y: P(Y <= it) = P(Y < y) whether the family floors or rounds
                double step = binomial ? 1.0 / w : 1.0;
                double below = y - 0.75 * step;
                double lower = below < 0 ? 0.0 : family.cumulativeProbability(below, mu, phi, w);
                u = lower + u01 * (upper - lower);
            } else if (y == 0 && upper > 0) {
                u = u01 * upper;
            } else {
                u = upper;
            }
            u = Math.min(Math.max(u, Double.MIN_NORMAL), 1 - 0x1.0p-53);
            r[i] = Distributions.normalQuantile(u);
        }
        return r;
    }

    /**
     * Describes what these residuals are.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        return "residuals of " + data.rows() + " rows (" + data.family().name() + ", " + data.link().name()
                + "), " + dispersion + ", seed " + seed;
    }
}
