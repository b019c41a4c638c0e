package dev.reweigh.examples.demo;

import dev.reweigh.core.Table;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

import static dev.reweigh.examples.demo.TrueModel.AVERAGE_CLAIM;
import static dev.reweigh.examples.demo.TrueModel.CLAIMS;
import static dev.reweigh.examples.demo.TrueModel.CLAIM_TOTAL;
import static dev.reweigh.examples.demo.TrueModel.DRIVER_AGE;
import static dev.reweigh.examples.demo.TrueModel.EXPOSURE;
import static dev.reweigh.examples.demo.TrueModel.LOSS_COST;
import static dev.reweigh.examples.demo.TrueModel.MILEAGE;
import static dev.reweigh.examples.demo.TrueModel.POWER;
import static dev.reweigh.examples.demo.TrueModel.REGION;

/**
 * A synthetic motor portfolio drawn from a {@link TrueModel} with a fixed seed: one row per
 * policy with its exposure (years), driver age band, vehicle power group, region, annual mileage,
 * claim count, claim total, average claim and loss cost. The same size and seed always give the
 * same portfolio.
 *
 * <pre>{@code
 * MotorPortfolio p = MotorPortfolio.simulate(TrueModel.standard(), 100_000, MotorPortfolio.DEFAULT_SEED);
 * Table policies = p.policies();
 * Table claimants = p.policiesWithClaims();
 * }</pre>
 *
 * @since 0.1
 */
public final class MotorPortfolio {
    /** The seed of the demo's portfolio. */
    public static final long DEFAULT_SEED = 20_261_202L;
    /** The demo's portfolio size. */
    public static final int DEFAULT_POLICIES = 100_000;

    private final TrueModel truth;
    private final Table policies;
    private final Table withClaims;
    private final long seed;

    private MotorPortfolio(TrueModel truth, Table policies, Table withClaims, long seed) {
        this.truth = truth;
        this.policies = policies;
        this.withClaims = withClaims;
        this.seed = seed;
    }

    /**
     * Simulates a portfolio.
     *
     * @param truth the true model
     * @param policies the number of policies, at least 100
     * @param seed the random seed
     * @return the portfolio
     * @throws IllegalArgumentException when fewer than 100 policies are asked for
     * @since 0.1
     */
    public static MotorPortfolio simulate(TrueModel truth, int policies, long seed) {
        if (policies < 100) {
            throw new IllegalArgumentException("simulate at least 100 policies, got " + policies);
        }
        SplittableRandom random = new SplittableRandom(seed);
        double[] exposure = new double[policies];
        String[] age = new String[policies];
        String[] power = new String[policies];
        String[] region = new String[policies];
        double[] mileage = new double[policies];
        double[] claims = new double[policies];
        double[] total = new double[policies];
        double[] average = new double[policies];
        double[] lossCost = new double[policies];
        List<Integer> claimRows = new ArrayList<>();
        for (int i = 0; i < policies; i++) {
            // Two in three policies run the whole year; the rest start or end during it.
            exposure[i] = random.nextDouble() < 0.65 ? 1.0 : round(0.05 + 0.95 * random.nextDouble(), 3);
            age[i] = draw(truth.mix(DRIVER_AGE), truth.levels(DRIVER_AGE), random);
            power[i] = draw(truth.mix(POWER), truth.levels(POWER), random);
            region[i] = draw(truth.mix(REGION), truth.levels(REGION), random);
            mileage[i] = round(Math.min(60, 1 + gamma(random, 3.5) * 3.4), 1);
            double mu = exposure[i] * truth.frequency(age[i], power[i], region[i], mileage[i]);
            int n = poisson(random, mu);
            claims[i] = n;
            if (n > 0) {
                double meanClaim = truth.severity(age[i], power[i], region[i]);
                // The sum of n Gamma(k, mean m) claims is Gamma(n k, mean n m).
                double sum = gamma(random, n * truth.severityShape()) * meanClaim / truth.severityShape();
                total[i] = round(sum, 2);
                average[i] = total[i] / n;
                claimRows.add(i);
            } else {
                average[i] = Double.NaN;
            }
            lossCost[i] = total[i] / exposure[i];
        }
        Table table = Table.builder()
                .numeric(EXPOSURE, exposure)
                .categorical(DRIVER_AGE, truth.levels(DRIVER_AGE), age)
                .categorical(POWER, truth.levels(POWER), power)
                .categorical(REGION, truth.levels(REGION), region)
                .numeric(MILEAGE, mileage)
                .numeric(CLAIMS, claims)
                .numeric(CLAIM_TOTAL, total)
                .numeric(AVERAGE_CLAIM, average)
                .numeric(LOSS_COST, lossCost)
                .build();
        int[] rows = claimRows.stream().mapToInt(Integer::intValue).toArray();
        return new MotorPortfolio(truth, table, table.select(rows), seed);
    }

    private static double round(double v, int decimals) {
        double f = Math.pow(10, decimals);
        return Math.round(v * f) / f;
    }

    private static String draw(Map<String, Double> shares, List<String> levels, SplittableRandom random) {
        double u = random.nextDouble();
        double cumulative = 0;
        for (String level : levels) {
            cumulative += shares.get(level);
            if (u < cumulative) {
                return level;
            }
        }
        return levels.get(levels.size() - 1);
    }

    /** Poisson by inversion of the distribution function; the demo's means are small. */
    static int poisson(SplittableRandom random, double mean) {
        double u = random.nextDouble();
        double p = Math.exp(-mean);
        double cumulative = p;
        int k = 0;
        while (u > cumulative && k < 10_000) {
            k++;
            p *= mean / k;
            cumulative += p;
        }
        return k;
    }

    /** Gamma(shape, scale 1) by Marsaglia and Tsang's squeeze method (shape below 1 via a power of a uniform). */
    static double gamma(SplittableRandom random, double shape) {
        if (shape < 1) {
            return gamma(random, shape + 1) * Math.pow(random.nextDouble(), 1 / shape);
        }
        double d = shape - 1.0 / 3;
        double c = 1 / Math.sqrt(9 * d);
        while (true) {
            double x = random.nextGaussian();
            double v = 1 + c * x;
            if (v <= 0) {
                continue;
            }
            v = v * v * v;
            double u = random.nextDouble();
            if (Math.log(u) < 0.5 * x * x + d - d * v + d * Math.log(v)) {
                return d * v;
            }
        }
    }

    /**
     * Returns the true model the portfolio was drawn from.
     *
     * @return the true model
     * @since 0.1
     */
    public TrueModel truth() {
        return truth;
    }

    /**
     * Returns the seed.
     *
     * @return the seed
     * @since 0.1
     */
    public long seed() {
        return seed;
    }

    /**
     * Returns all policies.
     *
     * @return one row per policy
     * @since 0.1
     */
    public Table policies() {
        return policies;
    }

    /**
     * Returns the policies with at least one claim (their average claim is defined).
     *
     * @return one row per policy with claims
     * @since 0.1
     */
    public Table policiesWithClaims() {
        return withClaims;
    }
}
