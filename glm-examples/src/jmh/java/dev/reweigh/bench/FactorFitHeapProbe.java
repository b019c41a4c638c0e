package dev.reweigh.bench;

import dev.reweigh.core.FitOptions;
import dev.reweigh.core.FittedModel;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Solver;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import java.lang.management.GarbageCollectorMXBean;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryMXBean;
import java.lang.management.MemoryUsage;
import javax.management.NotificationEmitter;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicLong;

/**
 * Peak heap of the factor-design fit (n rows, factors of 1000, 200 and 50 levels, 10 numeric
 * columns), not a timing benchmark. The reliable measure is the smallest heap the fit completes
 * in: with the serial collector, which compacts the whole heap before it gives up, and a small
 * young generation, e.g.
 * {@code java -XX:+UseSerialGC -Xmn16m -Xmx300m -cp benchmarks.jar dev.reweigh.bench.FactorFitHeapProbe 1000000},
 * a fit that completes needed at most the maximum heap, so its peak beyond the heap in use before
 * it is at most the difference, which the probe reports against the table's own size (its column
 * arrays). It also reports the highest heap in use sampled every millisecond (garbage included)
 * and the largest heap left after any collection during the fit, which depend on when the
 * collector happens to run.
 */
public final class FactorFitHeapProbe {
    private FactorFitHeapProbe() {
    }

    /**
     * Runs the probe.
     *
     * @param args the row count (default 1,000,000)
     * @throws InterruptedException if interrupted while sampling
     */
    public static void main(String[] args) throws InterruptedException {
        int n = args.length > 0 ? Integer.parseInt(args[0]) : 1_000_000;
        Table t = FactorDesignBenchmark.table(n, 5, false, false);
        ModelSpec.Builder b = ModelSpec.builder("claims").family(Families.poisson()).logOffset("exposure");
        for (int j = 0; j < 10; j++) {
            b.numeric("x" + j);
        }
        for (int f = 0; f < FactorDesignBenchmark.FACTORS.length; f++) {
            b.factor(FactorDesignBenchmark.FACTORS[f], FactorDesignBenchmark.FACTORS[f] + 0);
        }
        ModelSpec spec = b.build();
        // the table's column arrays: 12 numeric columns of n doubles, 3 code arrays of n ints
        long tableBytes = 12L * 8 * n + 3L * 4 * n;
        MemoryMXBean mem = ManagementFactory.getMemoryMXBean();
        System.gc();
        Thread.sleep(200);
        long before = mem.getHeapMemoryUsage().getUsed();
        AtomicLong peak = new AtomicLong(before);
        AtomicLong liveAfterGc = new AtomicLong(before);
        for (GarbageCollectorMXBean gc : ManagementFactory.getGarbageCollectorMXBeans()) {
            ((NotificationEmitter) gc).addNotificationListener((notification, handback) -> {
                if (!"com.sun.management.gc.notification".equals(notification.getType())) {
                    return;
                }
                com.sun.management.GarbageCollectionNotificationInfo info = com.sun.management.GarbageCollectionNotificationInfo
                        .from((javax.management.openmbean.CompositeData) notification.getUserData());
                long used = 0;
                for (MemoryUsage u : info.getGcInfo().getMemoryUsageAfterGc().values()) {
                    used += u.getUsed();
                }
                liveAfterGc.accumulateAndGet(used, Math::max);
            }, null, null);
        }
        AtomicBoolean done = new AtomicBoolean();
        Thread sampler = new Thread(() -> {
            while (!done.get()) {
                peak.accumulateAndGet(mem.getHeapMemoryUsage().getUsed(), Math::max);
                try {
                    Thread.sleep(1);
                } catch (InterruptedException e) {
                    return;
                }
            }
        });
        sampler.setDaemon(true);
        sampler.start();
        long t0 = System.nanoTime();
        FittedModel fit = Glm.fit(spec, t, FitOptions.builder().threads(2).solver(Solver.CHOLESKY).build());
        double seconds = (System.nanoTime() - t0) / 1e9;
        done.set(true);
        sampler.join();
        System.out.printf("rows %d, columns %d, iterations %d, converged %s, %.1f s%n", n, fit.columnCount(),
                fit.iterations(), fit.converged(), seconds);
        System.out.printf("table column arrays %d MB; heap max %d MB; in use before fit %d MB; sampled peak %d MB;"
                + " fit's extra peak %d MB = %.2f x the table%n", tableBytes >> 20, Runtime.getRuntime().maxMemory() >> 20,
                before >> 20, peak.get() >> 20, (peak.get() - before) >> 20, (peak.get() - before) / (double) tableBytes);
        System.out.printf("largest heap after a collection during the fit %d MB (includes non-heap pools' usage of"
                + " the collector's view, e.g. metaspace is not counted); extra over before %d MB = %.2f x the table%n",
                liveAfterGc.get() >> 20, (liveAfterGc.get() - before) >> 20,
                (liveAfterGc.get() - before) / (double) tableBytes);
        long max = Runtime.getRuntime().maxMemory();
        double bound = (max - before) / (double) tableBytes;
        System.out.printf("completed within a %d MB heap: the fit's peak beyond the %d MB held before it is at most %d MB"
                + " = %.2f x the table; target <= 2 x: %s%n", max >> 20, before >> 20, (max - before) >> 20, bound,
                bound <= 2.0 ? "met" : "not shown by this heap size (try a smaller -Xmx)");
    }
}
