package dev.reweigh.core;

import java.util.Objects;

/**
 * Fits a generalized linear model over rows streamed from a {@link ChunkSource}, never holding
 * more than one chunk: one pass over the source per IRLS iteration (plus one to survey it), with
 * the weighted cross products gathered chunk by chunk into sums whose size depends on the
 * number of model columns only. Memory is therefore independent of the number of rows.
 *
 * <p>The iteration is Fisher scoring as in the in-memory fit ({@link Glm#fit(ModelSpec, Table,
 * FitOptions)} on the Cholesky route): the same working response and weights, starting means,
 * step-halving, rank decision and convergence rule, so for canonical links both give the same
 * coefficients up to rounding; for other links the in-memory fit may take Newton steps instead,
 * and both converge to the same estimates. A first step that must be shortened is refused here
 * (give start coefficients). {@link FitOptions#threads()} applies to the accumulation within
 * each chunk, and results do not depend on it.
 *
 * <p>Differences from the in-memory fit: the solver is always Cholesky on the cross products
 * ({@link Solver#PIVOTED_QR} is refused), starting means ({@link FitOptions#startMeans()}) are
 * refused because they are per row (start coefficients are fine), orthogonal polynomial terms
 * are refused (they need the whole column; use raw powers), and the default reference level of
 * a factor is chosen from the survey pass by the same rule (largest total prior weight).
 * <pre>{@code
 * StreamingFit fit = StreamingGlm.fit(spec, JdbcChunkSource.of(dataSource, query, 50_000, levels),
 *         FitOptions.builder().threads(2).build());
 * }</pre>
 *
 * @since 0.1
 */
public final class StreamingGlm {
    private StreamingGlm() {
    }

    /**
     * Fits with default options.
     *
     * @param spec the model
     * @param source the rows
     * @return the fit
     * @throws dev.reweigh.families.InvalidDataException when a value is invalid (row numbers
     *         count from the source's first row)
     * @throws ModelSpecException when the specification does not suit the data or streaming
     * @since 0.1
     */
    public static StreamingFit fit(ModelSpec spec, ChunkSource source) {
        return fit(spec, source, FitOptions.defaults());
    }

    /**
     * Fits with the given options.
     *
     * @param spec the model
     * @param source the rows
     * @param options the fit options ({@link Solver#PIVOTED_QR} and start means are refused)
     * @return the fit
     * @throws IllegalArgumentException when the options ask for what a streaming fit cannot do
     * @throws dev.reweigh.families.InvalidDataException when a value is invalid (row numbers
     *         count from the source's first row)
     * @throws ModelSpecException when the specification does not suit the data or streaming
     * @throws FitInterruptedException when the thread is interrupted
     * @since 0.1
     */
    public static StreamingFit fit(ModelSpec spec, ChunkSource source, FitOptions options) {
        Objects.requireNonNull(spec, "spec");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(options, "options");
        if (options.solver() == Solver.PIVOTED_QR) {
            throw new IllegalArgumentException("a streaming fit solves from cross products (Cholesky); the PIVOTED_QR"
                    + " solver needs all rows in memory: use Glm.fit, or Solver.AUTO or CHOLESKY");
        }
        if (options.startMeans().isPresent()) {
            throw new IllegalArgumentException("start means are per row, which a streaming fit does not keep;"
                    + " give start coefficients instead");
        }
        return new StreamingRun(spec, source, options).run();
    }
}
