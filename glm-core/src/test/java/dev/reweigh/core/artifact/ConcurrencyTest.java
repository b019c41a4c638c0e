package dev.reweigh.core.artifact;

import dev.reweigh.core.FitInterruptedException;
import dev.reweigh.core.FitOptions;
import dev.reweigh.core.Glm;
import dev.reweigh.core.ModelSpec;
import dev.reweigh.core.Scorer;
import dev.reweigh.core.Table;
import dev.reweigh.families.Families;
import org.junit.jupiter.api.Test;

import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicReference;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ConcurrencyTest {

    @Test
    void sixteenThreadsScoringOneModelGetTheSingleThreadResults() throws Exception {
        Scorer scorer = Fixtures.ARTIFACT.scorerBuilder().intervalLevel(0.95).build();
        Table rows = Fixtures.FRESH_TABLE;
        double[] mean = scorer.score(rows).mean();
        double[] upper = scorer.score(rows).upper();
        ExecutorService pool = Executors.newFixedThreadPool(16);
        try {
            CountDownLatch start = new CountDownLatch(1);
            List<Future<String>> results = new ArrayList<>();
            for (int t = 0; t < 16; t++) {
                int thread = t;
                results.add(pool.submit(() -> {
                    start.await();
                    for (int round = 0; round < 20; round++) {
                        double[] m = new double[rows.rowCount()];
                        if ((thread + round) % 3 == 0) {
                            scorer.scoreMean(Fixtures.FRESH.columns(), m);
                        } else if ((thread + round) % 3 == 1) {
                            m = scorer.score(rows).mean();
                            double[] u = scorer.score(rows).upper();
                            for (int i = 0; i < u.length; i++) {
                                if (Double.doubleToRawLongBits(u[i]) != Double.doubleToRawLongBits(upper[i])) {
                                    return "thread " + thread + " interval row " + i;
                                }
                            }
                        } else {
                            for (int i = 0; i < m.length; i += 7) {
                                m[i] = scorer.mean(Fixtures.FRESH.row(i));
                            }
                            for (int i = 0; i < m.length; i++) {
                                if (i % 7 != 0) {
                                    m[i] = mean[i];
                                }
                            }
                        }
                        for (int i = 0; i < m.length; i++) {
                            if (Double.doubleToRawLongBits(m[i]) != Double.doubleToRawLongBits(mean[i])) {
                                return "thread " + thread + " round " + round + " row " + i;
                            }
                        }
                    }
                    return "ok";
                }));
            }
            start.countDown();
            for (Future<String> f : results) {
                assertEquals("ok", f.get(60, TimeUnit.SECONDS));
            }
        } finally {
            pool.shutdownNow();
        }
    }

    private static Table bigPortfolio() {
        Portfolio p = new Portfolio(600_000, 2024);
        return p.table("claims", p.response("poisson", true));
    }

    private static final ModelSpec BIG = ModelSpec.builder("claims").family(Families.poisson())
            .factor("region").factor("vehicle").polynomial("age", 3, true).interaction("region", "value")
            .logOffset("exposure").build();

    @Test
    void interruptingAFitStopsItPromptly() throws Exception {
        Table data = bigPortfolio();
        CountDownLatch iterating = new CountDownLatch(1);
        FitOptions options = FitOptions.builder().maxIterations(1000).tolerance(1e-15)
                .listener(e -> iterating.countDown()).build();
        AtomicReference<Throwable> outcome = new AtomicReference<>();
        AtomicReference<Boolean> stillInterrupted = new AtomicReference<>();
        Thread worker = new Thread(() -> {
            try {
                Glm.fit(BIG, data, options);
            } catch (Throwable t) {
                outcome.set(t);
                stillInterrupted.set(Thread.currentThread().isInterrupted());
            }
        }, "big fit");
        worker.start();
        assertTrue(iterating.await(60, TimeUnit.SECONDS), "the fit did not start iterating");
        long t0 = System.nanoTime();
        worker.interrupt();
        worker.join(2000);
        long waitedMillis = (System.nanoTime() - t0) / 1_000_000;
        assertTrue(!worker.isAlive(), "the fit was still running 2 s after the interrupt");
        assertTrue(outcome.get() instanceof FitInterruptedException, "outcome: " + outcome.get());
        assertTrue(stillInterrupted.get(), "the interrupt status is restored");
        System.out.println("fit stopped " + waitedMillis + " ms after the interrupt");
        assertTrue(waitedMillis < 2000, "stopped after " + waitedMillis + " ms");
    }

    @Test
    void anInterruptDuringTheLastIterationStillStopsTheFit() {
        // the null model (its own small fit when there is an offset) runs before the main fit; an
        // interrupt that arrives in the main fit's last iteration must still stop the whole fit
        int last = Glm.fit(Fixtures.SPEC, Fixtures.TRAIN_TABLE).iterations();
        FitOptions interruptAtLast = FitOptions.builder().listener(e -> {
            if (e.iteration() == last) {
                Thread.currentThread().interrupt();
            }
        }).build();
        try {
            Glm.fit(Fixtures.SPEC, Fixtures.TRAIN_TABLE, interruptAtLast);
            throw new AssertionError("the fit ignored an interrupt in its last iteration");
        } catch (FitInterruptedException e) {
            assertTrue(Thread.interrupted(), "the interrupt status is restored (and cleared here)");
        } finally {
            Thread.interrupted();
        }
    }

    @Test
    void aThreadInterruptedBeforeTheFitStopsAtOnce() {
        Table data = Fixtures.TRAIN_TABLE;
        assertTimeoutPreemptively(Duration.ofSeconds(2), () -> {
            Thread.currentThread().interrupt();
            try {
                Glm.fit(Fixtures.SPEC, data);
                throw new AssertionError("an interrupted thread fitted a model");
            } catch (FitInterruptedException e) {
                assertNotNull(e.getMessage());
                assertTrue(Thread.interrupted(), "the interrupt status is restored (and cleared here)");
            }
        });
    }
}
