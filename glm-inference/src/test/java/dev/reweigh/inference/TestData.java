package dev.reweigh.inference;

import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Table;
import dev.reweigh.families.Family;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.apache.commons.math3.distribution.GammaDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.PoissonDistribution;
import org.apache.commons.math3.random.RandomGenerator;
import org.apache.commons.math3.random.Well19937c;

/**
 * Test tables: the reference data sets copied from shared/reference-data (see SOURCES.md in the
 * test resources) and simulated motor-insurance portfolios with fixed seeds.
 */
final class TestData {
    static final String[] VEHICLES = {"hatchback", "saloon", "van"};

    private TestData() {
    }

    static List<String[]> csv(String name) {
        try (InputStream in = TestData.class.getResourceAsStream(name)) {
            if (in == null) {
                throw new IllegalStateException("missing test resource " + name);
            }
            String text = new String(in.readAllBytes(), StandardCharsets.UTF_8);
            List<String[]> rows = new ArrayList<>();
            for (String line : text.split("\\R")) {
                if (!line.isBlank()) {
                    rows.add(line.split(","));
                }
            }
            return rows;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** Ship damage data, the 34 rows with positive service (the offset is log(service)). */
    static Table ships() {
        List<String[]> rows = csv("ships.csv");
        List<String[]> kept = new ArrayList<>();
        for (String[] r : rows.subList(1, rows.size())) {
            if (Double.parseDouble(r[3]) > 0) {
                kept.add(r);
            }
        }
        int n = kept.size();
        String[] type = new String[n];
        String[] year = new String[n];
        String[] period = new String[n];
        double[] service = new double[n];
        double[] incidents = new double[n];
        for (int i = 0; i < n; i++) {
            String[] r = kept.get(i);
            type[i] = r[0];
            year[i] = r[1];
            period[i] = r[2];
            service[i] = Double.parseDouble(r[3]);
            incidents[i] = Double.parseDouble(r[4]);
        }
        return Table.builder().categorical("type", type).categorical("year", year).categorical("period", period)
                .numeric("service", service).numeric("incidents", incidents).build();
    }

    /** Beetle mortality data: dose, exposed, killed. */
    static Table beetles() {
        List<String[]> rows = csv("beetles.csv");
        int n = rows.size() - 1;
        double[] dose = new double[n];
        double[] exposed = new double[n];
        double[] killed = new double[n];
        for (int i = 0; i < n; i++) {
            String[] r = rows.get(i + 1);
            dose[i] = Double.parseDouble(r[0]);
            exposed[i] = Double.parseDouble(r[1]);
            killed[i] = Double.parseDouble(r[2]);
        }
        return Table.builder().numeric("dose", dose).numeric("exposed", exposed).numeric("killed", killed).build();
    }

    /** Rating factors of a simulated portfolio: vehicle class and driver age (centred at 40, in decades). */
    static final class Portfolio {
        final String[] vehicle;
        final double[] age;
        final double[] exposure;
        final RandomGenerator rng;

        Portfolio(int n, long seed) {
            rng = new Well19937c(seed);
            vehicle = new String[n];
            age = new double[n];
            exposure = new double[n];
            for (int i = 0; i < n; i++) {
                vehicle[i] = VEHICLES[rng.nextInt(VEHICLES.length)];
                age[i] = (18 + rng.nextInt(60) - 40) / 10.0;
                exposure[i] = 0.25 + 0.75 * rng.nextDouble();
            }
        }

        int size() {
            return age.length;
        }

        /** log of the expected value per unit: base + vehicle effect + age slope. */
        double logMean(int i, double base) {
            double v = vehicle[i].equals("saloon") ? 0.2 : vehicle[i].equals("van") ? 0.45 : 0.0;
            return base + v - 0.15 * age[i];
        }

        Table.Builder table() {
            return Table.builder().categorical("vehicle", vehicle).numeric("age", age).numeric("exposure", exposure);
        }
    }

    /**
     * The model the simulated portfolios are built for: a vehicle factor (base level hatchback) and
     * age; callers add the link, offset or weights their case needs.
     */
    static ModelSpec.Builder vehicleAndAge(String response, Family family) {
        return ModelSpec.builder(response).family(family).factor("vehicle", "hatchback").numeric("age");
    }

    /** Claim severities: Gamma with the given shape and a log-linear mean around exp(7). */
    static Table gammaSeverities(int n, double shape, long seed) {
        Portfolio p = new Portfolio(n, seed);
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            double mu = Math.exp(p.logMean(i, 7.0));
            y[i] = new GammaDistribution(p.rng, shape, mu / shape).sample();
        }
        return p.table().numeric("severity", y).build();
    }

    /** Claim severities with prior weights (claim counts 1..4): each row's shape is weight x shape. */
    static Table weightedGammaSeverities(int n, double shape, long seed) {
        Portfolio p = new Portfolio(n, seed);
        double[] y = new double[n];
        double[] w = new double[n];
        for (int i = 0; i < n; i++) {
            double mu = Math.exp(p.logMean(i, 7.0));
            w[i] = 1 + p.rng.nextInt(4);
            y[i] = new GammaDistribution(p.rng, w[i] * shape, mu / (w[i] * shape)).sample();
        }
        return p.table().numeric("severity", y).numeric("claims", w).build();
    }

    /** Gaussian responses with a log-linear mean around exp(7) and a constant standard deviation. */
    static Table gaussianSeverities(int n, double sd, long seed) {
        Portfolio p = new Portfolio(n, seed);
        NormalDistribution noise = new NormalDistribution(p.rng, 0, sd);
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            y[i] = Math.exp(p.logMean(i, 7.0)) + noise.sample();
        }
        return p.table().numeric("severity", y).build();
    }

