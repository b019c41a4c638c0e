package dev.reweigh.bench;

import java.util.Arrays;

/**
 * A paired check of {@link ScoringThroughputBenchmark}'s ratio, not a replacement for it: the
 * scorer and the bare loop score the same 10,000 policies alternately, round after round in one
 * JVM, so a slow spell of the shared machine hits both; it reports the median time per row of
 * each over the second half of the rounds and the median of the per-round ratios. Run after the
 * bench build: {@code java -cp glm-examples/target/benchmarks.jar dev.reweigh.bench.ScoringPairedProbe 20000}.
 */
public final class ScoringPairedProbe {
    // the scores are read into it, so no loop can be optimised away
    private static volatile double sink;

    private ScoringPairedProbe() {
    }

    /**
     * Runs the probe.
     *
     * @param args the number of rounds (default 20,000)
     */
    public static void main(String[] args) {
        int rounds = args.length > 0 ? Integer.parseInt(args[0]) : 20_000;
        ScoringThroughputBenchmark b = new ScoringThroughputBenchmark();
        b.setUp();
        long[] scorer = new long[rounds];
        long[] bare = new long[rounds];
        double[] ratio = new double[rounds];
        double read = 0;
        for (int r = 0; r < rounds; r++) {
            long t0 = System.nanoTime();
            read += b.scorerTablePerRow()[r % ScoringThroughputBenchmark.BATCH];
            long t1 = System.nanoTime();
            read += b.referenceBareLoop()[r % ScoringThroughputBenchmark.BATCH];
            long t2 = System.nanoTime();
            scorer[r] = t1 - t0;
            bare[r] = t2 - t1;
            ratio[r] = (t1 - t0) / (double) (t2 - t1);
        }
        sink = read;
        double n = ScoringThroughputBenchmark.BATCH;
        System.out.printf("scorer %.2f ns per row, bare loop %.2f ns per row (medians of the last %d rounds);"
                + " median ratio %.3f%n", median(scorer, rounds) / n, median(bare, rounds) / n, rounds - rounds / 2,
                median(ratio, rounds));
    }

    private static double median(long[] v, int rounds) {
        long[] s = Arrays.copyOfRange(v, rounds / 2, rounds);
        Arrays.sort(s);
        return s[s.length / 2];
    }

    private static double median(double[] v, int rounds) {
        double[] s = Arrays.copyOfRange(v, rounds / 2, rounds);
        Arrays.sort(s);
        return s[s.length / 2];
    }
}
