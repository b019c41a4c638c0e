package dev.reweigh.bench;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Scorer;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Scoring throughput against its reference in the same run: a bare loop on primitive arrays
 * (level codes already resolved to coefficients, numbers in double[]) computing the same means
 * exp(b0 + b_region + b_vehicle + b_age age + b_value value + log exposure). Also the latency of
 * one policy given by name. Times are per row.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
public class ScoringThroughputBenchmark {
    static final int BATCH = 10_000;
    static final List<String> REGIONS = List.of("central", "east", "north", "south", "west");
    static final List<String> VEHICLES = List.of("small", "medium", "large");

    private Scorer scorer;
    private Table batch;
    private double[] out;
    private Map<String, Object> policy;
    // the bare loop's inputs
    private int[] regionCode;
    private int[] vehicleCode;
    private double[] age;
    private double[] value;
    private double[] exposure;
    private double[] regionCoef;
    private double[] vehicleCoef;
    private double intercept;
    private double ageCoef;
    private double valueCoef;

    /** Fits the model and prepares both inputs. */
    @Setup(Level.Trial)
    public void setUp() {
        Table fitData = table(20_000, 11);
        FittedModel fit = Glm.fit(ModelSpec.builder("claims").family(Families.poisson()).factor("region")
                .factor("vehicle").numeric("age").numeric("value").logOffset("exposure").build(), fitData);
        scorer = fit.scorer();
        batch = table(BATCH, 12);
        out = new double[BATCH];
        regionCode = batch.codes("region");
        vehicleCode = batch.codes("vehicle");
        age = batch.numeric("age");
        value = batch.numeric("value");
        exposure = batch.numeric("exposure");
        regionCoef = levelCoefficients(fit, "region", batch.levels("region"));
        vehicleCoef = levelCoefficients(fit, "vehicle", batch.levels("vehicle"));
        intercept = fit.coefficient("intercept");
        ageCoef = fit.coefficient("age");
        valueCoef = fit.coefficient("value");
        policy = new HashMap<>();
        policy.put("region", "north");
        policy.put("vehicle", "small");
        policy.put("age", 42.0);
        policy.put("value", 23.0);
        policy.put("exposure", 0.5);
    }

    private static double[] levelCoefficients(FittedModel fit, String column, List<String> levels) {
        double[] c = new double[levels.size()];
        for (int k = 0; k < c.length; k++) {
            String name = column + "=" + levels.get(k);
            c[k] = fit.columnNames().contains(name) ? fit.coefficient(name) : 0.0; // reference level: 0
        }
        return c;
    }

    static Table table(int n, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        String[] region = new String[n];
        String[] vehicle = new String[n];
        double[] age = new double[n];
        double[] value = new double[n];
        double[] exposure = new double[n];
        double[] claims = new double[n];
        for (int i = 0; i < n; i++) {
            region[i] = REGIONS.get(r.nextInt(REGIONS.size()));
            vehicle[i] = VEHICLES.get(r.nextInt(VEHICLES.size()));
            age[i] = 18 + r.nextInt(68);
            value[i] = 5 + r.nextInt(50);
            exposure[i] = 0.1 + 0.9 * r.nextDouble();
            claims[i] = BenchData.poisson(r, exposure[i] * Math.exp(-2 + 0.01 * (age[i] - 50) + 0.01 * value[i]));
        }
        return Table.builder().categorical("region", REGIONS, region).categorical("vehicle", VEHICLES, vehicle)
                .numeric("age", age).numeric("value", value).numeric("exposure", exposure)
                .numeric("claims", claims).build();
    }

    /**
     * Reference: the bare loop on primitive arrays.
     *
     * @return the means
     */
    @Benchmark
    @OperationsPerInvocation(BATCH)
    public double[] referenceBareLoop() {
        for (int i = 0; i < BATCH; i++) {
            double eta = intercept + regionCoef[regionCode[i]] + vehicleCoef[vehicleCode[i]] + ageCoef * age[i]
                    + valueCoef * value[i] + Math.log(exposure[i]);
            out[i] = Math.exp(eta);
        }
        return out;
    }

    /**
     * The scorer on a table of 10,000 policies; time per row.
     *
     * @return the means
     */
    @Benchmark
    @OperationsPerInvocation(BATCH)
    public double[] scorerTablePerRow() {
        scorer.scoreMean(batch, out);
        return out;
    }

    /**
     * One policy given by name: latency.
     *
     * @return the mean
     */
    @Benchmark
    public double scorerSinglePolicy() {
        return scorer.mean(policy);
    }

    /**
     * Context: the same means with the scorer's compensated (double-double) sum, hand-written
     * one row at a time (what the block layout saves).
     *
     * @return the means
     */
    @Benchmark
    @OperationsPerInvocation(BATCH)
    public double[] contextCompensatedRowLoop() {
        for (int i = 0; i < BATCH; i++) {
            double s = Math.log(exposure[i]);
            double err;
            double p = intercept;
            double t = s + p;
            double bb = t - s;
            err = (s - (t - bb)) + (p - bb);
            s = t;
            double x = age[i];
            p = x * ageCoef;
            double pe = Math.fma(x, ageCoef, -p);
            t = s + p;
            bb = t - s;
            err += (s - (t - bb)) + (p - bb) + pe;
            s = t;
            x = value[i];
            p = x * valueCoef;
            pe = Math.fma(x, valueCoef, -p);
            t = s + p;
            bb = t - s;
            err += (s - (t - bb)) + (p - bb) + pe;
            s = t;
            p = regionCoef[regionCode[i]];
            t = s + p;
            bb = t - s;
            err += (s - (t - bb)) + (p - bb);
            s = t;
            p = vehicleCoef[vehicleCode[i]];
            t = s + p;
            bb = t - s;
            err += (s - (t - bb)) + (p - bb);
            s = t;
            out[i] = Math.exp(s + err);
        }
        return out;
    }

    /**
     * Context: the log of the exposure and the exp of the mean alone (the floor both loops share).
     *
     * @return the means
     */
    @Benchmark
    @OperationsPerInvocation(BATCH)
    public double[] contextLogExpOnly() {
        for (int i = 0; i < BATCH; i++) {
            out[i] = Math.exp(Math.log(exposure[i]) + intercept);
        }
        return out;
    }
}
