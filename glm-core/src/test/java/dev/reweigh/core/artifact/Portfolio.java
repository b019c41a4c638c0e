package dev.reweigh.core.artifact;

import dev.reweigh.core.Table;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;

/**
 * A synthetic motor insurance portfolio (fixed seed) for artifact and scoring tests: region and
 * vehicle class (factors), driver age, vehicle value, exposure, a numeric adjustment used as an
 * offset, and responses suited to each family.
 */
final class Portfolio {
    static final List<String> REGIONS = List.of("Central", "East", "North", "South", "West");
    static final List<String> VEHICLES = List.of("large", "medium", "small");

    final int rows;
    final String[] region;
    final String[] vehicle;
    final double[] age;
    final double[] value;
    final double[] exposure;
    final double[] adjustment;
    final double[] mean;        // a positive mean, about 1 to 8
    final double[] probability; // about 0.1 to 0.9
    final double[] trials;
    private final SplittableRandom rnd;

    Portfolio(int rows, long seed) {
        this.rows = rows;
        this.rnd = new SplittableRandom(seed);
        region = new String[rows];
        vehicle = new String[rows];
        age = new double[rows];
        value = new double[rows];
        exposure = new double[rows];
        adjustment = new double[rows];
        mean = new double[rows];
        probability = new double[rows];
        trials = new double[rows];
        double[] regionEffect = {0.0, 0.15, -0.2, 0.3, -0.1};
        double[] vehicleEffect = {0.25, 0.0, -0.15};
        for (int i = 0; i < rows; i++) {
            int r = rnd.nextInt(REGIONS.size());
            int v = rnd.nextInt(VEHICLES.size());
            region[i] = REGIONS.get(r);
            vehicle[i] = VEHICLES.get(v);
            age[i] = 18 + rnd.nextInt(68);
            value[i] = Math.round(5 + 55 * rnd.nextDouble() * rnd.nextDouble());
            exposure[i] = 0.05 + 0.95 * rnd.nextDouble();
            adjustment[i] = 0.2 * (rnd.nextDouble() - 0.5);
            double eta = 0.9 + regionEffect[r] + vehicleEffect[v] + 0.012 * (age[i] - 50) + 0.004 * (value[i] - 20);
            mean[i] = Math.exp(eta);
            probability[i] = 1 / (1 + Math.exp(-(eta - 1.0)));
            trials[i] = 1 + rnd.nextInt(10);
        }
    }

    /** Responses drawn for one family (by its name). */
    double[] response(String family, boolean withExposure) {
        double[] y = new double[rows];
        for (int i = 0; i < rows; i++) {
            double mu = mean[i] * (withExposure ? exposure[i] : 1.0);
            switch (family) {
                case "gaussian":
                case "quasi:constant":
                    y[i] = mu + 0.5 * gaussian();
                    break;
                case "poisson":
                case "quasi:mu":
                    y[i] = poisson(mu);
                    break;
                case "negative-binomial:2":
                    y[i] = poisson(mu * gamma(2) / 2);
                    break;
                case "gamma":
                case "quasi:mu^2":
                    y[i] = mu * gamma(4) / 4;
                    break;
                case "inverse-gaussian":
                    y[i] = mu * gamma(8) / 8;
                    break;
                case "tweedie:1.5": {
                    long n = poisson(2 * Math.sqrt(mu));
                    double s = 0;
                    for (long k = 0; k < n; k++) {
                        s += 0.5 * Math.sqrt(mu) * gamma(1);
                    }
                    y[i] = s;
                    break;
                }
                case "binomial":
                    y[i] = binomial((int) trials[i], probability[i]);
                    break;
                case "quasi:mu(1-mu)":
                    y[i] = binomial((int) trials[i], probability[i]) / trials[i];
                    break;
                default:
                    throw new IllegalArgumentException(family);
            }
        }
        return y;
    }

    Table table(String responseName, double[] response) {
        Table.Builder b = Table.builder()
                .categorical("region", region)
                .categorical("vehicle", vehicle)
                .numeric("age", age)
                .numeric("value", value)
                .numeric("exposure", exposure)
                .numeric("adjustment", adjustment)
                .numeric("trials", trials);
        if (response != null) {
            b.numeric(responseName, response);
        }
        return b.build();
    }

    /** The predictor columns as arrays by name, for the array scoring methods. */
    Map<String, Object> columns() {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("region", region.clone());
        m.put("vehicle", vehicle.clone());
        m.put("age", age.clone());
        m.put("value", value.clone());
        m.put("exposure", exposure.clone());
        m.put("adjustment", adjustment.clone());
        m.put("trials", trials.clone());
        return m;
    }

    /** One row's values by name. */
    Map<String, Object> row(int i) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("region", region[i]);
        m.put("vehicle", vehicle[i]);
        m.put("age", age[i]);
        m.put("value", value[i]);
        m.put("exposure", exposure[i]);
        m.put("adjustment", adjustment[i]);
        m.put("trials", trials[i]);
        return m;
    }

    private double gaussian() {
        double u = rnd.nextDouble();
        double v = rnd.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - u)) * Math.cos(2 * Math.PI * v);
    }

    private long poisson(double mu) {
        double l = Math.exp(-mu);
        long k = 0;
        double p = rnd.nextDouble();
        while (p > l) {
            k++;
            p *= rnd.nextDouble();
        }
        return k;
    }

    private double gamma(int shape) {
        double s = 0;
        for (int k = 0; k < shape; k++) {
            s -= Math.log(1 - rnd.nextDouble());
        }
        return s;
    }

    private double binomial(int n, double p) {
        int s = 0;
        for (int k = 0; k < n; k++) {
            s += rnd.nextDouble() < p ? 1 : 0;
        }
        return s;
    }
}
