package dev.reweigh.bench;

import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelArtifact;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Scorer;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import java.util.HashMap;
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
 * Scoring a claim-frequency model read back from its artifact (region and vehicle class factors,
 * an orthogonal polynomial in driver age, a vehicle-class-by-value interaction, exposure): one
 * policy given as a map of values, and a batch of column arrays written into a caller's array
 * (reported per row).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
public class ScorerBenchmark {
    static final int BATCH = 10_000;
    static final String[] REGIONS = {"Central", "East", "North", "South", "West"};
    static final String[] VEHICLES = {"large", "medium", "small"};

    private Scorer scorer;
    private Map<String, Object> policy;
    private Map<String, Object> columns;
    private double[] out;

    /** Fits, writes and reads the model; builds the inputs. */
    @Setup(Level.Trial)
    public void setUp() {
        SplittableRandom rnd = new SplittableRandom(7);
        int n = 20_000;
        String[] region = new String[n];
        String[] vehicle = new String[n];
        double[] age = new double[n];
        double[] value = new double[n];
        double[] exposure = new double[n];
        double[] claims = new double[n];
        for (int i = 0; i < n; i++) {
            region[i] = REGIONS[rnd.nextInt(REGIONS.length)];
            vehicle[i] = VEHICLES[rnd.nextInt(VEHICLES.length)];
            age[i] = 18 + rnd.nextInt(68);
            value[i] = 5 + rnd.nextInt(50);
            exposure[i] = 0.1 + 0.9 * rnd.nextDouble();
            double mu = exposure[i] * Math.exp(-2 + 0.01 * (age[i] - 50) + 0.01 * value[i]);
            claims[i] = rnd.nextDouble() < mu ? 1 : 0;
        }
        Table t = Table.builder().categorical("region", region).categorical("vehicle", vehicle)
                .numeric("age", age).numeric("value", value).numeric("exposure", exposure)
                .numeric("claims", claims).build();
        FittedModel fit = Glm.fit(ModelSpec.builder("claims").family(Families.poisson()).factor("region")
                .factor("vehicle").polynomial("age", 2, true).interaction("vehicle", "value")
                .logOffset("exposure").build(), t);
        scorer = ModelArtifact.fromJson(ModelArtifact.of(fit).toJson()).scorer();
        policy = new HashMap<>();
        policy.put("region", "North");
        policy.put("vehicle", "small");
        policy.put("age", 42.0);
        policy.put("value", 23.0);
        policy.put("exposure", 0.5);
        columns = new HashMap<>();
        columns.put("region", java.util.Arrays.copyOf(region, BATCH));
        columns.put("vehicle", java.util.Arrays.copyOf(vehicle, BATCH));
        columns.put("age", java.util.Arrays.copyOf(age, BATCH));
        columns.put("value", java.util.Arrays.copyOf(value, BATCH));
        columns.put("exposure", java.util.Arrays.copyOf(exposure, BATCH));
        out = new double[BATCH];
    }

    /** One policy given by name. */
    @Benchmark
    public double onePolicyMean() {
        return scorer.mean(policy);
    }

    /** A batch of column arrays into the caller's array; time per row. */
    @Benchmark
    @OperationsPerInvocation(BATCH)
    public double[] batchMeanPerRow() {
        scorer.scoreMean(columns, out);
        return out;
    }
}
