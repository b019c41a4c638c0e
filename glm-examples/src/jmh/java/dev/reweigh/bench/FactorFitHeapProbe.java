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
 * columns), not a timing benchmark: run with a small -Xmx, e.g.
 * {@code java -Xmx400m -cp benchmarks.jar dev.reweigh.bench.FactorFitHeapProbe 1000000}.
 * It reports the table's own size (its column arrays), the heap in use before the fit, and the
 * highest heap in use sampled every millisecond during the fit (after a forced collection
 * before it, so garbage counts too), and the largest heap left after any collection during the
 * fit (live data, the better measure of what the fit needs).
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
        double live = (liveAfterGc.get() - before) / (double) tableBytes;
        System.out.printf("target: the fit's live heap <= 2 x the table: %s (%.2f x)%n", live <= 2.0 ? "met" : "missed",
                live);
    }
}