    /** Claim counts: Poisson with mean exposure x exp(log-linear predictor around log 0.3). */
    static Table poissonCounts(int n, long seed) {
        Portfolio p = new Portfolio(n, seed);
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            double mu = p.exposure[i] * Math.exp(p.logMean(i, Math.log(0.3)));
            y[i] = new PoissonDistribution(p.rng, mu, 1e-12, 10_000).sample();
        }
        return p.table().numeric("claims", y).build();
    }

    /** Claim counts from a Gamma-Poisson mixture: negative binomial with the given theta. */
    static Table negativeBinomialCounts(int n, double theta, long seed) {
        Portfolio p = new Portfolio(n, seed);
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            double mu = p.exposure[i] * Math.exp(p.logMean(i, Math.log(2.0)));
            double lambda = new GammaDistribution(p.rng, theta, mu / theta).sample();
            y[i] = lambda > 0 ? new PoissonDistribution(p.rng, lambda, 1e-12, 10_000).sample() : 0;
        }
        return p.table().numeric("claims", y).build();
    }

    /** Lapses out of 1 to 5 policies per row: binomial with a logistic mean around 0.4. */
    static Table binomialLapses(int n, long seed) {
        Portfolio p = new Portfolio(n, seed);
        double[] lapsed = new double[n];
        double[] policies = new double[n];
        for (int i = 0; i < n; i++) {
            double prob = 1 / (1 + Math.exp(-p.logMean(i, -0.4)));
            policies[i] = 1 + p.rng.nextInt(5);
            for (int k = 0; k < policies[i]; k++) {
                lapsed[i] += p.rng.nextDouble() < prob ? 1 : 0;
            }
        }
        return p.table().numeric("lapsed", lapsed).numeric("policies", policies).build();
    }

    /** Pure premiums: compound Poisson sums of Gamma claims, i.e. Tweedie with power in (1, 2). */
    static Table compoundPoissonPremiums(int n, double power, double dispersion, long seed) {
        Portfolio p = new Portfolio(n, seed);
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            double mu = Math.exp(p.logMean(i, Math.log(100.0)));
            // Tweedie(mu, phi, p) = sum of N ~ Poisson(lambda) Gamma(alpha, scale) claims
            double lambda = Math.pow(mu, 2 - power) / (dispersion * (2 - power));
            double alpha = (2 - power) / (power - 1);
            double scale = dispersion * (power - 1) * Math.pow(mu, power - 1);
            int count = new PoissonDistribution(p.rng, lambda, 1e-12, 10_000).sample();
            double total = 0;
            for (int k = 0; k < count; k++) {
                total += new GammaDistribution(p.rng, alpha, scale).sample();
            }
            y[i] = total;
        }
        return p.table().numeric("premium", y).build();
    }

    static double sum(double[] v) {
        return Arrays.stream(v).sum();
    }
}
