package dev.reweigh.examples;

import dev.reweigh.core.Table;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * A small synthetic motor frequency data set for the command-line tests, written to CSV and
 * available as the equivalent Table (same values, same level order).
 */
final class PortfolioCsv {
    static final String[] AGES = {"18-24", "25-49", "50+"};
    static final double[] AGE_RELATIVITY = {1.8, 1.0, 0.85};
    static final String[] REGIONS = {"coast", "metro", "rural"};
    static final double[] REGION_RELATIVITY = {0.9, 1.0, 0.75};

    final double[] claims;
    final double[] exposure;
    final String[] age;
    final String[] region;
    final double[] mileage;
    final double[] amount;

    PortfolioCsv(int n, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        claims = new double[n];
        exposure = new double[n];
        age = new String[n];
        region = new String[n];
        mileage = new double[n];
        amount = new double[n];
        for (int i = 0; i < n; i++) {
            int a = r.nextInt(3);
            int g = r.nextInt(3);
            age[i] = AGES[a];
            region[i] = REGIONS[g];
            exposure[i] = Math.round((0.2 + 0.8 * r.nextDouble()) * 1000) / 1000.0;
            mileage[i] = Math.round((5 + 20 * r.nextDouble()) * 10) / 10.0;
            double mu = exposure[i] * 0.12 * AGE_RELATIVITY[a] * REGION_RELATIVITY[g] * Math.exp(0.02 * mileage[i]);
            claims[i] = poisson(r, mu);
            amount[i] = Math.round(500 + 3000 * r.nextDouble());
        }
    }

    private static int poisson(SplittableRandom r, double mean) {
        double u = r.nextDouble();
        double p = Math.exp(-mean);
        double c = p;
        int k = 0;
        while (u > c) {
            k++;
            p *= mean / k;
            c += p;
        }
        return k;
    }

    Table table() {
        return Table.builder()
                .numeric("claims", claims)
                .numeric("exposure", exposure)
                .categorical("driver_age", age)
                .categorical("region", region)
                .numeric("mileage", mileage)
                .numeric("amount", amount)
                .build();
    }

    Path write(Path file) {
        StringBuilder sb = new StringBuilder("claims,exposure,driver_age,region,mileage,amount\n");
        for (int i = 0; i < claims.length; i++) {
            sb.append(String.format(Locale.ROOT, "%d,%s,%s,%s,%s,%s%n", (long) claims[i], Double.toString(exposure[i]),
                    age[i], region[i], Double.toString(mileage[i]), Double.toString(amount[i])));
        }
        try {
            Files.writeString(file, sb.toString(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return file;
    }
}
