package dev.reweigh.core;

import java.util.Random;

/** Small synthetic motor-insurance portfolios with fixed seeds, for property tests. */
final class Portfolios {
    private Portfolios() {
    }

    static final String[] REGIONS = {"North", "South", "East", "West"};

    /**
     * Policies with driver age, region, exposure (years), claim counts (Poisson) and average claim
     * size (Gamma, positive for every row).
     */
    static Table motor(long seed, int n) {
        Random rnd = new Random(seed);
        double[] age = new double[n];
        String[] region = new String[n];
        double[] exposure = new double[n];
        double[] claims = new double[n];
        double[] severity = new double[n];
        double[] effect = {0.0, 0.3, -0.2, 0.5};
        for (int i = 0; i < n; i++) {
            age[i] = 18 + Math.floor(62 * rnd.nextDouble());
            int r = i < REGIONS.length ? i : rnd.nextInt(REGIONS.length);
            region[i] = REGIONS[r];
            exposure[i] = 0.1 + 1.9 * rnd.nextDouble();
            double rate = Math.exp(-1.0 - 0.01 * (age[i] - 40) + effect[r]);
            claims[i] = poisson(rnd, exposure[i] * rate);
            double mean = 1500 * Math.exp(0.005 * (age[i] - 40) + 0.5 * effect[r]);
            severity[i] = gamma(rnd, 2.0) * mean / 2.0;
        }
        return Table.builder()
                .numeric("age", age)
                .categorical("region", region)
                .numeric("exposure", exposure)
                .numeric("claims", claims)
                .numeric("severity", severity)
                .build();
    }

    static int poisson(Random rnd, double mean) {
        double l = Math.exp(-mean);
        int k = 0;
        double p = rnd.nextDouble();
        while (p > l) {
            k++;
            p *= rnd.nextDouble();
        }
        return k;
    }

    /** Gamma(shape, 1) by Marsaglia and Tsang (2000), shape at least 1/3 handled by boosting. */
    static double gamma(Random rnd, double shape) {
        if (shape < 1) {
            return gamma(rnd, shape + 1) * Math.pow(rnd.nextDouble(), 1 / shape);
        }
        double d = shape - 1.0 / 3;
        double c = 1 / Math.sqrt(9 * d);
        while (true) {
            double x = rnd.nextGaussian();
            double v = 1 + c * x;
            if (v <= 0) {
                continue;
            }
            v = v * v * v;
            double u = rnd.nextDouble();
            if (Math.log(u) < 0.5 * x * x + d - d * v + d * Math.log(v)) {
                return d * v;
            }
        }
    }
}
