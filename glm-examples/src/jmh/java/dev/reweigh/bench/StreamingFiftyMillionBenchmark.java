package dev.reweigh.bench;

import dev.reweigh.core.ChunkSource;
import dev.reweigh.core.FitOptions;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.StreamingFit;
import dev.reweigh.core.StreamingGlm;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.util.List;
import java.util.Map;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import java.util.function.Consumer;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

/**
 * A streaming Poisson frequency fit over 50,000,000 generated policies that are never held in
 * memory: each chunk is generated from its own seed on every pass, so every pass sees the same
 * rows. Runs in a JVM limited to 512 MB of heap (the rows alone would take about 2.4 GB as
 * doubles). Prints the heap's peak usage and the fit at the end.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.SECONDS)
@Fork(value = 1, jvmArgsAppend = {"-Xmx512m"})
@Warmup(iterations = 0)
@Measurement(iterations = 1)
public class StreamingFiftyMillionBenchmark {
    static final List<String> REGIONS = List.of("north", "south", "east", "west", "centre", "coast");

    /** Total rows. */
    @Param({"50000000"})
    public long rows;

    /** Rows per chunk. */
    @Param({"100000"})
    public int chunkRows;

    private StreamingFit last;

    /** Clears the heap peaks before the run. */
    @Setup(Level.Trial)
    public void resetPeaks() {
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            pool.resetPeakUsage();
        }
    }

    /** The generated source. */
    static ChunkSource generated(long rows, int chunkRows) {
        return new ChunkSource() {
            @Override
            public Map<String, List<String>> levels() {
                return Map.of("region", REGIONS);
            }

            @Override
            public void forEachChunk(Consumer<Table> action) {
                for (long start = 0, k = 0; start < rows; start += chunkRows, k++) {
                    int n = (int) Math.min(chunkRows, rows - start);
                    action.accept(chunk(n, 1_000_003L * k + 17));
                }
            }
        };
    }

    static Table chunk(int n, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] claims = new double[n];
        double[] exposure = new double[n];
        double[] age = new double[n];
        double[] value = new double[n];
        String[] region = new String[n];
        for (int i = 0; i < n; i++) {
            exposure[i] = 0.05 + 0.95 * r.nextDouble();
            age[i] = 18 + 62 * r.nextDouble();
            value[i] = 5 + 45 * r.nextDouble();
            int g = r.nextInt(REGIONS.size());
            region[i] = REGIONS.get(g);
            double eta = -2.2 - 0.012 * (age[i] - 45) + 0.01 * value[i] + 0.07 * g;
            claims[i] = BenchData.poisson(r, exposure[i] * Math.exp(eta));
        }
        return Table.builder().numeric("claims", claims).numeric("exposure", exposure).numeric("age", age)
                .numeric("value", value).categorical("region", REGIONS, region).build();
    }

    /**
     * The streaming fit.
     *
     * @return the fit
     */
    @Benchmark
    public StreamingFit streamingFit() {
        ModelSpec spec = ModelSpec.builder("claims").family(Families.poisson()).numeric("age").numeric("value")
                .factor("region").logOffset("exposure").build();
        last = StreamingGlm.fit(spec, generated(rows, chunkRows), FitOptions.builder().threads(2).build());
        return last;
    }

    /** Reports the heap peak and the fit. */
    @TearDown(Level.Trial)
    public void report() {
        long peak = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP) {
                peak += pool.getPeakUsage().getUsed();
            }
        }
        System.out.printf("%nheap: max %d MB, sum of pool peaks %d MB%n",
                Runtime.getRuntime().maxMemory() >> 20, peak >> 20);
        System.out.println(last);
    }
}
