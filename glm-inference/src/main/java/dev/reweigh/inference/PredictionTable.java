package dev.reweigh.inference;

import dev.reweigh.inference.internal.TextTable;
import java.util.List;

/**
 * Predictions for a set of rows, in row order.
 *
 * <pre>{@code
 * PredictionTable p = Inference.of(fit).predict(newPolicies);
 * double lower = p.predictions().get(0).interval().lower();
 * }</pre>
 *
 * @since 0.1
 */
public final class PredictionTable {
    private static final int SHOWN_ROWS = 20;

    private final List<Prediction> predictions;
    private final double level;

    PredictionTable(List<Prediction> predictions, double level) {
        this.predictions = List.copyOf(predictions);
        this.level = level;
    }

    /**
     * Returns the predictions in row order.
     *
     * @return an immutable list
     * @since 0.1
     */
    public List<Prediction> predictions() {
        return predictions;
    }

    /**
     * Returns the predicted means.
     *
     * @return one mean per row
     * @since 0.1
     */
    public double[] means() {
        return predictions.stream().mapToDouble(Prediction::mean).toArray();
    }

    /**
     * Returns the confidence level of the intervals.
     *
     * @return the level
     * @since 0.1
     */
    public double level() {
        return level;
    }

    /**
     * Renders the first twenty rows.
     *
     * @return the text
     * @since 0.1
     */
    @Override
    public String toString() {
        String pct = TextTable.percent(level);
        TextTable t = TextTable.withTitles("row", "linear predictor", "std error", "mean", "lower " + pct,
                "upper " + pct, "response sd");
        for (Prediction p : predictions.subList(0, Math.min(SHOWN_ROWS, predictions.size()))) {
            t.row(Integer.toString(p.row()), TextTable.number(p.linearPredictor()),
                    TextTable.number(p.linkStandardError()), TextTable.number(p.mean()),
                    TextTable.number(p.interval().lower()), TextTable.number(p.interval().upper()),
                    TextTable.number(p.responseStandardDeviation()));
        }
        String more = predictions.size() > SHOWN_ROWS
                ? "(" + (predictions.size() - SHOWN_ROWS) + " more rows)\n" : "";
        return t.render() + more;
    }
}
