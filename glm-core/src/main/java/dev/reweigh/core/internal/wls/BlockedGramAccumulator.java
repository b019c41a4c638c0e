package dev.reweigh.core.internal.wls;

import java.util.concurrent.Executor;
import java.util.concurrent.RejectedExecutionException;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * Sums X'WX and X'Wz over many rows on one or more threads, bit-identically for any thread count.
 *
 * <p>Rows are cut into blocks of {@link #blockRows()} rows counted from the first row of each
 * call; that size comes from the layout (or the caller), never from the thread count. Each block
 * is summed from zero into a per-worker {@link GramPartial}, and block partials are added to the
 * caller's total strictly in block order (a worker that finishes block b waits until blocks
 * 0..b-1 have been added). So the sequence of floating-point operations, and the result, are
 * the same whatever the number of threads and however they are scheduled.
 *
 * <p>Threads: the calling thread always works. Extra workers run on the caller's
 * {@link Executor} when one is given (no process-wide pool is ever used), otherwise on threads
 * started for the call. Workspaces (one partial per worker) are allocated on first use and
 * reused by every later call, so an IRLS iteration allocates nothing of size n or p^2.
 * An executor that runs tasks late, inline, or never is fine: the caller takes whatever blocks
 * are left, and a task that starts after its call has finished does nothing.
 *
 * <p>Not thread-safe: one instance per fit.
 */
public final class BlockedGramAccumulator {
    private final GramLayout layout;
    private final int blockRows;
    private final int threads;
    private final Executor executor;
    private final GramPartial[] workspaces;

    /**
     * Creates an accumulator.
     *
     * @param layout the column structure
     * @param blockRows rows per block (&ge; 1); use {@link GramLayout#defaultBlockRows()} unless testing
     * @param threads the number of workers, including the calling thread (&ge; 1)
     * @param executor where extra workers run, or null to start threads for each call
     */
    public BlockedGramAccumulator(GramLayout layout, int blockRows, int threads, Executor executor) {
        if (blockRows < 1 || threads < 1) {
            throw new IllegalArgumentException("blockRows and threads must be at least 1, got " + blockRows + " and " + threads);
        }
        this.layout = layout;
        this.blockRows = blockRows;
        this.threads = threads;
        this.executor = executor;
        this.workspaces = new GramPartial[threads];
    }

    /**
     * An accumulator with the layout's default block size.
     *
     * @param layout the column structure
     * @param threads the number of workers (&ge; 1)
     * @param executor where extra workers run, or null
     * @return the accumulator
     */
    public static BlockedGramAccumulator of(GramLayout layout, int threads, Executor executor) {
        return new BlockedGramAccumulator(layout, layout.defaultBlockRows(), threads, executor);
    }

    /** @return the column structure */
    public GramLayout layout() {
        return layout;
    }

    /** @return rows per block */
    public int blockRows() {
        return blockRows;
    }

    /** @return the number of workers */
    public int threads() {
        return threads;
    }

    /**
     * Adds all rows of {@code rows} to {@code total}: total += block 0 + block 1 + ..., in that
     * order. Call again with the next chunk of a stream to continue the same sum.
     *
     * @param rows the rows
     * @param w the weights (length &ge; rows)
     * @param z the working response (length &ge; rows)
     * @param total the running sum (same layout); not one of this accumulator's workspaces
     * @throws IllegalStateException if the calling thread is interrupted while waiting (the
     *         interrupt flag is restored)
     */
    public void accumulate(GramRows rows, double[] w, double[] z, GramPartial total) {
        if (rows.layout() != layout || total.layout() != layout) {
            throw new IllegalArgumentException("layout mismatch: accumulator " + layout + ", rows " + rows.layout()
                    + ", total " + total.layout());
        }
        int n = rows.rows();
        if (w.length < n || z.length < n) {
            throw new IllegalArgumentException("need " + n + " weights and responses, got " + w.length + " and " + z.length);
        }
        int blocks = (int) ((n + (long) blockRows - 1) / blockRows);
        if (blocks == 0) {
            return;
        }
        int workers = Math.min(threads, blocks);
        Job job = new Job(rows, w, z, total, blocks);
        for (int k = 1; k < workers; k++) {
            int worker = k;
            Runnable task = () -> job.work(worker);
            if (executor != null) {
                try {
                    executor.execute(task);
                } catch (RejectedExecutionException e) {
                    break; // the calling thread does the rest
                }
            } else {
                Thread t = new Thread(task, "reweigh-gram-" + k);
                t.setDaemon(true);
                t.start();
            }
        }
        job.work(0);
        job.finish();
    }

    private GramPartial workspace(int worker) {
        GramPartial ws = workspaces[worker];
        if (ws == null) {
            ws = new GramPartial(layout);
            workspaces[worker] = ws;
        }
        return ws;
    }

    /** The shared state of one call. */
    private final class Job {
        private final GramRows rows;
        private final double[] w;
        private final double[] z;
        private final GramPartial total;
        private final int blocks;
        private final AtomicInteger nextBlock = new AtomicInteger();
        // guarded by this
        private int folded;
        private int active;
        private boolean closed;
        private Throwable failure;

        Job(GramRows rows, double[] w, double[] z, GramPartial total, int blocks) {
            this.rows = rows;
            this.w = w;
            this.z = z;
            this.total = total;
            this.blocks = blocks;
        }

        void work(int worker) {
            GramPartial ws;
            synchronized (this) {
                if (closed) {
                    return;
                }
                active++;
                // workspace creation is guarded too: workers of one call may start concurrently
                ws = workspace(worker);
            }
            try {
                int n = rows.rows();
                for (int b = nextBlock.getAndIncrement(); b < blocks; b = nextBlock.getAndIncrement()) {
                    ws.reset();
                    int from = b * blockRows;
                    ws.accumulate(rows, w, z, from, Math.min(n, from + blockRows));
                    synchronized (this) {
                        while (folded != b && failure == null) {
                            wait();
                        }
                        if (failure != null) {
                            return;
                        }
                        total.add(ws);
                        folded++;
                        notifyAll();
                    }
                }
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                fail(e);
            } catch (RuntimeException | Error e) {
                fail(e);
            } finally {
                synchronized (this) {
                    active--;
                    notifyAll();
                }
            }
        }

        private synchronized void fail(Throwable t) {
            if (failure == null) {
                failure = t;
            }
            nextBlock.set(blocks);
            notifyAll();
        }

        /** Waits until every block is added (or a worker failed) and no worker still runs. */
        void finish() {
            boolean interrupted = false;
            synchronized (this) {
                while ((folded < blocks && failure == null) || active > 0) {
                    try {
                        wait();
                    } catch (InterruptedException e) {
                        interrupted = true;
                        if (failure == null) {
                            failure = e;
                        }
                        nextBlock.set(blocks);
                        notifyAll();
                    }
                }
                closed = true;
            }
            if (interrupted) {
                Thread.currentThread().interrupt();
            }
            if (failure instanceof RuntimeException) {
                throw (RuntimeException) failure;
            }
            if (failure instanceof Error) {
                throw (Error) failure;
            }
            if (failure != null) {
                throw new IllegalStateException("accumulation interrupted", failure);
            }
        }
    }
}
