package dev.reweigh.core.internal.wls;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.TimeUnit;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;

/** Results are bit-identical whatever the number of threads and whichever executor runs them. */
class ThreadIndependenceTest {

    private static long[] bits(double[] a) {
        long[] out = new long[a.length];
        for (int i = 0; i < a.length; i++) {
            out[i] = Double.doubleToRawLongBits(a[i]);
        }
        return out;
    }

    private static long[] run(RandomDesign design, int blockRows, int threads, java.util.concurrent.Executor executor) {
        int p = design.layout.columns();
        GramPartial total = new GramPartial(design.layout);
        BlockedGramAccumulator acc = new BlockedGramAccumulator(design.layout, blockRows, threads, executor);
        acc.accumulate(design.rows(), design.w, design.z, total);
        double[] gram = new double[p * p];
        double[] xtwz = new double[p + 0];
        total.writeTo(gram, xtwz, false);
        double[] both = new double[p * p + p];
        System.arraycopy(gram, 0, both, 0, p * p);
        System.arraycopy(xtwz, 0, both, p * p, p);
        return bits(both);
    }

    private static void assertSameForAllThreadCounts(RandomDesign design, int blockRows) throws Exception {
        long[] one = run(design, blockRows, 1, null);
        for (int t : new int[] {2, 4, 8}) {
            assertArrayEquals(one, run(design, blockRows, t, null), t + " started threads");
            ExecutorService pool = Executors.newFixedThreadPool(t);
            try {
                assertArrayEquals(one, run(design, blockRows, t, pool), t + " threads on a fixed pool");
            } finally {
                pool.shutdown();
                pool.awaitTermination(10, TimeUnit.SECONDS);
            }
            ForkJoinPool fj = new ForkJoinPool(Math.max(1, t / 2));
            try {
                assertArrayEquals(one, run(design, blockRows, t, fj), t + " workers on a smaller fork-join pool");
            } finally {
                fj.shutdown();
            }
            assertArrayEquals(one, run(design, blockRows, t, Runnable::run), t + " workers on a direct executor");
        }
    }

    @Property(tries = 50)
    void anyTwoThreadCountsGiveTheSameBits(@ForAll long seed, @ForAll @IntRange(min = 1, max = 3000) int n,
            @ForAll @IntRange(min = 1, max = 9) int d, @ForAll @IntRange(min = 0, max = 2) int factors,
            @ForAll @IntRange(min = 16, max = 700) int blockRows, @ForAll @IntRange(min = 1, max = 8) int t1,
            @ForAll @IntRange(min = 1, max = 8) int t2) {
        int[] levels = new int[factors];
        for (int f = 0; f < factors; f++) {
            levels[f] = 2 + f * 3;
        }
        RandomDesign design = RandomDesign.generate(seed, n, d, levels, true);
        assertArrayEquals(run(design, blockRows, t1, null), run(design, blockRows, t2, null),
                t1 + " vs " + t2 + " threads, " + blockRows + " rows per block");
    }

    @Test
    void denseDesignIsBitIdenticalFor1248Threads() throws Exception {
        assertSameForAllThreadCounts(RandomDesign.generate(11, 20_000, 23, new int[0], false), 1000);
    }

    @Test
    void factorDesignIsBitIdenticalFor1248Threads() throws Exception {
        assertSameForAllThreadCounts(RandomDesign.generate(12, 20_000, 5, new int[] {40, 7, 3}, true), 777);
    }

    @Test
    void defaultBlockSizeIsBitIdenticalAcrossThreadCounts() {
        RandomDesign design = RandomDesign.generate(13, 100_000, 9, new int[] {30}, false);
        GramLayout layout = design.layout;
        int blockRows = layout.defaultBlockRows();
        long[] one = run(design, blockRows, 1, null);
        assertArrayEquals(one, run(design, blockRows, 8, null));
    }

    @Test
    void workspacesAreReusedWithoutChangingResults() {
        RandomDesign design = RandomDesign.generate(14, 5_000, 7, new int[] {5, 4}, true);
        int p = design.layout.columns();
        BlockedGramAccumulator acc = new BlockedGramAccumulator(design.layout, 512, 3, null);
        double[] first = null;
        for (int rep = 0; rep < 3; rep++) {
            GramPartial total = new GramPartial(design.layout);
            acc.accumulate(design.rows(), design.w, design.z, total);
            double[] gram = new double[p * p];
            total.writeTo(gram, new double[p], true);
            if (first == null) {
                first = gram;
            } else {
                assertArrayEquals(bits(first), bits(gram));
            }
        }
    }

    @Test
    void chunksAlignedToBlocksGiveTheSameBitsAsOnePass() {
        RandomDesign design = RandomDesign.generate(15, 6_000, 6, new int[] {9, 2}, true);
        int p = design.layout.columns();
        BlockedGramAccumulator acc = new BlockedGramAccumulator(design.layout, 500, 2, null);
        GramPartial whole = new GramPartial(design.layout);
        acc.accumulate(design.rows(), design.w, design.z, whole);

        GramPartial chunked = new GramPartial(design.layout);
        for (int start = 0; start < design.n; start += 1500) {
            chunked.add(slice(design, start, Math.min(design.n, start + 1500), acc));
        }
        double[] g1 = new double[p * p];
        double[] g2 = new double[p * p];
        whole.writeTo(g1, new double[p], true);
        chunked.writeTo(g2, new double[p], true);
        // partials per chunk are merged in chunk order: the same additions as one pass only when
        // each chunk's blocks fold into a fresh partial first, so compare to rounding here
        for (int i = 0; i < g1.length; i++) {
            assertEquals(g1[i], g2[i], 1e-12 * Math.max(1, Math.abs(g1[i])));
        }
        // folding every chunk straight into one running total repeats one pass exactly
        GramPartial running = new GramPartial(design.layout);
        for (int start = 0; start < design.n; start += 1500) {
            RandomDesign part = design;
            int end = Math.min(design.n, start + 1500);
            acc.accumulate(sliceRows(part, start, end), sliceOf(part.w, start, end), sliceOf(part.z, start, end), running);
        }
        double[] g3 = new double[p * p];
        running.writeTo(g3, new double[p], true);
        assertArrayEquals(bits(g1), bits(g3));
    }

    private static GramPartial slice(RandomDesign design, int from, int to, BlockedGramAccumulator acc) {
        GramPartial part = new GramPartial(design.layout);
        acc.accumulate(sliceRows(design, from, to), sliceOf(design.w, from, to), sliceOf(design.z, from, to), part);
        return part;
    }

    private static double[] sliceOf(double[] a, int from, int to) {
        return java.util.Arrays.copyOfRange(a, from, to);
    }

    private static GramRows sliceRows(RandomDesign design, int from, int to) {
        int d = design.layout.denseWidth();
        int nf = design.layout.factorCount();
        int[][] codes = new int[nf][];
        double[][] mult = new double[nf][];
        for (int f = 0; f < nf; f++) {
            codes[f] = java.util.Arrays.copyOfRange(design.codes[f], from, to);
            mult[f] = design.multipliers[f] == null ? null : sliceOf(design.multipliers[f], from, to);
        }
        return GramRows.of(design.layout, to - from, sliceOf(design.dense, from * d, to * d), codes, mult);
    }

    @Test
    void aFailingWorkerSurfacesItsException() {
        RandomDesign design = RandomDesign.generate(16, 4_000, 3, new int[] {4}, false);
        int[][] bad = {design.codes[0].clone()};
        bad[0][3_500] = 99; // a code beyond the block's levels
        GramRows rows = GramRows.of(design.layout, design.n, design.dense, bad, new double[1][]);
        BlockedGramAccumulator acc = new BlockedGramAccumulator(design.layout, 256, 4, null);
        assertThrows(ArrayIndexOutOfBoundsException.class,
                () -> acc.accumulate(rows, design.w, design.z, new GramPartial(design.layout)));
    }
}
